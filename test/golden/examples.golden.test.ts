// Golden files of every artifact of each example spec (templates/examples/*.yaml through
// designFromText), byte for byte: artwork, design.json, report.md and Touchstone, so the whole
// output is pinned. Regenerate after an intended change with UPDATE_GOLDEN=1.
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { designFromText } from '../../src/design.js';
import { PRESETS } from '../helpers/randomSpecs.js';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '..', '..');
const update = process.env.UPDATE_GOLDEN === '1';
/** A fixed version string, so a release does not change the goldens. */
const VERSION = '0.0.0-golden';

const examples = readdirSync(join(root, 'templates', 'examples')).filter((n) => n.endsWith('.yaml')).sort();

describe.each(examples)('golden example %s', (file) => {
  const text = readFileSync(join(root, 'templates', 'examples', file), 'utf8');
  const run = designFromText(text, PRESETS, { version: VERSION }, file);
  const dir = join(here, 'examples', file.replace(/\.yaml$/, ''));
  if (update) {
    rmSync(dir, { recursive: true, force: true });
    mkdirSync(dir, { recursive: true });
    for (const a of run.artifacts) writeFileSync(join(dir, a.path), a.text);
  }

  it('writes exactly the files pinned for it', () => {
    expect(existsSync(dir), `${dir} missing: run with UPDATE_GOLDEN=1`).toBe(true);
    expect(run.artifacts.map((a) => a.path).sort()).toEqual(readdirSync(dir).sort());
  });
  it.each(run.artifacts.map((a) => [a.path, a] as const))('%s is byte-identical', (_path, a) => {
    const pinned = join(dir, a.path);
    expect(existsSync(pinned), `${pinned} missing: run with UPDATE_GOLDEN=1`).toBe(true);
    expect(a.text).toBe(readFileSync(pinned, 'utf8'));
  });
  it('is the same text on a second run (byte-stable)', () => {
    const again = designFromText(text, PRESETS, { version: VERSION }, file);
    expect(again.artifacts).toEqual(run.artifacts);
  });
});
