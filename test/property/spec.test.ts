// Fuzzing the spec reader (seeded): whatever the text, parseSpec returns a valid Spec or throws a
// TunestripError with a one-line message; nothing else escapes.
import fc from 'fast-check';
import YAML from 'yaml';
import { describe, expect, it } from 'vitest';
import { repoPresets, repoRoot, yamlFiles } from '../helpers/templates.js';
import { TunestripError } from '../../src/diagnostics.js';
import type { Spec } from '../../src/seams.js';
import { parseSpec, type Presets } from '../../src/spec/parse.js';

const root = repoRoot;
const presets: Presets = repoPresets();
const exampleTexts = Object.values(yamlFiles('templates/examples'));

const positive = (x: number): boolean => Number.isFinite(x) && x > 0;
const nonNegative = (x: number): boolean => Number.isFinite(x) && x >= 0;

/** What every returned Spec must satisfy, whatever the input was. */
function isValidSpec(spec: Spec): boolean {
  const s = spec.substrate;
  const f = spec.fab;
  return (
    /^[A-Za-z0-9_-][A-Za-z0-9._-]{0,63}$/.test(spec.name) &&
    positive(spec.frequency) &&
    Number.isFinite(spec.load.re) && Number.isFinite(spec.load.im) &&
    Number.isFinite(spec.target.re) && Number.isFinite(spec.target.im) &&
    positive(spec.lineZ0) && positive(spec.stubZ0) &&
    ['open', 'short', 'best'].includes(spec.stub) && ['single', 'balanced'].includes(spec.style) && ['left', 'right'].includes(spec.stubSide) &&
    Number.isFinite(s.er) && s.er >= 1 && positive(s.height) && nonNegative(s.copper) && nonNegative(s.tanDelta) && s.tanDelta < 1 &&
    nonNegative(s.roughness) && positive(s.conductivity) &&
    positive(f.minTrace) && positive(f.minSpace) && positive(f.viaDrill) && positive(f.viaPad) && nonNegative(f.minAnnularRing) &&
    nonNegative(f.copperToEdge) && Number.isInteger(f.viasPerStub) && f.viasPerStub >= 1 && f.viasPerStub <= 8 &&
    nonNegative(spec.leads.load) && nonNegative(spec.leads.source) && nonNegative(spec.clearance) &&
    spec.sweep.start < spec.frequency && spec.frequency < spec.sweep.stop && Number.isInteger(spec.sweep.points) &&
    spec.sweep.points >= 2 && spec.sweep.points <= 10001 &&
    JSON.stringify(JSON.parse(JSON.stringify(spec))) === JSON.stringify(spec)
  );
}

/** True when parseSpec either returns a valid Spec or throws our one-line error. */
function behaves(text: string): boolean {
  try {
    return isValidSpec(parseSpec(text, presets, 'fuzz.yaml').spec);
  } catch (error) {
    return error instanceof TunestripError && !/[\n\r]/.test(error.message);
  }
}

const exampleText = fc.constantFrom(...exampleTexts);

/** Character-level damage: delete, insert or replace a slice of a valid spec. */
const damagedText = fc
  .tuple(exampleText, fc.nat(), fc.nat({ max: 12 }), fc.oneof(fc.string({ maxLength: 8 }), fc.string({ unit: 'binary', maxLength: 8 }), fc.constantFrom(':', '-', '[', '{', '"', "'", '&a', '*a', '!!str', '\t', '\n', '  ', '#', '0', '.inf', '.nan', '1e999')))
  .map(([text, at, cut, insert]) => {
    const i = at % (text.length + 1);
    return text.slice(0, i) + insert + text.slice(i + cut);
  });

/** Leaf paths of a plain value, as key lists. */
function leafPaths(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  if (Array.isArray(value)) return value.flatMap((v, i) => leafPaths(v, [...prefix, i]));
  if (value !== null && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => leafPaths(v, [...prefix, k]));
  return [prefix];
}

function withLeaf(value: unknown, path: readonly (string | number)[], replacement: unknown, remove: boolean): unknown {
  const [head, ...rest] = path;
  if (head === undefined) return replacement;
  if (Array.isArray(value)) {
    const copy = [...value];
    if (rest.length === 0 && remove) copy.splice(Number(head), 1);
    else copy[Number(head)] = withLeaf(copy[Number(head)], rest, replacement, remove);
    return copy;
  }
  const record = { ...(value as Record<string, unknown>) };
  if (rest.length === 0 && remove) delete record[String(head)];
  else record[String(head)] = withLeaf(record[String(head)], rest, replacement, remove);
  return record;
}

const oddValue = fc.oneof(
  fc.anything({ maxDepth: 2 }),
  fc.double(),
  fc.constantFrom('0', '-1 mm', '1e400 Hz', 'NaN', '22-j', 'j', '1 oz', '35 µm', '5.8 ghz', '', ' ', 'open', '../x', '[]', '{}'),
  fc.string({ maxLength: 12 }),
);

/** Structure-level damage: one leaf replaced by an odd value, or removed; written as YAML or JSON. */
const exampleData: unknown[] = exampleTexts.map((t) => YAML.parse(t) as unknown);
const mutatedSpec = fc
  .tuple(fc.constantFrom(...exampleData), fc.nat(), oddValue, fc.boolean(), fc.boolean())
  .map(([data, pick, replacement, remove, asJson]) => {
    const paths = leafPaths(data);
    const path = paths[pick % paths.length] ?? [];
    const changed = withLeaf(data, path, replacement, remove);
    try {
      return asJson ? JSON.stringify(changed) : YAML.stringify(changed);
    } catch {
      return JSON.stringify(String(replacement));
    }
  });

describe('parseSpec fuzz (seeded)', () => {
  it('arbitrary text', () => {
    fc.assert(fc.property(fc.oneof(fc.string(), fc.string({ unit: 'binary' }), fc.string({ unit: 'grapheme' })), behaves), { seed: 42, numRuns: 500 });
  });
  it('character-damaged example specs', () => {
    fc.assert(fc.property(damagedText, behaves), { seed: 42, numRuns: 750 });
  });
  it('structurally mutated example specs', () => {
    let accepted = 0;
    const counting = (text: string): boolean => {
      try {
        parseSpec(text, presets);
        accepted++;
      } catch {
        // judged by behaves()
      }
      return behaves(text);
    };
    fc.assert(fc.property(mutatedSpec, counting), { seed: 42, numRuns: 750 });
    // Many single-leaf changes leave a valid spec (e.g. a removed optional key): the Spec invariants
    // above were really exercised, not only the error path.
    expect(accepted).toBeGreaterThan(100);
  });
});
