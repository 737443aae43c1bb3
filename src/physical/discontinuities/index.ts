// Microstrip discontinuity models: open end, T-junction, via ground, mitred bend.
export { openEndExtensionKJK, openEndExtensionDesign, openEndExtensionHB, OPEN_END_FULLWAVE_SCALE } from './openEnd.js';
export { tJunctionHammerstad, type TJunction } from './tJunction.js';
export { viaInductanceGoldfarbPucel, viaInductanceDesign, viaCrowdingBasis, viaResistance, mutualInductanceGrover, VIA_CROWDING_FIT, VIA_ROW_MUTUAL_FIT } from './via.js';
export { mitreDouvilleJames, mitredBendLength, BEND_LENGTH_FIT } from './mitre.js';
export { fittedJunction, CROSS_FIT, TEE_FIT, FIT_REFERENCE_ER, FIT_ER_RANGE, FIT_LOG_Z_RATIO_RANGE, type JunctionFit } from './fittedJunction.js';
