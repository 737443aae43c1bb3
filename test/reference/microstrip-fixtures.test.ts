// Grid comparisons with two external implementations, committed as fixtures with their scripts:
//  - test/fixtures/skrf-microstrip.json: scikit-rf (Debian python3-scikit-rf, version recorded in the
//    file), made by scripts/fixtures/skrf_microstrip.py; t = 0 only, static Z0, static εe, KJ εe(f).
//  - test/fixtures/independent-microstrip.json: an independent plain-Python implementation written from
//    the papers (HJ 1980, KJ 1982, JK 1983, Hammerstad–Bekkadal loss), made by
//    scripts/fixtures/independent_microstrip.py; t = 0 and 35 µm.
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analyseMicrostrip } from '../../src/physical/microstrip/index.js';

interface Case {
  readonly width: number; readonly height: number; readonly copper: number; readonly er: number; readonly frequency: number;
  readonly tanDelta?: number; readonly conductivity?: number; readonly roughness?: number;
  readonly z0Static: number; readonly epsEffStatic: number; readonly epsEff: number;
  readonly z0?: number; readonly alphaConductor?: number; readonly alphaDielectric?: number;
}
interface Fixture { readonly generator: string; readonly command: string; readonly cases: readonly Case[] }

const load = (name: string): Fixture =>
  JSON.parse(readFileSync(new URL(`../fixtures/${name}`, import.meta.url), 'utf8')) as Fixture;
const rel = (a: number, b: number): number => Math.abs(a / b - 1);
const analyseCase = (c: Case) =>
  analyseMicrostrip(c.width, {
    er: c.er, height: c.height, copper: c.copper, tanDelta: c.tanDelta ?? 0,
    roughness: c.roughness ?? 0, conductivity: c.conductivity ?? 5.8e7,
  }, c.frequency);

describe('scikit-rf MLine fixture (t = 0)', () => {
  const fx = load('skrf-microstrip.json');
  it('records the library version and the command', () => {
    expect(fx.generator).toMatch(/scikit-rf \d+\.\d+/);
    expect(fx.command).toMatch(/skrf_microstrip\.py/);
    expect(fx.cases.length).toBeGreaterThan(100);
  });
  it('static Z0, static εe (HJ 1980) and εe(f) (KJ 1982) within 0.2 %', () => {
    // scikit-rf skrf/media/mline.py, MLine.Z0, .ep_reff, .ep_reff_f with disp='kirschningjansen'.
    let worst = 0;
    for (const c of fx.cases) {
      const line = analyseCase(c);
      worst = Math.max(worst, rel(line.z0Static, c.z0Static), rel(line.epsEffStatic, c.epsEffStatic), rel(line.epsEff, c.epsEff));
    }
    expect(worst).toBeLessThan(0.002);
  });
});

describe('independent Python implementation fixture (t = 0 and 35 µm)', () => {
  const fx = load('independent-microstrip.json');
  it('covers both thicknesses', () => {
    expect(fx.cases.some((c) => c.copper === 0)).toBe(true);
    expect(fx.cases.some((c) => c.copper === 35e-6)).toBe(true);
  });
  it('Z0, Z0 static, εe, εe static within 0.2 %; αc, αd within 5 %', () => {
    let worstLine = 0;
    let worstLoss = 0;
    for (const c of fx.cases) {
      const line = analyseCase(c);
      worstLine = Math.max(
        worstLine,
        rel(line.z0, c.z0 ?? NaN), rel(line.z0Static, c.z0Static), rel(line.epsEff, c.epsEff), rel(line.epsEffStatic, c.epsEffStatic),
      );
      worstLoss = Math.max(worstLoss, rel(line.alphaConductor, c.alphaConductor ?? NaN), rel(line.alphaDielectric, c.alphaDielectric ?? NaN));
    }
    expect(worstLine).toBeLessThan(0.002);
    expect(worstLoss).toBeLessThan(0.05);
  });
  it('agrees with scikit-rf at t = 0 (the two fixtures cross-check each other)', () => {
    const skrf = load('skrf-microstrip.json');
    const key = (c: Case): string => [c.width, c.height, c.er, c.frequency].join('|');
    const byKey = new Map(fx.cases.filter((c) => c.copper === 0).map((c) => [key(c), c] as const));
    let matched = 0;
    for (const s of skrf.cases) {
      const c = byKey.get(key(s));
      if (!c) continue;
      matched++;
      expect(rel(c.z0Static, s.z0Static)).toBeLessThan(1e-6);
      expect(rel(c.epsEffStatic, s.epsEffStatic)).toBeLessThan(1e-6);
      expect(rel(c.epsEff, s.epsEff)).toBeLessThan(1e-6);
    }
    expect(matched).toBe(skrf.cases.length);
  });
});

describe('committed fixtures are what their scripts make', () => {
  // Re-runs the generators (Debian /usr/bin/python3, scikit-rf from python3-scikit-rf) and compares.
  const python = '/usr/bin/python3';
  const hasPython = existsSync(python);
  const hasSkrf = hasPython && spawnSync(python, ['-c', 'import skrf'], { encoding: 'utf8' }).status === 0;
  if (!hasPython) console.warn('skip: /usr/bin/python3 not installed');
  else if (!hasSkrf) console.warn('skip: python3-scikit-rf not installed');
  const regenerate = (script: string): Fixture => {
    const path = fileURLToPath(new URL(`../../scripts/fixtures/${script}`, import.meta.url));
    const run = spawnSync(python, [path, '--stdout'], { encoding: 'utf8', maxBuffer: 16 * 1024 * 1024 });
    expect(run.status).toBe(0);
    return JSON.parse(run.stdout) as Fixture;
  };
  const sameCases = (a: Fixture, b: Fixture): void => {
    expect(a.cases.length).toBe(b.cases.length);
    a.cases.forEach((c, i) => {
      const d = b.cases[i];
      expect(d).toBeDefined();
      const committed = d as unknown as Record<string, number>;
      for (const [k, v] of Object.entries(c) as [string, number][]) {
        const w = committed[k];
        expect(w === v ? 0 : rel(v, w ?? NaN)).toBeLessThan(1e-12);
      }
    });
  };
  it.skipIf(!hasSkrf)('skrf-microstrip.json', () => {
    sameCases(regenerate('skrf_microstrip.py'), load('skrf-microstrip.json'));
  });
  it.skipIf(!hasPython)('independent-microstrip.json', () => {
    sameCases(regenerate('independent_microstrip.py'), load('independent-microstrip.json'));
  });
});
