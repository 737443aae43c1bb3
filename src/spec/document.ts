// Spec text → plain data, plus where each JSON path sits in the text. YAML 1.2 (so JSON too).
// Every problem with the text itself is one 'spec.syntax' or 'spec.too-large' error naming its line.
import YAML, { LineCounter, isMap, isPair, isScalar, isSeq, type Node } from 'yaml';
import { TunestripError, fail } from '../diagnostics.js';

export const MAX_SPEC_BYTES = 1024 * 1024;

export interface SpecDocument {
  readonly data: unknown;
  /** 1-based line of the key (or item) at a JSON path such as "substrate.height" or "area.x[0]". */
  readonly lines: ReadonlyMap<string, number>;
}

function utf8Length(text: string): number {
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff) {
      bytes += 4;
      i++;
    } else bytes += 3;
  }
  return bytes;
}

const lineOf = (text: string, index: number): number => {
  let line = 1;
  for (let i = 0; i < index; i++) if (text.charCodeAt(i) === 10) line++;
  return line;
};

/** Refuse text that is binary rather than YAML: NUL and other control bytes, or U+FFFD from bad UTF-8. */
function refuseBinary(text: string, source: string): void {
  const index = text.search(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f\ufffd]/);
  if (index < 0) return;
  const code = text.charCodeAt(index);
  const line = lineOf(text, index);
  const what =
    code === 0
      ? 'a NUL byte'
      : code === 0xfffd
        ? 'bytes that are not valid UTF-8 (U+FFFD)'
        : `the control character U+${code.toString(16).toUpperCase().padStart(4, '0')}`;
  fail('spec.syntax', `${source}:${line}`, `line ${line} contains ${what}; a spec is a UTF-8 YAML or JSON text file, this looks binary`);
}

const firstLine = (message: string): string => (message.split('\n')[0] ?? '').replace(/ at line \d+, column \d+:?$/, '').trim();

/** The parser's message in the spec's terms: no library advice, no stack-depth jargon. */
function parserMessage(message: string): string {
  const text = firstLine(message);
  if (/call stack/i.test(text)) return 'the text is nested too deeply to be a spec (lists or mappings inside each other)';
  if (/multiple documents/i.test(text)) return 'the file holds more than one YAML document (a second "---" line); a spec is a single document';
  return text;
}

/**
 * Keys must be plain text and unique in each mapping. Checked here in one linear walk rather than by
 * the parser's own uniqueKeys option, which compares every pair of keys: a 1 MiB file of short keys
 * would take minutes.
 */
function refuseOddKeys(node: unknown, counter: LineCounter, source: string): void {
  const where = (n: Node | null | undefined): string => {
    if (!n?.range) return source;
    const pos = counter.linePos(n.range[0]);
    return `${source}:${pos.line}:${pos.col}`;
  };
  if (isMap(node)) {
    const seen = new Map<string, Node>();
    for (const item of node.items) {
      if (!isPair(item)) continue;
      const keyNode = item.key as Node | null;
      if (keyNode !== null && !isScalar(keyNode)) fail('spec.syntax', where(keyNode), 'a key is a list or mapping; keys must be plain names such as frequency');
      const key = isScalar(keyNode) ? String(keyNode.value) : '';
      const first = seen.get(key);
      if (first !== undefined) {
        const line = first.range ? counter.linePos(first.range[0]).line : undefined;
        fail('spec.syntax', where(keyNode), `the key ${JSON.stringify(key.length > 40 ? `${key.slice(0, 37)}…` : key)} appears twice${line === undefined ? '' : ` (first at line ${line})`}; map keys must be unique`);
      }
      if (keyNode !== null) seen.set(key, keyNode);
      refuseOddKeys(item.value, counter, source);
    }
  } else if (isSeq(node)) {
    for (const item of node.items) refuseOddKeys(item, counter, source);
  }
}

function recordLines(node: unknown, path: string, counter: LineCounter, lines: Map<string, number>): void {
  const at = (n: Node | null | undefined): number | undefined => (n?.range ? counter.linePos(n.range[0]).line : undefined);
  if (isMap(node)) {
    for (const item of node.items) {
      if (!isPair(item)) continue;
      const keyNode = item.key;
      const key = isScalar(keyNode) ? String(keyNode.value) : undefined;
      if (key === undefined) continue;
      const child = path === '' ? key : `${path}.${key}`;
      const line = at(isScalar(keyNode) ? keyNode : undefined) ?? at(item.value as Node | null);
      if (line !== undefined && !lines.has(child)) lines.set(child, line);
      recordLines(item.value, child, counter, lines);
    }
  } else if (isSeq(node)) {
    node.items.forEach((item, i) => {
      const child = `${path}[${i}]`;
      const line = at(item as Node | null);
      if (line !== undefined) lines.set(child, line);
      recordLines(item, child, counter, lines);
    });
  }
}

/** Parse spec text; throws TunestripError for text that is too large, binary or not YAML/JSON. */
export function readDocument(text: string, source: string): SpecDocument {
  if (text.length > MAX_SPEC_BYTES || (text.length > MAX_SPEC_BYTES / 4 && utf8Length(text) > MAX_SPEC_BYTES)) {
    fail('spec.too-large', source, `is larger than 1 MiB (${MAX_SPEC_BYTES} bytes); a spec is a short text file`);
  }
  const body = text.startsWith('\ufeff') ? text.slice(1) : text;
  refuseBinary(body, source);
  const counter = new LineCounter();
  // logLevel 'error': the parser must not print warnings of its own (the CLI owns stderr).
  const doc = YAML.parseDocument(body, { lineCounter: counter, prettyErrors: false, uniqueKeys: false, strict: true, logLevel: 'error' });
  const error = doc.errors[0];
  if (error) {
    const pos = counter.linePos(error.pos[0]);
    const message = parserMessage(error.message);
    fail('spec.syntax', `${source}:${pos.line}:${pos.col}`, message === firstLine(error.message) ? `not valid YAML or JSON: ${message}` : message);
  }
  let data: unknown;
  const lines = new Map<string, number>();
  try {
    refuseOddKeys(doc.contents, counter, source);
    data = doc.toJS({ maxAliasCount: 100 });
    recordLines(doc.contents, '', counter, lines);
  } catch (cause) {
    if (cause instanceof TunestripError) throw cause;
    // Unresolved or runaway aliases surface only when the document is turned into data.
    const message = cause instanceof Error ? parserMessage(cause.message) : 'cannot be read';
    fail('spec.syntax', source, `${message}`);
  }
  return { data, lines };
}

/** The line of a JSON path, or of its nearest ancestor that is in the text. */
export function lineAt(lines: ReadonlyMap<string, number>, where: string): number | undefined {
  let path = where;
  for (;;) {
    const line = lines.get(path);
    if (line !== undefined) return line;
    const cut = Math.max(path.lastIndexOf('.'), path.lastIndexOf('['));
    if (cut <= 0) return undefined;
    path = path.slice(0, cut);
  }
}
