import { describe, expect, it } from 'vitest';
import { errorOf } from '../helpers/errors.js';
import fc from 'fast-check';
import { TunestripError } from '../../src/diagnostics.js';
import { impedanceText, modelS11Text } from '../../src/format.js';
import { SI_PREFIXES, formatEngineering, parseImpedance, parseQuantity, type Dimension } from '../../src/units.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b), Number.MIN_VALUE);


describe('SI prefixes', () => {
  it('match the published table', () => {
    // NIST SP 811 (2008), Table 5 / BIPM SI Brochure, 9th ed. (2019), Table 7: SI prefixes.
    const published: Record<string, number> = {
      yocto: -24, zepto: -21, atto: -18, femto: -15, pico: -12, nano: -9, micro: -6, milli: -3,
      centi: -2, kilo: 3, mega: 6, giga: 9, tera: 12, peta: 15, exa: 18, zetta: 21, yotta: 24,
    };
    const ours = Object.fromEntries(SI_PREFIXES.filter((p) => p.name !== '').map((p) => [p.name, p.exponent]));
    expect(ours).toEqual(published);
    // Same source: symbols are case-sensitive, M = mega and m = milli, µ = micro.
    const symbols = Object.fromEntries(SI_PREFIXES.map((p) => [p.symbol, p.name]));
    expect(symbols.M).toBe('mega');
    expect(symbols.m).toBe('milli');
    expect(symbols['µ']).toBe('micro');
    expect(symbols.G).toBe('giga');
    expect(symbols.k).toBe('kilo');
  });
});

describe('parseQuantity accepts', () => {
  // [input, dimension, SI value, source]
  const exact: [unknown, Dimension, number, string][] = [
    ['5.8 GHz', 'frequency', 5.8e9, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: giga = 1e9'],
    ['915MHz', 'frequency', 915e6, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: mega = 1e6'],
    ['100 kHz', 'frequency', 100e3, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: kilo = 1e3'],
    ['0.3 THz', 'frequency', 0.3e12, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: tera = 1e12'],
    ['2e9 Hz', 'frequency', 2e9, 'common practice, no source: E-notation'],
    [5.8e9, 'frequency', 5.8e9, 'a bare number is already hertz (our convention)'],
    ['0.508 mm', 'length', 0.508e-3, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: milli = 1e-3'],
    ['1.6mm', 'length', 1.6e-3, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: milli = 1e-3'],
    ['35 um', 'length', 35e-6, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: micro = 1e-6 ("u" for µ is common practice, no source)'],
    ['35 µm', 'length', 35e-6, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: micro = 1e-6'],
    ['35 μm', 'length', 35e-6, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: micro = 1e-6 (Greek mu U+03BC)'],
    ['120 nm', 'length', 120e-9, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: nano = 1e-9'],
    ['2.5 cm', 'length', 2.5e-2, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: centi = 1e-2'],
    ['-1 mm', 'length', -1e-3, 'area corners may be negative (our convention)'],
    [0, 'length', 0, 'zero needs no unit (our convention)'],
    ['0', 'length', 0, 'zero needs no unit (our convention)'],
    ['5.8e7 S/m', 'conductivity', 5.8e7, 'SI derived unit S/m'],
    ['58 MS/m', 'conductivity', 58e6, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: mega = 1e6'],
    [50, 'impedance', 50, 'a bare number is already ohms'],
    ['50 ohm', 'impedance', 50, 'common practice, no source: "ohm" for Ω'],
    ['50 \u03A9', 'impedance', 50, 'BIPM SI Brochure: Ω (Greek capital omega)'],
    ['50 \u2126', 'impedance', 50, 'Unicode OHM SIGN U+2126, canonically equivalent to U+03A9'],
    ['1.2 kΩ', 'impedance', 1200, 'NIST SP 811 / BIPM SI Brochure, SI prefixes: kilo = 1e3'],
    ['4.4', 'dimensionless', 4.4, 'plain number'],
    [0.02, 'dimensionless', 0.02, 'plain number'],
  ];
  it.each(exact)('%s as %s → %d (%s)', (input, dimension, expected) => {
    expect(parseQuantity(input, dimension, 'x')).toBe(expected);
  });

  it('reads mil, inch and copper ounces', () => {
    // NIST SP 811 (2008), Appendix B.8: 1 mil = 2.54e-5 m exactly; 1 in = 2.54e-2 m exactly.
    expect(parseQuantity('1 mil', 'length', 'x')).toBe(2.54e-5);
    expect(rel(parseQuantity('62 mil', 'length', 'x'), 62 * 2.54e-5)).toBeLessThan(1e-15);
    expect(rel(parseQuantity('20 mils', 'length', 'x'), 0.508e-3)).toBeLessThan(1e-15);
    expect(rel(parseQuantity('0.1 in', 'length', 'x'), 2.54e-3)).toBeLessThan(1e-15);
    // Copper weight, 1 oz/ft² ≈ 34.8 µm (common practice, no source).
    expect(rel(parseQuantity('1 oz', 'length', 'x'), 34.8e-6)).toBeLessThan(1e-15);
    expect(rel(parseQuantity('0.5 oz', 'length', 'x'), 17.4e-6)).toBeLessThan(1e-15);
  });
});

describe('parseQuantity rejects', () => {
  // [input, dimension, text the one-line message must contain]
  const rejected: [unknown, Dimension, string][] = [
    ['0.5 parsecs', 'length', 'is not a length; use mm, um, mil or m'],
    ['1.6', 'length', 'has no unit'],
    [1.6, 'length', 'has no unit'],
    ['5.8 ghz', 'frequency', 'did you mean GHz?'],
    ['915 mHz', 'frequency', 'did you mean MHz?'],
    ['1.6 MM', 'length', 'did you mean mm?'],
    ['NaN', 'frequency', 'is not a frequency'],
    [Number.NaN, 'frequency', 'not a finite number'],
    [Number.POSITIVE_INFINITY, 'impedance', 'not a finite number'],
    ['Infinity GHz', 'frequency', 'is not a frequency'],
    ['1e400 Hz', 'frequency', 'not a finite number'],
    ['0x10 Hz', 'frequency', 'is not a frequency'],
    ['1,6 mm', 'length', 'is not a length'],
    ['', 'length', 'is not a length'],
    ['   ', 'frequency', 'is not a frequency'],
    [null, 'length', 'is not a length'],
    [true, 'frequency', 'is not a frequency'],
    [[1, 'mm'], 'length', 'is not a length'],
    [{ value: 1 }, 'length', 'is not a length'],
    ['5.8 GHz GHz', 'frequency', 'is not a frequency'],
    ['4.4 mm', 'dimensionless', 'should have no unit'],
    ['5 kg', 'length', 'is not a length'],
    ['mm', 'length', 'is not a length'],
    ['5.8e7', 'conductivity', ''],
  ];
  it.each(rejected.filter(([, , m]) => m !== ''))('%s as %s', (input, dimension, contains) => {
    const error = errorOf(() => parseQuantity(input, dimension, 'substrate.height'));
    expect(error.diagnostic.code).toBe('spec.invalid');
    expect(error.diagnostic.where).toBe('substrate.height');
    expect(error.message.startsWith('substrate.height: ')).toBe(true);
    expect(error.diagnostic.message).toContain(contains);
    expect(error.message).not.toMatch(/\n/);
  });
  it('a bare conductivity is taken as S/m, not refused', () => {
    expect(parseQuantity('5.8e7', 'conductivity', 'x')).toBe(5.8e7);
  });
  it('names the example in its advice (one line)', () => {
    const error = errorOf(() => parseQuantity('0.5 parsecs', 'length', 'substrate.height'));
    expect(error.message).toBe('substrate.height: "0.5 parsecs" is not a length; use mm, um, mil or m (e.g. 0.508 mm)');
  });
});

describe('parseImpedance', () => {
  const accepted: [unknown, number, number][] = [
    ['22-j31', 22, -31],
    [50, 50, 0],
    ['50', 50, 0],
    ['12.5+j4', 12.5, 4],
    ['-j5', 0, -5],
    ['j5', 0, 5],
    ['+j5', 0, 5],
    ['22 - j31', 22, -31],
    ['22-31j', 22, -31],
    ['22 + 31j', 22, 31],
    ['50 ohm', 50, 0],
    ['12.5+j4 Ω', 12.5, 4],
    ['(22-j31) ohms', 22, -31],
    ['2e1-j3.1e1', 20, -31],
    ['-3+j0', -3, 0],
    ['0.5-j .25', 0.5, -0.25],
    [{ re: 22, im: -31 }, 22, -31],
  ];
  it.each(accepted)('%s → %d %+dj', (input, re, im) => {
    const z = parseImpedance(input, 'load');
    expect(z.re).toBe(re);
    expect(z.im).toBe(im);
  });
  const rejected: unknown[] = [
    'abc', '22-j', 'j', '22 j31', '22--j31', '1+2+j3', 'NaN', 'Infinity', '1e400', '22-j1e400', '',
    '22-k31', '22-i31', null, true, [22, -31], { re: '22' }, { re: 1, im: 2, x: 3 }, Number.NaN, Number.NEGATIVE_INFINITY,
  ];
  it.each(rejected.map((r) => [r]))('rejects %s', (input) => {
    const error = errorOf(() => parseImpedance(input, 'load'));
    expect(error.diagnostic.code).toBe('spec.invalid');
    expect(error.diagnostic.where).toBe('load');
    expect(error.diagnostic.message).toMatch(/is not (a finite )?(an )?impedance/);
    expect(error.message).not.toMatch(/\n/);
  });
});

describe('formatEngineering', () => {
  const cases: [number, string, number | undefined, string][] = [
    [5.8e9, 'Hz', undefined, '5.8 GHz'],
    [915e6, 'Hz', undefined, '915 MHz'],
    [508e-6, 'm', undefined, '508 µm'],
    [0.508e-3, 'm', undefined, '508 µm'],
    [1.6e-3, 'm', undefined, '1.6 mm'],
    [999.96e6, 'Hz', 4, '1 GHz'],
    [123456, 'Hz', 3, '123 kHz'],
    [0, 'Hz', undefined, '0 Hz'],
    [-1.2e-3, 'm', undefined, '-1.2 mm'],
    [50, 'Ω', undefined, '50 Ω'],
    [1, 'Hz', undefined, '1 Hz'],
    [1000, 'Hz', undefined, '1 kHz'],
  ];
  it.each(cases)('%d %s (%s digits) → %s', (value, unit, digits, text) => {
    expect(formatEngineering(value, unit, digits)).toBe(text);
  });
  it('refuses non-finite values', () => {
    expect(() => formatEngineering(Number.NaN, 'Hz')).toThrow(RangeError);
  });
});

describe('round trips (seeded properties)', () => {
  const ranges: [Dimension, string, number, number][] = [
    ['frequency', 'Hz', 1, 999e12],
    ['length', 'm', 1e-9, 999],
    ['impedance', '\u03A9', 1e-3, 999e6],
    ['conductivity', 'S/m', 1, 999e6],
  ];
  it.each(ranges)('formatEngineering → parseQuantity (%s)', (dimension, unit, lo, hi) => {
    fc.assert(
      fc.property(fc.double({ min: lo, max: hi, noNaN: true }), fc.boolean(), (v, negative) => {
        const value = negative && dimension === 'length' ? -v : v;
        const back = parseQuantity(formatEngineering(value, unit, 12), dimension, 'x');
        return rel(back, value) <= 1e-11;
      }),
      { seed: 42, numRuns: 300 },
    );
  });
  it('three significant digits n × 10^k survive format and parse exactly', () => {
    fc.assert(
      fc.property(fc.integer({ min: 100, max: 999 }), fc.integer({ min: 0, max: 12 }), (n, k) => {
        const value = Number(`${n}e${k}`);
        return parseQuantity(formatEngineering(value, 'Hz', 3), 'frequency', 'x') === value;
      }),
      { seed: 42, numRuns: 300 },
    );
  });
  it('parseImpedance reads impedanceText back', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        fc.integer({ min: 0, max: 6 }),
        (re, im, decimals) => {
          const text = impedanceText(re, im, decimals);
          const z = parseImpedance(text, 'load');
          const expectedIm = Number(impedanceText(0, Math.abs(im), decimals).replace('+j', '') || '0');
          return z.re === (Number(impedanceText(re, 0, decimals)) || 0) && Math.abs(z.im) === expectedIm;
        },
      ),
      { seed: 42, numRuns: 500 },
    );
  });
});

describe('fuzz: only TunestripError escapes', () => {
  const onlyOurs = (run: () => unknown): boolean => {
    try {
      run();
      return true;
    } catch (error) {
      return error instanceof TunestripError && !error.message.includes('\n');
    }
  };
  const dims: Dimension[] = ['length', 'frequency', 'impedance', 'conductivity', 'dimensionless'];
  const noisyText = fc.oneof(
    fc.string({ unit: 'binary', maxLength: 30 }),
    fc.tuple(fc.double(), fc.constantFrom('', ' ', '  '), fc.constantFrom('GHz', 'mm', 'µm', 'mil', 'oz', 'S/m', 'Ω', 'j', 'e', 'x')).map(([n, s, u]) => `${n}${s}${u}`),
    fc.stringMatching(/^[-+ 0-9.eEjJ]{0,16}$/),
  );
  it('parseQuantity', () => {
    fc.assert(
      fc.property(fc.oneof(fc.anything(), noisyText), fc.constantFrom(...dims), (value, dim) => onlyOurs(() => parseQuantity(value, dim, 'x'))),
      { seed: 42, numRuns: 1000 },
    );
  });
  it('parseImpedance', () => {
    fc.assert(
      fc.property(fc.oneof(fc.anything(), noisyText), (value) => onlyOurs(() => parseImpedance(value, 'load'))),
      { seed: 42, numRuns: 1000 },
    );
  });
  it('results are finite', () => {
    fc.assert(
      fc.property(noisyText, fc.constantFrom(...dims), (value, dim) => {
        try {
          return Number.isFinite(parseQuantity(value, dim, 'x'));
        } catch (error) {
          return error instanceof TunestripError;
        }
      }),
      { seed: 42, numRuns: 500 },
    );
  });
});

// A converged solve leaves a residual at floating-point noise; a person should not read -291.6 dB
// as a prediction (common practice, no source: model figures below about -100 dB carry no meaning).
describe('modelS11Text', () => {
  it('prints ordinary values to 0.1 dB', () => {
    expect(modelS11Text(-29.44)).toBe('-29.4 dB');
    expect(modelS11Text(-100)).toBe('-100.0 dB');
  });
  it('prints a solver residual as a bound, not a figure', () => {
    expect(modelS11Text(-100.01)).toBe('below -100 dB');
    expect(modelS11Text(-291.64)).toBe('below -100 dB');
  });
});
