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

/** Warnings for every key not in `fields`, walking groups and regions. Never throws. */
export function unknownKeys(value: unknown, fields: readonly Field[], prefix = ''): Diagnostic[] {
  const out: Diagnostic[] = [];
  if (!isRecord(value)) return out;
  const known = fields.map((f) => f.key);
  for (const key of Object.keys(value)) {
    const where = join(prefix, key);
    const field = fields.find((f) => f.key === key);
    if (!field) {
      const shownKey = JSON.stringify(key.length > 40 ? `${key.slice(0, 37)}…` : key);
      out.push(diagnostic('spec.unknown-key', where, `unknown key ${shownKey} is ignored; ${suggestion(key, known)}`));
      continue;
    }
    const child = value[key];
    if (field.type.kind === 'group') out.push(...unknownKeys(child, field.type.fields, where));
    else if (field.type.kind === 'region') regionKeys(child, where, out);
    else if (field.type.kind === 'regions' && Array.isArray(child)) child.forEach((r, i) => regionKeys(r, `${where}[${i}]`, out));
  }
  return out;
}
