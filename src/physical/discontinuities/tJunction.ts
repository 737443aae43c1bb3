// Microstrip T-junction: reference-plane shifts, transformer ratios and shunt susceptance.
// Source: E. Hammerstad, "Computer-aided design of microstrip couplers with accurate discontinuity
// models", IEEE MTT-S Int. Microwave Symp. Digest, 1981, pp. 54–56 (as restated in physics.md §4.2).
// Arms: main arms a and b, side arm 2 (the stub). Equivalent circuit: junction node with shunt jB_T; the
// side arm connects directly; each main arm through an ideal transformer with ratio n² (admittance at
// the arm's plane = n² × admittance at the node). Planes: main arms at d_a, d_b from the stub's
// centre-line; side arm at d2 from the main line's centre-line.
import type { LineProperties, Substrate } from '../../seams.js';
import { diagnostic, type Diagnostic } from '../../diagnostics.js';
import { C0, ETA0 } from '../microstrip/constants.js';

export interface TJunction {
  /** Main-arm a reference-plane displacement from the side arm's centre-line (m). */
  readonly da: number;
  readonly db: number;
  /** Side-arm reference-plane displacement from the main line's centre-line (m). */
  readonly d2: number;
  /** Transformer ratios n_a², n_b². */
  readonly n2a: number;
  readonly n2b: number;
  /** Junction shunt susceptance B_T (S). */
  readonly susceptance: number;
  readonly warnings: readonly Diagnostic[];
}

/** Smallest n² kept; below it the model has broken down (f near the arm's higher-mode cut-off). */
const N2_FLOOR = 1e-3;

export function tJunctionHammerstad(
  mainA: LineProperties,
  mainB: LineProperties,
  stub: LineProperties,
  substrate: Substrate,
  frequency: number,
): TJunction {
  const h = substrate.height;
  const er = substrate.er;
  const f = frequency;
  const warnings: Diagnostic[] = [];
  for (const [name, arm] of [['a', mainA], ['b', mainB], ['2', stub]] as const) {
    if (Math.abs(arm.frequency - f) > 1e-9 * f) {
      warnings.push(diagnostic('model.out-of-range', `tJunction.arm-${name}`, `arm ${name} was analysed at ${arm.frequency} Hz, the junction at ${f} Hz`));
    }
  }
  const Za = mainA.z0;
  const Zb = mainB.z0;
  const Z2 = stub.z0;
  // Equivalent parallel-plate widths D = (η0/Z)·h/√εe.
  const Da = ((ETA0 / Za) * h) / Math.sqrt(mainA.epsEff);
  const Db = ((ETA0 / Zb) * h) / Math.sqrt(mainB.epsEff);
  const D2 = ((ETA0 / Z2) * h) / Math.sqrt(stub.epsEff);
  // First higher-order-mode frequency f_p = 0.4·Z/h [GHz, h in mm], as in the paper (≈ Z/(2μ0h)).
  const fpOf = (Z: number): number => ((0.4 * Z) / (h * 1e3)) * 1e9;
  const fpa = fpOf(Za);
  const fpb = fpOf(Zb);
  for (const [name, fp] of [['a', fpa], ['b', fpb]] as const) {
    if (f >= fp) warnings.push(diagnostic('model.out-of-range', `tJunction.arm-${name}`, `f is above the arm's higher-order-mode frequency ${(fp / 1e9).toPrecision(4)} GHz (Hammerstad 1981)`));
  }
  const lambdaA = C0 / (Math.sqrt(mainA.epsEff) * f);
  const lambdaB = C0 / (Math.sqrt(mainB.epsEff) * f);
  const da = 0.055 * D2 * (Za / Z2) * (1 - 2 * (Za / Z2) * (f / fpa) ** 2);
  const db = 0.055 * D2 * (Zb / Z2) * (1 - 2 * (Zb / Z2) * (f / fpb) ** 2);
  const r = Math.sqrt(Za * Zb) / Z2;
  const q = (f * f) / (fpa * fpb);
  const d2 = Math.sqrt(Da * Db) * (0.5 - r * (0.05 + 0.7 * Math.exp(-1.6 * r) + 0.25 * r * q - 0.17 * Math.log(r)));
  const n2Raw = (Z: number, D: number, fp: number): number =>
    1 - Math.PI * (f / fp) ** 2 * ((Z / Z2) ** 2 / 12 + (0.5 - d2 / D) ** 2);
  const floorN2 = (name: string, n2: number): number => {
    if (n2 >= N2_FLOOR) return n2;
    warnings.push(diagnostic('model.out-of-range', `tJunction.arm-${name}`, `transformer ratio n² = ${n2.toPrecision(3)} fell below ${N2_FLOOR}; held at ${N2_FLOOR} (Hammerstad 1981 model has broken down)`));
    return N2_FLOOR;
  };
  const n2a = floorN2('a', n2Raw(Za, Da, fpa));
  const n2b = floorN2('b', n2Raw(Zb, Db, fpb));
  // Arithmetic mean of the two main arms' terms (physics.md §4.2; identical to the geometric form when wa = wb).
  const susceptance =
    ((5.5 * (er + 2)) / er) *
    ((0.5 * ((da * Da) / (n2a * lambdaA) + (db * Db) / (n2b * lambdaB))) / (D2 * Z2)) *
    (1 + 0.9 * Math.log(r) + 4.5 * r * q - 4.4 * Math.exp(-1.3 * r) - 20 * (Z2 / ETA0) ** 2);
  return { da, db, d2, n2a, n2b, susceptance, warnings };
}
