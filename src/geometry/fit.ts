// Does the copper fit the space the spec allows? One signed margin over the allowed area and every
// keep-out, after the clearance, by exact plane geometry (no rasterising; common practice, no
// source): for each copper point p, s(p) is its distance to the region's boundary, positive on the
// allowed side (inside the area, outside a keep-out) and negative on the forbidden side; the margin
// of a region is min over all copper of s(p), minus the clearance.
//
// - Copper apart from the forbidden side: the minimum is the distance between the copper outlines
//   and the region boundary, the least vertex-to-segment distance between the two.
// - Copper reaching into the forbidden side: the minimum is −(the largest depth of copper inside it).
//   The depth is a minimum of distances to the boundary's vertices and edge lines, so its largest
//   value over the copper lies at a copper vertex, at a point of a copper edge equidistant from two
//   boundary features, or at a point inside the copper equidistant from three (a vertex of the
//   region's medial axis, e.g. the centre of a keep-out that the copper covers). Every such
//   candidate is solved for and its true depth evaluated, so the answer is exact.
// - Circles: min over copper of |p − c| − r for a circle keep-out (0 distance when the centre is on
//   copper), r − max over copper vertices of |p − c| for a circle area.
//
// Copper is the drawn island outlines (what the Gerber and DXF writers emit). A via pad there is the
// circumscribed polygon of `circlePolygon`: its extent along x and y equals the nominal circle's,
// and elsewhere it lies at most PAD_RADIAL_TOLERANCE (1 µm) outside, so margins near pads are the
// drawn copper's, conservative by at most 1 µm against the nominal circle.
import type { BoardGeometry, CopperIsland, Point, Region, Ring } from '../seams.js';
import { pointInRing, rectRing, ringBounds } from './polygon.js';

export interface FitReport {
  readonly fits: boolean;
  /** Worst signed margin (m): distance from copper (pads included) to the nearest area edge or keep-out, minus the clearance; negative when violated. +Infinity when there is nothing to fit. */
  readonly margin: number;
  /** Which constraint sets the worst margin, e.g. "area edge x max", "keep-out 2 (circle)"; "nothing" when none does. */
  readonly limitedBy: string;
}

/** Margins closer to zero than this (m) are float noise on the 1 nm board grid and count as touching. */
export const TOUCH_TOLERANCE = 1e-12;

/** Copper as polygons with holes: islands, or any other outline with holes (e.g. one feature). */
export interface CopperShape {
  readonly outline: Ring;
  readonly holes: readonly Ring[];
}

/** Signed margin of copper against one region, before clearance, with the copper point that sets it. */
export interface RegionMargin {
  /** min over copper of s(p) (m). */
  readonly value: number;
  /** Copper point where the minimum is reached. */
  readonly at: Point;
  /** Boundary feature nearest that point, e.g. "edge x max", "vertex 3", "circle". */
  readonly feature: string;
}

// ───────────────────────────── points and segments ─────────────────────────────

interface Foot {
  readonly distance: number;
  /** Parameter of the nearest point along a→b, in [0, 1]. */
  readonly t: number;
}

function pointSegment(p: Point, a: Point, b: Point): Foot {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2));
  return { distance: Math.hypot(p[0] - (a[0] + t * dx), p[1] - (a[1] + t * dy)), t };
}

/** Distance from a point to a ring's boundary (m). */
export function distanceToRing(p: Point, ring: Ring): number {
  let d = Infinity;
  for (let i = 0; i < ring.length; i++) d = Math.min(d, pointSegment(p, ring[i]!, ring[(i + 1) % ring.length]!).distance);
  return d;
}

const orient = (p: Point, q: Point, r: Point): number => Math.sign((q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0]));

function onSegment(p: Point, a: Point, b: Point): boolean {
  return Math.min(a[0], b[0]) <= p[0] && p[0] <= Math.max(a[0], b[0]) && Math.min(a[1], b[1]) <= p[1] && p[1] <= Math.max(a[1], b[1]);
}

/** Do the closed segments ab and cd share a point? */
export function segmentsIntersect(a: Point, b: Point, c: Point, d: Point): boolean {
  const o1 = orient(a, b, c);
  const o2 = orient(a, b, d);
  const o3 = orient(c, d, a);
  const o4 = orient(c, d, b);
  if (o1 * o2 < 0 && o3 * o4 < 0) return true;
  return (
    (o1 === 0 && onSegment(c, a, b)) ||
    (o2 === 0 && onSegment(d, a, b)) ||
    (o3 === 0 && onSegment(a, c, d)) ||
    (o4 === 0 && onSegment(b, c, d))
  );
}

/** Closest points of two segments: 0 when they meet, else the least of the four vertex-to-segment distances. */
export function segmentSegment(a: Point, b: Point, c: Point, d: Point): { readonly distance: number; readonly p: Point; readonly q: Point } {
  if (segmentsIntersect(a, b, c, d)) {
    const p = intersectionPoint(a, b, c, d);
    return { distance: 0, p, q: p };
  }
  const at = (s: Point, e: Point, t: number): Point => [s[0] + t * (e[0] - s[0]), s[1] + t * (e[1] - s[1])];
  const fa = pointSegment(a, c, d);
  const fb = pointSegment(b, c, d);
  const fc = pointSegment(c, a, b);
  const fd = pointSegment(d, a, b);
  let best = { distance: fa.distance, p: a, q: at(c, d, fa.t) };
  if (fb.distance < best.distance) best = { distance: fb.distance, p: b, q: at(c, d, fb.t) };
  if (fc.distance < best.distance) best = { distance: fc.distance, p: at(a, b, fc.t), q: c };
  if (fd.distance < best.distance) best = { distance: fd.distance, p: at(a, b, fd.t), q: d };
  return best;
}

function intersectionPoint(a: Point, b: Point, c: Point, d: Point): Point {
  const rx = b[0] - a[0];
  const ry = b[1] - a[1];
  const sx = d[0] - c[0];
  const sy = d[1] - c[1];
  const den = rx * sy - ry * sx;
  if (den === 0) {
    // Collinear overlap (or a touching end): any shared end point will do.
    for (const p of [a, b]) if (onSegment(p, c, d)) return p;
    return c;
  }
  const t = ((c[0] - a[0]) * sy - (c[1] - a[1]) * sx) / den;
  return [a[0] + t * rx, a[1] + t * ry];
}

const edgesOf = (ring: Ring): [Point, Point][] => ring.map((p, i) => [p, ring[(i + 1) % ring.length]!]);

/** Is the point strictly inside the copper (in the outline, not in a hole)? */
export const inCopper = (p: Point, shape: CopperShape): boolean => pointInRing(p, shape.outline) && !shape.holes.some((h) => pointInRing(p, h));

const ringsOf = (shape: CopperShape): readonly Ring[] => [shape.outline, ...shape.holes];

// ───────────────────────────── a polygon boundary as features ─────────────────────────────

interface Boundary {
  readonly ring: Ring;
  readonly edgeName: (i: number) => string;
  readonly vertexName: (i: number) => string;
}

const RECT_EDGES = ['edge y min', 'edge x max', 'edge y max', 'edge x min'];
const RECT_CORNERS = ['corner x min y min', 'corner x max y min', 'corner x max y max', 'corner x min y max'];

function boundaryOf(region: Exclude<Region, { kind: 'circle' }>): Boundary {
  if (region.kind === 'rect') {
    return {
      ring: rectRing(region.x[0], region.y[0], region.x[1], region.y[1]),
      edgeName: (i) => RECT_EDGES[i] ?? `edge ${i + 1}`,
      vertexName: (i) => RECT_CORNERS[i] ?? `vertex ${i + 1}`,
    };
  }
  // Polygon edge k runs from point k to point k + 1 (1-based, as a reader counts the spec's list).
  return { ring: region.points, edgeName: (i) => `edge ${i + 1}`, vertexName: (i) => `vertex ${i + 1}` };
}

/** Distance from p to the boundary and the name of the nearest feature (an edge, or a vertex when the foot is an end). */
function nearestFeature(p: Point, b: Boundary): { readonly distance: number; readonly name: string } {
  let best = { distance: Infinity, name: '' };
  const n = b.ring.length;
  for (let i = 0; i < n; i++) {
    const f = pointSegment(p, b.ring[i]!, b.ring[(i + 1) % n]!);
    if (f.distance < best.distance) {
      const name = f.t <= 0 ? b.vertexName(i) : f.t >= 1 ? b.vertexName((i + 1) % n) : b.edgeName(i);
      best = { distance: f.distance, name };
    }
  }
  return best;
}

/**
 * Equidistance constraints on (x, y, t), t the common distance: linear rows a·x + b·y + c·t = d,
 * and at most one quadratic |p − v|² = t². Solutions are candidate points; each is checked by
 * evaluating its true depth, so spurious roots are harmless.
 */
type Row = readonly [number, number, number, number];

const det3 = (a0: number, a1: number, a2: number, b0: number, b1: number, b2: number, c0: number, c1: number, c2: number): number =>
  a0 * (b1 * c2 - b2 * c1) - a1 * (b0 * c2 - b2 * c0) + a2 * (b0 * c1 - b1 * c0);

/** Cramer's rule for three rows; null when singular. */
function solve3(r: readonly [Row, Row, Row]): [number, number, number] | null {
  const [[a0, a1, a2, ad], [b0, b1, b2, bd], [c0, c1, c2, cd]] = r;
  const d = det3(a0, a1, a2, b0, b1, b2, c0, c1, c2);
  const scale = Math.max(Math.abs(a0), Math.abs(a1), Math.abs(a2), Math.abs(b0), Math.abs(b1), Math.abs(b2), Math.abs(c0), Math.abs(c1), Math.abs(c2));
  if (!(Math.abs(d) > 1e-12 * scale * scale * scale)) return null;
  return [
    det3(ad, a1, a2, bd, b1, b2, cd, c1, c2) / d,
    det3(a0, ad, a2, b0, bd, b2, c0, cd, c2) / d,
    det3(a0, a1, ad, b0, b1, bd, c0, c1, cd) / d,
  ];
}

/** Two linear rows and one quadratic |p − v|² = t²: the line of solutions of the rows cut by the quadratic. */
function solve2q(r1: Row, r2: Row, v: Point): Point[] {
  const w: [number, number, number] = [r1[1] * r2[2] - r1[2] * r2[1], r1[2] * r2[0] - r1[0] * r2[2], r1[0] * r2[1] - r1[1] * r2[0]];
  const q0 = solve3([r1, r2, [w[0], w[1], w[2], 0]]);
  if (!q0) return [];
  const ex = q0[0] - v[0];
  const ey = q0[1] - v[1];
  const A = w[0] * w[0] + w[1] * w[1] - w[2] * w[2];
  const B = 2 * (ex * w[0] + ey * w[1] - q0[2] * w[2]);
  const C = ex * ex + ey * ey - q0[2] * q0[2];
  const roots: number[] = [];
  const big = Math.max(Math.abs(A), Math.abs(B), Math.abs(C));
  if (Math.abs(A) <= 1e-14 * big) {
    if (B !== 0) roots.push(-C / B);
  } else {
    const disc = B * B - 4 * A * C;
    if (disc >= 0) {
      const s = Math.sqrt(disc);
      roots.push((-B + s) / (2 * A), (-B - s) / (2 * A));
    } else if (disc > -1e-12 * B * B) roots.push(-B / (2 * A));
  }
  return roots.map((s) => [q0[0] + s * w[0], q0[1] + s * w[1]] as Point);
}

interface LineFeature {
  readonly n: Point;
  readonly c: number;
}
type EquiFeature = { readonly kind: 'point'; readonly v: Point } | { readonly kind: 'line'; readonly line: LineFeature };

function featuresOf(ring: Ring): EquiFeature[] {
  const out: EquiFeature[] = ring.map((v) => ({ kind: 'point', v }));
  for (const [a, b] of edgesOf(ring)) {
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    if (len === 0) continue;
    const n: Point = [(b[1] - a[1]) / len, -(b[0] - a[0]) / len];
    out.push({ kind: 'line', line: { n, c: n[0] * a[0] + n[1] * a[1] } });
  }
  return out;
}

const signSets = (k: number): number[][] => (k === 0 ? [[]] : signSets(k - 1).flatMap((s) => [[...s, 1], [...s, -1]]));
const SIGN_SETS = [0, 1, 2, 3].map(signSets);

/** Points equidistant from every feature in `fs`, also meeting `extra` rows (e.g. "on this copper edge's line"). */
function equidistantPoints(fs: readonly EquiFeature[], extra: readonly Row[]): Point[] {
  const lines = fs.filter((f): f is Extract<EquiFeature, { kind: 'line' }> => f.kind === 'line').map((f) => f.line);
  const points = fs.filter((f): f is Extract<EquiFeature, { kind: 'point' }> => f.kind === 'point').map((f) => f.v);
  const out: Point[] = [];
  // Signs: which side of each line the point lies on; the first line's sign is fixed by symmetry when t is free.
  for (const signs of SIGN_SETS[lines.length] ?? []) {
    const rows: Row[] = [...extra, ...lines.map((l, i) => [l.n[0], l.n[1], -signs[i]!, l.c] as Row)];
    // Two points' distances agree on their perpendicular bisector: a row without t.
    const [v0, ...rest] = points;
    for (const v of rest) rows.push([2 * (v[0] - v0![0]), 2 * (v[1] - v0![1]), 0, v[0] * v[0] + v[1] * v[1] - v0![0] * v0![0] - v0![1] * v0![1]]);
    if (rows.length === 3 && !v0) {
      const s = solve3(rows as [Row, Row, Row]);
      if (s) out.push([s[0], s[1]]);
    } else if (rows.length === 2 && v0) {
      out.push(...solve2q(rows[0]!, rows[1]!, v0));
    } else if (rows.length === 3 && v0) {
      const s = solve3(rows as [Row, Row, Row]);
      if (s) out.push([s[0], s[1]]);
    }
  }
  return out.filter((p) => Number.isFinite(p[0]) && Number.isFinite(p[1]));
}

function* pairs<T>(xs: readonly T[]): Generator<[T, T]> {
  for (let i = 0; i < xs.length; i++) for (let j = i + 1; j < xs.length; j++) yield [xs[i]!, xs[j]!];
}
function* triples<T>(xs: readonly T[]): Generator<[T, T, T]> {
  for (let i = 0; i < xs.length; i++) for (let j = i + 1; j < xs.length; j++) for (let k = j + 1; k < xs.length; k++) yield [xs[i]!, xs[j]!, xs[k]!];
}

// ───────────────────────────── margin of copper against a polygon region ─────────────────────────────

/**
 * min over the copper of s(p) against a polygon boundary; `allowedInside` for an area, false for a keep-out.
 */
function polygonMargin(shape: CopperShape, b: Boundary, allowedInside: boolean): RegionMargin {
  const ring = b.ring;
  const forbidden = (p: Point): boolean => pointInRing(p, ring) !== allowedInside;
  const copperRings = ringsOf(shape);
  const copperEdges = copperRings.flatMap(edgesOf);
  const boundaryEdges = edgesOf(ring);

  const overlaps =
    copperRings.some((r) => r.some(forbidden)) ||
    ring.some((v) => inCopper(v, shape)) ||
    copperEdges.some(([a, c]) => boundaryEdges.some(([p, q]) => segmentsIntersect(a, c, p, q)));

  if (overlaps) {
    let deepest: { depth: number; at: Point } = { depth: 0, at: shape.outline[0] ?? [0, 0] };
    const consider = (p: Point): void => {
      if (!forbidden(p)) return;
      const d = distanceToRing(p, ring);
      if (d > deepest.depth) deepest = { depth: d, at: p };
    };
    // Copper vertices.
    for (const r of copperRings) r.forEach(consider);
    const features = featuresOf(ring);
    // Points of copper edges equidistant from two boundary features. An edge that neither starts
    // nor ends on the forbidden side and meets no boundary edge lies wholly on the allowed side.
    const reaches = ([a, c]: [Point, Point]): boolean => forbidden(a) || forbidden(c) || boundaryEdges.some(([p, q]) => segmentsIntersect(a, c, p, q));
    for (const [a, c] of copperEdges.filter(reaches)) {
      const ex = c[0] - a[0];
      const ey = c[1] - a[1];
      const len2 = ex * ex + ey * ey;
      if (len2 === 0) continue;
      const onLine: Row = [-ey, ex, 0, -ey * a[0] + ex * a[1]];
      for (const pair of pairs(features)) {
        for (const p of equidistantPoints(pair, [onLine])) {
          const t = ((p[0] - a[0]) * ex + (p[1] - a[1]) * ey) / len2;
          if (t < -1e-9 || t > 1 + 1e-9) continue;
          const tc = Math.max(0, Math.min(1, t));
          consider([a[0] + tc * ex, a[1] + tc * ey]);
        }
      }
    }
    // Points inside the copper equidistant from three boundary features (medial-axis vertices).
    const cb = ringBounds(shape.outline);
    for (const triple of triples(features)) {
      for (const p of equidistantPoints(triple, [])) {
        if (p[0] < cb.xmin || p[0] > cb.xmax || p[1] < cb.ymin || p[1] > cb.ymax) continue;
        if (inCopper(p, shape)) consider(p);
      }
    }
    if (deepest.depth > 0) return { value: -deepest.depth, at: deepest.at, feature: nearestFeature(deepest.at, b).name };
  }

  // Apart (or only touching): the least distance between copper edges and boundary edges.
  let best: RegionMargin = { value: Infinity, at: shape.outline[0] ?? [0, 0], feature: '' };
  boundaryEdges.forEach(([p, q], i) => {
    for (const [a, c] of copperEdges) {
      const s = segmentSegment(a, c, p, q);
      if (s.distance < best.value) {
        const ft = pointSegment(s.q, p, q).t;
        const feature = s.distance > 0 && ft <= 0 ? b.vertexName(i) : s.distance > 0 && ft >= 1 ? b.vertexName((i + 1) % ring.length) : b.edgeName(i);
        best = { value: s.distance, at: s.p, feature };
      }
    }
  });
  return best;
}

/** Signed margin of copper against one region (m, before clearance). */
export function regionMargin(shape: CopperShape, region: Region, allowedInside: boolean): RegionMargin {
  if (region.kind !== 'circle') return polygonMargin(shape, boundaryOf(region), allowedInside);
  const c = region.center;
  if (allowedInside) {
    // The farthest point of a polygon from a centre is one of its outline's vertices.
    let far = { d: -Infinity, at: c as Point };
    for (const p of shape.outline) {
      const d = Math.hypot(p[0] - c[0], p[1] - c[1]);
      if (d > far.d) far = { d, at: p };
    }
    return { value: region.radius - far.d, at: far.at, feature: 'circle' };
  }
  if (inCopper(c, shape)) return { value: -region.radius, at: c, feature: 'circle' };
  let near = { d: Infinity, at: c as Point };
  for (const r of ringsOf(shape))
    for (const [a, b] of edgesOf(r)) {
      const f = pointSegment(c, a, b);
      if (f.distance < near.d) near = { d: f.distance, at: [a[0] + f.t * (b[0] - a[0]), a[1] + f.t * (b[1] - a[1])] };
    }
  return { value: near.d - region.radius, at: near.at, feature: 'circle' };
}

const zeroNoise = (m: number): number => (Math.abs(m) < TOUCH_TOLERANCE ? 0 : m);

/** Worst margin of the copper against the allowed area and the keep-outs, after `clearance` (m). */
export function checkFit(g: BoardGeometry, area: Region | undefined, keepouts: readonly Region[], clearance: number): FitReport {
  let margin = Infinity;
  let limitedBy = 'nothing';
  const consider = (m: RegionMargin, what: string): void => {
    const value = zeroNoise(m.value - clearance);
    if (value < margin) {
      margin = value;
      limitedBy = what;
    }
  };
  const islands: readonly CopperIsland[] = g.copper;
  for (const island of islands) {
    if (area) {
      const m = regionMargin(island, area, true);
      consider(m, `area ${m.feature}`);
    }
    // Keep-outs are counted from 1, as a reader counts the spec's list.
    keepouts.forEach((k, i) => consider(regionMargin(island, k, false), `keep-out ${i + 1} (${k.kind})`));
  }
  return { fits: margin >= 0, margin, limitedBy };
}

/** Signed margin of all copper inside the area without clearance (m); +Infinity without copper. */
export const areaSlack = (g: BoardGeometry, area: Region): number =>
  Math.min(Infinity, ...g.copper.map((c) => zeroNoise(regionMargin(c, area, true).value)));
