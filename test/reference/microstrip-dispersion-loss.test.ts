// Dispersion (Kirschning & Jansen 1982 εe(f), Jansen & Kirschning 1983 Z0(f)) and losses
// (Hammerstad–Bekkadal conductor loss with Ki and Kr, filling-factor dielectric loss).
import { describe, expect, it } from 'vitest';
import type { Substrate } from '../../src/seams.js';
import {
  analyseMicrostrip,
  propagationConstant,
  roughnessFactorHammerstad,
  skinDepth,
  surfaceResistance,
  currentDistributionFactor,
  epsEffKJ,
  z0JK,
  synthesizeMicrostrip,
} from '../../src/physical/microstrip/index.js';
import { substrate as smoothSubstrate } from '../helpers/substrate.js';

const RHO_CU = 1.72e-8; // ρ(Cu) used by the physics.md §3.3 tables
const substrate = (er: number, height: number, copper = 0, extra: Partial<Substrate> = {}): Substrate =>
  smoothSubstrate(er, height, copper, { conductivity: 1 / RHO_CU, ...extra });
const DB_PER_NP = 20 / Math.LN10; // 8.686 dB per neper
/** |actual − printed| within one unit of the printed table's last digit (rounding boundaries). */
const expectNear = (actual: number, printed: number, unit: number): void => {
  expect(Math.abs(actual - printed)).toBeLessThanOrEqual(unit);
};

describe('Kirschning & Jansen 1982 εe(f) and Jansen & Kirschning 1983 Z0(f)', () => {
  // Kirschning & Jansen, Electronics Letters 18(6) 1982; Jansen & Kirschning, AEÜ 37 1983.
  // physics.md §2.4 check values [C, x-checked against scikit-rf]; h = 1 mm so f[GHz] = fn.
  const table: ReadonlyArray<readonly [number, number, number, number, number, number, number]> = [
    [2.2, 3.0, 2, 1.87822, 1.88308, 50.9172, 50.9076],
    [2.2, 3.0, 10, 1.87822, 1.91898, 50.9172, 51.4706],
    [2.2, 3.0, 20, 1.87822, 1.97299, 50.9172, 53.6214],
    [4.4, 2.0, 2, 3.34394, 3.36529, 48.6858, 48.6651],
    [4.4, 2.0, 10, 3.34394, 3.51826, 48.6858, 49.5372],
    [4.4, 2.0, 20, 3.34394, 3.72744, 48.6858, 52.7058],
    [9.8, 1.0, 2, 6.57903, 6.65379, 49.2888, 49.2497],
    [9.8, 1.0, 10, 6.57903, 7.19425, 49.2888, 50.9092],
    [9.8, 1.0, 20, 6.57903, 7.88779, 49.2888, 56.9176],
    [9.8, 0.2, 10, 6.04059, 6.38204, 90.0227, 91.9777],
  ];
  for (const [er, u, fn, ee0, eef, z00, z0f] of table) {
    it(`εr ${er}, u ${u}, fn ${fn}`, () => {
      const line = analyseMicrostrip(u * 1e-3, substrate(er, 1e-3), fn * 1e9);
      expect(line.epsEffStatic).toBeCloseTo(ee0, 5); // HJ 1980, physics.md §2.4 [C]
      expect(line.epsEff).toBeCloseTo(eef, 5); // KJ 1982, physics.md §2.4 [C]
      expect(line.z0Static).toBeCloseTo(z00, 4); // HJ 1980, physics.md §2.4 [C]
      expect(line.z0).toBeCloseTo(z0f, 4); // JK 1983, physics.md §2.4 [C]
    });
  }

  it('JK 1983 R8 has (fn/18.365)^2.745 inside the exponential', () => {
    // Jansen & Kirschning 1983 as restated in physics.md §2.2 [R]. Moving the factor outside the exp
    // (a known copying error) changes Z0(f) at fn 20 on εr 9.8 by far more than 1e-4 relative;
    // the check value 56.9176 Ω (physics.md §2.4 [C]) is met only with the paper's bracket.
    const z = z0JK(1.0, 9.8, 6.57903, epsEffKJ(1.0, 9.8, 6.57903, 20), 49.2888, 20);
    expect(z).toBeCloseTo(56.9176, 2);
  });

  // 50 Ω on FR-4 (εr 4.4, h 1.6 mm, t 0, u 1.9138 = the static HJ synthesis): physics.md §2.4 [C].
  const fr4Width = synthesizeMicrostrip(50, substrate(4.4, 1.6e-3), 1e3).width;
  const fr4: ReadonlyArray<readonly [number, number, number, number]> = [
    [1e9, 3.3465, 49.98, 163.88e-3],
    [2.4e9, 3.3814, 50.022, 67.93e-3],
    [5.8e9, 3.4872, 50.707, 27.68e-3],
    [10e9, 3.6305, 52.619, 15.73e-3],
  ];
  for (const [f, ee, z0, lg] of fr4) {
    it(`50 Ω FR-4 line at ${f / 1e9} GHz`, () => {
      const line = analyseMicrostrip(fr4Width, substrate(4.4, 1.6e-3), f);
      expect(line.epsEff).toBeCloseTo(ee, 4); // KJ 1982, physics.md §2.4 [C]
      expect(line.z0).toBeCloseTo(z0, 2); // JK 1983, physics.md §2.4 [C]
      expect(line.wavelength * 1e3).toBeCloseTo(lg * 1e3, 1); // λg = λ0/√εe(f), physics.md §2.4 [C]
    });
  }

  it('alumina 50 Ω at 10 and 30 GHz; hydrocarbon-ceramic laminate at 10 GHz', () => {
    // physics.md §2.4 [C]: εr 9.8, h 0.635 mm, u 0.9711 → 6.9074 / 50.443 Ω (10 GHz), 7.8037 / 57.050 Ω (30 GHz);
    // εr 3.66, h 0.508 mm, u 2.1894 at 10 GHz → 2.9093 / 50.092 Ω.
    const al = substrate(9.8, 0.635e-3);
    const a10 = analyseMicrostrip(0.9711 * 0.635e-3, al, 10e9);
    expect(a10.epsEff).toBeCloseTo(6.9074, 3);
    expect(a10.z0).toBeCloseTo(50.443, 2);
    const a30 = analyseMicrostrip(0.9711 * 0.635e-3, al, 30e9);
    expect(a30.epsEff).toBeCloseTo(7.8037, 3);
    expect(a30.z0).toBeCloseTo(57.05, 2);
    const hc = analyseMicrostrip(2.1894 * 0.508e-3, substrate(3.66, 0.508e-3), 10e9);
    expect(hc.epsEff).toBeCloseTo(2.9093, 3);
    expect(hc.z0).toBeCloseTo(50.092, 2);
  });

  it('end-to-end vector: FR-4, t 35 µm, w 3.0169 mm at 2.4 GHz (u = w/h fed to KJ/JK)', () => {
    // physics.md §5 end-to-end layout vector [C]: εe0 3.3025, εe(2.4 GHz) 3.3534, Z0 50.022 Ω, λg 68.213 mm.
    const line = analyseMicrostrip(3.0169e-3, substrate(4.4, 1.6e-3, 35e-6), 2.4e9);
    expect(line.epsEffStatic).toBeCloseTo(3.3025, 4);
    expect(line.epsEff).toBeCloseTo(3.3534, 4);
    expect(line.z0).toBeCloseTo(50.022, 3);
    expect(line.wavelength * 1e3).toBeCloseTo(68.213, 2);
  });
});

describe('losses', () => {
  // Hammerstad–Bekkadal 1975 conductor loss with Ki and Hammerstad Kr; physics.md §3.3 Kr table [C].
  const krTable: ReadonlyArray<readonly [number, number, number, number, number, number]> = [
    [1e9, 2.087e-6, 8.24e-3, 1.051, 1.198, 1.579],
    [2.4e9, 1.347e-6, 12.77e-3, 1.121, 1.418, 1.8],
    [5.8e9, 0.867e-6, 19.85e-3, 1.278, 1.687, 1.915],
    [10e9, 0.66e-6, 26.06e-3, 1.431, 1.808, 1.951],
  ];
  for (const [f, delta, rs, k05, k1, k2] of krTable) {
    it(`skin depth, Rs and Kr at ${f / 1e9} GHz`, () => {
      const d = skinDepth(f, 1 / RHO_CU);
      expect(d * 1e6).toBeCloseTo(delta * 1e6, 3); // physics.md §3.3 [C]
      expect(surfaceResistance(f, 1 / RHO_CU) * 1e3).toBeCloseTo(rs * 1e3, 2); // physics.md §3.3 [C]
      expectNear(roughnessFactorHammerstad(0.5e-6, d), k05, 1e-3); // physics.md §3.3 [C]
      expectNear(roughnessFactorHammerstad(1e-6, d), k1, 1e-3); // physics.md §3.3 [C]
      expectNear(roughnessFactorHammerstad(2e-6, d), k2, 1e-3); // physics.md §3.3 [C]
    });
  }
  it('Kr at Δ = δ is 1.6051; Kr saturates at 2', () => {
    // Hammerstad roughness factor, physics.md §3.3 [C] and §3.1 [M].
    expect(roughnessFactorHammerstad(1e-6, 1e-6)).toBeCloseTo(1.6051, 4);
    expect(roughnessFactorHammerstad(1e-3, 1e-6)).toBeCloseTo(2, 6);
    expect(roughnessFactorHammerstad(0, 1e-6)).toBe(1);
  });

  // 50 Ω FR-4 line (εr 4.4, h 1.6 mm, t 35 µm, w 3.017 mm, Ki 0.74684): physics.md §3.3 [C].
  const lossTable: ReadonlyArray<readonly [number, number, number, number]> = [
    [1e9, 0.354, 0.425, 2.985],
    [2.4e9, 0.549, 0.779, 7.164],
    [5.8e9, 0.853, 1.439, 17.31],
  ];
  for (const [f, smooth, rough, diel] of lossTable) {
    it(`FR-4 50 Ω losses at ${f / 1e9} GHz`, () => {
      const s = substrate(4.4, 1.6e-3, 35e-6, { tanDelta: 0.02 });
      const lineSmooth = analyseMicrostrip(3.017e-3, s, f);
      const lineRough = analyseMicrostrip(3.017e-3, { ...s, roughness: 1e-6 }, f);
      expect(currentDistributionFactor(lineSmooth.z0Static)).toBeCloseTo(0.74684, 4); // physics.md §3.3 [C]
      expect(lineSmooth.alphaConductor * DB_PER_NP).toBeCloseTo(smooth, 3); // physics.md §3.3 [C]
      expect(lineRough.alphaConductor * DB_PER_NP).toBeCloseTo(rough, 3); // physics.md §3.3 [C]
      expect(lineSmooth.alphaDielectric * DB_PER_NP).toBeCloseTo(diel, diel > 10 ? 2 : 3); // physics.md §3.3 [C]
    });
  }

  it('x-check at 2.4 GHz, w 3 mm, Δ 1 µm, tanδ 0.02', () => {
    // physics.md §3.3 [C, x-checked to scikit-rf]: αc = 0.0897834 Np/m, αd = 0.824354 Np/m.
    const line = analyseMicrostrip(3e-3, substrate(4.4, 1.6e-3, 35e-6, { tanDelta: 0.02, roughness: 1e-6 }), 2.4e9);
    expect(line.alphaConductor).toBeCloseTo(0.0897834, 7);
    expect(line.alphaDielectric).toBeCloseTo(0.824354, 6);
    const g = propagationConstant(line);
    expect(g.re).toBe(line.alphaConductor + line.alphaDielectric);
    expect(g.im).toBe(line.beta);
    // β = 2π/λg (definition)
    expect(line.beta * line.wavelength).toBeCloseTo(2 * Math.PI, 12);
  });

  it('hydrocarbon-ceramic laminate at 10 GHz', () => {
    // physics.md §3.3 [C]: εr 3.66, h 0.508 mm, t 35 µm, w 1.073 mm: αc smooth 3.15 dB/m, αd (tanδ 0.0037) 5.00 dB/m.
    const line = analyseMicrostrip(1.073e-3, substrate(3.66, 0.508e-3, 35e-6, { tanDelta: 0.0037 }), 10e9);
    expect(line.alphaConductor * DB_PER_NP).toBeCloseTo(3.15, 2);
    expect(line.alphaDielectric * DB_PER_NP).toBeCloseTo(5.0, 2);
  });

  it('dielectric loss is finite at εr = 1 (filling-factor guard) and zero for tanδ = 0', () => {
    // Filling-factor form is 0/0 at εr = 1 (physics.md §3.2 [R]). Its limit q = dεe/dεr lies between
    // 1/2 and 1 (HJ 1980: εe = (εr+1)/2 + (εr−1)/2·…), so αd = k0·q·tanδ/2 lies between k0·tanδ/4 and k0·tanδ/2.
    const f = 1e9;
    const line = analyseMicrostrip(1e-3, substrate(1, 1e-3, 0, { tanDelta: 0.01 }), f);
    expect(Number.isFinite(line.alphaDielectric)).toBe(true);
    const k0 = (2 * Math.PI * f) / 299_792_458;
    expect(line.alphaDielectric).toBeGreaterThan((k0 * 0.01) / 4);
    expect(line.alphaDielectric).toBeLessThanOrEqual((k0 * 0.01) / 2);
    expect(analyseMicrostrip(1e-3, substrate(4.4, 1e-3), f).alphaDielectric).toBe(0);
  });
});
