// The junction, open-end and via models against this project's own full-wave extractions
// (scripts/fullwave/junctions.json, made by scripts/fullwave/extract_junctions.py with openEMS, an
// independent FDTD solver, Debian package openems). openEMS does not run here: the test reads the
// committed data, checks that the extractions are physically sound, that they agree with the earlier,
// independently made extractions recorded in physics.md §4.2 and §4.4, and that the coefficients in
// src/ are the least-squares fit of these data and reproduce every case.
import { describe, expect, it } from 'vitest';
import { BEND_LENGTH_FIT, CROSS_FIT, OPEN_END_FULLWAVE_SCALE, TEE_FIT, VIA_CROWDING_FIT, VIA_ROW_MUTUAL_FIT } from '../../src/physical/discontinuities/index.js';
import { abs, add, complex, conj, mul } from '../../src/math/complex.js';
import {
  bendComparisons,
  caseElements,
  fitBendLength,
  fitViaRowMutual,
  viaRowComparisons,
  junctionElements,
  junctionPoints,
  fitJunction,
  fitOpenEndScale,
  fittedTees,
  fitViaCrowding,
  openEndComparisons,
  readJunctions,
  rmsError,
  viaComparisons,
} from '../../scripts/fullwave/junction-fit.js';

const data = readJunctions();

describe('full-wave cross extractions (junctions.json)', () => {
  it('cover the range the fit claims: eight crosses, εr 2.2–10.2, h 0.305–1.6 mm, stubs 35–100 Ω', () => {
    expect(data.crosses.length).toBe(8);
    const ers = data.crosses.map((c) => c.substrate.er);
    const hs = data.crosses.map((c) => c.substrate.height_m);
    const zs = data.crosses.map((c) => c.stub.z0_target_ohm);
    expect([Math.min(...ers), Math.max(...ers)]).toEqual([2.2, 10.2]);
    expect([Math.min(...hs), Math.max(...hs)]).toEqual([0.305e-3, 1.6e-3]);
    expect([Math.min(...zs), Math.max(...zs)]).toEqual([35, 100]);
  });

  for (const record of data.crosses) {
    it(`${record.name}: reciprocal, mirror-symmetric and lossless within the run's accuracy`, () => {
      // Bounds of our own: a mirror-symmetric mesh repeats to rounding, reciprocity to the run's decay.
      expect(record.reciprocity_error).toBeLessThan(5e-3);
      expect(record.symmetry_error).toBeLessThan(1e-3);
      // Lossless substrate and PEC copper: S^H·S = I, short of what the cross radiates (our own bound).
      for (const p of junctionPoints([record])) {
        for (let i = 0; i < 3; i += 1) {
          for (let k = 0; k < 3; k += 1) {
            let sum = complex(i === k ? -1 : 0);
            for (let m = 0; m < 3; m += 1) sum = add(sum, mul(conj(p.measured[m]![i]!), p.measured[m]![k]!));
            expect(abs(sum)).toBeLessThan(0.03);
          }
        }
      }
    });
  }

  it('agree with the two earlier extractions recorded in physics.md §4.2 (other runs, other script)', () => {
    // physics.md §4.2, "Full-wave check of the cross": measured d_a, d2, n², B at f0 for the same two
    // geometries. Put into the same equivalent circuit they reproduce our measured S at f0.
    const earlier: Record<string, { da: number; d2: number; n2: number; susceptance: number }> = {
      'cross-ptfe-508-50-60-6g4': { da: 0.14e-3, d2: 1.366e-3, n2: 0.976, susceptance: 1.79e-3 },
      'cross-fr4-1600-50-50-2g4': { da: 0.48e-3, d2: 3.609e-3, n2: 0.958, susceptance: 5.79e-3 },
    };
    for (const [name, elements] of Object.entries(earlier)) {
      const record = data.crosses.find((c) => c.name === name)!;
      const atF0 = junctionPoints([record]).filter((p) => Math.abs(p.main.frequency - record.frequency_hz) < 1);
      expect(atF0.length).toBe(1);
      // 0.015 is our own bound: each case's own best fit leaves 0.003–0.007 at f0.
      expect(rmsError(atF0, () => elements)).toBeLessThan(0.015);
    }
  });
});

describe('cross-junction model (src/physical/discontinuities/fittedJunction.ts) fitted to them', () => {
  const all = junctionPoints(data.crosses);
  const inSrc = rmsError(all, (p) => junctionElements(p, CROSS_FIT));

  it('its coefficients are the least-squares fit: a fresh fit improves the rms by under 0.5 %', () => {
    const fresh = fitJunction(all, CROSS_FIT);
    expect(fresh.rms).toBeGreaterThan(inSrc * 0.995);
  });

  for (const record of data.crosses) {
    it(`${record.name}: even-mode S within 0.02 rms, and closer than the bare T model`, () => {
      const points = junctionPoints([record]);
      const fitted = rmsError(points, (p) => junctionElements(p, CROSS_FIT));
      const tee = rmsError(points, (p) => junctionElements(p, undefined));
      // Our own bounds: the worst case of the fit is 0.018; the fit must beat the T it corrects.
      expect(fitted).toBeLessThan(0.02);
      expect(fitted).toBeLessThan(0.9 * tee);
    });
  }
});

describe('T-junction model (Hammerstad 1981 with TEE_FIT, src/physical/discontinuities/fittedJunction.ts) fitted to the full-wave tees', () => {
  const all = junctionPoints(fittedTees(data));

  it('its coefficients are the least-squares fit: a fresh fit improves the rms by under 0.5 %', () => {
    const inSrc = rmsError(all, (p) => junctionElements(p, TEE_FIT));
    expect(fitJunction(all, TEE_FIT).rms).toBeGreaterThan(inSrc * 0.995);
  });

  for (const record of data.tees) {
    it(`${record.name}${record.use === 'check' ? ' (held out of the fit)' : ''}: S within 0.02 rms, and within 10 % of Hammerstad's T alone or better`, () => {
      const points = junctionPoints([record]);
      const fitted = rmsError(points, (p) => junctionElements(p, TEE_FIT));
      // Our own bounds: the worst case of the fit is 0.0176 (εr 2.2 at 10 GHz); every tee gains on
      // Hammerstad's T alone, narrow stubs (where it is already close) least, wide stubs up to 74 %.
      expect(fitted).toBeLessThan(0.02);
      expect(fitted).toBeLessThan(1.1 * rmsError(points, (p) => junctionElements(p, undefined)));
    });
  }

  it('the held-out tees carry the junction susceptance TEE_FIT gives, within 0.1 mS', () => {
    // junctions.json (our own openEMS extractions): each held-out tee's own elements at f0 against
    // the fit's. The 50/50 Ω tee at f·h 6.8 GHz·mm (εr 3.0, 9 GHz) has 0.30 mS; TEE_FIT gave it
    // 1.21 mS before it took the impedance-ratio terms (twelfth round, scripts/fullwave/README.md).
    // 0.1 mS is our own bound.
    const held = data.tees.filter((t) => t.use === 'check');
    expect(held.map((t) => t.name).sort()).toEqual(['tee-er3-760-50-50-9g0', 'tee-hc-508-50-40-4g0']);
    for (const record of held) {
      const mid = junctionPoints([record]).find((p) => Math.abs(p.main.frequency - record.frequency_hz) < 1)!;
      const model = junctionElements(mid, TEE_FIT);
      expect(Math.abs(caseElements(mid, model).susceptance - model.susceptance)).toBeLessThan(0.1e-3);
    }
  });

  it('over all tees the correction beats Hammerstad alone by over a third', () => {
    // Our own bound: over the twelve fitted tees the fit gives 0.0094 rms against Hammerstad's 0.0208
    // (over all fourteen, held-out ones too, see fit-junctions.ts).
    const tees = junctionPoints(data.tees);
    expect(rmsError(tees, (p) => junctionElements(p, TEE_FIT))).toBeLessThan(0.67 * rmsError(tees, (p) => junctionElements(p, undefined)));
  });

  it('agree with the earlier 3-port extraction recorded in physics.md §4.2 (FR-4 1.6 mm, 50/50 Ω, 2.4 GHz)', () => {
    // physics.md §4.2: "A 3-port FDTD of the 50/50 Ω junction on FR-4 at 2.4 GHz gave d_a 0.258 mm,
    // d2 2.111 mm, n² 0.949, B_T +0.30 mS".
    const record = data.tees.find((t) => t.name === 'tee-fr4-1600-50-50-2g4')!;
    const atF0 = junctionPoints([record]).filter((p) => Math.abs(p.main.frequency - record.frequency_hz) < 1);
    expect(atF0.length).toBe(1);
    // 0.015: our own bound, as for the crosses above.
    expect(rmsError(atF0, () => ({ da: 0.258e-3, d2: 2.111e-3, n2: 0.949, susceptance: 0.3e-3 }))).toBeLessThan(0.015);
  });

  // The tee on 1.6 mm FR-4 at 5 GHz reaches 0.52 of the first higher-order-mode frequency at the
  // top of its band; its Z is reciprocal there only to 3.6 % (the others to 1 %), so the bound is ours.
  // Hammerstad's T alone is furthest off at f·h near 8 GHz·mm (0.031 on FR-4 at 5 GHz, 0.0353 on
  // εr 2.2 at 10 GHz) and within 0.031 elsewhere; the 0.04 bound is ours too.
  for (const record of data.tees) {
    it(`${record.name}: reciprocal and symmetric; Hammerstad's T within 0.04 rms`, () => {
      expect(record.reciprocity_error).toBeLessThan(0.04);
      expect(record.symmetry_error).toBeLessThan(1e-3);
      expect(rmsError(junctionPoints([record]), (p) => junctionElements(p, undefined))).toBeLessThan(0.04);
    });
  }

  it('the tee is far closer to Hammerstad than the cross is (why balanced stubs need their own model)', () => {
    const tees = rmsError(junctionPoints(data.tees), (p) => junctionElements(p, undefined));
    const crosses = rmsError(junctionPoints(data.crosses), (p) => junctionElements(p, undefined));
    expect(tees).toBeLessThan(0.5 * crosses);
  });
});

describe('open-end model (Kirschning–Jansen–Koster 1981, scaled) against the full-wave open ends', () => {
  const cases = openEndComparisons(data.open_ends);

  it('the scale in src is the least-squares fit, rounded to 4 digits', () => {
    expect(OPEN_END_FULLWAVE_SCALE).toBeCloseTo(fitOpenEndScale(data.open_ends), 4);
  });

  it('KJK alone falls short of every extraction (why the scale exists)', () => {
    for (const o of cases) expect(o.kjk).toBeLessThan(o.measured);
  });

  for (const o of cases) {
    it(`${o.name}: KJK within 8 %, the scaled model within 3 % of the extraction`, () => {
      // The paper states about 2.5 % (physics.md §4.1); the εr 10.2 extraction itself varies by ±8 %
      // over its band, so both bounds are ours (the scaled model's worst case is 1.6 %).
      expect(Math.abs(o.kjk / o.measured - 1)).toBeLessThan(0.08);
      expect(Math.abs(o.model / o.measured - 1)).toBeLessThan(0.03);
    });
  }
});

describe('via model (src/physical/discontinuities/via.ts) against the full-wave vias', () => {
  const cases = viaComparisons(data.vias);

  // physics.md §4.4, "Full-wave check": 0.245 nH for one 0.3 mm via, 0.6 mm pad, εr 3.0, h 0.76 mm;
  // 2 % is our own bound for two runs with different meshes.
  it('the line-ending-in-via case repeats physics.md §4.4 (0.245 nH, an earlier run) within 2 %', () => {
    const repeat = cases.find((c) => c.name === 'via-er3-760-d300')!;
    expect(Math.abs(repeat.measuredNh / 0.245 - 1)).toBeLessThan(0.02);
  });

  it('the crowding coefficient in src is the least-squares fit, rounded to 3 digits', () => {
    expect(VIA_CROWDING_FIT).toBeCloseTo(fitViaCrowding(data.vias), 3);
  });

  it('one via, run after the fit, is held out of it', () => {
    expect(cases.filter((c) => c.use === 'check').map((c) => c.name)).toEqual(['via-fr4-1600-d400']);
    expect(cases.filter((c) => c.use === 'fit').length).toBe(11);
  });

  for (const c of cases) {
    it(`${c.name} (${c.use === 'fit' ? 'fitted' : 'held out'}; h/d ${c.hOverD.toFixed(2)}, w/h ${c.wOverH.toFixed(2)}): design model within ±10 %`, () => {
      // ±10 %: our own bound (the worst case is 8 %). In our short-stub designs a 10 % error in L
      // moves the match by 0.2–1.5 % of f0 (scripts/fullwave/model-sensitivity.ts), the most on
      // thick boards and wide stubs.
      expect(Math.abs(c.designNh / c.measuredNh - 1)).toBeLessThan(0.1);
    });
  }

  it('Goldfarb–Pucel alone is over 20 % low for strips twice the height wide (why the correction exists)', () => {
    const wide = cases.filter((c) => c.wOverH > 2);
    expect(wide.length).toBeGreaterThanOrEqual(5);
    for (const c of wide) expect(c.goldfarbPucelNh / c.measuredNh).toBeLessThan(0.8);
  });
});

describe('mitred-bend length (src/physical/discontinuities/mitre.ts) against the full-wave bends', () => {
  const bends = data.bends;
  const cases = bendComparisons(bends);

  it('cover w/h 0.89–5.2 and εr 2.2–10.2 (the range the fit claims)', () => {
    expect(bends.length).toBe(8);
    const aspects = cases.map((c) => c.aspect);
    const ers = bends.map((b) => b.substrate.er);
    expect(Math.min(...aspects)).toBeCloseTo(0.89, 2);
    expect(Math.max(...aspects)).toBeCloseTo(5.2, 1);
    expect([Math.min(...ers), Math.max(...ers)]).toEqual([2.2, 10.2]);
  });

  for (const b of bends) {
    // Douville & James (1978) chose the mitre for the smallest reflection; the bounds are our own:
    // |S11| < 0.05, and |S11|² + |S21|² within 0.02 of 1 (lossless substrate, PEC copper: the rest
    // is radiation and the run's decay), 0.04 on thick FR-4 at 5 GHz, which radiates most.
    const lossBound = b.name === 'bend-fr4-1600-z50-5g0' ? 0.04 : 0.02;
    it(`${b.name}: matched (|S11| < 0.05) and lossless within ${lossBound}, as an optimum mitre should be`, () => {
      b.freq_hz.forEach((_, k) => {
        const s11 = Math.hypot(b.s11_re[k]!, b.s11_im[k]!);
        const s21 = Math.hypot(b.s21_re[k]!, b.s21_im[k]!);
        expect(s11).toBeLessThan(0.05);
        expect(Math.abs(1 - s11 * s11 - s21 * s21)).toBeLessThan(lossBound);
      });
    });
  }

  it('every bend is electrically shorter than its centre-line (why folded stubs are drawn longer)', () => {
    for (const c of cases) expect(c.measured, c.name).toBeLessThan(0);
  });

  it('the coefficients in src are the least-squares fit, rounded to 4 digits', () => {
    const fit = fitBendLength(bends);
    expect(BEND_LENGTH_FIT.perWidth).toBeCloseTo(fit.perWidth, 4);
    expect(BEND_LENGTH_FIT.perHeight).toBeCloseTo(fit.perHeight, 4);
  });

  for (const c of cases) {
    // Our own bounds: 0.04 w, under a tenth of the correction itself (0.45–0.77 w); 0.08 w on thick
    // FR-4 at 5 GHz (f·h = 8 GHz·mm), where the extracted length falls from −0.57 w to −0.36 w across
    // 0.7–1.3 f0 and the frequency-independent fit takes the value at f0.
    const bound = c.name === 'bend-fr4-1600-z50-5g0' ? 0.08 : 0.04;
    it(`${c.name}: the fitted length within ${bound} w of the extraction`, () => {
      expect(Math.abs(c.model - c.measured) / c.width).toBeLessThan(bound);
    });
  }
});

describe('via rows (src/physical/discontinuities/via.ts, Grover mutual term) against the full-wave rows', () => {
  const cases = viaRowComparisons(data.via_rows);
  const rms = (errors: readonly number[]): number => Math.sqrt(errors.reduce((a, e) => a + e * e, 0) / errors.length);

  it('five rows of two or three vias were extracted', () => {
    expect(cases.length).toBeGreaterThanOrEqual(5);
    expect(new Set(cases.map((c) => c.count))).toEqual(new Set([2, 3]));
  });

  it('every row is more inductive than its vias taken apart (why the mutual term exists)', () => {
    for (const c of cases) expect(c.measuredNh, c.name).toBeGreaterThan(c.noMutualNh);
  });

  it('the scale in src is the least-squares fit, rounded to 3 digits', () => {
    expect(VIA_ROW_MUTUAL_FIT).toBeCloseTo(fitViaRowMutual(data.via_rows), 3);
  });

  it('the design model is closer than the model without mutual inductance (rms), and every row within 30 %', () => {
    // 30 % is our own bound: the worst row (0.787 mm PTFE at 10 GHz) is 27 % low; rows are the
    // least certain of the via models, and tunestrip's README says so.
    const withMutual = cases.map((c) => c.designNh / c.measuredNh - 1);
    const without = cases.map((c) => c.noMutualNh / c.measuredNh - 1);
    expect(rms(withMutual)).toBeLessThan(0.6 * rms(without));
    for (const [i, e] of withMutual.entries()) expect(Math.abs(e), cases[i]!.name).toBeLessThan(0.3);
  });
});
