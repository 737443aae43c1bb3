// Speed and memory figures for tunestrip's main job. Prints figures and ratios; asserts nothing
// (targets live here, never in timed tests). Run with `npm run bench` (builds first).
import { readFileSync, readdirSync } from 'node:fs';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import { designFromText, solveSingleStub, analyseMicrostrip, synthesizeMicrostrip, complex } from '../dist/index.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const presetFolder = (f) =>
  Object.fromEntries(readdirSync(join(root, 'templates', f)).filter((n) => n.endsWith('.yaml')).map((n) => [n.replace(/\.yaml$/, ''), readFileSync(join(root, 'templates', f, n), 'utf8')]));
const presets = { substrates: presetFolder('substrates'), fab: presetFolder('fab') };

// Targets (figures a user would notice): a whole design well under 1 s; the solver and a line
// analysis in microseconds. Ratios below 1 meet the target.
const TARGETS = { designMs: 500, solveUs: 50, analyseUs: 20, synthesizeUs: 500 };

function time(label, runs, fn) {
  fn();
  const t0 = performance.now();
  for (let i = 0; i < runs; i++) fn();
  const each = (performance.now() - t0) / runs;
  return { label, runs, eachMs: each };
}

const rows = [];
for (const file of readdirSync(join(root, 'templates', 'examples')).sort()) {
  const text = readFileSync(join(root, 'templates', 'examples', file), 'utf8');
  const r = time(`design ${file}`, 10, () => designFromText(text, presets, { version: 'bench' }));
  rows.push({ ...r, target: TARGETS.designMs, unit: 'ms', value: r.eachMs });
}
const problem = { load: complex(22, -31), target: complex(50, 0), lineZ0: 50, stubZ0: 50, style: 'single' };
const s = time('solveSingleStub', 20000, () => solveSingleStub(problem));
rows.push({ ...s, target: TARGETS.solveUs, unit: 'µs', value: s.eachMs * 1e3 });
const sub = { er: 3.66, height: 0.508e-3, copper: 35e-6, tanDelta: 0.0037, roughness: 1e-6, conductivity: 5.8e7 };
const a = time('analyseMicrostrip', 20000, () => analyseMicrostrip(1.1e-3, sub, 5.8e9));
rows.push({ ...a, target: TARGETS.analyseUs, unit: 'µs', value: a.eachMs * 1e3 });
const y = time('synthesizeMicrostrip', 2000, () => synthesizeMicrostrip(50, sub, 5.8e9));
rows.push({ ...y, target: TARGETS.synthesizeUs, unit: 'µs', value: y.eachMs * 1e3 });

console.log('figure                                   each        target      ratio');
for (const r of rows) {
  console.log(`${r.label.padEnd(40)} ${r.value.toFixed(3).padStart(9)} ${r.unit.padEnd(3)} ${String(r.target).padStart(8)} ${r.unit.padEnd(3)} ${(r.value / r.target).toFixed(3).padStart(7)}`);
}
const heapMb = process.memoryUsage().heapUsed / 2 ** 20;
const rssMb = process.memoryUsage().rss / 2 ** 20;
console.log(`memory: heap ${heapMb.toFixed(1)} MiB, rss ${rssMb.toFixed(1)} MiB (target rss 200 MiB, ratio ${(rssMb / 200).toFixed(3)})`);
