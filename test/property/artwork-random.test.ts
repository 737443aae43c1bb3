// Seeded random specs (test/helpers/randomSpecs.ts: 0.5–20 GHz, loads, substrates, fab rules,
// styles, terminations, sides, placements, areas and keep-outs) through designFromText. For each
// design, the chosen geometry and the first variant of every fold the search built are checked:
// one island, no self-intersection, vias inside pads, area equal to an independent clipper-lib
// union; and every artwork file read back: the structural Gerber checks and gerber-parser/plotter
// (no warnings, bounding box within 1 nm of the copper bounds, region area within 1e-6 mm²), the
// drill file's holes, and the DXF through dxf-parser (finite, closed rings of ≥ 3 vertices, copper
// area within 1e-6 mm², LWPOLYLINE and TEXT only). The 500-spec run with gerbv and ezdxf is
// test/integration/artwork-500.test.ts.
import { describe, expect, it } from 'vitest';
import { designFromText, type DesignRun } from '../../src/design.js';
import { TunestripError } from '../../src/diagnostics.js';
import { artworkMeta } from '../../src/writers/index.js';
import { PRESETS, randomSpecs } from '../helpers/randomSpecs.js';
import { artworkProblems, geometriesToCheck, geometryProblems } from '../helpers/artworkChecks.js';

const N = 60;
const SEED = 20261202;

describe(`artwork of ${N} seeded random specs (seed ${SEED})`, () => {
  const specs = randomSpecs(SEED, N);
  const designed: DesignRun[] = [];
  const folds = new Map<string, number>();

  it.each(specs.map((s) => [s.index, s] as const))('spec %i: geometry and every file pass', async (_i, s) => {
    let run: DesignRun;
    try {
      run = designFromText(s.text, PRESETS, { version: 'prop' });
    } catch (e) {
      // A random request may have no buildable branch for its termination, or lines too wide for a
      // lumped junction at its frequency: a reported error, not a crash.
      expect(e).toBeInstanceOf(TunestripError);
      expect(['solve.no-passive-solution', 'design.out-of-model']).toContain((e as TunestripError).diagnostic.code);
      return;
    }
    designed.push(run);
    const meta = artworkMeta({ ...run, version: 'prop' });
    for (const v of geometriesToCheck(run)) {
      folds.set(v.fold, (folds.get(v.fold) ?? 0) + 1);
      const where = `${s.text}\nfold ${v.fold}, ${v.style}, ${v.physical.solution.termination}`;
      expect(geometryProblems(v.geometry, run.spec.fab), where).toEqual([]);
      expect(await artworkProblems(v.geometry, meta), where).toEqual([]);
    }
    // The chosen geometry's ports carry the placement: the load port sits at place (x, y).
    const load = run.geometry.ports.find((p) => p.role === 'load')!;
    expect(Math.hypot(load.x - run.spec.place.x, load.y - run.spec.place.y)).toBeLessThanOrEqual(1e-9);
  });

  it('most specs design, and folded L and U variants were among the checked layouts', () => {
    // So the property cannot pass by checking nothing.
    expect(designed.length).toBeGreaterThanOrEqual(0.8 * N);
    expect([...folds.keys()].some((k) => k.startsWith('L-'))).toBe(true);
    expect([...folds.keys()].some((k) => k.startsWith('U-'))).toBe(true);
  });
});
