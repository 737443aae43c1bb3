// Two-port and line relations: physical identities every ideal network must satisfy.
// Sources: Pozar, Microwave Engineering, 3rd ed. (2005): §2.3 (λ/2 and λ/4 lines, eq. 2.44–2.47),
// §2.5 (quarter-wave transformer), §2.7 (lossy line), §4.3 (unitary S of a lossless network,
// symmetric S of a reciprocal one), §4.4 Table 4.1 (ABCD) and Table 4.2 (ABCD → S).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { abs, add, complex, conj, div, exp, mul, neg, scale, sub, tanh, type Complex } from '../../src/math/complex.js';
import {
  idealInputImpedance,
  idealOpenStubAdmittance,
  idealShortStubAdmittance,
  inputImpedance,
  LOSSLESS_PER_WAVELENGTH,
  openStubAdmittance,
  shortStubAdmittance,
} from '../../src/math/lines.js';
import {
  abcdDeterminant,
  abcdToS,
  admittanceOf,
  cascade,
  IDENTITY_ABCD,
  inputImpedanceOf,
  lineAbcd,
  s11Of,
  seriesImpedanceAbcd,
  shuntAdmittanceAbcd,
  transformerAbcd,
  type Abcd,
} from '../../src/math/network.js';

const SEED = 20261202;
const close = (a: Complex, b: Complex, tol: number) => abs(sub(a, b)) <= tol * Math.max(1, abs(b));

const passiveLoad = fc
  .record({ r: fc.double({ min: 0.01, max: 1000, noNaN: true }), x: fc.double({ min: -1000, max: 1000, noNaN: true }) })
  .map(({ r, x }) => complex(r, x));
const z0 = fc.double({ min: 5, max: 200, noNaN: true });
const wl = fc.double({ min: 0, max: 2, noNaN: true });
/** Lossy line: attenuation up to 3 Np per unit length, phase constant 2π per unit length. */
const lossyGamma = fc.double({ min: 0, max: 3, noNaN: true }).map((alpha) => complex(alpha, 2 * Math.PI));

describe('ideal stubs and lines (Pozar 2005 §2.3)', () => {
  it('a λ/2 open stub and a λ/4 short stub are transparent in shunt', () => {
    // Pozar 2005 §2.3: Zin = ZL for a λ/2 line (open stays open); a shorted λ/4 line is an open circuit.
    expect(abs(idealOpenStubAdmittance(50, 0.5))).toBeLessThan(1e-15);
    expect(abs(idealShortStubAdmittance(50, 0.25))).toBeLessThan(1e-15);
    fc.assert(
      fc.property(passiveLoad, z0, z0, (zl, zLine, zStub) => {
        for (const y of [idealOpenStubAdmittance(zStub, 0.5), idealShortStubAdmittance(zStub, 0.25)]) {
          const zin = inputImpedanceOf(cascade(shuntAdmittanceAbcd(y), lineAbcd(zLine, LOSSLESS_PER_WAVELENGTH, 0.5)), zl);
          expect(close(zin, zl, 1e-12)).toBe(true);
        }
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('open and short stubs follow j tan βl / Z0 and −j cot βl / Z0', () => {
    // Pozar 2005 eq. 2.45 and 2.47 (written as admittances).
    fc.assert(
      fc.property(z0, fc.double({ min: 0.01, max: 0.49, noNaN: true }), (z, l) => {
        const bl = 2 * Math.PI * l;
        expect(close(idealOpenStubAdmittance(z, l), complex(0, Math.tan(bl) / z), 1e-12)).toBe(true);
        expect(close(idealShortStubAdmittance(z, l), complex(0, -1 / (Math.tan(bl) * z)), 1e-12)).toBe(true);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('quarter-wave transformer: Zin = Z0² / ZL', () => {
    // Pozar 2005 §2.5, eq. 2.60 (Zin = Z1²/RL generalised to a complex load by eq. 2.44 at βl = π/2).
    fc.assert(
      fc.property(passiveLoad, z0, (zl, z) => {
        // cos(2π·0.25) is 6e-17, not 0: the relative error is about Z0·6e-17/|ZL| (≤ 1.2e-12 here).
        expect(close(idealInputImpedance(zl, z, 0.25), div(complex(z * z), zl), 1e-10)).toBe(true);
        expect(close(idealInputImpedance(zl, z, 0.5), zl, 1e-10)).toBe(true);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('an open load (infinite impedance) is the open stub', () => {
    // Pozar 2005 eq. 2.47: Zin = −j Z0 cot βl for an open-circuited line.
    const zin = inputImpedance(complex(Infinity, 0), 50, LOSSLESS_PER_WAVELENGTH, 0.1);
    expect(close(zin, complex(0, -50 / Math.tan(0.2 * Math.PI)), 1e-12)).toBe(true);
    expect(close(inputImpedanceOf(lineAbcd(50, LOSSLESS_PER_WAVELENGTH, 0.1), complex(Infinity, 0)), zin, 1e-14)).toBe(true);
  });
});

describe('lossy lines (Pozar 2005 §2.7)', () => {
  it('cosh/sinh form equals the tanh form Zin = Z0 (ZL + Z0 tanh γl)/(Z0 + ZL tanh γl) and the ABCD form', () => {
    // Pozar 2005 eq. 2.91; ABCD of a line, Table 4.1.
    fc.assert(
      fc.property(passiveLoad, z0, lossyGamma, fc.double({ min: 0, max: 1.2, noNaN: true }), (zl, z, g, l) => {
        const t = tanh(scale(g, l));
        const zc = complex(z);
        const byTanh = mul(zc, div(add(zl, mul(zc, t)), add(zc, mul(zl, t))));
        fc.pre(Number.isFinite(byTanh.re) && Number.isFinite(byTanh.im));
        expect(close(inputImpedance(zl, z, g, l), byTanh, 1e-9)).toBe(true);
        expect(close(inputImpedanceOf(lineAbcd(z, g, l), zl), byTanh, 1e-9)).toBe(true);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('lossy stubs: open Y = tanh(γl)/Z0, short Y = 1/(Z0 tanh γl)', () => {
    // Pozar 2005 §2.7, ZL → ∞ and ZL = 0 in eq. 2.91.
    fc.assert(
      fc.property(z0, lossyGamma, fc.double({ min: 0.01, max: 1.2, noNaN: true }), (z, g, l) => {
        const t = tanh(scale(g, l));
        fc.pre(abs(t) > 1e-6 && abs(t) < 1e6);
        expect(close(openStubAdmittance(z, g, l), scale(t, 1 / z), 1e-9)).toBe(true);
        expect(close(shortStubAdmittance(z, g, l), div(complex(1 / z), t), 1e-9)).toBe(true);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('a matched lossy line has S11 = 0 and S21 = e^(−γl)', () => {
    // Pozar 2005 §4.3/§2.7: a matched line only delays and attenuates the wave.
    fc.assert(
      fc.property(z0, lossyGamma, wl, (z, g, l) => {
        const s = abcdToS(lineAbcd(z, g, l), z);
        expect(abs(s.s11)).toBeLessThan(1e-12);
        expect(abs(s.s22)).toBeLessThan(1e-12);
        expect(close(s.s21, exp(neg(scale(g, l))), 1e-12)).toBe(true);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });
});

/** A random ladder of lossless elements: lines, shunt and series reactances, ideal transformers. */
const losslessStage: fc.Arbitrary<Abcd> = fc.oneof(
  fc.tuple(z0, wl).map(([z, l]) => lineAbcd(z, LOSSLESS_PER_WAVELENGTH, l)),
  fc.double({ min: -0.1, max: 0.1, noNaN: true }).map((b) => shuntAdmittanceAbcd(complex(0, b))),
  fc.double({ min: -500, max: 500, noNaN: true }).map((x) => seriesImpedanceAbcd(complex(0, x))),
  fc.double({ min: 0.2, max: 5, noNaN: true }).map((n) => transformerAbcd(n)),
);
const lossyStage: fc.Arbitrary<Abcd> = fc.oneof(
  fc.tuple(z0, lossyGamma, wl).map(([z, g, l]) => lineAbcd(z, g, l)),
  passiveLoad.map((z) => seriesImpedanceAbcd(z)),
  passiveLoad.map((z) => shuntAdmittanceAbcd(admittanceOf(z))),
  fc.double({ min: 0.2, max: 5, noNaN: true }).map((n) => transformerAbcd(n)),
);

describe('network identities (Pozar 2005 §4.3–4.4)', () => {
  it('lossless networks have a unitary S matrix', () => {
    // Pozar 2005 §4.3: [S]^H [S] = [U] for a lossless network.
    fc.assert(
      fc.property(fc.array(losslessStage, { minLength: 1, maxLength: 6 }), fc.double({ min: 10, max: 100, noNaN: true }), (stages, zRef) => {
        const { s11, s12, s21, s22 } = abcdToS(cascade(...stages), zRef);
        const sq = (c: Complex) => c.re * c.re + c.im * c.im;
        expect(Math.abs(sq(s11) + sq(s21) - 1)).toBeLessThan(1e-9);
        expect(Math.abs(sq(s12) + sq(s22) - 1)).toBeLessThan(1e-9);
        expect(abs(add(mul(conj(s11), s12), mul(conj(s21), s22)))).toBeLessThan(1e-9);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('reciprocal networks (lossy too) have AD − BC = 1 and S12 = S21', () => {
    // Pozar 2005 §4.4: AD − BC = 1 for reciprocal two-ports; §4.3: reciprocal → symmetric [S].
    fc.assert(
      fc.property(fc.array(lossyStage, { minLength: 1, maxLength: 5 }), (stages) => {
        const m = cascade(...stages);
        const det = abcdDeterminant(m);
        const size = Math.max(1, ...m.map((x) => abs(x)));
        expect(abs(sub(det, complex(1)))).toBeLessThan(1e-12 * size * size);
        const s = abcdToS(m, 50);
        expect(abs(sub(s.s12, s.s21))).toBeLessThan(1e-9);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('cascade: empty is the identity; it is associative; element ABCDs act as expected', () => {
    // Pozar 2005 Table 4.1 (series Z, shunt Y, ideal transformer N:1 gives Zin = N² ZL).
    expect(cascade()).toEqual(IDENTITY_ABCD);
    const zl = complex(30, -40);
    expect(close(inputImpedanceOf(seriesImpedanceAbcd(complex(5, 7)), zl), complex(35, -33), 1e-15)).toBe(true);
    expect(close(inputImpedanceOf(shuntAdmittanceAbcd(admittanceOf(zl)), zl), scale(zl, 0.5), 1e-15)).toBe(true);
    expect(close(inputImpedanceOf(transformerAbcd(3), zl), scale(zl, 9), 1e-15)).toBe(true);
    fc.assert(
      fc.property(lossyStage, lossyStage, lossyStage, (a, b, c) => {
        const left = cascade(cascade(a, b), c);
        const right = cascade(a, cascade(b, c));
        const size = Math.max(1, ...left.map((x) => abs(x)));
        left.forEach((x, i) => expect(abs(sub(x, right[i]!))).toBeLessThan(1e-12 * size));
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('s11Of is the reflection coefficient; an open circuit reflects +1', () => {
    // Pozar 2005 eq. 2.35: Γ = (ZL − Z0)/(ZL + Z0).
    expect(close(s11Of(complex(60, -80), 50), div(complex(10, -80), complex(110, -80)), 1e-15)).toBe(true);
    expect(s11Of(complex(Infinity, 0), 50)).toEqual(complex(1));
    expect(abs(s11Of(complex(50), 50))).toBe(0);
  });
});
