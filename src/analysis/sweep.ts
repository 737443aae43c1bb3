// Frequency response of the ideal and the physical network over the spec's band.
import { abs, add, db, inv, scale, type Complex } from '../math/complex.js';
import type { PhysicalDesign, ResponseSet, Spec } from '../seams.js';
import { idealInputImpedance as idealLine, idealOpenStubAdmittance, idealShortStubAdmittance } from '../math/lines.js';
import { admittanceOf } from '../math/network.js';
import { mismatch, physicalInputImpedance } from './physicalNetwork.js';
import { toleranceRuns } from './tolerance.js';
import { sheetEquivalent } from './sheetEquivalent.js';
import { frequencyGrid } from './grid.js';

export { frequencyGrid };


/**
 * The ideal network at frequency f: lossless, dispersionless lines whose electrical lengths scale
 * with f/f0, no junction or end effects — what single-stub theory alone predicts.
 */
export function idealInputImpedance(design: PhysicalDesign, spec: Spec, frequency: number): Complex {
  // Electrical lengths are in wavelengths at f0; at f they scale by f/f0.
  const k = frequency / design.frequency;
  const wl = (role: string): number => k * (design.sections.find((s) => s.role === role)?.electricalWl ?? 0);
  const zSeries = idealLine(spec.load, spec.lineZ0, wl('series'));
  if (design.copper.stubCount === 0) return idealLine(zSeries, spec.lineZ0, wl('lead-source'));
  const yStub =
    design.solution.termination === 'open'
      ? idealOpenStubAdmittance(spec.stubZ0, wl('stub'))
      : idealShortStubAdmittance(spec.stubZ0, wl('stub'));
  const yJ = add(admittanceOf(zSeries), scale(yStub, design.copper.stubCount));
  return idealLine(inv(yJ), spec.lineZ0, wl('lead-source'));
}

export function sweep(spec: Spec, design: PhysicalDesign): ResponseSet {
  const frequencies = frequencyGrid(spec.sweep.start, spec.sweep.stop, spec.sweep.points);
  const ideal = frequencies.map((f) => mismatch(idealInputImpedance(design, spec, f), spec.target));
  const physical = frequencies.map((f) =>
    mismatch(physicalInputImpedance(design.copper, spec.load, spec.substrate, f), spec.target),
  );
  return {
    frequencies,
    ideal,
    physical,
    s11DbAtF0: design.s11DbAtF0,
    band10dB: bandAround(frequencies, physical, design.frequency, -10),
    tolerance: toleranceRuns(spec, design),
    sheetEquivalent: sheetEquivalent(spec, design),
  };
}

/** The contiguous band around f0 where |S11| stays at or below `limitDb`, or null. */
export function bandAround(frequencies: readonly number[], s11: readonly Complex[], f0: number, limitDb: number): ResponseSet['band10dB'] {
  let centre = 0;
  for (let i = 1; i < frequencies.length; i++) {
    if (Math.abs(frequencies[i]! - f0) < Math.abs(frequencies[centre]! - f0)) centre = i;
  }
  const ok = (i: number): boolean => db(abs(s11[i]!)) <= limitDb;
  if (!ok(centre)) return null;
  let lo = centre;
  let hi = centre;
  while (lo > 0 && ok(lo - 1)) lo--;
  while (hi < frequencies.length - 1 && ok(hi + 1)) hi++;
  return { low: frequencies[lo]!, high: frequencies[hi]! };
}
