// Areas and keep-outs from the spec file: rectangles, polygons and circles, in metres.
import { fail } from '../diagnostics.js';
import type { Point, Region } from '../seams.js';
import { parseQuantity, shown } from '../units.js';
import { REGION_FORMS } from './fields.js';

const FORMS_TEXT = '{ x: [min, max], y: [min, max] }, { polygon: [[x, y], …] } or { center: [x, y], radius: r }';

const isRecord = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object' && !Array.isArray(v);

function pair(value: unknown, where: string, what: string): readonly [number, number] {
  if (!Array.isArray(value) || value.length !== 2) {
    return fail('spec.invalid', where, `${shown(value)} is not ${what}; write two lengths in brackets, e.g. [-1 mm, 25 mm]`);
  }
  return [parseQuantity(value[0], 'length', `${where}[0]`), parseQuantity(value[1], 'length', `${where}[1]`)];
}

function interval(value: unknown, where: string): readonly [number, number] {
  const [lo, hi] = pair(value, where, 'an interval');
  if (!(lo < hi)) fail('spec.invalid', where, `the first value must be less than the second (got ${shown(value)})`);
  return [lo, hi];
}

/** Twice the signed area of a ring (shoelace); zero for a degenerate polygon. */
const twiceArea = (points: readonly Point[]): number =>
  points.reduce((sum, [x, y], i) => {
    const [nx, ny] = points[(i + 1) % points.length] ?? [x, y];
    return sum + x * ny - nx * y;
  }, 0);

/** One region; `where` is its JSON path. Keys from two forms at once are refused. */
export function parseRegion(value: unknown, where: string): Region {
  if (!isRecord(value)) return fail('spec.invalid', where, `${shown(value)} is not a region; use ${FORMS_TEXT}`);
  const has = (k: string): boolean => Object.hasOwn(value, k);
  const forms = (Object.keys(REGION_FORMS) as (keyof typeof REGION_FORMS)[]).filter((f) => REGION_FORMS[f].some(has));
  if (forms.length !== 1) {
    return fail('spec.invalid', where, forms.length === 0 ? `no region given; use ${FORMS_TEXT}` : `mixes ${forms.join(' and ')} keys; use exactly one of ${FORMS_TEXT}`);
  }
  const form = forms[0];
  for (const k of REGION_FORMS[form ?? 'rect']) {
    if (!has(k)) fail('spec.invalid', `${where}.${k}`, `is missing; a ${form} region needs ${REGION_FORMS[form ?? 'rect'].join(' and ')}`);
  }
  if (form === 'rect') return { kind: 'rect', x: interval(value.x, `${where}.x`), y: interval(value.y, `${where}.y`) };
  if (form === 'circle') {
    const center = pair(value.center, `${where}.center`, 'a point');
    const radius = parseQuantity(value.radius, 'length', `${where}.radius`);
    if (!(radius > 0)) fail('spec.invalid', `${where}.radius`, `${shown(value.radius)} must be greater than 0`);
    return { kind: 'circle', center, radius };
  }
  const raw = value.polygon;
  if (!Array.isArray(raw) || raw.length < 3) {
    return fail('spec.invalid', `${where}.polygon`, `needs a list of at least three points [x, y] (got ${Array.isArray(raw) ? `${raw.length}` : shown(raw)})`);
  }
  const given = raw.map((p, i) => pair(p, `${where}.polygon[${i}]`, 'a point'));
  // A ring is stored without its closing point; drop it when the file repeats the first point last.
  const [first, last] = [given[0], given[given.length - 1]];
  const closed = given.length > 3 && first !== undefined && last !== undefined && first[0] === last[0] && first[1] === last[1];
  const points = closed ? given.slice(0, -1) : given;
  // The copper stage works on a 1 nm grid (src/geometry/polygon.ts GRID); judge the outline as it will be drawn there.
  const onGrid = points.map(([x, y]): Point => [Math.round(x / 1e-9), Math.round(y / 1e-9)]);
  if (twiceArea(onGrid) === 0) fail('spec.invalid', `${where}.polygon`, 'encloses no area (all points on one line, to the nearest nanometre)');
  return { kind: 'polygon', points };
}

/** A list of regions (keep-outs). */
export function parseRegions(value: unknown, where: string): readonly Region[] {
  if (!Array.isArray(value)) return fail('spec.invalid', where, `${shown(value)} is not a list; write - { x: [...], y: [...] } items`);
  return value.map((r, i) => parseRegion(r, `${where}[${i}]`));
}
