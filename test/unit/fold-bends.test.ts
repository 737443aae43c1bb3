// A folded stub is drawn longer by what its mitred bends take (mitredBendLength, fitted to the
// full-wave bends of scripts/fullwave/junctions.json), so the physical network sees the same
// electrical stub as the straight design it came from and the match at f0 holds. Specs are the
// full-wave check's own fold scenarios (scripts/fullwave/specs), our own.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { designFromText } from '../../src/design.js';
import { mitredBendLength } from '../../src/physical/discontinuities/index.js';
import { MODEL_NAMES } from '../../src/physical/realize.js';
import { repoPresets, repoRoot } from '../helpers/templates.js';

const presets = repoPresets();
const specText = (name: string): string => readFileSync(join(repoRoot, 'scripts', 'fullwave', 'specs', `${name}.yaml`), 'utf8');
/** The same spec with no area: the straight design the fold starts from. */
const unconstrained = (text: string): string => text.replace(/^area:\n(?: {2}.*\n)+/m, '');
const run = (text: string, label: string) => designFromText(text, presets, { version: 'test' }, label);

describe.each([
  ['fw-2g0-ptfe-open-fold-l', 'L-source', 1],
  ['fw-1g2-fr4-open-fold-l', 'L-load', 1],
  ['fw-2g4-hc-short-fold-l', 'L-source', 1],
  ['fw-2g2-er3-open-fold-u', 'U-source', 2],
] as const)('%s', (name, fold, count) => {
  const folded = run(specText(name), name);
  const straight = run(unconstrained(specText(name)), `${name} without area`);
  const stubOf = (r: typeof folded) => r.physical.sections.find((s) => s.role === 'stub')!;

  it(`folds as ${fold} with ${count} bend(s), the straight design without the area`, () => {
    expect(folded.fold).toBe(fold);
    expect(straight.fold).toBe('straight');
    expect(folded.physical.copper.bends?.count).toBe(count);
    expect(straight.physical.copper.bends).toBeUndefined();
  });

  it('draws the stub longer by what the bends take, and records it as a correction', () => {
    const w = folded.physical.copper.stubWidth;
    const each = mitredBendLength(w, folded.spec.substrate.height);
    expect(each).toBeLessThan(0);
    expect(folded.physical.copper.bends!.lengthEach).toBe(each);
    expect(folded.physical.copper.stubLength - straight.physical.copper.stubLength).toBeCloseTo(-count * each, 12);
    const correction = stubOf(folded).corrections.find((c) => c.model === MODEL_NAMES.bend);
    expect(correction?.delta).toBeCloseTo(-count * each, 12);
    expect(stubOf(folded).length).toBe(folded.physical.copper.stubLength);
  });

  it('keeps the match: the physical model still meets −50 dB at f0, as the straight design', () => {
    expect(folded.physical.s11DbAtF0).toBeLessThanOrEqual(-50);
    expect(folded.response.s11DbAtF0).toBeLessThanOrEqual(-50);
  });

  it('records the bends in design.json', () => {
    const record = JSON.parse(folded.artifacts.find((a) => a.path === 'design.json')!.text) as { layout: { fold: string; bends?: { count: number; length_each_m: number } } };
    expect(record.layout.bends).toEqual({ count, length_each_m: folded.physical.copper.bends!.lengthEach });
  });
});
