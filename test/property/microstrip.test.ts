// Seeded property tests of the microstrip model (fast-check).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Substrate } from '../../src/seams.js';
import { analyseMicrostrip, FN_MAX, synthesizeMicrostrip } from '../../src/physical/microstrip/index.js';

const substrateArb = (erMax = 10): fc.Arbitrary<Substrate> =>
  fc.record({
    er: fc.double({ min: 2, max: erMax, noNaN: true }),
    height: fc.double({ min: 0.1e-3, max: 1.6e-3, noNaN: true }),
    copper: fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 70e-6, noNaN: true })),
    tanDelta: fc.double({ min: 0, max: 0.03, noNaN: true }),
    roughness: fc.double({ min: 0, max: 3e-6, noNaN: true }),
    conductivity: fc.constant(5.8e7),
  });
/** A frequency inside the dispersion models' range for this height: fn = f·h ≤ FN_MAX. */
const frequencyFor = (s: Substrate, fraction: number): number => 1e8 + fraction * (FN_MAX / (s.height * 1e-6) - 1e8);

describe('synthesis inverts analysis', () => {
  it('analyse(synthesize(Z0)).z0 = Z0 to 1e-9 relative (20–120 Ω, εr 2–10, h 0.1–1.6 mm, t 0–70 µm)', () => {
    fc.assert(
      fc.property(fc.double({ min: 20, max: 120, noNaN: true }), substrateArb(), fc.double({ min: 0, max: 1, noNaN: true }), (z0, s, k) => {
        const f = frequencyFor(s, k);
        const line = synthesizeMicrostrip(z0, s, f);
        const again = analyseMicrostrip(line.width, s, f);
        expect(Math.abs(again.z0 / z0 - 1)).toBeLessThan(1e-9);
      }),
      { seed: 42, numRuns: 150 },
    );
  });
  it('synthesize(analyse(w).z0).width = w to 1e-9 relative', () => {
    fc.assert(
      fc.property(substrateArb(), fc.double({ min: 0.15, max: 8, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (s, u, k) => {
        const f = frequencyFor(s, k);
        const w = Math.max(u * s.height, 2 * s.copper);
        const z0 = analyseMicrostrip(w, s, f).z0;
        const line = synthesizeMicrostrip(z0, s, f);
        expect(Math.abs(line.width / w - 1)).toBeLessThan(1e-9);
      }),
      { seed: 42, numRuns: 150 },
    );
  });
});

describe('monotonic and bounded', () => {
  it('Z0 (static and at f) decreases with width', () => {
    fc.assert(
      fc.property(substrateArb(), fc.double({ min: 0.1, max: 10, noNaN: true }), fc.double({ min: 1.001, max: 3, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (s, u, ratio, k) => {
        const f = frequencyFor(s, k);
        const narrow = analyseMicrostrip(u * s.height, s, f);
        const wide = analyseMicrostrip(u * ratio * s.height, s, f);
        expect(wide.z0).toBeLessThan(narrow.z0);
        expect(wide.z0Static).toBeLessThan(narrow.z0Static);
      }),
      { seed: 42, numRuns: 300 },
    );
  });
  it('1 < εe ≤ εr (static and at f), losses ≥ 0', () => {
    fc.assert(
      fc.property(substrateArb(20), fc.double({ min: 0.01, max: 100, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (s, u, k) => {
        const line = analyseMicrostrip(u * s.height, s, frequencyFor(s, k));
        for (const ee of [line.epsEff, line.epsEffStatic]) {
          expect(ee).toBeGreaterThan(1);
          expect(ee).toBeLessThanOrEqual(s.er);
        }
        expect(line.epsEff).toBeGreaterThanOrEqual(line.epsEffStatic);
        expect(line.alphaConductor).toBeGreaterThan(0);
        expect(line.alphaDielectric).toBeGreaterThanOrEqual(0);
      }),
      { seed: 42, numRuns: 300 },
    );
  });
});
