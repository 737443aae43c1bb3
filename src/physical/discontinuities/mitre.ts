// Optimum mitre of a symmetric 90° microstrip bend.
// Source: R. J. P. Douville, D. S. James, "Experimental study of symmetric microstrip bends and their
// compensation", IEEE T-MTT 26(3), pp. 175–182, 1978 (formula and range from memory, physics.md §4.3 [M]).
import { diagnostic, type Diagnostic } from '../../diagnostics.js';

/**
 * M = x/d = 52 + 65·exp(−1.35·w/h) percent, d = w·√2 the corner diagonal, x measured from the outer
 * corner. The cut meets each outer edge at a = x·√2 = 2·M·w from the outer corner. Validity w/h ≥ 0.25
 * (and εr ≤ 25); outside it a warning is returned and the formula value is kept.
 */
export function mitreDouvilleJames(width: number, height: number): { readonly fraction: number; readonly edgeCut: number; readonly warnings: readonly Diagnostic[] } {
  const u = width / height;
  const fraction = (52 + 65 * Math.exp(-1.35 * u)) / 100;
  const warnings: Diagnostic[] = [];
  if (u < 0.25) warnings.push(diagnostic('model.out-of-range', 'mitre', `w/h = ${u.toPrecision(3)} is below 0.25 (Douville–James 1978)`));
  if (fraction > 1) warnings.push(diagnostic('model.out-of-range', 'mitre', `mitre fraction ${fraction.toPrecision(3)} exceeds 1: the cut passes the inner corner`));
  return { fraction, edgeCut: 2 * fraction * width, warnings };
}

/**
 * Electrical length of one optimally mitred 90° bend beyond its centre-line length (m), measured
 * between the points where the two arms' centre-lines meet: negative, since the current cuts the
 * corner. Fitted to this project's own full-wave extractions of eight bare mitred bends (openEMS
 * FDTD; scripts/fullwave/junctions.json "bends", made by `extract_junctions.py bend`, fitted by
 * junction-fit.ts fitBendLength): Δl = a·w + b·h, least squares at f0 over w/h 0.89–5.2,
 * εr 2.2–10.2. Within 0.032 w of every extraction but one at f·h = 8 GHz·mm (0.074 w), where the
 * bend's length shrinks with frequency; elsewhere it changes by under 0.03 w over 0.7–1.3 f0, so
 * the length is taken as frequency-independent.
 */
export const BEND_LENGTH_FIT = { perWidth: -0.3769, perHeight: -0.3449 } as const;

export function mitredBendLength(width: number, height: number): number {
  return BEND_LENGTH_FIT.perWidth * width + BEND_LENGTH_FIT.perHeight * height;
}
