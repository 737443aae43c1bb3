// Landing the section on the board: a rigid transform (mirror about the section's own x axis, then
// a counter-clockwise rotation, then a move of the load plane centre to (x, y)) applied after
// layout and before the fit check, since the area and the keep-outs are in board coordinates.
// Copper is unioned again after the transform, so islands stay normalised: counter-clockwise
// outlines, clockwise holes, snapped to the 1 nm grid, no duplicate or collinear points.
import type { BoardGeometry, CopperIsland, Feature, Placement, Point, Port, Ring, Via } from '../seams.js';
import { boundsOfRings, normaliseRing, snap } from './polygon.js';
import { unionRings } from './union.js';

export const IDENTITY_PLACEMENT: Placement = { x: 0, y: 0, rotationDeg: 0, mirror: false };

export const isIdentityPlacement = (p: Placement): boolean => p.x === 0 && p.y === 0 && p.rotationDeg === 0 && !p.mirror;

/** Angle in [0, 360) with float noise below 1e-9° removed. */
export function normaliseDegrees(deg: number): number {
  const r = Math.round(deg * 1e9) / 1e9;
  const m = ((r % 360) + 360) % 360;
  return m === 0 || m === 360 ? 0 : m;
}

/** cos and sin of an angle in degrees, exact at multiples of 90°. */
function cosSin(deg: number): [number, number] {
  const d = normaliseDegrees(deg);
  if (d === 0) return [1, 0];
  if (d === 90) return [0, 1];
  if (d === 180) return [-1, 0];
  if (d === 270) return [0, -1];
  const a = (d * Math.PI) / 180;
  return [Math.cos(a), Math.sin(a)];
}

/** The point map of a placement, section frame → board frame (not snapped). */
export function placementMap(place: Placement): (p: Point) => Point {
  const [c, s] = cosSin(place.rotationDeg);
  const flip = place.mirror ? -1 : 1;
  return ([px, py]) => {
    const qy = flip * py;
    return [place.x + c * px - s * qy, place.y + s * px + c * qy];
  };
}

/** A direction (degrees, 0 = +x) carried by the placement. */
export const placedDirection = (place: Placement, deg: number): number => normaliseDegrees(place.rotationDeg + (place.mirror ? -deg : deg));

/** The geometry moved onto the board. The identity returns the geometry as it is. */
export function placeGeometry(g: BoardGeometry, place: Placement): BoardGeometry {
  if (![place.x, place.y, place.rotationDeg].every(Number.isFinite)) throw new RangeError('placement must be finite');
  if (isIdentityPlacement(place)) return g;
  const map = placementMap(place);
  const ring = (r: Ring): Ring => r.map(map);
  const islands = unionRings(g.copper.flatMap((c) => [ring(c.outline), ...c.holes.map(ring)]));
  const copper: CopperIsland[] = islands.map((island, i) => ({ id: islands.length === 1 ? 'copper' : `copper-${i + 1}`, outline: island.outline, holes: island.holes }));
  const vias: Via[] = g.vias.map((v) => {
    const [x, y] = map([v.x, v.y]);
    return { ...v, x: snap(x), y: snap(y) };
  });
  const ports: Port[] = g.ports.map((p) => {
    const [x, y] = map([p.x, p.y]);
    return { ...p, x: snap(x), y: snap(y), directionDeg: placedDirection(place, p.directionDeg) };
  });
  const features: Feature[] = g.features.map((f) => (f.outline ? { ...f, outline: normaliseRing(ring(f.outline), true) } : f));
  return { ...g, copper, vias, ports, features, bounds: boundsOfRings(copper.map((c) => c.outline)), placement: place };
}
