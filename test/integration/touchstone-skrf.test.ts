// Touchstone files read back by an independent parser: scikit-rf's Network reader (Debian
// python3-scikit-rf), which implements the Touchstone File Format Specification (IBIS Open Forum,
// version 2.0, 2009; version 1 syntax). Skips with a printed reason when scikit-rf is absent.
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { designFromText } from '../../src/design.js';
import { repoPresets } from '../helpers/templates.js';
import { abs } from '../../src/math/complex.js';

const root = resolve(import.meta.dirname, '..', '..');
const probe = spawnSync('/usr/bin/python3', ['-c', 'import skrf'], { encoding: 'utf8' });
const hasSkrf = probe.status === 0;
if (!hasSkrf) console.warn('skip: Touchstone read-back needs Debian python3-scikit-rf (installed by .ci/run)');

const presets = repoPresets();

const READER = `
import json, sys, skrf
n = skrf.Network(sys.argv[1])
print(json.dumps({"f": [float(x) for x in n.f], "re": [float(x) for x in n.s[:, 0, 0].real], "im": [float(x) for x in n.s[:, 0, 0].imag], "z0": float(n.z0[0, 0].real)}))
`;

describe.skipIf(!hasSkrf)('Touchstone read back by scikit-rf', () => {
  for (const example of ['receiver-5g8.yaml', 'mixer-10g.yaml']) {
    it(`${example}: frequencies, S11 and reference impedance survive the round trip`, () => {
      const run = designFromText(readFileSync(join(root, 'templates', 'examples', example), 'utf8'), presets, { version: 'test' });
      const art = run.artifacts.find((a) => a.path === 'response.s1p')!;
      const dir = mkdtempSync(join(tmpdir(), 'tunestrip-s1p-'));
      const file = join(dir, 'response.s1p');
      writeFileSync(file, art.text);
      const r = spawnSync('/usr/bin/python3', ['-c', READER, file], { encoding: 'utf8', env: { ...process.env, MPLBACKEND: 'Agg', MPLCONFIGDIR: dir } });
      rmSync(dir, { recursive: true, force: true });
      expect(r.status, r.stderr).toBe(0);
      // scikit-rf may print a plotting-library notice first; the JSON is the last line.
      const back = JSON.parse(r.stdout.trim().split('\n').at(-1)!);
      expect(back.f.length).toBe(run.response.frequencies.length);
      expect(back.z0).toBe(run.spec.target.re);
      run.response.frequencies.forEach((f, i) => {
        expect(back.f[i]).toBeCloseTo(f, 0);
        const g = run.response.physical[i]!;
        expect(Math.abs(back.re[i] - g.re) + Math.abs(back.im[i] - g.im)).toBeLessThan(1e-11);
      });
      // The minimum of the physical response sits at the design frequency (grid spacing).
      const mags = run.response.physical.map(abs);
      const iMin = mags.indexOf(Math.min(...mags));
      const step = run.response.frequencies[1]! - run.response.frequencies[0]!;
      expect(Math.abs(run.response.frequencies[iMin]! - run.spec.frequency)).toBeLessThanOrEqual(step);
    });
  }
});
