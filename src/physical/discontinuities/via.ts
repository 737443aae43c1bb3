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
 * Strip-to-via crowding, fitted to this project's own full-wave extractions (scripts/fullwave/
 * junctions.json, made by extract_junctions.py with openEMS; fitted by junction-fit.ts): a strip
 * ending on the centre of a via and its pad shows, at the via centre, Goldfarb–Pucel's barrel
 * inductance plus (μ0/2π)·k·(w − pad) when the strip is wider than the pad. The current has to
 * crowd in from the strip's width onto the pad, which the barrel formula leaves out. Eleven cases
 * (εr 2.2–10.2, h 0.254–1.6 mm, drill 0.2–0.8 mm, w/h 0.8–5.2) give k = 0.283 with every case within
 * ±8 % (a twelfth, held out of the fit, −4.6 %); Goldfarb–Pucel alone was up to 52 % low. Strips
 * narrower than the pad get no term (the one such case measured 8 % below Goldfarb–Pucel). Least
 * squares in relative error; rounded to 3 digits.
 */
export const VIA_CROWDING_FIT = 0.283;

/** The crowding term per unit of k, (μ0/2π)·max(w − pad, 0) (H), for one via under a strip share of `stripWidth`. */
export function viaCrowdingBasis(pad: number, stripWidth: number): number {
  return (MU0 / (2 * Math.PI)) * Math.max(stripWidth - pad, 0);
}

/**
 * Mutual inductance of two equal parallel filaments of length l a distance d apart (Grover,
 * "Inductance Calculations", 1946, from memory): (μ0/2π)·[l·ln((l + √(l² + d²))/d) − √(l² + d²) + d].
 */
export function mutualInductanceGrover(length: number, distance: number): number {
  const s = Math.sqrt(length * length + distance * distance);
  return (MU0 / (2 * Math.PI)) * (length * Math.log((length + s) / distance) - s + distance);
}

/**
 * Scale on Grover's mutual inductance between the vias of a row, fitted to this project's own
 * full-wave extractions of five rows of 2–3 vias at a line's end (openEMS FDTD; scripts/fullwave/
 * junctions.json "via_rows", made by `extract_junctions.py via-row`, fitted by junction-fit.ts
 * fitViaRowMutual; least squares in relative error, rounded to 3 digits). The rows measured 9–72 %
 * above the model without mutual inductance (that model −42…−8 %); with it, the cases lie within
 * −27…+15 % (the worst, 0.787 mm PTFE at 10 GHz, low). Rows are the least certain via model.
 */
export const VIA_ROW_MUTUAL_FIT = 0.684;

/**
 * Inductance of a stub's grounded end as the physical design uses it: `count` vias of `drill` in
 * `pad`, `pitch` apart centre to centre in a row across a strip of `stripWidth`, seen at the via
 * centre-line. Each via takes an equal share of the strip's width and of the current, so the row is
 * (1/n²)·Σ_i Σ_j L_ij: each via's own inductance (Goldfarb–Pucel plus the crowding term) and the
 * mutual inductance of every pair (Grover's filaments, scaled by VIA_ROW_MUTUAL_FIT). Vias close
 * together share their flux: two 0.2 mm vias 0.55 mm apart on 1.6 mm measured half again as
 * inductive as one alone halved.
 */
export function viaInductanceDesign(height: number, drill: number, pad: number, stripWidth: number, count = 1, pitch = 0): number {
  if (!(pad > 0 && stripWidth > 0 && Number.isInteger(count) && count >= 1)) {
    fail('spec.invalid', 'via', `via pad, strip width must be positive and the count a whole number ≥ 1 (pad ${pad}, w ${stripWidth}, n ${count})`);
  }
  if (count > 1 && !(pitch > drill)) fail('spec.invalid', 'via', `vias of a row must sit more than a drill apart (pitch ${pitch}, drill ${drill})`);
  const own = viaInductanceGoldfarbPucel(height, drill) + VIA_CROWDING_FIT * viaCrowdingBasis(pad, stripWidth / count);
  let mutual = 0;
  for (let i = 0; i < count; i += 1) {
    for (let j = 0; j < count; j += 1) if (i !== j) mutual += mutualInductanceGrover(height, Math.abs(i - j) * pitch);
  }
  return own / count + (VIA_ROW_MUTUAL_FIT * mutual) / (count * count);
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
