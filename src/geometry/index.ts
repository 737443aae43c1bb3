// Copper geometry: polygons, union into islands, and the stub-match layout.
export { layoutStubMatch, planFold, foldFits, type StubLayoutInput, type StubFold, type FoldPlan } from './layout.js';
export { placeGeometry, placementMap, placedDirection, normaliseDegrees, isIdentityPlacement, IDENTITY_PLACEMENT } from './place.js';
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
export { checkDesignRules } from './drc.js';
export { TOUCH_TOLERANCE, regionMargin, segmentSegment, segmentsIntersect, inCopper, type CopperShape, type RegionMargin } from './fit.js';
export { RULE_TOLERANCE } from './drc.js';
