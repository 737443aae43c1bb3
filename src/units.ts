// Engineering units at the edge of the core: text such as "5.8 GHz", "0.508 mm" or "22-j31" in,
// SI numbers out; and SI numbers back to engineering text. Nothing else in the core sees units.
import { complex, type Complex } from './math/complex.js';
import { fail } from './diagnostics.js';
import { impedanceText, trimmed } from './format.js';

export type Dimension = 'length' | 'frequency' | 'impedance' | 'conductivity' | 'dimensionless';

/**
 * SI prefixes and their powers of ten (NIST SP 811, 2008, Table 5; BIPM SI Brochure, 9th ed., 2019,
 * Table 7). The micro sign U+00B5 is the symbol we write; U+03BC and "u" are read as aliases.
 */
export const SI_PREFIXES: readonly { readonly symbol: string; readonly name: string; readonly exponent: number }[] = [
  { symbol: 'y', name: 'yocto', exponent: -24 },
  { symbol: 'z', name: 'zepto', exponent: -21 },
  { symbol: 'a', name: 'atto', exponent: -18 },
  { symbol: 'f', name: 'femto', exponent: -15 },
  { symbol: 'p', name: 'pico', exponent: -12 },
  { symbol: 'n', name: 'nano', exponent: -9 },
  { symbol: 'µ', name: 'micro', exponent: -6 },
  { symbol: 'm', name: 'milli', exponent: -3 },
  { symbol: 'c', name: 'centi', exponent: -2 },
  { symbol: '', name: '', exponent: 0 },
  { symbol: 'k', name: 'kilo', exponent: 3 },
  { symbol: 'M', name: 'mega', exponent: 6 },
  { symbol: 'G', name: 'giga', exponent: 9 },
  { symbol: 'T', name: 'tera', exponent: 12 },
  { symbol: 'P', name: 'peta', exponent: 15 },
  { symbol: 'E', name: 'exa', exponent: 18 },
  { symbol: 'Z', name: 'zetta', exponent: 21 },
  { symbol: 'Y', name: 'yotta', exponent: 24 },
];

/** A unit the parser accepts: value × factor × 10^exponent, with factor an exact integer. */
interface UnitEntry {
  readonly text: string;
  readonly exponent: number;
  readonly factor?: number;
}

const siUnits = (bases: readonly string[], prefixes: readonly string[]): UnitEntry[] =>
  bases.flatMap((base) =>
    prefixes.map((p) => {
      const exponent = SI_PREFIXES.find((q) => q.symbol === p)?.exponent ?? 0;
      return { text: `${p}${base}`, exponent };
    }),
  );

const withMicroAliases = (units: UnitEntry[]): UnitEntry[] =>
  units.flatMap((u) => (u.text.startsWith('µ') ? [u, { ...u, text: `u${u.text.slice(1)}` }, { ...u, text: `μ${u.text.slice(1)}` }] : [u]));

const OHM_SYMBOLS = ['\u03A9', '\u2126', 'ohm', 'ohms', 'Ohm', 'Ohms'];

// Per dimension, only the units an RF engineer would write. Frequency has no sub-hertz prefixes on
// purpose: "915 mHz" is a typo for MHz far more often than it is 0.915 Hz.
const UNITS: Readonly<Record<Exclude<Dimension, 'dimensionless'>, readonly UnitEntry[]>> = {
  length: [
    ...withMicroAliases(siUnits(['m'], ['n', 'µ', 'm', 'c', ''])),
    // 1 mil = 0.001 in = 25.4 µm and 1 in = 25.4 mm, both exact (NIST SP 811, 2008, Appendix B.8).
    { text: 'mil', exponent: -7, factor: 254 },
    { text: 'mils', exponent: -7, factor: 254 },
    { text: 'thou', exponent: -7, factor: 254 },
    { text: 'in', exponent: -4, factor: 254 },
    // Copper weight: 1 oz of copper over 1 ft² is taken as 34.8 µm thick (common practice, no source).
    { text: 'oz', exponent: -7, factor: 348 },
  ],
  frequency: siUnits(['Hz'], ['', 'k', 'M', 'G', 'T']),
  impedance: siUnits(OHM_SYMBOLS, ['m', '', 'k', 'M']),
  conductivity: siUnits(['S/m'], ['', 'k', 'M']),
};

const UNIT_ADVICE: Readonly<Record<Dimension, string>> = {
  length: 'use mm, um, mil or m (e.g. 0.508 mm)',
  frequency: 'use Hz, kHz, MHz or GHz (e.g. 5.8 GHz)',
  impedance: 'use a number of ohms (e.g. 50 or 50 ohm)',
  conductivity: 'use S/m or MS/m (e.g. 5.8e7 S/m)',
  dimensionless: 'use a plain number (e.g. 4.4)',
};

const ARTICLE: Readonly<Record<Dimension, string>> = {
  length: 'a length',
  frequency: 'a frequency',
  impedance: 'an impedance',
  conductivity: 'a conductivity',
  dimensionless: 'a plain number',
};

/** Decimal number: optional sign, digits with optional fraction, optional exponent. No hex, no "NaN". */
const NUMBER = String.raw`[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?`;
const UNSIGNED = String.raw`(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?`;
const QUANTITY_RE = new RegExp(String.raw`^(${NUMBER})\s*(.*)$`, 's');

/** Show a user's value inside a one-line message: JSON-quoted, control characters escaped, shortened. */
export function shown(value: unknown): string {
  let text: string;
  if (typeof value === 'string') text = JSON.stringify(value);
  else if (typeof value === 'number' || typeof value === 'boolean' || value === null) text = String(value);
  else if (value === undefined) text = 'nothing';
  else if (Array.isArray(value)) text = 'a list';
  else if (typeof value === 'object') text = 'a mapping';
  else text = typeof value;
  return text.length > 48 ? `${text.slice(0, 45)}…` : text;
}

/** Decimal text × 10^exponent, rounded once (the string carries the exponent, so 0.508 mm is exactly 0.508e-3). */
function scaledDecimal(numberText: string, exponent: number): number {
  const m = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+))(?:[eE]([+-]?\d+))?$/.exec(numberText);
  if (!m) return Number.NaN;
  const own = m[2] === undefined ? 0 : Number(m[2]);
  return Number(`${m[1]}e${own + exponent}`);
}

function finiteOrFail(value: number, original: unknown, dimension: Dimension, where: string): number {
  if (!Number.isFinite(value)) fail('spec.invalid', where, `${shown(original)} is not a finite number; ${UNIT_ADVICE[dimension]}`);
  return value;
}

/**
 * An engineering quantity in SI units. Numbers are taken as already SI (Hz, Ω, S/m) except for
 * lengths, where a bare number other than 0 is refused: "1.6" could be mm, mil or m.
 */
export function parseQuantity(value: unknown, dimension: Dimension, where: string): number {
  if (typeof value === 'number') {
    finiteOrFail(value, value, dimension, where);
    if (dimension === 'length' && value !== 0) {
      fail('spec.invalid', where, `${shown(value)} has no unit; lengths need one: ${UNIT_ADVICE.length}`);
    }
    return value === 0 ? 0 : value;
  }
  if (typeof value !== 'string') {
    return fail('spec.invalid', where, `${shown(value)} is not ${ARTICLE[dimension]}; ${UNIT_ADVICE[dimension]}`);
  }
  const text = value.trim();
  const m = QUANTITY_RE.exec(text);
  if (!m) return fail('spec.invalid', where, `${shown(value)} is not ${ARTICLE[dimension]}; ${UNIT_ADVICE[dimension]}`);
  const numberText = m[1] ?? '';
  const unitText = (m[2] ?? '').trim();
  if (unitText === '') {
    if (dimension === 'length' && Number(numberText) !== 0) {
      fail('spec.invalid', where, `${shown(value)} has no unit; lengths need one: ${UNIT_ADVICE.length}`);
    }
    const plain = finiteOrFail(Number(numberText), value, dimension, where);
    return plain === 0 ? 0 : plain;
  }
  if (dimension === 'dimensionless') {
    return fail('spec.invalid', where, `${shown(value)} should have no unit; ${UNIT_ADVICE.dimensionless}`);
  }
  const units = UNITS[dimension];
  const unit = units.find((u) => u.text === unitText);
  if (!unit) {
    const caseFix = units.find((u) => u.text.toLowerCase() === unitText.toLowerCase());
    const hint = caseFix ? `did you mean ${caseFix.text}? (unit prefixes are case-sensitive: m is milli, M is mega)` : UNIT_ADVICE[dimension];
    return fail('spec.invalid', where, `${shown(value)} is not ${ARTICLE[dimension]}; ${hint}`);
  }
  // Multiply by the integer factor first, then divide by an exact power of ten: 1 mil is then
  // exactly the double nearest 25.4 µm.
  const scaled = unit.factor === undefined ? scaledDecimal(numberText, unit.exponent) : (Number(numberText) * unit.factor) / 10 ** -unit.exponent;
  const result = finiteOrFail(scaled, value, dimension, where);
  return result === 0 ? 0 : result;
}

const IMPEDANCE_ADVICE = 'write it as R+jX in ohms (e.g. 50, 22-j31, 12.5+j4 or 22-31j)';
const IMPEDANCE_UNIT_RE = /\s*(?:\u03A9|\u2126|ohms?|Ohms?)$/u;
const REAL_ONLY = new RegExp(`^(${NUMBER})$`);
const IMAG_ONLY_J_FIRST = new RegExp(`^([+-]?)\\s*j\\s*(${UNSIGNED})$`);
const IMAG_ONLY_J_LAST = new RegExp(`^([+-]?)\\s*(${UNSIGNED})\\s*j$`);
const BOTH_J_FIRST = new RegExp(`^(${NUMBER})\\s*([+-])\\s*j\\s*(${UNSIGNED})$`);
const BOTH_J_LAST = new RegExp(`^(${NUMBER})\\s*([+-])\\s*(${UNSIGNED})\\s*j$`);

/**
 * A complex impedance in ohms, in the trade's notation: 50, 22-j31, 12.5+j4, -j5, 22 - j31, 22-31j,
 * "50 ohm", "12.5+j4 Ω". A {re, im} mapping is accepted too. Physical sense (Re > 0) is not judged here.
 */
export function parseImpedance(value: unknown, where: string): Complex {
  const bad = (): never => fail('spec.invalid', where, `${shown(value)} is not an impedance; ${IMPEDANCE_ADVICE}`);
  const finite = (re: number, im: number): Complex => {
    if (!Number.isFinite(re) || !Number.isFinite(im)) {
      fail('spec.invalid', where, `${shown(value)} is not a finite impedance; ${IMPEDANCE_ADVICE}`);
    }
    return complex(re === 0 ? 0 : re, im === 0 ? 0 : im);
  };
  if (typeof value === 'number') return finite(value, 0);
  if (value !== null && typeof value === 'object' && !Array.isArray(value)) {
    const record = value as Record<string, unknown>;
    const keys = Object.keys(record);
    if (keys.every((k) => k === 're' || k === 'im') && typeof record.re === 'number' && (record.im === undefined || typeof record.im === 'number')) {
      return finite(record.re, typeof record.im === 'number' ? record.im : 0);
    }
    return bad();
  }
  if (typeof value !== 'string') return bad();
  let text = value.trim().replace(IMPEDANCE_UNIT_RE, '').trim();
  if (text.startsWith('(') && text.endsWith(')')) text = text.slice(1, -1).trim();
  const sign = (s: string | undefined): number => (s === '-' ? -1 : 1);
  let m = REAL_ONLY.exec(text);
  if (m) return finite(Number(m[1]), 0);
  m = IMAG_ONLY_J_FIRST.exec(text) ?? IMAG_ONLY_J_LAST.exec(text);
  if (m) return finite(0, sign(m[1]) * Number(m[2]));
  m = BOTH_J_FIRST.exec(text) ?? BOTH_J_LAST.exec(text);
  if (m) return finite(Number(m[1]), sign(m[2]) * Number(m[3]));
  return bad();
}

/** Complex impedance as text that parseImpedance reads back (the trade's notation, via src/format.ts). */
export const formatImpedance = (z: Complex, decimals = 2): string => impedanceText(z.re, z.im, decimals);

/**
 * A value with an SI prefix chosen so the mantissa lies in [1, 1000): 5.8e9 Hz → "5.8 GHz",
 * 508e-6 m → "508 µm". `digits` are significant digits (default 4), trailing zeros trimmed.
 */
export function formatEngineering(value: number, unit: string, digits = 4): string {
  if (!Number.isFinite(value)) throw new RangeError(`cannot format non-finite number ${value}`);
  if (!Number.isInteger(digits) || digits < 1 || digits > 15) throw new RangeError(`digits must be an integer 1–15, got ${digits}`);
  if (value === 0) return `0 ${unit}`;
  const magnitude = Math.abs(value);
  // Beyond the prefix table no prefix fits; write E-notation, which parseQuantity reads back.
  if (magnitude < 1e-24 || magnitude >= 1e27) {
    return `${value.toExponential(digits - 1).replace(/\.?0+e/, 'e')} ${unit}`;
  }
  const minExponent = SI_PREFIXES[0]?.exponent ?? -24;
  const maxExponent = SI_PREFIXES[SI_PREFIXES.length - 1]?.exponent ?? 24;
  const pick = (exponent: number): { mantissa: number; exponent: number } => {
    const clamped = Math.min(maxExponent, Math.max(minExponent, exponent));
    return { mantissa: magnitude / 10 ** clamped, exponent: clamped };
  };
  let { mantissa, exponent } = pick(Math.floor(Math.log10(magnitude) / 3) * 3);
  // log10 may land a hair off near powers of ten; settle the mantissa into [1, 1000).
  if (mantissa >= 1000 && exponent < maxExponent) ({ mantissa, exponent } = pick(exponent + 3));
  if (mantissa < 1 && exponent > minExponent) ({ mantissa, exponent } = pick(exponent - 3));
  const decimalsFor = (m: number): number => Math.min(20, Math.max(0, digits - 1 - Math.floor(Math.log10(m))));
  let decimals = decimalsFor(mantissa);
  let rounded = Number(mantissa.toFixed(decimals));
  if (rounded >= 1000 && exponent < maxExponent) {
    // 999.96 at 4 digits rounds to 1000: step up a prefix instead of writing "1000 MHz".
    ({ mantissa, exponent } = pick(exponent + 3));
    decimals = decimalsFor(mantissa);
    rounded = Number(mantissa.toFixed(decimals));
  }
  if (rounded >= 1000) return `${value.toExponential(digits - 1).replace(/\.?0+e/, 'e')} ${unit}`;
  const prefix = SI_PREFIXES.find((p) => p.exponent === exponent)?.symbol ?? '';
  const signed = value < 0 ? -rounded : rounded;
  return `${trimmed(signed, decimals)} ${prefix}${unit}`;
}
