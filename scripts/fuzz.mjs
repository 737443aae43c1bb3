// Long fuzzing run (npm run fuzz): 100 000 generated inputs by default, spread over the spec parser,
// the unit parser, the solver, the layout and the whole pipeline, against the built library in dist/.
// Every input must give a finite result or our one-line TunestripError; anything else is a crash.
// Each target runs in its own child process with a memory cap and a time limit, so a hang or an
// out-of-memory is reported with the input that caused it instead of killing the run.
//
//   node scripts/fuzz.mjs [--runs 100000] [--seed 20261202] [--only spec,units,impedance,solver,geometry,pipeline]
//
// Exit code 0 when nothing crashed, 1 otherwise. Seeded: the same seed gives the same inputs.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const dist = join(root, 'dist');

/** Share of the runs each target gets; the pipeline is slow (tens of ms a run), the parsers fast. */
const SHARES = { spec: 0.25, units: 0.3, impedance: 0.15, solver: 0.25, geometry: 0.04, pipeline: 0.01 };
const CHILD_MEMORY_MB = 1536;
const CHILD_TIME_LIMIT_MS = 20 * 60 * 1000;

function argValue(name, fallback) {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 && process.argv[i + 1] !== undefined ? process.argv[i + 1] : fallback;
}

const importDist = (path) => import(pathToFileURL(join(dist, path)).href);

// ───────────────────────────── child: one target ─────────────────────────────

async function runTarget(target, runs, seed, progressFile) {
  const fc = (await import('fast-check')).default;
  const YAML = (await import('yaml')).default;
  const { TunestripError } = await importDist('diagnostics.js');
  const { parseSpec } = await importDist('spec/index.js');
  const { parseQuantity, parseImpedance } = await importDist('units.js');
  const { solveSingleStub } = await importDist('solve/index.js');
  const { layoutStubMatch } = await importDist('geometry/index.js');
  const { designFromText } = await importDist('design.js');

  const yamlFiles = (dir) =>
    Object.fromEntries(
      readdirSync(join(root, dir))
        .filter((f) => f.endsWith('.yaml'))
        .sort()
        .map((f) => [f.replace(/\.yaml$/, ''), readFileSync(join(root, dir, f), 'utf8')]),
    );
  const presets = { substrates: yamlFiles('templates/substrates'), fab: yamlFiles('templates/fab') };

  const cleanError = (e) => e instanceof TunestripError && !/[\n\r]/.test(e.message) && e.diagnostic.severity === 'error';
  const nonFinite = (value, path = '', seen = new Set()) => {
    if (typeof value === 'number') return Number.isFinite(value) ? [] : [`${path} = ${value}`];
    if (value === null || typeof value !== 'object' || seen.has(value)) return [];
    seen.add(value);
    return Object.entries(value).flatMap(([k, v]) => nonFinite(v, `${path}.${k}`, seen));
  };
  const must = (ok, what) => {
    if (!ok) throw new Error(what);
  };
  /** Runs `body`; our one-line error passes, any other throw is a crash. */
  const tolerant = (body) => {
    try {
      body();
    } catch (e) {
      if (!cleanError(e)) throw e;
    }
  };

  // ── generators (the same families as test/property/pipeline-fuzz.test.ts, wider; the shared ones in scripts/fuzz-inputs.mjs) ──
  const { layoutInputs, quantityLikes } = await import(pathToFileURL(join(root, 'scripts', 'fuzz-inputs.mjs')).href);
  const quantityLike = quantityLikes(fc, { maxLength: 24, maxDepth: 2 });
  const angle = fc.double({ min: -Math.PI, max: Math.PI, noNaN: true });
  const gammaMagnitude = fc.oneof(fc.constant(0), fc.double({ min: 0, max: 1e-9, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 1 - 1e-6, max: 1, noNaN: true }), fc.constant(1));
  const fromGamma = (z0, g, p) => {
    // Z = Z0 (1 + Γ)/(1 − Γ) (Pozar, Microwave Engineering, 3rd ed. 2005, §2.3; from memory).
    const gr = g * Math.cos(p);
    const gi = g * Math.sin(p);
    const den = (1 - gr) ** 2 + gi ** 2;
    return { re: (z0 * (1 - gr * gr - gi * gi)) / den, im: (z0 * 2 * gi) / den };
  };
  const rawZ = fc.record({ re: fc.double(), im: fc.double() });
  const z0Value = fc.oneof(fc.double({ min: 1, max: 500, noNaN: true }), fc.double(), fc.constantFrom(50, 1e-300, 1e300, 5e-324));
  const mm = (v) => `${v} mm`;
  const zText = (z) => `${z.re}${z.im < 0 ? '-' : '+'}j${Math.abs(z.im)}`;
  const loadZ = fc.oneof(
    fc.tuple(gammaMagnitude, angle).map(([g, p]) => fromGamma(50, g, p)),
    fc.tuple(fc.double({ min: -10, max: 1000, noNaN: true }), fc.double({ min: -1000, max: 1000, noNaN: true })).map(([re, im]) => ({ re, im })),
  );
  const specObject = fc.record(
    {
      name: fc.constant('fuzz'),
      frequency: fc.double({ min: 5, max: 12, noNaN: true }).map((e) => `${10 ** e} Hz`),
      load: loadZ.map(zText),
      target: fc.oneof(fc.constant('50'), loadZ.map(zText)),
      line_z0: fc.double({ min: 2, max: 300, noNaN: true }),
      stub_z0: fc.double({ min: 2, max: 300, noNaN: true }),
      stub: fc.constantFrom('open', 'short', 'best'),
      style: fc.constantFrom('single', 'balanced'),
      stub_side: fc.constantFrom('left', 'right'),
      substrate: fc.oneof(
        fc.record({ preset: fc.constantFrom(...Object.keys(presets.substrates)) }),
        fc.record(
          {
            er: fc.oneof(fc.constant(1), fc.double({ min: 1, max: 30, noNaN: true }), fc.double({ min: 1, max: 1000, noNaN: true })),
            height: fc.oneof(fc.double({ min: 0.005, max: 10, noNaN: true }), fc.double({ min: 1e-6, max: 1000, noNaN: true })).map(mm),
            copper: fc.oneof(fc.constant('0 mm'), fc.double({ min: 0, max: 1, noNaN: true }).map(mm)),
            tan_delta: fc.double({ min: 0, max: 0.999, noNaN: true }),
            roughness: fc.double({ min: 0, max: 0.1, noNaN: true }).map(mm),
            conductivity: fc.double({ min: 1e3, max: 1e9, noNaN: true }).map((s) => `${s} S/m`),
          },
          { requiredKeys: ['er', 'height'] },
        ),
      ),
      fab: fc.record(
        {
          min_trace: fc.double({ min: 0.001, max: 5, noNaN: true }).map(mm),
          min_space: fc.double({ min: 0.001, max: 5, noNaN: true }).map(mm),
          via_drill: fc.double({ min: 0.01, max: 2, noNaN: true }).map(mm),
          via_pad: fc.double({ min: 0.01, max: 4, noNaN: true }).map(mm),
          min_annular_ring: fc.double({ min: 0, max: 1, noNaN: true }).map(mm),
          copper_to_edge: fc.double({ min: 0, max: 5, noNaN: true }).map(mm),
          vias_per_stub: fc.integer({ min: 1, max: 8 }),
        },
        { requiredKeys: [] },
      ),
      leads: fc.record({ load: fc.double({ min: 0, max: 100, noNaN: true }).map(mm), source: fc.double({ min: 0, max: 100, noNaN: true }).map(mm) }, { requiredKeys: [] }),
      area: fc.oneof(
        fc.tuple(fc.double({ min: 0.1, max: 200, noNaN: true }), fc.double({ min: 0.1, max: 200, noNaN: true })).map(([w, h]) => ({ x: [mm(-1), mm(w)], y: [mm(-h / 2), mm(h / 2)] })),
        fc.tuple(fc.double({ min: 0.1, max: 100, noNaN: true }), fc.double({ min: 0.1, max: 100, noNaN: true })).map(([w, h]) => ({ polygon: [[mm(-1), mm(-h)], [mm(w), mm(-h)], [mm(w), mm(h)], [mm(-1), mm(h)]] })),
      ),
      keepouts: fc.array(fc.record({ center: fc.tuple(fc.double({ min: -5, max: 60, noNaN: true }).map(mm), fc.double({ min: -30, max: 30, noNaN: true }).map(mm)), radius: fc.double({ min: 0.001, max: 10, noNaN: true }).map(mm) }), { maxLength: 3 }),
      clearance: fc.double({ min: 0, max: 2, noNaN: true }).map(mm),
      sweep: fc.record({ points: fc.integer({ min: 2, max: 2001 }) }, { requiredKeys: [] }),
    },
    { requiredKeys: ['name', 'frequency', 'load', 'substrate'] },
  );

  // Seeds for text damage: the example specs and the bad-input corpus.
  const seedTexts = [
    ...Object.values(yamlFiles('templates/examples')),
    ...readdirSync(join(root, 'test', 'fixtures', 'bad-inputs'))
      .filter((f) => /\.(ya?ml|json)$/.test(f))
      .sort()
      .map((f) => readFileSync(join(root, 'test', 'fixtures', 'bad-inputs', f)).toString('utf8'))
      // The deeply nested case takes a parser's full stack each time; one copy in the corpus test is enough.
      .filter((t) => t.length < 4096),
  ];
  const damaged = fc
    .tuple(
      fc.constantFrom(...seedTexts),
      fc.nat(),
      fc.nat({ max: 16 }),
      fc.oneof(fc.string({ maxLength: 8 }), fc.string({ unit: 'binary', maxLength: 8 }), fc.constantFrom(':', '-', '[', '{', '}', ']', '"', "'", '&a', '*a', '!!str', '!!binary', '? ', '\t', '\n', '  ', '#', '0', '.inf', '.nan', '1e999', '---\n', '<<: ', '__proto__: ', '\ufeff')),
    )
    .map(([text, at, cut, insert]) => {
      const i = at % (text.length + 1);
      return text.slice(0, i) + insert + text.slice(i + cut);
    });
  const specText = fc.oneof(
    { weight: 3, arbitrary: damaged },
    { weight: 2, arbitrary: fc.tuple(specObject, fc.boolean()).map(([o, j]) => (j ? JSON.stringify(o) : YAML.stringify(o))) },
    { weight: 1, arbitrary: fc.oneof(fc.string(), fc.string({ unit: 'binary' }), fc.string({ unit: 'grapheme' })) },
  );

  const layoutInput = layoutInputs(fc, { maxWidthUm: 1e6, maxLengthUm: 1e6, maxLeadUm: 1e6, drillUm: [10, 2000], ringUm: [0.1, 1000] });

  const checkPipeline = (text) => {
    let run;
    try {
      run = designFromText(text, presets, { version: 'fuzz' }, 'fuzz.yaml');
    } catch (e) {
      if (cleanError(e)) return;
      throw e;
    }
    for (const part of ['physical', 'geometry', 'response']) {
      const bad = nonFinite(run[part]);
      must(bad.length === 0, `${part} has non-finite numbers: ${bad.slice(0, 3).join(', ')}`);
    }
    for (const a of run.artifacts) must(!/NaN|Infinity|undefined|\[object Object\]/.test(a.text), `${a.path} contains NaN, Infinity or undefined`);
    for (const d of run.diagnostics) must(!/[\n\r]/.test(d.message), `diagnostic ${d.where} spans lines`);
  };

  const properties = {
    spec: fc.property(specText, (text) =>
      tolerant(() => {
        const { spec } = parseSpec(text, presets, 'fuzz.yaml');
        must(nonFinite(spec).length === 0, 'spec has non-finite numbers');
        must(spec.frequency > 0 && spec.substrate.height > 0 && spec.substrate.er >= 1, 'spec out of its own bounds');
      }),
    ),
    units: fc.property(quantityLike, fc.constantFrom('length', 'frequency', 'impedance', 'conductivity', 'dimensionless'), (value, dimension) =>
      tolerant(() => must(Number.isFinite(parseQuantity(value, dimension, 'field')), 'non-finite quantity')),
    ),
    impedance: fc.property(fc.oneof(quantityLike, rawZ), (value) => tolerant(() => must(nonFinite(parseImpedance(value, 'load')).length === 0, 'non-finite impedance'))),
    solver: fc.property(
      fc.oneof(fc.tuple(fc.double({ min: 5, max: 200, noNaN: true }), gammaMagnitude, angle).map(([z0, g, p]) => ({ z0, load: fromGamma(z0, g, p) })), fc.tuple(z0Value, rawZ).map(([z0, load]) => ({ z0, load }))),
      fc.oneof(fc.constant({ re: 50, im: 0 }), rawZ, fc.tuple(gammaMagnitude, angle).map(([g, p]) => fromGamma(50, g, p))),
      z0Value,
      fc.constantFrom('single', 'balanced'),
      ({ z0, load }, target, stubZ0, style) =>
        tolerant(() => {
          const r = solveSingleStub({ load, target, lineZ0: z0, stubZ0, style });
          must(nonFinite(r).length === 0, `non-finite solution: ${nonFinite(r).slice(0, 3).join(', ')}`);
          must(r.solutions.length > 0, 'no solutions and no error');
          for (const s of r.solutions) must(s.positionWl >= 0 && s.positionWl < 0.5 && s.stubWl >= 0 && s.stubWl < 0.5, 'length outside [0, ½)');
        }),
    ),
    geometry: fc.property(layoutInput, (input) => {
      const g = layoutStubMatch(input);
      must(nonFinite(g).length === 0, 'non-finite geometry');
      must(g.copper.length >= 1 && g.copper.every((i) => i.outline.length >= 4), 'degenerate copper');
    }),
    pipeline: fc.property(fc.tuple(specObject, fc.boolean()), ([o, asJson]) => {
      const text = asJson ? JSON.stringify(o) : YAML.stringify(o);
      // Written before each run, so a hang or an out-of-memory still names its input.
      if (progressFile) writeFileSync(progressFile, text);
      checkPipeline(text);
    }),
  };

  const started = Date.now();
  const result = fc.check(properties[target], { seed, numRuns: runs, endOnFailure: true });
  const summary = {
    target,
    runs: result.numRuns,
    seconds: (Date.now() - started) / 1000,
    failed: result.failed,
    ...(result.failed
      ? { counterexample: JSON.stringify(result.counterexample)?.slice(0, 2000), error: String(result.errorInstance?.stack ?? result.errorInstance ?? result.error).split('\n').slice(0, 6).join('\n') }
      : {}),
  };
  process.stdout.write(`FUZZ-RESULT ${JSON.stringify(summary)}\n`);
}

// ───────────────────────────── parent: all targets ─────────────────────────────

async function runAll() {
  if (!existsSync(join(dist, 'design.js'))) {
    console.error('fuzz: dist/ is missing; run npm run build first (npm run fuzz does)');
    process.exit(2);
  }
  const total = Number(argValue('runs', '100000'));
  const seed = Number(argValue('seed', process.env.FUZZ_SEED ?? '20261202'));
  const only = argValue('only', Object.keys(SHARES).join(',')).split(',');
  if (!Number.isInteger(total) || total < 1 || !Number.isInteger(seed)) {
    console.error('fuzz: --runs and --seed must be whole numbers');
    process.exit(2);
  }
  const chosen = Object.entries(SHARES).filter(([t]) => only.includes(t));
  const weight = chosen.reduce((s, [, w]) => s + w, 0);
  const work = mkdtempSync(join(tmpdir(), 'tunestrip-fuzz-'));
  console.log(`fuzz: ${total} inputs, seed ${seed}, targets ${chosen.map(([t]) => t).join(', ')}`);
  let crashed = 0;
  let done = 0;
  for (const [target, share] of chosen) {
    const runs = Math.max(1, Math.round((total * share) / weight));
    const progress = join(work, `${target}.current`);
    const child = spawnSync(process.execPath, [`--max-old-space-size=${CHILD_MEMORY_MB}`, fileURLToPath(import.meta.url), '--child', target, String(runs), String(seed), progress], {
      cwd: root,
      encoding: 'utf8',
      timeout: CHILD_TIME_LIMIT_MS,
      maxBuffer: 64 * 1024 * 1024,
    });
    const line = (child.stdout ?? '').split('\n').find((l) => l.startsWith('FUZZ-RESULT '));
    if (!line) {
      crashed++;
      const why = child.error?.code === 'ETIMEDOUT' ? `no result within ${CHILD_TIME_LIMIT_MS / 60000} min` : `exit ${child.status ?? child.signal}`;
      const last = existsSync(progress) ? readFileSync(progress, 'utf8') : '(not recorded for this target)';
      console.log(`✗ ${target}: the fuzzing process died (${why})\n  last input:\n${last.replace(/^/gm, '    ')}\n  stderr: ${(child.stderr ?? '').split('\n').slice(-8).join('\n  ')}`);
      continue;
    }
    const r = JSON.parse(line.slice('FUZZ-RESULT '.length));
    done += r.runs;
    if (r.failed) {
      crashed++;
      console.log(`✗ ${target}: failed after ${r.runs} runs (${r.seconds.toFixed(1)} s)\n  counterexample: ${r.counterexample}\n  ${r.error.replace(/\n/g, '\n  ')}`);
    } else {
      console.log(`✓ ${target}: ${r.runs} inputs, no crash (${r.seconds.toFixed(1)} s)`);
    }
  }
  rmSync(work, { recursive: true, force: true });
  console.log(`fuzz: ${done} inputs run, ${crashed} target${crashed === 1 ? '' : 's'} crashed`);
  process.exit(crashed === 0 ? 0 : 1);
}

if (process.argv[2] === '--child') {
  const [, , , target, runs, seed, progress] = process.argv;
  await runTarget(target, Number(runs), Number(seed), progress);
} else {
  await runAll();
}
