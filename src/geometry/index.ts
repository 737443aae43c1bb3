// Copper geometry: polygons, union into islands, and the stub-match layout.
export { layoutStubMatch, type StubLayoutInput } from './layout.js';
export {
  GRID,
  snap,
  toNm,
  polygonArea,
  islandArea,
  ringBounds,
  boundsOfRings,
  mergeBounds,
  EMPTY_BOUNDS,
  isEmptyBounds,
  rectRing,
  circlePolygon,
  padSegments,
  padPolygonArea,
  PAD_RADIAL_TOLERANCE,
  normaliseRing,
  pointInRing,
} from './polygon.js';
export { unionRings, type UnionIsland } from './union.js';
export { checkFit, distanceToRing, areaSlack, type FitReport } from './fit.js';
export { checkDesignRules } from './rules.js';
