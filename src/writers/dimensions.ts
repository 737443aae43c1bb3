// Dimension lines shared by the SVG and DXF writers: one for every length and every width of the
// drawn features, placed outside the copper. They are worked out in the section's own frame (where
// the series line runs along +x and feature rects and centre-lines are given), then carried to the
// board by the geometry's placement, so a rotated or mirrored section keeps correct dimensions.
import type { BoardGeometry, Bounds, Feature, Point } from '../seams.js';
import { EMPTY_BOUNDS, isEmptyBounds, mergeBounds } from '../geometry/polygon.js';
import { IDENTITY_PLACEMENT, placementMap } from '../geometry/place.js';
import { labelHeight, mmLabel, type ArtworkMeta } from './units.js';

export interface Dimension {
  /** The two measured points (board frame, m). */
  readonly from: Point;
  readonly to: Point;
  /** Unit normal towards the side the dimension line sits on, and its distance from the measured points (m). */
  readonly normal: Point;
  readonly offset: number;
  readonly label: string;
}

const label = (prefix: string, v: number): string => `${prefix} ${mmLabel(v)} mm`;
const sub = (a: Point, b: Point): Point => [a[0] - b[0], a[1] - b[1]];
const dot = (a: Point, b: Point): number => a[0] * b[0] + a[1] * b[1];
const along = (p: Point, d: Point, t: number): Point => [p[0] + d[0] * t, p[1] + d[1] * t];

function rectBounds(features: readonly Feature[]): Bounds {
  return features.reduce((b, f) => mergeBounds(b, f.rect), EMPTY_BOUNDS);
}

/** How far the copper reaches past point p along direction n (m, ≥ 0). */
function reach(b: Bounds, p: Point, n: Point): number {
  const corners: Point[] = [[b.xmin, b.ymin], [b.xmax, b.ymin], [b.xmax, b.ymax], [b.xmin, b.ymax]];
  return Math.max(0, ...corners.map((c) => dot(sub(c, p), n)));
}

/** Dimensions of one stub: each straight segment of its centre-line, and its width at the end. */
function stubDimensions(f: Feature, all: Bounds, gap: number, pads: readonly Feature[]): Dimension[] {
  const r = f.rect;
  const path = f.path ?? [];
  if (path.length < 2) return [];
  const centre: Point = [(r.xmin + r.xmax) / 2, (r.ymin + r.ymax) / 2];
  const out: Dimension[] = [];
  const segments = path.length - 1;
  for (let i = 0; i < segments; i++) {
    const p = path[i]!;
    const q = path[i + 1]!;
    const len = Math.hypot(q[0] - p[0], q[1] - p[1]);
    if (len === 0) continue;
    const d: Point = [(q[0] - p[0]) / len, (q[1] - p[1]) / len];
    // Outward: away from the middle of the stub's extent; a straight stub's dimension sits on its +x side.
    let n: Point = [d[1], -d[0]];
    const mid: Point = [(p[0] + q[0]) / 2, (p[1] + q[1]) / 2];
    const side = dot(sub(mid, centre), n);
    if (side < 0 || (side === 0 && n[0] < 0)) n = [-n[0], -n[1]];
    const edge = f.width / 2;
    const from = along(p, n, edge);
    // A fold's arm along the series line: beyond all copper on its side, and below the chain of line lengths.
    const offset = segments > 1 && Math.abs(n[1]) > 0.5 ? reach(all, from, n) + (n[1] < 0 ? 2 : 1) * gap : gap;
    out.push({ from, to: along(q, n, edge), normal: n, offset, label: label(segments > 1 ? `L${i + 1}` : 'L', len) });
  }
  const end = path[path.length - 1]!;
  const before = path[path.length - 2]!;
  const len = Math.hypot(end[0] - before[0], end[1] - before[1]) || 1;
  const d: Point = [(end[0] - before[0]) / len, (end[1] - before[1]) / len];
  const across: Point = [-d[1], d[0]];
  const text = segments > 1 ? `${label('W', f.width)}, L total ${mmLabel(f.length)} mm` : label('W', f.width);
  // A U's end points back at the series line: its width sits just past the end (and any via pads),
  // in the space the fold keeps clear, not beyond all the copper on the far side.
  const first = path[1]!;
  const returns = dot(d, sub(first, path[0]!)) < 0;
  const offset = returns ? Math.max(0, ...pads.map((p) => dot(sub([p.rect.xmax, p.rect.ymax], end), d)), ...pads.map((p) => dot(sub([p.rect.xmin, p.rect.ymin], end), d))) + 0.5 * gap : reach(all, end, d) + gap;
  out.push({ from: along(end, across, -f.width / 2), to: along(end, across, f.width / 2), normal: d, offset, label: text });
  return out;
}

/** Every feature's length and width dimensions, in the board frame. */
export function featureDimensions(g: BoardGeometry, h = labelHeight(g.bounds)): Dimension[] {
  const local = rectBounds(g.features);
  if (isEmptyBounds(local)) return [];
  const gap = 2.5 * h;
  const dims: Dimension[] = [];
  for (const f of g.features) {
    const r = f.rect;
    if (f.kind === 'line' || f.kind === 'lead') {
      // Line and lead lengths as one chain below the lowest copper; widths at the line ends.
      if (f.length > 0) dims.push({ from: [r.xmin, r.ymin], to: [r.xmax, r.ymin], normal: [0, -1], offset: r.ymin - local.ymin + gap, label: label('L', f.length) });
      const x = f.kind === 'line' ? r.xmin : r.xmax;
      dims.push({ from: [x, r.ymin], to: [x, r.ymax], normal: [f.kind === 'line' ? -1 : 1, 0], offset: gap * 2, label: label('W', f.width) });
    } else if (f.kind === 'stub') {
      // The via pads at this stub's end: those within a pad of its last centre-line point.
      const end = f.path?.at(-1);
      const pads = end ? g.features.filter((p) => p.kind === 'pad' && Math.hypot((p.rect.xmin + p.rect.xmax) / 2 - end[0], (p.rect.ymin + p.rect.ymax) / 2 - end[1]) <= p.length + f.width * 2 + 1e-3) : [];
      dims.push(...stubDimensions(f, local, gap, pads));
    }
  }
  const map = placementMap(g.placement ?? IDENTITY_PLACEMENT);
  const origin = map([0, 0]);
  const direction = (n: Point): Point => sub(map(n), origin);
  return dims.map((d) => ({ ...d, from: map(d.from), to: map(d.to), normal: direction(d.normal) }));
}

/** The caller's extra dimensions (board frame), stacked below the chain of line lengths. */
export function extraDimensions(g: BoardGeometry, meta: ArtworkMeta, h = labelHeight(g.bounds)): Dimension[] {
  return (meta.dimensions ?? []).map((d, i) => ({
    from: d.from,
    to: d.to,
    normal: [0, -1],
    offset: Math.max(0, Math.min(d.from[1], d.to[1]) - g.bounds.ymin) + (7.5 + 2.5 * i) * h,
    label: d.label,
  }));
}

/** Where a dimension is drawn: the dimension line's two ends and the label anchor (board frame). */
export function dimensionLine(d: Dimension, h: number): { readonly a: Point; readonly b: Point; readonly labelAt: Point; readonly angleDeg: number } {
  const a = along(d.from, d.normal, d.offset);
  const b = along(d.to, d.normal, d.offset);
  const labelAt = along([(a[0] + b[0]) / 2, (a[1] + b[1]) / 2], d.normal, 0.9 * h);
  // Text along the line, turned so it never reads upside down: angle in (−90°, 90°].
  let angle = (Math.atan2(b[1] - a[1], b[0] - a[0]) * 180) / Math.PI;
  if (angle > 90 + 1e-9) angle -= 180;
  if (angle <= -90 + 1e-9) angle += 180;
  return { a, b, labelAt, angleDeg: Math.round(angle * 1e6) / 1e6 || 0 };
}
