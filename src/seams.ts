// The typed seams between pipeline stages. Every seam is plain, read-only and JSON-serialisable
// (no classes, no functions); unions carry a `kind` tag. SI units throughout: m, Hz, Ω, S, rad.
import type { Complex } from './math/complex.js';
import type { Diagnostic } from './diagnostics.js';

// ───────────────────────────── spec ─────────────────────────────

export interface Substrate {
  /** Preset name it came from, if any. */
  readonly preset?: string;
  readonly er: number;
  /** Dielectric height h (m). */
  readonly height: number;
  /** Strip thickness t (m); 0 selects the zero-thickness model. */
  readonly copper: number;
  readonly tanDelta: number;
  /** RMS surface roughness (m). */
  readonly roughness: number;
  /** Conductor conductivity (S/m). */
  readonly conductivity: number;
}

export interface FabRules {
  readonly minTrace: number;
  readonly minSpace: number;
  readonly viaDrill: number;
  readonly viaPad: number;
  readonly minAnnularRing: number;
  readonly copperToEdge: number;
  readonly viasPerStub: number;
}

export type Point = readonly [number, number];

export type Region =
  | { readonly kind: 'rect'; readonly x: readonly [number, number]; readonly y: readonly [number, number] }
  | { readonly kind: 'polygon'; readonly points: readonly Point[] }
  | { readonly kind: 'circle'; readonly center: Point; readonly radius: number };

/** Local section frame → board frame: p_board = (x, y) + R(rotationDeg) · (mirror ? (px, −py) : p). */
export interface Placement {
  readonly x: number;
  readonly y: number;
  readonly rotationDeg: number;
  readonly mirror: boolean;
}

export type StubChoice = 'open' | 'short' | 'best';
export type StubStyle = 'single' | 'balanced';
export type Termination = 'open' | 'short';

export interface ToleranceSpec {
  /** Etched width spread (m), the same for every line. */
  readonly width: number;
  readonly erFraction: number;
  readonly heightFraction: number;
  readonly copperFraction: number;
  /** Number of runs; 0 turns the check off. */
  readonly runs: number;
  readonly seed: number;
}

export interface Spec {
  readonly name: string;
  readonly frequency: number;
  readonly load: Complex;
  readonly target: Complex;
  readonly lineZ0: number;
  readonly stubZ0: number;
  readonly stub: StubChoice;
  readonly style: StubStyle;
  readonly stubSide: 'left' | 'right';
  readonly substrate: Substrate;
  readonly fab: FabRules;
  /** Straight line lengths at the load and source ports (m). */
  readonly leads: { readonly load: number; readonly source: number };
  /** Where the section lands on the board (m, degrees): mirror about its own x axis, rotate counter-clockwise, then move the load plane centre to (x, y). */
  readonly place: Placement;
  readonly area?: Region;
  readonly keepouts: readonly Region[];
  readonly clearance: number;
  /** Optional sweep band for verification (Hz). */
  readonly sweep: { readonly start: number; readonly stop: number; readonly points: number };
  /** Fabrication spread for the Monte-Carlo check: uniform within ± each value. */
  readonly tolerance: ToleranceSpec;
  /** Keys that were not in the file and took their default value, as JSON paths. */
  readonly defaulted: readonly string[];
}

// ───────────────────────────── ideal solution ─────────────────────────────

export interface StubSolution {
  /** Distance load → stub, in wavelengths of the series line, in [0, 0.5). */
  readonly positionWl: number;
  /** Stub length in wavelengths of the stub line, in [0, 0.5). Per stub for balanced style. */
  readonly stubWl: number;
  readonly termination: Termination;
  readonly style: StubStyle;
  /** Which root of the position quadratic (1 or 2), stable across terminations. */
  readonly branch: 1 | 2;
  /** Susceptance all stubs together add, normalised to the series line's Y0. */
  readonly stubSusceptance: number;
  /** |Γ| of the ideal network against the target after re-substitution. */
  readonly residualGamma: number;
}

export interface IdealSolution {
  readonly alreadyMatched: boolean;
  /** Every branch, ranked: shortest stub first, then shorter series line. */
  readonly solutions: readonly StubSolution[];
}

// ───────────────────────────── physical design ─────────────────────────────

/** What a transmission-line model answers for one width, substrate and frequency. */
export interface LineProperties {
  readonly width: number;
  readonly frequency: number;
  /** Characteristic impedance at frequency (Ω). */
  readonly z0: number;
  readonly z0Static: number;
  readonly epsEff: number;
  readonly epsEffStatic: number;
  /** Guided wavelength at frequency (m). */
  readonly wavelength: number;
  /** Attenuation constants (Np/m). */
  readonly alphaConductor: number;
  readonly alphaDielectric: number;
  /** Phase constant (rad/m). */
  readonly beta: number;
  readonly warnings: readonly Diagnostic[];
}

export interface Correction {
  /** Model that caused it, with its source, e.g. "open end (Kirschning-Jansen-Koster 1981)". */
  readonly model: string;
  /** Change applied to the physical length (m); negative shortens. */
  readonly delta: number;
}

export type SectionRole = 'series' | 'stub' | 'lead-load' | 'lead-source';

export interface Section {
  readonly role: SectionRole;
  readonly width: number;
  readonly z0: number;
  readonly epsEff: number;
  readonly wavelength: number;
  /** Ideal electrical length (wavelengths). */
  readonly electricalWl: number;
  /** Ideal length = electricalWl × wavelength (m). */
  readonly idealLength: number;
  /** Copper length drawn (m), after corrections: for the stub, from the series line's edge to its end. */
  readonly length: number;
  readonly corrections: readonly Correction[];
}

export interface ViaSpec {
  readonly drill: number;
  readonly pad: number;
  readonly count: number;
  /** Centre-to-centre distance of the vias in a row (m). */
  readonly pitch: number;
  readonly inductance: number;
}

/** Copper dimensions of a match as drawn (m): what the geometry stage and the network model share. */
export interface MatchCopper {
  readonly seriesWidth: number;
  readonly stubWidth: number;
  /** Load reference plane → stub centre-line. */
  readonly seriesLength: number;
  /** Series line edge → open end, or → via centre for a short stub. */
  readonly stubLength: number;
  /** Stub centre-line → source reference plane. */
  readonly leadLength: number;
  readonly termination: Termination;
  /** 0 when the load is already matched (a plain line), 1 single stub, 2 balanced stubs. */
  readonly stubCount: 0 | 1 | 2;
  /** Ground vias at each short stub's end: a row of `count`, `pitch` apart centre to centre. */
  readonly vias?: { readonly drill: number; readonly pad: number; readonly count: number; readonly pitch: number };
  /**
   * Mitred 90° bends of a folded stub: how many each stub turns through, and each bend's electrical
   * length beyond its centre-line (m; negative: shorter). Absent for a straight stub.
   */
  readonly bends?: { readonly count: number; readonly lengthEach: number };
}

export interface PhysicalDesign {
  readonly frequency: number;
  readonly substrate: Substrate;
  readonly solution: StubSolution;
  /** Target impedance moved back through the source lead to the junction. */
  readonly targetAtJunction: Complex;
  readonly sections: readonly Section[];
  readonly copper: MatchCopper;
  readonly stubSides: readonly ('left' | 'right')[];
  readonly via?: ViaSpec;
  /** |S11| at f0 of the physical network model against the target (dB). */
  readonly s11DbAtF0: number;
  readonly diagnostics: readonly Diagnostic[];
}

// ───────────────────────────── verification ─────────────────────────────

export interface ResponseSet {
  readonly frequencies: readonly number[];
  /** S11 at the source port against the target, of the ideal network. */
  readonly ideal: readonly Complex[];
  /** S11 of the physical network (dispersion, loss, discontinuities). */
  readonly physical: readonly Complex[];
  readonly s11DbAtF0: number;
  /** Band (Hz) where return loss of the physical network ≥ 10 dB, around f0; null when none. */
  readonly band10dB: { readonly low: number; readonly high: number } | null;
  /** Monte-Carlo spread of the physical network over the fabrication tolerances; null when off. */
  readonly tolerance: ToleranceResult | null;
  /** The same copper drawn as a lossless zero-thickness sheet; null when the stackup's copper is zero-thickness. */
  readonly sheetEquivalent: SheetEquivalent | null;
}

/** Where an EM model of the artwork with zero-thickness copper should put the return-loss minimum. */
export interface SheetEquivalent {
  readonly minimumFrequency: number;
  /** (minimumFrequency − f0)/f0. */
  readonly offset: number;
}

export interface ToleranceResult {
  readonly runs: number;
  readonly seed: number;
  /** |S11| at f0 (dB) over the runs: median, 95th percentile and worst. */
  readonly s11DbAtF0: { readonly median: number; readonly p95: number; readonly worst: number };
  /** Frequency of the |S11| minimum over the runs (Hz): 5th and 95th percentile. */
  readonly minimumFrequency: { readonly p5: number; readonly p95: number };
  /** Share of runs whose return loss at f0 is at least 10 dB. */
  readonly yield10dB: number;
  /** Per-frequency 95th-percentile |S11| (dB) on `frequencies`. */
  readonly frequencies: readonly number[];
  readonly envelopeP95Db: readonly number[];
}

// ───────────────────────────── geometry ─────────────────────────────

/** A closed ring, counter-clockwise for outer rings, no repeated closing point (m). */
export type Ring = readonly Point[];

export interface CopperIsland {
  readonly id: string;
  readonly outline: Ring;
  readonly holes: readonly Ring[];
}

export interface Via {
  readonly x: number;
  readonly y: number;
  readonly drill: number;
  readonly pad: number;
}

export interface Port {
  readonly role: 'load' | 'source';
  readonly x: number;
  readonly y: number;
  /** Direction from the reference plane into the network, degrees (0 = +x, 90 = +y). */
  readonly directionDeg: number;
  readonly width: number;
}

export interface Feature {
  /** Stable id: `series`, `stub`, `stub-2`, `lead-load`, `lead-source`, `via-1` … */
  readonly id: string;
  readonly kind: 'line' | 'stub' | 'lead' | 'pad';
  /** Axis-aligned rectangle of the feature before union, in the section's own frame, before placement (m). */
  readonly rect: { readonly xmin: number; readonly ymin: number; readonly xmax: number; readonly ymax: number };
  /** Length along the feature's axis and its width (m), for dimensions. */
  readonly length: number;
  readonly width: number;
  /** The feature's copper before union in board coordinates (after folding and placement), counter-clockwise. */
  readonly outline?: Ring;
  /** Centre-line from start to end in board coordinates, for dimensions (lines, leads, stub segments). */
  readonly path?: readonly Point[];
}

export interface Bounds {
  readonly xmin: number;
  readonly ymin: number;
  readonly xmax: number;
  readonly ymax: number;
}

export interface BoardGeometry {
  readonly copper: readonly CopperIsland[];
  readonly vias: readonly Via[];
  readonly ports: readonly Port[];
  readonly features: readonly Feature[];
  readonly area?: Region;
  readonly keepouts: readonly Region[];
  readonly bounds: Bounds;
  /** The transform from the section's own frame (feature rects) to the board frame; absent = identity. */
  readonly placement?: Placement;
}

// ───────────────────────────── writers ─────────────────────────────

export interface Artifact {
  /** Path relative to the output folder. */
  readonly path: string;
  readonly mediaType: string;
  readonly text: string;
}
