// The zod schema of a spec file, built from the field table. Each leaf converts engineering text to
// SI (through src/units.ts) and checks its bounds; each problem becomes one zod issue whose message is
// a single line and whose path is the field's JSON path.
import * as z from 'zod';
import YAML from 'yaml';
import { TunestripError, fail } from '../diagnostics.js';
import { parseImpedance, parseQuantity, shown } from '../units.js';
import { FAB_PRESET_FIELDS, SPEC_FIELDS, SUBSTRATE_PRESET_FIELDS, type Bounds, type Field, type FieldType } from './fields.js';
import { parseRegion, parseRegions } from './regions.js';
import { suggestion } from './suggest.js';

const NAME_RE = /^[A-Za-z0-9_-][A-Za-z0-9._-]*$/;
export const MAX_NAME_LENGTH = 64;

function checkName(value: unknown, where: string): string {
  if (typeof value !== 'string') return fail('spec.invalid', where, `${shown(value)} is not a name; quote it if it is a number, e.g. "lna-input"`);
  if (value === '') return fail('spec.invalid', where, 'is empty; give a folder name such as lna-input');
  if (/[/\\]/.test(value) || /^[A-Za-z]:/.test(value)) {
    return fail('spec.invalid', where, `${shown(value)} is a path; the name must be a plain folder name (letters, digits, . _ -)`);
  }
  if (value.startsWith('.')) return fail('spec.invalid', where, `${shown(value)} starts with a dot; the name must not be hidden or a relative path`);
  if (value.length > MAX_NAME_LENGTH) return fail('spec.invalid', where, `is ${value.length} characters long; at most ${MAX_NAME_LENGTH} allowed`);
  if (!NAME_RE.test(value)) return fail('spec.invalid', where, `${shown(value)} has characters other than letters, digits, dot, underscore and hyphen`);
  return value;
}

export function checkBounds(value: number, bounds: Bounds, original: unknown, where: string): number {
  const { min, max } = bounds;
  if (min !== undefined && (bounds.minExclusive ? !(value > min) : !(value >= min))) {
    fail('spec.invalid', where, `${shown(original)} must be ${bounds.minExclusive ? 'greater than' : 'at least'} ${min}`);
  }
  if (max !== undefined && (bounds.maxExclusive ? !(value < max) : !(value <= max))) {
    fail('spec.invalid', where, `${shown(original)} must be ${bounds.maxExclusive ? 'less than' : 'at most'} ${max}`);
  }
  return value;
}

function checkInteger(value: unknown, min: number, max: number, where: string): number {
  const n = typeof value === 'number' ? value : typeof value === 'string' && /^\s*\d+\s*$/.test(value) ? Number(value) : Number.NaN;
  if (!Number.isInteger(n) || n < min || n > max) {
    return fail('spec.invalid', where, `${shown(value)} is not allowed; use a whole number from ${min} to ${max}`);
  }
  return n;
}

function checkEnum(value: unknown, values: readonly string[], where: string): string {
  if (typeof value === 'string' && values.includes(value)) return value;
  const hint = typeof value === 'string' ? suggestion(value, values) : `allowed: ${values.join(', ')}`;
  return fail('spec.invalid', where, `${shown(value)} is not allowed; ${hint.startsWith('did') ? `${hint} (allowed: ${values.join(', ')})` : hint}`);
}

/** Convert one present, non-group value to its Spec form; throws TunestripError. */
export function convertValue(type: Exclude<FieldType, { kind: 'group' }>, value: unknown, where: string): unknown {
  if (value === null) return fail('spec.invalid', where, 'has no value; give one or remove the key');
  switch (type.kind) {
    case 'name':
      return checkName(value, where);
    case 'preset':
      if (typeof value !== 'string' || value.trim() === '') return fail('spec.invalid', where, `${shown(value)} is not a preset name`);
      return value;
    case 'note':
      if (typeof value !== 'string') return fail('spec.invalid', where, `${shown(value)} is not text`);
      return value;
    case 'quantity':
      return checkBounds(parseQuantity(value, type.dimension, where), type.bounds, value, where);
    case 'impedance':
      return parseImpedance(value, where);
    case 'enum':
      return checkEnum(value, type.values, where);
    case 'integer':
      return checkInteger(value, type.min, type.max, where);
    case 'boolean':
      if (typeof value !== 'boolean') return fail('spec.invalid', where, `${shown(value)} is not allowed; use true or false`);
      return value;
    case 'region':
      return parseRegion(value, where);
    case 'regions':
      return parseRegions(value, where);
  }
}

function readDefault(field: Field, where: string): unknown {
  if (field.type.kind === 'group' || field.defaultText === undefined || field.presence !== 'default') return undefined;
  return convertValue(field.type, YAML.parse(field.defaultText) as unknown, where);
}

// Every default, read once from its table text exactly as the same text in a spec file would be
// (so a wrong default in the table fails at load, not in a user's run).
const DEFAULTS: ReadonlyMap<Field, unknown> = new Map(
  (function* all(fields: readonly Field[], prefix: string): Generator<[Field, unknown]> {
    for (const field of fields) {
      const where = prefix === '' ? field.key : `${prefix}.${field.key}`;
      if (field.type.kind === 'group') yield* all(field.type.fields, where);
      else yield [field, readDefault(field, where)];
    }
  })([...SPEC_FIELDS, ...SUBSTRATE_PRESET_FIELDS, ...FAB_PRESET_FIELDS], ''),
);

/** A field's default value in Spec form (undefined when it has none). */
export const defaultValue = (field: Field): unknown => DEFAULTS.get(field);

const joinPath = (prefix: string, key: string): string => (prefix === '' ? key : `${prefix}.${key}`);

function leafSchema(type: Exclude<FieldType, { kind: 'group' }>, where: string): z.ZodType<unknown> {
  return z.unknown().transform((value, ctx) => {
    if (value === undefined) return undefined;
    try {
      return convertValue(type, value, where);
    } catch (error) {
      if (!(error instanceof TunestripError)) throw error;
      ctx.addIssue({ code: 'custom', message: error.diagnostic.message, params: { where: error.diagnostic.where } });
      return z.NEVER;
    }
  }).optional();
}

/** A mapping of the given fields; unknown keys pass through (they are warned about elsewhere). */
export function groupSchema(fields: readonly Field[], prefix: string): z.ZodType<Record<string, unknown>> {
  const shape: Record<string, z.ZodType<unknown>> = {};
  for (const field of fields) {
    const where = joinPath(prefix, field.key);
    shape[field.key] = field.type.kind === 'group' ? groupSchema(field.type.fields, where).optional() : leafSchema(field.type, where);
  }
  return z.looseObject(shape, {
    error: (issue) => ({
      message: issue.input === null ? 'has no value; give a mapping of keys or remove the key' : `${shown(issue.input)} is not a mapping of keys (${fields.map((f) => f.key).join(', ')})`,
    }),
  });
}

export const specSchema = groupSchema(SPEC_FIELDS, '');
/** Schemas of preset files; their paths are relative to the preset, e.g. "er". */
export const substratePresetSchema = groupSchema(SUBSTRATE_PRESET_FIELDS, '');
export const fabPresetSchema = groupSchema(FAB_PRESET_FIELDS, '');

/** Where a zod issue points: our own `where` if we set one, else its path as text. */
export function issueWhere(issue: z.core.$ZodIssue, fallback: string): string {
  const params = (issue as { params?: { where?: unknown } }).params;
  if (params && typeof params.where === 'string') return params.where;
  const text = issue.path
    .map((p, i) => (typeof p === 'number' ? `[${p}]` : i === 0 ? String(p) : `.${String(p)}`))
    .join('');
  return text === '' ? fallback : text;
}
