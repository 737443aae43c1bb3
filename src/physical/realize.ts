// From ideal electrical lengths to copper that matches once etched: size the lines, move the target
// through the source lead, apply the first-order discontinuity corrections, then refine both
// lengths on the full physical network (Newton on two unknowns) so the model presents the target at f0.
import { complex, abs, db, type Complex } from '../math/complex.js';
import { diagnostic, fail, type Diagnostic } from '../diagnostics.js';
import type {
  Correction,
  IdealSolution,
  LineProperties,
  MatchCopper,
  PhysicalDesign,
  Section,
  Spec,
  StubSolution,
  ViaSpec,
} from '../seams.js';
import { synthesizeMicrostrip } from './microstrip/index.js';
import { mitredBendLength, openEndExtensionDesign, tJunctionHammerstad, viaInductanceDesign } from './discontinuities/index.js';
import { inputImpedance } from '../math/lines.js';
import { newton2 } from '../math/newton.js';
import { MIN_DRAWN_WIDTH } from '../geometry/layout.js';
import { junctionAt, mismatch, physicalInputImpedance, type JunctionView } from '../analysis/physicalNetwork.js';
import { mm, trimmed } from '../format.js';

/** Sources named in every correction record. */
export const MODEL_NAMES = {
  junction: 'T-junction reference planes (Hammerstad 1981, corrected to full-wave runs)',
  openEnd: 'open-end extension (Kirschning-Jansen-Koster 1981, scaled to full-wave runs)',
  via: 'via inductance (Goldfarb-Pucel 1991 plus strip-to-pad crowding and, for a row of vias, Grover mutual inductance, fitted to full-wave runs)',
  halfWave: 'half wavelength added to keep the copper buildable',
  bend: 'mitred bends of the folded stub (Douville-James 1978 mitre, length fitted to full-wave runs)',
  refine: 'solve on the physical network (junction ratio and susceptance, dispersion, loss)',
} as const;

/**
 * When the spec leaves the choice open (stub: best), a short stub whose via would sit within this
 * fraction of a wavelength of the junction is made half a wavelength longer: a margin, kept since a
 * via 0.1 λg from the junction landed 6 % low in a full-wave check before the via model was fitted
 * to full-wave runs (physics.md §4.4).
 */
export const VIA_JUNCTION_CLEARANCE_WL = 0.15;

/**
 * The closest a via has sat to the junction in a full-wave check of a whole design: with the fitted
 * via model, the single-via designs with vias 0.072–0.149 λg from the line as drawn landed within
 * −1.46…+0.76 % (scripts/fullwave/README.md, ninth, tenth and fourteenth rounds; the closest,
 * fw-1g9-fr4-short, −0.72 %; with the copper's edges meshed finely, eighteenth round, the folded
 * fw-1g5-fr4-short-fold-l lands −2.19 % and fw-1g9-fr4-short −0.80 %). Its via sits 0.065 λ out
 * by the first-order length this check measures, before the solve on the physical network; a via
 * closer than this gets a warning.
 */
export const VIA_CHECKED_CLEARANCE_WL = 0.064;

/**
 * Seven of the eight crosses the cross model was fitted to have εr ≤ 4.4 (scripts/fullwave/
 * junctions.json); a balanced design on εr 10.2 landed 1.6 % low in a full-wave check (ninth round;
 * earlier rounds said 1.7 %, without the feed's attenuation in the shift, and 0.9 %, with the
 * reference plane off the mesh line openEMS measured on). Balanced
 * designs above this εr get a note saying so.
 */
export const BALANCED_CHECKED_ER = 4.5;

export interface SizedLines {
  readonly series: LineProperties;
  readonly stub: LineProperties;
  readonly diagnostics: readonly Diagnostic[];
}

/** Widths for the series line and stub impedances at f0, with fabrication checks. */
export function sizeLines(spec: Spec): SizedLines {
  const series = synthesizeMicrostrip(spec.lineZ0, spec.substrate, spec.frequency);
  const stub = spec.stubZ0 === spec.lineZ0 ? series : synthesizeMicrostrip(spec.stubZ0, spec.substrate, spec.frequency);
  const diagnostics: Diagnostic[] = [...series.warnings.map((d) => ({ ...d, where: 'line_z0' }))];
  if (stub !== series) diagnostics.push(...stub.warnings.map((d) => ({ ...d, where: 'stub_z0' })));
  for (const [where, line, z0] of [['line_z0', series, spec.lineZ0], ['stub_z0', stub, spec.stubZ0]] as const) {
    if (![line.width, line.z0, line.epsEff, line.wavelength, line.beta].every(Number.isFinite)) {
      fail('design.out-of-model', where, `the microstrip models give no finite answer for a ${trimmed(z0, 3)} Ω line on this substrate (εr ${trimmed(spec.substrate.er, 3)}, h ${mm(spec.substrate.height)} mm) at ${trimmed(spec.frequency / 1e9, 4)} GHz`);
    }
    if (line.width < MIN_DRAWN_WIDTH) {
      fail('fab.too-narrow', where, `a ${trimmed(z0, 3)} Ω line on this substrate would be ${line.width.toExponential(2)} m wide, far below any etchable copper; use a lower impedance or a thicker substrate`);
    }
    if (line.width < spec.fab.minTrace) {
      diagnostics.push(
        diagnostic('fab.too-narrow', where, `a ${z0} Ω line on this substrate is ${mm(line.width)} mm wide, below fab.min_trace ${mm(spec.fab.minTrace)} mm; use a lower impedance or a thicker substrate`),
      );
    }
  }
  return { series, stub, diagnostics };
}

export interface JunctionPlan {
  readonly junction: JunctionView;
  /** Drawn source lead: stub centre-line → source plane (m). */
  readonly leadLength: number;
  /** The target moved back through the source lead to the junction's arm-b plane. */
  readonly targetAtJunction: Complex;
}

export function planJunction(spec: Spec, lines: SizedLines, stubCount: 0 | 1 | 2): JunctionPlan {
  const leadLength = (stubCount === 0 ? 0 : lines.stub.width / 2) + spec.leads.source;
  const probe: MatchCopper = copperOf(lines, stubCount === 0 ? 1 : stubCount, 'open', 0, 0, leadLength);
  if (stubCount !== 0) requireLumpedJunction(spec, lines);
  const junction = stubCount === 0 ? { da: 0, db: 0, d2: lines.series.width / 2, n2a: 1, n2b: 1, susceptance: 0 } : junctionAt(probe, spec.substrate, spec.frequency);
  // Move the target back through the lossless lead: a negative length inverts the transformation.
  const electrical = leadLength - junction.db;
  const targetAtJunction = inputImpedance(spec.target, lines.series.z0, complex(0, lines.series.beta), -electrical);
  return { junction, leadLength, targetAtJunction };
}

/**
 * The T-junction model (and single-stub theory with it) treats the junction as lumped. Above the
 * first higher-order mode of the wider line, f_p = 0.4·Z0/h (GHz, h in mm; Hammerstad 1981), or
 * where its transformer ratio collapses, no closed-form correction holds: refuse with the reason.
 */
function requireLumpedJunction(spec: Spec, lines: SizedLines): void {
  const tee = tJunctionHammerstad(lines.series, lines.series, lines.stub, spec.substrate, spec.frequency);
  const broken = tee.warnings.find((w) => /higher-order-mode|broken down/.test(w.message));
  const sizes = [tee.da, tee.db, tee.d2].map(Math.abs);
  if (broken || sizes.some((v) => !Number.isFinite(v) || v > lines.series.wavelength / 4)) {
    const fp = (0.4 * Math.min(lines.series.z0, lines.stub.z0)) / (spec.substrate.height * 1e3);
    const near = Number.isFinite(fp) ? ` (first higher-order mode near ${trimmed(fp, 3)} GHz, Hammerstad 1981)` : '';
    fail(
      'design.out-of-model',
      'frequency',
      `at ${trimmed(spec.frequency / 1e9, 4)} GHz the ${mm(Math.max(lines.series.width, lines.stub.width))} mm wide lines on ${mm(spec.substrate.height)} mm are too wide for a lumped T-junction${near}; use a thinner substrate or higher line impedances`,
    );
  }
}

/** Whole half wavelengths to add so `length` reaches `minimum`; more than a few means the request is unbuildable. */
const MAX_HALF_WAVES = 4;
function halfWavesToReach(length: number, minimum: number, wavelength: number): number {
  if (length >= minimum) return 0;
  const n = Math.ceil((minimum - length) / (wavelength / 2));
  return Number.isFinite(n) ? n : Number.POSITIVE_INFINITY;
}

function copperOf(
  lines: SizedLines,
  stubCount: 0 | 1 | 2,
  termination: 'open' | 'short',
  seriesLength: number,
  stubLength: number,
  leadLength: number,
  vias?: MatchCopper['vias'],
): MatchCopper {
  return {
    seriesWidth: lines.series.width,
    stubWidth: lines.stub.width,
    seriesLength,
    stubLength,
    leadLength,
    termination,
    stubCount,
    ...(vias ? { vias } : {}),
  };
}

interface Candidate {
  readonly solution: StubSolution;
  readonly copper: MatchCopper;
  readonly seriesCorrections: readonly Correction[];
  readonly stubCorrections: readonly Correction[];
  readonly residual: number;
  readonly converged: boolean;
  readonly notes: readonly Diagnostic[];
}

/**
 * Every buildable physical design for the given terminations, best first: shortest stub, then
 * shorter series line. Empty when no branch could be brought to the target.
 */
export function realizeAll(
  spec: Spec,
  lines: SizedLines,
  plan: JunctionPlan,
  ideal: IdealSolution,
  terminations: readonly ('open' | 'short')[] = spec.stub === 'best' ? ['open', 'short'] : [spec.stub],
): PhysicalDesign[] {
  const stubCount: 1 | 2 = ideal.solutions[0]?.style === 'balanced' ? 2 : 1;
  const stubSides = stubCount === 2 ? (['left', 'right'] as const) : ([spec.stubSide] as const);
  const via = spec.fab.viasPerStub > 0 ? viaOf(spec, lines.stub.width) : undefined;
  if (ideal.alreadyMatched) return [matchedLine(spec, lines, ideal, [...lines.diagnostics])];
  const candidates = ideal.solutions
    .filter((s) => terminations.includes(s.termination))
    .map((s) => realizeBranch(spec, lines, plan, s, stubCount, via))
    .filter((c) => c.converged)
    .sort((a, b) => a.copper.stubLength - b.copper.stubLength || a.copper.seriesLength - b.copper.seriesLength);
  return candidates.map((c) => {
    const diagnostics: Diagnostic[] = [...lines.diagnostics, ...c.notes];
    if (c.copper.termination === 'short' && via) {
      const ring = (via.pad - via.drill) / 2;
      if (ring < spec.fab.minAnnularRing) {
        diagnostics.push(diagnostic('fab.annular-ring', 'fab.via_pad', `annular ring ${mm(ring)} mm is below fab.min_annular_ring ${mm(spec.fab.minAnnularRing)} mm`));
      }
    }
    return assemble(spec, lines, plan, c, stubSides, via, diagnostics);
  });
}

/** The best buildable design for the spec's own choices (termination, style, side). */
export function realize(spec: Spec, lines: SizedLines, plan: JunctionPlan, ideal: IdealSolution): PhysicalDesign {
  const all = realizeAll(spec, lines, plan, ideal);
  if (all.length === 0) {
    fail('solve.no-passive-solution', 'stub', `no ${spec.stub === 'best' ? '' : `${spec.stub}-circuit `}stub branch could be built and brought to the target on the physical network; try another stub termination, stub impedance or fabrication limits`);
  }
  return all[0]!;
}

/** Vias in a row sit one pad plus the minimum space apart (common practice, no source). */
export const viaPitch = (spec: Spec): number => spec.fab.viaPad + spec.fab.minSpace;

function viaOf(spec: Spec, stubWidth: number): ViaSpec {
  return {
    drill: spec.fab.viaDrill,
    pad: spec.fab.viaPad,
    count: spec.fab.viasPerStub,
    pitch: viaPitch(spec),
    inductance: viaInductanceDesign(spec.substrate.height, spec.fab.viaDrill, spec.fab.viaPad, stubWidth, spec.fab.viasPerStub, viaPitch(spec)),
  };
}

function realizeBranch(
  spec: Spec,
  lines: SizedLines,
  plan: JunctionPlan,
  solution: StubSolution,
  stubCount: 1 | 2,
  via: ViaSpec | undefined,
): Candidate {
  const { series, stub } = lines;
  const j = plan.junction;
  const notes: Diagnostic[] = [];
  const seriesCorrections: Correction[] = [{ model: MODEL_NAMES.junction, delta: j.da }];
  let seriesLength = solution.positionWl * series.wavelength + j.da;
  // The stub must clear the load plane and any load lead the spec asks for.
  const seriesMinimum = spec.leads.load + stub.width / 2;
  const seriesHalves = halfWavesToReach(seriesLength, seriesMinimum, series.wavelength);
  if (seriesHalves > 0 && seriesHalves <= MAX_HALF_WAVES) {
    seriesLength += (seriesHalves * series.wavelength) / 2;
    seriesCorrections.push({ model: MODEL_NAMES.halfWave, delta: (seriesHalves * series.wavelength) / 2 });
  }

  const stubCorrections: Correction[] = [{ model: MODEL_NAMES.junction, delta: j.d2 - series.width / 2 }];
  let stubLength = solution.stubWl * stub.wavelength + j.d2 - series.width / 2;
  if (solution.termination === 'open') {
    const extension = openEndExtensionDesign(stub, spec.substrate);
    stubLength -= extension;
    stubCorrections.push({ model: MODEL_NAMES.openEnd, delta: -extension });
  } else if (via) {
    // An inductive end jX adds electrical length atan(X/Zs) (physics.md §4.4).
    const x = 2 * Math.PI * spec.frequency * via.inductance;
    const shortening = Math.atan(x / stub.z0) / stub.beta;
    stubLength -= shortening;
    stubCorrections.push({ model: MODEL_NAMES.via, delta: -shortening });
  }
  const stubMinimum = minimumStub(spec, solution.termination);
  const viaClearance = VIA_JUNCTION_CLEARANCE_WL * stub.wavelength;
  const wantClearance = solution.termination === 'short' && spec.stub === 'best';
  const stubHalves = halfWavesToReach(stubLength, Math.max(stubMinimum, wantClearance ? viaClearance : 0), stub.wavelength);
  if (stubHalves > 0 && stubHalves <= MAX_HALF_WAVES) {
    stubLength += (stubHalves * stub.wavelength) / 2;
    stubCorrections.push({ model: MODEL_NAMES.halfWave, delta: (stubHalves * stub.wavelength) / 2 });
  }
  if (solution.termination === 'short' && stubLength < VIA_CHECKED_CLEARANCE_WL * stub.wavelength) {
    notes.push(diagnostic('design.via-near-junction', 'stub', `the via sits ${mm(stubLength)} mm (${(stubLength / stub.wavelength).toFixed(3)} λ) from the line, closer than the ${VIA_CHECKED_CLEARANCE_WL} λ the full-wave checks cover; the via and the junction may interact beyond the model: check by full-wave simulation, or use stub: best`));
  } else if (wantClearance && stubCorrections.some((c) => c.model === MODEL_NAMES.halfWave)) {
    notes.push(diagnostic('design.note', 'stub', `short stub made half a wavelength longer to keep its via clear of the junction`));
  }
  if (stubCount === 2 && spec.substrate.er > BALANCED_CHECKED_ER) {
    notes.push(diagnostic('design.note', 'style', `the cross model of balanced stubs rests mostly on εr ≤ 4.4; a full-wave check on εr 10.2 landed 1.6 % low: check this design by full-wave simulation`));
  }

  const vias = solution.termination === 'short' && via ? { drill: via.drill, pad: via.pad, count: via.count, pitch: via.pitch } : undefined;
  const start = copperOf(lines, stubCount, solution.termination, seriesLength, stubLength, plan.leadLength, vias);
  const residualOf = (x: readonly [number, number]): readonly [number, number] => {
    const zin = physicalInputImpedance({ ...start, seriesLength: x[0], stubLength: x[1] }, spec.load, spec.substrate, spec.frequency);
    const g = mismatch(zin, spec.target);
    return [g.re, g.im];
  };
  if (seriesHalves > MAX_HALF_WAVES || stubHalves > MAX_HALF_WAVES) {
    return { solution, copper: start, seriesCorrections, stubCorrections, residual: Number.POSITIVE_INFINITY, converged: false, notes };
  }
  const result = newton2(residualOf, [seriesLength, stubLength], {
    step: [series.wavelength * 1e-7, stub.wavelength * 1e-7],
    tolerance: 1e-10,
    maxMove: [series.wavelength / 16, stub.wavelength / 16],
  });
  const refined = { ...start, seriesLength: result.x[0], stubLength: result.x[1] };
  const buildable = refined.stubLength >= stubMinimum && refined.seriesLength >= seriesMinimum;
  seriesCorrections.push({ model: MODEL_NAMES.refine, delta: refined.seriesLength - seriesLength });
  stubCorrections.push({ model: MODEL_NAMES.refine, delta: refined.stubLength - stubLength });
  return {
    solution,
    copper: refined,
    seriesCorrections,
    stubCorrections,
    residual: result.residual,
    converged: result.residual <= 1e-6 && buildable,
    notes,
  };
}

/**
 * The design drawn folded: a mitred bend is electrically shorter than its centre-line
 * (mitredBendLength, fitted to full-wave runs), so the stub's drawn centre-line grows by what its
 * bends take, and the network sees the same electrical stub as before: the match is unchanged.
 */
export function withBends(spec: Spec, physical: PhysicalDesign, count: 1 | 2): PhysicalDesign {
  const lengthEach = mitredBendLength(physical.copper.stubWidth, spec.substrate.height);
  const delta = -count * lengthEach;
  const copper: MatchCopper = { ...physical.copper, stubLength: physical.copper.stubLength + delta, bends: { count, lengthEach } };
  const sections = physical.sections.map((sec) =>
    sec.role === 'stub' ? { ...sec, length: copper.stubLength, corrections: [...sec.corrections, { model: MODEL_NAMES.bend, delta }] } : sec,
  );
  const zin = physicalInputImpedance(copper, spec.load, spec.substrate, spec.frequency);
  return { ...physical, copper, sections, s11DbAtF0: db(abs(mismatch(zin, spec.target))) };
}

/** Shortest stub the fabrication rules allow: a feature at least one minimum trace long; a via pad clear of the line. */
function minimumStub(spec: Spec, termination: 'open' | 'short'): number {
  return termination === 'open' ? spec.fab.minTrace : spec.fab.viaPad / 2 + spec.fab.minSpace;
}

function section(role: Section['role'], line: LineProperties, electricalWl: number, length: number, corrections: readonly Correction[]): Section {
  return {
    role,
    width: line.width,
    z0: line.z0,
    epsEff: line.epsEff,
    wavelength: line.wavelength,
    electricalWl,
    idealLength: electricalWl * line.wavelength,
    length,
    corrections,
  };
}

function assemble(
  spec: Spec,
  lines: SizedLines,
  plan: JunctionPlan,
  chosen: Candidate,
  stubSides: readonly ('left' | 'right')[],
  via: ViaSpec | undefined,
  diagnostics: readonly Diagnostic[],
): PhysicalDesign {
  const { series, stub } = lines;
  const c = chosen.copper;
  const leadElectrical = plan.leadLength - plan.junction.db;
  const sections: Section[] = [
    section('series', series, chosen.solution.positionWl, c.seriesLength, chosen.seriesCorrections),
    section('stub', stub, chosen.solution.stubWl, c.stubLength, chosen.stubCorrections),
    section('lead-source', series, leadElectrical / series.wavelength, c.leadLength, [{ model: MODEL_NAMES.junction, delta: plan.junction.db }]),
  ];
  const zin = physicalInputImpedance(c, spec.load, spec.substrate, spec.frequency);
  return {
    frequency: spec.frequency,
    substrate: spec.substrate,
    solution: chosen.solution,
    targetAtJunction: plan.targetAtJunction,
    sections,
    copper: c,
    stubSides,
    ...(c.termination === 'short' && via ? { via } : {}),
    s11DbAtF0: db(abs(mismatch(zin, spec.target))),
    diagnostics,
  };
}

function matchedLine(spec: Spec, lines: SizedLines, ideal: IdealSolution, diagnostics: Diagnostic[]): PhysicalDesign {
  // A plain line still needs copper to land on: at least one line width long in all.
  const source = Math.max(spec.leads.source, lines.series.width - spec.leads.load);
  const c = copperOf(lines, 0, 'open', Math.max(spec.leads.load, 0), 0, source);
  const zin = physicalInputImpedance(c, spec.load, spec.substrate, spec.frequency);
  diagnostics.push(diagnostic('solve.already-matched', 'load', 'the load already presents the target: no stub is needed, a plain line is drawn'));
  const trivial: StubSolution = ideal.solutions[0] ?? {
    positionWl: 0, stubWl: 0, termination: 'open', style: spec.style, branch: 1, stubSusceptance: 0, residualGamma: 0,
  };
  return {
    frequency: spec.frequency,
    substrate: spec.substrate,
    solution: trivial,
    targetAtJunction: spec.target,
    sections: [section('series', lines.series, c.seriesLength / lines.series.wavelength, c.seriesLength, []), section('lead-source', lines.series, c.leadLength / lines.series.wavelength, c.leadLength, [])],
    copper: c,
    stubSides: [],
    s11DbAtF0: db(abs(mismatch(zin, spec.target))),
    diagnostics,
  };
}


