// parseSpec: spec text → validated Spec in SI units with defaults filled and listed. Presets arrive
// as text (the CLI reads templates/); nothing here touches files.
import type * as z from 'zod';
import { TunestripError, diagnostic, fail, type Diagnostic } from '../diagnostics.js';
import type { Complex } from '../math/complex.js';
import type { FabRules, Region, Spec, StubChoice, StubStyle, Substrate } from '../seams.js';
import { formatEngineering, shown } from '../units.js';
import { lineAt, readDocument, type SpecDocument } from './document.js';
import { FAB_FIELDS, FAB_PRESET_FIELDS, LEAD_FIELDS, PLACE_FIELDS, SPEC_FIELDS, SUBSTRATE_FIELDS, SUBSTRATE_PRESET_FIELDS, SWEEP_FIELDS, TOLERANCE_FIELDS, typeText, type Field } from './fields.js';
import { defaultValue, fabPresetSchema, issueWhere, specSchema, substratePresetSchema } from './schema.js';
import { closest, suggestion } from './suggest.js';
import { misplacedKey, unknownKeys } from './unknown-keys.js';

export interface Presets {
  readonly substrates: Readonly<Record<string, string>>;
  readonly fab: Readonly<Record<string, string>>;
}

export interface ParsedSpec {
  readonly spec: Spec;
  readonly diagnostics: readonly Diagnostic[];
}

type Values = Readonly<Record<string, unknown>>;

const isRecord = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object' && !Array.isArray(v);

/** Run a schema; the first issue becomes a TunestripError whose message ends with the file line. */
function validate(schema: z.ZodType<Record<string, unknown>>, data: unknown, doc: SpecDocument, source: string, rootWhere: string, prefix = ''): Values {
  const result = schema.safeParse(data);
  if (result.success) return result.data;
  const issue = result.error.issues[0];
  const local = issue ? issueWhere(issue, '') : '';
  const line = local === '' ? undefined : lineAt(doc.lines, local);
  const where = local === '' ? rootWhere : prefix === '' ? local : `${prefix}.${local}`;
  const message = (issue?.message ?? 'is not valid').replace(/\s+/g, ' ');
  throw new TunestripError(diagnostic('spec.invalid', where, line === undefined ? message : `${message} (${source}:${line})`));
}

/** Rethrow a TunestripError with the file line of its field appended. */
function withLine<T>(doc: SpecDocument, source: string, run: () => T): T {
  try {
    return run();
  } catch (error) {
    if (!(error instanceof TunestripError)) throw error;
    const d = error.diagnostic;
    const line = lineAt(doc.lines, d.where);
    if (line === undefined || d.code !== 'spec.invalid') throw error;
    throw new TunestripError({ ...d, message: `${d.message} (${source}:${line})` });
  }
}

/** Explicit value, else preset value, else the table default (parsed like file text); records which took the default. */
function fill(fields: readonly Field[], explicit: Values, preset: Values, prefix: string, defaulted: string[]): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const field of fields) {
    if (field.type.kind === 'group' || field.key === 'preset' || field.key === 'note') continue;
    const where = `${prefix}.${field.key}`;
    const value = explicit[field.key] ?? preset[field.key];
    if (value !== undefined) {
      out[field.key] = value;
    } else if (field.presence === 'default' && field.defaultText !== undefined) {
      out[field.key] = defaultValue(field);
      defaulted.push(where);
    } else if (field.presence === 'required') {
      fail('spec.invalid', where, `required key is missing: ${field.doc}`);
    }
  }
  return out;
}

function readPreset(family: 'substrates' | 'fab', presets: Presets, name: string, where: string): string {
  const table = presets[family];
  if (Object.hasOwn(table, name)) {
    const text = table[name];
    if (typeof text === 'string') return text;
  }
  const known = Object.keys(table).sort();
  const hint = known.length === 0 ? 'no presets were given' : suggestion(name, known).replace('allowed:', 'known:');
  return fail('spec.invalid', where, `${shown(name)} is not a known ${family === 'fab' ? 'fab' : 'substrate'} preset; ${hint}`);
}

function presetValues(text: string, family: 'substrates' | 'fab', name: string): { values: Values; warnings: Diagnostic[] } {
  const source = `${family}/${name}`;
  const doc = readDocument(text, source);
  const fields = family === 'fab' ? FAB_PRESET_FIELDS : SUBSTRATE_PRESET_FIELDS;
  if (!isRecord(doc.data)) fail('spec.invalid', source, `preset is ${shown(doc.data)}, not a mapping of keys (${fields.map((f) => f.key).join(', ')})`);
  const schema = family === 'fab' ? fabPresetSchema : substratePresetSchema;
  const values = validate(schema, doc.data, doc, source, source, source);
  return { values, warnings: unknownKeys(doc.data, fields, source) };
}

const substrateOf = (v: Values, preset?: string): Substrate => ({
  ...(preset === undefined ? {} : { preset }),
  er: v.er as number,
  height: v.height as number,
  copper: v.copper as number,
  tanDelta: v.tan_delta as number,
  roughness: v.roughness as number,
  conductivity: v.conductivity as number,
});

const fabOf = (v: Values): FabRules => ({
  minTrace: v.min_trace as number,
  minSpace: v.min_space as number,
  viaDrill: v.via_drill as number,
  viaPad: v.via_pad as number,
  minAnnularRing: v.min_annular_ring as number,
  copperToEdge: v.copper_to_edge as number,
  viasPerStub: v.vias_per_stub as number,
});

/** A substrate preset file (templates/substrates/<name>.yaml) as a Substrate; absent keys take the spec defaults. */
export function parseSubstratePreset(text: string, name: string): Substrate {
  const { values } = presetValues(text, 'substrates', name);
  return substrateOf(fill(SUBSTRATE_FIELDS, values, {}, `substrates/${name}`, []), name);
}

/** A fabrication preset file (templates/fab/<name>.yaml) as FabRules; absent keys take the spec defaults. */
export function parseFabPreset(text: string, name: string): FabRules {
  const { values } = presetValues(text, 'fab', name);
  return fabOf(fill(FAB_FIELDS, values, {}, `fab/${name}`, []));
}

/** Parse and validate a spec file (YAML or JSON). Throws TunestripError with the first error. */
export function parseSpec(text: string, presets: Presets, sourceName = 'spec'): ParsedSpec {
  const doc = readDocument(text, sourceName);
  const data = doc.data;
  if (!isRecord(data)) {
    return fail(
      'spec.invalid',
      '(root)',
      data === null || data === undefined
        ? 'the spec is empty; it needs at least name, frequency, load and substrate'
        : `the spec is ${shown(data)}, not a mapping of keys (name, frequency, load, substrate, …)`,
    );
  }
  const diagnostics: Diagnostic[] = unknownKeys(data, SPEC_FIELDS);
  const misplaced = misplacedKey(data, SPEC_FIELDS);
  if (misplaced) {
    const [first] = misplaced.groups;
    const message = `belongs in ${misplaced.groups.map((g) => `${g}:`).join(' or ')}, as ${first}: { ${misplaced.key}: … }; where it stands it would be ignored`;
    withLine(doc, sourceName, () => fail('spec.invalid', misplaced.where, message));
  }
  const values = validate(specSchema, data, doc, sourceName, '(root)');
  diagnostics.push(...bareFrequencies(data));
  const spec = withLine(doc, sourceName, () => resolve(values, presets, diagnostics));
  return { spec, diagnostics };
}

/** A frequency written as a bare number below 1 MHz is read as Hz; say so, since "5.8" likely meant GHz. */
function bareFrequencies(data: Record<string, unknown>): Diagnostic[] {
  const sweep = isRecord(data.sweep) ? data.sweep : {};
  const candidates: [string, unknown][] = [['frequency', data.frequency], ['sweep.start', sweep.start], ['sweep.stop', sweep.stop]];
  return candidates
    .filter(([, v]) => typeof v === 'number' && v > 0 && v < 1e6)
    .map(([where, v]) => diagnostic('spec.bare-number', where, `${shown(v)} has no unit and is read as ${shown(v)} Hz; write e.g. "${shown(v)} GHz" if that was meant`));
}

function resolve(values: Values, presets: Presets, diagnostics: Diagnostic[]): Spec {
  const defaulted: string[] = [];
  for (const field of SPEC_FIELDS) {
    if (field.presence === 'required' && values[field.key] === undefined) {
      // A misspelt key was already found; name it, since it is the likely cause.
      const typo = diagnostics.find((d) => d.code === 'spec.unknown-key' && !d.where.includes('.') && closest(d.where, [field.key]) === field.key);
      const also = typo === undefined ? '' : `; is ${JSON.stringify(typo.where)} a typo for it?`;
      fail('spec.invalid', field.key, `required key is missing: ${field.doc} (${typeText(field.type)})${also}`);
    }
  }
  const group = (key: string): Values => (isRecord(values[key]) ? (values[key] as Values) : {});
  const top = (key: string): unknown => {
    const field = SPEC_FIELDS.find((f) => f.key === key);
    if (values[key] !== undefined || !field || field.type.kind === 'group' || field.defaultText === undefined) return values[key];
    defaulted.push(key);
    return defaultValue(field);
  };

  const frequency = values.frequency as number;
  const name = values.name as string;
  const load = values.load as Complex;
  const target = top('target') as Complex;
  const lineZ0 = top('line_z0') as number;
  let stubZ0 = values.stub_z0 as number | undefined;
  if (stubZ0 === undefined) {
    stubZ0 = lineZ0;
    defaulted.push('stub_z0');
  }
  const stub = top('stub') as StubChoice;
  const style = top('style') as StubStyle;
  const stubSide = top('stub_side') as 'left' | 'right';

  // A group's `preset:` names a file whose values the group's own keys override.
  const presetOf = (family: 'substrates' | 'fab', where: string, name: string | undefined): Values => {
    if (name === undefined) return {};
    const loaded = presetValues(readPreset(family, presets, name, where), family, name);
    diagnostics.push(...loaded.warnings);
    return loaded.values;
  };

  const substrateValues = group('substrate');
  const substratePresetName = substrateValues.preset as string | undefined;
  const substratePreset = presetOf('substrates', 'substrate.preset', substratePresetName);
  if (substratePresetName === undefined) {
    for (const key of ['er', 'height']) {
      if (substrateValues[key] === undefined) {
        const known = Object.keys(presets.substrates).sort();
        fail('spec.invalid', `substrate.${key}`, `required key is missing: give substrate.${key} or substrate.preset${known.length > 0 ? ` (known: ${known.join(', ')})` : ''}`);
      }
    }
  }
  const substrate = substrateOf(fill(SUBSTRATE_FIELDS, substrateValues, substratePreset, 'substrate', defaulted), substratePresetName);

  const fabValues = group('fab');
  const fabPreset = presetOf('fab', 'fab.preset', fabValues.preset as string | undefined);
  const fab = fabOf(fill(FAB_FIELDS, fabValues, fabPreset, 'fab', defaulted));
  if (!(fab.viaPad > fab.viaDrill)) {
    // A pad no larger than its hole leaves no copper around the via: not a design to check, an input to fix.
    fail('spec.invalid', fabValues.via_pad !== undefined || fabValues.via_drill === undefined ? 'fab.via_pad' : 'fab.via_drill', `via pad ${formatEngineering(fab.viaPad, 'm')} must be larger than the via drill ${formatEngineering(fab.viaDrill, 'm')}`);
  }

  const leadValues = fill(LEAD_FIELDS, group('leads'), {}, 'leads', defaulted);
  const leads = { load: leadValues.load as number, source: leadValues.source as number };

  const placeValues = fill(PLACE_FIELDS, group('place'), {}, 'place', defaulted);
  const place = { x: placeValues.x as number, y: placeValues.y as number, rotationDeg: placeValues.rotation_deg as number, mirror: placeValues.mirror as boolean };

  const tol = fill(TOLERANCE_FIELDS, group('tolerance'), {}, 'tolerance', defaulted);
  const tolerance = {
    width: tol.width as number,
    erFraction: tol.er_fraction as number,
    heightFraction: tol.height_fraction as number,
    copperFraction: tol.copper_fraction as number,
    runs: tol.runs as number,
    seed: tol.seed as number,
  };

  const area = values.area as Region | undefined;
  const keepouts = top('keepouts') as readonly Region[];
  const clearance = top('clearance') as number;

  const sweepValues = group('sweep');
  let start = sweepValues.start as number | undefined;
  let stop = sweepValues.stop as number | undefined;
  if (start === undefined) {
    start = 0.8 * frequency;
    defaulted.push('sweep.start');
  }
  if (stop === undefined) {
    stop = 1.2 * frequency;
    defaulted.push('sweep.stop');
  }
  const points = fill(SWEEP_FIELDS.filter((f) => f.key === 'points'), sweepValues, {}, 'sweep', defaulted).points as number;
  const f0 = formatEngineering(frequency, 'Hz');
  if (!(start < frequency)) fail('spec.invalid', 'sweep.start', `${formatEngineering(start, 'Hz')} must be below frequency (${f0})`);
  if (!(stop > frequency)) fail('spec.invalid', 'sweep.stop', `${formatEngineering(stop, 'Hz')} must be above frequency (${f0})`);

  return {
    name,
    frequency,
    load,
    target,
    lineZ0,
    stubZ0,
    stub,
    style,
    stubSide,
    substrate,
    fab,
    leads,
    place,
    ...(area === undefined ? {} : { area }),
    keepouts,
    clearance,
    sweep: { start, stop, points },
    tolerance,
    defaulted,
  };
}

/** Every key of a spec file with its type, default and documentation, for README and DEVELOPERS. */
export function listFields(): readonly { path: string; type: string; default?: string; doc: string }[] {
  const rows: { path: string; type: string; default?: string; doc: string }[] = [];
  const walk = (fields: readonly Field[], prefix: string): void => {
    for (const field of fields) {
      const path = prefix === '' ? field.key : `${prefix}.${field.key}`;
      if (field.type.kind === 'group') {
        rows.push({ path, type: 'mapping', doc: field.doc });
        walk(field.type.fields, path);
        continue;
      }
      const row: { path: string; type: string; default?: string; doc: string } = { path, type: typeText(field.type), doc: field.doc };
      if (field.defaultText !== undefined) row.default = field.defaultText;
      else if (field.presence === 'required') row.default = 'required';
      rows.push(row);
    }
  };
  walk(SPEC_FIELDS, '');
  return rows;
}
