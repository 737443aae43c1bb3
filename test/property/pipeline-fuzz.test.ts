// Seeded fuzzing (fast-check) of the unit parser, the solver, the layout and the whole pipeline from
// spec text to artifacts: whatever the input, each returns finite results or throws our one-line
// TunestripError; nothing else escapes. The long run is `npm run fuzz` (scripts/fuzz.mjs, against
// dist/); this is its short, seeded form for npm test. The invariants are the project's own contract
// (README "Exit codes"; physics.md §5.2 [C] for the solver's reachability condition).
import fc from 'fast-check';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import YAML from 'yaml';
import { describe, expect, it } from 'vitest';
import { TunestripError } from '../../src/diagnostics.js';
import { designFromText } from '../../src/design.js';
import { layoutStubMatch } from '../../src/geometry/index.js';
import { layoutInputs, quantityLikes } from '../../scripts/fuzz-inputs.mjs';
import { complex, type Complex } from '../../src/math/complex.js';
import { solveSingleStub } from '../../src/solve/index.js';
import type { Presets } from '../../src/spec/index.js';
import { parseImpedance, parseQuantity, type Dimension } from '../../src/units.js';

const SEED = 4242;
const root = join(import.meta.dirname, '..', '..');
const yamlFiles = (dir: string): Record<string, string> =>
  Object.fromEntries(
    readdirSync(join(root, dir))
      .filter((f) => f.endsWith('.yaml'))
      .sort()
      .map((f) => [f.replace(/\.yaml$/, ''), readFileSync(join(root, dir, f), 'utf8')]),
  );
const presets: Presets = { substrates: yamlFiles('templates/substrates'), fab: yamlFiles('templates/fab') };

/** Our error, on one line; anything else is a crash. */
function isCleanError(e: unknown): boolean {
  return e instanceof TunestripError && !/[\n\r]/.test(e.message) && e.diagnostic.severity === 'error';
}

/** Paths of every number in a plain value that is not finite. */
function nonFinite(value: unknown, path = '', seen = new Set<unknown>()): string[] {
  if (typeof value === 'number') return Number.isFinite(value) ? [] : [`${path} = ${value}`];
  if (value === null || typeof value !== 'object' || seen.has(value)) return [];
  seen.add(value);
  return Object.entries(value).flatMap(([k, v]) => nonFinite(v, `${path}.${k}`, seen));
}

// ───────────── unit parser ─────────────

const DIMENSIONS: readonly Dimension[] = ['length', 'frequency', 'impedance', 'conductivity', 'dimensionless'];
const quantityLike = quantityLikes(fc, { maxLength: 16, maxDepth: 1 });

describe('unit parser fuzz (seeded)', () => {
  it('parseQuantity: a finite number or a one-line error, for every dimension', () => {
    fc.assert(
      fc.property(quantityLike, fc.constantFrom(...DIMENSIONS), (value, dimension) => {
        try {
          const n = parseQuantity(value, dimension, 'field');
          return Number.isFinite(n) && !Object.is(n, -0);
        } catch (e) {
          return isCleanError(e) && (e as TunestripError).diagnostic.where === 'field';
        }
      }),
      { seed: SEED, numRuns: 1500 },
    );
  });

  it('parseImpedance: a finite complex number or a one-line error', () => {
    fc.assert(
      fc.property(fc.oneof(quantityLike, fc.record({ re: fc.double(), im: fc.double() })), (value) => {
        try {
          const z = parseImpedance(value, 'load');
          return nonFinite(z).length === 0;
        } catch (e) {
          return isCleanError(e);
        }
      }),
      { seed: SEED, numRuns: 1500 },
    );
  });
});

// ───────────── solver ─────────────

/** Loads from the chart's centre to its edge, plus raw doubles of any size and sign. */
const gammaMagnitude = fc.oneof(
  fc.constant(0),
  fc.double({ min: 0, max: 1e-9, noNaN: true }),
  fc.double({ min: 0, max: 1, noNaN: true }),
  fc.double({ min: 1 - 1e-6, max: 1, noNaN: true }),
  fc.constant(1),
);
const angle = fc.double({ min: -Math.PI, max: Math.PI, noNaN: true });
const loadFromGamma = (z0: number, g: number, phase: number): Complex => {
  // Z = Z0 (1 + Γ)/(1 − Γ) (Pozar, Microwave Engineering, 3rd ed. 2005, §2.3; from memory).
  const gr = g * Math.cos(phase);
  const gi = g * Math.sin(phase);
  const den = (1 - gr) ** 2 + gi ** 2;
  return complex((z0 * (1 - gr * gr - gi * gi)) / den, (z0 * 2 * gi) / den);
};
const rawImpedance = fc.record({ re: fc.double(), im: fc.double() }).map(({ re, im }) => complex(re, im));
const z0Value = fc.oneof(fc.double({ min: 1, max: 500, noNaN: true }), fc.double(), fc.constantFrom(50, 1e-300, 1e300));

describe('solver fuzz (seeded)', () => {
  it('finite solutions with lengths in [0, ½), or a one-line error', () => {
    fc.assert(
      fc.property(
        fc.oneof(
          fc.tuple(fc.double({ min: 5, max: 200, noNaN: true }), gammaMagnitude, angle).map(([z0, g, p]) => ({ z0, load: loadFromGamma(z0, g, p) })),
          fc.tuple(z0Value, rawImpedance).map(([z0, load]) => ({ z0, load })),
        ),
        fc.oneof(fc.constant(complex(50, 0)), rawImpedance, fc.tuple(gammaMagnitude, angle).map(([g, p]) => loadFromGamma(50, g, p))),
        z0Value,
        fc.constantFrom('single' as const, 'balanced' as const),
        ({ z0, load }, target, stubZ0, style) => {
          try {
            const r = solveSingleStub({ load, target, lineZ0: z0, stubZ0, style });
            expect(nonFinite(r)).toEqual([]);
            expect(r.solutions.length).toBeGreaterThan(0);
            for (const s of r.solutions) {
              expect(s.positionWl).toBeGreaterThanOrEqual(0);
              expect(s.positionWl).toBeLessThan(0.5);
              expect(s.stubWl).toBeGreaterThanOrEqual(0);
              expect(s.stubWl).toBeLessThan(0.5);
            }
          } catch (e) {
            if (!isCleanError(e)) throw e;
          }
        },
      ),
      { seed: SEED, numRuns: 2000 },
    );
  });
});

// ───────────── geometry ─────────────

const validLayout = layoutInputs(fc, { maxWidthUm: 50_000, maxLengthUm: 200_000, maxLeadUm: 100_000, drillUm: [50, 1000], ringUm: [1, 500] });

describe('geometry fuzz (seeded)', () => {
  it('valid dimensions give closed, finite copper; invalid ones a RangeError, never a wrong shape', () => {
    fc.assert(
      fc.property(validLayout, fc.option(fc.constantFrom('seriesWidth', 'stubLength', 'leadLength'), { nil: undefined }), fc.constantFrom(Number.NaN, -1e-3, Infinity, 0), (input, broken, bad) => {
        const given = broken === undefined ? input : { ...input, [broken]: bad };
        let g;
        try {
          g = layoutStubMatch(given);
        } catch (e) {
          // The layout's contract: bad dimensions are a RangeError (the stages before it must not send them).
          expect(e).toBeInstanceOf(RangeError);
          expect(broken).toBeDefined();
          return;
        }
        expect(nonFinite(g)).toEqual([]);
        expect(g.copper.length).toBeGreaterThanOrEqual(1);
        for (const island of g.copper) expect(island.outline.length).toBeGreaterThanOrEqual(4);
        expect(g.bounds.xmin).toBeLessThanOrEqual(0);
        expect(g.bounds.xmax).toBeGreaterThanOrEqual(given.seriesLength + given.leadLength - 1e-9);
      }),
      { seed: SEED, numRuns: 400 },
    );
  });
});

// ───────────── whole pipeline ─────────────

const mm = (v: number): string => `${v} mm`;
const loadText = fc.oneof(
  fc.tuple(gammaMagnitude.filter((g) => g > 0), angle).map(([g, p]) => loadFromGamma(50, g, p)),
  fc.tuple(fc.double({ min: -10, max: 1000, noNaN: true }), fc.double({ min: -1000, max: 1000, noNaN: true })).map(([re, im]) => complex(re, im)),
);
const impedanceText = (z: Complex): string => `${z.re}${z.im < 0 ? '-' : '+'}j${Math.abs(z.im)}`;

/** A spec as a plain object: every field in or beyond its usual range, each written the way a user would. */
const specObject = fc.record(
  {
    name: fc.constant('fuzz'),
    frequency: fc.double({ min: 6, max: 11, noNaN: true }).map((e) => `${10 ** e} Hz`),
    load: loadText.map(impedanceText),
    target: fc.oneof(fc.constant('50'), loadText.map(impedanceText)),
    line_z0: fc.double({ min: 5, max: 200, noNaN: true }),
    stub_z0: fc.double({ min: 5, max: 200, noNaN: true }),
    stub: fc.constantFrom('open', 'short', 'best'),
    style: fc.constantFrom('single', 'balanced'),
    stub_side: fc.constantFrom('left', 'right'),
    substrate: fc.oneof(
      fc.record({ preset: fc.constantFrom(...Object.keys(presets.substrates)) }),
      fc.record(
        {
          er: fc.oneof(fc.constant(1), fc.double({ min: 1, max: 30, noNaN: true }), fc.double({ min: 1, max: 200, noNaN: true })),
          height: fc.double({ min: 0.005, max: 10, noNaN: true }).map(mm),
          copper: fc.oneof(fc.constant('0 mm'), fc.double({ min: 0, max: 0.2, noNaN: true }).map(mm)),
          tan_delta: fc.double({ min: 0, max: 0.2, noNaN: true }),
          roughness: fc.double({ min: 0, max: 0.01, noNaN: true }).map(mm),
        },
        { requiredKeys: ['er', 'height'] },
      ),
    ),
    fab: fc.record(
      {
        min_trace: fc.double({ min: 0.01, max: 1, noNaN: true }).map(mm),
        min_space: fc.double({ min: 0.01, max: 1, noNaN: true }).map(mm),
        via_drill: fc.double({ min: 0.05, max: 1, noNaN: true }).map(mm),
        via_pad: fc.double({ min: 0.05, max: 2, noNaN: true }).map(mm),
        vias_per_stub: fc.integer({ min: 1, max: 8 }),
      },
      { requiredKeys: [] },
    ),
    leads: fc.record({ load: fc.double({ min: 0, max: 10, noNaN: true }).map(mm), source: fc.double({ min: 0, max: 10, noNaN: true }).map(mm) }, { requiredKeys: [] }),
    area: fc
      .tuple(fc.double({ min: 0.1, max: 80, noNaN: true }), fc.double({ min: 0.1, max: 80, noNaN: true }))
      .map(([w, h]) => ({ x: [mm(-1), mm(w)], y: [mm(-h / 2), mm(h / 2)] })),
    keepouts: fc.array(fc.record({ center: fc.tuple(fc.double({ min: -5, max: 40, noNaN: true }).map(mm), fc.double({ min: -20, max: 20, noNaN: true }).map(mm)), radius: fc.double({ min: 0.01, max: 5, noNaN: true }).map(mm) }), { maxLength: 2 }),
    sweep: fc.record({ points: fc.integer({ min: 2, max: 401 }) }, { requiredKeys: [] }),
  },
  { requiredKeys: ['name', 'frequency', 'load', 'substrate'] },
);

function checkPipeline(text: string): void {
  let run;
  try {
    run = designFromText(text, presets, { version: 'fuzz' }, 'fuzz.yaml');
  } catch (e) {
    if (isCleanError(e)) return;
    throw e;
  }
  expect(nonFinite(run.physical)).toEqual([]);
  expect(nonFinite(run.geometry)).toEqual([]);
  expect(nonFinite(run.response)).toEqual([]);
  expect(run.artifacts.length).toBeGreaterThanOrEqual(6);
  for (const a of run.artifacts) {
    expect(a.text, a.path).not.toMatch(/NaN|Infinity|undefined|\[object Object\]/);
    expect(a.path).toMatch(/^[A-Za-z0-9][A-Za-z0-9._-]*$/);
  }
  for (const d of run.diagnostics) expect(d.message, d.where).not.toMatch(/[\n\r]|NaN|undefined/);
}

describe('pipeline fuzz (seeded): spec text → design → artifacts', () => {
  it('finite copper, response and files, or a one-line error', () => {
    fc.assert(
      fc.property(specObject, fc.boolean(), (spec, asJson) => checkPipeline(asJson ? JSON.stringify(spec) : YAML.stringify(spec))),
      { seed: SEED, numRuns: 40 },
    );
  });

  it('near-matched loads and stubs of nearly 0 or nearly λ/2: finite, or a one-line error', () => {
    // Loads a hair from the target (Γ → 0) and targets placed so the stub susceptance nearly vanishes.
    const base = (load: string, extra = ''): string =>
      `name: edge\nfrequency: 2.45 GHz\nload: ${load}\nsubstrate: { preset: ptfe-glass-0.79 }\n${extra}`;
    fc.assert(
      fc.property(fc.double({ min: -1e-6, max: 1e-6, noNaN: true }), fc.double({ min: -1e-6, max: 1e-6, noNaN: true }), fc.constantFrom('open', 'short', 'best'), (dr, dx, stub) =>
        checkPipeline(base(impedanceText(complex(50 + dr, dx)), `stub: ${stub}\n`)),
      ),
      { seed: SEED, numRuns: 20 },
    );
  });

  it('an already-matched load gives a plain line, not a crash', () => {
    checkPipeline('name: matched\nfrequency: 2.45 GHz\nload: 50\nsubstrate: { preset: ptfe-glass-0.79 }\n');
    const run = designFromText('name: matched\nfrequency: 2.45 GHz\nload: 50\nsubstrate: { preset: ptfe-glass-0.79 }\n', presets, { version: 'fuzz' });
    expect(run.ideal.alreadyMatched).toBe(true);
  });
});
