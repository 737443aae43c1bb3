// Closed-form single shunt-stub matching of a load to a (complex) target impedance on a lossless line.
// Sources: Pozar, Microwave Engineering, 3rd ed. (2005), §5.2 (shunt stub, Y_T = Y0), generalised to a
// complex target Y_T = G_T + jB_T, a stub impedance Zs ≠ Z0 and balanced stubs as in physics.md §5.2–5.4
// ([C] derivation; balanced legs after Orfanidis, Electromagnetic Waves and Antennas, [R]).
import { abs, add, complex, conj, div, inv, scale, sub, type Complex } from '../math/complex.js';
import { idealInputImpedance, idealOpenStubAdmittance, idealShortStubAdmittance } from '../math/lines.js';
import { fail } from '../diagnostics.js';
import { trimmed } from '../format.js';
import type { IdealSolution, StubSolution, StubStyle, Termination } from '../seams.js';

export interface StubProblem {
  /** Load impedance (Ω). */
  readonly load: Complex;
  /** Impedance the network must present at the stub junction (Ω). */
  readonly target: Complex;
  /** Characteristic impedance of the series line (Ω). */
  readonly lineZ0: number;
  /** Characteristic impedance of the stub line (Ω). */
  readonly stubZ0: number;
  readonly style: StubStyle;
}

/**
 * |Γ| below which two impedances count as equal; returned residuals meet it except where rounding d and ℓ
 * to doubles alone moves the input admittance further (loads with VSWR beyond about 1e5).
 */
export const MATCH_TOLERANCE = 1e-9;

/** Relative conductance error accepted when two nearly equal roots are merged into the tangent point. */
const TANGENT_SLACK = 1e-12;

const TWO_PI = 2 * Math.PI;

/** A number inside a message: 4 decimals, or E-notation where fixed notation cannot show it (|v| ≥ 1e15, tiny, non-finite). */
const shownNumber = (v: number): string =>
  Number.isFinite(v) && (v === 0 || (Math.abs(v) < 1e15 && Math.abs(v) >= 1e-4)) ? trimmed(v, 4) : v.toExponential(3);

/** |(Zin − Zt)/(Zin + Zt*)|: the mismatch of zin against the target, as defined for residualGamma. */
export function mismatchGamma(zin: Complex, target: Complex): number {
  return abs(div(sub(zin, target), add(zin, conj(target))));
}

/** Wraps a phase into [0, period) and turns −0 and rounding up to the period into 0. */
function wrap(value: number, period: number): number {
  let w = value % period;
  if (w < 0) w += period;
  if (w >= period) w -= period;
  return w + 0;
}

/**
 * Normalised admittance after a lossless line of electrical angle θ = βd (Pozar 2005, eq. 2.44 in
 * admittance form): y(d) = (y_L cos θ + j sin θ)/(cos θ + j y_L sin θ). Same as physics.md §5.2's
 * (y_L + jt)/(1 + j y_L t) with t = tan θ, but finite at θ = π/2.
 */
function admittanceAlongLine(yLoad: Complex, theta: number): Complex {
  const c = Math.cos(theta);
  const s = Math.sin(theta);
  const num = complex(yLoad.re * c, yLoad.im * c + s);
  const den = complex(c - yLoad.im * s, yLoad.re * s);
  return div(num, den);
}

/**
 * Stub positions βd ∈ [0, π) where Re y(d) = g_T (physics.md §5.2 [C]).
 * The quadratic a t² + b t + c = 0 with a = g_T|y_L|² − g_L, b = −2 g_T b_L, c = g_T − g_L and
 * t = tan θ is multiplied by cos²θ and written with ψ = 2θ as
 *   P + Q cos ψ + R sin ψ = 0,  P = (a + c)/2, Q = (c − a)/2, R = b/2,
 * so the t → ∞ root (a = 0, d = λ/4) needs no special case. With ρ = √(Q² + R²) and α = atan2(R, Q):
 * ψ = α ± acos(−P/ρ). The quarter discriminant b²/4 − ac = ρ² − P² expands to
 *   Δ = g_L·[ g_T(1 + |y_L|²) − g_L(1 + g_T²) ]  ( = g_T g_L² [ (S + 1/S) − (g_T + 1/g_T) ] ),
 * and ψ = α ± atan2(√Δ, −P), with Δ taken from whichever of its two forms rounds least: near the
 * chart edge the two circles almost touch and 1 − (P/ρ)² would lose all but a few digits.
 * Returns null when Δ < 0 (beyond rounding). Returns one angle when |Δ| is within the merge tolerance
 * (a double root: merging shifts Re y(d) by at most TANGENT_SLACK relative, since
 * Re y(d) − g_T = (ρ − |P|)·g_T/g_L at the merged point and ρ − |P| = Δ/(ρ + |P|)), and when every
 * position works (ρ = 0: a matched load with g_T = 1), where d = 0 is returned.
 */
function stubAngles(yLoad: Complex, gT: number): readonly number[] | null {
  const gL = yLoad.re;
  const bL = yLoad.im;
  const yy = gL * gL + bL * bL;
  const a = gT * yy - gL;
  const b = -2 * gT * bL;
  const c = gT - gL;
  const p = (a + c) / 2;
  const q = (c - a) / 2;
  const r = b / 2;
  const rho = Math.hypot(q, r);
  // Two algebraically equal forms of Δ; each is accurate where the other cancels (the factored one
  // near the chart edge, b²/4 − ac near its centre). Use the one with the smaller rounding bound.
  const factored = gL * (gT * (1 + yy) - gL * (1 + gT * gT));
  const factoredNoise = 4 * Number.EPSILON * gL * (gT * (1 + yy) + gL * (1 + gT * gT));
  const direct = r * r - a * c;
  const directNoise = 4 * Number.EPSILON * (r * r + Math.abs(c) * (gT * yy + gL) + Math.abs(a) * (gT + gL));
  const [discriminant, roundingNoise] = factoredNoise <= directNoise ? [factored, factoredNoise] : [direct, directNoise];
  const tolerance = TANGENT_SLACK * gL * (rho + Math.abs(p)) + 4 * roundingNoise;
  if (discriminant < -tolerance) return null;
  // ρ at rounding level: Re y(d) = g_T all along the line (matched load, g_T = 1), so d = 0 serves.
  if (rho <= 4 * Number.EPSILON * (gT * (1 + yy) + gL)) return [0];
  const alpha = Math.atan2(r, q);
  if (discriminant <= tolerance) return [wrap((alpha + (p > 0 ? Math.PI : 0)) / 2, Math.PI)];
  const spread = Math.atan2(Math.sqrt(discriminant), -p);
  const first = wrap((alpha - spread) / 2, Math.PI);
  const second = wrap((alpha + spread) / 2, Math.PI);
  if (first === second) return [first];
  return first < second ? [first, second] : [second, first];
}

/**
 * Open-stub length for a normalised susceptance b on a stub of normalised admittance y_s:
 * b = y_s tan(βℓ) (physics.md §5.3 [C]; Pozar 2005 §5.2 for y_s = 1), ℓ in wavelengths in [0, ½).
 */
export function openStubWl(b: number, ys: number): number {
  return wrap(Math.atan2(b, ys) / TWO_PI, 0.5);
}

/**
 * Short-stub length for b = −y_s cot(βℓ) (physics.md §5.3 [C]), in wavelengths in [0, ½);
 * b = 0 gives λ/4. atan2(y_s, −b) lies in (0, π) for y_s > 0, so no division by b occurs.
 */
export function shortStubWl(b: number, ys: number): number {
  return wrap(Math.atan2(ys, -b) / TWO_PI, 0.5);
}

function checkImpedance(z: Complex, field: 'load' | 'target'): void {
  const what = field === 'load' ? 'load impedance' : 'target impedance';
  if (!Number.isFinite(z.re) || !Number.isFinite(z.im)) {
    fail('solve.no-passive-solution', field, `the ${what} must be finite`);
  }
  if (z.re === 0) {
    fail(
      'solve.no-passive-solution',
      field,
      field === 'load'
        ? 'the load is purely reactive (resistance 0 Ω): it absorbs no power, so no lossless stub network can match it'
        : 'the target is purely reactive (resistance 0 Ω): no passive network presents it from a load that absorbs power',
    );
  }
  if (z.re < 0) {
    fail(
      'solve.no-passive-solution',
      field,
      `the ${what} has negative resistance (${shownNumber(z.re)} Ω, an active ${field === 'load' ? 'load' : 'port'}): a passive stub network only matches resistance > 0`,
    );
  }
}

function checkLineImpedance(z0: number, field: 'lineZ0' | 'stubZ0'): void {
  if (!Number.isFinite(z0) || z0 <= 0) {
    const what = field === 'lineZ0' ? 'series line' : 'stub line';
    fail('solve.no-passive-solution', field, `the ${what} characteristic impedance must be a finite number > 0 Ω`);
  }
}

/**
 * Loads (and targets) beyond this VSWR on the series line are refused: there the resistance is so small against
 * its reactance (or so far from Z0) that rounding decides the answer. The solver is checked to VSWR 1e9
 * (test/property/solve.test.ts); 1e12 leaves room above that and stays far below where Γ rounds to 1.
 */
export const MAX_LOAD_VSWR = 1e12;

/** VSWR of a load on a line of real z0; Infinity at the chart edge. */
function vswrOf(load: Complex, z0: number): number {
  const g = abs(div(sub(load, complex(z0)), add(load, complex(z0))));
  return g >= 1 ? Infinity : (1 + g) / (1 - g);
}

function unreachable(problem: StubProblem, gT: number): never {
  const s = vswrOf(problem.load, problem.lineZ0);
  const y0mS = 1e3 / problem.lineZ0;
  const range =
    s === Infinity ? '' : ` from ${shownNumber(y0mS / s)} mS to ${shownNumber(y0mS * s)} mS (1/S to S times 1/Z0, VSWR S = ${shownNumber(s)})`;
  return fail(
    'solve.no-passive-solution',
    'target',
    `the target conductance Re(1/Zt) = ${shownNumber(gT * y0mS)} mS is unreachable with a single shunt stub on a ` +
      `${shownNumber(problem.lineZ0)} Ω line: along that line the load only presents conductances${range}; ` +
      'a series line of another impedance, or a second stub, is needed',
  );
}

/** Re-substitutes a solution into the ideal lossless network and returns |Γ| against the target. */
function residualOf(problem: StubProblem, positionWl: number, stubWl: number, termination: Termination): number {
  const stubCount = problem.style === 'balanced' ? 2 : 1;
  const lineY = inv(idealInputImpedance(problem.load, problem.lineZ0, positionWl));
  const oneStubY =
    termination === 'open'
      ? idealOpenStubAdmittance(problem.stubZ0, stubWl)
      : idealShortStubAdmittance(problem.stubZ0, stubWl);
  const zin = inv(add(lineY, scale(oneStubY, stubCount)));
  return mismatchGamma(zin, problem.target);
}

function byRank(x: StubSolution, y: StubSolution): number {
  return (
    x.stubWl - y.stubWl ||
    x.positionWl - y.positionWl ||
    (x.termination === y.termination ? 0 : x.termination === 'open' ? -1 : 1) ||
    x.branch - y.branch
  );
}

/**
 * Every single shunt-stub solution that makes the input admittance at the stub equal 1/target:
 * each stub position d ∈ [0, λ/2) (branch 1 = the smaller d, branch 2 = the larger; a single
 * position is branch 1), and for each both the open- and the short-circuited stub length in [0, λ/2)
 * of the stub line's wavelength (per stub for the balanced style, each supplying half the susceptance).
 * Ranked shortest stub first, then shorter series line, then open before short, then branch.
 * Throws TunestripError `solve.no-passive-solution` when no passive single-stub match exists.
 */
export function solveSingleStub(problem: StubProblem): IdealSolution {
  const { load, target, lineZ0, stubZ0, style } = problem;
  checkLineImpedance(lineZ0, 'lineZ0');
  checkLineImpedance(stubZ0, 'stubZ0');
  // Far outside any etchable pair of lines the stub's tangent rounds to 0 or ∞ and the residual to NaN.
  if (!(stubZ0 / lineZ0 <= 1e6 && lineZ0 / stubZ0 <= 1e6)) {
    fail('solve.no-passive-solution', 'stubZ0', `the stub impedance ${shownNumber(stubZ0)} Ω is over a million times larger or smaller than the line impedance ${shownNumber(lineZ0)} Ω; no stub of such lines can be computed`);
  }
  checkImpedance(load, 'load');
  checkImpedance(target, 'target');
  for (const [field, z] of [['load', load], ['target', target]] as const) {
    const vswr = vswrOf(z, lineZ0);
    if (!(vswr <= MAX_LOAD_VSWR)) {
      fail(
        'solve.no-passive-solution',
        field,
        `the ${field} is at the edge of the Smith chart on the ${shownNumber(lineZ0)} Ω line (VSWR ${Number.isFinite(vswr) ? vswr.toExponential(1) : 'beyond 1e16'}, over 1e12): ` +
          `its resistance is lost to rounding against its reactance or Z0, so no match can be computed; check the ${field} value`,
      );
    }
  }

  const yLoad = div(complex(lineZ0), load);
  const yTarget = div(complex(lineZ0), target);
  const angles = stubAngles(yLoad, yTarget.re);
  if (angles === null) return unreachable(problem, yTarget.re);

  const ys = lineZ0 / stubZ0;
  const stubCount = style === 'balanced' ? 2 : 1;
  const solutions: StubSolution[] = [];
  angles.forEach((theta, index) => {
    const branch: 1 | 2 = index === 0 ? 1 : 2;
    const positionWl = wrap(theta / TWO_PI, 0.5);
    const stubSusceptance = yTarget.im - admittanceAlongLine(yLoad, theta).im;
    const perStub = stubSusceptance / stubCount;
    for (const termination of ['open', 'short'] as const) {
      const stubWl = termination === 'open' ? openStubWl(perStub, ys) : shortStubWl(perStub, ys);
      solutions.push({
        positionWl,
        stubWl,
        termination,
        style,
        branch,
        stubSusceptance,
        residualGamma: residualOf(problem, positionWl, stubWl, termination),
      });
    }
  });
  solutions.sort(byRank);
  return { alreadyMatched: mismatchGamma(load, target) < MATCH_TOLERANCE, solutions };
}
