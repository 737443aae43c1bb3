// Thin-strip synthesis start value.
// Source: H. A. Wheeler, "Transmission-line properties of a strip on a dielectric sheet on a plane",
// IEEE Trans. MTT-25(8), pp. 631–647, Aug. 1977 (the exact form is from memory, physics.md §1.3 [M];
// it is only a starting value: within about 0.1–0.8 % of Hammerstad–Jensen).

/** u0 = w/h for impedance z0 (Ω) on permittivity er: X = exp[(Z0/42.4)·√(εr+1)] − 1, u0 = 8·√[X·(7+4/εr)/11 + (1+1/εr)/0.81]/X. */
export function wheelerSynthesisU(z0: number, er: number): number {
  const X = Math.exp((z0 / 42.4) * Math.sqrt(er + 1)) - 1;
  return (8 * Math.sqrt((X * (7 + 4 / er)) / 11 + (1 + 1 / er) / 0.81)) / X;
}
