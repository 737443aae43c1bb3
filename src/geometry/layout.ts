// Copper of a single (or balanced) shunt-stub match from its section dimensions.
//
// Section frame (metres, y up): the load-side reference plane is the line x = 0, the series line
// runs along +x centred on y = 0, the stub centre-line starts at x = seriesLength, and the source
// reference plane is at x = seriesLength + leadLength. A 'left' stub points along +y (left of the
// load → source direction), a 'right' stub along −y. `placeGeometry` (place.ts) moves the result
// onto the board.
//
// Each stub starts on the series line's centre-line, so it overlaps the line by half the line width
// of real copper (Gerber spec 2023.08 §4.14: connect by overlap, not by touching), and the two are
// merged into one outline anyway. A short stub ends on the centre-line of a row of vias across its
// end; each via pad is a polygon (see `circlePolygon` for the area convention) that belongs to the
// same copper island. A row wider than the stub gets a bar of copper behind the via centres that
// ties every pad to the stub end.
//
// Folded stubs (when a straight one does not fit): 'L' turns once by 90° towards the load or the
// source, 'U' turns twice and comes back towards the series line. Every corner is mitred: the outer
// corner is cut off along a line that meets each outer edge `mitreCut` from the outer corner
// (Douville & James 1978, physics.md §4.3 [M]; the cut comes from mitreDouvilleJames). The stub's
// length is its centre-line length through the bends, measured along the centre-lines to the points
// where they meet (common practice, no source); the physical network takes that length corrected
// by each bend's own electrical length (mitredBendLength: a mitred bend is shorter than its centre-line).
import type { BoardGeometry, CopperIsland, Feature, Point, Port, Region, Ring, Via } from '../seams.js';
import { boundsOfRings, circlePolygon, normaliseRing, rectRing, ringBounds, snap } from './polygon.js';
import { unionRings } from './union.js';

export interface StubFold {
  readonly kind: 'L' | 'U';
  /** Which way the arm after the first corner runs: along −x ('load') or +x ('source'). */
  readonly toward: 'load' | 'source';
  /** Mitre of each corner: distance from the outer corner to the cut along each outer edge (m). */
  readonly mitreCut: number;
  /** Least gap the fold keeps between its copper and the series line, and between a U's two arms (m). */
  readonly clearance: number;
}

export interface StubLayoutInput {
  /** Series line and source lead width (m). */
  readonly seriesWidth: number;
  /** Load reference plane (x = 0) → stub centre-line (m). */
  readonly seriesLength: number;
  /** Stub centre-line → source reference plane (m), ≥ 0. */
  readonly leadLength: number;
  readonly stubWidth: number;
  /** From the series line's edge to the open end, or to the via centre for a short stub, along the centre-line through any bends (m). */
  readonly stubLength: number;
  /** ['left'] = +y; balanced = ['left', 'right']. */
  readonly stubSides: readonly ('left' | 'right')[];
  readonly termination: 'open' | 'short';
  /** Short stubs: `count` vias in a row across the stub end, `pitch` apart centre to centre, centred on the stub axis. */
  readonly via?: { readonly drill: number; readonly pad: number; readonly count: number; readonly pitch: number };
  /** Absent: a straight stub. */
  readonly fold?: StubFold;
  readonly area?: Region;
  readonly keepouts?: readonly Region[];
}

type Rect = Feature['rect'];

function requireLength(name: string, value: number, positive: boolean): void {
  if (!Number.isFinite(value)) throw new RangeError(`${name} must be finite, got ${value}`);
  if (positive ? !(value > 0) : value < 0)
    throw new RangeError(`${name} must be ${positive ? 'positive' : 'non-negative'}, got ${value}`);
}

function requireFiniteRegion(name: string, region: Region): void {
  const numbers =
    region.kind === 'rect'
      ? [...region.x, ...region.y]
      : region.kind === 'circle'
        ? [...region.center, region.radius]
        : region.points.flat();
  if (!numbers.every(Number.isFinite)) throw new RangeError(`${name} has a non-finite coordinate`);
}

/** Narrowest copper the layout draws (m). */
export const MIN_DRAWN_WIDTH = 1e-6;

function validate(input: StubLayoutInput): void {
  requireLength('seriesWidth', input.seriesWidth, true);
  requireLength('stubWidth', input.stubWidth, true);
  // Widths must survive the 1 nm board grid as real copper: a micrometre is far below any etch.
  for (const [name, w] of [['seriesWidth', input.seriesWidth], ['stubWidth', input.stubWidth]] as const) {
    if (w < MIN_DRAWN_WIDTH) throw new RangeError(`${name} must be at least ${MIN_DRAWN_WIDTH} m, got ${w}`);
  }
  requireLength('seriesLength', input.seriesLength, false);
  requireLength('leadLength', input.leadLength, false);
  requireLength('stubLength', input.stubLength, false);
  const sides = input.stubSides;
  // No side at all is a plain line: the load is already matched and needs no stub.
  if (sides.length > 2 || new Set(sides).size !== sides.length)
    throw new RangeError(`stubSides must be empty, one side or both distinct sides, got [${sides.join(', ')}]`);
  if (input.termination === 'short') {
    const v = input.via;
    if (!v) throw new RangeError('a short stub needs via dimensions');
    requireLength('via.drill', v.drill, true);
    requireLength('via.pad', v.pad, true);
    requireLength('via.pitch', v.pitch, false);
    if (!Number.isInteger(v.count) || v.count < 1) throw new RangeError(`via.count must be a whole number ≥ 1, got ${v.count}`);
    if (!(v.drill < v.pad)) throw new RangeError(`via.drill ${v.drill} must be smaller than via.pad ${v.pad}`);
    if (v.count > 1 && !(v.pitch > v.drill)) throw new RangeError(`via.pitch ${v.pitch} must exceed via.drill ${v.drill}: drills would overlap`);
  }
  if (input.fold) {
    requireLength('fold.mitreCut', input.fold.mitreCut, false);
    requireLength('fold.clearance', input.fold.clearance, false);
    const plan = planFold(input);
    if (typeof plan === 'string') throw new RangeError(plan);
  }
  if (input.area) requireFiniteRegion('area', input.area);
  (input.keepouts ?? []).forEach((k, i) => requireFiniteRegion(`keepouts[${i}]`, k));
}

// ───────────────────────────── the stub's own frame ─────────────────────────────
//
// (u, v): u along the series line towards where a fold turns, v from the series centre-line along
// the stub. A stub is mapped to the section frame by x = xStub + s·u, y = side·v (s = +1 towards
// the source, −1 towards the load; side = +1 left, −1 right).

/** Half the extent of the via row across the stub end (m); 0 for an open stub. */
function rowHalf(input: StubLayoutInput): number {
  const v = input.via;
  if (input.termination !== 'short' || !v) return 0;
  return ((v.count - 1) * v.pitch + v.pad) / 2;
}

export interface FoldPlan {
  /** Centre-line from the series line's edge through each corner to the end, in (u, v). */
  readonly centreLine: readonly Point[];
  /** The stub copper as one simple polygon in (u, v), mitred corners included. */
  readonly outline: Ring;
}

/**
 * The fold's arm lengths, or the reason it cannot be built. First arm: long enough that the arm
 * after the corner (and a via row across its end) clears the series line by `clearance`. U: the
 * second arm keeps the two parallel arms (and the via row) `clearance` apart, and the first arm is
 * chosen so the two parallel arms are as short as possible while the end still clears the line.
 */
export function planFold(input: StubLayoutInput): FoldPlan | string {
  const w = input.stubWidth;
  const hl = input.seriesWidth / 2;
  const L = input.stubLength;
  const fold = input.fold;
  if (!fold) {
    return { centreLine: [[0, hl], [0, hl + L]], outline: rectRing(-w / 2, 0, w / 2, hl + L) };
  }
  const a = fold.mitreCut;
  // Past 2w the cut would pass the inner corner (mitre fraction above 1, outside Douville–James).
  if (!(a < 2 * w)) return `the mitre cut ${a} m passes the inner corner of a ${w} m wide bend`;
  const half = Math.max(w / 2, rowHalf(input));
  const endPad = input.termination === 'short' && input.via ? input.via.pad / 2 : 0;
  if (fold.kind === 'L') {
    const a1 = half + fold.clearance;
    const a2 = L - a1;
    if (!(a2 >= Math.max(a, w))) return `an L-folded stub needs at least ${a1 + Math.max(a, w)} m of length, has ${L} m`;
    const c = hl + a1;
    if (!(c + w / 2 - a > hl)) return `the mitre cut ${a} m reaches the series line`;
    return {
      centreLine: [[0, hl], [0, c], [a2, c]],
      outline: [
        [-w / 2, 0],
        [w / 2, 0],
        [w / 2, c - w / 2],
        [a2, c - w / 2],
        [a2, c + w / 2],
        [-w / 2 + a, c + w / 2],
        [-w / 2, c + w / 2 - a],
      ],
    };
  }
  const a2 = half + w / 2 + fold.clearance;
  if (!(a2 + w > 2 * a)) return `the U's mitre cuts (${a} m) overlap across its ${a2 + w} m wide top`;
  const endClear = endPad + fold.clearance;
  const a1 = Math.max(half + fold.clearance, (L - a2 + endClear) / 2);
  const a3 = L - a1 - a2;
  if (!(a3 >= Math.max(a, w))) return `a U-folded stub needs at least ${a1 + a2 + Math.max(a, w)} m of length, has ${L} m`;
  const c = hl + a1;
  if (!(c + w / 2 - a > hl)) return `the mitre cut ${a} m reaches the series line`;
  return {
    centreLine: [[0, hl], [0, c], [a2, c], [a2, c - a3]],
    outline: [
      [-w / 2, 0],
      [w / 2, 0],
      [w / 2, c - w / 2],
      [a2 - w / 2, c - w / 2],
      [a2 - w / 2, c - a3],
      [a2 + w / 2, c - a3],
      [a2 + w / 2, c + w / 2 - a],
      [a2 + w / 2 - a, c + w / 2],
      [-w / 2 + a, c + w / 2],
      [-w / 2, c + w / 2 - a],
    ],
  };
}

/** Can this fold be built for these dimensions? */
export const foldFits = (input: StubLayoutInput): boolean => typeof planFold(input) !== 'string';

const rectOf = (xmin: number, ymin: number, xmax: number, ymax: number): Rect => ({
  xmin: snap(xmin),
  ymin: snap(ymin),
  xmax: snap(xmax),
  ymax: snap(ymax),
});

const ringOf = (r: Rect): Ring => rectRing(r.xmin, r.ymin, r.xmax, r.ymax);
const hasArea = (r: Rect): boolean => r.xmax > r.xmin && r.ymax > r.ymin;
const rectFromBounds = (ring: Ring): Rect => {
  const b = ringBounds(ring);
  return rectOf(b.xmin, b.ymin, b.xmax, b.ymax);
};
const snapPoint = ([x, y]: Point): Point => [snap(x), snap(y)];

export function layoutStubMatch(input: StubLayoutInput): BoardGeometry {
  validate(input);
  const halfLine = input.seriesWidth / 2;
  const xStub = input.seriesLength;
  const xEnd = input.seriesLength + input.leadLength;

  const lineFeature = (id: string, kind: 'line' | 'lead', x0: number, x1: number, length: number): Feature => {
    const rect = rectOf(x0, -halfLine, x1, halfLine);
    return { id, kind, rect, length, width: input.seriesWidth, outline: ringOf(rect), path: [[rect.xmin, 0], [rect.xmax, 0]] };
  };
  const features: Feature[] = [lineFeature('series', 'line', 0, xStub, input.seriesLength), lineFeature('lead-source', 'lead', xStub, xEnd, input.leadLength)];

  const plan = planFold(input) as FoldPlan;
  const s = input.fold?.toward === 'load' ? -1 : 1;
  // Canonical side order (left, then right) keeps ids stable whatever order the caller lists.
  const sides = (['left', 'right'] as const).filter((side) => input.stubSides.includes(side));
  const vias: Via[] = [];
  sides.forEach((side, index) => {
    const sign = side === 'left' ? 1 : -1;
    const toSection = ([u, v]: Point): Point => [xStub + s * u, sign * v];
    const outline = normaliseRing(plan.outline.map(toSection), true);
    const path = plan.centreLine.map((p) => snapPoint(toSection(p)));
    features.push({
      id: index === 0 ? 'stub' : `stub-${index + 1}`,
      kind: 'stub',
      rect: rectFromBounds(outline),
      length: input.stubLength,
      width: input.stubWidth,
      outline,
      path,
    });
    const v = input.via;
    if (input.termination !== 'short' || !v) return;
    // The row runs across the last arm at its end: along the perpendicular of the end direction.
    const end = path[path.length - 1]!;
    const before = path[path.length - 2]!;
    const len = Math.hypot(end[0] - before[0], end[1] - before[1]) || 1;
    const d: Point = [(end[0] - before[0]) / len, (end[1] - before[1]) / len];
    const across: Point = [-d[1], d[0]];
    const offsets = Array.from({ length: v.count }, (_, k) => (k - (v.count - 1) / 2) * v.pitch);
    const span = (v.count - 1) * v.pitch;
    const barNumber = index + 1;
    if (span > input.stubWidth) {
      // Bar behind the via centres, as wide as the row, one pad radius deep: every pad overlaps it.
      const at = (o: number, back: number): Point => [end[0] + across[0] * o - d[0] * back, end[1] + across[1] * o - d[1] * back];
      const bar = normaliseRing([at(-span / 2, 0), at(span / 2, 0), at(span / 2, v.pad / 2), at(-span / 2, v.pad / 2)], true);
      features.push({ id: `via-bar-${barNumber}`, kind: 'pad', rect: rectFromBounds(bar), length: span, width: v.pad / 2, outline: bar });
    }
    // Vias numbered along the row by board x, then y, whichever way the stub points.
    const centres = offsets.map((o): Point => [snap(end[0] + across[0] * o), snap(end[1] + across[1] * o)]).sort((p, q) => p[0] - q[0] || p[1] - q[1]);
    for (const centre of centres) {
      const n = vias.length + 1;
      vias.push({ x: centre[0], y: centre[1], drill: v.drill, pad: v.pad });
      features.push({
        id: `via-pad-${n}`,
        kind: 'pad',
        rect: rectOf(centre[0] - v.pad / 2, centre[1] - v.pad / 2, centre[0] + v.pad / 2, centre[1] + v.pad / 2),
        length: v.pad,
        width: v.pad,
        outline: circlePolygon(centre, v.pad / 2),
      });
    }
  });

  const shapes = features.filter((f) => hasArea(f.rect)).map((f) => f.outline ?? ringOf(f.rect));
  const islands = unionRings(shapes);
  const copper: CopperIsland[] = islands.map((island, i) => ({
    id: islands.length === 1 ? 'copper' : `copper-${i + 1}`,
    outline: island.outline,
    holes: island.holes,
  }));

  const ports: Port[] = [
    { role: 'load', x: 0, y: 0, directionDeg: 0, width: input.seriesWidth },
    { role: 'source', x: snap(xEnd), y: 0, directionDeg: 180, width: input.seriesWidth },
  ];

  const geometry: BoardGeometry = {
    copper,
    vias,
    ports,
    features,
    keepouts: input.keepouts ? [...input.keepouts] : [],
    bounds: boundsOfRings(copper.map((c) => c.outline)),
  };
  return input.area ? { ...geometry, area: input.area } : geometry;
}
