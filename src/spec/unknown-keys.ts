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

/**
 * A key at the wrong level that a group field knows (e.g. `via_drill` at the top level, meant for
 * `fab:`): where it was found and the group(s) it belongs in. Such a key is an error, not an
 * ignored key: the user meant a setting, and ignoring it would draw copper to other rules.
 * `preset` and `note` are left out: they belong in several groups and say nothing alone.
 */
export function misplacedKey(value: unknown, fields: readonly Field[], prefix = ''): { readonly where: string; readonly key: string; readonly groups: readonly string[] } | undefined {
  if (!isRecord(value)) return undefined;
  const groups = fields.filter((f) => f.type.kind === 'group');
  for (const key of Object.keys(value)) {
    const field = fields.find((f) => f.key === key);
    if (field?.type.kind === 'group') {
      const inner = misplacedKeyInGroup(value[key], field, groups, join(prefix, key));
      if (inner) return inner;
      continue;
    }
    if (field || key === 'preset' || key === 'note') continue;
    const owners = groups.filter((g) => g.type.kind === 'group' && g.type.fields.some((f) => f.key === key)).map((g) => g.key);
    if (owners.length > 0) return { where: join(prefix, key), key, groups: owners };
  }
  return undefined;
}

function misplacedKeyInGroup(value: unknown, group: Field, groups: readonly Field[], where: string) {
  if (!isRecord(value) || group.type.kind !== 'group') return undefined;
  const own = group.type.fields;
  for (const key of Object.keys(value)) {
    if (own.some((f) => f.key === key) || key === 'preset' || key === 'note') continue;
    const owners = groups.filter((g) => g !== group && g.type.kind === 'group' && g.type.fields.some((f) => f.key === key)).map((g) => g.key);
    if (owners.length > 0) return { where: join(where, key), key, groups: owners };
  }
  return undefined;
}
