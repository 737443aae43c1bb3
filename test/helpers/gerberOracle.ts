// Layered Gerber oracle. Nobody validates a Gerber file alone (ecosystem.md: a file broken eight
// ways was caught by different readers), so: (1) our structural checks on the text, each citing
// Ucamco, The Gerber Layer Format Specification, rev. 2023.08 ("spec" below); (2) gerber-parser +
// gerber-plotter (tracespace, npm): warnings, image bounding box and region area; (3) gerbv (Debian):
// render at 600 dpi, read its stderr and count copper pixels (the PNG is decoded here with zlib).
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';
import gerberParserModule from 'gerber-parser';
import gerberPlotterModule from 'gerber-plotter';

// ─────────────────────────── layer 1: structure ───────────────────────────

/** Problems found in the text of a Gerber file; empty when it passes. */
export function gerberStructureProblems(text: string): string[] {
  const problems: string[] = [];
  // Spec §3 (from memory for the number): commands end in '*', extended ones are wrapped in '%'. Our
  // writer puts one command per line, so the checks read line by line.
  const lines = text.split('\n').filter((l) => l.length > 0);
  // Common practice, no source: a writer bug shows up as NaN/undefined/Infinity in the text.
  if (/NaN|undefined|Infinity|null/.test(text)) problems.push('text contains NaN/undefined/Infinity/null');
  const isCoordinateLine = (l: string): boolean => /^(G0[123])?X|^(G0[123])?Y|^[XYIJ][+-]?\d/.test(l);
  const firstCoordinate = lines.findIndex(isCoordinateLine);
  const fsLines = lines.map((l, i) => [l, i] as const).filter(([l]) => l.startsWith('%FS'));
  const moLines = lines.map((l, i) => [l, i] as const).filter(([l]) => l.startsWith('%MO'));
  // Spec §4.2.2 (physics.md §7.1 [R]): FS exactly once, in the header; only LA; X and Y formats identical; 6 decimals in mm.
  if (fsLines.length !== 1) problems.push(`expected exactly one FS command, found ${fsLines.length}`);
  const fs = fsLines[0];
  let digits = 0;
  if (fs) {
    const m = /^%FSLAX([1-6])([56])Y\1\2\*%$/.exec(fs[0]);
    if (!m) problems.push(`malformed or deprecated FS: ${fs[0]}`);
    else digits = Number(m[1]) + Number(m[2]);
    if (firstCoordinate >= 0 && fs[1] > firstCoordinate) problems.push('FS comes after the first coordinate');
  }
  // Spec §4.2.1 (physics.md §7.1 [R]): MO exactly once, before the first operation; metric recommended.
  if (moLines.length !== 1) problems.push(`expected exactly one MO command, found ${moLines.length}`);
  const mo = moLines[0];
  if (mo) {
    if (mo[0] !== '%MOMM*%') problems.push(`unit is not mm: ${mo[0]}`);
    if (firstCoordinate >= 0 && mo[1] > firstCoordinate) problems.push('MO comes after the first coordinate');
  }
  // Spec §4.13 (physics.md §7.6 [R]): M02 is mandatory and the last command; nothing may follow.
  if (lines[lines.length - 1] !== 'M02*') problems.push('file does not end with M02*');
  if (lines.filter((l) => l === 'M02*').length !== 1) problems.push('M02* must appear exactly once');
  // Spec §8 (physics.md §7.8 [R], deprecated, never emit): G54/G55, G70/G71, G90/G91, G74, M00/M01, IP/AS/IR/MI/OF/SF/IN/LN.
  for (const l of lines) {
    if (/^(G54|G55|G70|G71|G90|G91|G74|M00|M01)\b/.test(l) || /^%(IP|AS|IR|MI|OF|SF|IN|LN)/.test(l)) problems.push(`deprecated command: ${l}`);
    // Spec §8 (physics.md §7.8 [R]): G01/G02/G03 combined with D01 in one word is deprecated.
    if (/^G0[123]X/.test(l)) problems.push(`deprecated combined G code and coordinates: ${l}`);
    // Spec §4.1 (physics.md §7.1 [R]; the '*'/'%' rule from memory): a comment cannot contain '*' or '%' other than its terminator.
    if (l.startsWith('G04') && !/^G04[^*%]*\*$/.test(l)) problems.push(`malformed comment: ${l}`);
  }
  // Spec §4.2.2 (physics.md §7.1 [R]) with FSLAX46Y46: coordinates are integers of at most 4 + 6 digits, optional sign,
  // no decimal point. Spec §8: every coordinate word carries an explicit D01/D02/D03 (modal D01 deprecated).
  const defined = new Set<number>();
  let current: number | null = null;
  let inRegion = false;
  let contour: [number, number][] = [];
  let position: [number, number] = [0, 0];
  const closeContour = (where: number): void => {
    if (contour.length === 0) return;
    const first = contour[0]!;
    const last = contour[contour.length - 1]!;
    // Spec §4.10 (physics.md §7.4 [R]): every contour is closed: its last vertex coincides exactly with its first.
    if (first[0] !== last[0] || first[1] !== last[1]) problems.push(`contour ending at line ${where + 1} is not closed`);
    // Spec §4.10 (physics.md §7.4 [R], closed contour; the count is ours): a contour with area needs at least 3 distinct vertices plus the closing one.
    if (contour.length < 4) problems.push(`contour ending at line ${where + 1} has fewer than 4 points`);
    contour = [];
  };
  lines.forEach((l, i) => {
    const ad = /^%ADD(\d+)([A-Za-z_.$][^,*]*)(,[^*]*)?\*%$/.exec(l);
    if (l.startsWith('%ADD')) {
      if (!ad) problems.push(`malformed aperture definition: ${l}`);
      else {
        const d = Number(ad[1]);
        // Spec §4.3 (physics.md §7.2 [R]): aperture numbers are ≥ 10 and cannot be re-assigned.
        if (d < 10) problems.push(`aperture number below 10: D${d}`);
        if (defined.has(d)) problems.push(`aperture D${d} defined twice`);
        defined.add(d);
        // Spec §8.2 (physics.md §7.2 [R]): holes in standard apertures are deprecated (a second parameter on C).
        if (ad[2] === 'C' && ad[3] && ad[3].includes('X')) problems.push(`circular aperture with a hole: ${l}`);
      }
      return;
    }
    const select = /^D(\d+)\*$/.exec(l);
    if (select) {
      const d = Number(select[1]);
      // Spec §4.6 (from memory for the number): selecting an undefined aperture is an error.
      if (d >= 10 && !defined.has(d)) problems.push(`aperture D${d} used before it is defined (line ${i + 1})`);
      if (inRegion) problems.push('aperture selected inside a region');
      current = d;
      return;
    }
    if (l === 'G36*') {
      // Spec §4.10 (from memory): regions cannot be nested.
      if (inRegion) problems.push(`G36 inside an open region at line ${i + 1}`);
      inRegion = true;
      return;
    }
    if (l === 'G37*') {
      if (!inRegion) problems.push(`G37 without G36 at line ${i + 1}`);
      closeContour(i);
      inRegion = false;
      return;
    }
    if (l === 'M02*' && inRegion) problems.push('M02 inside an open region'); // spec §4.13, physics.md §7.6 [R]
    const op = /^(?:X([^YIJD]*))?(?:Y([^IJD]*))?(?:I([^JD]*))?(?:J([^D]*))?D0([123])\*$/.exec(l);
    if (!op) {
      if (/^[XYIJ]/.test(l)) problems.push(`coordinate word without a valid D code: ${l}`);
      return;
    }
    for (const raw of op.slice(1, 5)) {
      if (raw === undefined) continue;
      if (!/^[+-]?\d{1,10}$/.test(raw) || raw.replace(/^[+-]/, '').length > Math.max(digits, 1))
        problems.push(`bad coordinate "${raw}" at line ${i + 1}`);
    }
    const next: [number, number] = [op[1] !== undefined ? Number(op[1]) : position[0], op[2] !== undefined ? Number(op[2]) : position[1]];
    const code = Number(op[5]);
    if (inRegion) {
      // Spec §4.10 (physics.md §7.4 [R]): inside a region only D01 and D02 (and G01/G02/G03) are allowed.
      if (code === 3) problems.push(`flash inside a region at line ${i + 1}`);
      if (code === 2) {
        closeContour(i);
        contour = [next];
      } else if (code === 1) {
        // Spec §4.10 (physics.md §7.4 [R]): zero-length segments are not allowed.
        if (next[0] === position[0] && next[1] === position[1]) problems.push(`zero-length segment at line ${i + 1}`);
        if (contour.length === 0) problems.push(`D01 without a starting D02 in a region at line ${i + 1}`);
        contour.push(next);
      }
    } else if (code === 1 || code === 3) {
      // Spec §4.8 (from memory): D01/D03 outside a region need a current aperture.
      if (current === null) problems.push(`operation without a current aperture at line ${i + 1}`);
    }
    position = next;
  });
  if (inRegion) problems.push('region not closed by G37 (G36/G37 unbalanced)');
  return problems;
}

// ─────────────────────────── layer 2: gerber-parser + gerber-plotter ───────────────────────────

export interface PlotResult {
  readonly warnings: string[];
  /** Image box [xmin, ymin, xmax, ymax] in file units (mm). */
  readonly box: readonly [number, number, number, number];
  readonly units: string;
  /** Area of dark fills minus clear fills (mm²), from the plotter's line segments. */
  readonly fillArea: number;
  readonly pads: { tool: string; x: number; y: number }[];
}

type ParserFactory = (options?: object) => {
  parseSync(text: string): object[];
  on(event: string, cb: (w: { message: string }) => void): void;
};
type PlotterFactory = (options?: object) => NodeJS.ReadWriteStream & { on(event: string, cb: (x: never) => void): unknown };

// CommonJS packages under ESM: default import, tolerate a nested default (ecosystem.md, traps).
const gerberParser = ((gerberParserModule as unknown as { default?: ParserFactory }).default ?? gerberParserModule) as unknown as ParserFactory;
const gerberPlotter = ((gerberPlotterModule as unknown as { default?: PlotterFactory }).default ?? gerberPlotterModule) as unknown as PlotterFactory;

const shoelace = (pts: readonly (readonly number[])[]): number => {
  let s = 0;
  for (let i = 0; i < pts.length; i++) {
    const a = pts[i]!;
    const b = pts[(i + 1) % pts.length]!;
    s += a[0]! * b[1]! - b[0]! * a[1]!;
  }
  return s / 2;
};

/** Parse with gerber-parser (parseSync in try/catch) and plot with gerber-plotter. */
export async function plotGerber(text: string, filetype: 'gerber' | 'drill' = 'gerber'): Promise<PlotResult> {
  const warnings: string[] = [];
  const parser = gerberParser(filetype === 'drill' ? { filetype } : {});
  // gerber-parser 4 does not know X2 attributes (%TF, %TA, %TO, %TD); like gerbv it ignores them,
  // which is legitimate: attributes do not change the image (Gerber spec 2023.08 §5, from memory;
  // physics.md §7.9 [C] records gerbv doing the same). Only those
  // warnings are dropped; every other one fails the check.
  const x2 = /^block "%T[FAOD][^"]*" was not recognized and was ignored$/;
  parser.on('warning', (w) => {
    if (!x2.test(w.message)) warnings.push(`parser: ${w.message}`);
  });
  let commands: object[];
  try {
    commands = parser.parseSync(text);
  } catch (e) {
    throw new Error(`gerber-parser threw: ${(e as Error).message}`);
  }
  const plotter = gerberPlotter({});
  const objects: Record<string, unknown>[] = [];
  return new Promise((resolve, reject) => {
    plotter.on('warning', ((w: { message: string }) => warnings.push(`plotter: ${w.message}`)) as never);
    plotter.on('data', ((o: Record<string, unknown>) => objects.push(o)) as never);
    plotter.on('error', reject as never);
    plotter.on('end', (() => {
      const size = objects.find((o) => o.type === 'size') as { box: [number, number, number, number]; units: string } | undefined;
      if (!size) return reject(new Error('plotter emitted no size object'));
      let dark = true;
      let fillArea = 0;
      const pads: { tool: string; x: number; y: number }[] = [];
      for (const o of objects) {
        if (o.type === 'polarity') dark = o.polarity === 'dark';
        if (o.type === 'pad') pads.push({ tool: String(o.tool), x: o.x as number, y: o.y as number });
        if (o.type === 'fill') {
          const path = o.path as { type: string; start: number[]; end: number[] }[];
          // Split the path into closed loops where a segment does not start at the previous end.
          let loop: number[][] = [];
          const flush = (): void => {
            if (loop.length >= 3) fillArea += (dark ? 1 : -1) * Math.abs(shoelace(loop));
            loop = [];
          };
          let last: number[] | null = null;
          for (const seg of path) {
            if (seg.type !== 'line') warnings.push(`oracle: non-line segment in fill (${seg.type})`);
            if (!last || last[0] !== seg.start[0] || last[1] !== seg.start[1]) {
              flush();
              loop.push(seg.start);
            }
            loop.push(seg.end);
            last = seg.end;
          }
          flush();
        }
      }
      resolve({ warnings, box: size.box, units: size.units, fillArea, pads });
    }) as never);
    // Object-mode stream: the parser's command objects go in as they are.
    for (const c of commands) plotter.write(c as unknown as string);
    plotter.end();
  });
}

// ─────────────────────────── layer 3: gerbv ───────────────────────────

export const GERBV = '/usr/bin/gerbv';
export const hasGerbv = (): boolean => existsSync(GERBV);

export interface GerbvRender {
  /** stderr lines that are CRITICAL or WARNING, without the "Unknown RS-274X extension" ones. */
  readonly complaints: string[];
  /** Copper area from the antialiased pixels (mm²), at the given dpi. */
  readonly copperArea: number;
  readonly width: number;
  readonly height: number;
}

const FOREGROUND = [0xb8, 0x73, 0x33] as const;

/**
 * Render with `gerbv -x png -D <dpi> -a -b '#FFFFFF' -f '#B87333FF'` (ecosystem.md) and count
 * copper: each pixel's coverage is read from its blue channel between white (0) and the
 * foreground (1), which keeps the antialiased edge pixels' fractions.
 */
export function renderWithGerbv(files: readonly { name: string; text: string }[], dpi = 600): GerbvRender {
  const dir = mkdtempSync(join(tmpdir(), 'tunestrip-gerbv-'));
  try {
    const paths = files.map((f) => {
      const p = join(dir, f.name);
      writeFileSync(p, f.text);
      return p;
    });
    const out = join(dir, 'out.png');
    const run = spawnSync(GERBV, ['-x', 'png', '-D', String(dpi), '-a', '-b', '#FFFFFF', '-f', '#B87333FF', '-o', out, ...paths], { encoding: 'utf8' });
    const complaints = `${run.stderr}\n${run.stdout}`
      .split('\n')
      .filter((l) => /CRITICAL|WARNING/.test(l) && !/Unknown RS-274X extension/.test(l));
    const png = decodePng(readFileSync(out));
    let covered = 0;
    for (let i = 0; i < png.width * png.height; i++) {
      const b = png.pixels[i * png.channels + 2]!;
      covered += Math.min(1, Math.max(0, (255 - b) / (255 - FOREGROUND[2])));
    }
    const pixelMm = 25.4 / dpi;
    return { complaints, copperArea: covered * pixelMm * pixelMm, width: png.width, height: png.height };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** gerbv's own version line, for the skip/diagnostic messages. */
export const gerbvVersion = (): string => execFileSync(GERBV, ['--version'], { encoding: 'utf8' }).split('\n')[0] ?? '';

/** Minimal PNG decoder (8-bit RGB/RGBA, non-interlaced), after the PNG specification (W3C, 2003), §9 filters. */
export function decodePng(data: Buffer): { width: number; height: number; channels: number; pixels: Uint8Array } {
  if (data.readUInt32BE(0) !== 0x89504e47) throw new Error('not a PNG');
  let offset = 8;
  let width = 0;
  let height = 0;
  let channels = 0;
  const idat: Buffer[] = [];
  while (offset < data.length) {
    const length = data.readUInt32BE(offset);
    const type = data.toString('ascii', offset + 4, offset + 8);
    const body = data.subarray(offset + 8, offset + 8 + length);
    if (type === 'IHDR') {
      width = body.readUInt32BE(0);
      height = body.readUInt32BE(4);
      const depth = body[8];
      const colour = body[9];
      const interlace = body[12];
      if (depth !== 8 || (colour !== 2 && colour !== 6) || interlace !== 0) throw new Error(`unsupported PNG: depth ${depth}, colour ${colour}, interlace ${interlace}`);
      channels = colour === 2 ? 3 : 4;
    } else if (type === 'IDAT') idat.push(body);
    else if (type === 'IEND') break;
    offset += 12 + length;
  }
  const raw = inflateSync(Buffer.concat(idat));
  const stride = width * channels;
  const pixels = new Uint8Array(height * stride);
  for (let y = 0; y < height; y++) {
    const filter = raw[y * (stride + 1)]!;
    const line = raw.subarray(y * (stride + 1) + 1, (y + 1) * (stride + 1));
    for (let x = 0; x < stride; x++) {
      const a = x >= channels ? pixels[y * stride + x - channels]! : 0;
      const b = y > 0 ? pixels[(y - 1) * stride + x]! : 0;
      const c = x >= channels && y > 0 ? pixels[(y - 1) * stride + x - channels]! : 0;
      let predictor = 0;
      if (filter === 1) predictor = a;
      else if (filter === 2) predictor = b;
      else if (filter === 3) predictor = (a + b) >> 1;
      else if (filter === 4) {
        const p = a + b - c;
        const pa = Math.abs(p - a);
        const pb = Math.abs(p - b);
        const pc = Math.abs(p - c);
        predictor = pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
      }
      pixels[y * stride + x] = (line[x]! + predictor) & 0xff;
    }
  }
  return { width, height, channels, pixels };
}
