// Seeded random spec files (YAML text) for the artwork property tests: frequency 0.5–20 GHz, load,
// substrate, fabrication rules, style, termination, side, leads, placement, and sometimes an area
// and keep-outs around the placed section. Our own scenarios; the generator is the core's
// seeded mulberry32 (src/math/random.ts), so a seed always gives the same specs.
import type { Presets } from '../../src/spec/index.js';
import { seededUniform } from '../../src/math/random.js';
import { repoPresets } from './templates.js';

export const PRESETS: Presets = repoPresets();


export interface RandomSpec {
  readonly index: number;
  readonly text: string;
}

const fx = (v: number, d = 3): string => v.toFixed(d);

/** `count` spec texts from `seed`. */
export function randomSpecs(seed: number, count: number): RandomSpec[] {
  const r = seededUniform(seed);
  const pick = <T,>(xs: readonly T[]): T => xs[Math.floor(r() * xs.length)]!;
  const between = (lo: number, hi: number): number => lo + (hi - lo) * r();
  const out: RandomSpec[] = [];
  for (let i = 0; i < count; i++) {
    const f = 0.5e9 * Math.pow(40, r()); // log-uniform 0.5–20 GHz
    const load = `${fx(between(5, 200), 2)}${r() < 0.5 ? '-' : '+'}j${fx(between(0, 150), 2)}`;
    const lines = [`name: random-${i}`, `frequency: ${fx(f / 1e9, 4)} GHz`, `load: ${load}`];
    if (r() < 0.2) lines.push(`stub_z0: ${fx(between(35, 80), 1)}`);
    lines.push(`stub: ${pick(['open', 'short', 'best'])}`, `style: ${pick(['single', 'single', 'balanced'])}`, `stub_side: ${pick(['left', 'right'])}`);
    if (r() < 0.6) lines.push('substrate:', `  preset: ${pick(Object.keys(PRESETS.substrates).sort())}`);
    else lines.push('substrate:', `  er: ${fx(between(2.2, 10), 2)}`, `  height: ${fx(between(0.2, 1.6), 3)} mm`, `  copper: ${pick(['18 um', '35 um', '0 um'])}`);
    const fab = pick(['standard', 'fine']);
    lines.push('fab:', `  preset: ${fab}`, `  vias_per_stub: ${1 + Math.floor(r() * 4)}`);
    lines.push(`leads: { load: ${fx(between(0, 3))} mm, source: ${fx(between(0, 5))} mm }`);
    const x = between(-20, 20);
    const y = between(-20, 20);
    const rotation = r() < 0.4 ? pick([0, 90, 180, 270, -90, 450]) : between(-720, 720);
    const mirror = r() < 0.5;
    lines.push(`place: { x: ${fx(x)} mm, y: ${fx(y)} mm, rotation_deg: ${fx(rotation, 4)}, mirror: ${mirror} }`);
    // Sometimes a board area around the placed section (wide or tight, so folds get tried) and keep-outs.
    if (r() < 0.45) {
      const half = between(4, 30);
      lines.push(`area: { x: [${fx(x - half)} mm, ${fx(x + half)} mm], y: [${fx(y - half * between(0.3, 1))} mm, ${fx(y + half * between(0.3, 1))} mm] }`);
    }
    if (r() < 0.35) {
      lines.push('keepouts:');
      lines.push(`  - { center: [${fx(x + between(-25, 25))} mm, ${fx(y + between(-25, 25))} mm], radius: ${fx(between(0.5, 4))} mm }`);
      if (r() < 0.5) {
        const kx = x + between(-25, 20);
        const ky = y + between(-25, 20);
        lines.push(`  - { x: [${fx(kx)} mm, ${fx(kx + between(1, 6))} mm], y: [${fx(ky)} mm, ${fx(ky + between(1, 6))} mm] }`);
      }
      lines.push(`clearance: ${fx(between(0, 0.5))} mm`);
    }
    // The fabrication-spread check does not touch the artwork; leave it out to keep the runs fast.
    lines.push('tolerance: { runs: 0 }');
    out.push({ index: i, text: `${lines.join('\n')}\n` });
  }
  return out;
}
