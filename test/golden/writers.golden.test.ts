// Golden files: every writer's output for the three fixed layouts, byte for byte.
// Regenerate after an intended change with UPDATE_GOLDEN=1 (the test then writes the files).
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { FIXTURES } from './fixtures.js';
import { writeDxf } from '../../src/writers/dxf.js';
import { writeSvg } from '../../src/writers/svg.js';
import { writeGerberCopper, writeGerberKeepout, writeGerberProfile } from '../../src/writers/gerber.js';
import { writeDrill } from '../../src/writers/drill.js';
import type { Artifact, BoardGeometry } from '../../src/seams.js';
import type { ArtworkMeta } from '../../src/writers/units.js';

const here = dirname(fileURLToPath(import.meta.url));
const update = process.env.UPDATE_GOLDEN === '1';

const WRITERS: readonly [string, (g: BoardGeometry, m: ArtworkMeta) => Artifact | null][] = [
  ['dxf', writeDxf],
  ['svg', writeSvg],
  ['gerber-copper', writeGerberCopper],
  ['gerber-profile', writeGerberProfile],
  ['gerber-keepout', writeGerberKeepout],
  ['drill', writeDrill],
];

describe.each(FIXTURES)('golden: $name', (f) => {
  it.each(WRITERS)('%s', (kind, write) => {
    const art = write(f.geometry, f.meta);
    if (art === null) {
      // Only the drill (no vias), the profile (no area) and the keep-out layer (no keep-outs) may be absent.
      const allowed =
        (kind === 'drill' && f.geometry.vias.length === 0) ||
        (kind === 'gerber-profile' && !f.geometry.area) ||
        (kind === 'gerber-keepout' && f.geometry.keepouts.length === 0);
      return expect(allowed).toBe(true);
    }
    const file = join(here, f.name, art.path);
    if (update) {
      mkdirSync(dirname(file), { recursive: true });
      writeFileSync(file, art.text);
    }
    expect(existsSync(file), `${file} missing: run with UPDATE_GOLDEN=1`).toBe(true);
    expect(art.text).toBe(readFileSync(file, 'utf8'));
  });
});
