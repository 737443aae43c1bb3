// Two-port networks as ABCD (chain) matrices on plain complex numbers, and their S-parameters.
// Source: Pozar, Microwave Engineering, 3rd ed. (2005), §4.4 Table 4.1 (ABCD of useful two-ports)
// and Table 4.2 (ABCD → S conversion, real reference impedance Z0).
import { add, complex, cosh, div, inv, isFiniteComplex, mul, ONE, scale, sinh, sub, ZERO, type Complex } from './complex.js';
import type { LineImpedance } from './lines.js';

/** Chain matrix [A, B, C, D] in row order: V1 = A·V2 + B·I2, I1 = C·V2 + D·I2. */
export type Abcd = readonly [Complex, Complex, Complex, Complex];

/** Scattering parameters of a two-port against one real reference impedance. */
export interface TwoPortS {
  readonly s11: Complex;
  readonly s12: Complex;
  readonly s21: Complex;
  readonly s22: Complex;
}

const asComplex = (z: LineImpedance): Complex => (typeof z === 'number' ? complex(z, 0) : z);

export const IDENTITY_ABCD: Abcd = [ONE, ZERO, ZERO, ONE];

/** Transmission line: [cosh γl, Z0 sinh γl; sinh γl / Z0, cosh γl] (Pozar 2005, Table 4.1). */
export function lineAbcd(z0: LineImpedance, gamma: Complex, length: number): Abcd {
  const zc = asComplex(z0);
  const gl = complex(gamma.re * length, gamma.im * length);
  const ch = cosh(gl);
  const sh = sinh(gl);
  return [ch, mul(zc, sh), div(sh, zc), ch];
}

/** Shunt admittance Y: [1, 0; Y, 1] (Pozar 2005, Table 4.1). */
export const shuntAdmittanceAbcd = (y: Complex): Abcd => [ONE, ZERO, y, ONE];

/** Series impedance Z: [1, Z; 0, 1] (Pozar 2005, Table 4.1). */
export const seriesImpedanceAbcd = (z: Complex): Abcd => [ONE, z, ZERO, ONE];

/** Ideal transformer with turns ratio n:1 (port 1 : port 2): [n, 0; 0, 1/n] (Pozar 2005, Table 4.1). */
export const transformerAbcd = (n: number): Abcd => [complex(n), ZERO, ZERO, complex(1 / n)];

function product(m: Abcd, n: Abcd): Abcd {
  const [a, b, c, d] = m;
  const [e, f, g, h] = n;
  return [add(mul(a, e), mul(b, g)), add(mul(a, f), mul(b, h)), add(mul(c, e), mul(d, g)), add(mul(c, f), mul(d, h))];
}

/** Cascade from port 1 (source side) to port 2 (load side); no argument gives the identity. */
export const cascade = (...stages: readonly Abcd[]): Abcd => stages.reduce(product, IDENTITY_ABCD);

/** AD − BC; 1 for every reciprocal two-port (Pozar 2005, §4.4). */
export const abcdDeterminant = ([a, b, c, d]: Abcd): Complex => sub(mul(a, d), mul(b, c));

/** Impedance seen at port 1 with zLoad on port 2: (A·ZL + B)/(C·ZL + D); an infinite load gives A/C. */
export function inputImpedanceOf([a, b, c, d]: Abcd, zLoad: Complex): Complex {
  if (!isFiniteComplex(zLoad)) return div(a, c);
  return div(add(mul(a, zLoad), b), add(mul(c, zLoad), d));
}

/** Reflection coefficient of zin against a reference impedance: (Zin − Zref)/(Zin + Zref) (Pozar 2005, eq. 2.35). */
export function s11Of(zin: Complex, zRef: LineImpedance): Complex {
  const zr = asComplex(zRef);
  if (!isFiniteComplex(zin)) return ONE;
  return div(sub(zin, zr), add(zin, zr));
}

/** S-parameters of a two-port against a real reference z0ref at both ports (Pozar 2005, Table 4.2). */
export function abcdToS([a, b, c, d]: Abcd, z0ref: number): TwoPortS {
  const bn = scale(b, 1 / z0ref);
  const cn = scale(c, z0ref);
  const den = add(add(a, bn), add(cn, d));
  return {
    s11: div(sub(add(a, bn), add(cn, d)), den),
    s12: div(scale(sub(mul(a, d), mul(b, c)), 2), den),
    s21: div(complex(2), den),
    s22: div(sub(add(bn, d), add(a, cn)), den),
  };
}

/** Admittance of a one-port given by its impedance; an open circuit (infinite z) gives 0. */
export const admittanceOf = (z: Complex): Complex => (isFiniteComplex(z) ? inv(z) : ZERO);
