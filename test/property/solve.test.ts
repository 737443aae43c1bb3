// Seeded property tests of the single shunt-stub solver. The invariants are the definition of a
// match (Pozar, Microwave Engineering, 3rd ed. 2005, §5.2) and the reachability condition
// 1/S ≤ g_T ≤ S of physics.md §5.2 [C]. Every match is re-checked here with the ABCD network of
// src/math/network.ts (Pozar 2005 Table 4.1), independently of the solver's own residual.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { abs, add, complex, conj, div, impedanceOf, isFiniteComplex, sub, type Complex } from '../../src/math/complex.js';
import { idealInputImpedance, idealOpenStubAdmittance, idealShortStubAdmittance, LOSSLESS_PER_WAVELENGTH } from '../../src/math/lines.js';
import { cascade, inputImpedanceOf, lineAbcd, shuntAdmittanceAbcd } from '../../src/math/network.js';
import { solveSingleStub, type StubProblem } from '../../src/solve/index.js';
import { TunestripError } from '../../src/diagnostics.js';
import type { IdealSolution, StubSolution } from '../../src/seams.js';

const SEED = 20261202;

/** Input impedance of the solved network built from ABCD matrices: stub(s) in shunt, then the line to the load. */
function zinByAbcd(p: StubProblem, s: StubSolution): Complex {
  const one = s.termination === 'open' ? idealOpenStubAdmittance(p.stubZ0, s.stubWl) : idealShortStubAdmittance(p.stubZ0, s.stubWl);
  const count = p.style === 'balanced' ? 2 : 1;
  const stub = shuntAdmittanceAbcd(complex(one.re * count, one.im * count));
  return inputImpedanceOf(cascade(stub, lineAbcd(p.lineZ0, LOSSLESS_PER_WAVELENGTH, s.positionWl)), p.load);
}

const vswr = (p: StubProblem): number => {
  const g = abs(div(sub(p.load, complex(p.lineZ0)), add(p.load, complex(p.lineZ0))));
  return (1 + g) / (1 - g);
};

const mismatch = (z: Complex, t: Complex): number => abs(div(sub(z, t), add(z, conj(t))));

/** Load from its reflection coefficient on the line; |Γ| spans the chart centre to very near its edge. */
const gammaMagnitude = fc.oneof(
  fc.double({ min: 1e-6, max: 1e-3, noNaN: true }),
  fc.double({ min: 1e-3, max: 0.999, noNaN: true }),
  // Up to VSWR 1e5; beyond, the rounding allowance below exceeds 1e-9 for most problems (extreme-edge property).
  fc.double({ min: 0.999, max: 1 - 2e-5, noNaN: true }),
);
const lineZ0 = fc.double({ min: 10, max: 150, noNaN: true });
const stubZ0 = fc.double({ min: 10, max: 200, noNaN: true });
const style = fc.constantFrom('single' as const, 'balanced' as const);
const loadOn = (z0: number, g: number, phase: number): Complex =>
  impedanceOf(complex(g * Math.cos(phase), g * Math.sin(phase)), complex(z0));

const reachableProblem = fc
  .record({
    z0: lineZ0,
    zs: stubZ0,
    style,
    g: gammaMagnitude,
    phase: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
    where: fc.double({ min: -0.999, max: 0.999, noNaN: true }),
    bT: fc.double({ min: -5, max: 5, noNaN: true }),
  })
  .map(({ z0, zs, style, g, phase, where, bT }) => {
    const s = (1 + g) / (1 - g);
    // g_T = S^where lies strictly inside [1/S, S].
    const gT = Math.exp(where * Math.log(s));
    const problem: StubProblem = { load: loadOn(z0, g, phase), target: div(complex(z0), complex(gT, bT)), lineZ0: z0, stubZ0: zs, style };
    return problem;
  })
  .filter((p) => p.load.re > 0 && isFiniteComplex(p.load));

/** Residuals (solver's or ABCD re-check) ≥ 1e-9, accepted only under the rounding allowance. */
let overOneNano = 0;

/**
 * Residual allowed for a solution: 1e-9, or more where the problem is so ill-conditioned that rounding
 * positionWl and stubWl to doubles alone moves the input admittance further. Sensitivities of the
 * lossless network (Pozar 2005 §2.3, normalised): dy/dθ = j(1 + y²) along the line, and
 * db/d(βℓ) = y_s(1 + (b/y_s)²) for a stub; |Γ| ≈ |δy|/(2 g_T). δθ is taken as 2π·4·2^-53.
 */
function allowance(p: StubProblem, s: StubSolution): number {
  const count = p.style === 'balanced' ? 2 : 1;
  const y = div(complex(p.lineZ0), idealInputImpedance(p.load, p.lineZ0, s.positionWl));
  const onePlusY2 = abs(complex(1 + y.re * y.re - y.im * y.im, 2 * y.re * y.im));
  const ys = p.lineZ0 / p.stubZ0;
  const each = s.stubSusceptance / count / ys;
  const gT = div(complex(p.lineZ0), p.target).re;
  const dTheta = 2 * Math.PI * 4 * 2 ** -53;
  const bound = (dTheta * (onePlusY2 + count * ys * (1 + each * each))) / (2 * gT);
  return Math.max(1e-9, bound);
}

/** Every invariant of a returned solution set; returns the broken ones (plain checks: fast with many runs). */
function problemsOf(p: StubProblem, r: IdealSolution): string[] {
  const broken: string[] = [];
  const check = (ok: boolean, what: string) => {
    if (!ok) broken.push(what);
  };
  r.solutions.forEach((s, i) => {
    const at = `solution ${i} (${s.termination} d=${s.positionWl} l=${s.stubWl})`;
    check([s.positionWl, s.stubWl, s.stubSusceptance, s.residualGamma].every(Number.isFinite), `${at}: non-finite`);
    check(s.positionWl >= 0 && s.positionWl < 0.5, `${at}: position outside [0, 0.5)`);
    check(s.stubWl >= 0 && s.stubWl < 0.5, `${at}: stub length outside [0, 0.5)`);
    check(!Object.is(s.stubWl, -0) && !Object.is(s.positionWl, -0), `${at}: -0`);
    check(s.style === p.style, `${at}: style`);
    const byAbcd = mismatch(zinByAbcd(p, s), p.target);
    if (s.residualGamma >= 1e-9 || byAbcd >= 1e-9) {
      overOneNano += 1;
      const allowed = allowance(p, s);
      check(s.residualGamma < allowed, `${at}: residual ${s.residualGamma} ≥ ${allowed}`);
      check(byAbcd < allowed, `${at}: ABCD re-check ${byAbcd} ≥ ${allowed}`);
    }
  });
  for (let i = 1; i < r.solutions.length; i++) {
    const [a, b] = [r.solutions[i - 1]!, r.solutions[i]!];
    check(a.stubWl < b.stubWl || (a.stubWl === b.stubWl && a.positionWl <= b.positionWl), `rank ${i - 1} before ${i}`);
  }
  return broken;
}

function expectWellFormed(p: StubProblem, r: IdealSolution): void {
  expect(problemsOf(p, r)).toEqual([]);
}

describe('solveSingleStub properties (fast-check, seeded)', () => {
  it('reachable target: four solutions (2 positions × open/short), all matched, lengths in [0, ½)', () => {
    overOneNano = 0;
    fc.assert(
      fc.property(reachableProblem, (p) => {
        const r = solveSingleStub(p);
        expectWellFormed(p, r);
        // Count rule: 4 when the discriminant is clearly positive; within rounding of 0 the two roots are
        // merged (a double root) and 2 are returned. Margin from physics.md §5.2: Δ ∝ (S + 1/S) − (g_T + 1/g_T).
        const s = vswr(p);
        const gT = div(complex(p.lineZ0), p.target).re;
        const margin = (s + 1 / s - (gT + 1 / gT)) / (s + 1 / s);
        if (margin < 1e-10) {
          expect([2, 4]).toContain(r.solutions.length);
          return;
        }
        expect(r.solutions).toHaveLength(4);
        const positions = (b: 1 | 2) => r.solutions.filter((s) => s.branch === b).map((s) => s.positionWl);
        const [p1, p2] = [positions(1), positions(2)];
        expect(p1).toHaveLength(2);
        expect(p2).toHaveLength(2);
        expect(p1[0]).toBe(p1[1]);
        expect(p2[0]).toBe(p2[1]);
        expect(p1[0]!).toBeLessThan(p2[0]!); // branch 1 is the smaller distance
        for (const b of [1, 2] as const) {
          const terms = r.solutions.filter((s) => s.branch === b).map((s) => s.termination).sort();
          expect(terms).toEqual(['open', 'short']);
        }
      }),
      { seed: SEED, numRuns: 1500 },
    );
    // The allowance is a fallback for the extreme edge only: here every residual meets 1e-9 itself.
    expect(overOneNano).toBe(0);
  });

  it('extreme chart edge (VSWR 1e5 … 1e9): finite, in range, residual within the rounding allowance', () => {
    // Conditioning bound of allowance() above (sensitivities from Pozar 2005 §2.3).
    fc.assert(
      fc.property(
        lineZ0,
        stubZ0,
        style,
        fc.double({ min: 1 - 2e-5, max: 1 - 2e-9, noNaN: true }),
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
        fc.double({ min: -0.99, max: 0.99, noNaN: true }),
        (z0, zs, st, g, phase, where) => {
          const s = (1 + g) / (1 - g);
          const p: StubProblem = { load: loadOn(z0, g, phase), target: div(complex(z0), complex(Math.exp(where * Math.log(s)), 0.5)), lineZ0: z0, stubZ0: zs, style: st };
          fc.pre(p.load.re > 0);
          const r = solveSingleStub(p);
          expect(r.solutions).toHaveLength(4);
          expectWellFormed(p, r);
        },
      ),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('target on the line itself: the stub vanishes (open ≈ 0 or ≈ ½ wrapped, short ≈ ¼) and the position is recovered', () => {
    // b_stub = 0 → open 0, short λ/4 (physics.md §5.3 [C]); exercises near-zero and near-λ/2 stub wraps.
    fc.assert(
      fc.property(
        lineZ0,
        stubZ0,
        fc.double({ min: 1e-3, max: 0.99, noNaN: true }),
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
        fc.double({ min: 0.001, max: 0.499, noNaN: true }),
        (z0, zs, g, phase, d) => {
          const load = loadOn(z0, g, phase);
          const p: StubProblem = { load, target: idealInputImpedance(load, z0, d), lineZ0: z0, stubZ0: zs, style: 'single' };
          const r = solveSingleStub(p);
          expectWellFormed(p, r);
          const here = r.solutions.filter((s) => Math.abs(s.positionWl - d) < 1e-7);
          expect(here).toHaveLength(2);
          for (const s of here) {
            const expected = s.termination === 'open' ? 0 : 0.25;
            const dist = Math.abs(s.stubWl - expected);
            expect(Math.min(dist, 0.5 - dist)).toBeLessThan(1e-7);
          }
        },
      ),
      { seed: SEED, numRuns: 500 },
    );
  });

  it('unreachable targets give solve.no-passive-solution at "target", and only they do', () => {
    fc.assert(
      fc.property(
        lineZ0,
        fc.double({ min: 1e-4, max: 0.999, noNaN: true }),
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
        fc.double({ min: -8, max: 8, noNaN: true }),
        fc.double({ min: -5, max: 5, noNaN: true }),
        (z0, g, phase, logGT, bT) => {
          const s = (1 + g) / (1 - g);
          const gT = Math.exp(logGT);
          const margin = Math.abs(Math.abs(logGT) - Math.log(s));
          fc.pre(margin > 1e-8);
          const p: StubProblem = { load: loadOn(z0, g, phase), target: div(complex(z0), complex(gT, bT)), lineZ0: z0, stubZ0: z0, style: 'single' };
          const reachable = gT >= 1 / s && gT <= s;
          let error: TunestripError | undefined;
          try {
            expectWellFormed(p, solveSingleStub(p));
          } catch (e) {
            if (!(e instanceof TunestripError)) throw e;
            error = e;
          }
          expect(error === undefined).toBe(reachable);
          if (error) {
            expect(error.diagnostic.code).toBe('solve.no-passive-solution');
            expect(error.diagnostic.where).toBe('target');
          }
        },
      ),
      { seed: SEED, numRuns: 1000 },
    );
  });

  it('tangent case (discriminant exactly 0, g_T = S or 1/S): one position, two solutions', () => {
    // Defined behaviour: a double root is one position (branch 1) with its open and short stub.
    // Exact in floating point: real load R = Z0·2^k on a line Z0 = 2^m gives S = 2^|k| exactly;
    // the quarter-wave transformer makes g_T = S (or 1/S) at d = λ/4 (Pozar 2005 §2.5).
    fc.assert(
      fc.property(
        fc.integer({ min: -6, max: 6 }).filter((k) => k !== 0),
        fc.integer({ min: 3, max: 7 }),
        fc.double({ min: -3, max: 3, noNaN: true }),
        style,
        (k, m, bT, st) => {
          const z0 = 2 ** m;
          const load = complex(z0 * 2 ** k);
          const gT = 2 ** k; // normalised: y_L = 2^-k, its quarter-wave image 2^k = S or 1/S
          const p: StubProblem = { load, target: div(complex(z0), complex(gT, bT)), lineZ0: z0, stubZ0: z0, style: st };
          const r = solveSingleStub(p);
          expect(r.solutions).toHaveLength(2);
          expect(r.solutions.every((s) => s.branch === 1 && s.positionWl === 0.25)).toBe(true);
          expectWellFormed(p, r);
        },
      ),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('matched load and g_T = Y0: every position works; the solver returns d = 0 only', () => {
    // Defined behaviour (common practice, no source): the conductance is Y0 all along a matched line.
    fc.assert(
      fc.property(lineZ0, fc.double({ min: -5, max: 5, noNaN: true }), (z0, bT) => {
        const p: StubProblem = { load: complex(z0), target: div(complex(z0), complex(1, bT)), lineZ0: z0, stubZ0: z0, style: 'single' };
        const r = solveSingleStub(p);
        expect(r.solutions).toHaveLength(2);
        expect(r.solutions.every((s) => s.positionWl === 0)).toBe(true);
        expect(r.alreadyMatched).toBe(Math.abs(bT) < 2e-9);
        expectWellFormed(p, r);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('does not mutate its input', () => {
    fc.assert(
      fc.property(reachableProblem, (p) => {
        const copy = JSON.parse(JSON.stringify(p));
        solveSingleStub(Object.freeze({ ...p, load: Object.freeze({ ...p.load }), target: Object.freeze({ ...p.target }) }));
        expect(p).toEqual(copy);
      }),
      { seed: SEED, numRuns: 50 },
    );
  });
});
