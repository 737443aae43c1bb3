// checkFit on copper whose distances to areas and keep-outs are worked out by hand. Every expected
// value is plane geometry (point-to-line and point-to-point distances) computed in the comment
// beside it: common practice, no source.
import { describe, expect, it } from 'vitest';
import { checkFit, layoutStubMatch, rectRing } from '../../src/geometry/index.js';
import type { BoardGeometry, Region, Ring } from '../../src/seams.js';

const mm = 1e-3;

/** A board whose only copper is the given rings (no features, vias or ports). */
const board = (...outlines: Ring[]): BoardGeometry => ({
  copper: outlines.map((outline, i) => ({ id: `copper-${i + 1}`, outline, holes: [] })),
  vias: [],
  ports: [],
  features: [],
  keepouts: [],
  bounds: { xmin: 0, ymin: 0, xmax: 0, ymax: 0 },
});
const rect = (x0: number, x1: number, y0: number, y1: number): Region => ({ kind: 'rect', x: [x0 * mm, x1 * mm], y: [y0 * mm, y1 * mm] });
const polygon = (...pts: [number, number][]): Region => ({ kind: 'polygon', points: pts.map(([x, y]) => [x * mm, y * mm] as const) });
const circle = (x: number, y: number, r: number): Region => ({ kind: 'circle', center: [x * mm, y * mm], radius: r * mm });

// The copper used throughout: a 10 mm × 2 mm line, x ∈ [0, 10], y ∈ [0, 2] (mm).
const line = board(rectRing(0, 0, 10 * mm, 2 * mm));
const fit = (area: Region | undefined, keepouts: Region[], clearance = 0) => checkFit(line, area, keepouts, clearance * mm);

describe('checkFit: nothing to fit', () => {
  it('is +Infinity without limits or without copper', () => {
    // Empty minimum: nothing constrains the copper.
    expect(fit(undefined, [])).toEqual({ fits: true, margin: Infinity, limitedBy: 'nothing' });
    expect(checkFit(board(), rect(0, 1, 0, 1), [circle(0, 0, 1)], 0)).toEqual({ fits: true, margin: Infinity, limitedBy: 'nothing' });
  });
});

describe('checkFit: rectangular area', () => {
  it('0.1 mm of room on the right edge: +0.1 mm, fits', () => {
    // Gaps: left 1, right 10.1 − 10 = 0.1, bottom 1, top 1 (mm).
    const f = fit(rect(-1, 10.1, -1, 3), []);
    expect(f.fits).toBe(true);
    expect(f.margin / mm).toBeCloseTo(0.1, 12);
    expect(f.limitedBy).toBe('area edge x max');
  });
  it('0.1 mm too small on the right edge: −0.1 mm, does not fit', () => {
    // Copper x ∈ (9.9, 10] lies outside; its farthest point is 10 − 9.9 = 0.1 mm out.
    const f = fit(rect(-1, 9.9, -1, 3), []);
    expect(f.fits).toBe(false);
    expect(f.margin / mm).toBeCloseTo(-0.1, 12);
    expect(f.limitedBy).toBe('area edge x max');
  });
  it('subtracts the clearance', () => {
    // 0.1 − 0.05 = 0.05; 0.1 − 0.15 = −0.05; −0.1 − 0.05 = −0.15 (mm).
    expect(fit(rect(-1, 10.1, -1, 3), [], 0.05).margin / mm).toBeCloseTo(0.05, 12);
    const tight = fit(rect(-1, 10.1, -1, 3), [], 0.15);
    expect(tight.margin / mm).toBeCloseTo(-0.05, 12);
    expect(tight.fits).toBe(false);
    expect(fit(rect(-1, 9.9, -1, 3), [], 0.05).margin / mm).toBeCloseTo(-0.15, 12);
  });
  it('names the limiting edge on every side', () => {
    // Each area leaves 0.1 mm on one side and 1 mm on the others.
    expect(fit(rect(-0.1, 11, -1, 3), []).limitedBy).toBe('area edge x min');
    expect(fit(rect(-1, 11, -0.1, 3), []).limitedBy).toBe('area edge y min');
    expect(fit(rect(-1, 11, -1, 2.1), []).limitedBy).toBe('area edge y max');
  });
  it('a corner sticking out diagonally misses by its distance to the area corner', () => {
    // Copper corner (10, 2) is (0.3, 0.4) beyond the area corner (9.7, 1.6): √(0.3² + 0.4²) = 0.5 mm.
    const f = fit(rect(-1, 9.7, -1, 1.6), []);
    expect(f.margin / mm).toBeCloseTo(-0.5, 12);
    expect(f.limitedBy).toBe('area corner x max y max');
  });
  it('exactly touching fits with margin 0', () => {
    const f = fit(rect(0, 10, 0, 2), []);
    expect(f.margin).toBe(0);
    expect(f.fits).toBe(true);
  });
});

describe('checkFit: polygon area', () => {
  it('the same rectangle as a clockwise polygon gives the same margins', () => {
    // Orientation of the spec's polygon does not matter: distances are unsigned, inside is even-odd.
    const room = polygon([-1, -1], [-1, 3], [10.1, 3], [10.1, -1]);
    const short = polygon([-1, -1], [-1, 3], [9.9, 3], [9.9, -1]);
    expect(fit(room, []).margin / mm).toBeCloseTo(0.1, 12);
    expect(fit(short, []).margin / mm).toBeCloseTo(-0.1, 12);
    expect(fit(short, []).fits).toBe(false);
  });

  // Non-convex L: a horizontal arm x ∈ [−1, R], y ∈ [−0.5, 2.3] and a vertical arm x ∈ [−1, 1] up to y = 20.
  // Edge 2 runs from point 2 to point 3 (x = R); the reflex vertex 4 is (1, 2.3).
  const lShape = (right: number): Region => polygon([-1, -0.5], [right, -0.5], [right, 2.3], [1, 2.3], [1, 20], [-1, 20]);
  it('L-shaped area with 0.1 mm of room and 0.1 mm too little', () => {
    // Gaps to the copper: left 1, bottom 0.5, top 2.3 − 2 = 0.3 (edge 3 and the reflex vertex), right R − 10.
    const room = fit(lShape(10.1), []);
    expect(room.margin / mm).toBeCloseTo(0.1, 12);
    expect(room.limitedBy).toBe('area edge 2');
    const short = fit(lShape(9.9), []);
    expect(short.margin / mm).toBeCloseTo(-0.1, 12);
    expect(short.fits).toBe(false);
    // With 0.2 mm clearance the 0.3 mm top gap still holds; the right edge sets −0.1 mm.
    expect(fit(lShape(10.1), [], 0.2).margin / mm).toBeCloseTo(-0.1, 12);
  });
  it('copper in the notch of the L misses by its farthest point from the area', () => {
    // Copper [2, 4] × [3, 5] lies outside, beyond edge 3 (y = 2.3) and edge 4 (x = 1); the distance
    // to the L is min(y − 2.3, x − 1), largest at (4, 5): min(2.7, 3) = 2.7 mm.
    const notch = board(rectRing(2 * mm, 3 * mm, 4 * mm, 5 * mm));
    const f = checkFit(notch, lShape(12), [], 0);
    expect(f.margin / mm).toBeCloseTo(-2.7, 12);
    expect(f.limitedBy).toBe('area edge 3');
  });
  it('copper crossing the reflex corner: the point deepest outside lies inside a copper edge', () => {
    // Copper [0, 3] × [2, 2.8] crosses edge 3 (y = 2.3) right of the reflex vertex (1, 2.3). Outside
    // points have distance min(y − 2.3, distance to edge 4 or vertex 4); at y = 2.8 that is
    // min(0.5, x − 1), so the worst is 0.5 mm for x ≥ 1.5 (a plateau along the copper's top edge).
    const corner = board(rectRing(0, 2 * mm, 3 * mm, 2.8 * mm));
    const f = checkFit(corner, lShape(12), [], 0);
    expect(f.margin / mm).toBeCloseTo(-0.5, 12);
  });
});

describe('checkFit: keep-outs', () => {
  it('rect keep-out 0.1 mm above the copper, and 0.1 mm into it', () => {
    // Keep-out x ∈ [4, 6] with its bottom at y = 2.1 (gap 0.1) or y = 1.9 (copper 0.1 mm deep in it).
    const apart = fit(undefined, [rect(4, 6, 2.1, 3)]);
    expect(apart.margin / mm).toBeCloseTo(0.1, 12);
    expect(apart.limitedBy).toBe('keep-out 1 (rect)');
    const over = fit(undefined, [rect(4, 6, 1.9, 3)]);
    expect(over.margin / mm).toBeCloseTo(-0.1, 12);
    expect(over.fits).toBe(false);
    // Clearance 0.05 mm: 0.1 − 0.05 and −0.1 − 0.05.
    expect(fit(undefined, [rect(4, 6, 2.1, 3)], 0.05).margin / mm).toBeCloseTo(0.05, 12);
    expect(fit(undefined, [rect(4, 6, 1.9, 3)], 0.05).margin / mm).toBeCloseTo(-0.15, 12);
  });
  it('keep-out straddling the copper edge: the deepest copper lies mid-edge, not at a vertex', () => {
    // Keep-out [4, 6] × [−1, 1.5]: no copper vertex is inside; along the copper's bottom edge the depth
    // is min(x − 4, 6 − x, 0 + 1, 1.5 − 0), largest at x = 5: 1 mm.
    expect(fit(undefined, [rect(4, 6, -1, 1.5)]).margin / mm).toBeCloseTo(-1, 12);
  });
  it('keep-out wholly covered by copper: depth of its centre', () => {
    // Keep-out [3, 4] × [0.5, 1.2] inside the line: deepest point is 0.35 mm (half of 0.7) from its edges.
    expect(fit(undefined, [rect(3, 4, 0.5, 1.2)]).margin / mm).toBeCloseTo(-0.35, 12);
  });
  it('polygon keep-out (trapezoid) 0.1 mm away and 0.1 mm into the copper', () => {
    // Bottom edge at y = 2.1 / 1.9 from x = 4 to 6, slanting out to x ∈ [3.5, 6.5] at y = 4; the
    // slanted sides are farther from the copper than the bottom edge.
    const apart = fit(undefined, [polygon([4, 2.1], [6, 2.1], [6.5, 4], [3.5, 4])]);
    expect(apart.margin / mm).toBeCloseTo(0.1, 12);
    expect(apart.limitedBy).toBe('keep-out 1 (polygon)');
    const over = fit(undefined, [polygon([4, 1.9], [6, 1.9], [6.5, 4], [3.5, 4])]);
    expect(over.margin / mm).toBeCloseTo(-0.1, 12);
    expect(fit(undefined, [polygon([4, 1.9], [6, 1.9], [6.5, 4], [3.5, 4])], 0.05).margin / mm).toBeCloseTo(-0.15, 12);
  });
  it('triangle keep-out dipping its apex 0.1 mm into the copper', () => {
    // Apex (5, 1.9), sides to (4, 4) and (6, 4). The deepest copper point is (5, 2) on the copper's
    // top edge; its distance to either side line (direction (1, 2.1)) is 0.1 · 1 / √(1 + 2.1²) mm.
    const f = fit(undefined, [polygon([5, 1.9], [6, 4], [4, 4])]);
    expect(f.margin / mm).toBeCloseTo(-0.1 / Math.sqrt(1 + 2.1 * 2.1), 12);
    // Apex 0.1 mm above the copper: the gap is the apex's height, 0.1 mm.
    expect(fit(undefined, [polygon([5, 2.1], [6, 4], [4, 4])]).margin / mm).toBeCloseTo(0.1, 12);
  });
  it('circle keep-out 0.1 mm away and 0.1 mm in: radius + clearance − distance from centre to copper', () => {
    // Centre (5, 3) is 1 mm above the copper's top edge.
    const apart = fit(undefined, [circle(5, 3, 0.9)]);
    expect(apart.margin / mm).toBeCloseTo(0.1, 12);
    expect(apart.limitedBy).toBe('keep-out 1 (circle)');
    expect(fit(undefined, [circle(5, 3, 1.1)]).margin / mm).toBeCloseTo(-0.1, 12);
    expect(fit(undefined, [circle(5, 3, 0.9)], 0.05).margin / mm).toBeCloseTo(0.05, 12);
    expect(fit(undefined, [circle(5, 3, 1.1)], 0.05).margin / mm).toBeCloseTo(-0.15, 12);
    // Centre on the copper: distance 0, so the margin is −radius.
    expect(fit(undefined, [circle(5, 1, 0.3)]).margin / mm).toBeCloseTo(-0.3, 12);
    // Centre beyond a corner: distance to (10, 2) from (13, 6) is 5 mm.
    expect(fit(undefined, [circle(13, 6, 4.9)]).margin / mm).toBeCloseTo(0.1, 12);
  });
  it('the worst of several keep-outs and the area sets the margin, counted from 1', () => {
    // Area leaves 1 mm; keep-out 1 is 2 mm away, keep-out 2 (circle) 0.5 mm.
    const f = fit(rect(-1, 11, -1, 3), [rect(4, 6, 4, 5), circle(5, -1, 0.5)]);
    expect(f.margin / mm).toBeCloseTo(0.5, 12);
    expect(f.limitedBy).toBe('keep-out 2 (circle)');
  });
});

describe('checkFit: circle area', () => {
  it('0.1 mm of room and 0.1 mm too little around the farthest corner', () => {
    // Centre (5, 1): every corner is √(5² + 1²) mm away.
    const far = Math.hypot(5, 1);
    expect(fit(circle(5, 1, far + 0.1), []).margin / mm).toBeCloseTo(0.1, 12);
    const short = fit(circle(5, 1, far - 0.1), []);
    expect(short.margin / mm).toBeCloseTo(-0.1, 12);
    expect(short.limitedBy).toBe('area circle');
  });
});

describe('checkFit: a laid-out short stub', () => {
  it('via pads count as copper: the pad top sets the margin to the area', () => {
    // Stub centred at x = 10 mm, line width 3 mm, stub length 8 mm: via centre at y = 1.5 + 8 = 9.5 mm,
    // pad radius 0.3 mm, so the pad tops are at 9.8 mm; the area's top at 9.9 mm leaves 0.1 mm, at
    // 9.7 mm the pads stick out 0.1 mm (the pad polygon's y extent equals the circle's).
    const g = layoutStubMatch({
      seriesWidth: 3 * mm,
      seriesLength: 10 * mm,
      leadLength: 10 * mm,
      stubWidth: 3 * mm,
      stubLength: 8 * mm,
      stubSides: ['left'],
      termination: 'short',
      via: { drill: 0.3 * mm, pad: 0.6 * mm, count: 2, pitch: 0.8 * mm },
    });
    const room = checkFit(g, rect(-1, 21, -3, 9.9), [], 0);
    expect(room.margin / mm).toBeCloseTo(0.1, 9);
    expect(room.limitedBy).toBe('area edge y max');
    expect(checkFit(g, rect(-1, 21, -3, 9.7), [], 0).margin / mm).toBeCloseTo(-0.1, 9);
  });
});
