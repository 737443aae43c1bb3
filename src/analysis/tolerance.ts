// Monte-Carlo check of a physical design over fabrication spread: every run perturbs εr, the
// dielectric height, the copper thickness and the etched width (the same bias on every line)
// uniformly within the spec's tolerances, keeps the drawn lengths, and evaluates the physical
// network. Seeded, so the same spec gives the same figures.
import { abs, db } from '../math/complex.js';
import { quantile, seededUniform } from '../math/random.js';
import type { PhysicalDesign, Spec, ToleranceResult } from '../seams.js';
import { mismatch, physicalInputImpedance } from './physicalNetwork.js';
import { frequencyGrid } from './grid.js';

/** Frequencies per run: coarse enough to stay fast, fine enough to place the minimum by interpolation. */
const TOLERANCE_POINTS = 61;


export function toleranceRuns(spec: Spec, design: PhysicalDesign): ToleranceResult | null {
  const t = spec.tolerance;
  if (t.runs === 0) return null;
  const next = seededUniform(t.seed);
  const spread = (nominal: number, fraction: number): number => nominal * (1 + fraction * (2 * next() - 1));
  const frequencies = [...frequencyGrid(spec.sweep.start, spec.sweep.stop, TOLERANCE_POINTS)];
  const atF0: number[] = [];
  const minima: number[] = [];
  const perFrequency: number[][] = frequencies.map(() => []);
  for (let run = 0; run < t.runs; run++) {
    const substrate = {
      ...spec.substrate,
      er: Math.max(1, spread(spec.substrate.er, t.erFraction)),
      height: spread(spec.substrate.height, t.heightFraction),
      copper: spread(spec.substrate.copper, t.copperFraction),
    };
    const bias = t.width * (2 * next() - 1);
    const c = design.copper;
    const copper = { ...c, seriesWidth: Math.max(c.seriesWidth + bias, c.seriesWidth * 0.1), stubWidth: Math.max(c.stubWidth + bias, c.stubWidth * 0.1) };
    const gammaAt = (f: number): number => abs(mismatch(physicalInputImpedance(copper, spec.load, substrate, f), spec.target));
    const mags = frequencies.map(gammaAt);
    mags.forEach((m, i) => perFrequency[i]!.push(db(m)));
    atF0.push(db(gammaAt(spec.frequency)));
    minima.push(minimumFrequency(frequencies, mags));
  }
  const sortedF0 = [...atF0].sort((a, b) => a - b);
  const sortedMin = [...minima].sort((a, b) => a - b);
  return {
    runs: t.runs,
    seed: t.seed,
    s11DbAtF0: { median: quantile(sortedF0, 0.5), p95: quantile(sortedF0, 0.95), worst: sortedF0[sortedF0.length - 1]! },
    minimumFrequency: { p5: quantile(sortedMin, 0.05), p95: quantile(sortedMin, 0.95) },
    yield10dB: atF0.filter((v) => v <= -10).length / t.runs,
    frequencies,
    envelopeP95Db: perFrequency.map((v) => quantile([...v].sort((a, b) => a - b), 0.95)),
  };
}

/** Frequency of the smallest |Γ| on the grid, refined by a parabola through |Γ|² at its neighbours. */
export function minimumFrequency(frequencies: readonly number[], mags: readonly number[]): number {
  let i = 0;
  for (let k = 1; k < mags.length; k++) if (mags[k]! < mags[i]!) i = k;
  if (i === 0 || i === mags.length - 1) return frequencies[i]!;
  const [y0, y1, y2] = [mags[i - 1]! ** 2, mags[i]! ** 2, mags[i + 1]! ** 2];
  const den = y0 - 2 * y1 + y2;
  const step = frequencies[i + 1]! - frequencies[i]!;
  const offset = den > 0 ? (0.5 * (y0 - y2)) / den : 0;
  return frequencies[i]! + Math.max(-1, Math.min(1, offset)) * step;
}
