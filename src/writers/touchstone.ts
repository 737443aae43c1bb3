// Touchstone 1-port file of the predicted S11 (physical and ideal networks).
// Format: Touchstone File Format Specification, version 2.0 (IBIS Open Forum, 2009), which also
// defines the version 1.x syntax used here: "!" comments, option line "# <unit> S <format> R <n>",
// then one "frequency real imaginary" data line per frequency.
// Touchstone references are real: with a real target the file holds S11 against it, with a complex
// target S11 against 50 Ω (the conversion lives in src/analysis/reference.ts).
import type { Artifact, ResponseSet, Spec } from '../seams.js';
import { fixed, trimmed } from '../format.js';
import { realReference, responseAgainstReference } from '../analysis/reference.js';

export function writeTouchstone(spec: Spec, response: ResponseSet, which: 'physical' | 'ideal'): Artifact {
  const reference = realReference(spec.target);
  const data = responseAgainstReference(spec, which === 'physical' ? response.physical : response.ideal);
  const lines = [
    `! tunestrip predicted S11 of the ${which} network, design "${spec.name}"`,
    `! load held at ${fixed(spec.load.re, 4)}${spec.load.im < 0 ? '-' : '+'}j${fixed(Math.abs(spec.load.im), 4)} ohm over the band`,
    '! prediction from closed-form models; verify by EM simulation or measurement',
    `# GHZ S RI R ${trimmed(reference, 6)}`,
    ...response.frequencies.map((f, i) => {
      const g = data[i]!;
      return `${fixed(f / 1e9, 9)} ${fixed(g.re, 12)} ${fixed(g.im, 12)}`;
    }),
  ];
  return { path: which === 'physical' ? 'response.s1p' : 'response-ideal.s1p', mediaType: 'text/plain', text: `${lines.join('\n')}\n` };
}
