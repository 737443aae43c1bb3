// The Monte-Carlo fabrication-spread check (src/analysis/tolerance.ts).
import { describe, expect, it } from 'vitest';
import { designFromText } from '../../src/design.js';
import { toleranceRuns, minimumFrequency } from '../../src/analysis/tolerance.js';
import { seededUniform, quantile } from '../../src/math/random.js';
import { exampleSpecs, repoPresets } from '../helpers/templates.js';

const presets = repoPresets();
const base = exampleSpecs()['receiver-5g8']!;
const run = designFromText(base, presets, { version: 'test' });
const withTolerance = (t: Partial<typeof run.spec.tolerance>) => ({ ...run.spec, tolerance: { ...run.spec.tolerance, ...t } });

describe('fabrication spread', () => {
  it('with no spread every run is the nominal design: matched at f0, minimum at f0', () => {
    const r = toleranceRuns(withTolerance({ width: 0, erFraction: 0, heightFraction: 0, copperFraction: 0, runs: 5 }), run.physical)!;
    expect(r.s11DbAtF0.worst).toBeLessThan(-100);
    expect(r.yield10dB).toBe(1);
    // Parabolic refinement on a 61-point grid over ±14 %: within a few parts in 1e4 of f0.
    expect(Math.abs(r.minimumFrequency.p5 / run.spec.frequency - 1)).toBeLessThan(1e-3);
  });

  it('is reproducible for a seed and changes with it', () => {
    const a = toleranceRuns(withTolerance({ runs: 30, seed: 7 }), run.physical)!;
    const b = toleranceRuns(withTolerance({ runs: 30, seed: 7 }), run.physical)!;
    const c = toleranceRuns(withTolerance({ runs: 30, seed: 8 }), run.physical)!;
    expect(b).toEqual(a);
    expect(c.s11DbAtF0.median).not.toBe(a.s11DbAtF0.median);
  });

  it('a ±2 % permittivity spread moves the match by about ±1 %', () => {
    // Source: physics.md §9.3 [R], an RF-laminate maker's FAQ: "±2 % in Dk gives about ±1 % in
    // microstrip Z0 and about ±1 % shift in resonant frequency".
    const r = toleranceRuns(withTolerance({ width: 0, erFraction: 0.02, heightFraction: 0, copperFraction: 0, runs: 200 }), run.physical)!;
    const low = r.minimumFrequency.p5 / run.spec.frequency - 1;
    const high = r.minimumFrequency.p95 / run.spec.frequency - 1;
    expect(low).toBeLessThan(-0.005);
    expect(low).toBeGreaterThan(-0.012);
    expect(high).toBeGreaterThan(0.005);
    expect(high).toBeLessThan(0.012);
  });

  it('a wider etch spread makes the 95th percentile worse (same random draws)', () => {
    // For small errors |Γ| grows about linearly with the width error, so five times the spread
    // should cost about 14 dB; 6 dB is a loose floor (our own reasoning, no source).
    const narrow = toleranceRuns(withTolerance({ width: 0.01e-3, erFraction: 0, heightFraction: 0, copperFraction: 0, runs: 100 }), run.physical)!;
    const wide = toleranceRuns(withTolerance({ width: 0.05e-3, erFraction: 0, heightFraction: 0, copperFraction: 0, runs: 100 }), run.physical)!;
    expect(wide.s11DbAtF0.p95).toBeGreaterThan(narrow.s11DbAtF0.p95 + 6);
  });

  it('runs: 0 turns the check off', () => {
    expect(toleranceRuns(withTolerance({ runs: 0 }), run.physical)).toBeNull();
  });
});

describe('helpers', () => {
  it('the generator is uniform on [0, 1) (mean and variance of 1/2 and 1/12 within sampling error)', () => {
    const next = seededUniform(123);
    const xs = Array.from({ length: 20000 }, next);
    const mean = xs.reduce((a, b) => a + b, 0) / xs.length;
    const variance = xs.reduce((a, b) => a + (b - mean) ** 2, 0) / xs.length;
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...xs)).toBeLessThan(1);
    expect(Math.abs(mean - 0.5)).toBeLessThan(0.01);
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(0.003);
  });

  it('quantile interpolates linearly', () => {
    expect(quantile([1, 2, 3, 4], 0.5)).toBe(2.5);
    expect(quantile([1, 2, 3, 4], 1)).toBe(4);
  });

  it('minimumFrequency finds the vertex of a sampled parabola', () => {
    const f = [1, 2, 3, 4, 5];
    const m = f.map((x) => Math.sqrt((x - 3.3) ** 2 + 0.01));
    expect(minimumFrequency(f, m)).toBeCloseTo(3.3, 9);
  });
});
