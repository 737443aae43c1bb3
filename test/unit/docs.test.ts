// The README's worked example is the bundled example as tunestrip designs it today: the committed
// SVG and the quoted summary must match a fresh run (regenerate with `npm run docs`).
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { designFromText } from '../../src/design.js';
import { designSummary } from '../../src/cli/print.js';
import { exampleSpecs, repoPresets, repoRoot } from '../helpers/templates.js';
import pkg from '../../package.json' with { type: 'json' };

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
