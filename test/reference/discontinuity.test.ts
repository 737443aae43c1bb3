// Discontinuity models: open end (Kirschning–Jansen–Koster 1981, Hammerstad–Bekkadal 1975),
// T-junction (Hammerstad 1981), via ground (Goldfarb–Pucel 1991), mitred bend (Douville–James 1978).
import { describe, expect, it } from 'vitest';
import type { LineProperties, Substrate } from '../../src/seams.js';
import { analyseMicrostrip, synthesizeMicrostrip } from '../../src/physical/microstrip/index.js';
import {
  mitreDouvilleJames,
  openEndExtensionHB,
  openEndExtensionKJK,
  tJunctionHammerstad,
  viaInductanceGoldfarbPucel,
  viaResistance,
} from '../../src/physical/discontinuities/index.js';
import { substrate } from '../helpers/substrate.js';

/** A line record carrying exactly the table's u and εe (the open-end formulas read width and epsEff). */
const lineWith = (width: number, epsEff: number): LineProperties => ({
  width, frequency: 1e9, z0: 50, z0Static: 50, epsEff, epsEffStatic: epsEff, wavelength: 0.1,
  alphaConductor: 0, alphaDielectric: 0, beta: 1, warnings: [],
});
const expectNear = (actual: number, printed: number, unit: number): void => {
  expect(Math.abs(actual - printed)).toBeLessThanOrEqual(unit);
};

describe('open-end length extension', () => {
  // Kirschning, Jansen & Koster, Electronics Letters 17(3) 1981 (formula [M], coefficients [R]) and
  // Hammerstad & Bekkadal, Microstrip Handbook 1975 [M]; check values physics.md §4.1 [C].
  const table: ReadonlyArray<readonly [number, number, number, number, number, number]> = [
    // εr, h (m), u, εe, Δl/h HB, Δl/h KJK
    [10.0, 1e-3, 1.0, 6.7053, 0.3144, 0.3167],
    [2.2, 1e-3, 1.0, 1.7723, 0.3959, 0.3883],
    [9.8, 1e-3, 0.5, 6.2766, 0.2646, 0.2653],
    [4.4, 1e-3, 2.0, 3.3439, 0.3934, 0.4065],
    [4.4, 1e-3, 10, 3.8639, 0.4521, 0.5215],
    [10, 1e-3, 0.1, 6.0403, 0.1827, 0.1611],
    [4.4, 1.6e-3, 1.9138, 3.3313, 0.3907, 0.4025],
    [9.8, 0.635e-3, 0.9711, 6.563, 0.3127, 0.3151],
    [3.66, 0.508e-3, 2.1894, 2.858, 0.4107, 0.428],
    [4.4, 1.6e-3, 0.4406, 3.0339, 0.281, 0.2777],
    [4.4, 1.6e-3, 5.2327, 3.6519, 0.4371, 0.4904],
  ];
  for (const [er, h, u, ee, hb, kjk] of table) {
    it(`εr ${er}, u ${u}, εe ${ee}`, () => {
      const s = substrate(er, h);
      const line = lineWith(u * h, ee);
      expectNear(openEndExtensionHB(line, s) / h, hb, 1e-4); // HB 1975 via physics.md §4.1 [C]
      expectNear(openEndExtensionKJK(line, s) / h, kjk, 1e-4); // KJK 1981 via physics.md §4.1 [C]
    });
  }
  it('absolute Δl of the 50 Ω lines: 0.644 mm (FR-4), 0.200 mm (alumina), 0.217 mm (εr 3.66)', () => {
    // physics.md §4.1 [C], KJK 1981.
    expect(openEndExtensionKJK(lineWith(1.9138 * 1.6e-3, 3.3313), substrate(4.4, 1.6e-3)) * 1e3).toBeCloseTo(0.644, 3);
    expect(openEndExtensionHB(lineWith(1.9138 * 1.6e-3, 3.3313), substrate(4.4, 1.6e-3)) * 1e3).toBeCloseTo(0.625, 3);
    expect(openEndExtensionKJK(lineWith(0.9711 * 0.635e-3, 6.563), substrate(9.8, 0.635e-3)) * 1e3).toBeCloseTo(0.2, 3);
    expect(openEndExtensionKJK(lineWith(2.1894 * 0.508e-3, 2.858), substrate(3.66, 0.508e-3)) * 1e3).toBeCloseTo(0.217, 3);
  });
  it('uses εe at the line frequency: end-to-end vector Δl = 0.6411 mm', () => {
    // physics.md §5 end-to-end vector [C]: FR-4, t 35 µm, w 3.0169 mm, 2.4 GHz, KJK with εe(f).
    const s = substrate(4.4, 1.6e-3, 35e-6);
    const line = analyseMicrostrip(3.0169e-3, s, 2.4e9);
    expect(openEndExtensionKJK(line, s) * 1e3).toBeCloseTo(0.6411, 4);
  });
  it('trade fact: Δl/h is within 0.3–0.45 for common FR-4 lines', () => {
    // common practice, no source. Checked on FR-4 (εr 4.4, h 1.6 mm) for w/h 0.75–3, where it holds
    // for both formulas; at w/h 0.5 the models give ≈ 0.29 (physics.md §4.1 table: 0.28 at u 0.44).
    const s = substrate(4.4, 1.6e-3, 35e-6);
    for (const u of [0.75, 1, 1.5, 2, 2.5, 3]) {
      const line = analyseMicrostrip(u * 1.6e-3, s, 2.4e9);
      for (const dl of [openEndExtensionKJK(line, s), openEndExtensionHB(line, s)]) {
        expect(dl / 1.6e-3).toBeGreaterThan(0.3);
        expect(dl / 1.6e-3).toBeLessThan(0.45);
      }
    }
  });
});

describe('T-junction, Hammerstad 1981', () => {
  // Hammerstad, "Computer-aided design of microstrip couplers with accurate discontinuity models",
  // MTT-S Digest 1981; coefficients [R] from an open-source simulator, check values physics.md §4.2 [C]
  // (FR-4 εr 4.4, h 1.6 mm, t 0, widths from the static HJ synthesis, JK/KJ dispersion).
  const fr4 = substrate(4.4, 1.6e-3);
  const widthFor = (z0: number): number => synthesizeMicrostrip(z0, fr4, 1e3).width;
  const table: ReadonlyArray<{ zm: number; zs: number; f: number; Za: number; Z2: number; da: number; d2: number; n2: number; bt: number }> = [
    { zm: 50, zs: 50, f: 1.0e9, Za: 49.98, Z2: 49.98, da: 0.358e-3, d2: 2.024e-3, n2: 0.99757, bt: -0.183e-3 },
    { zm: 50, zs: 50, f: 2.4e9, Za: 50.02, Z2: 50.02, da: 0.334e-3, d2: 1.962e-3, n2: 0.9857, bt: -0.308e-3 },
    { zm: 50, zs: 50, f: 5.8e9, Za: 50.71, Z2: 50.71, da: 0.204e-3, d2: 1.632e-3, n2: 0.90615, bt: 0.487e-3 },
    { zm: 50, zs: 100, f: 2.4e9, Za: 50.02, Z2: 100.02, da: 0.091e-3, d2: 1.681e-3, n2: 0.99073, bt: -0.67e-3 },
    { zm: 50, zs: 35, f: 2.4e9, Za: 50.02, Z2: 35.03, da: 0.64e-3, d2: 2.585e-3, n2: 0.97905, bt: 1.101e-3 },
  ];
  for (const c of table) {
    it(`${c.zm} Ω main / ${c.zs} Ω stub at ${c.f / 1e9} GHz`, () => {
      const main = analyseMicrostrip(widthFor(c.zm), fr4, c.f);
      const stub = analyseMicrostrip(widthFor(c.zs), fr4, c.f);
      expect(main.z0).toBeCloseTo(c.Za, 2); // physics.md §4.2 [C]
      expect(stub.z0).toBeCloseTo(c.Z2, 2); // physics.md §4.2 [C]
      const t = tJunctionHammerstad(main, main, stub, fr4, c.f);
      expectNear(t.da * 1e3, c.da * 1e3, 1e-3); // Hammerstad 1981 via physics.md §4.2 [C]
      expect(t.db).toBe(t.da); // symmetric main arms
      expectNear(t.d2 * 1e3, c.d2 * 1e3, 1e-3); // physics.md §4.2 [C]
      expectNear(t.n2a, c.n2, 1e-5); // physics.md §4.2 [C]
      expectNear(t.susceptance * 1e3, c.bt * 1e3, 1e-3); // physics.md §4.2 [C]
      expect(t.warnings).toEqual([]);
    });
  }
  it('alumina 50/50 Ω at 10 GHz', () => {
    // physics.md §4.2 [C]: εr 9.8, h 0.635 mm: d_a 0.080 mm, d2 0.512 mm, n² 0.9595, B_T −0.107 mS.
    const al = substrate(9.8, 0.635e-3);
    const line = analyseMicrostrip(synthesizeMicrostrip(50, al, 1e3).width, al, 10e9);
    const t = tJunctionHammerstad(line, line, line, al, 10e9);
    expectNear(t.da * 1e3, 0.08, 1e-3);
    expectNear(t.d2 * 1e3, 0.512, 1e-3);
    expectNear(t.n2a, 0.9595, 1e-4);
    expectNear(t.susceptance * 1e3, -0.107, 1e-3);
  });
  it('end-to-end vector tee, t 35 µm: d_a 0.3353 mm, d2 1.9706 mm, n² 0.98570, B_T −0.3078 mS', () => {
    // physics.md §5 end-to-end layout vector [C]: FR-4, 50/50 Ω, w 3.0169 mm, 2.4 GHz.
    const s = substrate(4.4, 1.6e-3, 35e-6);
    const line = analyseMicrostrip(3.0169e-3, s, 2.4e9);
    const t = tJunctionHammerstad(line, line, line, s, 2.4e9);
    expectNear(t.da * 1e3, 0.3353, 1e-4);
    expectNear(t.d2 * 1e3, 1.9706, 1e-4);
    expectNear(t.n2a, 0.9857, 1e-5);
    expectNear(t.susceptance * 1e3, -0.3078, 1e-4);
  });
  it('warns when an arm is above its higher-order-mode frequency or n² breaks down', () => {
    // Hammerstad 1981: f_p = 0.4·Z/h GHz·mm is the first higher-order-mode frequency (physics.md §4.2).
    const s = substrate(10, 3e-3);
    const f = 20e9; // f_p ≈ 0.4·50/3 ≈ 6.7 GHz
    const line = analyseMicrostrip(3e-3, s, f);
    const t = tJunctionHammerstad(line, line, line, s, f);
    expect(t.warnings.some((d) => d.code === 'model.out-of-range')).toBe(true);
    expect(t.n2a).toBeGreaterThan(0);
  });
});

describe('via ground, Goldfarb & Pucel 1991', () => {
  // Goldfarb & Pucel, IEEE MGWL 1(6) 1991; formula [R] (symplyphysics), check values physics.md §4.4 [C].
  const table: ReadonlyArray<readonly [number, number, number, number]> = [
    [1.6e-3, 0.3e-3, 0.5429e-9, 8.19],
    [1.6e-3, 0.4e-3, 0.4647e-9, 7.01],
    [1.6e-3, 0.8e-3, 0.2955e-9, 4.46],
    [0.635e-3, 0.3e-3, 0.1223e-9, 1.84],
    [0.508e-3, 0.3e-3, 0.0826e-9, 1.25],
    [0.254e-3, 0.2e-3, 0.0325e-9, 0.49],
    [0.1e-3, 0.1e-3, 0.0103e-9, 0.16],
  ];
  for (const [h, d, L, X] of table) {
    it(`h ${h * 1e3} mm, drill ${d * 1e3} mm → ${L * 1e9} nH`, () => {
      const l = viaInductanceGoldfarbPucel(h, d);
      expectNear(l * 1e9, L * 1e9, 1e-4); // physics.md §4.4 [C]
      expectNear(2 * Math.PI * 2.4e9 * l, X, 0.01); // X = ωL at 2.4 GHz, physics.md §4.4 [C]
    });
  }
  it('one 0.3 mm via on a 50 Ω FR-4 stub at 2.4 GHz: θ_L 9.30°, shortening 1.762 mm', () => {
    // physics.md §4.4 [C]: θ_L = atan(ωL/Zs) with Zs = 50 Ω, Δℓ = θ_L/β with λg 68.21 mm.
    const s = substrate(4.4, 1.6e-3, 35e-6);
    const line = analyseMicrostrip(3.0169e-3, s, 2.4e9);
    const theta = Math.atan((2 * Math.PI * 2.4e9 * viaInductanceGoldfarbPucel(1.6e-3, 0.3e-3)) / 50);
    expect(line.wavelength * 1e3).toBeCloseTo(68.21, 1);
    expect((theta * 180) / Math.PI).toBeCloseTo(9.3, 2);
    expect((theta / line.beta) * 1e3).toBeCloseTo(1.762, 2);
  });
  it('resistance: DC limit and √f growth', () => {
    // Goldfarb & Pucel 1991 resistance, form from memory (physics.md §4.4 [M]):
    // R = R_dc·√(1 + f/f_δ), R_dc = ρh/(π(r² − (r − t)²)), f_δ = ρ/(π μ0 t²).
    const sigma = 5.8e7;
    const h = 1.6e-3;
    const r = 0.15e-3;
    const t = 25e-6;
    const rdc = h / sigma / (Math.PI * (r * r - (r - t) ** 2));
    expect(viaResistance(h, 2 * r, t, sigma, 0)).toBeCloseTo(rdc, 12);
    const fDelta = 1 / sigma / (Math.PI * 4e-7 * Math.PI * t * t);
    expect(viaResistance(h, 2 * r, t, sigma, fDelta) / rdc).toBeCloseTo(Math.SQRT2, 10);
    // High frequency: R ∝ √f (quadrupling f doubles R to within 1 %)
    expect(viaResistance(h, 2 * r, t, sigma, 400e9) / viaResistance(h, 2 * r, t, sigma, 100e9)).toBeCloseTo(2, 2);
  });
});

describe('mitred bend, Douville & James 1978', () => {
  // Douville & James, T-MTT 26(3) 1978 (formula [M]); geometry table physics.md §4.3 [C].
  const table: ReadonlyArray<readonly [number, number, number]> = [
    [0.25, 0.9838, 1.968],
    [0.5, 0.851, 1.702],
    [1.0, 0.6885, 1.377],
    [1.9138, 0.5691, 1.138],
    [3.0, 0.5313, 1.063],
  ];
  for (const [u, M, aw] of table) {
    it(`w/h ${u}: M ${M * 100} %, a/w ${aw}`, () => {
      const h = 1e-3;
      const m = mitreDouvilleJames(u * h, h);
      expectNear(m.fraction, M, 1e-4); // physics.md §4.3 [C]
      expectNear(m.edgeCut / (u * h), aw, 1e-3); // physics.md §4.3 [C]
      expect(m.warnings).toEqual([]);
    });
  }
  it('below w/h 0.25 it warns and keeps the formula value', () => {
    // Validity w/h ≥ 0.25 (physics.md §4.3 [M]).
    const m = mitreDouvilleJames(0.1e-3, 1e-3);
    expect(m.warnings.length).toBeGreaterThan(0);
    expect(m.fraction).toBeCloseTo((52 + 65 * Math.exp(-0.135)) / 100, 12);
  });
});
