// Attenuation of microstrip.
// Conductor loss: E. Hammerstad, F. Bekkadal, Microstrip Handbook, ELAB report STF44 A74169,
// Univ. of Trondheim, 1975, with the current-distribution factor Ki and the roughness factor Kr of
// Hammerstad & Jensen 1980 (physics.md §3.1). Dielectric loss: filling-factor form, Welch & Pratt 1966
// and Pozar, Microwave Engineering §3.8 (physics.md §3.2).
import { C0, ETA0, MU0 } from './constants.js';

/** Skin depth δ = √(ρ/(π·f·μ0)) (m), ρ = 1/σ. */
export function skinDepth(frequency: number, conductivity: number): number {
  return Math.sqrt(1 / (Math.PI * frequency * MU0 * conductivity));
}

/** Surface resistance Rs = √(π·f·μ0·ρ) (Ω). */
export function surfaceResistance(frequency: number, conductivity: number): number {
  return Math.sqrt((Math.PI * frequency * MU0) / conductivity);
}

/** Current-distribution factor Ki = exp[−1.2·(Z0/η0)^0.7]. */
export function currentDistributionFactor(z0: number): number {
  return Math.exp(-1.2 * Math.pow(z0 / ETA0, 0.7));
}

/** Hammerstad roughness factor Kr = 1 + (2/π)·atan[1.4·(Δ/δ)²], Δ = RMS roughness. */
export function roughnessFactorHammerstad(roughness: number, skin: number): number {
  return 1 + (2 / Math.PI) * Math.atan(1.4 * (roughness / skin) ** 2);
}

/** αc = Rs/(Z0·w)·Ki·Kr (Np/m), Hammerstad–Bekkadal 1975. */
export function conductorLossHB(z0: number, width: number, frequency: number, conductivity: number, roughness: number): number {
  const Rs = surfaceResistance(frequency, conductivity);
  const Ki = currentDistributionFactor(z0);
  const Kr = roughnessFactorHammerstad(roughness, skinDepth(frequency, conductivity));
  return (Rs / (z0 * width)) * Ki * Kr;
}

/**
 * αd = k0·εr·q·tanδ/(2·√εe) (Np/m) with filling factor q = (εe − 1)/(εr − 1).
 * q is passed in because it is singular at εr = 1 (0/0); analyse.ts supplies its limit there.
 */
export function dielectricLossFillingFactor(er: number, epsEff: number, fillingFactor: number, tanDelta: number, frequency: number): number {
  const k0 = (2 * Math.PI * frequency) / C0;
  return (k0 * er * fillingFactor * tanDelta) / (2 * Math.sqrt(epsEff));
}
