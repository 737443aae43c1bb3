import { describe, expect, it } from 'vitest';
import {
  circlePolygon,
  islandArea,
  layoutStubMatch,
  normaliseRing,
  padPolygonArea,
  padSegments,
  polygonArea,
  ringBounds,
  type StubLayoutInput,
} from '../../src/geometry/index.js';

const mm = 1e-3;
const toMm = (ring: readonly (readonly [number, number])[]): [number, number][] =>
  ring.map(([x, y]) => [Math.round(x * 1e9) / 1e6, Math.round(y * 1e9) / 1e6]);

const base: StubLayoutInput = {
  seriesWidth: 3.0621 * mm,
  seriesLength: 10 * mm,
  leadLength: 10 * mm,
  stubWidth: 3.0621 * mm,
  stubLength: 15.46895 * mm,
  stubSides: ['left'],
  termination: 'open',
};

function deepFreeze<T>(o: T): T {
  if (o && typeof o === 'object') {
    Object.values(o).forEach(deepFreeze);
    Object.freeze(o);
  }
  return o;
}

describe('layoutStubMatch: open single stub', () => {
  it('merges line and stub into the published outline', () => {
    const g = layoutStubMatch(base);
    expect(g.copper).toHaveLength(1);
    // physics.md §8.6 [C] (validated with ezdxf 0.18): the line plus stub of §7.9 as one merged
    // polygon, 20 mm line of width 3.0621 mm, stub centred at x = 10 mm reaching y = 17 mm.
    expect(toMm(g.copper[0]!.outline)).toEqual([
      [0, -1.53105],
      [20, -1.53105],
      [20, 1.53105],
      [11.53105, 1.53105],
      [11.53105, 17],
      [8.46895, 17],
      [8.46895, 1.53105],
      [0, 1.53105],
    ]);
    expect(g.copper[0]!.holes).toEqual([]);
    // Area by hand from the same dimensions: 20 × 3.0621 + 3.0621 × 15.46895 (mm²).
    expect(islandArea(g.copper[0]!) * 1e6).toBeCloseTo(20 * 3.0621 + 3.0621 * 15.46895, 9);
  });

  it('places ports on the reference planes with the line width (design.md board frame)', () => {
    const g = layoutStubMatch(base);
    expect(g.ports).toEqual([
      { role: 'load', x: 0, y: 0, directionDeg: 0, width: 3.0621 * mm },
      { role: 'source', x: expect.closeTo(20 * mm, 12), y: 0, directionDeg: 180, width: 3.0621 * mm },
    ]);
  });

  it('gives stable feature ids with length and width', () => {
    const g = layoutStubMatch(base);
    expect(g.features.map((f) => [f.id, f.kind])).toEqual([
      ['series', 'line'],
      ['lead-source', 'lead'],
      ['stub', 'stub'],
    ]);
    const stub = g.features.find((f) => f.id === 'stub')!;
    expect(stub.length).toBe(base.stubLength);
    expect(stub.width).toBe(base.stubWidth);
    // The stub rectangle starts on the line's centre-line: overlap of half the line width
    // (Gerber spec 2023.08 §4.14: connect by overlap, not by touching).
    expect(stub.rect.ymin).toBe(0);
    expect(stub.rect.ymax * 1e3).toBeCloseTo(1.53105 + 15.46895, 9);
  });

  it('bounds are the copper bounds', () => {
    const g = layoutStubMatch(base);
    expect(g.bounds).toEqual(ringBounds(g.copper[0]!.outline));
    expect(g.bounds.ymax * 1e3).toBeCloseTo(17, 9);
  });

  it('a right stub mirrors a left one', () => {
    const l = layoutStubMatch(base);
    const r = layoutStubMatch({ ...base, stubSides: ['right'] });
    expect(r.bounds.ymin).toBeCloseTo(-l.bounds.ymax, 12);
    expect(islandArea(r.copper[0]!)).toBeCloseTo(islandArea(l.copper[0]!), 15);
  });

  it('lists balanced stubs as stub (left) and stub-2 (right) whatever the input order', () => {
    const a = layoutStubMatch({ ...base, stubSides: ['right', 'left'] });
    const b = layoutStubMatch({ ...base, stubSides: ['left', 'right'] });
    expect(a).toEqual(b);
    expect(a.features.find((f) => f.id === 'stub')!.rect.ymin).toBe(0);
    expect(a.features.find((f) => f.id === 'stub-2')!.rect.ymax).toBe(0);
    expect(a.copper).toHaveLength(1);
    expect(a.copper[0]!.outline).toHaveLength(12); // a cross: 12 corners
  });

  it('handles zero stub length and zero lead length', () => {
    const g = layoutStubMatch({ ...base, stubLength: 0, leadLength: 0 });
    expect(g.copper).toHaveLength(1);
    // Rectangle area by hand: the line 10 mm, plus the stub's overlap rectangle (half its width
    // past the stub centre, from the centre-line to the line edge) that sticks out past x = 10 mm.
    expect(islandArea(g.copper[0]!) * 1e6).toBeCloseTo(3.0621 * 10 + (3.0621 / 2) * (3.0621 / 2), 9);
    expect(g.ports[1]!.x).toBeCloseTo(10 * mm, 12);
  });

  it('does not change its input', () => {
    const input = deepFreeze({ ...base, keepouts: [{ kind: 'rect' as const, x: [0, 1e-3] as const, y: [0, 1e-3] as const }] });
    expect(() => layoutStubMatch(input)).not.toThrow();
  });
});

describe('layoutStubMatch: short stub with vias', () => {
  const short: StubLayoutInput = {
    ...base,
    stubLength: 8 * mm,
    termination: 'short',
    via: { drill: 0.3 * mm, pad: 0.6 * mm, count: 2, pitch: 1 * mm },
  };

  it('puts the vias in a row on the stub end, one island with the pads', () => {
    const g = layoutStubMatch(short);
    expect(g.copper).toHaveLength(1);
    expect(g.vias.map((v) => [Math.round(v.x * 1e9), Math.round(v.y * 1e9)])).toEqual([
      [9_500_000, 9_531_050],
      [10_500_000, 9_531_050],
    ]);
    expect(g.features.filter((f) => f.kind === 'pad').map((f) => f.id)).toEqual(['via-pad-1', 'via-pad-2']);
    // Pad edges tangent at 90°: the copper reaches exactly one pad radius past the via centre.
    expect(g.bounds.ymax * 1e3).toBeCloseTo(9.53105 + 0.3, 9);
    // Area: line + stub rectangles, plus the outer half of each pad polygon (pads inside the stub width).
    const expected = 20 * 3.0621 + 3.0621 * 8 + 2 * (padPolygonArea(0.3 * mm) * 1e6) / 2;
    expect(islandArea(g.copper[0]!) * 1e6).toBeCloseTo(expected, 6);
  });

  it('rejects impossible via rows and bad numbers with RangeError', () => {
    expect(() => layoutStubMatch({ ...short, via: undefined })).toThrow(RangeError);
    expect(() => layoutStubMatch({ ...short, via: { drill: 0.6 * mm, pad: 0.6 * mm, count: 1, pitch: 0 } })).toThrow(RangeError);
    expect(() => layoutStubMatch({ ...short, via: { drill: 0.3 * mm, pad: 0.6 * mm, count: 2, pitch: 0.2 * mm } })).toThrow(/overlap/);
    // A row wider than the stub is allowed: a bar behind the via centres ties the pads to the stub (one island).
    expect(layoutStubMatch({ ...short, via: { drill: 0.3 * mm, pad: 0.6 * mm, count: 5, pitch: 1 * mm } }).copper).toHaveLength(1);
    expect(() => layoutStubMatch({ ...short, via: { drill: 0.3 * mm, pad: 0.6 * mm, count: 1.5, pitch: 1 * mm } })).toThrow(RangeError);
  });
});

describe('input validation', () => {
  it.each([
    ['seriesWidth', Number.NaN],
    ['seriesWidth', 0],
    ['stubWidth', -1e-3],
    ['seriesLength', Number.POSITIVE_INFINITY],
    ['leadLength', -1e-9],
    ['stubLength', -1e-3],
  ] as const)('%s = %s throws RangeError', (key, value) => {
    expect(() => layoutStubMatch({ ...base, [key]: value })).toThrow(RangeError);
  });
  it('rejects repeated sides', () => {
    expect(() => layoutStubMatch({ ...base, stubSides: ['left', 'left'] })).toThrow(RangeError);
  });
  it('draws a plain line, one island without a stub, when no side is given (already matched)', () => {
    const g = layoutStubMatch({ ...base, stubSides: [] });
    expect(g.copper).toHaveLength(1);
    expect(g.features.map((f) => f.id)).toEqual(['series', 'lead-source']);
    // Area of the bare line: width × (series + lead), exact rectangle.
    expect(polygonArea(g.copper[0]!.outline)).toBeCloseTo(base.seriesWidth * (base.seriesLength + base.leadLength), 15);
  });
  it('rejects a non-finite keep-out', () => {
    expect(() => layoutStubMatch({ ...base, keepouts: [{ kind: 'circle', center: [0, Number.NaN], radius: 1 }] })).toThrow(RangeError);
  });
});

describe('pad polygon convention', () => {
  it('is circumscribed: extent equals the diameter, vertices within 1 µm of the circle', () => {
    const r = 0.3 * mm;
    const ring = circlePolygon([0, 0], r);
    const n = padSegments(r);
    expect(n % 4).toBe(0);
    expect(ring).toHaveLength(n);
    const b = ringBounds(ring);
    expect(b.xmax).toBeCloseTo(r, 15);
    expect(b.ymin).toBeCloseTo(-r, 15);
    for (const [x, y] of ring) {
      const d = Math.hypot(x, y);
      expect(d).toBeGreaterThanOrEqual(r);
      expect(d - r).toBeLessThanOrEqual(1e-6);
    }
    // Regular n-gon circumscribed about radius r has area n r² tan(π/n) (elementary geometry, common practice, no source).
    expect(polygonArea(ring)).toBeCloseTo(n * r * r * Math.tan(Math.PI / n), 18);
    expect(polygonArea(ring)).toBeGreaterThan(Math.PI * r * r);
  });
});

describe('normaliseRing', () => {
  it('drops the closing point, duplicates and collinear points and orients the ring', () => {
    const cw: [number, number][] = [
      [0, 0],
      [0, 1e-3],
      [0, 1e-3],
      [1e-3, 1e-3],
      [1e-3, 0.5e-3],
      [1e-3, 0],
      [0, 0],
    ];
    const ring = normaliseRing(cw, true);
    expect(ring).toEqual([
      [0, 0],
      [1e-3, 0],
      [1e-3, 1e-3],
      [0, 1e-3],
    ]);
    expect(polygonArea(ring)).toBeGreaterThan(0);
    expect(polygonArea(normaliseRing(cw, false))).toBeLessThan(0);
  });
});
