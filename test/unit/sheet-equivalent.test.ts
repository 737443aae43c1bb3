// The zero-thickness-sheet prediction (src/analysis/sheetEquivalent.ts) and the minimiser under it.
// Its physics is checked against the full-wave sheet runs in test/reference/fullwave-results.test.ts.
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { designFromText } from '../../src/design.js';
import { abs } from '../../src/math/complex.js';
import { minimiseOnGrid } from '../../src/math/minimise.js';
import { ALL_MODELS, mismatch, physicalInputImpedance } from '../../src/analysis/physicalNetwork.js';
import { repoPresets, repoRoot } from '../helpers/templates.js';

describe('minimiseOnGrid', () => {
  it('finds the vertex of a parabola anywhere in the range', () => {
    fc.assert(
      fc.property(fc.double({ min: -0.95, max: 0.95, noNaN: true }), fc.double({ min: 0.1, max: 100, noNaN: true }), (x0, k) => {
        const x = minimiseOnGrid((v) => k * (v - x0) ** 2, -1, 1, 41, 1e-9);
        expect(Math.abs(x - x0)).toBeLessThan(1e-8);
      }),
    );
  });
  it('takes the deeper of two dips, wherever the grid starts', () => {
    // Dips at -0.5 (depth 1) and +0.6 (depth 2): the search must not settle in the first it meets.
    const f = (v: number): number => -Math.exp(-(((v + 0.5) / 0.05) ** 2)) - 2 * Math.exp(-(((v - 0.6) / 0.05) ** 2));
    expect(Math.abs(minimiseOnGrid(f, -1, 1, 201, 1e-9) - 0.6)).toBeLessThan(1e-6);
  });
});

describe('sheetEquivalent', () => {
  const designExample = (name: string, edit: (text: string) => string = (t) => t) =>
    designFromText(edit(readFileSync(`${repoRoot}/templates/examples/${name}.yaml`, 'utf8')), repoPresets(), { version: 'test' });

  it('is the minimum of the same copper on the same stackup with zero-thickness, lossless lines (a dense grid agrees)', () => {
    const run = designExample('receiver-5g8');
    const sheet = run.response.sheetEquivalent;
    expect(sheet).not.toBeNull();
    const { spec, physical } = run;
    const substrate = { ...spec.substrate, copper: 0 };
    const gammaAt = (f: number): number =>
      abs(mismatch(physicalInputImpedance(physical.copper, spec.load, substrate, f, { ...ALL_MODELS, loss: false }), spec.target));
    let best = { f: 0, g: Infinity };
    for (let k = 0; k <= 20000; k++) {
      const f = spec.frequency * (0.9 + (0.2 * k) / 20000);
      const g = gammaAt(f);
      if (g < best.g) best = { f, g };
    }
    // Within one step of the dense grid (0.2 f0 / 20000 = 1e-5 f0).
    expect(Math.abs((sheet?.minimumFrequency ?? NaN) - best.f) / spec.frequency).toBeLessThan(1e-5);
    expect(sheet?.offset).toBeCloseTo((sheet?.minimumFrequency ?? NaN) / spec.frequency - 1, 12);
  });

  it('is null when the stackup already has zero-thickness copper', () => {
    const run = designExample('receiver-5g8', (t) => t.replace('  preset: hydrocarbon-ceramic-0.51', '  preset: hydrocarbon-ceramic-0.51\n  copper: 0 um'));
    expect(run.spec.substrate.copper).toBe(0);
    expect(run.response.sheetEquivalent).toBeNull();
  });
});
