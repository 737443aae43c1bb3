// The via-near-junction warning fires only where the full-wave checks give no evidence: closer to
// the junction than any via of a recorded full-wave design (scripts/fullwave/results.json, openEMS
// FDTD runs of tunestrip's own artwork). Between that distance and 0.15 λ the recorded designs meet
// the project issue's acceptance (all but one folded design with finely meshed edges, below), so a
// warning there would be a false alarm.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { designFromText } from '../../src/design.js';
import { VIA_CHECKED_CLEARANCE_WL } from '../../src/physical/realize.js';
import { repoPresets, repoRoot } from '../helpers/templates.js';
import { OUTSIDE_ACCEPTANCE, runLabel } from '../helpers/fullwaveMisses.js';

const presets = repoPresets();
const specText = (name: string): string => readFileSync(join(repoRoot, 'scripts', 'fullwave', 'specs', `${name}.yaml`), 'utf8');
const warnings = (text: string, label: string) =>
  designFromText(text, presets, { version: 'test' }, label).diagnostics.filter((d) => d.code === 'design.via-near-junction');

interface Recorded {
  readonly name: string;
  readonly spec: string;
  readonly termination: string;
  readonly copper_model: string;
  readonly offset_percent: number;
  readonly s11_db_at_f0: number;
}
interface Line {
  readonly role: string;
  readonly length_m: number;
  readonly wavelength_m: number;
}

/** Via distance from the line, in stub wavelengths, and via count, of the copper tunestrip draws today for a recorded spec. */
function viaOf(specPath: string): { wl: number; vias: number } {
  const run = designFromText(readFileSync(join(repoRoot, specPath), 'utf8'), presets, { version: 'test' }, specPath);
  const record = JSON.parse(run.artifacts.find((a) => a.path === 'design.json')!.text) as { lines: Line[]; vias: unknown[] };
  const stub = record.lines.find((l) => l.role === 'stub')!;
  return { wl: stub.length_m / stub.wavelength_m, vias: record.vias.length };
}

describe('via-near-junction warning', () => {
  const results = JSON.parse(readFileSync(join(repoRoot, 'scripts', 'fullwave', 'results.json'), 'utf8')) as { designs: Recorded[] };
  const shortStubs = results.designs.filter((d) => d.termination === 'short');
  const distances = shortStubs.map((d) => ({ ...d, ...viaOf(d.spec) }));

  it('sits just below the closest via the full-wave checks cover', () => {
    expect(shortStubs.length).toBeGreaterThanOrEqual(8);
    const closest = Math.min(...distances.map((d) => d.wl));
    expect(closest).toBeGreaterThanOrEqual(VIA_CHECKED_CLEARANCE_WL);
    expect(closest - VIA_CHECKED_CLEARANCE_WL).toBeLessThan(0.01);
  });

  // Single vias only: the one recorded row design this close, mixer-10g (two vias at 10 GHz, 0.137 λ),
  // lands +2.28 %, outside the acceptance and listed as such in fullwave-results.test.ts.
  // Runs with the copper's edges meshed finely (copper model "… edge lines …", fifteenth to
  // eighteenth rounds in scripts/fullwave/README.md) are held to the same bound, except the known
  // misses listed in test/helpers/fullwaveMisses.ts: the folded fw-1g5-fr4-short-fold-l (via 0.11 λ
  // out) lands −2.19 % there (−1.46 % at the recorded setting). Straight short stubs with vias nearer
  // (fw-1g9-fr4-short, 0.07 λ) meet it with fine edges, so the miss is not read as the via's
  // distance. Runs at the recorded setting, the evidence for the threshold, get no exemption.
  it('every recorded single-via short-stub design within 0.15 λ meets the acceptance (±2 %, ≤ −15 dB)', () => {
    const near = distances.filter((d) => d.wl < 0.15 && d.vias === 1);
    expect(near.length).toBeGreaterThanOrEqual(5);
    const listed = near.filter((d) => OUTSIDE_ACCEPTANCE[runLabel(d)] !== undefined);
    expect(listed.map((d) => d.name)).toEqual(['fw-1g5-fr4-short-fold-l']);
    for (const d of listed) expect(d.copper_model, d.name).toContain('edge lines');
    for (const d of listed) expect(Math.abs(d.offset_percent), d.name).toBeGreaterThan(2);
    for (const d of near.filter((r) => !listed.includes(r))) {
      expect(Math.abs(d.offset_percent), `${d.name}, ${d.copper_model}`).toBeLessThanOrEqual(2);
      expect(d.s11_db_at_f0, `${d.name}, ${d.copper_model}`).toBeLessThanOrEqual(-15);
    }
  });

  it('is not given for the closest recorded via (fw-1g9-fr4-short)', () => {
    expect(warnings(specText('fw-1g9-fr4-short'), 'closest')).toHaveLength(0);
  });

  it('is given, with the distance in wavelengths, for a via closer than that', () => {
    // 8+j3 Ω needs a shorter short stub (our own variation of the same spec).
    const text = specText('fw-3g5-short-via-close').replace(/^load: .*$/m, 'load: 8+j3');
    const found = warnings(text, 'closer');
    expect(found).toHaveLength(1);
    const stated = /\(([0-9.]+) λ\) from the line/.exec(found[0]!.message);
    expect(stated, found[0]!.message).not.toBeNull();
    expect(Number(stated![1])).toBeLessThan(VIA_CHECKED_CLEARANCE_WL);
  });
});
