// Every bad input the CLI reads gets one clear line naming the field (JSON path or file:line), the
// right exit code (2 input or usage error, 1 design failure) and no files; never a stack trace
// unless --debug. The corpus in test/fixtures/bad-inputs/ holds one spec file per case beside
// <case>.expect.json {"exit", "stderr_contains", "where"}. The exit-code convention is the
// project's own (README "Exit codes"); the cases are this project's own scenarios.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import type { Io } from '../../src/cli/io.js';
import { captureIo } from '../helpers/captureIo.js';

const root = resolve(import.meta.dirname, '..', '..');
const corpus = join(root, 'test', 'fixtures', 'bad-inputs');
const scratch = mkdtempSync(join(tmpdir(), 'tunestrip-bad-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

interface Expectation {
  readonly exit: 1 | 2;
  readonly stderr_contains: string;
  readonly where: string;
}

interface Run {
  readonly code: number;
  readonly stderr: string;
  readonly stdout: string;
}

function runIn(cwd: string, argv: string[], io?: Io): Run {
  const cap = captureIo(cwd);
  const code = main(argv, io ?? cap.io, '0.0.0-test');
  return { code, stderr: cap.err.join(''), stdout: cap.out.join('') };
}

const STACK_LINE = /^\s+at .+(:\d+:\d+\)?|\(native\))$/m;

/** The error lines of a run: each `tunestrip: …` line (warnings start with `warning:`). */
const errorLines = (stderr: string): string[] => stderr.split('\n').filter((l) => l.startsWith('tunestrip: '));

function expectCleanFailure(r: Run): void {
  expect(r.stderr).not.toMatch(STACK_LINE);
  expect(r.stderr).not.toContain('internal error');
  expect(r.stderr.endsWith('\n')).toBe(true);
  expect(errorLines(r.stderr).length).toBeGreaterThanOrEqual(1);
}

const specFiles = readdirSync(corpus)
  .filter((f) => !f.endsWith('.expect.json') && !f.endsWith('.md'))
  .sort();
const caseName = (file: string): string => file.replace(/\.(ya?ml|json)$/, '');

describe('bad-input corpus (in-process main)', () => {
  it('pairs every spec file with an expectation, and covers input errors and design failures', () => {
    const expectations = readdirSync(corpus).filter((f) => f.endsWith('.expect.json')).map((f) => f.replace(/\.expect\.json$/, '')).sort();
    expect(specFiles.map(caseName)).toEqual(expectations);
    expect(specFiles.length).toBeGreaterThanOrEqual(80);
    const exits = expectations.map((n) => (JSON.parse(readFileSync(join(corpus, `${n}.expect.json`), 'utf8')) as Expectation).exit);
    expect(exits.filter((e) => e === 1).length).toBeGreaterThanOrEqual(8);
    expect(exits.filter((e) => e === 2).length).toBeGreaterThanOrEqual(60);
  });

  it.each(specFiles)('%s', (file) => {
    const expected = JSON.parse(readFileSync(join(corpus, `${caseName(file)}.expect.json`), 'utf8')) as Expectation;
    const out = join(scratch, caseName(file));
    const before = readdirSync(corpus);
    const r = runIn(corpus, ['design', file, '--out', out]);
    expect(r.code, r.stderr).toBe(expected.exit);
    expectCleanFailure(r);
    // The first error line names the field or the file position, then says what is wrong.
    const named = errorLines(r.stderr).find((l) => l.startsWith(`tunestrip: ${expected.where}`));
    expect(named, r.stderr).toBeDefined();
    expect(named).toContain(expected.stderr_contains);
    // Nothing written: not the chosen folder, not out/<name> beside the spec.
    expect(existsSync(out)).toBe(false);
    expect(readdirSync(corpus)).toEqual(before);
    expect(r.stdout).toBe('');
  });
});

describe('bad input outside the corpus', () => {
  const minimal = 'name: ok-case\nfrequency: 2.45 GHz\nload: 30-j25\nsubstrate: { preset: ptfe-glass-0.79 }\n';
  const specAt = (name: string, text: string | Buffer): string => {
    const path = join(scratch, name);
    writeFileSync(path, text);
    return path;
  };

  it('refuses a file over 1 MiB before parsing it', () => {
    const path = specAt('huge.yaml', `${minimal}note: ${'x'.repeat(1024 * 1024)}\n`);
    const r = runIn(scratch, ['design', path, '--out', join(scratch, 'huge-out')]);
    expect(r.code).toBe(2);
    expectCleanFailure(r);
    expect(errorLines(r.stderr)).toHaveLength(1);
    expect(r.stderr).toContain('limited to 1048576 bytes');
    expect(existsSync(join(scratch, 'huge-out'))).toBe(false);
  });

  it('caps the unknown-key warnings of a file full of them', () => {
    const keys = Array.from({ length: 500 }, (_, i) => `extra_${i}: 1`).join('\n');
    const path = specAt('many-keys.yaml', `${minimal}${keys}\n`);
    const r = runIn(scratch, ['design', path, '--out', join(scratch, 'many-keys-out')]);
    expect(r.code, r.stderr).toBe(0);
    const warnings = r.stderr.split('\n').filter((l) => l.startsWith('warning:'));
    expect(warnings).toHaveLength(51);
    expect(warnings[50]).toBe('warning: extra_499: 450 more unknown keys are ignored');
  });

  it('names a missing file, a folder and a device instead of reading them', () => {
    for (const [arg, text] of [
      [join(scratch, 'nowhere.yaml'), 'no such file'],
      [scratch, 'not a regular file (it is a folder)'],
      ['/dev/zero', 'not a regular file'],
    ] as const) {
      if (arg === '/dev/zero' && !existsSync(arg)) continue;
      const r = runIn(scratch, ['design', arg]);
      expect(r.code, arg).toBe(2);
      expectCleanFailure(r);
      expect(errorLines(r.stderr)).toEqual([expect.stringContaining(text)]);
    }
  });

  it('warns about an unknown key with a suggestion and still designs', () => {
    const path = specAt('typo.yaml', `${minimal}stub_sid: right\n`);
    const r = runIn(scratch, ['design', path, '--out', join(scratch, 'typo-out')]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stderr).toContain('warning: stub_sid: unknown key "stub_sid" is ignored; did you mean stub_side?');
    expect(existsSync(join(scratch, 'typo-out', 'design.json'))).toBe(true);
  });

  it('says so when a typo hides a required key', () => {
    const path = specAt('typo-required.yaml', minimal.replace('frequency:', 'frequncy:'));
    const r = runIn(scratch, ['design', path, '--out', join(scratch, 'typo-required-out')]);
    expect(r.code).toBe(2);
    expect(errorLines(r.stderr)).toEqual([expect.stringMatching(/^tunestrip: frequency: required key is missing.*"frequncy" a typo/)]);
  });

  it('warns when a line leaves the dispersion model\'s validity range, and still designs', () => {
    // Jansen & Kirschning (1983) Z0(f) is stated for 0.1 ≤ w/h ≤ 10 (physics.md §2.2 [M]); a 12 Ω stub
    // on a 0.787 mm, εr 2.2 board is about 18 h wide.
    const path = specAt('wide-stub.yaml', `${minimal}stub_z0: 12\n`);
    const r = runIn(scratch, ['design', path, '--out', join(scratch, 'wide-out')]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stderr).toMatch(/^warning: stub_z0: w\/h = [\d.]+ is outside 0\.1–10 \(Jansen–Kirschning 1983/m);
    expect(r.stderr).not.toMatch(STACK_LINE);
  });

  it('gives usage errors exit 2 and one line', () => {
    for (const argv of [
      ['design'],
      ['frobnicate'],
      ['design', 'x.yaml', '--no-such-option'],
      ['solve'],
      ['solve', '--load', 'abc'],
      ['solve', '--load', '30-j25', '--target', '50+j'],
      ['solve', '--load', '30-j25', '--style', 'triple'],
      ['line', '--er', 'x', '--height', '1mm', '--freq', '1GHz', '--z0', '50'],
      ['line', '--er', '4', '--height', '1', '--freq', '1GHz', '--z0', '50'],
      ['line', '--er', '4', '--height=-1mm', '--freq', '1GHz', '--z0', '50'],
      ['line', '--er', '4', '--height', '1mm', '--freq', '0Hz', '--z0', '50'],
      ['line', '--er', '4', '--height', '1mm', '--freq', '1GHz', '--z0', '50', '--width', '1mm'],
      ['line', '--er', '4', '--height', '1mm', '--freq', '1GHz', '--z0', '1e9'],
      ['line', '--er', '4', '--height', '1mm', '--freq', '1GHz', '--width', '0mm'],
    ]) {
      const r = runIn(scratch, argv);
      expect(r.code, argv.join(' ')).toBe(2);
      expectCleanFailure(r);
      expect(errorLines(r.stderr), argv.join(' ')).toHaveLength(1);
    }
  });

  it('gives an impossible match exit 1 and one line', () => {
    for (const argv of [
      ['solve', '--load', '0-j40'],
      ['solve', '--load=-10+j5'],
      ['solve', '--load', '45', '--target', '5'],
    ]) {
      const r = runIn(scratch, argv);
      expect(r.code, argv.join(' ')).toBe(1);
      expectCleanFailure(r);
      expect(errorLines(r.stderr)).toHaveLength(1);
    }
  });

  it('prints an internal error as one line, with the stack only under --debug', () => {
    const path = specAt('internal.yaml', minimal);
    const broken = (): Io => {
      const cap = captureIo(scratch);
      return { ...cap.io, readPresets: () => { throw new TypeError('presets exploded'); } };
    };
    const plain = captureIo(scratch);
    const code = main(['design', path], { ...broken(), stderr: plain.io.stderr, stdout: plain.io.stdout }, 't');
    expect(code).toBe(1);
    expect(plain.err.join('')).toBe('tunestrip: internal error: presets exploded (run with --debug for details)\n');
    const debug = captureIo(scratch);
    expect(main(['design', path, '--debug'], { ...broken(), stderr: debug.io.stderr, stdout: debug.io.stdout }, 't')).toBe(1);
    expect(debug.err.join('')).toMatch(STACK_LINE);
  });
});

describe('bad input through the built command', () => {
  const bin = join(root, 'dist', 'cli', 'bin.js');
  const has = existsSync(bin);
  if (!has) console.warn('skip: dist/cli/bin.js is missing (npm run build)');
  it.skipIf(!has)('binary garbage: one line, right code, nothing written', () => {
    for (const file of ['binary-random.yaml']) {
      const expected = JSON.parse(readFileSync(join(corpus, `${caseName(file)}.expect.json`), 'utf8')) as Expectation;
      const cwd = mkdtempSync(join(scratch, 'child-'));
      const r = spawnSync(process.execPath, [bin, 'design', join(corpus, file)], { cwd, encoding: 'utf8' });
      expect(r.status, r.stderr).toBe(expected.exit);
      expect(r.stderr).not.toMatch(STACK_LINE);
      expect(errorLines(r.stderr)[0]).toContain(expected.stderr_contains);
      expect(readdirSync(cwd)).toEqual([]);
    }
  });
});
