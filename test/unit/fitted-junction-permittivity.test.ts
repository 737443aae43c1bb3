// The optional permittivity and impedance-ratio terms of the fitted junction correction
// (fittedJunction.ts). Properties of the code, no outside source: zero terms change nothing, the
// terms act about εr 4.4 and ratio 0, and both are held to the extractions' spans instead of being
// extrapolated.
import { describe, expect, it } from 'vitest';
import { analyseMicrostrip } from '../../src/physical/microstrip/index.js';
import { FIT_ER_RANGE, FIT_LOG_Z_RATIO_RANGE, FIT_REFERENCE_ER, TEE_FIT, fittedJunction, tJunctionHammerstad } from '../../src/physical/discontinuities/index.js';
import { substrate } from '../helpers/substrate.js';

function junctionOn(er: number, fit = TEE_FIT) {
  const board = substrate(er, 0.635e-3);
  const main = analyseMicrostrip(0.6e-3, board, 4e9);
  const stub = analyseMicrostrip(0.3e-3, board, 4e9);
  const bare = tJunctionHammerstad(main, main, stub, board, 4e9);
  return { bare, fitted: fittedJunction(bare, main, stub, board, fit) };
}
// The ratio terms set to zero, so that the permittivity terms act alone.
const withoutRatio = { ...TEE_FIT, planeAPerLogZRatio: 0, n2DeficitPerLogZRatio: 0, susceptancePerLogZRatio: 0 };
const withEr = { ...withoutRatio, planeAPerEr: -0.05, n2DeficitPerEr: 0.1 };

describe('fitted junction: permittivity terms', () => {
  it('zero terms give the same junction as none', () => {
    const { planeAPerEr: _plane, n2DeficitPerEr: _deficit, ...withoutTerms } = TEE_FIT;
    expect(junctionOn(10.2, { ...TEE_FIT, planeAPerEr: 0, n2DeficitPerEr: 0 }).fitted).toEqual(junctionOn(10.2, withoutTerms).fitted);
  });

  it('the adopted fit carries permittivity terms that move the junction on εr 10.2', () => {
    expect(junctionOn(10.2).fitted.da).not.toBeCloseTo(junctionOn(10.2, { ...TEE_FIT, planeAPerEr: 0, n2DeficitPerEr: 0 }).fitted.da, 9);
  });

  it('at εr 4.4 the terms change nothing', () => {
    expect(junctionOn(FIT_REFERENCE_ER, withEr).fitted).toEqual(junctionOn(FIT_REFERENCE_ER, withoutRatio).fitted);
  });

  it('the main-arm plane follows planeA + planeAPerEr·(εr − 4.4), the deficit n2Deficit + n2DeficitPerEr·(εr − 4.4)', () => {
    const { bare, fitted } = junctionOn(8, withEr);
    expect(fitted.da / bare.da).toBeCloseTo(TEE_FIT.planeA - 0.05 * (8 - 4.4), 12);
    expect((1 - fitted.n2a) / (1 - bare.n2a)).toBeCloseTo(TEE_FIT.n2Deficit + 0.1 * (8 - 4.4), 9);
  });

  it('beyond the extractions the permittivity is held at 2.2 and 10.2', () => {
    for (const [outside, edge] of [[12.9, FIT_ER_RANGE[1]], [1.5, FIT_ER_RANGE[0]]] as const) {
      const { bare, fitted } = junctionOn(outside, withEr);
      expect(fitted.da / bare.da).toBeCloseTo(TEE_FIT.planeA - 0.05 * (edge - FIT_REFERENCE_ER), 12);
    }
  });
});

// The impedance-ratio terms (weighed in the ninth full-wave round; TEE_FIT takes the plane's and the
// susceptance's since the twelfth).
function junctionWith(stubWidth: number, fit: Parameters<typeof fittedJunction>[4]) {
  const board = substrate(FIT_REFERENCE_ER, 0.635e-3);
  const main = analyseMicrostrip(1.2e-3, board, 4e9);
  const stub = analyseMicrostrip(stubWidth, board, 4e9);
  const bare = tJunctionHammerstad(main, main, stub, board, 4e9);
  return { bare, fitted: fittedJunction(bare, main, stub, board, fit), ratio: Math.log(main.z0 / stub.z0) };
}
const withRatio = { ...TEE_FIT, planeAPerLogZRatio: 0.3, n2DeficitPerLogZRatio: 0.5, susceptancePerLogZRatio: 0.8 };

describe('fitted junction: impedance-ratio terms', () => {
  it('TEE_FIT carries the plane and susceptance terms, not the deficit term, and zero terms give the same junction as none', () => {
    expect(TEE_FIT.planeAPerLogZRatio ?? 0).toBeGreaterThan(0);
    expect(TEE_FIT.susceptancePerLogZRatio ?? 0).toBeGreaterThan(0);
    expect(TEE_FIT.n2DeficitPerLogZRatio ?? 0).toBe(0);
    const { planeAPerLogZRatio: _plane, susceptancePerLogZRatio: _susceptance, ...withoutTerms } = TEE_FIT;
    expect(junctionWith(0.6e-3, { ...TEE_FIT, planeAPerLogZRatio: 0, n2DeficitPerLogZRatio: 0, susceptancePerLogZRatio: 0 }).fitted).toEqual(junctionWith(0.6e-3, withoutTerms).fitted);
  });

  it('a stub as wide as the line (ratio 0) is not moved by them', () => {
    expect(junctionWith(1.2e-3, withRatio).fitted).toEqual(junctionWith(1.2e-3, TEE_FIT).fitted);
  });

  it('inside the extractions the plane and deficit follow the ratio linearly', () => {
    const { bare, fitted, ratio } = junctionWith(0.6e-3, withRatio);
    expect(ratio).toBeGreaterThan(FIT_LOG_Z_RATIO_RANGE[0]);
    expect(ratio).toBeLessThan(0);
    expect(fitted.da / bare.da).toBeCloseTo(TEE_FIT.planeA + 0.3 * ratio, 12);
    expect((1 - fitted.n2a) / (1 - bare.n2a)).toBeCloseTo(TEE_FIT.n2Deficit + 0.5 * ratio, 9);
  });

  it('a stub narrower than the extractions is held at their ratio, not extrapolated', () => {
    const { bare, fitted, ratio } = junctionWith(0.05e-3, withRatio);
    expect(ratio).toBeLessThan(FIT_LOG_Z_RATIO_RANGE[0]);
    expect(fitted.da / bare.da).toBeCloseTo(TEE_FIT.planeA + 0.3 * FIT_LOG_Z_RATIO_RANGE[0], 12);
  });
});
