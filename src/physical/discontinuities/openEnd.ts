// Open-end length extension Δl of a microstrip line (the fringing field counted as extra line).
import type { LineProperties, Substrate } from '../../seams.js';

/**
 * Kirschning, Jansen & Koster, "Accurate model for open end effect of microstrip lines",
 * Electronics Letters 17(3), pp. 123–125, 1981. Δl/h = ξ1·ξ3·ξ5/ξ4, evaluated with εe at the line's
 * frequency (line.epsEff). Stated accuracy about 2.5 % for 0.01 ≤ u ≤ 100, εr ≤ 50 (physics.md §4.1, [M]).
 */
export function openEndExtensionKJK(line: LineProperties, substrate: Substrate): number {
  const u = line.width / substrate.height;
  const ee = line.epsEff;
  const er = substrate.er;
  const ee081 = Math.pow(ee, 0.81);
  const u08544 = Math.pow(u, 0.8544);
  const xi1 = ((0.434907 * (ee081 + 0.26)) / (ee081 - 0.189)) * ((u08544 + 0.236) / (u08544 + 0.87));
  const xi2 = 1 + Math.pow(u, 0.371) / (2.358 * er + 1);
  const xi3 = 1 + (0.5274 * Math.atan(0.084 * Math.pow(u, 1.9413 / xi2))) / Math.pow(ee, 0.9236);
  const xi4 = 1 + 0.0377 * Math.atan(0.067 * Math.pow(u, 1.456)) * (6 - 5 * Math.exp(0.036 * (1 - er)));
  const xi5 = 1 - 0.218 * Math.exp(-7.5 * u);
  return substrate.height * ((xi1 * xi3 * xi5) / xi4);
}

/**
 * Scale on Kirschning–Jansen–Koster's Δl fitted to this project's four full-wave open ends
 * (scripts/fullwave/junctions.json: εr 2.2–10.2, h 0.508–1.6 mm, 50–70 Ω; KJK falls 2.7–5.3 % short
 * of every one). Least squares on the relative error (scripts/fullwave/junction-fit.ts).
 */
export const OPEN_END_FULLWAVE_SCALE = 1.0386;

/**
 * KJK 1981 scaled to the full-wave extractions: the open-end extension the design uses.
 */
export function openEndExtensionDesign(line: LineProperties, substrate: Substrate): number {
  return OPEN_END_FULLWAVE_SCALE * openEndExtensionKJK(line, substrate);
}

/**
 * Hammerstad & Bekkadal, Microstrip Handbook, ELAB report, Univ. of Trondheim, 1975 (form from memory,
 * physics.md §4.1 [M]): Δl/h = 0.412·(εe + 0.3)(u + 0.264)/[(εe − 0.258)(u + 0.8)], with εe = line.epsEff.
 * Roughly ±5 % for 0.2 ≤ u ≤ 6, 2 ≤ εr ≤ 50.
 */
export function openEndExtensionHB(line: LineProperties, substrate: Substrate): number {
  const u = line.width / substrate.height;
  const ee = line.epsEff;
  return substrate.height * ((0.412 * (ee + 0.3) * (u + 0.264)) / ((ee - 0.258) * (u + 0.8)));
}
