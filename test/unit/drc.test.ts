// checkDesignRules on layouts whose widths, gaps and edge distances are worked out by hand (plane
// geometry, common practice, no source) unless a comment names another source.
import { describe, expect, it } from 'vitest';
import { layoutStubMatch, rectRing, type StubLayoutInput } from '../../src/geometry/index.js';
import { checkDesignRules } from '../../src/geometry/drc.js';
import { placeGeometry } from '../../src/geometry/place.js';
import type { BoardGeometry, FabRules, Region } from '../../src/seams.js';

const mm = 1e-3;
const rect = (x0: number, x1: number, y0: number, y1: number): Region => ({ kind: 'rect', x: [x0 * mm, x1 * mm], y: [y0 * mm, y1 * mm] });

// Annular ring limit 0.05 mm: IPC-6012E (2020) Class 3 external minimum (physics.md §9.1 [R]).
const fab: FabRules = { minTrace: 0.15 * mm, minSpace: 0.15 * mm, viaDrill: 0.3 * mm, viaPad: 0.6 * mm, minAnnularRing: 0.05 * mm, copperToEdge: 0.25 * mm, viasPerStub: 2 };

// Line 3 mm wide along y = 0 from x = 0 to 20 mm, stub 3 mm wide centred at x = 10 mm, 8 mm long
// (its end at y = 1.5 + 8 = 9.5 mm).
const open: StubLayoutInput = { seriesWidth: 3 * mm, seriesLength: 10 * mm, leadLength: 10 * mm, stubWidth: 3 * mm, stubLength: 8 * mm, stubSides: ['left'], termination: 'open' };
const short = (via: StubLayoutInput['via']): StubLayoutInput => ({ ...open, termination: 'short', ...(via ? { via } : {}) });
const codes = (ds: readonly { code: string; where: string }[]) => ds.map((d) => [d.code, d.where]);

describe('checkDesignRules: a clean layout', () => {
  it('gives no diagnostics when no rule is broken', () => {
    // Pads 0.6 mm at 0.8 mm pitch: gap 0.2 ≥ 0.15; ring (0.6 − 0.3)/2 = 0.15 ≥ 0.05; area leaves ≥ 1 mm.
    const g = layoutStubMatch(short({ drill: 0.3 * mm, pad: 0.6 * mm, count: 2, pitch: 0.8 * mm }));
    expect(checkDesignRules(g, fab, rect(-1, 21, -3, 11))).toEqual([]);
    expect(checkDesignRules(layoutStubMatch({ ...open, stubSides: ['left', 'right'] }), fab, rect(-1, 21, -11, 11))).toEqual([]);
  });
  it('rules met exactly are not broken', () => {
    // min_trace = 3 mm = every width; pad gap 0.75 − 0.6 = 0.15 mm = min_space; top gap 9.8 + 0.25 = 10.05.
    const g = layoutStubMatch(short({ drill: 0.3 * mm, pad: 0.6 * mm, count: 2, pitch: 0.75 * mm }));
    expect(checkDesignRules(g, { ...fab, minTrace: 0.6 * mm, minAnnularRing: 0.15 * mm }, rect(-0.25, 20.25, -1.75, 10.05))).toEqual([]);
  });
});

describe('checkDesignRules: min_trace', () => {
  it('names each feature narrower than fab.min_trace with both values in mm', () => {
    const g = layoutStubMatch({ ...open, stubWidth: 0.12 * mm });
    const ds = checkDesignRules(g, fab);
    expect(codes(ds)).toEqual([['fab.too-narrow', 'stub']]);
    expect(ds[0]!.message).toBe('stub: width 0.120 mm below fab.min_trace 0.150 mm');
    expect(ds[0]!.severity).toBe('error');
  });
});

describe('checkDesignRules: annular ring', () => {
  it('flags (pad − drill)/2 below fab.min_annular_ring for each via', () => {
    // (0.38 − 0.3)/2 = 0.04 mm < 0.05 mm.
    const g = layoutStubMatch(short({ drill: 0.3 * mm, pad: 0.38 * mm, count: 2, pitch: 0.6 * mm }));
    const ds = checkDesignRules(g, fab);
    expect(codes(ds)).toEqual([
      ['fab.annular-ring', 'via-1'],
      ['fab.annular-ring', 'via-2'],
    ]);
    expect(ds[0]!.message).toBe('via-1: annular ring 0.040 mm below fab.min_annular_ring 0.050 mm');
  });
});

describe('checkDesignRules: min_space', () => {
  it('two via pads with a 0.1 mm gap across the stub end', () => {
    // Pitch 0.7 mm, pad 0.6 mm: the pads' facing sides are 0.7 − 0.6 = 0.1 mm apart above the stub end.
    const g = layoutStubMatch(short({ drill: 0.3 * mm, pad: 0.6 * mm, count: 2, pitch: 0.7 * mm }));
    const ds = checkDesignRules(g, fab);
    expect(codes(ds)).toEqual([['fab.min-space', 'via-pad-1']]);
    expect(ds[0]!.message).toBe('via-pad-1 to via-pad-2: space 0.100 mm below fab.min_space 0.150 mm');
  });
  it('three pads in a row: one diagnostic per neighbouring pair', () => {
    const g = layoutStubMatch(short({ drill: 0.3 * mm, pad: 0.6 * mm, count: 3, pitch: 0.7 * mm }));
    expect(codes(checkDesignRules(g, fab))).toEqual([
      ['fab.min-space', 'via-pad-1'],
      ['fab.min-space', 'via-pad-2'],
    ]);
  });
  it('merged pads: the drill-to-drill web must keep the minimum space', () => {
    // Pitch 0.4 mm < pad 0.6 mm, so the pads merge; the holes are 0.4 − 0.3 = 0.1 mm apart.
    const g = layoutStubMatch(short({ drill: 0.3 * mm, pad: 0.6 * mm, count: 2, pitch: 0.4 * mm }));
    const ds = checkDesignRules(g, fab);
    expect(codes(ds)).toEqual([['fab.min-space', 'via-1']]);
    expect(ds[0]!.message).toBe('via-1 to via-2: drill-to-drill space 0.100 mm below fab.min_space 0.150 mm');
    // At 0.45 mm pitch the web is 0.15 mm: not broken.
    expect(checkDesignRules(layoutStubMatch(short({ drill: 0.3 * mm, pad: 0.6 * mm, count: 2, pitch: 0.45 * mm })), fab)).toEqual([]);
  });
  it('separate islands closer than fab.min_space', () => {
    // Two 1 mm squares 0.1 mm apart (x ∈ [0, 1] and [1.1, 2.1]), then 0.2 mm apart.
    const islands = (gap: number): BoardGeometry => ({
      copper: [
        { id: 'copper-1', outline: rectRing(0, 0, 1 * mm, 1 * mm), holes: [] },
        { id: 'copper-2', outline: rectRing((1 + gap) * mm, 0, (2 + gap) * mm, 1 * mm), holes: [] },
      ],
      vias: [],
      ports: [],
      features: [],
      keepouts: [],
      bounds: { xmin: 0, ymin: 0, xmax: (2 + gap) * mm, ymax: 1 * mm },
    });
    const ds = checkDesignRules(islands(0.1), fab);
    expect(codes(ds)).toEqual([['fab.min-space', 'copper-1']]);
    expect(ds[0]!.message).toBe('copper-1 to copper-2: space 0.100 mm below fab.min_space 0.150 mm');
    expect(checkDesignRules(islands(0.2), fab)).toEqual([]);
  });
  it('the arms of a U-shaped island facing each other across a slot', () => {
    // U: outer [0, 3] × [0, 3] with a slot x ∈ [1, 1.1] from y = 1 up: the arms face 0.1 mm apart.
    // Its inner corners at the slot bottom are right angles, which are no gap.
    const u = (slot: number): BoardGeometry => ({
      copper: [
        {
          id: 'copper',
          outline: [
            [0, 0],
            [3 * mm, 0],
            [3 * mm, 3 * mm],
            [(1 + slot) * mm, 3 * mm],
            [(1 + slot) * mm, 1 * mm],
            [1 * mm, 1 * mm],
            [1 * mm, 3 * mm],
            [0, 3 * mm],
          ],
          holes: [],
        },
      ],
      vias: [],
      ports: [],
      features: [],
      keepouts: [],
      bounds: { xmin: 0, ymin: 0, xmax: 3 * mm, ymax: 3 * mm },
    });
    const ds = checkDesignRules(u(0.1), fab);
    expect(codes(ds)).toEqual([['fab.min-space', 'copper']]);
    expect(ds[0]!.message).toBe('copper: space 0.100 mm below fab.min_space 0.150 mm');
    expect(checkDesignRules(u(0.15), fab)).toEqual([]);
  });
  it('T-junction corners and pad-to-stub corners are not gaps', () => {
    // Balanced short stubs, 3 pads at 1 mm pitch (gaps 0.4 mm): the line–stub and pad–stub-end
    // inner corners are right angles, which are no gap.
    const g = layoutStubMatch({ ...short({ drill: 0.3 * mm, pad: 0.6 * mm, count: 3, pitch: 1 * mm }), stubSides: ['left', 'right'] });
    expect(checkDesignRules(g, fab)).toEqual([]);
  });
});

describe('checkDesignRules: folded stubs', () => {
  it("a U-folded stub's arms and its end facing the line", () => {
    // Stub 1 mm wide, fold clearance c: the arms x ∈ [9.5, 10.5] and [10.5 + c, 11.5 + c] are c apart,
    // and the returning arm ends c above the line's top edge (y = 1.5).
    const u = (c: number) => layoutStubMatch({ ...open, stubWidth: 1 * mm, stubLength: 20 * mm, fold: { kind: 'U', toward: 'source', mitreCut: 0.5 * mm, clearance: c * mm } });
    expect(checkDesignRules(u(0.1), fab).map((d) => d.message)).toEqual([
      'lead-source to stub: space 0.100 mm below fab.min_space 0.150 mm',
      'stub: space 0.100 mm below fab.min_space 0.150 mm',
    ]);
    expect(checkDesignRules(u(0.15), fab)).toEqual([]);
  });
});

describe('checkDesignRules: copper_to_edge', () => {
  it('flags each feature closer to the board edge than fab.copper_to_edge', () => {
    // Area top at 9.6 mm: the stub end (9.5) is 0.1 mm from it; the other sides leave 1 mm or more.
    const ds = checkDesignRules(layoutStubMatch(open), fab, rect(-1, 21, -3, 9.6));
    expect(codes(ds)).toEqual([['fab.copper-to-edge', 'stub']]);
    expect(ds[0]!.message).toBe('stub: 0.100 mm from the board edge (area edge y max), below fab.copper_to_edge 0.250 mm');
  });
  it('placed on the board: the rules follow the copper (mirrored, turned 90°, moved)', () => {
    // Mirror then rotate 90° maps the section point (px, py) to (py, px), then + (5, 7) mm: the
    // area of the first test, x ∈ [−1, 21], y ∈ [−3, 9.6], lands on x ∈ [2, 14.6], y ∈ [6, 28].
    const placed = placeGeometry(layoutStubMatch(open), { x: 5 * mm, y: 7 * mm, rotationDeg: 90, mirror: true });
    const ds = checkDesignRules(placed, fab, rect(2, 14.6, 6, 28));
    expect(ds.map((d) => d.message)).toEqual(['stub: 0.100 mm from the board edge (area edge x max), below fab.copper_to_edge 0.250 mm']);
    // A 0.1 mm pad gap stays a 0.1 mm gap.
    const vias = placeGeometry(layoutStubMatch(short({ drill: 0.3 * mm, pad: 0.6 * mm, count: 2, pitch: 0.7 * mm })), { x: 1 * mm, y: -2 * mm, rotationDeg: 30, mirror: false });
    expect(checkDesignRules(vias, fab).map((d) => d.message)).toEqual(['via-pad-1 to via-pad-2: space 0.100 mm below fab.min_space 0.150 mm']);
  });
  it('copper outside the board edge, and pads by their own outline', () => {
    // Area x ∈ [0.1, 21]: the line starts 0.1 mm outside the left edge. Pads reach 9.5 + 0.3 = 9.8 mm;
    // with the top at 9.9 mm each pad is 0.1 mm from it while the stub end (9.5) is 0.4 mm away.
    const g = layoutStubMatch(short({ drill: 0.3 * mm, pad: 0.6 * mm, count: 2, pitch: 0.8 * mm }));
    const ds = checkDesignRules(g, fab, rect(0.1, 21, -3, 9.9));
    expect(codes(ds)).toEqual([
      ['fab.copper-to-edge', 'series'],
      ['fab.copper-to-edge', 'via-pad-1'],
      ['fab.copper-to-edge', 'via-pad-2'],
    ]);
    expect(ds[0]!.message).toBe('series: 0.100 mm outside the board edge (area edge x min); fab.copper_to_edge is 0.250 mm');
    expect(ds[1]!.message).toBe('via-pad-1: 0.100 mm from the board edge (area edge y max), below fab.copper_to_edge 0.250 mm');
  });
  it('circle board edge: radius minus the farthest copper corner', () => {
    // Centre (10, 0): the farthest open-stub copper corners are the line ends (0 or 20, ±1.5) at
    // √(10² + 1.5²) = 10.1119 mm and the stub end corners (8.5 or 11.5, 9.5) at √(1.5² + 9.5²) = 9.6177 mm.
    const far = Math.hypot(10, 1.5);
    const ds = checkDesignRules(layoutStubMatch(open), fab, { kind: 'circle', center: [10 * mm, 0], radius: (far + 0.2) * mm });
    expect(codes(ds)).toEqual([
      ['fab.copper-to-edge', 'series'],
      ['fab.copper-to-edge', 'lead-source'],
    ]);
    expect(ds[0]!.message).toBe('series: 0.200 mm from the board edge (area circle), below fab.copper_to_edge 0.250 mm');
  });
});
