// Gerber RS-274X / X2 writers for one copper layer and the board profile.
// Source: Ucamco, The Gerber Layer Format Specification, rev. 2023.08 (section numbers below).
import type { Artifact, BoardGeometry, Point, Region, Ring } from '../seams.js';
import { asciiText, fileStem, gerberCoordinate, gerberXY, mm6, type ArtworkMeta } from './units.js';

export type { ArtworkMeta } from './units.js';

const MEDIA_TYPE = 'application/vnd.gerber';
/** Characters with a meaning in Gerber syntax: never inside a comment (§4.1; from memory) … */
const RESERVED_IN_COMMENT = '*%';
/** … nor inside an attribute field, where ',' separates fields (§5.1; from memory). */
const RESERVED_IN_FIELD = '*%,';
/** Aperture of the profile stroke (common practice, no source: a thin line on the profile centre). */
const PROFILE_STROKE = 0.1e-3;

const field = (text: string): string => asciiText(text, RESERVED_IN_FIELD).trim() || '-';
const comment = (text: string): string => `G04 ${asciiText(text, RESERVED_IN_COMMENT)}*`;

/** Header common to our files: comments, X2 file attributes (§5.6), FS and MO once (§4.2), LPD, G01. */
function header(meta: ArtworkMeta, title: string, fileFunction: string, polarity: string | null): string[] {
  return [
    comment(`${meta.name}: ${title}`),
    comment('units mm, coordinates in nanometres'),
    ...meta.notes.map(comment),
    `%TF.GenerationSoftware,tunestrip,tunestrip,${field(meta.version)}*%`,
    '%TF.SameCoordinates*%',
    '%TF.Part,Single*%',
    `%TF.FileFunction,${fileFunction}*%`,
    ...(polarity ? [`%TF.FilePolarity,${polarity}*%`] : []),
    '%FSLAX46Y46*%',
    '%MOMM*%',
    '%LPD*%',
    'G01*',
  ];
}

/** One contour of a region (§4.10): D02 to the first vertex, D01 along every edge and back to the first. */
function contour(ring: Ring): string[] {
  const first = ring[0];
  if (!first || ring.length < 3) throw new RangeError('a region contour needs at least three vertices');
  return [`${gerberXY(first)}D02*`, ...ring.slice(1).map((p) => `${gerberXY(p)}D01*`), `${gerberXY(first)}D01*`];
}

const region = (rings: readonly Ring[]): string[] => ['G36*', ...rings.flatMap(contour), 'G37*'];

/**
 * Copper top layer. Each island is one region with AperFunction Conductor (§5.6.10); its holes
 * are cleared by a region in clear polarity (%LPC*%; LP is §4.9, from memory) right after it. Via pads are part of
 * the island's region and also flashed with a ViaPad aperture at every via centre (D03; pads as flashes,
 * §7.2 'bad practices' per physics.md §7.3 [R]), which
 * keeps at least one aperture defined even when there are no vias.
 */
export function writeGerberCopper(g: BoardGeometry, meta: ArtworkMeta): Artifact {
  const padSizes = [...new Set(g.vias.map((v) => mm6(v.pad)))].sort((a, b) => Number(a) - Number(b));
  const dcode = new Map(padSizes.map((s, i) => [s, 10 + i] as const));
  const lines = header(meta, 'copper, top layer', 'Copper,L1,Top', 'Positive');
  if (padSizes.length > 0) {
    lines.push('%TA.AperFunction,ViaPad*%', ...padSizes.map((s) => `%ADD${dcode.get(s)}C,${s}*%`), '%TD*%');
  } else {
    // A file with regions only and no aperture draws false warnings from some readers (gerbv 2.9
    // reports it as RS-274D), so one conductor aperture of the line width stays defined, unused.
    const width = mm6(Math.min(...g.ports.map((p) => p.width), ...g.features.map((f) => f.width)));
    lines.push(comment('D10 is defined for readers that expect an aperture; it is not used'));
    lines.push('%TA.AperFunction,Conductor*%', `%ADD10C,${width}*%`, '%TD*%');
  }
  for (const island of g.copper) {
    lines.push('%TA.AperFunction,Conductor*%', ...region([island.outline]), '%TD*%');
    if (island.holes.length > 0) lines.push('%LPC*%', ...region(island.holes), '%LPD*%');
  }
  let current: number | null = null;
  for (const v of g.vias) {
    const d = dcode.get(mm6(v.pad))!;
    if (d !== current) lines.push(`D${d}*`);
    current = d;
    lines.push(`${gerberXY([v.x, v.y])}D03*`);
  }
  lines.push('M02*');
  return { path: `${fileStem(meta.name)}-copper_top.gbr`, mediaType: MEDIA_TYPE, text: lines.join('\n') + '\n' };
}

/** The area's outline without repeated points on the 1 nm grid (no zero-length draws, §4.14). */
function regionOutline(r: Region): Ring | null {
  const ring: Ring | null =
    r.kind === 'rect' ? [[r.x[0], r.y[0]], [r.x[1], r.y[0]], [r.x[1], r.y[1]], [r.x[0], r.y[1]]] : r.kind === 'polygon' ? r.points : null;
  if (!ring) return null;
  const key = (p: Point): string => gerberXY(p);
  return ring.filter((p, i) => key(p) !== key(ring[(i + ring.length - 1) % ring.length]!));
}

/**
 * Board profile (§5.6.3 .FileFunction,Profile,NP): the allowed area's outline drawn with a thin
 * circular aperture (draws with circular apertures only, §4.7). A circular area is one full
 * circle in multi-quadrant mode (G75 before the arc, §4.7.2). Null when the geometry has no area.
 */
export function writeGerberProfile(g: BoardGeometry, meta: ArtworkMeta): Artifact | null {
  if (!g.area) return null;
  const lines = header(meta, 'board profile', 'Profile,NP', null);
  // AperFunction Profile marks the draws that define the board outline (§5.6.10; from memory).
  lines.push('%TA.AperFunction,Profile*%', `%ADD10C,${mm6(PROFILE_STROKE)}*%`, '%TD*%', 'D10*');
  const outline = regionOutline(g.area);
  if (outline) {
    if (outline.length < 3) throw new RangeError('the area outline needs at least three vertices');
    const first = outline[0]!;
    lines.push(`${gerberXY(first)}D02*`, ...outline.slice(1).map((p) => `${gerberXY(p)}D01*`), `${gerberXY(first)}D01*`);
  } else if (g.area.kind === 'circle') {
    const [cx, cy] = g.area.center;
    const start: Point = [cx + g.area.radius, cy];
    lines.push(
      'G75*',
      `${gerberXY(start)}D02*`,
      'G03*',
      `${gerberXY(start)}I${gerberCoordinate(-g.area.radius)}J0D01*`,
      'G01*',
    );
  }
  lines.push('M02*');
  return { path: `${fileStem(meta.name)}-profile.gbr`, mediaType: MEDIA_TYPE, text: lines.join('\n') + '\n' };
}

/**
 * Keep-outs as their own layer, in the copper file's coordinates: rectangles and polygons as dark
 * regions, circles as flashes of a circular aperture of their diameter. The file function is
 * `Other,Keepout` (§5.6.3 lists an `Other,<text>` function for layers it has no name for; from
 * memory). One aperture stays defined even without circles (gerbv 2.9 warns on regions-only files,
 * ecosystem.md). Null when there are no keep-outs.
 */
export function writeGerberKeepout(g: BoardGeometry, meta: ArtworkMeta): Artifact | null {
  if (g.keepouts.length === 0) return null;
  const lines = header(meta, 'keep-out regions', 'Other,Keepout', 'Positive');
  const sizes = [...new Set(g.keepouts.flatMap((k) => (k.kind === 'circle' ? [mm6(2 * k.radius)] : [])))].sort((a, b) => Number(a) - Number(b));
  if (sizes.length === 0) sizes.push(mm6(PROFILE_STROKE));
  const dcode = new Map(sizes.map((s, i) => [s, 10 + i] as const));
  lines.push(...sizes.map((s) => `%ADD${dcode.get(s)}C,${s}*%`));
  for (const k of g.keepouts) {
    const outline = regionOutline(k);
    if (outline) {
      if (outline.length < 3) throw new RangeError('a keep-out outline needs at least three vertices');
      lines.push(...region([outline]));
    }
  }
  let current: number | null = null;
  for (const k of g.keepouts) {
    if (k.kind !== 'circle') continue;
    const d = dcode.get(mm6(2 * k.radius))!;
    if (d !== current) lines.push(`D${d}*`);
    current = d;
    lines.push(`${gerberXY(k.center)}D03*`);
  }
  lines.push('M02*');
  return { path: `${fileStem(meta.name)}-keepout.gbr`, mediaType: MEDIA_TYPE, text: lines.join('\n') + '\n' };
}
