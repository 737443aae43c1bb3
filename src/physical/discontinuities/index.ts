// Microstrip discontinuity models: open end, T-junction, via ground, mitred bend.
export { openEndExtensionKJK, openEndExtensionHB } from './openEnd.js';
export { tJunctionHammerstad, type TJunction } from './tJunction.js';
export { viaInductanceGoldfarbPucel, viaResistance } from './via.js';
export { mitreDouvilleJames } from './mitre.js';
