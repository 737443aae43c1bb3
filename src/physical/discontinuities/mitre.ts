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
