// The fits of tunestrip's junction, open-end and via models to this project's own full-wave extractions
// (scripts/fullwave/junctions.json, made by extract_junctions.py with openEMS). Used by
// fit-junctions.ts (prints the fit) and by test/reference/fullwave-junctions.test.ts (checks that the
// coefficients in src/ are the ones these data give). Not part of tunestrip.
//
// Cross: the equivalent circuit tunestrip's network uses (physics.md §4.2: a node with shunt jB, the
// main arms through ideal transformers n², reference planes d_a and d2), seen from the cross's
// centre-lines, is compared with the extracted S matrix in the even mode of the two stubs (the only
// mode a balanced stub pair drives). The four coefficients of `crossJunctionFitted` are chosen by
// least squares over every case and frequency. T-junctions are compared the same way (3 ports), as
// a check of Hammerstad's closed form; nothing is fitted to them.
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { abs, add, complex, div, exp, mul, scale, sub, type Complex } from '../../src/math/complex.js';
import { analyseMicrostrip } from '../../src/physical/microstrip/index.js';
import { fittedJunction, mitredBendLength, mutualInductanceGrover, openEndExtensionDesign, openEndExtensionKJK, tJunctionHammerstad, viaCrowdingBasis, viaInductanceDesign, viaInductanceGoldfarbPucel, type JunctionFit } from '../../src/physical/discontinuities/index.js';
import type { LineProperties, Substrate } from '../../src/seams.js';

export interface SubstrateRecord { readonly er: number; readonly height_m: number; readonly copper_m: number; readonly tan_delta: number }
export interface CrossRecord {
  readonly name: string;
  readonly substrate: SubstrateRecord;
  readonly frequency_hz: number;
  readonly main: { readonly z0_target_ohm: number; readonly width_m: number };
  readonly stub: { readonly z0_target_ohm: number; readonly width_m: number };
  readonly freq_hz: readonly number[];
  readonly s_re: readonly (readonly (readonly number[])[])[];
  readonly s_im: readonly (readonly (readonly number[])[])[];
  readonly reciprocity_error: number;
  readonly symmetry_error: number;
}
export interface ViaRecord {
  readonly name: string;
  /** "fit": used by the fit; "check": run after the fit and kept out of it. */
  readonly use: 'fit' | 'check';
  readonly substrate: SubstrateRecord;
  readonly frequency_hz: number;
  readonly line: { readonly width_m: number };
  readonly via: { readonly drill_m: number; readonly pad_m: number };
  readonly freq_hz: readonly number[];
  readonly inductance_nh: readonly number[];
  readonly inductance_nh_at_f0: number;
}
/** A row of vias at a line's end (`extract_junctions.py via-row`): the same fields, the row's count and pitch. */
export interface ViaRowRecord {
  readonly name: string;
  readonly substrate: SubstrateRecord;
  readonly frequency_hz: number;
  readonly line: { readonly width_m: number };
  readonly via: { readonly drill_m: number; readonly pad_m: number; readonly count: number; readonly pitch_m: number };
  readonly freq_hz: readonly number[];
  readonly inductance_nh: readonly number[];
  readonly inductance_nh_at_f0: number;
}
/**
 * A T-junction extraction has the same fields as a cross's, with a 3 × 3 S (ports 1, 2 main, 3 stub),
 * and says whether the fit uses it ("fit") or it was run after the fit and kept out ("check").
 */
export interface TeeRecord extends CrossRecord {
  readonly use: 'fit' | 'check';
}

/** The tees the fit uses. */
export const fittedTees = (data: JunctionData): readonly TeeRecord[] => data.tees.filter((t) => t.use === 'fit');
export interface OpenEndRecord {
  readonly name: string;
  readonly substrate: SubstrateRecord;
  readonly frequency_hz: number;
  readonly line: { readonly width_m: number };
  readonly extension_m_at_f0: number;
}
export interface BendRecord {
  readonly name: string;
  readonly substrate: SubstrateRecord;
  readonly frequency_hz: number;
  readonly line: { readonly z0_target_ohm: number; readonly width_m: number };
  readonly mitre_edge_cut_m: number;
  readonly freq_hz: readonly number[];
  readonly s11_re: readonly number[];
  readonly s11_im: readonly number[];
  readonly s21_re: readonly number[];
  readonly s21_im: readonly number[];
  readonly equivalent_length_m: readonly number[];
  readonly equivalent_length_m_at_f0: number;
}
export interface JunctionData {
  readonly solver: string;
  readonly crosses: readonly CrossRecord[];
  readonly tees: readonly TeeRecord[];
  readonly open_ends: readonly OpenEndRecord[];
  readonly vias: readonly ViaRecord[];
  readonly bends: readonly BendRecord[];
  readonly via_rows: readonly ViaRowRecord[];
}

const here = dirname(fileURLToPath(import.meta.url));
export const JUNCTIONS_FILE = join(here, 'junctions.json');

export function readJunctions(file = JUNCTIONS_FILE): JunctionData {
  return JSON.parse(readFileSync(file, 'utf8')) as JunctionData;
}

export const substrateOf = (s: SubstrateRecord): Substrate => ({
  er: s.er,
  height: s.height_m,
  copper: s.copper_m,
  tanDelta: s.tan_delta,
  roughness: 0,
  conductivity: 5.8e7,
});

type Matrix = Complex[][];

/** Even mode of the stub pair: ports main 1, main 2, and (stub 3 + stub 4)/√2. */
function evenMode(s: Matrix): Matrix {
  const u = (row: Complex[], k: number): Complex => (k < 2 ? row[k]! : scale(add(row[2]!, row[3]!), Math.SQRT1_2));
  const half = s.map((row) => [0, 1, 2].map((k) => u(row, k)));
  return [0, 1, 2].map((i) => [0, 1, 2].map((k) => (i < 2 ? half[i]![k]! : scale(add(half[2]![k]!, half[3]![k]!), Math.SQRT1_2))));
}

/** The recorded S at frequency k: a tee's as it is, a cross's in the even mode of its stubs. */
export function measuredS(record: CrossRecord, k: number): Matrix {
  const s = record.s_re[k]!.map((row, i) => row.map((re, j) => complex(re, record.s_im[k]![i]![j]!)));
  return s.length === 4 ? evenMode(s) : s;
}

/** Line properties of one cross or tee case at one frequency, computed once per fit. */
export interface JunctionPoint {
  readonly arms: 3 | 4;
  readonly substrate: Substrate;
  readonly main: LineProperties;
  readonly stub: LineProperties;
  readonly measured: Matrix;
}

export function junctionPoints(records: readonly CrossRecord[]): JunctionPoint[] {
  return records.flatMap((r) => {
    const substrate = substrateOf(r.substrate);
    return r.freq_hz.map((f, k) => ({
      arms: r.s_re[k]!.length === 4 ? (4 as const) : (3 as const),
      substrate,
      main: analyseMicrostrip(r.main.width_m, substrate, f),
      stub: analyseMicrostrip(r.stub.width_m, substrate, f),
      measured: measuredS(r, k),
    }));
  });
}

export interface JunctionElements { readonly da: number; readonly d2: number; readonly n2: number; readonly susceptance: number }

/**
 * S of the equivalent circuit seen from the junction's centre-lines (a cross's in the even mode). At
 * the node the arms present G_k = 1/(n_k²·Z_k) (a transformer renormalises without reflecting), so
 * S_node = 2·√(G_i·G_j)/(ΣG + jB) − δ_ij; each arm then adds its line from the centre-line to its
 * reference plane, of length −d_a (main) or −d2 (stub).
 */
export function modelS(point: JunctionPoint, j: JunctionElements): Matrix {
  const { main, stub } = point;
  const g = [1 / (j.n2 * main.z0), 1 / (j.n2 * main.z0), 1 / stub.z0, 1 / stub.z0].slice(0, point.arms);
  const total = complex(g.reduce((a, b) => a + b, 0), j.susceptance);
  const phase = [main.beta * j.da, main.beta * j.da, stub.beta * j.d2, stub.beta * j.d2];
  const s = g.map((gi, i) =>
    g.map((gk, k) => {
      const node = sub(div(complex(2 * Math.sqrt(gi * gk)), total), complex(i === k ? 1 : 0));
      return mul(node, exp(complex(0, phase[i]! + phase[k]!)));
    }),
  );
  return point.arms === 4 ? evenMode(s) : s;
}

export function junctionElements(point: JunctionPoint, fit: JunctionFit | undefined): JunctionElements {
  const f = point.main.frequency;
  const tee = tJunctionHammerstad(point.main, point.main, point.stub, point.substrate, f);
  const j = fit ? fittedJunction(tee, point.main, point.stub, point.substrate, fit) : tee;
  return { da: j.da, d2: j.d2, n2: j.n2a, susceptance: j.susceptance };
}

/** Root-mean-square difference of the (even-mode) S elements over the points (9 per point). */
export function rmsError(points: readonly JunctionPoint[], elementsOf: (p: JunctionPoint) => JunctionElements): number {
  let sum = 0;
  for (const p of points) {
    const model = modelS(p, elementsOf(p));
    for (let i = 0; i < 3; i += 1) for (let k = 0; k < 3; k += 1) sum += abs(sub(model[i]![k]!, p.measured[i]![k]!)) ** 2;
  }
  return Math.sqrt(sum / (9 * points.length));
}

/** The optional terms of a junction correction, fitted when the start value carries them. */
const OPTIONAL_TERMS = ['planeAPerEr', 'n2DeficitPerEr', 'planeAPerLogZRatio', 'n2DeficitPerLogZRatio', 'susceptancePerLogZRatio'] as const;

/**
 * Least-squares coefficients of a junction correction over all points (Nelder–Mead from `start`,
 * restarted until a restart stops improving). The optional terms (εr, impedance ratio) are fitted
 * when `start` has them.
 */
export function fitJunction(points: readonly JunctionPoint[], start: JunctionFit): { fit: JunctionFit; rms: number } {
  const optional = OPTIONAL_TERMS.filter((k) => start[k] !== undefined);
  const fitOf = (v: readonly number[]): JunctionFit => ({
    planeA: v[0]!,
    stubPlaneD2: v[1]!,
    n2Deficit: v[2]!,
    susceptance: v[3]!,
    ...Object.fromEntries(optional.map((k, i) => [k, v[4 + i]!])),
  });
  let x = [start.planeA, start.stubPlaneD2, start.n2Deficit, start.susceptance, ...optional.map((k) => start[k]!)];
  const cost = (v: readonly number[]): number => rmsError(points, (p) => junctionElements(p, fitOf(v)));
  let value = Infinity;
  for (let restart = 0; restart < 8; restart += 1) {
    const best = nelderMead(cost, x, x.map((v) => 0.2 * Math.abs(v) + 0.05));
    const done = best.value > value * (1 - 1e-6);
    x = best.x;
    value = Math.min(value, best.value);
    if (done) break;
  }
  return { fit: fitOf(x), rms: value };
}

/** One cross case's own elements (d_a, d2, n², B) at one frequency, fitted to its S alone. */
export function caseElements(point: JunctionPoint, start: JunctionElements): JunctionElements & { rms: number } {
  const toElements = (x: readonly number[]): JunctionElements => ({ da: x[0]! * 1e-3, d2: x[1]! * 1e-3, n2: x[2]!, susceptance: x[3]! * 1e-3 });
  const x0 = [start.da * 1e3, start.d2 * 1e3, start.n2, start.susceptance * 1e3];
  const best = nelderMead((x) => rmsError([point], () => toElements(x)), x0, [0.1, 0.3, 0.02, 0.5]);
  return { ...toElements(best.x), rms: best.value };
}

/** Nelder–Mead simplex minimisation (standard coefficients 1, 2, ½, ½), to a relative spread of 1e-12. */
export function nelderMead(f: (x: readonly number[]) => number, x0: readonly number[], steps: readonly number[], maxIterations = 4000): { x: number[]; value: number } {
  const n = x0.length;
  let simplex = [x0.slice(), ...steps.map((s, i) => x0.map((v, k) => (k === i ? v + s : v)))].map((x) => ({ x, value: f(x) }));
  for (let it = 0; it < maxIterations; it += 1) {
    simplex.sort((a, b) => a.value - b.value);
    const best = simplex[0]!;
    const worst = simplex[n]!;
    if (Math.abs(worst.value - best.value) <= 1e-12 * (Math.abs(best.value) + 1e-30)) break;
    const centroid = x0.map((_, k) => simplex.slice(0, n).reduce((a, p) => a + p.x[k]!, 0) / n);
    const along = (t: number): number[] => centroid.map((c, k) => c + t * (worst.x[k]! - c));
    const reflected = along(-1);
    const fr = f(reflected);
    if (fr < best.value) {
      const expanded = along(-2);
      const fe = f(expanded);
      simplex[n] = fe < fr ? { x: expanded, value: fe } : { x: reflected, value: fr };
    } else if (fr < simplex[n - 1]!.value) {
      simplex[n] = { x: reflected, value: fr };
    } else {
      const contracted = fr < worst.value ? along(-0.5) : along(0.5);
      const fc = f(contracted);
      if (fc < Math.min(fr, worst.value)) simplex[n] = { x: contracted, value: fc };
      else simplex = simplex.map((p, i) => (i === 0 ? p : { x: p.x.map((v, k) => best.x[k]! + 0.5 * (v - best.x[k]!)), value: NaN })).map((p) => (Number.isNaN(p.value) ? { x: p.x, value: f(p.x) } : p));
    }
  }
  simplex.sort((a, b) => a.value - b.value);
  return { x: simplex[0]!.x, value: simplex[0]!.value };
}

export interface ViaComparison {
  readonly name: string;
  readonly use: 'fit' | 'check';
  readonly hOverD: number;
  readonly wOverH: number;
  readonly measuredNh: number;
  readonly goldfarbPucelNh: number;
  /** tunestrip's design model (src/) for the same via, strip and pad. */
  readonly designNh: number;
}

export function viaComparisons(records: readonly ViaRecord[]): ViaComparison[] {
  return records.map((r) => ({
    name: r.name,
    use: r.use,
    hOverD: r.substrate.height_m / r.via.drill_m,
    wOverH: r.line.width_m / r.substrate.height_m,
    measuredNh: r.inductance_nh_at_f0,
    goldfarbPucelNh: viaInductanceGoldfarbPucel(r.substrate.height_m, r.via.drill_m) * 1e9,
    designNh: viaInductanceDesign(r.substrate.height_m, r.via.drill_m, r.via.pad_m, r.line.width_m) * 1e9,
  }));
}

/**
 * The crowding coefficient k of L = L_GP + k·viaCrowdingBasis(pad, w) that minimises the squared
 * relative error over the extracted vias marked "fit" (linear least squares, closed form).
 */
export function fitViaCrowding(records: readonly ViaRecord[]): number {
  let num = 0;
  let den = 0;
  for (const r of records.filter((v) => v.use === 'fit')) {
    const measured = r.inductance_nh_at_f0 * 1e-9;
    const gp = viaInductanceGoldfarbPucel(r.substrate.height_m, r.via.drill_m);
    const c = viaCrowdingBasis(r.via.pad_m, r.line.width_m);
    num += (c / measured) * (1 - gp / measured);
    den += (c / measured) ** 2;
  }
  return num / den;
}

/** The scale s on KJK's Δl minimising Σ(s·model/measured − 1)² over the open ends (closed form). */
export function fitOpenEndScale(records: readonly OpenEndRecord[]): number {
  const ratios = openEndComparisons(records).map((o) => o.kjk / o.measured);
  return ratios.reduce((a, r) => a + r, 0) / ratios.reduce((a, r) => a + r * r, 0);
}

/** Each extracted open-end extension at f0 beside Kirschning–Jansen–Koster's for the same line. */
export function openEndComparisons(records: readonly OpenEndRecord[]): { name: string; height: number; measured: number; kjk: number; model: number }[] {
  return records.map((r) => {
    const substrate = substrateOf(r.substrate);
    const line = analyseMicrostrip(r.line.width_m, substrate, r.frequency_hz);
    return { name: r.name, height: r.substrate.height_m, measured: r.extension_m_at_f0, kjk: openEndExtensionKJK(line, substrate), model: openEndExtensionDesign(line, substrate) };
  });
}

/**
 * The two coefficients of mitredBendLength, Δl = a·w + b·h, minimising Σ(Δl_model/w − Δl/w)² over
 * the extracted bends at f0 (linear least squares in a and b, closed form; regressor h/w).
 */
export function fitBendLength(records: readonly BendRecord[]): { perWidth: number; perHeight: number } {
  let n = 0;
  let sx = 0;
  let sxx = 0;
  let sy = 0;
  let sxy = 0;
  for (const r of records) {
    const x = r.substrate.height_m / r.line.width_m;
    const y = r.equivalent_length_m_at_f0 / r.line.width_m;
    n += 1;
    sx += x;
    sxx += x * x;
    sy += y;
    sxy += x * y;
  }
  const det = n * sxx - sx * sx;
  return { perWidth: (sxx * sy - sx * sxy) / det, perHeight: (n * sxy - sx * sy) / det };
}

/** Each extracted bend's equivalent length at f0 beside mitredBendLength for the same line. */
export function bendComparisons(records: readonly BendRecord[]): { name: string; width: number; aspect: number; measured: number; model: number }[] {
  return records.map((r) => ({
    name: r.name,
    width: r.line.width_m,
    aspect: r.line.width_m / r.substrate.height_m,
    measured: r.equivalent_length_m_at_f0,
    model: mitredBendLength(r.line.width_m, r.substrate.height_m),
  }));
}

/** A row's own part (each via's inductance over n) and its mutual part per unit scale (Σ_i≠j Grover / n²), in H. */
function viaRowParts(r: ViaRowRecord): { own: number; mutual: number } {
  const { count, pitch_m: pitch } = r.via;
  const h = r.substrate.height_m;
  const one = viaInductanceDesign(h, r.via.drill_m, r.via.pad_m, r.line.width_m / count);
  let mutual = 0;
  for (let i = 0; i < count; i += 1) for (let j = 0; j < count; j += 1) if (i !== j) mutual += mutualInductanceGrover(h, Math.abs(i - j) * pitch);
  // viaInductanceDesign with count 1 on the via's share of the strip is that via's own inductance.
  return { own: one / count, mutual: mutual / (count * count) };
}

/** The scale k on Grover's mutual inductance minimising Σ((own + k·mutual)/measured − 1)² over the extracted rows (closed form). */
export function fitViaRowMutual(records: readonly ViaRowRecord[]): number {
  let num = 0;
  let den = 0;
  for (const r of records) {
    const measured = r.inductance_nh_at_f0 * 1e-9;
    const { own, mutual } = viaRowParts(r);
    num += (mutual / measured) * (1 - own / measured);
    den += (mutual / measured) ** 2;
  }
  return num / den;
}

/** Each extracted row beside tunestrip's design model (src/) and the same model without mutual inductance. */
export function viaRowComparisons(records: readonly ViaRowRecord[]): { name: string; count: number; measuredNh: number; designNh: number; noMutualNh: number }[] {
  return records.map((r) => ({
    name: r.name,
    count: r.via.count,
    measuredNh: r.inductance_nh_at_f0,
    designNh: viaInductanceDesign(r.substrate.height_m, r.via.drill_m, r.via.pad_m, r.line.width_m, r.via.count, r.via.pitch_m) * 1e9,
    noMutualNh: viaRowParts(r).own * 1e9,
  }));
}
