// Complex arithmetic on plain read-only records, so values cross every seam as JSON.
export interface Complex {
  readonly re: number;
  readonly im: number;
}

export const complex = (re: number, im = 0): Complex => ({ re, im });
export const ZERO: Complex = complex(0, 0);
export const ONE: Complex = complex(1, 0);
export const J: Complex = complex(0, 1);

export const add = (a: Complex, b: Complex): Complex => complex(a.re + b.re, a.im + b.im);
export const sub = (a: Complex, b: Complex): Complex => complex(a.re - b.re, a.im - b.im);
export const mul = (a: Complex, b: Complex): Complex =>
  complex(a.re * b.re - a.im * b.im, a.re * b.im + a.im * b.re);
export const scale = (a: Complex, k: number): Complex => complex(a.re * k, a.im * k);
export const neg = (a: Complex): Complex => complex(-a.re, -a.im);
export const conj = (a: Complex): Complex => complex(a.re, -a.im);
export const abs = (a: Complex): number => Math.hypot(a.re, a.im);
export const arg = (a: Complex): number => Math.atan2(a.im, a.re);

export function div(a: Complex, b: Complex): Complex {
  // Smith's algorithm: avoids overflow when |b| is large or small.
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re;
    const d = b.re + b.im * r;
    return complex((a.re + a.im * r) / d, (a.im - a.re * r) / d);
  }
  const r = b.re / b.im;
  const d = b.re * r + b.im;
  return complex((a.re * r + a.im) / d, (a.im * r - a.re) / d);
}

export const inv = (a: Complex): Complex => div(ONE, a);

export function exp(a: Complex): Complex {
  const m = Math.exp(a.re);
  return complex(m * Math.cos(a.im), m * Math.sin(a.im));
}

export function sqrt(a: Complex): Complex {
  const m = abs(a);
  const re = Math.sqrt((m + a.re) / 2);
  const im = Math.sign(a.im || 1) * Math.sqrt(Math.max(0, (m - a.re) / 2));
  return complex(re, im);
}

export function tanh(a: Complex): Complex {
  // tanh(x+jy) = (sinh 2x + j sin 2y) / (cosh 2x + cos 2y), stable for large |x| via the limit.
  if (Math.abs(a.re) > 20) return complex(Math.sign(a.re), 0);
  const d = Math.cosh(2 * a.re) + Math.cos(2 * a.im);
  return complex(Math.sinh(2 * a.re) / d, Math.sin(2 * a.im) / d);
}

export function cosh(a: Complex): Complex {
  return complex(Math.cosh(a.re) * Math.cos(a.im), Math.sinh(a.re) * Math.sin(a.im));
}

export function sinh(a: Complex): Complex {
  return complex(Math.sinh(a.re) * Math.cos(a.im), Math.cosh(a.re) * Math.sin(a.im));
}

/** 20·log10 of a magnitude, floored at −300 dB so an exact match stays finite. */
export const db = (magnitude: number): number => 20 * Math.log10(Math.max(magnitude, 1e-15));

export const isFiniteComplex = (a: Complex): boolean => Number.isFinite(a.re) && Number.isFinite(a.im);

/** Reflection coefficient of impedance z against reference z0 (complex references allowed, power-wave form not used). */
export const gammaOf = (z: Complex, z0: Complex): Complex => div(sub(z, z0), add(z, z0));

/** Impedance whose reflection against z0 is gamma. */
export const impedanceOf = (gamma: Complex, z0: Complex): Complex => mul(z0, div(add(ONE, gamma), sub(ONE, gamma)));
