// Plain polygon helpers over the seam types (metres, y up). Rings are closed implicitly: the
// first point is not repeated at the end. Outer rings run counter-clockwise, holes clockwise.
import type { Bounds, CopperIsland, Point, Ring } from '../seams.js';

/** The board grid: every copper coordinate is a whole number of nanometres (1 nm = 1e-9 m). */
export const GRID = 1e-9;

/** Snap a length in metres to the 1 nm grid (Gerber at 6 decimals in mm has the same resolution). */
export const snap = (metres: number): number => Math.round(metres / GRID) * GRID || 0; // `|| 0`: no -0

/** Length in metres as a whole number of nanometres. */
export const toNm = (metres: number): number => Math.round(metres / GRID);

/**
 * Signed area by the shoelace formula (m²): positive for a counter-clockwise ring, negative for
 * a clockwise one. Coordinates are taken relative to the first point to keep the sum exact-ish.
 */
export function polygonArea(ring: Ring): number {
  const n = ring.length;
  if (n < 3) return 0;
  const [x0, y0] = ring[0]!;
  let twice = 0;
  for (let i = 0; i < n; i++) {
    const [ax, ay] = ring[i]!;
    const [bx, by] = ring[(i + 1) % n]!;
    twice += (ax - x0) * (by - y0) - (bx - x0) * (ay - y0);
  }
  return twice / 2;
}

/** Copper area of an island (m²): outline minus holes. */
export const islandArea = (island: CopperIsland): number =>
  Math.abs(polygonArea(island.outline)) - island.holes.reduce((sum, h) => sum + Math.abs(polygonArea(h)), 0);

/** The empty bounds: identity of `mergeBounds`. */
export const EMPTY_BOUNDS: Bounds = { xmin: Infinity, ymin: Infinity, xmax: -Infinity, ymax: -Infinity };

export const isEmptyBounds = (b: Bounds): boolean => !(b.xmin <= b.xmax && b.ymin <= b.ymax);

export function mergeBounds(a: Bounds, b: Bounds): Bounds {
  return {
    xmin: Math.min(a.xmin, b.xmin),
    ymin: Math.min(a.ymin, b.ymin),
    xmax: Math.max(a.xmax, b.xmax),
    ymax: Math.max(a.ymax, b.ymax),
  };
}

export function ringBounds(ring: Ring): Bounds {
  let b = EMPTY_BOUNDS;
  for (const [x, y] of ring) b = mergeBounds(b, { xmin: x, ymin: y, xmax: x, ymax: y });
  return b;
}

export const boundsOfRings = (rings: readonly Ring[]): Bounds =>
  rings.reduce((acc, r) => mergeBounds(acc, ringBounds(r)), EMPTY_BOUNDS);

/** Axis-aligned rectangle as a counter-clockwise ring starting at its lower-left corner. */
export function rectRing(xmin: number, ymin: number, xmax: number, ymax: number): Ring {
  return [
    [xmin, ymin],
    [xmax, ymin],
    [xmax, ymax],
    [xmin, ymax],
  ];
}

/** Largest radial excess of a pad polygon's vertices over the nominal circle (m). */
export const PAD_RADIAL_TOLERANCE = 1e-6;

/**
 * Number of sides for a pad polygon of radius r: the smallest multiple of 4 (at least 16, at most
 * 256) whose circumscribed polygon has its vertices no more than PAD_RADIAL_TOLERANCE outside the
 * circle. Multiples of 4 keep the polygon symmetric about both axes through its centre.
 */
export function padSegments(radius: number): number {
  const needed = Math.PI / Math.acos(radius / (radius + PAD_RADIAL_TOLERANCE));
  const n = Math.ceil(needed / 4) * 4;
  return Math.min(256, Math.max(16, n));
}

/**
 * Pad polygon: the regular n-gon circumscribed about the circle (centre, radius), counter-clockwise.
 * Area convention: the copper covers the nominal circle everywhere (the annular ring is never
 * thinner than drawn), its extent along x and y equals the nominal diameter exactly (edges are
 * tangent at 0°, 90°, 180°, 270°), and its area is n·r²·tan(π/n), slightly above π·r².
 */
export function circlePolygon(center: Point, radius: number, segments = padSegments(radius)): Ring {
  if (segments < 4 || segments % 4 !== 0) throw new RangeError(`pad polygon needs a multiple of 4 sides, got ${segments}`);
  const vertexRadius = radius / Math.cos(Math.PI / segments);
  const ring: Point[] = [];
  for (let k = 0; k < segments; k++) {
    const a = ((k + 0.5) * 2 * Math.PI) / segments;
    ring.push([center[0] + vertexRadius * Math.cos(a), center[1] + vertexRadius * Math.sin(a)]);
  }
  return ring;
}

/** Area of the pad polygon drawn by `circlePolygon` (m²): n·r²·tan(π/n). */
export const padPolygonArea = (radius: number, segments = padSegments(radius)): number =>
  segments * radius * radius * Math.tan(Math.PI / segments);

/**
 * Snap a ring to the nanometre grid and clean it: no repeated closing point, no duplicate
 * consecutive points, no collinear points (tested exactly in integer nanometres), oriented
 * counter-clockwise (`ccw`) or clockwise, starting at its lowest-x then lowest-y vertex.
 * Returns an empty ring when nothing with area is left.
 */
export function normaliseRing(ring: Ring, ccw: boolean): Ring {
  let pts: [number, number][] = ring.map(([x, y]) => [toNm(x), toNm(y)]);
  // Drop consecutive duplicates, including the closing point.
  pts = pts.filter((p, i) => {
    const q = pts[(i + pts.length - 1) % pts.length]!;
    return pts.length === 1 || p[0] !== q[0] || p[1] !== q[1];
  });
  // Drop collinear points until none is left (removing one can make its neighbour collinear).
  let changed = true;
  while (changed && pts.length >= 3) {
    changed = false;
    for (let i = 0; i < pts.length; i++) {
      const a = pts[(i + pts.length - 1) % pts.length]!;
      const b = pts[i]!;
      const c = pts[(i + 1) % pts.length]!;
      const cross =
        BigInt(b[0] - a[0]) * BigInt(c[1] - a[1]) - BigInt(b[1] - a[1]) * BigInt(c[0] - a[0]);
      const same = b[0] === c[0] && b[1] === c[1];
      if (cross === 0n || same) {
        pts.splice(i, 1);
        changed = true;
        break;
      }
    }
  }
  if (pts.length < 3) return [];
  const metres: Point[] = pts.map(([x, y]) => [x * GRID || 0, y * GRID || 0]);
  const oriented = (polygonArea(metres) > 0) === ccw ? metres : [...metres].reverse();
  let start = 0;
  for (let i = 1; i < oriented.length; i++) {
    const p = oriented[i]!;
    const s = oriented[start]!;
    if (p[0] < s[0] || (p[0] === s[0] && p[1] < s[1])) start = i;
  }
  return [...oriented.slice(start), ...oriented.slice(0, start)];
}

/** Is the point strictly inside the ring (even-odd rule)? Points on an edge count as outside. */
export function pointInRing(point: Point, ring: Ring): boolean {
  const [px, py] = point;
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i]!;
    const [xj, yj] = ring[j]!;
    if (yi > py !== yj > py && px < ((xj - xi) * (py - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}
