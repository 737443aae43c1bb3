// DXF R2000 (AC1015) writer, written by hand so the text is byte-stable: handles are numbered per
// drawing, in writing order. Sources for the structure: Autodesk, DXF Reference (HEADER variables,
// TABLES, BLOCKS, OBJECTS, LWPOLYLINE and TEXT group codes) and the ezdxf documentation (DXF
// internals: file structure), as summarised in physics.md §8 [R].
//
// Content, all geometry as LWPOLYLINE (no LINE, no CIRCLE): every copper ring (outlines and holes)
// as a closed polyline on COPPER_TOP, via pads included in those rings; drills as closed circles of
// four bulged quarter arcs on DRILL; reference planes, arrows and labels on PORTS; dimension lines,
// arrow heads and TEXT labels on DIMENSIONS; notes on NOTES; the allowed area on AREA and keep-outs
// on KEEPOUT when given. Units: millimetres, $INSUNITS 4 and $MEASUREMENT 1; coordinates rounded
// once to the nanometre (6 decimals), non-finite values refused.
import type { Artifact, BoardGeometry, Bounds, Point, Region, Ring } from '../seams.js';
import { EMPTY_BOUNDS, isEmptyBounds, mergeBounds, ringBounds } from '../geometry/polygon.js';
import { labelHeight, mm6, type ArtworkMeta } from './units.js';
import { dimensionLine, extraDimensions, featureDimensions, type Dimension } from './dimensions.js';

export type { ArtworkMeta } from './units.js';

type Pair = readonly [code: number, value: string];

/** Layer name → AutoCAD colour index (ACI): our own choice. */
const LAYER_COLOURS: Readonly<Record<string, number>> = {
  COPPER_TOP: 30,
  DRILL: 7,
  PORTS: 5,
  DIMENSIONS: 4,
  NOTES: 8,
  AREA: 3,
  KEEPOUT: 1,
};

/** DXF strings: ASCII only; anything else as the \U+XXXX escape AutoCAD uses since R2000. */
function dxfString(text: string): string {
  let out = '';
  for (const ch of text) {
    const code = ch.codePointAt(0)!;
    if (code < 0x20) out += ' ';
    else if (code > 0x7e) out += code > 0xffff ? '?' : `\\U+${code.toString(16).toUpperCase().padStart(4, '0')}`;
    else out += ch;
  }
  return out;
}

const hex = (n: number): string => n.toString(16).toUpperCase();

interface Drawing {
  readonly entities: Pair[][];
  extents: Bounds;
}

const point = (code: number, [x, y]: Point): Pair[] => [
  [10 + code, mm6(x)],
  [20 + code, mm6(y)],
  [30 + code, '0.000000'],
];

const grow = (d: Drawing, b: Bounds): void => {
  d.extents = mergeBounds(d.extents, b);
};

/** A vertex with the bulge of the segment that starts at it (tan of a quarter of the arc's angle; 0 = straight). */
type Vertex = readonly [x: number, y: number, bulge?: number];

function polyline(d: Drawing, layer: string, ring: readonly Vertex[], closed: boolean): void {
  const vertices = ring.flatMap(([x, y, bulge]): Pair[] => [
    [10, mm6(x)],
    [20, mm6(y)],
    ...(bulge ? ([[42, bulge.toFixed(12)]] as Pair[]) : []),
  ]);
  d.entities.push([[0, 'LWPOLYLINE'], [100, 'AcDbEntity'], [8, layer], [100, 'AcDbPolyline'], [90, String(ring.length)], [70, closed ? '1' : '0'], [43, '0.000000'], ...vertices]);
  grow(d, ringBounds(ring.map(([x, y]) => [x, y] as const)));
}

/** Bulge of a quarter circle: tan(90° / 4) (Autodesk DXF Reference, LWPOLYLINE group 42). */
const QUARTER_BULGE = Math.tan(Math.PI / 8);

/** A full circle as a closed LWPOLYLINE of four quarter arcs, so every outline is an LWPOLYLINE. */
function circle(d: Drawing, layer: string, centre: Point, radius: number): void {
  const [cx, cy] = centre;
  polyline(d, layer, [[cx + radius, cy, QUARTER_BULGE], [cx, cy + radius, QUARTER_BULGE], [cx - radius, cy, QUARTER_BULGE], [cx, cy - radius, QUARTER_BULGE]], true);
}

/** An open two-point LWPOLYLINE (no LINE entities anywhere). */
const segment = (d: Drawing, layer: string, from: Point, to: Point): void => polyline(d, layer, [from, to], false);

/** A filled-looking arrow head: a closed triangle with its tip at `tip`, pointing along (ux, uy). */
function arrowHead(d: Drawing, layer: string, tip: Point, [ux, uy]: Point, size: number): void {
  const back: Point = [tip[0] - ux * size, tip[1] - uy * size];
  polyline(d, layer, [tip, [back[0] - uy * size * 0.35, back[1] + ux * size * 0.35], [back[0] + uy * size * 0.35, back[1] - ux * size * 0.35]], true);
}

/** Single-line TEXT; height in metres. Centred on `at` (72 = 1, 73 = 2, alignment point 11/21/31) and turned by `angleDeg`. */
function text(d: Drawing, layer: string, at: Point, height: number, content: string, centred = false, angleDeg = 0): void {
  const rotation: Pair[] = angleDeg !== 0 ? [[50, angleDeg.toFixed(6)]] : [];
  const align: Pair[] = centred ? [[72, '1'], ...point(1, at)] : [];
  const tail: Pair[] = centred ? [[100, 'AcDbText'], [73, '2']] : [[100, 'AcDbText']];
  d.entities.push([[0, 'TEXT'], [100, 'AcDbEntity'], [8, layer], [100, 'AcDbText'], ...point(0, at), [40, mm6(height)], [1, dxfString(content)], ...rotation, ...align, ...tail]);
  const w = 0.6 * height * content.length;
  grow(d, centred ? ringBounds([[at[0] - w / 2, at[1] - height], [at[0] + w / 2, at[1] + height]]) : ringBounds([at, [at[0] + w, at[1] + height]]));
}

function region(d: Drawing, layer: string, r: Region): void {
  if (r.kind === 'circle') circle(d, layer, r.center, r.radius);
  else if (r.kind === 'rect') polyline(d, layer, [[r.x[0], r.y[0]], [r.x[1], r.y[0]], [r.x[1], r.y[1]], [r.x[0], r.y[1]]], true);
  else {
    // Drop repeated points (a closing point given twice) on the written 6-decimal grid.
    const key = ([x, y]: Point): string => `${mm6(x)},${mm6(y)}`;
    polyline(d, layer, r.points.filter((p, i) => key(p) !== key(r.points[(i + r.points.length - 1) % r.points.length]!)), true);
  }
}

/** A dimension: extension lines, the dimension line with an arrow head at each end, and its label. */
function dimension(d: Drawing, dim: Dimension, h: number): void {
  const { a, b, labelAt, angleDeg } = dimensionLine(dim, h);
  const [nx, ny] = dim.normal;
  segment(d, 'DIMENSIONS', [dim.from[0] + nx * 0.3 * h, dim.from[1] + ny * 0.3 * h], [a[0] + nx * 0.5 * h, a[1] + ny * 0.5 * h]);
  segment(d, 'DIMENSIONS', [dim.to[0] + nx * 0.3 * h, dim.to[1] + ny * 0.3 * h], [b[0] + nx * 0.5 * h, b[1] + ny * 0.5 * h]);
  segment(d, 'DIMENSIONS', a, b);
  const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
  if (len > 0) {
    const u: Point = [(b[0] - a[0]) / len, (b[1] - a[1]) / len];
    const size = Math.min(0.8 * h, len / 3);
    arrowHead(d, 'DIMENSIONS', b, u, size);
    arrowHead(d, 'DIMENSIONS', a, [-u[0], -u[1]], size);
  }
  text(d, 'DIMENSIONS', labelAt, h, dim.label, true, angleDeg);
}

function drawContent(g: BoardGeometry, meta: ArtworkMeta): Drawing {
  const d: Drawing = { entities: [], extents: EMPTY_BOUNDS };
  const h = labelHeight(g.bounds);
  for (const island of g.copper) {
    polyline(d, 'COPPER_TOP', island.outline, true);
    for (const hole of island.holes) polyline(d, 'COPPER_TOP', hole, true);
  }
  for (const v of g.vias) circle(d, 'DRILL', [v.x, v.y], v.drill / 2);
  for (const p of g.ports) {
    const a = (p.directionDeg * Math.PI) / 180;
    const [ux, uy] = [Math.cos(a), Math.sin(a)];
    const half = p.width / 2;
    // Reference plane across the line, and an arrow pointing into the network.
    segment(d, 'PORTS', [p.x - uy * half, p.y + ux * half], [p.x + uy * half, p.y - ux * half]);
    const tip: Point = [p.x + ux * p.width, p.y + uy * p.width];
    const head = p.width * 0.3;
    segment(d, 'PORTS', [p.x, p.y], [tip[0] - ux * head, tip[1] - uy * head]);
    arrowHead(d, 'PORTS', tip, [ux, uy], head);
    // Label behind the reference plane, outside the network.
    text(d, 'PORTS', [p.x - ux * 2.5 * h, p.y - uy * 2.5 * h], h, p.role, true);
  }
  for (const dim of [...featureDimensions(g, h), ...extraDimensions(g, meta, h)]) dimension(d, dim, h);
  if (g.area) region(d, 'AREA', g.area);
  for (const k of g.keepouts) region(d, 'KEEPOUT', k);
  const base = isEmptyBounds(d.extents) ? { xmin: 0, ymin: 0 } : d.extents;
  const lines = [`${meta.name} - tunestrip ${meta.version} - units mm`, ...meta.notes];
  lines.forEach((n, i) => text(d, 'NOTES', [base.xmin, base.ymin - (i + 2) * 1.6 * h], h, n));
  return d;
}

export function writeDxf(g: BoardGeometry, meta: ArtworkMeta): Artifact {
  const content = drawContent(g, meta);
  let next = 1;
  const handle = (): string => hex(next++);
  const out: Pair[] = [];
  const emit = (...pairs: Pair[]): void => {
    out.push(...pairs);
  };

  // Fixed objects first so their handles are known where they are referenced.
  const hVportTable = handle();
  const hLtypeTable = handle();
  const hLayerTable = handle();
  const hStyleTable = handle();
  const hViewTable = handle();
  const hUcsTable = handle();
  const hAppidTable = handle();
  const hDimstyleTable = handle();
  const hBlockRecordTable = handle();
  const hModelRecord = handle();
  const hPaperRecord = handle();
  const hRootDict = handle();
  const hGroupDict = handle();

  const layers = ['0', 'COPPER_TOP', 'DRILL', 'PORTS', 'DIMENSIONS', 'NOTES', ...(g.area ? ['AREA'] : []), ...(g.keepouts.length > 0 ? ['KEEPOUT'] : [])];
  const table = (name: string, h: string, count: number, records: Pair[][], extraMarker?: string): void => {
    emit([0, 'TABLE'], [2, name], [5, h], [330, '0'], [100, 'AcDbSymbolTable'], [70, String(count)]);
    if (extraMarker) emit([100, extraMarker]);
    for (const r of records) emit(...r);
    emit([0, 'ENDTAB']);
  };
  const record = (type: string, owner: string, marker: string, body: Pair[], handleCode = 5): Pair[] => [
    [0, type],
    [handleCode, handle()],
    [330, owner],
    [100, 'AcDbSymbolTableRecord'],
    [100, marker],
    ...body,
  ];

  const ext = isEmptyBounds(content.extents) ? { xmin: 0, ymin: 0, xmax: 0, ymax: 0 } : content.extents;
  emit([0, 'SECTION'], [2, 'HEADER'], [9, '$ACADVER'], [1, 'AC1015'], [9, '$DWGCODEPAGE'], [3, 'ANSI_1252']);
  emit([9, '$INSBASE'], ...point(0, [0, 0]), [9, '$EXTMIN'], ...point(0, [ext.xmin, ext.ymin]), [9, '$EXTMAX'], ...point(0, [ext.xmax, ext.ymax]));
  emit([9, '$INSUNITS'], [70, '4'], [9, '$MEASUREMENT'], [70, '1']);
  const handseedAt = out.length;
  emit([9, '$HANDSEED'], [5, 'PLACEHOLDER'], [0, 'ENDSEC']);

  emit([0, 'SECTION'], [2, 'CLASSES'], [0, 'ENDSEC']);

  emit([0, 'SECTION'], [2, 'TABLES']);
  table('VPORT', hVportTable, 1, [
    record('VPORT', hVportTable, 'AcDbViewportTableRecord', [
      [2, '*Active'],
      [70, '0'],
      ...point(0, [0, 0]).slice(0, 2),
      [11, '1.000000'],
      [21, '1.000000'],
      [12, mm6((ext.xmin + ext.xmax) / 2)],
      [22, mm6((ext.ymin + ext.ymax) / 2)],
      [40, mm6(Math.max(ext.ymax - ext.ymin, 1e-3) * 1.2)],
      [41, '1.500000'],
    ]),
  ]);
  const ltype = (name: string): Pair[] =>
    record('LTYPE', hLtypeTable, 'AcDbLinetypeTableRecord', [
      [2, name],
      [70, '0'],
      [3, name === 'Continuous' ? 'Solid line' : ''],
      [72, '65'],
      [73, '0'],
      [40, '0.000000'],
    ]);
  table('LTYPE', hLtypeTable, 3, [ltype('ByBlock'), ltype('ByLayer'), ltype('Continuous')]);
  table(
    'LAYER',
    hLayerTable,
    layers.length,
    layers.map((name) =>
      record('LAYER', hLayerTable, 'AcDbLayerTableRecord', [
        [2, name],
        [70, '0'],
        [62, String(LAYER_COLOURS[name] ?? 7)],
        [6, 'Continuous'],
      ]),
    ),
  );
  table('STYLE', hStyleTable, 1, [
    record('STYLE', hStyleTable, 'AcDbTextStyleTableRecord', [
      [2, 'Standard'],
      [70, '0'],
      [40, '0.000000'],
      [41, '1.000000'],
      [50, '0.000000'],
      [71, '0'],
      [42, '2.500000'],
      [3, 'txt'],
      [4, ''],
    ]),
  ]);
  table('VIEW', hViewTable, 0, []);
  table('UCS', hUcsTable, 0, []);
  table('APPID', hAppidTable, 1, [record('APPID', hAppidTable, 'AcDbRegAppTableRecord', [[2, 'ACAD'], [70, '0']])]);
  table(
    'DIMSTYLE',
    hDimstyleTable,
    1,
    [record('DIMSTYLE', hDimstyleTable, 'AcDbDimStyleTableRecord', [[2, 'Standard'], [70, '0']], 105)],
    'AcDbDimStyleTable',
  );
  const blockRecord = (h: string, name: string): Pair[] => [
    [0, 'BLOCK_RECORD'],
    [5, h],
    [330, hBlockRecordTable],
    [100, 'AcDbSymbolTableRecord'],
    [100, 'AcDbBlockTableRecord'],
    [2, name],
  ];
  table('BLOCK_RECORD', hBlockRecordTable, 2, [blockRecord(hModelRecord, '*Model_Space'), blockRecord(hPaperRecord, '*Paper_Space')]);
  emit([0, 'ENDSEC']);

  emit([0, 'SECTION'], [2, 'BLOCKS']);
  for (const [owner, name] of [
    [hModelRecord, '*Model_Space'],
    [hPaperRecord, '*Paper_Space'],
  ] as const) {
    emit([0, 'BLOCK'], [5, handle()], [330, owner], [100, 'AcDbEntity'], [8, '0'], [100, 'AcDbBlockBegin'], [2, name], [70, '0']);
    emit(...point(0, [0, 0]), [3, name], [1, '']);
    emit([0, 'ENDBLK'], [5, handle()], [330, owner], [100, 'AcDbEntity'], [8, '0'], [100, 'AcDbBlockEnd']);
  }
  emit([0, 'ENDSEC']);

  emit([0, 'SECTION'], [2, 'ENTITIES']);
  for (const entity of content.entities) {
    const [type, ...rest] = entity;
    emit(type!, [5, handle()], [330, hModelRecord], ...rest);
  }
  emit([0, 'ENDSEC']);

  emit([0, 'SECTION'], [2, 'OBJECTS']);
  emit([0, 'DICTIONARY'], [5, hRootDict], [330, '0'], [100, 'AcDbDictionary'], [281, '1'], [3, 'ACAD_GROUP'], [350, hGroupDict]);
  emit([0, 'DICTIONARY'], [5, hGroupDict], [330, hRootDict], [100, 'AcDbDictionary'], [281, '1']);
  emit([0, 'ENDSEC'], [0, 'EOF']);

  out[handseedAt + 1] = [5, hex(next)];
  const textOut = out.map(([code, value]) => `${String(code).padStart(3, ' ')}\n${value}`).join('\n') + '\n';
  return { path: 'layout.dxf', mediaType: 'image/vnd.dxf', text: textOut };
}
