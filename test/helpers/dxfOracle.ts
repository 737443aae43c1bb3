// DXF oracle: read the file back with dxf-parser (npm) and check what neither dxf-parser nor
// ezdxf's audit checks by itself (ecosystem.md: both pass NaN vertices and one-vertex polylines);
// then ezdxf's audit (Debian python3-ezdxf) through scripts/fixtures/ezdxf_audit.py.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import M from 'dxf-parser';

// dxf-parser under ESM (ecosystem.md, traps).
const DxfParser = ((M as unknown as { default?: unknown }).default ?? M) as new () => { parseSync(text: string): ParsedDxf };

interface Vertex {
  readonly x: number;
  readonly y: number;
}
export interface ParsedEntity {
  readonly type: string;
  readonly layer: string;
  readonly vertices?: readonly Vertex[];
  readonly shape?: boolean;
  readonly center?: Vertex;
  readonly radius?: number;
  readonly text?: string;
}
export interface ParsedDxf {
  readonly header: Record<string, unknown>;
  readonly entities: readonly ParsedEntity[];
  readonly tables: { readonly layer?: { readonly layers: Record<string, unknown> } };
}

export interface DxfReadBack {
  readonly dxf: ParsedDxf;
  readonly problems: string[];
  /** Signed-area sum of the closed copper polylines (mm²): outlines CCW (+), holes CW (−). */
  readonly copperArea: number;
}

function nonFinite(value: unknown, path: string, out: string[]): void {
  if (typeof value === 'number' && !Number.isFinite(value)) out.push(`non-finite number at ${path}`);
  else if (Array.isArray(value)) value.forEach((v, i) => nonFinite(v, `${path}[${i}]`, out));
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) nonFinite(v, `${path}.${k}`, out);
}

const signedArea = (vs: readonly Vertex[]): number => {
  let s = 0;
  for (let i = 0; i < vs.length; i++) {
    const a = vs[i]!;
    const b = vs[(i + 1) % vs.length]!;
    s += a.x * b.y - b.x * a.y;
  }
  return s / 2;
};

/** Layers whose polylines are outlines (closed rings); PORTS and NOTES may hold open lines. */
const RING_LAYERS = new Set(['COPPER_TOP', 'DRILL', 'AREA', 'KEEPOUT']);

export function readDxf(text: string): DxfReadBack {
  const problems: string[] = [];
  // Text-level check: the parser turns "nan" into NaN silently, so look at the text too (common practice, no source).
  if (/\bnan\b|NaN|Infinity|undefined/i.test(text)) problems.push('text contains NaN/Infinity/undefined');
  const dxf = new DxfParser().parseSync(text);
  nonFinite(dxf.entities, 'entities', problems);
  nonFinite(dxf.header, 'header', problems);
  // Autodesk DXF Reference, HEADER: $INSUNITS 4 = millimetres; $MEASUREMENT 1 = metric.
  if (dxf.header['$INSUNITS'] !== 4) problems.push(`$INSUNITS is ${String(dxf.header['$INSUNITS'])}, expected 4 (mm)`);
  if (dxf.header['$MEASUREMENT'] !== 1) problems.push(`$MEASUREMENT is ${String(dxf.header['$MEASUREMENT'])}, expected 1 (metric)`);
  if (dxf.header['$ACADVER'] !== 'AC1015') problems.push(`$ACADVER is ${String(dxf.header['$ACADVER'])}, expected AC1015 (R2000)`);
  const layers = new Set(Object.keys(dxf.tables.layer?.layers ?? {}));
  let copperArea = 0;
  for (const e of dxf.entities) {
    // Every entity sits on a layer the LAYER table defines (physics.md §8.5 [M], common practice).
    if (!layers.has(e.layer)) problems.push(`${e.type} on undefined layer ${e.layer}`);
    if (e.type === 'LWPOLYLINE' && RING_LAYERS.has(e.layer)) {
      const vs = e.vertices ?? [];
      // Autodesk DXF Reference, LWPOLYLINE: group 70 bit 1 = closed; a ring needs ≥ 3 vertices.
      if (!e.shape) problems.push(`open LWPOLYLINE on ${e.layer}`);
      if (vs.length < 3) problems.push(`LWPOLYLINE with ${vs.length} vertices on ${e.layer}`);
      if (e.layer === 'COPPER_TOP') copperArea += signedArea(vs);
    }
    if (e.type === 'POLYLINE') problems.push('old-style POLYLINE in an R2000 file (LWPOLYLINE expected)');
  }
  return { dxf, problems, copperArea };
}

// ─────────────────────────── ezdxf audit ───────────────────────────

export const PYTHON = '/usr/bin/python3';
const AUDIT_SCRIPT = fileURLToPath(new URL('../../scripts/fixtures/ezdxf_audit.py', import.meta.url));

/** Why the ezdxf check cannot run here, or null when it can. */
export function ezdxfMissing(): string | null {
  if (!existsSync(PYTHON)) return `${PYTHON} not found`;
  const probe = spawnSync(PYTHON, ['-c', 'import ezdxf; print(ezdxf.__version__)'], { encoding: 'utf8' });
  return probe.status === 0 ? null : 'python3-ezdxf is not installed (apt-get install -y python3-ezdxf)';
}

export interface EzdxfAudit {
  readonly ezdxf: string;
  readonly dxfversion: string;
  readonly insunits: number;
  readonly measurement: number;
  readonly errors: string[];
  readonly fixes: string[];
  readonly loadWarnings: string[];
  readonly layers: string[];
  readonly entities: Record<string, number>;
  readonly closedPolylines: number;
}

/** Audit several DXF texts in one Python process (ezdxf's import dominates the run time). */
export function auditWithEzdxf(texts: readonly string[]): EzdxfAudit[] {
  const dir = mkdtempSync(join(tmpdir(), 'tunestrip-ezdxf-'));
  try {
    const files = texts.map((text, i) => {
      const file = join(dir, `layout-${i}.dxf`);
      writeFileSync(file, text);
      return file;
    });
    const run = spawnSync(PYTHON, [AUDIT_SCRIPT, ...files], { encoding: 'utf8' });
    if (run.status !== 0) throw new Error(`ezdxf_audit.py failed: ${run.stderr}`);
    return run.stdout
      .split('\n')
      .filter((l) => l.trim().length > 0)
      .map((l) => JSON.parse(l) as EzdxfAudit);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
