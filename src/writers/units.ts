// Board lengths at the writer edge: metres inside, millimetres in files. Every coordinate is
// rounded once, to the nanometre, and only then formatted.
import { fixed, trimmed } from '../format.js';
import type { Bounds, Point } from '../seams.js';
import { isEmptyBounds } from '../geometry/polygon.js';

/** Whole nanometres from metres; throws on a non-finite value so no NaN reaches a file. */
export function nanometres(metres: number): number {
  if (!Number.isFinite(metres)) throw new RangeError(`non-finite board coordinate ${metres}`);
  const nm = Math.round(metres * 1e9);
  return nm === 0 ? 0 : nm; // no -0
}

/** Millimetres with exactly 6 decimals (1 nm), e.g. "1.531050". */
export const mm6 = (metres: number): string => fixed(nanometres(metres) / 1e6, 6);

/** Millimetres, trimmed, for labels: 1.5310 → "1.531". */
export const mmLabel = (metres: number, decimals = 3): string => trimmed(nanometres(metres) / 1e6, decimals);

/** Gerber coordinate at %FSLAX46Y46*% with %MOMM*%: the integer count of nanometres, e.g. "-1531050". */
export const gerberCoordinate = (metres: number): string => String(nanometres(metres));

export const gerberXY = ([x, y]: Point): string => `X${gerberCoordinate(x)}Y${gerberCoordinate(y)}`;

/** A file-name-safe stem: ASCII letters, digits, '.', '_' and '-' only. */
export function fileStem(name: string): string {
  const stem = name.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^[-.]+|-+$/g, '');
  return stem.length > 0 ? stem : 'board';
}

const TRANSLITERATION: Readonly<Record<string, string>> = {
  'Ω': 'ohm', 'µ': 'u', 'μ': 'u', '°': 'deg', '±': '+/-', '×': 'x', '−': '-', '–': '-', '—': '-',
  '·': '.', 'λ': 'lambda', 'ε': 'eps', 'Γ': 'Gamma', '≥': '>=', '≤': '<=', '→': '->', '≈': '~',
};

/** Printable ASCII without the characters a format reserves; common symbols are spelt out, anything else becomes '?'. */
export function asciiText(text: string, reserved: string): string {
  let out = '';
  for (const ch of Array.from(text, (c) => TRANSLITERATION[c] ?? c).join('')) {
    const code = ch.codePointAt(0)!;
    out += code < 0x20 || code > 0x7e || reserved.includes(ch) ? (code === 0x09 ? ' ' : '?') : ch;
  }
  return out;
}

/** What every artwork writer needs besides the geometry (kept here, the writers' one shared module). */
export interface ArtworkMeta {
  readonly name: string;
  readonly version: string;
  readonly notes: readonly string[];
  /** Extra dimension lines to draw (board metres), on top of each feature's length and width. */
  readonly dimensions?: readonly { readonly label: string; readonly from: Point; readonly to: Point }[];
}

/** Text height for labels: 1/40 of the larger copper extent, between 0.25 mm and 3 mm (our choice). */
export function labelHeight(b: Bounds): number {
  const span = isEmptyBounds(b) ? 0 : Math.max(b.xmax - b.xmin, b.ymax - b.ymin);
  return Math.min(3e-3, Math.max(0.25e-3, Math.round((span / 40) * 1e5) / 1e5));
}
