// Fit verdicts on whole designs with a known answer: an area exactly 0.1 mm too small for the
// preferred layout fails it by 0.1 mm; 0.1 mm larger fits it unchanged (issue "Artwork that drops
// into a board", done-when). The margin arithmetic itself is checked in test/unit/fit.test.ts.
import { describe, expect, it } from 'vitest';
import { designFromText } from '../../src/design.js';
import { exampleSpecs, repoPresets } from '../helpers/templates.js';

const presets = repoPresets();
// The receiver example without its area and keep-out, to learn the preferred footprint.
const base = exampleSpecs()['receiver-5g8']!.replace(/^area:[\s\S]*?(?=^sweep:)/m, '');
const free = designFromText(base, presets, { version: 'test' });
const b = free.geometry.bounds;
const mm = (m: number) => `${(m * 1e3).toFixed(6)} mm`;
// `grow` on every side, except the x max side, which gets `growXmax` when given.
const withArea = (grow: number, clearance = 0, growXmax = grow) =>
  `${base}area: { x: [${mm(b.xmin - grow)}, ${mm(b.xmax + growXmax)}], y: [${mm(b.ymin - grow)}, ${mm(b.ymax + grow)}] }\nclearance: ${mm(clearance)}\n`;

describe('fit verdicts on designs', () => {
  it('the spec without an area has nothing to fit', () => {
    expect(free.fit.fits).toBe(true);
    expect(free.fit.margin).toBe(Infinity);
  });

  it('0.1 mm of room on every side: the preferred layout fits unchanged, margin +0.1 mm', () => {
    const run = designFromText(withArea(0.1e-3), presets, { version: 'test' });
    expect(run.fit.fits).toBe(true);
    expect(run.fit.changed).toEqual([]);
    expect(run.fit.margin).toBeCloseTo(0.1e-3, 8);
    expect(run.geometry.bounds).toEqual(b);
  });

  it('0.1 mm too short along x: the preferred layout misses by 0.1 mm at the x max edge', () => {
    const run = designFromText(withArea(0.1e-3, 0, -0.1e-3), presets, { version: 'test' });
    const preferred = run.variants[0]!;
    expect(preferred.fit.fits).toBe(false);
    expect(preferred.fit.margin).toBeCloseTo(-0.1e-3, 8);
    expect(preferred.fit.limitedBy).toContain('x max');
    // Whatever the search then picks must really fit, or the design reports no fit.
    if (run.fit.fits) expect(run.fit.changed.length).toBeGreaterThan(0);
    else expect(run.diagnostics.some((d) => d.code === 'fit.no-fit')).toBe(true);
  });

  it('clearance counts: 0.1 mm of room with a 0.15 mm clearance misses by 0.05 mm', () => {
    const run = designFromText(withArea(0.1e-3, 0.15e-3), presets, { version: 'test' });
    expect(run.variants[0]!.fit.margin).toBeCloseTo(-0.05e-3, 8);
  });
});
