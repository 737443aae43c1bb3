// Checks of one laid-out geometry and every artwork file written from it, shared by the seeded
// artwork property test (N = 60) and the full run (N = 500). Each check names its source.
import { createRequire } from 'node:module';
import { circlePolygon, islandArea, pointInRing, polygonArea } from '../../src/geometry/index.js';
import type { Artifact, BoardGeometry, FabRules, Ring } from '../../src/seams.js';
import type { DesignRun } from '../../src/design.js';
import type { LayoutVariant } from '../../src/layoutSearch.js';
import { writeDxf } from '../../src/writers/dxf.js';
import { writeGerberCopper, writeGerberKeepout, writeGerberProfile } from '../../src/writers/gerber.js';
import { writeDrill } from '../../src/writers/drill.js';
import type { ArtworkMeta } from '../../src/writers/units.js';
import { gerberStructureProblems, plotGerber } from './gerberOracle.js';
import { readDxf } from './dxfOracle.js';

// clipper-lib (Angus Johnson's Clipper 6, independent of the clipper2 union we use) is CommonJS
// without types: load it with require (ecosystem.md, traps).
// eslint-disable-next-line @typescript-eslint/no-explicit-any
const ClipperLib = createRequire(import.meta.url)('clipper-lib') as any;

/** 1e-6 mm² in m². */
export const AREA_TOL_M2 = 1e-6 * 1e-6;
/** 1 nm in mm. */
export const NM_IN_MM = 1e-6;

/** Does the ring cross or touch itself? Exact in integer nanometres (common practice, no source). */
export function selfIntersects(ring: Ring): boolean {
  const n = ring.length;
  const P = ring.map(([x, y]) => [BigInt(Math.round(x * 1e9)), BigInt(Math.round(y * 1e9))] as const);
  const orient = (a: readonly bigint[], b: readonly bigint[], c: readonly bigint[]): number => {
    const v = (b[0]! - a[0]!) * (c[1]! - a[1]!) - (b[1]! - a[1]!) * (c[0]! - a[0]!);
    return v > 0n ? 1 : v < 0n ? -1 : 0;
  };
  const onSeg = (a: readonly bigint[], b: readonly bigint[], p: readonly bigint[]): boolean =>
    (p[0]! - a[0]!) * (p[0]! - b[0]!) <= 0n && (p[1]! - a[1]!) * (p[1]! - b[1]!) <= 0n;
  for (let i = 0; i < n; i++)
    for (let j = i + 1; j < n; j++) {
      if (j === i + 1 || (i === 0 && j === n - 1)) continue;
      const [a, b, c, d] = [P[i]!, P[(i + 1) % n]!, P[j]!, P[(j + 1) % n]!];
      const o1 = orient(a, b, c), o2 = orient(a, b, d), o3 = orient(c, d, a), o4 = orient(c, d, b);
      if (o1 !== o2 && o3 !== o4 && o1 !== 0 && o2 !== 0 && o3 !== 0 && o4 !== 0) return true;
      if ((o1 === 0 && onSeg(a, b, c)) || (o2 === 0 && onSeg(a, b, d)) || (o3 === 0 && onSeg(c, d, a)) || (o4 === 0 && onSeg(c, d, b))) return true;
    }
  return false;
}

/** Union area (m²) and polygon count of rings by clipper-lib, at 1 nm. */
export function clipperLibUnion(rings: readonly Ring[]): { count: number; area: number } {
  const scale = 1e9;
  const paths = rings.map((r) => r.map(([x, y]) => ({ X: Math.round(x * scale), Y: Math.round(y * scale) })));
  const c = new ClipperLib.Clipper();
  c.AddPaths(paths, ClipperLib.PolyType.ptSubject, true);
  const out = new ClipperLib.Paths();
  c.Execute(ClipperLib.ClipType.ctUnion, out, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
  const area = out.reduce((s: number, p: unknown) => s + ClipperLib.Clipper.Area(p), 0) / (scale * scale);
  return { count: out.filter((p: unknown) => ClipperLib.Clipper.Area(p) > 0).length, area };
}

/** The artwork files of one geometry, as the pipeline writes them. */
export function artworkOf(g: BoardGeometry, meta: ArtworkMeta): { dxf: Artifact; copper: Artifact; others: Artifact[]; drill: Artifact | null } {
  const others = [writeGerberProfile(g, meta), writeGerberKeepout(g, meta)].filter((a): a is Artifact => a !== null);
  return { dxf: writeDxf(g, meta), copper: writeGerberCopper(g, meta), others, drill: writeDrill(g, meta) };
}

/** Problems of the geometry itself; empty when it passes. */
export function geometryProblems(g: BoardGeometry, fab: FabRules): string[] {
  const out: string[] = [];
  if (g.copper.length !== 1) out.push(`${g.copper.length} copper islands, expected one`);
  for (const island of g.copper) {
    const ring = island.outline;
    if (island.holes.length > 0) out.push(`${island.id} has ${island.holes.length} holes`);
    if (!(polygonArea(ring) > 0)) out.push(`${island.id} outline is not counter-clockwise`);
    if (selfIntersects(ring)) out.push(`${island.id} outline touches or crosses itself`);
    for (let i = 0; i < ring.length; i++) {
      const a = ring[(i + ring.length - 1) % ring.length]!, b = ring[i]!, c = ring[(i + 1) % ring.length]!;
      if ((b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]) === 0) out.push(`${island.id} has a duplicate or collinear vertex ${i}`);
      if (!ring.every(([x, y]) => Math.abs(x * 1e9 - Math.round(x * 1e9)) < 1e-3 && Math.abs(y * 1e9 - Math.round(y * 1e9)) < 1e-3)) {
        out.push(`${island.id} is off the 1 nm grid`);
        break;
      }
    }
  }
  // The union against an independent union of every feature's drawn shape (clipper-lib).
  const shapes = g.features.filter((f) => f.outline && f.outline.length >= 3).map((f) => f.outline!);
  const other = clipperLibUnion(shapes);
  const area = g.copper.reduce((s, c) => s + islandArea(c), 0);
  if (other.count !== g.copper.length) out.push(`clipper-lib finds ${other.count} polygons, we have ${g.copper.length}`);
  // Tolerance: rotated vertices are snapped to 1 nm after the transform, the features' outlines separately.
  const perimeter = g.copper.reduce((s, c) => s + c.outline.reduce((p, a, i) => p + Math.hypot(c.outline[(i + 1) % c.outline.length]![0] - a[0], c.outline[(i + 1) % c.outline.length]![1] - a[1]), 0), 0);
  if (Math.abs(other.area - area) > AREA_TOL_M2 + perimeter * 1e-9) out.push(`area ${area} m² differs from clipper-lib's ${other.area} m²`);
  // Vias inside their pads and on the copper; drills of one row at least pad + min space apart.
  for (const v of g.vias) {
    const pad = circlePolygon([v.x, v.y], v.pad / 2);
    for (let k = 0; k < 16; k++) {
      const a = (k * Math.PI) / 8;
      const p = [v.x + (v.drill / 2) * Math.cos(a), v.y + (v.drill / 2) * Math.sin(a)] as const;
      if (!pointInRing(p, pad) || !g.copper.some((c) => pointInRing(p, c.outline))) {
        out.push(`via at (${v.x}, ${v.y}) is not inside its pad and the copper`);
        break;
      }
    }
  }
  for (let i = 0; i < g.vias.length; i++)
    for (let j = i + 1; j < g.vias.length; j++) {
      const a = g.vias[i]!, b = g.vias[j]!;
      const d = Math.hypot(a.x - b.x, a.y - b.y);
      if (d < fab.viaPad + fab.minSpace - 3e-9) out.push(`vias ${i + 1} and ${j + 1} are ${d} m apart, below pad + min space`);
    }
  return out;
}

/** Problems of the files written from the geometry, read back by independent parsers. */
export async function artworkProblems(g: BoardGeometry, meta: ArtworkMeta): Promise<string[]> {
  const out: string[] = [];
  const files = artworkOf(g, meta);
  const mm2 = (m2: number): number => m2 * 1e6;
  const area = mm2(g.copper.reduce((s, c) => s + islandArea(c), 0));
  const b = { xmin: g.bounds.xmin * 1e3, ymin: g.bounds.ymin * 1e3, xmax: g.bounds.xmax * 1e3, ymax: g.bounds.ymax * 1e3 };

  // Gerber layer 1 (Ucamco, Gerber Layer Format Specification 2023.08; see gerberOracle.ts).
  for (const f of [files.copper, ...files.others]) for (const p of gerberStructureProblems(f.text)) out.push(`${f.path}: ${p}`);
  // Gerber layer 2: gerber-parser + gerber-plotter warnings, image box and region area.
  const plot = await plotGerber(files.copper.text);
  out.push(...plot.warnings.map((w) => `${files.copper.path}: ${w}`));
  const [x0, y0, x1, y1] = plot.box;
  if (Math.max(Math.abs(x0 - b.xmin), Math.abs(y0 - b.ymin), Math.abs(x1 - b.xmax), Math.abs(y1 - b.ymax)) > NM_IN_MM + 1e-9)
    out.push(`${files.copper.path}: plotted box [${plot.box.join(', ')}] is not the copper bounds [${b.xmin}, ${b.ymin}, ${b.xmax}, ${b.ymax}]`);
  if (Math.abs(plot.fillArea - area) > 1e-6) out.push(`${files.copper.path}: plotted region area ${plot.fillArea} mm², copper ${area} mm²`);
  if (plot.pads.length !== g.vias.length) out.push(`${files.copper.path}: ${plot.pads.length} pad flashes for ${g.vias.length} vias`);
  for (const f of files.others) out.push(...(await plotGerber(f.text)).warnings.map((w) => `${f.path}: ${w}`));
  if (files.drill) {
    const drill = await plotGerber(files.drill.text, 'drill');
    out.push(...drill.warnings.map((w) => `${files.drill!.path}: ${w}`));
    if (drill.pads.length !== g.vias.length) out.push(`${files.drill.path}: ${drill.pads.length} holes for ${g.vias.length} vias`);
    drill.pads.forEach((p, i) => {
      const v = g.vias[i];
      if (v && Math.hypot(p.x - v.x * 1e3, p.y - v.y * 1e3) > 2 * NM_IN_MM) out.push(`${files.drill!.path}: hole ${i + 1} at (${p.x}, ${p.y}) mm, via at (${v.x * 1e3}, ${v.y * 1e3}) mm`);
    });
  }

  // DXF through dxf-parser: finite, closed rings of ≥ 3 vertices, mm units (see dxfOracle.ts).
  const back = readDxf(files.dxf.text);
  out.push(...back.problems.map((p) => `layout.dxf: ${p}`));
  if (Math.abs(back.copperArea - area) > 1e-6) out.push(`layout.dxf: copper area ${back.copperArea} mm², geometry ${area} mm²`);
  const copperVertices = back.dxf.entities.filter((e) => e.layer === 'COPPER_TOP').flatMap((e) => e.vertices ?? []);
  const vx = copperVertices.map((v) => v.x);
  const vy = copperVertices.map((v) => v.y);
  if (Math.max(Math.abs(Math.min(...vx) - b.xmin), Math.abs(Math.min(...vy) - b.ymin), Math.abs(Math.max(...vx) - b.xmax), Math.abs(Math.max(...vy) - b.ymax)) > NM_IN_MM + 1e-9)
    out.push('layout.dxf: copper vertex box is not the copper bounds');
  // Only LWPOLYLINE and TEXT entities (the rule for files that import at the right scale).
  const kinds = new Set(back.dxf.entities.map((e) => e.type));
  for (const k of kinds) if (k !== 'LWPOLYLINE' && k !== 'TEXT') out.push(`layout.dxf: ${k} entity`);
  const layers = Object.keys(back.dxf.tables.layer?.layers ?? {});
  for (const l of ['COPPER_TOP', 'DRILL', 'PORTS', 'DIMENSIONS', ...(g.area ? ['AREA'] : []), ...(g.keepouts.length > 0 ? ['KEEPOUT'] : [])])
    if (!layers.includes(l)) out.push(`layout.dxf: layer ${l} missing`);
  return out;
}

/** The chosen layout and the first variant of each other fold the search built. */
export function geometriesToCheck(run: DesignRun): LayoutVariant[] {
  const chosen = run.variants.find((v) => v.geometry === run.geometry);
  const seen = new Set(chosen ? [chosen.fold] : []);
  const out = chosen ? [chosen] : [];
  for (const v of run.variants) {
    if (seen.has(v.fold)) continue;
    seen.add(v.fold);
    out.push(v);
  }
  return out;
}
