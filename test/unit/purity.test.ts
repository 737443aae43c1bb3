// The core does no I/O: only src/cli/ may touch files, the process, the clock or randomness
// (design rule of this project, docs in DEVELOPERS.md). This test reads the sources as text.
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';

const root = join(import.meta.dirname, '..', '..', 'src');

function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return name === 'cli' && dir === root ? [] : sources(path);
    return path.endsWith('.ts') ? [path] : [];
  });
}

const FORBIDDEN: [RegExp, string][] = [
  [/from ['"]node:(fs|child_process|net|http|https|os)['"]/, 'a node I/O module'],
  [/from ['"](fs|child_process|path|os)['"]/, 'a node I/O module'],
  [/\bprocess\.(env|argv|exit|stdout|stderr|cwd)/, 'the process'],
  [/\bDate\.now\(|new Date\(/, 'the clock'],
  [/\bMath\.random\(/, 'randomness'],
  [/\bconsole\./, 'the console'],
];

describe('core purity', () => {
  const files = sources(root);
  it('finds the core sources', () => {
    expect(files.length).toBeGreaterThan(20);
  });
  for (const file of files) {
    it(`${relative(root, file)} does no I/O`, () => {
      const text = readFileSync(file, 'utf8');
      for (const [pattern, what] of FORBIDDEN) {
        expect(pattern.test(text), `${relative(root, file)} uses ${what}`).toBe(false);
      }
    });
  }
});
