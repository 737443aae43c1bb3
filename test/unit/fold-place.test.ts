// Folded stubs (L and U with mitred corners), via rows wider than the stub, the board placement
// (mirror, rotate, move) and the `place` spec field, checked against hand-worked geometry.
import { describe, expect, it } from 'vitest';
import { foldFits, islandArea, layoutStubMatch, placeGeometry, planFold, pointInRing, polygonArea, type FoldPlan, type StubLayoutInput } from '../../src/geometry/index.js';
import { mitreDouvilleJames } from '../../src/physical/discontinuities/index.js';
import { parseSpec } from '../../src/spec/index.js';
import { designFromText } from '../../src/design.js';
import { TunestripError } from '../../src/diagnostics.js';
import { PRESETS } from '../helpers/randomSpecs.js';
import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';

const mm = 1e-3;
const M2 = 1e-12; // 1e-6 mm² in m²

const base: StubLayoutInput = {
  seriesWidth: 1 * mm,
  seriesLength: 10 * mm,
  leadLength: 5 * mm,
  stubWidth: 1 * mm,
  stubLength: 12 * mm,
  stubSides: ['left'],
  termination: 'open',
};
const h = 1 * mm; // substrate height: w/h = 1
const cut = mitreDouvilleJames(1 * mm, h).edgeCut;
const fold = (kind: 'L' | 'U', toward: 'load' | 'source'): StubLayoutInput => ({ ...base, fold: { kind, toward, mitreCut: cut, clearance: 2 * mm } });

const pathLength = (pts: readonly (readonly [number, number])[]): number =>
  pts.slice(1).reduce((s, p, i) => s + Math.hypot(p[0] - pts[i]![0], p[1] - pts[i]![1]), 0);

describe('mitred bends', () => {
  it('cut the outer corner by a = 2·M·w along each edge, M from Douville–James', () => {
    // Douville & James (1978), M = 52 + 65·exp(−1.35 w/h) %; at w/h = 1 the cut meets each outer
    // edge a = 1.377 w from the corner (physics.md §4.3 table, [M]).
    expect(cut / mm).toBeCloseTo(1.377, 3);
    const g = layoutStubMatch(fold('L', 'source'));
    const ring = g.copper[0]!.outline;
    // The mitre is the one edge at 45°, of length a·√2.
    const diagonal = ring.map((p, i) => [p, ring[(i + 1) % ring.length]!] as const).filter(([p, q]) => Math.abs(Math.abs(q[0] - p[0]) - Math.abs(q[1] - p[1])) < 2e-9 && q[0] !== p[0]);
    expect(diagonal).toHaveLength(1);
    const [p, q] = diagonal[0]!;
    expect(Math.abs(Math.hypot(q[0] - p[0], q[1] - p[1]) - cut * Math.SQRT2)).toBeLessThan(3e-9);
  });
});

describe('L-folded stub', () => {
  it.each(['source', 'load'] as const)('towards the %s: centre-line length, area and bounds as worked by hand', (toward) => {
    const input = fold('L', toward);
    const g = layoutStubMatch(input);
    expect(g.copper).toHaveLength(1);
    const stub = g.features.find((f) => f.id === 'stub')!;
    // Convention: the stub's length is its centre-line length through the bend (common practice, no source).
    expect(Math.abs(pathLength(stub.path!) - input.stubLength)).toBeLessThan(2e-9);
    // First arm: half the stub width plus the clearance (2 mm) past the line edge → corner at y = 0.5 + 2.5 = 3 mm;
    // second arm 12 − 2.5 = 9.5 mm. Area: line 1 × 15, arm one 1 × 3.5 (from the line's centre-line),
    // arm two 1 × (9.5 − 0.5), less the mitre triangle a²/2 and the arm's overlap with the line (1 × 0.5).
    const area = 1 * 15 + 3.5 + 9 - (cut / mm) ** 2 / 2 - 0.5;
    expect(Math.abs(islandArea(g.copper[0]!) - area * 1e-6)).toBeLessThan(M2);
    expect(g.bounds.ymax).toBeCloseTo(3.5 * mm, 12);
    if (toward === 'source') expect(g.bounds.xmax).toBeCloseTo(19.5 * mm, 12);
    else expect(stub.path!.at(-1)![0]).toBeCloseTo(0.5 * mm, 12); // 10 − 9.5: the arm ends over the series line
  });

  it('a short L stub ends on a via row across its last arm', () => {
    const g = layoutStubMatch({ ...fold('L', 'source'), termination: 'short', via: { drill: 0.3 * mm, pad: 0.6 * mm, count: 2, pitch: 0.75 * mm } });
    expect(g.copper).toHaveLength(1);
    expect(g.vias).toHaveLength(2);
    // The last arm runs along +x, so the row runs along y at the arm's end. The first arm now clears
    // the row, half of (0.75 + 0.6) mm = 0.675 mm, plus the 2 mm clearance: x = 10 + 12 − 2.675 mm.
    for (const v of g.vias) expect(v.x).toBeCloseTo(19.325 * mm, 12);
    expect(Math.abs(g.vias[0]!.y - g.vias[1]!.y)).toBeCloseTo(0.75 * mm, 12);
  });

  it('is refused when the stub is too short to fold', () => {
    const short = { ...fold('L', 'source'), stubLength: 3 * mm };
    expect(foldFits(short)).toBe(false);
    expect(() => layoutStubMatch(short)).toThrow(RangeError);
  });
});

describe('U-folded stub', () => {
  it('keeps the clearance between its arms and from the line, length through both bends', () => {
    const input = { ...fold('U', 'source'), stubLength: 20 * mm };
    const plan = planFold(input) as FoldPlan;
    expect(typeof plan).not.toBe('string');
    expect(Math.abs(pathLength(plan.centreLine) - 20 * mm)).toBeLessThan(1e-12);
    const [, c1, c2, end] = plan.centreLine as [unknown, readonly [number, number], readonly [number, number], readonly [number, number]];
    // Arms' facing edges: centre spacing minus one width, at least the 2 mm clearance.
    expect(c2[0] - c1[0] - 1 * mm).toBeGreaterThanOrEqual(2 * mm - 1e-12);
    // Open end of the returning arm: at least the clearance above the line edge (y = 0.5 mm).
    expect(end[1] - 0.5 * mm).toBeGreaterThanOrEqual(2 * mm - 1e-12);
    // Polygon area by hand: three arms and the part of the top between them, less two mitre triangles.
    const w = 1 * mm;
    const a1 = c1[1] - 0.5 * mm;
    const a2 = c2[0] - c1[0];
    const a3 = c2[1] - end[1];
    const stubArea = w * (0.5 * mm + a1 + w / 2) + (a2 - w) * w + w * (a3 + w / 2) - cut * cut;
    expect(Math.abs(polygonArea(plan.outline) - stubArea)).toBeLessThan(1e-18);
    const g = layoutStubMatch(input);
    expect(g.copper).toHaveLength(1);
    expect(Math.abs(islandArea(g.copper[0]!) - (1 * mm * 15 * mm + stubArea - w * 0.5 * mm))).toBeLessThan(M2);
  });
});

describe('via rows wider than the stub', () => {
  it('are tied to the stub end by a bar: one island, every via inside its pad and the copper', () => {
    const g = layoutStubMatch({ ...base, stubWidth: 0.3 * mm, stubLength: 4 * mm, termination: 'short', via: { drill: 0.3 * mm, pad: 0.6 * mm, count: 4, pitch: 0.75 * mm } });
    expect(g.copper).toHaveLength(1);
    expect(g.features.some((f) => f.id === 'via-bar-1')).toBe(true);
    for (const v of g.vias) expect(pointInRing([v.x + 0.14 * mm, v.y], g.copper[0]!.outline)).toBe(true);
  });
});

describe('placeGeometry', () => {
  const g = layoutStubMatch({ ...fold('L', 'source'), termination: 'short', via: { drill: 0.3 * mm, pad: 0.6 * mm, count: 2, pitch: 0.75 * mm } });
  it('is the identity for the default placement', () => {
    expect(placeGeometry(g, { x: 0, y: 0, rotationDeg: 0, mirror: false })).toBe(g);
  });
  it('rotates by 90° exactly: (x, y) → (x0 − y, y0 + x), areas kept, ports turned', () => {
    const p = placeGeometry(g, { x: 2 * mm, y: -1 * mm, rotationDeg: 90, mirror: false });
    expect(p.bounds.xmin).toBeCloseTo(2 * mm - g.bounds.ymax, 12);
    expect(p.bounds.ymax).toBeCloseTo(-1 * mm + g.bounds.xmax, 12);
    expect(Math.abs(islandArea(p.copper[0]!) - islandArea(g.copper[0]!))).toBeLessThan(1e-18);
    expect(p.ports.map((q) => q.directionDeg)).toEqual([90, 270]);
    expect(p.ports[0]).toMatchObject({ x: 2 * mm, y: -1 * mm });
  });
  it('mirrors about the section axis before rotating; outlines stay counter-clockwise', () => {
    const p = placeGeometry(g, { x: 0, y: 0, rotationDeg: 30, mirror: true });
    expect(polygonArea(p.copper[0]!.outline)).toBeGreaterThan(0);
    // The source port points along 180°: mirrored it stays 180°, rotated by 30° it is 210°.
    expect(p.ports[1]!.directionDeg).toBeCloseTo(210, 9);
    // Mirror then rotate: a via at local (x, y) lands at R(30°)·(x, −y).
    const v = g.vias[0]!;
    const c = Math.cos(Math.PI / 6);
    const s = Math.sin(Math.PI / 6);
    expect(p.vias[0]!.x).toBeCloseTo(c * v.x + s * v.y, 9);
    expect(p.vias[0]!.y).toBeCloseTo(s * v.x - c * v.y, 9);
    // Rotated vertices are snapped to the 1 nm grid: the area moves by at most perimeter × 1 nm (~60 mm × 1 nm).
    expect(Math.abs(islandArea(p.copper[0]!) - islandArea(g.copper[0]!))).toBeLessThan(60e-3 * 1e-9);
    expect(p.placement).toEqual({ x: 0, y: 0, rotationDeg: 30, mirror: true });
  });
});

describe('the place field', () => {
  const minimal = 'name: t\nfrequency: 2.4 GHz\nload: 30-j10\nsubstrate:\n  er: 4.4\n  height: 1.6 mm\n';
  it('reads lengths with units, any angle and a boolean', () => {
    const { spec } = parseSpec(`${minimal}place: { x: 12 mm, y: -40 mil, rotation_deg: -397.5, mirror: true }\n`, PRESETS);
    expect(spec.place.x).toBeCloseTo(12e-3, 15);
    expect(spec.place.y).toBeCloseTo(-40 * 25.4e-6, 15);
    expect(spec.place).toMatchObject({ rotationDeg: -397.5, mirror: true });
  });
  it('defaults to the identity and lists the defaults', () => {
    const { spec } = parseSpec(minimal, PRESETS);
    expect(spec.place).toEqual({ x: 0, y: 0, rotationDeg: 0, mirror: false });
    expect(spec.defaulted).toEqual(expect.arrayContaining(['place.x', 'place.y', 'place.rotation_deg', 'place.mirror']));
  });
  it.each([
    ['mirror: yes', 'place.mirror'],
    ['x: 3', 'place.x'],
    ['rotation_deg: 90 deg', 'place.rotation_deg'],
  ])('refuses %s', (bad, where) => {
    let error: unknown;
    try {
      parseSpec(`${minimal}place: { ${bad} }\n`, PRESETS);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(TunestripError);
    expect((error as TunestripError).diagnostic.where).toBe(where);
  });
});

describe('fit search with folds', () => {
  const root = resolve(import.meta.dirname, '..', '..');
  const text = readFileSync(join(root, 'templates', 'examples', 'sensor-915.yaml'), 'utf8');
  it('folds the stub when the straight one does not fit, and says so', () => {
    // Our own scenario: the 915 MHz example on a board 24 mm tall, too short for its straight stub.
    const run = designFromText(`${text}area: { x: [-5 mm, 60 mm], y: [-12 mm, 12 mm] }\n`, PRESETS, { version: 't' });
    expect(run.fit.fits).toBe(true);
    expect(run.fit.changed.some((c) => /^L-folded stub/.test(c))).toBe(true);
    expect(run.diagnostics.some((d) => d.code === 'fit.changed' && /L-folded stub/.test(d.message))).toBe(true);
    const straight = run.variants.filter((v) => v.fold === 'straight');
    expect(straight.every((v) => !v.fit.fits)).toBe(true);
    const stub = run.geometry.features.find((f) => f.id === 'stub')!;
    expect(Math.abs(pathLength(stub.path!) - run.physical.copper.stubLength)).toBeLessThan(3e-9);
  });
  it('checks the fit in board coordinates, after the placement', () => {
    const area = 'area: { x: [95 mm, 160 mm], y: [-12 mm, 12 mm] }\n';
    const moved = designFromText(`${text}${area}place: { x: 100 mm, y: 0 mm, rotation_deg: 0, mirror: false }\n`, PRESETS, { version: 't' });
    expect(moved.fit.fits).toBe(true);
    expect(moved.geometry.bounds.xmin).toBeGreaterThanOrEqual(95e-3);
    const unmoved = designFromText(`${text}${area}`, PRESETS, { version: 't' });
    expect(unmoved.fit.fits).toBe(false);
  });
});
