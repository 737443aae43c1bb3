// Static (quasi-TEM) microstrip model with strip-thickness correction.
// Source: E. Hammerstad, Ø. Jensen, "Accurate models for microstrip computer-aided design",
// IEEE MTT-S Int. Microwave Symp. Digest, 1980, pp. 407–409. Notation as in the paper:
// u = w/h, tn = t/h, Z01 = impedance of the air-filled line, εe = effective permittivity.
import { ETA0 } from './constants.js';

/** f(u) of HJ 1980, inside Z01. */
export function fHJ(u: number): number {
  return 6 + (2 * Math.PI - 6) * Math.exp(-Math.pow(30.666 / u, 0.7528));
}

/** Z01(u): characteristic impedance of the air-filled microstrip (Ω), HJ 1980. */
export function z01HJ(u: number): number {
  return (ETA0 / (2 * Math.PI)) * Math.log(fHJ(u) / u + Math.sqrt(1 + (2 / u) ** 2));
}

/** a(u) of HJ 1980, exponent term of εe. */
export function aHJ(u: number): number {
  return (
    1 +
    (1 / 49) * Math.log((u ** 4 + (u / 52) ** 2) / (u ** 4 + 0.432)) +
    (1 / 18.7) * Math.log(1 + (u / 18.1) ** 3)
  );
}

/** b(εr) of HJ 1980, exponent term of εe. */
export function bHJ(er: number): number {
  return 0.564 * Math.pow((er - 0.9) / (er + 3), 0.053);
}

/** εe(u, εr) for zero thickness, HJ 1980. */
export function epsEffHJ(u: number, er: number): number {
  return (er + 1) / 2 + ((er - 1) / 2) * Math.pow(1 + 10 / u, -aHJ(u) * bHJ(er));
}

/** Δu1 of HJ 1980 (thickness correction of the air line); 0 for tn = 0. */
export function deltaU1HJ(u: number, tn: number): number {
  if (tn <= 0) return 0;
  const coth = 1 / Math.tanh(Math.sqrt(6.517 * u));
  return (tn / Math.PI) * Math.log(1 + (4 * Math.E) / (tn * coth * coth));
}

/** Δur of HJ 1980 (thickness correction with dielectric): ½·[1 + sech(√(εr − 1))]·Δu1. */
export function deltaUrHJ(deltaU1: number, er: number): number {
  return 0.5 * (1 + 1 / Math.cosh(Math.sqrt(er - 1))) * deltaU1;
}

export interface StaticHJ {
  /** Static characteristic impedance Z0 (Ω). */
  readonly z0: number;
  /** Static effective permittivity εe. */
  readonly epsEff: number;
  /** u1 = u + Δu1. */
  readonly u1: number;
  /** ur = u + Δur = w_eff/h. */
  readonly ur: number;
}

/**
 * HJ 1980 with thickness: Z0 = Z01(ur)/√εe(ur, εr), εe = εe(ur, εr)·[Z01(u1)/Z01(ur)]².
 * With tn = 0, Δu1 = Δur = 0 and this is exactly the zero-thickness model.
 */
export function staticHJ(u: number, tn: number, er: number): StaticHJ {
  const du1 = deltaU1HJ(u, tn);
  const dur = deltaUrHJ(du1, er);
  const u1 = u + du1;
  const ur = u + dur;
  const epsEffR = epsEffHJ(ur, er);
  const z01r = z01HJ(ur);
  const z0 = z01r / Math.sqrt(epsEffR);
  const epsEff = du1 === 0 ? epsEffR : epsEffR * (z01HJ(u1) / z01r) ** 2;
  return { z0, epsEff, u1, ur };
}
