// Union of copper shapes into islands (outline + holes) with clipper2-ts. Clipper2 rounds to
// 10^-precision of the unit it is given, and its precision stops at 8, so the union runs in
// millimetres at precision 6: the same 1 nm grid the Gerber and DXF writers use.
import { Clipper, ClipType, FillRule, PolyTreeD, type PathD, type PolyPathD } from 'clipper2-ts';
import type { Ring } from '../seams.js';
import { normaliseRing, polygonArea, ringBounds } from './polygon.js';

const MM_PER_M = 1e3;
const UNION_PRECISION = 6;

export interface UnionIsland {
  readonly outline: Ring;
  readonly holes: readonly Ring[];
}

const toPathMm = (ring: Ring): PathD => ring.map(([x, y]) => ({ x: x * MM_PER_M, y: y * MM_PER_M }));
const fromPathMm = (path: PathD): Ring => path.map((p) => [p.x / MM_PER_M, p.y / MM_PER_M] as const);

/**
 * Union of rings (any orientation, non-zero fill) into islands, each normalised: outline
 * counter-clockwise, holes clockwise, snapped to 1 nm, without duplicate or collinear points.
 * Islands are ordered by their lowest x, then lowest y, so the order does not depend on the input order.
 */
export function unionRings(rings: readonly Ring[]): UnionIsland[] {
  const subject = rings.filter((r) => r.length >= 3 && Math.abs(polygonArea(r)) > 0).map(toPathMm);
  if (subject.length === 0) return [];
  const tree = new PolyTreeD();
  Clipper.booleanOpDWithPolyTree(ClipType.Union, subject, null, tree, FillRule.NonZero, UNION_PRECISION);
  const islands: UnionIsland[] = [];
  // Level 1 nodes are outlines, their children holes, and a hole's children are islands again.
  const visitOuter = (node: PolyPathD): void => {
    const outline = normaliseRing(fromPathMm(node.poly ?? []), true);
    const holes: Ring[] = [];
    for (let i = 0; i < node.count; i++) {
      const hole = node.child(i);
      const ring = normaliseRing(fromPathMm(hole.poly ?? []), false);
      if (ring.length >= 3) holes.push(ring);
      for (let j = 0; j < hole.count; j++) visitOuter(hole.child(j));
    }
    if (outline.length >= 3) islands.push({ outline, holes: holes.sort(compareRings) });
  };
  for (let i = 0; i < tree.count; i++) visitOuter(tree.child(i));
  return islands.sort((a, b) => compareRings(a.outline, b.outline));
}

function compareRings(a: Ring, b: Ring): number {
  const ba = ringBounds(a);
  const bb = ringBounds(b);
  return ba.xmin - bb.xmin || ba.ymin - bb.ymin || ba.xmax - bb.xmax || ba.ymax - bb.ymax;
}
