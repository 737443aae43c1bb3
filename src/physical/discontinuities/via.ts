// Via-hole ground: inductance and resistance of a plated through hole to the ground plane.
import { fail } from '../../diagnostics.js';
import { MU0 } from '../microstrip/constants.js';

/**
 * Goldfarb & Pucel, "Modeling via hole grounds in microstrip", IEEE Microwave and Guided Wave Letters
 * 1(6), pp. 135–137, 1991: L = (μ0/2π)·[h·ln((h + √(r² + h²))/r) + 1.5·(r − √(r² + h²))] (H),
 * r = drill/2, h = substrate height.
 */
export function viaInductanceGoldfarbPucel(height: number, drill: number): number {
  if (!(height > 0 && drill > 0)) fail('spec.invalid', 'via', `via height and drill must be positive (h ${height}, d ${drill})`);
  const r = drill / 2;
  const s = Math.sqrt(r * r + height * height);
  return (MU0 / (2 * Math.PI)) * (height * Math.log((height + s) / r) + 1.5 * (r - s));
}

/**
 * Ratio of the via inductance seen in this project's full-wave runs to Goldfarb–Pucel's barrel
 * formula: a line ending in one 0.3 mm via with a 0.6 mm pad on εr 3.0, h 0.76 mm measured 0.245 nH
 * against 0.166 nH (×1.48, physics.md §4.4), and the short-stub matches in scripts/fullwave/ land
 * on the simulated frequency with ×1.5 (via 0.14 λg from the line) and ×1.7 (0.1 λg). The formula
 * leaves out the pad and the strip-to-pad current crowding. Fitted on one stackup (h/d ≈ 2.5):
 * treat it as a correction with that pedigree, and check short stubs by full-wave simulation.
 */
export const VIA_FULLWAVE_FACTOR = 1.5;

/** Inductance of one ground via as the physical design uses it: Goldfarb–Pucel × the full-wave factor. */
export function viaInductanceDesign(height: number, drill: number): number {
  return VIA_FULLWAVE_FACTOR * viaInductanceGoldfarbPucel(height, drill);
}

/**
 * Goldfarb & Pucel 1991 resistance (form from memory, physics.md §4.4 [M]): R = R_dc·√(1 + f/f_δ) with
 * R_dc = ρ·h/(π·(r² − (r − t)²)) and f_δ = ρ/(π·μ0·t²), ρ = 1/σ, t = plating thickness. A plating
 * thicker than the radius is a solid barrel (inner radius 0).
 */
export function viaResistance(height: number, drill: number, platingThickness: number, conductivity: number, frequency: number): number {
  if (!(height > 0 && drill > 0 && platingThickness > 0 && conductivity > 0 && frequency >= 0)) {
    fail('spec.invalid', 'via', 'via height, drill, plating thickness and conductivity must be positive, frequency ≥ 0');
  }
  const rho = 1 / conductivity;
  const r = drill / 2;
  const inner = Math.max(r - platingThickness, 0);
  const Rdc = (rho * height) / (Math.PI * (r * r - inner * inner));
  const fDelta = rho / (Math.PI * MU0 * platingThickness * platingThickness);
  return Rdc * Math.sqrt(1 + frequency / fDelta);
}
