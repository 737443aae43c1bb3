// Generated inputs (fast-check) shared by the long fuzzing run (scripts/fuzz.mjs, plain JS against
// dist/) and the seeded fuzz test (test/property/pipeline-fuzz.test.ts): quantity texts for the unit
// parser and stub-layout inputs. Plain JS so that both can import it; types in fuzz-inputs.d.mts.

/** Unit words a user might write, right or wrong, including none. */
export const UNIT_WORDS = ['mm', 'um', 'µm', 'μm', 'nm', 'm', 'cm', 'mil', 'mils', 'in', 'oz', 'Hz', 'kHz', 'MHz', 'GHz', 'THz', 'ghz', 'mHz', 'Ω', 'ohm', 'kΩ', 'S/m', 'MS/m', '', ' ', 'x', 'e', 'j'];

/** Number texts, ordinary and hostile. @param {typeof import('fast-check')} fc */
export function numberTexts(fc) {
  return fc.oneof(
    fc.double().map(String),
    fc.integer().map(String),
    fc.constantFrom('1e308', '1e309', '-1e309', '4.9e-324', '1e-400', '0', '-0', '.5', '5.', '+3', '--3', '1e', 'NaN', 'Infinity', '0x10', '1_000', '١٢', '1,5'),
  );
}

/**
 * Anything a spec field might hold where a quantity or an impedance belongs: number and unit texts,
 * impedance-like texts, free strings up to `maxLength`, arbitrary values up to `maxDepth`, numbers.
 * @param {typeof import('fast-check')} fc
 * @param {{ maxLength: number, maxDepth: number }} size
 */
export function quantityLikes(fc, size) {
  const numberText = numberTexts(fc);
  return fc.oneof(
    fc.tuple(numberText, fc.constantFrom('', ' ', '  ', '\t'), fc.constantFrom(...UNIT_WORDS)).map(([n, s, u]) => `${n}${s}${u}`),
    fc.tuple(numberText, fc.constantFrom('+', '-', ' + ', ' - '), fc.constantFrom('j', 'j ', ''), numberText, fc.constantFrom('', 'j', ' Ω', ' ohm')).map(([a, s, j, b, t]) => `${a}${s}${j}${b}${t}`),
    fc.string({ maxLength: size.maxLength }),
    fc.string({ unit: 'binary', maxLength: size.maxLength }),
    fc.anything({ maxDepth: size.maxDepth }),
    fc.double(),
  );
}

/**
 * Stub-layout inputs, dimensions drawn in µm and returned in metres. The pad always fits the stub
 * and the via row the pad pitch, so every input is valid.
 * @param {typeof import('fast-check')} fc
 * @param {{ maxWidthUm: number, maxLengthUm: number, maxLeadUm: number, drillUm: [number, number], ringUm: [number, number] }} range
 */
export function layoutInputs(fc, range) {
  const um = 1e-6;
  return fc
    .record({
      seriesWidth: fc.double({ min: 1, max: range.maxWidthUm, noNaN: true }),
      seriesLength: fc.oneof(fc.constant(0), fc.double({ min: 0, max: range.maxLengthUm, noNaN: true })),
      leadLength: fc.oneof(fc.constant(0), fc.double({ min: 0, max: range.maxLeadUm, noNaN: true })),
      stubWidth: fc.double({ min: 1, max: range.maxWidthUm, noNaN: true }),
      stubLength: fc.oneof(fc.constant(0), fc.double({ min: 0, max: 1e-3, noNaN: true }), fc.double({ min: 0, max: range.maxLengthUm, noNaN: true })),
      sides: fc.constantFrom(['left'], ['right'], ['left', 'right']),
      short: fc.boolean(),
      drill: fc.double({ min: range.drillUm[0], max: range.drillUm[1], noNaN: true }),
      ring: fc.double({ min: range.ringUm[0], max: range.ringUm[1], noNaN: true }),
      count: fc.integer({ min: 1, max: 8 }),
    })
    .map((r) => {
      const pad = r.drill + 2 * r.ring;
      const stubWidth = Math.max(r.stubWidth, pad);
      const pitch = pad + 10;
      const count = Math.max(1, Math.min(r.count, Math.floor(stubWidth / pitch) + 1));
      return {
        seriesWidth: r.seriesWidth * um,
        seriesLength: r.seriesLength * um,
        leadLength: r.leadLength * um,
        stubWidth: stubWidth * um,
        stubLength: r.stubLength * um,
        stubSides: r.sides,
        termination: r.short ? 'short' : 'open',
        ...(r.short ? { via: { drill: r.drill * um, pad: pad * um, count, pitch: pitch * um } } : {}),
      };
    });
}
