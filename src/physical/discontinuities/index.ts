// Microstrip discontinuity models: open end, T-junction, via ground, mitred bend.
export { openEndExtensionKJK, openEndExtensionHB } from './openEnd.js';
export { tJunctionHammerstad, type TJunction } from './tJunction.js';
export { viaInductanceGoldfarbPucel, viaInductanceDesign, viaCrowdingBasis, viaResistance, VIA_CROWDING_FIT } from './via.js';
export { mitreDouvilleJames } from './mitre.js';
export { crossJunctionFitted, CROSS_FIT, type CrossFit } from './cross.js';
