// The repository's templates as the CLI reads them: preset name → YAML text, per folder.
import { readFileSync, readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { Presets } from '../../src/spec/index.js';

export const repoRoot = resolve(import.meta.dirname, '..', '..');

/** Every `.yaml` file in a folder of the repository, keyed by its name without the extension, sorted. */
export const yamlFiles = (dir: string): Record<string, string> =>
  Object.fromEntries(
    readdirSync(join(repoRoot, dir))
      .filter((f) => f.endsWith('.yaml'))
      .sort()
      .map((f) => [f.replace(/\.yaml$/, ''), readFileSync(join(repoRoot, dir, f), 'utf8')]),
  );

export const repoPresets = (): Presets => ({ substrates: yamlFiles('templates/substrates'), fab: yamlFiles('templates/fab') });

/** The bundled example specs: name → text. */
export const exampleSpecs = (): Record<string, string> => yamlFiles('templates/examples');
