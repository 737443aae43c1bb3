// Seeded property test: checkDesignRules reports a rule exactly when it is broken, for random valid
// stub layouts (layoutStubMatch) and random fabrication rules. The expected verdicts are worked out
// from the layout inputs alone (plane geometry, common practice, no source):
// - widths: the line and lead are seriesWidth wide, each stub stubWidth, each pad feature pad wide;
// - annular ring (pad − drill)/2 per via (the rule of IPC-2221B, physics.md §9.1 [M]);
// - space: neighbouring pads in a row are pitch − pad apart when that is positive; pads that
//   overlap leave a drill-to-drill web of (centre distance − drill);
// - copper to edge: each feature's bounding box against the rectangular area (a pad polygon spans
//   exactly its circle's diameter along x and y, see circlePolygon).
// All lengths are whole micrometres, so no verdict sits within the checker's 2 nm tolerance.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { layoutStubMatch, type StubLayoutInput } from '../../src/geometry/index.js';
import { checkDesignRules } from '../../src/geometry/drc.js';
import type { FabRules, Region } from '../../src/seams.js';

const um = 1e-6;

interface Case {
  readonly seriesWidth: number;
  readonly seriesLength: number;
  readonly leadLength: number;
  readonly stubWidth: number;
  readonly stubLength: number;
  readonly sides: readonly ('left' | 'right')[];
  readonly short: boolean;
  readonly drill: number;
  readonly pad: number;
  readonly count: number;
  readonly pitch: number;
  readonly fab: { minTrace: number; minSpace: number; minAnnularRing: number; copperToEdge: number };
  readonly margins: readonly [number, number, number, number];
}

const caseArb: fc.Arbitrary<Case> = fc
  .record({
    seriesWidth: fc.integer({ min: 100, max: 3000 }),
    seriesLength: fc.integer({ min: 0, max: 20000 }),
    leadLength: fc.integer({ min: 0, max: 10000 }),
    stubWidth: fc.integer({ min: 100, max: 3000 }),
    stubLength: fc.integer({ min: 0, max: 15000 }),
    sides: fc.constantFrom<('left' | 'right')[]>(['left'], ['right'], ['left', 'right']),
    short: fc.boolean(),
    drill: fc.integer({ min: 100, max: 400 }),
    annular: fc.integer({ min: 20, max: 300 }),
    count: fc.integer({ min: 1, max: 4 }),
    pitchOver: fc.integer({ min: 1, max: 800 }),
    minTrace: fc.integer({ min: 50, max: 1500 }),
    minSpace: fc.integer({ min: 20, max: 400 }),
    minAnnularRing: fc.integer({ min: 10, max: 300 }),
    copperToEdge: fc.integer({ min: 0, max: 800 }),
    margins: fc.tuple(...[0, 1, 2, 3].map(() => fc.integer({ min: -300, max: 1500 }))) as fc.Arbitrary<[number, number, number, number]>,
  })
  .map((r) => {
    const pad = r.drill + 2 * r.annular;
    const pitch = r.drill + r.pitchOver;
    // Keep the via row's pads within the stub width and its inner halves on the stub (stubLength ≥ pad),
    // so the only gaps inside the copper are between pads.
    const stubWidth = r.short ? Math.max(r.stubWidth, (r.count - 1) * pitch + pad) : r.stubWidth;
    const stubLength = r.short ? Math.max(r.stubLength, pad) : r.stubLength;
    return {
      seriesWidth: r.seriesWidth,
      seriesLength: r.seriesLength,
      leadLength: r.leadLength,
      stubWidth,
      stubLength,
      sides: r.sides,
      short: r.short,
      drill: r.drill,
      pad,
      count: r.count,
      pitch,
      fab: { minTrace: r.minTrace, minSpace: r.minSpace, minAnnularRing: r.minAnnularRing, copperToEdge: r.copperToEdge },
      margins: r.margins,
    };
  });

type Box = readonly [number, number, number, number];

/** Everything expected, as sorted "code where" strings, in µm arithmetic. */
function expected(c: Case, numberAt: (x: number, y: number) => number): { found: string[]; area: Box } {
  const h = c.seriesWidth / 2;
  const xStub = c.seriesLength;
  const xEnd = c.seriesLength + c.leadLength;
  const out: string[] = [];
  const boxes: [string, Box][] = [];
  if (c.seriesLength > 0) boxes.push(['series', [0, -h, xStub, h]]);
  if (c.leadLength > 0) boxes.push(['lead-source', [xStub, -h, xEnd, h]]);
  const widths: [string, number][] = [
    ['series', c.seriesWidth],
    ['lead-source', c.seriesWidth],
  ];
  const pads: { id: string; via: string; x: number; y: number; row: number }[] = [];
  const sides = (['left', 'right'] as const).filter((s) => c.sides.includes(s));
  sides.forEach((side, i) => {
    const id = i === 0 ? 'stub' : `stub-${i + 1}`;
    const sign = side === 'left' ? 1 : -1;
    const yEnd = sign * (h + c.stubLength);
    widths.push([id, c.stubWidth]);
    boxes.push([id, [xStub - c.stubWidth / 2, Math.min(0, yEnd), xStub + c.stubWidth / 2, Math.max(0, yEnd)]]);
    if (c.short)
      for (let k = 0; k < c.count; k++) {
        // The row runs across the stub end centred on its axis, in order along x. Which end the
        // layout numbers from is its own choice: the number is looked up by position.
        const x = xStub + (k - (c.count - 1) / 2) * c.pitch;
        const n = numberAt(x, yEnd);
        pads.push({ id: `via-pad-${n}`, via: `via-${n}`, x, y: yEnd, row: i });
      }
  });
  for (const p of pads) {
    widths.push([p.id, c.pad]);
    boxes.push([p.id, [p.x - c.pad / 2, p.y - c.pad / 2, p.x + c.pad / 2, p.y + c.pad / 2]]);
    if (c.pad - c.drill < 2 * c.fab.minAnnularRing) out.push(`fab.annular-ring ${p.via}`);
  }
  for (const [id, w] of widths) if (w < c.fab.minTrace) out.push(`fab.too-narrow ${id}`);
  for (let i = 0; i < pads.length; i++)
    for (let j = i + 1; j < pads.length; j++) {
      const a = pads[i]!;
      const b = pads[j]!;
      if (a.row !== b.row) continue;
      const centres = Math.abs(a.x - b.x);
      const gap = centres - c.pad;
      // Neighbours in the row (k and k + 1) only; the diagnostic sits on the lower-numbered pad.
      const first = a.id < b.id ? a : b;
      if (j === i + 1 && gap > 0 && gap < c.fab.minSpace) out.push(`fab.min-space ${first.id}`);
      if (gap <= 0 && centres - c.drill < c.fab.minSpace) out.push(`fab.min-space ${first.via}`);
    }
  // The area: the copper's extent widened by the four margins (x min, x max, y min, y max).
  const ext = boxes.reduce<Box>((e, [, b]) => [Math.min(e[0], b[0]), Math.min(e[1], b[1]), Math.max(e[2], b[2]), Math.max(e[3], b[3])], [Infinity, Infinity, -Infinity, -Infinity]);
  const area: Box = [ext[0] - c.margins[0], ext[1] - c.margins[2], ext[2] + c.margins[1], ext[3] + c.margins[3]];
  for (const [id, b] of boxes) {
    const least = Math.min(b[0] - area[0], area[2] - b[2], b[1] - area[1], area[3] - b[3]);
    if (least < c.fab.copperToEdge) out.push(`fab.copper-to-edge ${id}`);
  }
  return { found: out.sort(), area };
}

describe('checkDesignRules properties', () => {
  it('reports exactly the broken rules of random layouts and fab rules', () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        const input: StubLayoutInput = {
          seriesWidth: c.seriesWidth * um,
          seriesLength: c.seriesLength * um,
          leadLength: c.leadLength * um,
          stubWidth: c.stubWidth * um,
          stubLength: c.stubLength * um,
          stubSides: c.sides,
          termination: c.short ? 'short' : 'open',
          ...(c.short ? { via: { drill: c.drill * um, pad: c.pad * um, count: c.count, pitch: c.pitch * um } } : {}),
        };
        const fab: FabRules = {
          minTrace: c.fab.minTrace * um,
          minSpace: c.fab.minSpace * um,
          viaDrill: c.drill * um,
          viaPad: c.pad * um,
          minAnnularRing: c.fab.minAnnularRing * um,
          copperToEdge: c.fab.copperToEdge * um,
          viasPerStub: c.count,
        };
        const g = layoutStubMatch(input);
        const numberAt = (x: number, y: number): number => {
          const i = g.vias.findIndex((v) => Math.abs(v.x - x * um) < 1e-9 && Math.abs(v.y - y * um) < 1e-9);
          if (i < 0) throw new Error(`no via at (${x}, ${y}) µm`);
          return i + 1;
        };
        const e = expected(c, numberAt);
        expect(g.vias).toHaveLength(c.short ? c.count * c.sides.length : 0);
        const area: Region = { kind: 'rect', x: [e.area[0] * um, e.area[2] * um], y: [e.area[1] * um, e.area[3] * um] };
        const ds = checkDesignRules(g, fab, area);
        expect(ds.map((d) => `${d.code} ${d.where}`).sort()).toEqual(e.found);
        expect(ds.every((d) => d.severity === 'error')).toBe(true);
      }),
      { seed: 42, numRuns: 80 },
    );
  });
});
