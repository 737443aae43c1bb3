// Touchstone 1-port file of the predicted S11 (physical and ideal networks).
// Format: Touchstone File Format Specification, version 2.0 (IBIS Open Forum, 2009), which also
// defines the version 1.x syntax used here: "!" comments, option line "# <unit> S <format> R <n>",
// then one "frequency real imaginary" data line per frequency.
import { complex, div, sub, add, type Complex } from '../math/complex.js';
import type { Artifact, ResponseSet, Spec } from '../seams.js';
import { fixed } from '../format.js';
import { mismatch } from '../analysis/physicalNetwork.js';

/**
 * Touchstone references are real. With a real target the file holds S11 against it; with a
 * complex target it holds S11 against 50 Ω, converted from the power-wave reflection.
 */
export function touchstoneReference(spec: Spec): number {
  return spec.target.im === 0 ? spec.target.re : 50;
}

function againstReference(gamma: Complex, target: Complex, reference: number): Complex {
  if (target.im === 0 && target.re === reference) return gamma;
  // Recover Zin from the power-wave Γ = (Z − Zt)/(Z + Zt*), then reflect against the real reference.
  const zt = target;
  const ztc = complex(zt.re, -zt.im);
  const zin = div(add(zt, mulC(gamma, ztc)), sub(complex(1, 0), gamma));
  return mismatch(zin, complex(reference, 0));
}

const mulC = (a: Complex, b: Complex): Complex => complex(a.re * b.re - a.im * b.im, a.re * b.im + a.im * b.re);

export function writeTouchstone(spec: Spec, response: ResponseSet, which: 'physical' | 'ideal'): Artifact {
  const reference = touchstoneReference(spec);
  const data = which === 'physical' ? response.physical : response.ideal;
  const lines = [
    `! tunestrip predicted S11 of the ${which} network, design "${spec.name}"`,
    `! load held at ${fixed(spec.load.re, 4)}${spec.load.im < 0 ? '-' : '+'}j${fixed(Math.abs(spec.load.im), 4)} ohm over the band`,
    '! prediction from closed-form models; verify by EM simulation or measurement',
    `# GHZ S RI R ${fixed(reference, 6).replace(/\.?0+$/, '')}`,
    ...response.frequencies.map((f, i) => {
      const g = againstReference(data[i]!, spec.target, reference);
      return `${fixed(f / 1e9, 9)} ${fixed(g.re, 12)} ${fixed(g.im, 12)}`;
    }),
  ];
  return { path: which === 'physical' ? 'response.s1p' : 'response-ideal.s1p', mediaType: 'text/plain', text: `${lines.join('\n')}\n` };
}
