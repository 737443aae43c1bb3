// The one number formatter behind every writer and printout: fixed decimals, no "-0", no exponent.
export function fixed(value: number, decimals: number): string {
  if (!Number.isFinite(value)) throw new RangeError(`cannot format non-finite number ${value}`);
  const text = value.toFixed(decimals);
  // toFixed switches to exponent form at 1e21; such values never occur in board coordinates.
  if (/e/i.test(text)) throw new RangeError(`number ${value} is out of range for fixed formatting`);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** Fixed decimals with trailing zeros (and a bare trailing point) removed: 1.500 → "1.5", 2.000 → "2". */
export function trimmed(value: number, decimals: number): string {
  const text = fixed(value, decimals);
  return text.includes('.') ? text.replace(/0+$/, '').replace(/\.$/, '') : text;
}

/** Gigahertz from hertz, trimmed, with its unit: 5.8 GHz. */
export const ghz = (hz: number): string => `${trimmed(hz / 1e9, 6)} GHz`;

/** A fraction as a signed percentage with two decimals: -0.0140 → "-1.40 %", 0.003 → "+0.30 %". */
export const signedPercent = (fraction: number): string => `${fraction >= 0 ? '+' : ''}${fixed(fraction * 100, 2)} %`;

/** Millimetres from metres, trimmed. */
export const mm = (metres: number, decimals = 3): string => trimmed(metres * 1e3, decimals);

/** The trade's complex notation: 22-j31, 50, 12.5+j4. */
export function impedanceText(re: number, im: number, decimals = 2): string {
  const r = trimmed(re, decimals);
  const i = trimmed(Math.abs(im), decimals);
  if (i === '0') return r;
  return `${r}${im < 0 ? '-' : '+'}j${i}`;
}

/**
 * A model's |S11| in dB for a person to read. A solve that converged leaves a residual at the
 * level of floating-point noise (−200 to −300 dB); printing that figure would suggest a precision
 * no model has, so anything below −100 dB reads as "below -100 dB".
 */
export const modelS11Text = (db: number): string => (db < -100 ? 'below -100 dB' : `${fixed(db, 1)} dB`);
