// Microstrip line models: analysis, synthesis, propagation constant, and the published formulas.
export { analyseMicrostrip, propagationConstant, normalisedFrequency, FN_MAX } from './analyse.js';
export { synthesizeMicrostrip } from './synthesis.js';
export { MU0, C0, ETA0 } from './constants.js';
export { fHJ, z01HJ, aHJ, bHJ, epsEffHJ, deltaU1HJ, deltaUrHJ, staticHJ, type StaticHJ } from './hammerstadJensen1980.js';
export { epsEffKJ } from './kirschningJansen1982.js';
export { z0JK } from './jansenKirschning1983.js';
export { wheelerSynthesisU } from './wheeler1977.js';
export {
  skinDepth,
  surfaceResistance,
  currentDistributionFactor,
  roughnessFactorHammerstad,
  conductorLossHB,
  dielectricLossFillingFactor,
} from './loss.js';
