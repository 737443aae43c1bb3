// Seeded property tests of the stub layout against independent computations: an exact union
// area of axis-aligned rectangles by coordinate compression, clipper-lib (Angus Johnson's
// Clipper 6, the independent predecessor of clipper2) for the union area and island count, and
// an O(n²) segment-intersection test for simplicity.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { circlePolygon, layoutStubMatch, padPolygonArea, pointInRing, polygonArea, type StubLayoutInput } from '../../src/geometry/index.js';
import type { Feature, Ring } from '../../src/seams.js';

// The O(n²) simplicity test and the clipper-lib union are shared with the artwork checks.
import { clipperLibUnion, selfIntersects } from '../helpers/artworkChecks.js';

const um = 1e-6;

/** Valid inputs: lengths on a 1 µm grid; via rows that fit inside the stub width with non-touching pads. */
const layoutInput: fc.Arbitrary<StubLayoutInput> = fc
  .record({
    seriesWidth: fc.integer({ min: 100, max: 5000 }),
    seriesLength: fc.integer({ min: 0, max: 40000 }),
    leadLength: fc.integer({ min: 0, max: 20000 }),
    stubWidth: fc.integer({ min: 100, max: 5000 }),
    stubLength: fc.integer({ min: 0, max: 30000 }),
    sides: fc.constantFrom<('left' | 'right')[]>(['left'], ['right'], ['left', 'right'], ['right', 'left']),
    short: fc.boolean(),
    drill: fc.integer({ min: 100, max: 400 }),
    annular: fc.integer({ min: 50, max: 300 }),
    count: fc.integer({ min: 1, max: 4 }),
  })
  .map((r) => {
    const pad = r.drill + 2 * r.annular;
    // Pitch ≥ pad (pads do not touch) and the whole pad row inside the stub width.
    const count = Math.max(1, Math.min(r.count, Math.floor(r.stubWidth / pad)));
    const stubWidth = Math.max(r.stubWidth, pad);
    const input: StubLayoutInput = {
      seriesWidth: r.seriesWidth * um,
      seriesLength: r.seriesLength * um,
      leadLength: r.leadLength * um,
      stubWidth: stubWidth * um,
      // Short stubs reach at least one pad radius past the centre-line, so each pad's inner half
      // lies on the stub rectangle (keeps the analytic area below exact).
      stubLength: (r.short ? Math.max(r.stubLength, Math.ceil(pad / 2)) : r.stubLength) * um,
      stubSides: r.sides,
      termination: r.short ? 'short' : 'open',
      ...(r.short ? { via: { drill: r.drill * um, pad: pad * um, count, pitch: pad * um } } : {}),
    };
    return input;
  });

/** Exact area of a union of axis-aligned rectangles by coordinate compression (integer nm). */
function rectUnionArea(rects: readonly Feature['rect'][]): number {
  const nm = (v: number): number => Math.round(v * 1e9);
  const rs = rects.map((r) => [nm(r.xmin), nm(r.ymin), nm(r.xmax), nm(r.ymax)] as const).filter(([a, b, c, d]) => c > a && d > b);
  const xs = [...new Set(rs.flatMap((r) => [r[0], r[2]]))].sort((a, b) => a - b);
  const ys = [...new Set(rs.flatMap((r) => [r[1], r[3]]))].sort((a, b) => a - b);
  let area = 0;
  for (let i = 0; i + 1 < xs.length; i++)
    for (let j = 0; j + 1 < ys.length; j++) {
      const cx = (xs[i]! + xs[i + 1]!) / 2;
      const cy = (ys[j]! + ys[j + 1]!) / 2;
      if (rs.some(([a, b, c, d]) => cx > a && cx < c && cy > b && cy < d)) area += (xs[i + 1]! - xs[i]!) * (ys[j + 1]! - ys[j]!);
    }
  return area * 1e-18;
}


describe('layoutStubMatch properties (fast-check, seed 42)', () => {
  it('one simple counter-clockwise island, area and bounds as computed independently, vias on their pads', () => {
    fc.assert(
      fc.property(layoutInput, (input) => {
        const g = layoutStubMatch(input);
        expect(g.copper).toHaveLength(1);
        const island = g.copper[0]!;
        const ring = island.outline;
        expect(island.holes).toEqual([]);
        expect(polygonArea(ring)).toBeGreaterThan(0); // counter-clockwise
        expect(selfIntersects(ring)).toBe(false);
        // No repeated closing point, no duplicate or collinear consecutive points.
        for (let i = 0; i < ring.length; i++) {
          const a = ring[(i + ring.length - 1) % ring.length]!, b = ring[i]!, c = ring[(i + 1) % ring.length]!;
          const cross = (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
          expect(Math.abs(cross)).toBeGreaterThan(0);
        }
        // Area: exact rectangle union plus the outer half of each pad polygon (pads lie inside
        // the stub width and do not touch each other, so only their outer halves add copper).
        const rects = g.features.filter((f) => f.kind !== 'pad').map((f) => f.rect);
        const pads = g.vias.length * (input.via ? padPolygonArea(input.via.pad / 2) / 2 : 0);
        const analytic = rectUnionArea(rects) + pads;
        // Tolerance: pad vertices are rounded to 1 nm (≤ 0.5 nm × perimeter per pad).
        const tol = 1e-15 + g.vias.length * 0.5e-9 * Math.PI * (input.via?.pad ?? 0) * 1.1;
        expect(Math.abs(polygonArea(ring) - analytic)).toBeLessThanOrEqual(tol);
        // clipper-lib on the same shapes: one polygon, same area.
        const shapes = [...g.features.filter((f) => f.kind !== 'pad' && f.rect.xmax > f.rect.xmin && f.rect.ymax > f.rect.ymin).map((f) => [[f.rect.xmin, f.rect.ymin], [f.rect.xmax, f.rect.ymin], [f.rect.xmax, f.rect.ymax], [f.rect.xmin, f.rect.ymax]] as Ring), ...g.vias.map((v) => circlePolygon([v.x, v.y], v.pad / 2))];
        const other = clipperLibUnion(shapes);
        expect(other.count).toBe(1);
        expect(Math.abs(other.area - polygonArea(ring))).toBeLessThanOrEqual(tol + 1e-15);
        // Bounds from the inputs: x from the load plane (or the stub's left edge) to the source plane
        // (or the stub's right edge); y from the line edges to the stub ends (or the pad rims).
        const xStub = input.seriesLength;
        const half = input.seriesWidth / 2;
        const reach = half + input.stubLength + (input.termination === 'short' ? input.via!.pad / 2 : 0);
        const left = input.stubSides.includes('left');
        const right = input.stubSides.includes('right');
        const close = (a: number, b: number): void => expect(Math.abs(a - b)).toBeLessThanOrEqual(2e-9);
        close(g.bounds.xmin, Math.min(0, xStub - input.stubWidth / 2));
        close(g.bounds.xmax, Math.max(xStub + input.leadLength, xStub + input.stubWidth / 2));
        // With no series line and no lead, only the stubs' overlap rectangles (from y = 0) remain.
        const line = input.seriesLength + input.leadLength > 0 ? half : 0;
        close(g.bounds.ymax, left ? Math.max(reach, line) : line);
        close(g.bounds.ymin, right ? -Math.max(reach, line) : -line);
        // Every drill lies inside its pad polygon and on the copper.
        for (const v of g.vias) {
          const pad = circlePolygon([v.x, v.y], v.pad / 2);
          for (let k = 0; k < 8; k++) {
            const a = (k * Math.PI) / 4;
            const p = [v.x + (v.drill / 2) * Math.cos(a), v.y + (v.drill / 2) * Math.sin(a)] as const;
            expect(pointInRing(p, pad)).toBe(true);
            expect(pointInRing(p, ring)).toBe(true);
          }
        }
        // Ports on the reference planes.
        close(g.ports[0]!.x, 0);
        close(g.ports[1]!.x, input.seriesLength + input.leadLength);
      }),
      { seed: 42, numRuns: 150 },
    );
  });

  it('is deterministic and ignores the order of the sides', () => {
    fc.assert(
      fc.property(layoutInput, (input) => {
        const a = layoutStubMatch(input);
        const b = layoutStubMatch({ ...input, stubSides: [...input.stubSides].reverse() });
        expect(JSON.stringify(a)).toBe(JSON.stringify(b));
      }),
      { seed: 42, numRuns: 50 },
    );
  });
});
