// Every artwork writer's output read back by an independent parser (gerber-parser +
// gerber-plotter, dxf-parser) plus our structural checks. Fixtures: test/golden/fixtures.ts.
import { describe, expect, it } from 'vitest';
import { FIXTURES } from '../golden/fixtures.js';
import { gerberStructureProblems, plotGerber } from '../helpers/gerberOracle.js';
import { readDxf } from '../helpers/dxfOracle.js';
import { writeGerberCopper, writeGerberProfile } from '../../src/writers/gerber.js';
import { writeDrill } from '../../src/writers/drill.js';
import { writeDxf } from '../../src/writers/dxf.js';
import { writeSvg, scaleBarLength } from '../../src/writers/svg.js';
import { layoutStubMatch } from '../../src/geometry/index.js';

const toMm = (m: number): number => m * 1e3;

describe.each(FIXTURES)('Gerber copper: $name', (f) => {
  const art = writeGerberCopper(f.geometry, f.meta);

  it('passes the structural checks (Gerber spec 2023.08, see gerberOracle.ts)', () => {
    expect(art.path).toBe(`${f.name}-copper_top.gbr`);
    expect(gerberStructureProblems(art.text)).toEqual([]);
  });

  it('carries the X2 file attributes and no creation date (Gerber spec 2023.08 §5.6)', () => {
    for (const a of [
      '%TF.GenerationSoftware,tunestrip,tunestrip,0.1.0*%',
      '%TF.FileFunction,Copper,L1,Top*%',
      '%TF.FilePolarity,Positive*%',
      '%TF.Part,Single*%',
      '%TF.SameCoordinates*%',
      '%TA.AperFunction,Conductor*%',
    ])
      expect(art.text).toContain(a);
    expect(art.text).not.toContain('CreationDate');
    expect(art.text.includes('%TA.AperFunction,ViaPad*%')).toBe(f.geometry.vias.length > 0);
  });

  it('reads back with gerber-parser + gerber-plotter: no warnings, box = geometry bounds within 1 nm, area', async () => {
    const plot = await plotGerber(art.text);
    expect(plot.warnings).toEqual([]);
    expect(plot.units).toBe('mm');
    const b = f.geometry.bounds;
    const box = plot.box;
    [toMm(b.xmin), toMm(b.ymin), toMm(b.xmax), toMm(b.ymax)].forEach((v, i) => expect(Math.abs(box[i]! - v)).toBeLessThanOrEqual(1e-6));
    // Region area from the plotter's segments against the hand-worked area of the fixture.
    expect(Math.abs(plot.fillArea - f.analyticAreaMm2)).toBeLessThanOrEqual(1e-6);
    expect(plot.pads).toHaveLength(f.geometry.vias.length);
    plot.pads.forEach((p, i) => {
      expect(p.x).toBeCloseTo(toMm(f.geometry.vias[i]!.x), 6);
      expect(p.y).toBeCloseTo(toMm(f.geometry.vias[i]!.y), 6);
    });
  });
});

describe('Gerber oracle catches broken files (each break from ecosystem.md)', () => {
  const good = writeGerberCopper(FIXTURES[1]!.geometry, FIXTURES[1]!.meta).text;
  it.each([
    ['missing M02', good.replace('M02*\n', '')],
    ['contour not closed', good.replace(/(G36\*\n(?:.*\n)*?)(X\d+Y-?\d+D01\*\n)G37\*/, '$1G37*')],
    ['G37 missing', good.replace('G37*\n', '')],
    ['undefined aperture', good.replace('%ADD10C', '%ADD11C')],
    ['decimal point in coordinates', good.replace(/X(\d+)Y/, 'X$1.5Y')],
    ['too many digits', good.replace(/X(\d+)Y/, 'X12345678901Y')],
    ['format statement missing', good.replace('%FSLAX46Y46*%\n', '')],
    ['NaN', good.replace(/X(\d+)Y/, 'XNaNY')],
  ])('%s', (_name, broken) => {
    expect(broken).not.toBe(good);
    expect(gerberStructureProblems(broken).length).toBeGreaterThan(0);
  });
});

describe('Gerber profile', () => {
  it('is null without an area', () => {
    expect(writeGerberProfile(FIXTURES[0]!.geometry, FIXTURES[0]!.meta)).toBeNull();
  });
  it.each(FIXTURES.filter((f) => f.geometry.area))('$name: outline of the area, read back by gerber-plotter', async (f) => {
    const art = writeGerberProfile(f.geometry, f.meta)!;
    expect(art.text).toContain('%TF.FileFunction,Profile,NP*%'); // Gerber spec 2023.08 §5.6.3
    expect(gerberStructureProblems(art.text)).toEqual([]);
    const plot = await plotGerber(art.text);
    expect(plot.warnings).toEqual([]);
    const a = f.geometry.area!;
    const stroke = 0.1; // mm, the profile aperture
    const expected =
      a.kind === 'rect'
        ? [a.x[0], a.y[0], a.x[1], a.y[1]].map(toMm)
        : a.kind === 'circle'
          ? [a.center[0] - a.radius, a.center[1] - a.radius, a.center[0] + a.radius, a.center[1] + a.radius].map(toMm)
          : [];
    const grow = [-stroke / 2, -stroke / 2, stroke / 2, stroke / 2];
    expected.forEach((v, i) => expect(plot.box[i]!).toBeCloseTo(v + grow[i]!, 5));
  });
});

describe('Excellon drill', () => {
  it('is null without vias', () => {
    expect(writeDrill(FIXTURES[0]!.geometry, FIXTURES[0]!.meta)).toBeNull();
  });
  it('reads back with gerber-parser (drill) + gerber-plotter: every hole where the via is', async () => {
    const f = FIXTURES[1]!;
    const art = writeDrill(f.geometry, f.meta)!;
    expect(art.path).toBe('short-vias-plated.drl');
    expect(art.text.startsWith('M48\n')).toBe(true);
    expect(art.text.endsWith('M30\n')).toBe(true);
    expect(art.text).toContain('METRIC');
    const plot = await plotGerber(art.text, 'drill');
    expect(plot.warnings).toEqual([]);
    expect(plot.units).toBe('mm');
    expect(plot.pads).toHaveLength(3);
    plot.pads.forEach((p, i) => {
      expect(p.x).toBeCloseTo(toMm(f.geometry.vias[i]!.x), 6);
      expect(p.y).toBeCloseTo(toMm(f.geometry.vias[i]!.y), 6);
    });
    // The box of three 0.3 mm holes: via centres ± the drill radius.
    const v = f.geometry.vias;
    expect(plot.box[0]).toBeCloseTo(toMm(v[0]!.x) - 0.15, 6);
    expect(plot.box[2]).toBeCloseTo(toMm(v[2]!.x) + 0.15, 6);
  });
});

describe.each(FIXTURES)('DXF: $name', (f) => {
  const art = writeDxf(f.geometry, f.meta);
  it('reads back with dxf-parser: finite numbers, closed rings, mm units, copper area', () => {
    expect(art.path).toBe('layout.dxf');
    const back = readDxf(art.text);
    expect(back.problems).toEqual([]);
    // Hand-worked area of the fixture (rectangles and pad polygons), within 1e-6 mm².
    expect(Math.abs(back.copperArea - f.analyticAreaMm2)).toBeLessThanOrEqual(1e-6);
    // Drills are closed LWPOLYLINEs of four quarter arcs (bulge tan(π/8), Autodesk DXF Reference,
    // LWPOLYLINE group 42): centre = mean of the four vertices, radius = half their x extent.
    const drills = back.dxf.entities.filter((e) => e.type === 'LWPOLYLINE' && e.layer === 'DRILL');
    expect(drills).toHaveLength(f.geometry.vias.length);
    expect(back.dxf.entities.filter((e) => e.type === 'LINE' || e.type === 'CIRCLE')).toEqual([]);
    drills.forEach((d, i) => {
      const vs = d.vertices!;
      expect(vs).toHaveLength(4);
      expect(vs.reduce((sum, v) => sum + v.x, 0) / 4).toBeCloseTo(toMm(f.geometry.vias[i]!.x), 6);
      expect((Math.max(...vs.map((v) => v.x)) - Math.min(...vs.map((v) => v.x))) / 2).toBeCloseTo(toMm(f.geometry.vias[i]!.drill) / 2, 6);
      for (const v of vs) expect((v as { bulge?: number }).bulge).toBeCloseTo(Math.tan(Math.PI / 8), 9);
    });
    const layers = Object.keys(back.dxf.tables.layer!.layers);
    for (const l of ['COPPER_TOP', 'DRILL', 'PORTS', 'DIMENSIONS', 'NOTES']) expect(layers).toContain(l);
    expect(layers.includes('AREA')).toBe(Boolean(f.geometry.area));
    expect(layers.includes('KEEPOUT')).toBe(f.geometry.keepouts.length > 0);
    const texts = back.dxf.entities.filter((e) => e.type === 'TEXT').map((e) => e.text);
    expect(texts).toEqual(expect.arrayContaining(['load', 'source', ...f.meta.notes.map((n) => n.replace(/[^\x20-\x7e]/g, (c) => `\\U+${c.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`))]));
  });
  it('writes $EXTMIN/$EXTMAX around the copper (Autodesk DXF Reference, HEADER)', () => {
    const { dxf } = readDxf(art.text);
    const min = dxf.header['$EXTMIN'] as { x: number; y: number };
    const max = dxf.header['$EXTMAX'] as { x: number; y: number };
    expect(min.x).toBeLessThanOrEqual(toMm(f.geometry.bounds.xmin));
    expect(min.y).toBeLessThanOrEqual(toMm(f.geometry.bounds.ymin));
    expect(max.x).toBeGreaterThanOrEqual(toMm(f.geometry.bounds.xmax));
    expect(max.y).toBeGreaterThanOrEqual(toMm(f.geometry.bounds.ymax));
  });
  it('has 6 decimals on every coordinate and unique handles', () => {
    const lines = art.text.split('\n');
    const handles: string[] = [];
    for (let i = 0; i + 1 < lines.length; i += 2) {
      const code = Number(lines[i]);
      if ([10, 20, 11, 21].includes(code)) expect(lines[i + 1]).toMatch(/^-?\d+\.\d{6}$/);
      if (code === 5 || code === 105) handles.push(lines[i + 1]!);
    }
    expect(new Set(handles).size).toBe(handles.length);
  });
});

describe.each(FIXTURES)('SVG: $name', (f) => {
  const art = writeSvg(f.geometry, f.meta);
  it('is true scale in mm with a mm viewBox', () => {
    const m = /<svg [^>]*width="([\d.]+)mm" height="([\d.]+)mm" viewBox="(-?[\d.]+) (-?[\d.]+) ([\d.]+) ([\d.]+)"/.exec(art.text);
    expect(m).not.toBeNull();
    expect(Number(m![1])).toBe(Number(m![5]));
    expect(Number(m![2])).toBe(Number(m![6]));
    // The drawing covers the copper, y flipped: copper y in [ymin, ymax] ↦ [−ymax, −ymin].
    const [vx, vy, vw, vh] = m!.slice(3).map(Number) as [number, number, number, number];
    const b = f.geometry.bounds;
    expect(vx).toBeLessThan(toMm(b.xmin));
    expect(vx + vw).toBeGreaterThan(toMm(b.xmax));
    expect(vy).toBeLessThan(-toMm(b.ymax));
    expect(vy + vh).toBeGreaterThan(-toMm(b.ymin));
  });
  it('draws the copper outline with y flipped once', () => {
    const d = /<g id="copper"><path d="M([^"]+) Z"/.exec(art.text)![1]!;
    const pts = d.split(' L').map((p) => p.split(' ').map(Number) as [number, number]);
    const ring = f.geometry.copper[0]!.outline;
    expect(pts).toHaveLength(ring.length);
    pts.forEach(([x, y], i) => {
      expect(x).toBeCloseTo(toMm(ring[i]![0]), 6);
      expect(y).toBeCloseTo(-toMm(ring[i]![1]), 6);
    });
  });
  it('labels ports, dimensions every feature, shows vias, scale bar and notes; balanced tags', () => {
    expect(art.text).toContain('>load</text>');
    expect(art.text).toContain('>source</text>');
    for (const feat of f.geometry.features.filter((x) => x.kind !== 'pad')) {
      if (feat.length > 0) expect(art.text).toContain(`L ${Number((feat.length * 1e3).toFixed(3))} mm`);
      expect(art.text).toContain(`W ${Number((feat.width * 1e3).toFixed(3))} mm`);
    }
    expect((art.text.match(/class="drill"/g) ?? []).length).toBe(f.geometry.vias.length);
    expect(art.text).toContain('id="scale-bar"');
    for (const n of f.meta.notes) expect(art.text).toContain(n.replace(/&/g, '&amp;'));
    // Well-formed enough: every opened element is closed, in order (common practice, no source).
    const stack: string[] = [];
    for (const t of art.text.matchAll(/<(\/?)([a-zA-Z]+)[^>]*?(\/?)>/g)) {
      if (t[0].startsWith('<?')) continue;
      if (t[1]) expect(stack.pop()).toBe(t[2]);
      else if (!t[3]) stack.push(t[2]!);
    }
    expect(stack).toEqual([]);
    // Only our fixed ids, so the file is byte-stable.
    const ids = [...art.text.matchAll(/id="([^"]+)"/g)].map((x) => x[1]);
    expect(new Set(ids).size).toBe(ids.length);
    for (const id of ids) expect(['dim-arrow', 'port-arrow', 'keepout-hatch', 'area', 'keepouts', 'copper', 'vias', 'dimensions', 'ports', 'scale-bar', 'notes']).toContain(id);
  });
});

describe('writers are pure and deterministic', () => {
  it('give the same bytes on repeated and interleaved calls', () => {
    const [a, b] = [FIXTURES[0]!, FIXTURES[1]!];
    const first = [writeDxf(a.geometry, a.meta).text, writeSvg(a.geometry, a.meta).text, writeGerberCopper(a.geometry, a.meta).text];
    writeDxf(b.geometry, b.meta);
    writeSvg(b.geometry, b.meta);
    writeGerberCopper(b.geometry, b.meta);
    expect([writeDxf(a.geometry, a.meta).text, writeSvg(a.geometry, a.meta).text, writeGerberCopper(a.geometry, a.meta).text]).toEqual(first);
  });
  it('refuse a non-finite coordinate instead of writing NaN', () => {
    const g = layoutStubMatch(FIXTURES[0]!.input);
    const bad = { ...g, vias: [{ x: Number.NaN, y: 0, drill: 3e-4, pad: 6e-4 }] };
    expect(() => writeGerberCopper(bad, FIXTURES[0]!.meta)).toThrow(RangeError);
    expect(() => writeDxf(bad, FIXTURES[0]!.meta)).toThrow(RangeError);
    expect(() => writeDrill(bad, FIXTURES[0]!.meta)).toThrow(RangeError);
  });
  it('scale bar is a 1-2-5 length', () => {
    expect(scaleBarLength(0.02)).toBeCloseTo(0.002, 12);
    expect(scaleBarLength(0.03)).toBeCloseTo(0.005, 12);
    expect(scaleBarLength(0.012)).toBeCloseTo(0.002, 12);
  });
});

describe('islands with holes (synthetic geometry: a 10 mm square frame with a 4 mm square hole)', () => {
  const outline = [[0, 0], [10e-3, 0], [10e-3, 10e-3], [0, 10e-3]] as const;
  const hole = [[3e-3, 3e-3], [3e-3, 7e-3], [7e-3, 7e-3], [7e-3, 3e-3]] as const; // clockwise
  const base = FIXTURES[0]!.geometry;
  const g = { ...base, copper: [{ id: 'copper', outline, holes: [hole] }], vias: [], features: base.features, bounds: { xmin: 0, ymin: 0, xmax: 10e-3, ymax: 10e-3 } };
  const meta = FIXTURES[0]!.meta;
  it('Gerber clears the hole with a clear-polarity region (spec 2023.08 §4.9.2 LP, from memory for the number)', async () => {
    const text = writeGerberCopper(g, meta).text;
    expect(gerberStructureProblems(text)).toEqual([]);
    expect(text).toContain('%LPC*%');
    const plot = await plotGerber(text);
    expect(plot.warnings).toEqual([]);
    // 10 × 10 − 4 × 4 mm² by hand.
    expect(plot.fillArea).toBeCloseTo(84, 9);
  });
  it('DXF writes the hole as its own closed polyline, signed areas sum to the copper', () => {
    const back = readDxf(writeDxf(g, meta).text);
    expect(back.problems).toEqual([]);
    expect(back.copperArea).toBeCloseTo(84, 9);
  });
});

describe('a polygon area with its closing point repeated', () => {
  const f = FIXTURES[0]!;
  const area = { kind: 'polygon' as const, points: [[-1e-3, -2e-3], [13e-3, -2e-3], [13e-3, 9e-3], [-1e-3, 9e-3], [-1e-3, -2e-3]] as const };
  const g = { ...f.geometry, area };
  it('profile: no zero-length draw, box = polygon ± half the stroke', async () => {
    const text = writeGerberProfile(g, f.meta)!.text;
    expect(gerberStructureProblems(text)).toEqual([]);
    expect((text.match(/D01\*/g) ?? []).length).toBe(4);
    const plot = await plotGerber(text);
    expect(plot.warnings).toEqual([]);
    [-1.05, -2.05, 13.05, 9.05].forEach((v, i) => expect(plot.box[i]!).toBeCloseTo(v, 6));
  });
  it('DXF and SVG draw it on the area layer / group', () => {
    const back = readDxf(writeDxf(g, f.meta).text);
    expect(back.problems).toEqual([]);
    const areas = back.dxf.entities.filter((e) => e.layer === 'AREA' && e.type === 'LWPOLYLINE');
    expect(areas).toHaveLength(1);
    expect(areas[0]!.vertices).toHaveLength(4);
    expect(writeSvg(g, f.meta).text).toContain('<g id="area">');
  });
});
