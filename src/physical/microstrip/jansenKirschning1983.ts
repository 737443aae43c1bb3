// Dispersion of the characteristic impedance (power–current definition).
// Source: R. H. Jansen, M. Kirschning, "Arguments and an accurate model for the power-current
// formulation of microstrip characteristic impedance", AEÜ 37, pp. 108–112, 1983. fn in GHz·mm.
//
// R8 is written as in the paper: the (fn/18.365)^2.745 factor is INSIDE the exponential. (At least one
// public implementation places it outside; that is a copying error.)
//
// Numerics: scikit-rf clamps R1, R2 and R6 at 20 before exp(−R) to avoid overflow in its vector code.
// In IEEE doubles exp(−x) for large x underflows smoothly to 0, so no clamp is used here; the two
// differ by at most exp(−20) ≈ 2e-9 in the affected factors.

/**
 * Z0(f) = Z00·(R13/R14)^R17.
 * @param u w/h (see analyse.ts for the choice made when t > 0)
 * @param epsEff0 static εe, @param epsEffF εe(f) from Kirschning–Jansen 1982, @param z00 static Z0 (Ω)
 */
export function z0JK(u: number, er: number, epsEff0: number, epsEffF: number, z00: number, fn: number): number {
  const R1 = 0.03891 * Math.pow(er, 1.4);
  const R2 = 0.2671 * Math.pow(u, 7);
  const R3 = 4.766 * Math.exp(-3.228 * Math.pow(u, 0.641));
  const R4 = 0.016 + Math.pow(0.0514 * er, 4.524);
  const R5 = Math.pow(fn / 28.843, 12);
  const R6 = 22.2 * Math.pow(u, 1.92);
  const R7 = 1.206 - 0.3144 * Math.exp(-R1) * (1 - Math.exp(-R2));
  const R8 = 1 + 1.275 * (1 - Math.exp(-0.004625 * R3 * Math.pow(er, 1.674) * Math.pow(fn / 18.365, 2.745)));
  const R9 =
    ((5.086 * R4 * R5) / (0.3838 + 0.386 * R4)) *
    (Math.exp(-R6) / (1 + 1.2992 * R5)) *
    (Math.pow(er - 1, 6) / (1 + 10 * Math.pow(er - 1, 6)));
  const R10 = 0.00044 * Math.pow(er, 2.136) + 0.0184;
  const x = Math.pow(fn / 19.47, 6);
  const R11 = x / (1 + 0.0962 * x);
  const R12 = 1 / (1 + 0.00245 * u * u);
  const R13 = 0.9408 * Math.pow(epsEffF, R8) - 0.9603;
  const R14 = (0.9408 - R9) * Math.pow(epsEff0, R8) - 0.9603;
  const R15 = 0.707 * R10 * Math.pow(fn / 12.3, 1.097);
  const R16 = 1 + 0.0503 * er * er * R11 * (1 - Math.exp(-Math.pow(u / 15, 6)));
  const R17 = R7 * (1 - 1.1241 * (R12 / R16) * Math.exp(-0.026 * Math.pow(fn, 1.15656) - R15));
  return z00 * Math.pow(R13 / R14, R17);
}
