// Reflection against a real reference impedance, for files whose format allows only real
// references (Touchstone). The match itself is judged by the power-wave reflection against the
// target, Γ = (Z − Zt)/(Z + Zt*); this recovers Z from that Γ and reflects it against the reference.
import { complex, div, mul, sub, add, type Complex } from '../math/complex.js';
import type { Spec } from '../seams.js';
import { mismatch } from './physicalNetwork.js';

/** The real reference a file can state: the target when it is real, 50 Ω otherwise. */
export function realReference(target: Complex): number {
  return target.im === 0 ? target.re : 50;
}

/** S11 against `reference` from the power-wave reflection against `target`. */
export function reflectionAgainst(gamma: Complex, target: Complex, reference: number): Complex {
  if (target.im === 0 && target.re === reference) return gamma;
  const zin = div(add(target, mul(gamma, complex(target.re, -target.im))), sub(complex(1, 0), gamma));
  return mismatch(zin, complex(reference, 0));
}

/** Every point of a response against the spec's real reference. */
export const responseAgainstReference = (spec: Spec, gammas: readonly Complex[]): Complex[] =>
  gammas.map((g) => reflectionAgainst(g, spec.target, realReference(spec.target)));
