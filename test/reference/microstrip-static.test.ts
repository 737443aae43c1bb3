// Static microstrip model: Hammerstad & Jensen 1980 (zero thickness and thickness correction),
// Wheeler 1977 start value and width synthesis. Each check names its source.
import { describe, expect, it } from 'vitest';
import type { Substrate } from '../../src/seams.js';
import {
  analyseMicrostrip,
  epsEffHJ,
  staticHJ,
  synthesizeMicrostrip,
  wheelerSynthesisU,
  z01HJ,
} from '../../src/physical/microstrip/index.js';
import { substrate } from '../helpers/substrate.js';

/** 1 kHz: dispersion terms are below 1e-10 here, so analysis returns the static model. */
const STATIC_F = 1e3;
const rel = (a: number, b: number): number => Math.abs(a / b - 1);

describe('Hammerstad & Jensen 1980, zero thickness', () => {
  // Hammerstad & Jensen, "Accurate models for microstrip computer-aided design", MTT-S Digest 1980;
  // check values of physics.md §1.4 [C, x-checked against scikit-rf MLine]. h cancels: any h.
  const table: ReadonlyArray<readonly [number, number, number, number]> = [
    [0.1, 1.0, 262.758, 1.0],
    [1.0, 1.0, 126.424, 1.0],
    [10, 1.0, 29.021, 1.0],
    [0.1, 2.2, 202.685, 1.68062],
    [1.0, 2.2, 94.963, 1.77235],
    [3.0828, 2.2, 50.0, 1.8813],
    [0.5, 4.4, 95.453, 3.04991],
    [1.0, 4.4, 71.031, 3.16782],
    [2.0, 4.4, 48.686, 3.34394],
    [5.0, 4.4, 25.888, 3.63656],
    [10, 4.4, 14.764, 3.86389],
    [0.1, 9.8, 107.914, 5.92869],
    [1.0, 9.8, 49.289, 6.57903],
    [2.0, 9.8, 33.569, 7.03361],
    [1.0, 10.0, 48.823, 6.70526],
  ];
  for (const [u, er, z0, ee] of table) {
    it(`u ${u}, εr ${er}: Z0 ${z0} Ω, εe ${ee}`, () => {
      const h = 0.8e-3;
      const line = analyseMicrostrip(u * h, substrate(er, h), STATIC_F);
      expect(line.z0Static).toBeCloseTo(z0, 3); // HJ 1980 via physics.md §1.4 [C]
      expect(line.epsEffStatic).toBeCloseTo(ee, 4); // HJ 1980 via physics.md §1.4 [C]
    });
  }

  it('copper = 0 gives exactly the zero-thickness formulas', () => {
    // HJ 1980 thickness correction reduces to the zero-thickness model at t = 0; physics.md §1.2 [R]
    // (scikit-rf tests exactly that).
    for (const [u, er] of [[0.3, 2.2], [1.7, 4.4], [6, 10.2]] as const) {
      const s = staticHJ(u, 0, er);
      expect(s.epsEff).toBe(epsEffHJ(u, er));
      expect(s.z0).toBe(z01HJ(u) / Math.sqrt(epsEffHJ(u, er)));
      expect(s.ur).toBe(u);
    }
  });
});

describe('Hammerstad & Jensen 1980, strip-thickness correction', () => {
  // HJ 1980 with t; u = 1, εr = 4.4, h = 1 mm. physics.md §1.4 [C, x-checked against scikit-rf].
  const table: ReadonlyArray<readonly [number, number, number, number]> = [
    [17.5e-6, 70.241, 3.13852, 1.02336e-3],
    [35e-6, 69.636, 3.11656, 1.04168e-3],
    [70e-6, 68.619, 3.08059, 1.0733e-3],
  ];
  for (const [t, z0, ee, weff] of table) {
    it(`t ${t * 1e6} µm: Z0 ${z0} Ω, εe ${ee}, w_eff ${weff * 1e3} mm`, () => {
      const h = 1e-3;
      const line = analyseMicrostrip(1e-3, substrate(4.4, h, t), STATIC_F);
      // within one unit of the last printed digit (68.6185 sits on a rounding boundary)
      expect(Math.abs(line.z0Static - z0)).toBeLessThanOrEqual(1e-3); // HJ 1980 via physics.md §1.4 [C]
      expect(line.epsEffStatic).toBeCloseTo(ee, 5); // HJ 1980 via physics.md §1.4 [C]
      expect(staticHJ(1, t / h, 4.4).ur * h * 1e3).toBeCloseTo(weff * 1e3, 5); // HJ 1980 via physics.md §1.4 [C]
    });
  }

  it('scikit-rf unit test case: w 3 mm, h 1.55 mm, t 35 µm, εr 4.413, 1 GHz', () => {
    // scikit-rf skrf/media/tests/test_mline.py asserts Z0 ≈ 49.142 Ω and εe ≈ 3.324, each ±1 %
    // (physics.md §1.4 [R]); that test uses HJ dispersion, ours is KJ/JK, well inside ±1 % at 1 GHz.
    const line = analyseMicrostrip(3e-3, substrate(4.413, 1.55e-3, 35e-6), 1e9);
    expect(rel(line.z0, 49.142)).toBeLessThan(0.01);
    expect(rel(line.epsEff, 3.324)).toBeLessThan(0.01);
    // Static values of this sheet's HJ implementation: 49.153 Ω / 3.3184 (physics.md §1.4 [C]).
    expect(line.z0Static).toBeCloseTo(49.153, 3);
    expect(line.epsEffStatic).toBeCloseTo(3.3184, 4);
  });
});

describe('synthesis: Wheeler 1977 start and HJ-exact width', () => {
  // Wheeler, "Transmission-line properties of a strip on a dielectric sheet on a plane", T-MTT 1977
  // (form [M]) and HJ 1980; values of physics.md §1.4, 50 Ω synthesis table [C].
  const table: ReadonlyArray<{ er: number; h: number; t: number; u0?: number; zAtU0?: number; u: number; w: number; ee: number }> = [
    { er: 4.4, h: 1.6e-3, t: 0, u0: 1.9071, zAtU0: 50.106, u: 1.9138, w: 3.062e-3, ee: 3.3313 },
    { er: 4.4, h: 1.6e-3, t: 35e-6, u0: 1.9071, u: 1.8855, w: 3.017e-3, ee: 3.3025 },
    { er: 4.5, h: 1.6e-3, t: 0, u0: 1.8758, zAtU0: 50.096, u: 1.8818, w: 3.011e-3, ee: 3.3944 },
    { er: 4.5, h: 1.6e-3, t: 35e-6, u: 1.8537, w: 2.966e-3, ee: 3.3644 },
    { er: 4.3, h: 1.6e-3, t: 35e-6, u: 1.9185, w: 3.07e-3, ee: 3.2404 },
    { er: 4.6, h: 1.6e-3, t: 35e-6, u: 1.8229, w: 2.917e-3, ee: 3.4261 },
    { er: 9.8, h: 0.635e-3, t: 0, u0: 0.9758, zAtU0: 49.881, u: 0.9711, w: 0.617e-3, ee: 6.563 },
    { er: 3.66, h: 0.508e-3, t: 0, u0: 2.1761, zAtU0: 50.19, u: 2.1894, w: 1.112e-3, ee: 2.858 },
    { er: 3.66, h: 0.508e-3, t: 35e-6, u: 2.1129, w: 1.073e-3, ee: 2.8062 },
    { er: 10.0, h: 1.0e-3, t: 0, u0: 0.9569, zAtU0: 49.879, u: 0.9522, w: 0.952e-3, ee: 6.6781 },
  ];
  for (const c of table) {
    it(`50 Ω on εr ${c.er}, h ${c.h * 1e3} mm, t ${c.t * 1e6} µm → u ${c.u}`, () => {
      if (c.u0 !== undefined) expect(wheelerSynthesisU(50, c.er)).toBeCloseTo(c.u0, 4); // Wheeler 1977 [M] via physics.md §1.4 [C]
      if (c.zAtU0 !== undefined && c.u0 !== undefined) expect(staticHJ(wheelerSynthesisU(50, c.er), 0, c.er).z0).toBeCloseTo(c.zAtU0, 3); // HJ 1980 at Wheeler u0, physics.md §1.4 [C]
      const line = synthesizeMicrostrip(50, substrate(c.er, c.h, c.t), STATIC_F);
      expect(line.width / c.h).toBeCloseTo(c.u, 4); // HJ 1980 synthesis, physics.md §1.4 [C]
      expect(line.width * 1e3).toBeCloseTo(c.w * 1e3, 3); // physics.md §1.4 [C]
      expect(line.epsEffStatic).toBeCloseTo(c.ee, 4); // physics.md §1.4 [C]
    });
  }

  // Other impedances on εr 4.4, h 1.6 mm, t 0: physics.md §1.4 [C], HJ 1980.
  const others: ReadonlyArray<readonly [number, number, number, number]> = [
    [25, 5.2327, 8.372e-3, 3.6519],
    [35, 3.3119, 5.299e-3, 3.4996],
    [70.7, 1.0097, 1.616e-3, 3.1699],
    [100, 0.4406, 0.705e-3, 3.0339],
    [120, 0.2537, 0.406e-3, 2.9769],
  ];
  for (const [z0, u, w, ee] of others) {
    it(`${z0} Ω on εr 4.4, h 1.6 mm → u ${u}`, () => {
      const line = synthesizeMicrostrip(z0, substrate(4.4, 1.6e-3), STATIC_F);
      expect(line.width / 1.6e-3).toBeCloseTo(u, 4); // physics.md §1.4 [C]
      expect(line.width * 1e3).toBeCloseTo(w * 1e3, 3); // physics.md §1.4 [C]
      expect(line.epsEffStatic).toBeCloseTo(ee, 4); // physics.md §1.4 [C]
    });
  }

  it('Pozar microstrip design example: εr 2.20, h 1.27 mm, 50 Ω', () => {
    // Pozar, Microwave Engineering, §3.8 microstrip design example (from memory; numbering Example 3.7
    // in the editions recalled). Pozar's own formulas give W/d 3.081, εe 1.87; with HJ 1980 the values
    // are u = 3.0828, εe = 1.8813 (physics.md §6.2 [C]).
    const line = synthesizeMicrostrip(50, substrate(2.2, 1.27e-3), STATIC_F);
    expect(line.width / 1.27e-3).toBeCloseTo(3.0828, 4);
    expect(line.epsEffStatic).toBeCloseTo(1.8813, 4);
    // The textbook's rounded answers (W/d 3.081, εe 1.87, from memory) agree to 0.1 % / 0.6 %.
    expect(rel(line.width / 1.27e-3, 3.081)).toBeLessThan(0.001);
    expect(rel(line.epsEffStatic, 1.87)).toBeLessThan(0.007);
  });
});

describe('trade facts', () => {
  it('50 Ω on εr ≈ 4.5, h 1.6 mm is about 3 mm wide', () => {
    // common practice, no source ("about 2.9–3.1 mm"; physics.md §6.1)
    for (const t of [0, 35e-6]) {
      for (const f of [1e9, 2.4e9]) {
        const w = synthesizeMicrostrip(50, substrate(4.5, 1.6e-3, t), f).width;
        expect(w).toBeGreaterThan(2.9e-3);
        expect(w).toBeLessThan(3.1e-3);
      }
    }
  });

  it('λg/λ0 of 50 Ω on FR-4 is about 0.54–0.6', () => {
    // common practice, no source. Holds for εr 4.4 up to a few GHz; dispersion takes it below 0.54
    // by 5.8 GHz (physics.md §2.4: 0.5355), so the check stops at 2.4 GHz.
    for (const f of [0.5e9, 1e9, 2.4e9]) {
      const line = synthesizeMicrostrip(50, substrate(4.4, 1.6e-3, 35e-6), f);
      const ratio = line.wavelength / (299_792_458 / f);
      expect(ratio).toBeGreaterThan(0.54);
      expect(ratio).toBeLessThan(0.6);
    }
  });
});

describe('validity warnings (never silent clamping)', () => {
  it('in range: no warnings', () => {
    // Validity ranges of HJ 1980, KJ 1982, JK 1983 as listed in physics.md §1.1, §2.1, §2.2 [M].
    expect(analyseMicrostrip(3e-3, substrate(4.4, 1.6e-3, 35e-6), 2.4e9).warnings).toEqual([]);
  });
  it('w/h below 0.1 warns (KJ 1982 / JK 1983 range) and still returns a value', () => {
    // KJ 1982 validity 0.1 ≤ u ≤ 100 (physics.md §2.1 [M]).
    const line = analyseMicrostrip(0.05e-3, substrate(4.4, 1e-3), 1e9);
    expect(line.warnings.some((d) => d.code === 'model.out-of-range' && d.where === 'microstrip.width')).toBe(true);
    expect(Number.isFinite(line.z0)).toBe(true);
  });
  it('w/h above 10 warns for JK 1983 only', () => {
    // JK 1983 validity 0.1 ≤ u ≤ 10 (physics.md §2.2 [M]).
    const line = analyseMicrostrip(20e-3, substrate(4.4, 1e-3), 1e9);
    expect(line.warnings.map((d) => d.message).join('\n')).toMatch(/Jansen–Kirschning 1983/);
    expect(line.warnings.map((d) => d.message).join('\n')).not.toMatch(/Kirschning–Jansen 1982/);
  });
  it('εr above 20 and f·h above 39 GHz·mm warn', () => {
    // KJ 1982: εr ≤ 20, h/λ0 ≤ 0.13 (physics.md §2.1 [M]).
    const hiEr = analyseMicrostrip(1e-3, substrate(25, 1e-3), 1e9);
    expect(hiEr.warnings.some((d) => d.where === 'substrate.er')).toBe(true);
    const hiF = analyseMicrostrip(3e-3, substrate(4.4, 1.6e-3), 30e9);
    expect(hiF.warnings.some((d) => d.where === 'frequency')).toBe(true);
  });
  it('copper thinner than 3 skin depths warns (t > 0 only)', () => {
    // Hammerstad–Bekkadal loss valid for t ≥ 3δ; scikit-rf warns below (physics.md §3.1 [R]).
    // δ(Cu, 1 GHz) ≈ 2.09 µm (physics.md §3.3).
    const thin = analyseMicrostrip(3e-3, substrate(4.4, 1.6e-3, 5e-6), 1e9);
    expect(thin.warnings.some((d) => d.code === 'model.thin-conductor')).toBe(true);
    const thick = analyseMicrostrip(3e-3, substrate(4.4, 1.6e-3, 7e-6), 1e9);
    expect(thick.warnings.some((d) => d.code === 'model.thin-conductor')).toBe(false);
    const zero = analyseMicrostrip(3e-3, substrate(4.4, 1.6e-3, 0), 1e9);
    expect(zero.warnings.some((d) => d.code === 'model.thin-conductor')).toBe(false);
  });
  it('impossible inputs are errors', () => {
    expect(() => analyseMicrostrip(-1e-3, substrate(4.4, 1.6e-3), 1e9)).toThrow(/width/);
    expect(() => analyseMicrostrip(1e-3, substrate(0.5, 1.6e-3), 1e9)).toThrow(/εr/);
    expect(() => synthesizeMicrostrip(-50, substrate(4.4, 1.6e-3), 1e9)).toThrow(/impedance/);
  });
});
