// Fabrication design rules on the laid-out copper, one error diagnostic per broken rule and place:
// trace width, via annular ring, space between copper (between islands, across gaps inside one
// island, and between drills of vias whose pads merge), and copper to the board edge (the allowed
// area's boundary). Plane geometry throughout (common practice, no source).
//
// Measured values come from copper on the 1 nm board grid (snapping moves a distance by up to
// √2 nm), so a rule counts as broken only when the value is more than RULE_TOLERANCE below its
// limit; nothing is clamped.
import type { BoardGeometry, CopperIsland, FabRules, Feature, Point, Region, Ring } from '../seams.js';
import { diagnostic, type Diagnostic } from '../diagnostics.js';
import { fixed } from '../format.js';
import { rectRing } from './polygon.js';
import { placementMap } from './place.js';
import { distanceToRing, inCopper, regionMargin, segmentSegment, type CopperShape } from './fit.js';

/** Two grid steps: a gap is broken only when it is this much (m) or more below the limit. */
export const RULE_TOLERANCE = 2e-9;

/** Edges whose outward normals are within this angle of opposite face each other across a gap. */
const FACING_COS = Math.cos(Math.PI / 4);

const mm3 = (metres: number): string => fixed(metres * 1e3, 3);
const compareText = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);
const below = (value: number, limit: number): boolean => value < limit - RULE_TOLERANCE;

export function checkDesignRules(g: BoardGeometry, fab: FabRules, area?: Region): Diagnostic[] {
  return [...traceWidths(g, fab), ...annularRings(g, fab), ...spaces(g, fab), ...(area ? copperToEdge(g, fab, area) : [])];
}

function traceWidths(g: BoardGeometry, fab: FabRules): Diagnostic[] {
  return g.features
    .filter((f) => below(f.width, fab.minTrace))
    .map((f) => diagnostic('fab.too-narrow', f.id, `${f.id}: width ${mm3(f.width)} mm below fab.min_trace ${mm3(fab.minTrace)} mm`));
}

function annularRings(g: BoardGeometry, fab: FabRules): Diagnostic[] {
  // Annular ring = (pad − drill) / 2, the copper left around the hole; fab.min_annular_ring
  // defaults to IPC-6012E (2020) Class 3 external, 0.05 mm (physics.md §9.1 [R]). The drill itself
  // is fab.via_drill by construction, so it is not checked against it.
  return g.vias.flatMap((v, i) => {
    const ring = (v.pad - v.drill) / 2;
    const id = `via-${i + 1}`;
    return below(ring, fab.minAnnularRing)
      ? [diagnostic('fab.annular-ring', id, `${id}: annular ring ${mm3(ring)} mm below fab.min_annular_ring ${mm3(fab.minAnnularRing)} mm`)]
      : [];
  });
}

// ───────────────────────────── space ─────────────────────────────

/** The feature a copper point belongs to: a via pad (by its circle) before any rectangle it lies on. */
function featureAt(p: Point, g: BoardGeometry, fallback: string): string {
  let best = { d: Infinity, id: fallback };
  g.vias.forEach((v, i) => {
    const d = Math.abs(Math.hypot(p[0] - v.x, p[1] - v.y) - v.pad / 2);
    // Pad polygons reach up to 1 µm past the circle; 2 µm covers that and the grid.
    if (d <= 2e-6 && d < best.d) best = { d, id: `via-pad-${i + 1}` };
  });
  if (best.d < Infinity) return best.id;
  for (const piece of pieces(g)) {
    if (piece.id.startsWith('via-pad-')) continue;
    const d = inCopper(p, piece.shape) ? 0 : distanceToRing(p, piece.shape.outline);
    if (d < best.d) best = { d, id: piece.id };
  }
  return best.id;
}

interface Edge {
  readonly a: Point;
  readonly b: Point;
  /** Outward normal (copper on the left of a→b for outlines; holes run the other way, so it also points away from copper). */
  readonly n: Point;
  readonly ring: number;
  readonly index: number;
  readonly size: number;
}

function edgesOfIsland(island: CopperIsland): Edge[] {
  return [island.outline, ...island.holes].flatMap((ring, r) =>
    ring.map((a, i) => {
      const b = ring[(i + 1) % ring.length]!;
      const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
      return { a, b, n: [(b[1] - a[1]) / len, -(b[0] - a[0]) / len] as Point, ring: r, index: i, size: ring.length };
    }),
  );
}

const adjacent = (e: Edge, f: Edge): boolean =>
  e.ring === f.ring && (e.index === f.index || (e.index + 1) % e.size === f.index || (f.index + 1) % f.size === e.index);

/**
 * For antiparallel edges, the points facing each other in the middle of their common span: the
 * closest points of parallel edges are not unique, and an end point can sit on a neighbouring
 * feature (e.g. where a folded stub's arm meets the line), which would name the wrong feature.
 */
function facingMiddle(e: Edge, f: Edge): [Point, Point] | null {
  const dx = e.b[0] - e.a[0];
  const dy = e.b[1] - e.a[1];
  const len2 = dx * dx + dy * dy;
  const cross = e.n[0] * f.n[1] - e.n[1] * f.n[0];
  if (len2 === 0 || Math.abs(cross) > 1e-9) return null;
  const along = (p: Point): number => ((p[0] - e.a[0]) * dx + (p[1] - e.a[1]) * dy) / len2;
  const lo = Math.max(0, Math.min(along(f.a), along(f.b)));
  const hi = Math.min(1, Math.max(along(f.a), along(f.b)));
  if (!(lo <= hi)) return null;
  const t = (lo + hi) / 2;
  const p: Point = [e.a[0] + t * dx, e.a[1] + t * dy];
  // Its foot on f's line, offset by the gap along e's outward normal.
  const gap = (f.a[0] - p[0]) * e.n[0] + (f.a[1] - p[1]) * e.n[1];
  return [p, [p[0] + gap * e.n[0], p[1] + gap * e.n[1]]];
}

/**
 * Two overlapping pads make one land; the V at their waist is not a gap between separate copper
 * (their holes are checked by the drill-to-drill rule instead).
 */
function atWaistOfMergedPads(p: Point, q: Point, g: BoardGeometry): boolean {
  const a = featureAt(p, g, '');
  const b = featureAt(q, g, '');
  const padIndex = (id: string): number => (id.startsWith('via-pad-') ? Number(id.slice('via-pad-'.length)) - 1 : -1);
  const va = g.vias[padIndex(a)];
  const vb = g.vias[padIndex(b)];
  return va !== undefined && vb !== undefined && va !== vb && Math.hypot(va.x - vb.x, va.y - vb.y) < (va.pad + vb.pad) / 2 + RULE_TOLERANCE;
}

interface Gap {
  readonly first: string;
  readonly second: string;
  readonly gap: number;
  readonly what: string;
}

function spaces(g: BoardGeometry, fab: FabRules): Diagnostic[] {
  const found = new Map<string, Gap>();
  const note = (p: Point, q: Point, gap: number, fallback: [string, string], what = 'space'): void => {
    const ids = [featureAt(p, g, fallback[0]), featureAt(q, g, fallback[1])].sort();
    const key = `${what}|${ids[0]}|${ids[1]}`;
    const old = found.get(key);
    if (!old || gap < old.gap) found.set(key, { first: ids[0]!, second: ids[1]!, gap, what });
  };
  const limit = fab.minSpace - RULE_TOLERANCE;
  const islandEdges = g.copper.map(edgesOfIsland);

  // Between islands: their closest approach (they are disjoint, or they would be one island).
  for (let i = 0; i < g.copper.length; i++)
    for (let j = i + 1; j < g.copper.length; j++)
      for (const e of islandEdges[i]!)
        for (const f of islandEdges[j]!) {
          const s = segmentSegment(e.a, e.b, f.a, f.b);
          if (s.distance < limit) note(s.p, s.q, s.distance, [g.copper[i]!.id, g.copper[j]!.id]);
        }

  // Inside one island: edges that face each other across empty space (a notch between two via
  // pads, the arms of a folded stub). Edges meeting at a corner, or at right angles, are not a gap.
  g.copper.forEach((island, k) => {
    const edges = islandEdges[k]!;
    for (let i = 0; i < edges.length; i++)
      for (let j = i + 1; j < edges.length; j++) {
        const e = edges[i]!;
        const f = edges[j]!;
        if (adjacent(e, f) || e.n[0] * f.n[0] + e.n[1] * f.n[1] > -FACING_COS) continue;
        const s = segmentSegment(e.a, e.b, f.a, f.b);
        if (!(s.distance < limit) || s.distance === 0) continue;
        const [p, q] = facingMiddle(e, f) ?? [s.p, s.q];
        const dx = q[0] - p[0];
        const dy = q[1] - p[1];
        const faces = e.n[0] * dx + e.n[1] * dy > 0 && -(f.n[0] * dx + f.n[1] * dy) > 0;
        const mid: Point = [(p[0] + q[0]) / 2, (p[1] + q[1]) / 2];
        if (!faces || inCopper(mid, island) || atWaistOfMergedPads(p, q, g)) continue;
        note(p, q, s.distance, [island.id, island.id]);
      }
  });

  // Drills of vias whose pads merge: the web between the holes must keep the minimum space too
  // (the spec has no separate hole-to-hole rule; common practice, no source). Separate pads are
  // checked above as copper, and their gap is always the smaller one.
  for (let i = 0; i < g.vias.length; i++)
    for (let j = i + 1; j < g.vias.length; j++) {
      const a = g.vias[i]!;
      const b = g.vias[j]!;
      const centres = Math.hypot(a.x - b.x, a.y - b.y);
      if (centres > (a.pad + b.pad) / 2 + RULE_TOLERANCE) continue;
      const web = centres - (a.drill + b.drill) / 2;
      if (web < limit) found.set(`drill|via-${i + 1}|via-${j + 1}`, { first: `via-${i + 1}`, second: `via-${j + 1}`, gap: web, what: 'drill-to-drill space' });
    }

  // Stable order whatever the edge order: by the features named, then by the kind of space.
  const byNames = (a: Gap, b: Gap): number => compareText(a.first, b.first) || compareText(a.second, b.second) || compareText(a.what, b.what);
  return [...found.values()].sort(byNames).map(({ first, second, gap, what }) => {
    const where = first === second ? first : `${first} to ${second}`;
    return diagnostic('fab.min-space', first, `${where}: ${what} ${mm3(gap)} mm below fab.min_space ${mm3(fab.minSpace)} mm`);
  });
}

// ───────────────────────────── copper to edge ─────────────────────────────

interface Piece {
  readonly id: string;
  readonly shape: CopperShape;
}

/**
 * Copper by feature: each feature's own outline before union (board coordinates), or its rectangle
 * moved by the placement when it has none; islands when there are no features.
 * Features without area are not drawn and are skipped.
 */
function pieces(g: BoardGeometry): Piece[] {
  if (g.features.length === 0) return g.copper.map((c) => ({ id: c.id, shape: c }));
  const drawn = (f: Feature): boolean => f.rect.xmax > f.rect.xmin && f.rect.ymax > f.rect.ymin;
  // A rectangle is in the section's frame: move it onto the board (orientation does not matter here).
  const toBoard = g.placement ? placementMap(g.placement) : (p: Point): Point => p;
  const outlineOf = (f: Feature): Ring => f.outline ?? rectRing(f.rect.xmin, f.rect.ymin, f.rect.xmax, f.rect.ymax).map(toBoard);
  return g.features.filter(drawn).map((f) => ({ id: f.id, shape: { outline: outlineOf(f), holes: [] } }));
}

function copperToEdge(g: BoardGeometry, fab: FabRules, area: Region): Diagnostic[] {
  return pieces(g).flatMap(({ id, shape }) => {
    const m = regionMargin(shape, area, true);
    if (!below(m.value, fab.copperToEdge)) return [];
    const place = `board edge (area ${m.feature})`;
    const text =
      m.value >= 0
        ? `${id}: ${mm3(m.value)} mm from the ${place}, below fab.copper_to_edge ${mm3(fab.copperToEdge)} mm`
        : `${id}: ${mm3(-m.value)} mm outside the ${place}; fab.copper_to_edge is ${mm3(fab.copperToEdge)} mm`;
    return [diagnostic('fab.copper-to-edge', id, text)];
  });
}
