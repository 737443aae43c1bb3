// Dispersion of the effective permittivity.
// Source: M. Kirschning, R. H. Jansen, "Accurate model for effective dielectric constant of microstrip
// with validity up to millimetre-wave frequencies", Electronics Letters 18(6), pp. 272–273, 1982.
// The letter writes fn in GHz·cm (constants 0.157, 3.87 and a factor 10 on fn inside P); this is the
// equivalent GHz·mm form, fn = f[GHz]·h[mm].

/**
 * εe(f) = εr − (εr − εe0)/(1 + P(f)), with P(f) = P1·P2·[(0.1844 + P3·P4)·fn]^1.5763.
 * @param u w/h (see analyse.ts for the choice made when t > 0)
 * @param epsEff0 static εe (Hammerstad–Jensen 1980)
 * @param fn f·h in GHz·mm
 */
export function epsEffKJ(u: number, er: number, epsEff0: number, fn: number): number {
  const P1 = 0.27488 + (0.6315 + 0.525 / Math.pow(1 + 0.0157 * fn, 20)) * u - 0.065683 * Math.exp(-8.7513 * u);
  const P2 = 0.33622 * (1 - Math.exp(-0.03442 * er));
  const P3 = 0.0363 * Math.exp(-4.6 * u) * (1 - Math.exp(-Math.pow(fn / 38.7, 4.97)));
  const P4 = 1 + 2.751 * (1 - Math.exp(-Math.pow(er / 15.916, 8)));
  const P = P1 * P2 * Math.pow((0.1844 + P3 * P4) * fn, 1.5763);
  return er - (er - epsEff0) / (1 + P);
}
