// Width synthesis: the width whose dispersive Z0 (Jansen–Kirschning 1983 on Hammerstad–Jensen 1980,
// thickness included) at the given frequency equals the target. Start from Wheeler 1977, then a
// safeguarded Newton iteration on ln u (numerical derivative) kept inside a bracket, with bisection
// whenever a Newton step would leave it (physics.md §1.3).
import type { LineProperties, Substrate } from '../../seams.js';
import { fail } from '../../diagnostics.js';
import { analyseMicrostrip } from './analyse.js';
import { wheelerSynthesisU } from './wheeler1977.js';

/** Search limits on u = w/h; far beyond every model's validity range, so only absurd targets fail. */
const U_MIN = 1e-4;
const U_MAX = 1e4;
const REL_TOL = 1e-12;
const MAX_ITER = 200;

export function synthesizeMicrostrip(z0: number, substrate: Substrate, frequency: number): LineProperties {
  if (!(Number.isFinite(z0) && z0 > 0)) fail('spec.invalid', 'microstrip.z0', `impedance must be positive, got ${z0}`);
  const h = substrate.height;
  // g(x) = ln Z0(u = e^x) − ln z0 decreases with x: Z0 falls as the strip widens.
  const g = (x: number): number => Math.log(analyseMicrostrip(Math.exp(x) * h, substrate, frequency).z0 / z0);

  const start = wheelerSynthesisU(z0, substrate.er);
  let x = Math.log(Number.isFinite(start) && start > 0 ? Math.min(Math.max(start, U_MIN), U_MAX) : 1);
  let gx = g(x);

  // Bracket [lo, hi] with g(lo) > 0 > g(hi), widening from the start value.
  let lo = x;
  let hi = x;
  let glo = gx;
  let ghi = gx;
  let step = 0.05;
  while (glo <= 0 && lo > Math.log(U_MIN)) {
    lo = Math.max(lo - step, Math.log(U_MIN));
    glo = g(lo);
    step *= 2;
  }
  step = 0.05;
  while (ghi >= 0 && hi < Math.log(U_MAX)) {
    hi = Math.min(hi + step, Math.log(U_MAX));
    ghi = g(hi);
    step *= 2;
  }
  if (glo < 0 || ghi > 0) {
    fail('spec.invalid', 'microstrip.z0', `no width in w/h ${U_MIN}–${U_MAX} gives ${z0} Ω on this substrate`);
  }

  for (let i = 0; i < MAX_ITER && Math.abs(gx) > REL_TOL; i++) {
    if (gx > 0) lo = x;
    else hi = x;
    const dx = 1e-6;
    const slope = (g(x + dx) - g(x - dx)) / (2 * dx);
    let next = x - gx / slope;
    if (!Number.isFinite(next) || next <= lo || next >= hi) next = (lo + hi) / 2;
    x = next;
    gx = g(x);
    if (hi - lo < 1e-15) break;
  }
  return analyseMicrostrip(Math.exp(x) * h, substrate, frequency);
}
