// Cross-check against an independent closed-form solver in plain Python that works by Smith-chart
// geometry in the reflection-coefficient plane (scripts/fixtures/independent_stub_solver.py; the seed,
// command and Python version are recorded in the fixture). Agreement required: 1e-6 wavelengths.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Complex } from '../../src/math/complex.js';
import { solveSingleStub } from '../../src/solve/index.js';
import { TunestripError } from '../../src/diagnostics.js';
import type { StubStyle } from '../../src/seams.js';

interface FixturePosition {
  readonly positionWl: number;
  readonly stubSusceptance: number;
  readonly openWl: number;
  readonly shortWl: number;
}
interface FixtureCase {
  readonly load: Complex;
  readonly target: Complex;
  readonly lineZ0: number;
  readonly stubZ0: number;
  readonly style: StubStyle;
  readonly reachable: boolean;
  readonly positions: readonly FixturePosition[];
}

const fixture = JSON.parse(readFileSync(new URL('../fixtures/independent-stub-solutions.json', import.meta.url), 'utf8')) as {
  seed: number;
  cases: FixtureCase[];
};

/** Distance on the circle of lengths modulo λ/2, so 1e-12 and 0.5 − 1e-12 count as equal. */
const wrappedDistance = (a: number, b: number): number => {
  const d = Math.abs(a - b) % 0.5;
  return Math.min(d, 0.5 - d);
};

describe(`independent Smith-chart solver fixture (seed ${fixture.seed})`, () => {
  it('has about 200 cases, both reachable and unreachable', () => {
    expect(fixture.cases.length).toBeGreaterThanOrEqual(200);
    expect(fixture.cases.some((c) => !c.reachable)).toBe(true);
    expect(fixture.cases.filter((c) => c.reachable).length).toBeGreaterThan(150);
  });

  it('agrees on every branch: position, open and short length to 1e-6 λ; susceptance to 1e-6', () => {
    let compared = 0;
    fixture.cases.forEach((c, index) => {
      const p = { load: c.load, target: c.target, lineZ0: c.lineZ0, stubZ0: c.stubZ0, style: c.style };
      if (!c.reachable) {
        expect(() => solveSingleStub(p), `case ${index}`).toThrow(TunestripError);
        return;
      }
      const { solutions } = solveSingleStub(p);
      expect(solutions.length, `case ${index}`).toBe(2 * c.positions.length);
      c.positions.forEach((ref, i) => {
        const branch = (i + 1) as 1 | 2;
        const mine = solutions.filter((s) => s.branch === branch);
        expect(mine, `case ${index} branch ${branch}`).toHaveLength(2);
        for (const s of mine) {
          const where = `case ${index} branch ${branch} ${s.termination}`;
          expect(wrappedDistance(s.positionWl, ref.positionWl), where).toBeLessThan(1e-6);
          const refLength = s.termination === 'open' ? ref.openWl : ref.shortWl;
          expect(wrappedDistance(s.stubWl, refLength), where).toBeLessThan(1e-6);
          expect(Math.abs(s.stubSusceptance - ref.stubSusceptance), where).toBeLessThan(1e-6 * Math.max(1, Math.abs(ref.stubSusceptance)));
          compared += 1;
        }
      });
    });
    expect(compared).toBeGreaterThan(600);
  });
});
