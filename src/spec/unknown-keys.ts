// Keys the field table does not know: a warning each, with the nearest known key suggested.
import { diagnostic, type Diagnostic } from '../diagnostics.js';
import { REGION_KEYS, type Field } from './fields.js';
import { suggestion } from './suggest.js';

const isRecord = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object' && !Array.isArray(v);
const join = (prefix: string, key: string): string => (prefix === '' ? key : `${prefix}.${key}`);

function regionKeys(value: unknown, where: string, out: Diagnostic[]): void {
  if (!isRecord(value)) return;
  for (const key of Object.keys(value)) {
    if (!REGION_KEYS.includes(key)) {
      out.push(diagnostic('spec.unknown-key', join(where, key), `unknown key ${JSON.stringify(key)} is ignored; ${suggestion(key, REGION_KEYS)}`));
    }
  }
}

/** A file with more unknown keys than this is not a misspelt spec; the rest are counted in one warning. */
export const MAX_UNKNOWN_KEY_WARNINGS = 50;

/** Warnings for every key not in `fields`, walking groups and regions; at most MAX_UNKNOWN_KEY_WARNINGS and a count. Never throws. */
export function unknownKeys(value: unknown, fields: readonly Field[], prefix = ''): Diagnostic[] {
  const all = unknownKeysIn(value, fields, prefix, { left: MAX_UNKNOWN_KEY_WARNINGS });
  if (all.length <= MAX_UNKNOWN_KEY_WARNINGS) return all;
  const rest = all.length - MAX_UNKNOWN_KEY_WARNINGS;
  const kept = all.slice(0, MAX_UNKNOWN_KEY_WARNINGS);
  const last = all[all.length - 1];
  return [...kept, diagnostic('spec.unknown-key', last?.where ?? prefix, `${rest} more unknown keys are ignored`)];
}

function unknownKeysIn(value: unknown, fields: readonly Field[], prefix: string, budget: { left: number }): Diagnostic[] {
  const out: Diagnostic[] = [];
  if (!isRecord(value)) return out;
  const known = fields.map((f) => f.key);
  for (const key of Object.keys(value)) {
    const where = join(prefix, key);
    const field = fields.find((f) => f.key === key);
    if (!field) {
      const shownKey = JSON.stringify(key.length > 40 ? `${key.slice(0, 37)}…` : key);
      // Past the budget only the count is reported, so no suggestion is worked out.
      out.push(diagnostic('spec.unknown-key', where, budget.left-- > 0 ? `unknown key ${shownKey} is ignored; ${suggestion(key, known)}` : ''));
      continue;
    }
    const child = value[key];
    if (field.type.kind === 'group') out.push(...unknownKeysIn(child, field.type.fields, where, budget));
    else if (field.type.kind === 'region') regionKeys(child, where, out);
    else if (field.type.kind === 'regions' && Array.isArray(child)) child.forEach((r, i) => regionKeys(r, `${where}[${i}]`, out));
  }
  return out;
}
