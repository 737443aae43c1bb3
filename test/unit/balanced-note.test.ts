// Balanced stubs on a high-permittivity substrate carry a note: the cross model rests mostly on
// crosses with εr ≤ 4.4 (scripts/fullwave/junctions.json), and the one full-wave balanced design on
// εr 10.2 (scripts/fullwave/results.json, fw-6g0-er10-balanced) landed 1.6 % low (ninth round of the full-wave check).
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { designFromText } from '../../src/design.js';
import { repoPresets, repoRoot } from '../helpers/templates.js';

const presets = repoPresets();
const spec = (name: string): string => readFileSync(join(repoRoot, 'scripts', 'fullwave', 'specs', `${name}.yaml`), 'utf8');
const crossNotes = (name: string) =>
  designFromText(spec(name), presets, { version: 'test' }, name).diagnostics.filter((d) => d.where === 'style' && d.message.includes('cross model'));

describe('balanced stubs above εr 4.5', () => {
  it('get the note on εr 10.2', () => {
    expect(crossNotes('fw-6g0-er10-balanced')).toHaveLength(1);
  });
  it('do not on εr 3.48 or 4.4', () => {
    expect(crossNotes('fw-3g0-balanced-er348')).toHaveLength(0);
    expect(crossNotes('fw-2g4-balanced')).toHaveLength(0);
  });
  it('the full-wave record behind the note says what the note says', () => {
    const results = JSON.parse(readFileSync(join(repoRoot, 'scripts', 'fullwave', 'results.json'), 'utf8')) as { designs: { name: string; offset_percent: number }[] };
    const er10 = results.designs.find((d) => d.name === 'fw-6g0-er10-balanced')!;
    const [note] = crossNotes('fw-6g0-er10-balanced');
    const stated = /landed ([0-9.]+) % low/.exec(note!.message);
    expect(stated, note!.message).not.toBeNull();
    expect(-Number(stated![1])).toBeCloseTo(er10.offset_percent, 1);
  });
});
