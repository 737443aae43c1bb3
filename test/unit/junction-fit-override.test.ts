// The network's junction-correction override (NetworkModels.junctionFit), which the full-wave
// diagnostics use to weigh a candidate correction on copper already drawn. Properties of the code,
// no outside source: the default is the fitted tee, and the override reaches the cascade.
import { describe, expect, it } from 'vitest';
import { abs, complex, sub } from '../../src/math/complex.js';
import { ALL_MODELS, physicalInputImpedance } from '../../src/analysis/physicalNetwork.js';
import { CROSS_FIT, TEE_FIT } from '../../src/physical/discontinuities/index.js';
import type { MatchCopper } from '../../src/seams.js';
import { substrate } from '../helpers/substrate.js';

const board = substrate(10.2, 0.635e-3);
const copper: MatchCopper = { seriesWidth: 0.6e-3, stubWidth: 1.4e-3, seriesLength: 5e-3, stubLength: 3.5e-3, leadLength: 2e-3, termination: 'open', stubCount: 1 };
const load = complex(80, 30);
const zin = (models = ALL_MODELS) => physicalInputImpedance(copper, load, board, 4.5e9, models);

describe('physical network: junction-correction override', () => {
  it('left unset, a single stub uses TEE_FIT', () => {
    expect(abs(sub(zin(), zin({ ...ALL_MODELS, junctionFit: TEE_FIT })))).toBe(0);
  });

  it('set, it changes the input impedance', () => {
    expect(abs(sub(zin(), zin({ ...ALL_MODELS, junctionFit: CROSS_FIT })))).toBeGreaterThan(0.1);
  });
});
