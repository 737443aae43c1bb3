// SVG drawing of the layout at true scale: width, height and viewBox in millimetres, so 1 user
// unit = 1 mm. Board y points up, SVG y points down: y is negated here, once, in `sy`.
// Palette (our own): neutral board, copper tone, dark blue dimensions, red keep-outs.
import type { Artifact, BoardGeometry, Bounds, Point, Region, Ring } from '../seams.js';
import { dimensionLine, extraDimensions, featureDimensions, type Dimension } from './dimensions.js';
import { isEmptyBounds, mergeBounds, ringBounds } from '../geometry/polygon.js';
import { trimmed } from '../format.js';
import { labelHeight, mmLabel, nanometres, type ArtworkMeta } from './units.js';

export type { ArtworkMeta } from './units.js';

const COLOURS = {
  background: '#FFFFFF',
  board: '#E6E2D6',
  copper: '#C27838',
  copperEdge: '#7E4A1E',
  drill: '#F4F1EA',
  drillEdge: '#2B2B2B',
  dimension: '#2D4B66',
  port: '#1D6B4F',
  area: '#4C6B3C',
  keepout: '#B3261E',
  text: '#1E1E1E',
} as const;

/** SVG length in mm from metres: rounded once to the nanometre, trailing zeros removed. */
const n = (metres: number): string => trimmed(nanometres(metres) / 1e6, 6);
const sx = (x: number): string => n(x);
/** The one y flip: board y up → SVG y down. */
const sy = (y: number): string => n(-y);

const escapeXml = (text: string): string =>
  text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;');

const pathData = (rings: readonly Ring[]): string =>
  rings
    .filter((r) => r.length >= 3)
    .map((r) => `M${r.map(([x, y]) => `${sx(x)} ${sy(y)}`).join(' L')} Z`)
    .join(' ');

const grown = (b: Bounds, d: number): Bounds => ({ xmin: b.xmin - d, ymin: b.ymin - d, xmax: b.xmax + d, ymax: b.ymax + d });

const regionRing = (r: Region): Ring | null =>
  r.kind === 'rect' ? [[r.x[0], r.y[0]], [r.x[1], r.y[0]], [r.x[1], r.y[1]], [r.x[0], r.y[1]]] : r.kind === 'polygon' ? r.points : null;

function regionBounds(r: Region): Bounds {
  if (r.kind === 'circle') return { xmin: r.center[0] - r.radius, ymin: r.center[1] - r.radius, xmax: r.center[0] + r.radius, ymax: r.center[1] + r.radius };
  return ringBounds(regionRing(r)!);
}

function regionElement(r: Region, attrs: string): string {
  if (r.kind === 'circle') return `<circle cx="${sx(r.center[0])}" cy="${sy(r.center[1])}" r="${n(r.radius)}" ${attrs}/>`;
  return `<path d="${pathData([regionRing(r)!])}" ${attrs}/>`;
}

function dimensionElements(d: Dimension, h: number): { svg: string[]; bounds: Bounds } {
  const [nx, ny] = d.normal;
  const { a, b, labelAt, angleDeg } = dimensionLine(d, h);
  const ext = (p: Point, q: Point): string =>
    `<line x1="${sx(p[0] + nx * 0.3 * h)}" y1="${sy(p[1] + ny * 0.3 * h)}" x2="${sx(q[0] + nx * 0.5 * h)}" y2="${sy(q[1] + ny * 0.5 * h)}" class="ext"/>`;
  // SVG angles turn clockwise on screen (y down): the board angle with its sign changed.
  const rotate = angleDeg !== 0 ? ` transform="rotate(${trimmed(-angleDeg, 6)} ${sx(labelAt[0])} ${sy(labelAt[1])})"` : '';
  const svg = [
    ext(d.from, a),
    ext(d.to, b),
    `<line x1="${sx(a[0])}" y1="${sy(a[1])}" x2="${sx(b[0])}" y2="${sy(b[1])}" class="dim" marker-start="url(#dim-arrow)" marker-end="url(#dim-arrow)"/>`,
    `<text x="${sx(labelAt[0])}" y="${sy(labelAt[1])}" dy="0.35em" class="dim-label"${rotate}>${escapeXml(d.label)}</text>`,
  ];
  const reachOut = 1.5 * h;
  const bounds = ringBounds([
    [a[0] + nx * reachOut, a[1] + ny * reachOut],
    [b[0] + nx * reachOut, b[1] + ny * reachOut],
    [labelAt[0] + nx * reachOut, labelAt[1] + ny * reachOut],
    d.from,
    d.to,
  ]);
  return { svg, bounds };
}

/** A round scale-bar length near a fifth of the drawing width: 1, 2 or 5 × 10^k metres. */
export function scaleBarLength(width: number): number {
  const target = Math.max(width / 5, 1e-4);
  const decade = 10 ** Math.floor(Math.log10(target));
  const steps = [1, 2, 5, 10];
  const step = [...steps].reverse().find((s) => s * decade <= target) ?? 1;
  return Math.round(step * decade * 1e9) / 1e9;
}

export function writeSvg(g: BoardGeometry, meta: ArtworkMeta): Artifact {
  const h = labelHeight(g.bounds);
  const body: string[] = [];
  let extent: Bounds = g.bounds;
  if (g.area) extent = mergeBounds(extent, regionBounds(g.area));
  for (const k of g.keepouts) extent = mergeBounds(extent, regionBounds(k));

  const dims = [...featureDimensions(g, h), ...extraDimensions(g, meta, h)];
  const dimSvg: string[] = [];
  for (const d of dims) {
    const e = dimensionElements(d, h);
    dimSvg.push(...e.svg);
    extent = mergeBounds(extent, e.bounds);
  }

  // Ports: reference plane, arrow into the network, label behind the plane.
  const portSvg: string[] = [];
  for (const p of g.ports) {
    const a = (p.directionDeg * Math.PI) / 180;
    const [ux, uy] = [Math.cos(a), Math.sin(a)];
    const half = p.width / 2 + h;
    const tail: Point = [p.x - ux * 2.5 * h, p.y - uy * 2.5 * h];
    const tip: Point = [p.x + ux * 1.5 * h, p.y + uy * 1.5 * h];
    // Label just outside the line edge, centred on the reference plane.
    const labelAt: Point = [p.x - uy * (half + 0.6 * h), p.y + ux * (half + 0.6 * h)];
    portSvg.push(
      `<line x1="${sx(p.x - uy * half)}" y1="${sy(p.y + ux * half)}" x2="${sx(p.x + uy * half)}" y2="${sy(p.y - ux * half)}" class="port-plane"/>`,
      `<line x1="${sx(tail[0])}" y1="${sy(tail[1])}" x2="${sx(tip[0])}" y2="${sy(tip[1])}" class="port" marker-end="url(#port-arrow)"/>`,
      `<text x="${sx(labelAt[0])}" y="${sy(labelAt[1])}" class="port-label">${p.role}</text>`,
    );
    extent = mergeBounds(extent, ringBounds([[labelAt[0] - 3 * h, labelAt[1] - h], [labelAt[0] + 3 * h, labelAt[1] + h], tail]));
  }

  if (isEmptyBounds(extent)) extent = { xmin: 0, ymin: 0, xmax: 1e-3, ymax: 1e-3 };
  const margin = 2 * h;
  const footer = (meta.notes.length + 5) * 1.6 * h;
  const xmin = extent.xmin - margin;
  const xmax = extent.xmax + margin;
  const ymax = extent.ymax + margin + 2 * h; // room for the title
  const ymin = extent.ymin - margin - footer;
  const width = xmax - xmin;
  const height = ymax - ymin;

  body.push(`<rect x="${sx(xmin)}" y="${sy(ymax)}" width="${n(width)}" height="${n(height)}" fill="${COLOURS.background}"/>`);
  // The board: the allowed area's shape when given, else the copper with a small rim.
  if (g.area) body.push(regionElement(g.area, 'class="board"'));
  else {
    const box = isEmptyBounds(g.bounds) ? extent : grown(g.bounds, h);
    body.push(`<rect x="${sx(box.xmin)}" y="${sy(box.ymax)}" width="${n(box.xmax - box.xmin)}" height="${n(box.ymax - box.ymin)}" class="board"/>`);
  }
  if (g.area) body.push(`<g id="area">${regionElement(g.area, 'class="area"')}</g>`);
  if (g.keepouts.length > 0) body.push(`<g id="keepouts">${g.keepouts.map((k) => regionElement(k, 'class="keepout"')).join('')}</g>`);
  body.push(
    `<g id="copper">${g.copper.map((c) => `<path d="${pathData([c.outline, ...c.holes])}" class="copper"/>`).join('')}</g>`,
  );
  if (g.vias.length > 0) {
    const viaSvg = g.vias.map((v) => {
      const r = v.drill / 2;
      return `<circle cx="${sx(v.x)}" cy="${sy(v.y)}" r="${n(r)}" class="drill"/><path d="M${sx(v.x - r)} ${sy(v.y)} L${sx(v.x + r)} ${sy(v.y)} M${sx(v.x)} ${sy(v.y - r)} L${sx(v.x)} ${sy(v.y + r)}" class="drill-cross"/>`;
    });
    body.push(`<g id="vias">${viaSvg.join('')}</g>`);
  }
  body.push(`<g id="dimensions">${dimSvg.join('')}</g>`, `<g id="ports">${portSvg.join('')}</g>`);

  // Scale bar and notes in the footer; title at the top.
  const bar = scaleBarLength(extent.xmax - extent.xmin);
  const barY = extent.ymin - margin - 1.2 * h;
  body.push(
    `<g id="scale-bar"><rect x="${sx(extent.xmin)}" y="${sy(barY + 0.25 * h)}" width="${n(bar)}" height="${n(0.5 * h)}" class="scale"/>` +
      `<text x="${sx(extent.xmin + bar + 0.5 * h)}" y="${sy(barY - 0.35 * h)}" class="note">${escapeXml(`${mmLabel(bar)} mm`)}</text></g>`,
  );
  const viaSizes = [...new Set(g.vias.map((v) => `drill ${mmLabel(v.drill)} mm, pad ${mmLabel(v.pad)} mm`))];
  const viaNote = g.vias.length > 0 ? [`${g.vias.length} via${g.vias.length > 1 ? 's' : ''}: ${viaSizes.join('; ')}`] : [];
  const notes = [`units mm, true scale; tunestrip ${meta.version}`, ...viaNote, ...meta.notes];
  body.push(
    `<g id="notes">${notes.map((t, i) => `<text x="${sx(extent.xmin)}" y="${sy(barY - (i + 1.6) * 1.6 * h)}" class="note">${escapeXml(t)}</text>`).join('')}</g>`,
    `<text x="${sx(xmin + margin)}" y="${sy(ymax - 1.6 * h)}" class="title">${escapeXml(meta.name)}</text>`,
  );

  const style = [
    `.board{fill:${COLOURS.board};stroke:none}`,
    `.copper{fill:${COLOURS.copper};fill-rule:evenodd;stroke:${COLOURS.copperEdge};stroke-width:${n(h / 25)}}`,
    `.drill{fill:${COLOURS.drill};stroke:${COLOURS.drillEdge};stroke-width:${n(h / 25)}}`,
    `.drill-cross{stroke:${COLOURS.drillEdge};stroke-width:${n(h / 30)};fill:none}`,
    `.dim,.ext{stroke:${COLOURS.dimension};stroke-width:${n(h / 20)};fill:none}`,
    `.ext{stroke-width:${n(h / 30)}}`,
    `.dim-label{fill:${COLOURS.dimension};font-size:${n(h)}px;text-anchor:middle}`,
    `.port,.port-plane{stroke:${COLOURS.port};stroke-width:${n(h / 10)};fill:none}`,
    `.port-plane{stroke-dasharray:${n(h / 3)} ${n(h / 6)}}`,
    `.port-label{fill:${COLOURS.port};font-size:${n(h)}px;font-weight:bold;text-anchor:middle}`,
    `.area{fill:none;stroke:${COLOURS.area};stroke-width:${n(h / 12)};stroke-dasharray:${n(h)} ${n(h / 2)}}`,
    `.keepout{fill:url(#keepout-hatch);stroke:${COLOURS.keepout};stroke-width:${n(h / 12)}}`,
    `.scale{fill:${COLOURS.text}}`,
    `.note{fill:${COLOURS.text};font-size:${n(h)}px}`,
    `.title{fill:${COLOURS.text};font-size:${n(1.4 * h)}px;font-weight:bold}`,
    `text{font-family:sans-serif}`,
  ].join('');
  const arrow = (id: string, colour: string, size: number): string =>
    `<marker id="${id}" viewBox="0 0 10 10" refX="10" refY="5" markerWidth="${n(size)}" markerHeight="${n(size)}" orient="auto-start-reverse" markerUnits="userSpaceOnUse"><path d="M0 0 L10 5 L0 10 Z" fill="${colour}"/></marker>`;
  const defs =
    `<defs><style>${style}</style>` +
    arrow('dim-arrow', COLOURS.dimension, 0.8 * h) +
    arrow('port-arrow', COLOURS.port, 1.2 * h) +
    `<pattern id="keepout-hatch" width="${n(h)}" height="${n(h)}" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><line x1="0" y1="0" x2="0" y2="${n(h)}" stroke="${COLOURS.keepout}" stroke-width="${n(h / 8)}"/></pattern></defs>`;

  const text = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="${n(width)}mm" height="${n(height)}mm" viewBox="${sx(xmin)} ${sy(ymax)} ${n(width)} ${n(height)}">`,
    `<title>${escapeXml(`${meta.name}: copper layout (mm)`)}</title>`,
    defs,
    ...body,
    '</svg>',
    '',
  ].join('\n');
  return { path: 'layout.svg', mediaType: 'image/svg+xml', text };
}
