// Reference checks of the closed-form single shunt-stub solver against published worked examples and
// the computed check values of physics.md §5.7. Each check names its source.
import { describe, expect, it } from 'vitest';
import { complex, type Complex } from '../../src/math/complex.js';
import { openStubWl, shortStubWl, solveSingleStub, type StubProblem } from '../../src/solve/index.js';
import { TunestripError } from '../../src/diagnostics.js';
import type { StubSolution, StubStyle, Termination } from '../../src/seams.js';

const problem = (load: Complex, target: Complex, lineZ0 = 50, stubZ0 = lineZ0, style: StubStyle = 'single'): StubProblem => ({
  load,
  target,
  lineZ0,
  stubZ0,
  style,
});

function pick(solutions: readonly StubSolution[], positionWl: number, termination: Termination, tol: number): StubSolution {
  const found = solutions.filter((s) => s.termination === termination && Math.abs(s.positionWl - positionWl) < tol);
  expect(found, `one ${termination} solution at d ≈ ${positionWl}λ`).toHaveLength(1);
  return found[0]!;
}

function expectAllMatched(solutions: readonly StubSolution[]): void {
  for (const s of solutions) expect(s.residualGamma).toBeLessThan(1e-9);
}

function failureOf(p: StubProblem): TunestripError {
  try {
    solveSingleStub(p);
  } catch (e) {
    if (e instanceof TunestripError) return e;
    throw e;
  }
  throw new Error('expected solve.no-passive-solution');
}

describe('Pozar, Microwave Engineering, 3rd ed. (2005), Example 5.2: ZL = 60 − j80 Ω on 50 Ω, short stubs', () => {
  const result = solveSingleStub(problem(complex(60, -80), complex(50)));

  it('matches the textbook answers to their printed three decimals', () => {
    // Pozar (2005) Example 5.2, textbook values from memory (physics.md §5.7 [M]): d1 = 0.110λ, ℓ1 = 0.095λ;
    // d2 = 0.260λ, ℓ2 = 0.405λ. Tolerance: half a unit in the last printed digit plus rounding slack.
    const s1 = pick(result.solutions, 0.11, 'short', 0.002);
    expect(s1.stubWl).toBeCloseTo(0.095, 2);
    expect(Math.abs(s1.stubWl - 0.095)).toBeLessThan(0.001);
    const s2 = pick(result.solutions, 0.26, 'short', 0.002);
    expect(Math.abs(s2.stubWl - 0.405)).toBeLessThan(0.001);
  });

  it('matches the computed table to five decimals, open and short, with t and y(d)', () => {
    // physics.md §5.7 table [C] (Pozar 2005 Ex. 5.2 reproduced by an independent implementation).
    expect(result.alreadyMatched).toBe(false);
    expect(result.solutions).toHaveLength(4);
    const b1 = result.solutions.filter((s) => s.branch === 1);
    const b2 = result.solutions.filter((s) => s.branch === 2);
    for (const s of b1) {
      expect(s.positionWl).toBeCloseTo(0.11042, 5);
      expect(Math.tan(2 * Math.PI * s.positionWl)).toBeCloseTo(0.83176, 5); // t, physics.md §5.7 [C]
      expect(s.stubSusceptance).toBeCloseTo(-1.47196, 5); // y(d) = 1 + j1.47196 → stub −j1.47196
    }
    for (const s of b2) {
      expect(s.positionWl).toBeCloseTo(0.25944, 5);
      expect(Math.tan(2 * Math.PI * s.positionWl)).toBeCloseTo(-16.83176, 4); // t, physics.md §5.7 [C]
      expect(s.stubSusceptance).toBeCloseTo(1.47196, 5);
    }
    expect(pick(b1, 0.11042, 'short', 1e-5).stubWl).toBeCloseTo(0.09497, 5);
    expect(pick(b1, 0.11042, 'open', 1e-5).stubWl).toBeCloseTo(0.34497, 5);
    expect(pick(b2, 0.25944, 'short', 1e-5).stubWl).toBeCloseTo(0.40503, 5);
    expect(pick(b2, 0.25944, 'open', 1e-5).stubWl).toBeCloseTo(0.15503, 5);
    expectAllMatched(result.solutions);
  });

  it('ranks shortest stub first, then the shorter line', () => {
    // Ranking rule of the IdealSolution seam (src/seams.ts); lengths from physics.md §5.7 [C].
    expect(result.solutions.map((s) => [s.termination, Number(s.stubWl.toFixed(5))])).toEqual([
      ['short', 0.09497],
      ['open', 0.15503],
      ['open', 0.34497],
      ['short', 0.40503],
    ]);
  });

  it('balanced stubs: each leg tan βℓ_bal = ½ tan βℓ_single', () => {
    // Orfanidis, Electromagnetic Waves and Antennas, balanced single-stub legs [R]; values physics.md §5.7 [C].
    const bal = solveSingleStub(problem(complex(60, -80), complex(50), 50, 50, 'balanced'));
    expect(bal.solutions).toHaveLength(4);
    expect(pick(bal.solutions, 0.11042, 'short', 1e-5).stubWl).toBeCloseTo(0.14902, 5);
    expect(pick(bal.solutions, 0.11042, 'open', 1e-5).stubWl).toBeCloseTo(0.39902, 5);
    expect(pick(bal.solutions, 0.25944, 'short', 1e-5).stubWl).toBeCloseTo(0.35098, 5);
    expect(pick(bal.solutions, 0.25944, 'open', 1e-5).stubWl).toBeCloseTo(0.10098, 5);
    for (const s of bal.solutions) {
      expect(s.style).toBe('balanced');
      const single = result.solutions.find((x) => x.branch === s.branch && x.termination === s.termination)!;
      // Orfanidis' relation [R]: open tan(βℓ_bal) = ½ tan(βℓ_single); short cot(βℓ_bal) = ½ cot(βℓ_single).
      const f = s.termination === 'open' ? Math.tan : (x: number) => 1 / Math.tan(x);
      expect(f(2 * Math.PI * s.stubWl)).toBeCloseTo(0.5 * f(2 * Math.PI * single.stubWl), 9);
      expect(s.stubSusceptance).toBeCloseTo(single.stubSusceptance, 12);
    }
    expectAllMatched(bal.solutions);
  });
});

describe('physics.md §5.7 computed check values [C]', () => {
  it('same load with a Zs = 100 Ω stub (y_s = 0.5)', () => {
    // physics.md §5.7 [C], from Pozar (2005) Ex. 5.2 with the stub impedance changed.
    const r = solveSingleStub(problem(complex(60, -80), complex(50), 50, 100));
    expect(pick(r.solutions, 0.11042, 'open', 1e-5).stubWl).toBeCloseTo(0.30212, 5);
    expect(pick(r.solutions, 0.11042, 'short', 1e-5).stubWl).toBeCloseTo(0.05212, 5);
    expect(pick(r.solutions, 0.25944, 'open', 1e-5).stubWl).toBeCloseTo(0.19788, 5);
    expect(pick(r.solutions, 0.25944, 'short', 1e-5).stubWl).toBeCloseTo(0.44788, 5);
    expectAllMatched(r.solutions);
  });

  it('complex target 25 + j15 Ω', () => {
    // physics.md §5.7 "Complex target" [C].
    const r = solveSingleStub(problem(complex(60, -80), complex(25, 15)));
    expect(r.solutions).toHaveLength(4);
    const a = pick(r.solutions, 0.1296, 'open', 1e-5);
    expect(a.stubSusceptance).toBeCloseTo(-2.60422, 5);
    expect(a.stubWl).toBeCloseTo(0.30835, 5);
    expect(pick(r.solutions, 0.1296, 'short', 1e-5).stubWl).toBeCloseTo(0.05835, 5);
    const b = pick(r.solutions, 0.24027, 'open', 1e-5);
    expect(b.stubSusceptance).toBeCloseTo(0.83951, 5);
    expect(b.stubWl).toBeCloseTo(0.11115, 5);
    expect(pick(r.solutions, 0.24027, 'short', 1e-5).stubWl).toBeCloseTo(0.36115, 5);
    expectAllMatched(r.solutions);
  });

  it('RL = Z0: the t → ∞ root at d = λ/4 is found', () => {
    // physics.md §5.1/§5.7 [C]: ZL = 50 + j50 on 50 Ω; Pozar's (2005) t formula lists only the finite root.
    const r = solveSingleStub(problem(complex(50, 50), complex(50)));
    expect(r.solutions).toHaveLength(4);
    const q = r.solutions.filter((s) => s.branch === 1);
    for (const s of q) {
      expect(s.positionWl).toBeCloseTo(0.25, 12);
      expect(s.stubSusceptance).toBeCloseTo(-1, 9);
    }
    const other = pick(r.solutions, 0.42621, 'open', 1e-5);
    expect(other.stubSusceptance).toBeCloseTo(1, 9);
    expect(other.stubWl).toBeCloseTo(0.125, 9);
    expect(pick(r.solutions, 0.42621, 'short', 1e-5).stubWl).toBeCloseTo(0.375, 9);
    expectAllMatched(r.solutions);
  });

  it('ZL = 20 − j10 Ω on 50 Ω', () => {
    // physics.md §5.7 degenerate and special cases [C].
    const r = solveSingleStub(problem(complex(20, -10), complex(50)));
    expect(pick(r.solutions, 0.125, 'short', 1e-5).stubWl).toBeCloseTo(0.375, 5);
    expect(pick(r.solutions, 0.125, 'open', 1e-5).stubWl).toBeCloseTo(0.125, 5);
    expect(pick(r.solutions, 0.44879, 'short', 1e-5).stubWl).toBeCloseTo(0.125, 5);
    expect(pick(r.solutions, 0.44879, 'open', 1e-5).stubWl).toBeCloseTo(0.375, 5);
    expectAllMatched(r.solutions);
  });

  it('ZL = 100 + j80 Ω on 75 Ω (Pozar 2005 problem 5.4 type)', () => {
    // physics.md §5.7 [C]; the pairing 0.2276λ/0.1224λ found on the web is wrong (§5.7 caution [R]).
    const r = solveSingleStub(problem(complex(100, 80), complex(75), 75));
    expect(pick(r.solutions, 0.22764, 'short', 1e-5).stubWl).toBeCloseTo(0.1276, 5);
    expect(pick(r.solutions, 0.22764, 'open', 1e-5).stubWl).toBeCloseTo(0.3776, 5);
    expect(pick(r.solutions, 0.40591, 'short', 1e-5).stubWl).toBeCloseTo(0.3724, 5);
    expect(pick(r.solutions, 0.40591, 'open', 1e-5).stubWl).toBeCloseTo(0.1224, 5);
    expectAllMatched(r.solutions);
  });

  it('purely reactive load: no solution, the reason names the load', () => {
    // physics.md §5.7 [C]: purely reactive ZL has no solution.
    const e = failureOf(problem(complex(0, -80), complex(50)));
    expect(e.diagnostic.code).toBe('solve.no-passive-solution');
    expect(e.diagnostic.severity).toBe('error');
    expect(e.diagnostic.where).toBe('load');
    expect(e.diagnostic.message).toMatch(/purely reactive/);
  });
});

describe('impossible requests are errors with a reason (common practice, no source)', () => {
  it.each([
    [problem(complex(-10, 5), complex(50)), 'load', /negative resistance/],
    [problem(complex(30, 5), complex(0, 20)), 'target', /purely reactive/],
    [problem(complex(30, 5), complex(-5, 20)), 'target', /negative resistance/],
    [problem(complex(30, 5), complex(50), 0), 'lineZ0', /> 0/],
    [problem(complex(30, 5), complex(50), 50, -1), 'stubZ0', /> 0/],
    [problem(complex(Number.NaN, 5), complex(50)), 'load', /finite/],
  ])('%# → %s', (p, where, reason) => {
    const e = failureOf(p);
    expect(e.diagnostic.code).toBe('solve.no-passive-solution');
    expect(e.diagnostic.where).toBe(where);
    expect(e.diagnostic.message).toMatch(reason);
  });

  it('unreachable target conductance names the line and the reachable range', () => {
    // physics.md §5.2 [C]: real roots only for 1/S ≤ g_T ≤ S. ZL = 60 − j80 on 50 Ω has S = 3.911
    // (|Γ| = 0.5963 for this load, Pozar 2005 Ex. 5.2 data), so 20 mS·[1/S, S] = 5.114 … 78.22 mS; 10 Ω asks 100 mS.
    const e = failureOf(problem(complex(60, -80), complex(10)));
    expect(e.diagnostic.where).toBe('target');
    expect(e.diagnostic.message).toMatch(/unreachable with a single shunt stub on a 50 Ω line/);
    expect(e.diagnostic.message).toMatch(/100 mS/);
    expect(e.diagnostic.message).toMatch(/5\.11\d+ mS to 78\.2\d+ mS/);
  });
});

describe('already matched (common practice, no source)', () => {
  it('load equal to the target: alreadyMatched, trivial solutions still returned', () => {
    const r = solveSingleStub(problem(complex(50), complex(50)));
    expect(r.alreadyMatched).toBe(true);
    expect(r.solutions.map((s) => [s.positionWl, s.termination, s.stubWl])).toEqual([
      [0, 'open', 0],
      [0, 'short', 0.25],
    ]);
    expectAllMatched(r.solutions);
  });

  it('complex load equal to a complex target keeps d = 0 with a zero-length open stub', () => {
    const r = solveSingleStub(problem(complex(30, 40), complex(30, 40)));
    expect(r.alreadyMatched).toBe(true);
    expect(r.solutions[0]).toMatchObject({ positionWl: 0, termination: 'open', stubWl: 0 });
    expect(r.solutions.some((s) => s.positionWl === 0 && s.termination === 'short' && s.stubWl === 0.25)).toBe(true);
    expectAllMatched(r.solutions);
  });
});

describe('stub-length wraps into [0, λ/2) (physics.md §5.3 [C]: b = y_s tan βℓ open, b = −y_s cot βℓ short)', () => {
  it('b = 0: open 0, short λ/4; −0 never leaks out', () => {
    expect(Object.is(openStubWl(0, 1), 0)).toBe(true);
    expect(Object.is(openStubWl(-0, 1), 0)).toBe(true);
    expect(shortStubWl(0, 1)).toBe(0.25);
    expect(shortStubWl(-0, 0.3)).toBe(0.25);
  });

  it('a tiny negative susceptance wraps an open stub from just below λ/2 exactly to 0', () => {
    // atan(−1e-300)/2π + ½ rounds to ½ in doubles: it must come out as 0, not 0.5.
    expect(openStubWl(-1e-300, 1)).toBe(0);
    expect(openStubWl(-1e-12, 1)).toBeCloseTo(0.5 - 1e-12 / (2 * Math.PI), 15);
    expect(openStubWl(-1e-12, 1)).toBeLessThan(0.5);
  });

  it('a huge susceptance: open → λ/4, short → 0 (wrapped from just below λ/2 when b > 0)', () => {
    expect(openStubWl(1e300, 1)).toBe(0.25);
    expect(openStubWl(-1e300, 1)).toBe(0.25);
    expect(shortStubWl(1e300, 1)).toBe(0);
    expect(shortStubWl(-1e300, 1)).toBeCloseTo(0, 15);
    expect(shortStubWl(1e12, 1)).toBeLessThan(0.5);
  });

  it('agrees with the tan/cot forms of physics.md §5.3 for ordinary values', () => {
    for (const [b, ys] of [[1.47196, 1], [-1.47196, 0.5], [0.3, 2], [-7, 0.8]] as const) {
      expect(ys * Math.tan(2 * Math.PI * openStubWl(b, ys))).toBeCloseTo(b, 10);
      expect(-ys / Math.tan(2 * Math.PI * shortStubWl(b, ys))).toBeCloseTo(b, 10);
    }
  });
});
