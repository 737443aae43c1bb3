// Seeded property tests of checkFit against independent closed forms (plane geometry, common
// practice, no source): for an axis-aligned copper rectangle C and a rectangular area A, the least
// signed distance of C to A's edge is the smallest side gap when C ⊂ A, and otherwise minus the
// largest corner distance outside A (distance outside a rectangle is convex, so its maximum over C
// is at a corner); for a circle keep-out it is the distance from the centre to C minus the radius.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkFit, rectRing } from '../../src/geometry/index.js';
import type { BoardGeometry, Region } from '../../src/seams.js';

const um = 1e-6;

interface Box {
  readonly x0: number;
  readonly y0: number;
  readonly x1: number;
  readonly y1: number;
}

/** Integer micrometres, positive size. */
const box = (span: number, size: number): fc.Arbitrary<Box> =>
  fc
    .record({ x: fc.integer({ min: -span, max: span }), y: fc.integer({ min: -span, max: span }), w: fc.integer({ min: 1, max: size }), h: fc.integer({ min: 1, max: size }) })
    .map(({ x, y, w, h }) => ({ x0: x, y0: y, x1: x + w, y1: y + h }));

const boardOf = (c: Box): BoardGeometry => ({
  copper: [{ id: 'copper', outline: rectRing(c.x0 * um, c.y0 * um, c.x1 * um, c.y1 * um), holes: [] }],
  vias: [],
  ports: [],
  features: [],
  keepouts: [],
  bounds: { xmin: c.x0 * um, ymin: c.y0 * um, xmax: c.x1 * um, ymax: c.y1 * um },
});
const rectRegion = (a: Box): Region => ({ kind: 'rect', x: [a.x0 * um, a.x1 * um], y: [a.y0 * um, a.y1 * um] });
const shift = (c: Box, dx: number, dy: number): Box => ({ x0: c.x0 + dx, y0: c.y0 + dy, x1: c.x1 + dx, y1: c.y1 + dy });

/** Expected margin (µm) of copper C in area A, and the limiting side when C ⊂ A. */
function expectedInArea(c: Box, a: Box): { margin: number; side?: 'x min' | 'x max' | 'y min' | 'y max' } {
  const corners: [number, number][] = [
    [c.x0, c.y0],
    [c.x1, c.y0],
    [c.x1, c.y1],
    [c.x0, c.y1],
  ];
  const outside = corners.map(([x, y]) => Math.hypot(Math.max(0, a.x0 - x, x - a.x1), Math.max(0, a.y0 - y, y - a.y1)));
  const worst = Math.max(...outside);
  if (worst > 0) return { margin: -worst };
  const gaps = { 'x min': c.x0 - a.x0, 'x max': a.x1 - c.x1, 'y min': c.y0 - a.y0, 'y max': a.y1 - c.y1 } as const;
  const entries = Object.entries(gaps) as ['x min' | 'x max' | 'y min' | 'y max', number][];
  const least = Math.min(...entries.map(([, g]) => g));
  const limiting = entries.filter(([, g]) => g === least);
  return limiting.length === 1 ? { margin: least, side: limiting[0]![0] } : { margin: least };
}

describe('checkFit properties: rectangular copper in a rectangular area', () => {
  it('margin equals the closed form, and fits exactly when margin ≥ 0', () => {
    fc.assert(
      fc.property(box(3000, 4000), box(3000, 8000), fc.integer({ min: 0, max: 500 }), (c, a, clearance) => {
        const f = checkFit(boardOf(c), rectRegion(a), [], clearance * um);
        const e = expectedInArea(c, a);
        expect(f.margin / um).toBeCloseTo(e.margin - clearance, 6);
        expect(f.fits).toBe(f.margin >= 0);
        if (e.side && e.margin > 0) expect(f.limitedBy).toBe(`area edge ${e.side}`);
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it('moving the copper δ towards the limiting edge lowers the margin by exactly δ, inside or out', () => {
    fc.assert(
      fc.property(box(2000, 3000), fc.integer({ min: 1, max: 3000 }), fc.constantFrom('x min', 'x max', 'y min', 'y max'), fc.integer({ min: 0, max: 2000 }), (c, room, side, delta) => {
        // An area with `room` µm on the chosen side and 5 mm on the others, so that side limits.
        const far = 5000;
        const a: Box = {
          x0: c.x0 - (side === 'x min' ? room : far),
          x1: c.x1 + (side === 'x max' ? room : far),
          y0: c.y0 - (side === 'y min' ? room : far),
          y1: c.y1 + (side === 'y max' ? room : far),
        };
        const step: [number, number] = side === 'x min' ? [-1, 0] : side === 'x max' ? [1, 0] : side === 'y min' ? [0, -1] : [0, 1];
        const before = checkFit(boardOf(c), rectRegion(a), [], 0);
        const after = checkFit(boardOf(shift(c, step[0] * delta, step[1] * delta)), rectRegion(a), [], 0);
        expect(before.margin / um).toBeCloseTo(room, 6);
        expect(before.limitedBy).toBe(`area edge ${side}`);
        // Past the edge the copper sticks out over that side only, so the margin keeps falling by δ.
        expect((before.margin - after.margin) / um).toBeCloseTo(delta, 6);
        expect(after.fits).toBe(delta <= room);
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it('a clockwise polygon of the same rectangle gives the same margin', () => {
    fc.assert(
      fc.property(box(3000, 4000), box(3000, 8000), (c, a) => {
        const poly: Region = { kind: 'polygon', points: [...rectRing(a.x0 * um, a.y0 * um, a.x1 * um, a.y1 * um)].reverse() };
        expect(checkFit(boardOf(c), poly, [], 0).margin / um).toBeCloseTo(checkFit(boardOf(c), rectRegion(a), [], 0).margin / um, 6);
      }),
      { seed: 42, numRuns: 200 },
    );
  });
});

describe('checkFit properties: keep-outs', () => {
  it('circle keep-out: distance from the centre to the copper minus radius and clearance', () => {
    fc.assert(
      fc.property(box(3000, 4000), fc.integer({ min: -6000, max: 6000 }), fc.integer({ min: -6000, max: 6000 }), fc.integer({ min: 1, max: 3000 }), fc.integer({ min: 0, max: 300 }), (c, cx, cy, r, clearance) => {
        const d = Math.hypot(Math.max(0, c.x0 - cx, cx - c.x1), Math.max(0, c.y0 - cy, cy - c.y1));
        const f = checkFit(boardOf(c), undefined, [{ kind: 'circle', center: [cx * um, cy * um], radius: r * um }], clearance * um);
        expect(f.margin / um).toBeCloseTo(d - r - clearance, 6);
        expect(f.fits).toBe(f.margin >= 0);
        expect(f.limitedBy).toBe('keep-out 1 (circle)');
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it('rect keep-out: gap when apart, depth of the deepest copper point when overlapping', () => {
    fc.assert(
      fc.property(box(3000, 4000), box(3000, 4000), (c, k) => {
        // Apart: distance between the boxes. Overlapping: the overlap box ∩ has its deepest point in K at
        // depth max over p ∈ C∩K of min(x − k.x0, k.x1 − x, y − k.y0, k.y1 − y), separable per axis:
        // min(best x-depth, best y-depth), each the depth of the overlap interval's point nearest K's middle.
        const gx = Math.max(0, k.x0 - c.x1, c.x0 - k.x1);
        const gy = Math.max(0, k.y0 - c.y1, c.y0 - k.y1);
        const axisDepth = (lo: number, hi: number, k0: number, k1: number): number => {
          const mid = Math.min(Math.max((k0 + k1) / 2, lo), hi);
          return Math.min(mid - k0, k1 - mid);
        };
        const overlap = c.x0 < k.x1 && k.x0 < c.x1 && c.y0 < k.y1 && k.y0 < c.y1;
        const expected = overlap
          ? -Math.min(axisDepth(Math.max(c.x0, k.x0), Math.min(c.x1, k.x1), k.x0, k.x1), axisDepth(Math.max(c.y0, k.y0), Math.min(c.y1, k.y1), k.y0, k.y1))
          : Math.hypot(gx, gy);
        const f = checkFit(boardOf(c), undefined, [rectRegion(k)], 0);
        expect(f.margin / um).toBeCloseTo(expected, 6);
        expect(f.fits).toBe(f.margin >= 0);
      }),
      { seed: 42, numRuns: 200 },
    );
  });
});
