// Transmission-line relations on plain complex numbers (SI: Ω, S, m, 1/m).
// Source: Pozar, Microwave Engineering, 3rd ed. (2005), §2.3 (lossless) and §2.7 (lossy line),
// written in the cosh/sinh (ABCD) form so that no tan/tanh pole is ever divided by.
import { add, complex, cosh, div, inv, mul, sinh, type Complex } from './complex.js';

/** Characteristic impedance given as a real number or a complex value. */
export type LineImpedance = Complex | number;

const asComplex = (z: LineImpedance): Complex => (typeof z === 'number' ? complex(z, 0) : z);

/** Propagation constant γ = jβ of a lossless line measured in wavelengths (β = 2π per wavelength). */
export const LOSSLESS_PER_WAVELENGTH: Complex = complex(0, 2 * Math.PI);

/** A load is treated as an open circuit when either part is infinite. */
export const isOpenLoad = (z: Complex): boolean => !Number.isFinite(z.re) || !Number.isFinite(z.im);

/**
 * Input impedance of a line of characteristic impedance z0 and propagation constant gamma, of the
 * given length, terminated in zLoad (Pozar 2005, eq. 2.91 lossy form, Zin = Z0 (ZL + Z0 tanh γl)/(Z0 + ZL tanh γl)),
 * evaluated as (ZL cosh γl + Z0 sinh γl)/(ZL sinh γl / Z0 + cosh γl). An infinite load is an open circuit.
 */
export function inputImpedance(zLoad: Complex, z0: LineImpedance, gamma: Complex, length: number): Complex {
  if (isOpenLoad(zLoad)) return inv(openStubAdmittance(z0, gamma, length));
  const zc = asComplex(z0);
  const gl = complex(gamma.re * length, gamma.im * length);
  const ch = cosh(gl);
  const sh = sinh(gl);
  return div(add(mul(zLoad, ch), mul(zc, sh)), add(div(mul(zLoad, sh), zc), ch));
}

/** Input admittance of an open-circuited stub: Y = tanh(γl)/Z0 (Pozar 2005, §2.3/§2.7, ZL → ∞). */
export function openStubAdmittance(z0: LineImpedance, gamma: Complex, length: number): Complex {
  const gl = complex(gamma.re * length, gamma.im * length);
  return div(sinh(gl), mul(asComplex(z0), cosh(gl)));
}

/** Input admittance of a short-circuited stub: Y = 1/(Z0 tanh γl) (Pozar 2005, §2.3/§2.7, ZL = 0). Non-finite at l = 0. */
export function shortStubAdmittance(z0: LineImpedance, gamma: Complex, length: number): Complex {
  const gl = complex(gamma.re * length, gamma.im * length);
  return div(cosh(gl), mul(asComplex(z0), sinh(gl)));
}

/** Lossless line of electrical length `lengthWl` wavelengths (Pozar 2005, eq. 2.44). */
export const idealInputImpedance = (zLoad: Complex, z0: number, lengthWl: number): Complex =>
  inputImpedance(zLoad, z0, LOSSLESS_PER_WAVELENGTH, lengthWl);

/** Lossless open stub, Y = j tan(βl)/Z0, length in wavelengths. */
export const idealOpenStubAdmittance = (z0: number, lengthWl: number): Complex =>
  openStubAdmittance(z0, LOSSLESS_PER_WAVELENGTH, lengthWl);

/** Lossless short stub, Y = −j cot(βl)/Z0, length in wavelengths. */
export const idealShortStubAdmittance = (z0: number, lengthWl: number): Complex =>
  shortStubAdmittance(z0, LOSSLESS_PER_WAVELENGTH, lengthWl);
