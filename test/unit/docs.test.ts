// The README's worked example is the bundled example as tunestrip designs it today: the committed
// SVG and the quoted summary must match a fresh run (regenerate with `npm run docs`).
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { designFromText } from '../../src/design.js';
import { designSummary } from '../../src/cli/print.js';
import { exampleSpecs, repoPresets, repoRoot } from '../helpers/templates.js';
import pkg from '../../package.json' with { type: 'json' };
import { BEND_LENGTH_FIT } from '../../src/physical/discontinuities/index.js';

describe('README worked example', () => {
  const run = designFromText(exampleSpecs()['receiver-5g8']!, repoPresets(), { version: pkg.version });
  const readme = readFileSync(join(repoRoot, 'README.md'), 'utf8');

  it('shows the SVG the example produces', () => {
    const svg = run.artifacts.find((a) => a.path === 'layout.svg')!.text;
    expect(readFileSync(join(repoRoot, 'docs', 'receiver-5g8-layout.svg'), 'utf8'), 'docs/receiver-5g8-layout.svg is stale: npm run docs').toBe(svg);
  });

  it('quotes the summary the example prints', () => {
    const summary = designSummary(run, run.artifacts.map((a) => a.path), 'out/receiver-5g8');
    for (const line of summary.trimEnd().split('\n')) expect(readme, 'README summary is stale: npm run docs').toContain(line);
  });
});

describe('README worked example prose', () => {
  const run = designFromText(exampleSpecs()['receiver-5g8']!, repoPresets(), { version: pkg.version });
  const readme = readFileSync(join(repoRoot, 'README.md'), 'utf8');

  it('quotes the corrections the example makes (each figure in mm is one of its corrections, or the stub total)', () => {
    const start = readme.indexOf('Of the four ideal branches');
    const paragraph = readme.slice(start, readme.indexOf('![receiver-5g8 layout', start));
    const quoted = [...paragraph.matchAll(/([0-9]+\.[0-9]+) mm/g)].map((m) => Number(m[1]));
    expect(quoted.length).toBeGreaterThanOrEqual(5);
    const stub = run.physical.sections.find((s) => s.role === 'stub')!;
    const known = [
      ...run.physical.sections.flatMap((s) => s.corrections.map((c) => Math.abs(c.delta) * 1e3)),
      Math.abs(stub.length - stub.idealLength) * 1e3,
    ];
    for (const q of quoted) expect(known.some((k) => Math.abs(k - q) < 0.0006), `README quotes ${q} mm; the example's corrections are ${known.map((k) => k.toFixed(3)).join(', ')}`).toBe(true);
  });
});

describe('README model figures', () => {
  const readme = readFileSync(join(repoRoot, 'README.md'), 'utf8');
  it('quotes the mitred-bend length fit in src, to three digits', () => {
    const quoted = /Δl = −([0-9.]+)·w − ([0-9.]+)·h per bend/.exec(readme);
    expect(quoted, 'README no longer quotes the bend fit').not.toBeNull();
    expect(-Number(quoted![1])).toBeCloseTo(BEND_LENGTH_FIT.perWidth, 3);
    expect(-Number(quoted![2])).toBeCloseTo(BEND_LENGTH_FIT.perHeight, 3);
  });
});
