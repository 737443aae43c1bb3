// Safe file output: temporary name + rename (a crash leaves the old file or the new one, never a
// partial one), writing only inside the chosen folder, refusing a folder tunestrip did not make
// without --force, and the same bytes for the same spec whatever the order of runs. The rules are the
// project's own (README "Commands" and "Output files"); the crash uses the hook
// TUNESTRIP_TEST_CRASH_AFTER_TEMP_FILES in src/cli/io.ts, which SIGKILLs the process.
import { spawnSync } from 'node:child_process';
import { chmodSync, existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { IoError, MARKER, writeOutputsAtomically } from '../../src/cli/io.js';
import { main } from '../../src/cli/main.js';
import type { Artifact } from '../../src/seams.js';
import { captureIo } from '../helpers/captureIo.js';
import { errorOf } from '../helpers/errors.js';

const root = resolve(import.meta.dirname, '..', '..');
const version = (JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { version: string }).version;
const scratch = mkdtempSync(join(tmpdir(), 'tunestrip-safe-'));
afterAll(() => {
  chmodRecursive(scratch);
  rmSync(scratch, { recursive: true, force: true });
});
function chmodRecursive(dir: string): void {
  try {
    chmodSync(dir, 0o755);
    for (const e of readdirSync(dir, { withFileTypes: true })) if (e.isDirectory()) chmodRecursive(join(dir, e.name));
  } catch {
    // best effort clean-up
  }
}

let counter = 0;
const fresh = (label: string): string => join(scratch, `${label}-${++counter}`);
const artifact = (path: string, text: string): Artifact => ({ path, mediaType: 'text/plain', text });

/** Every file in a folder with its bytes, sorted by name. */
const snapshot = (dir: string): Record<string, string> =>
  Object.fromEntries(readdirSync(dir).sort().map((f) => [f, readFileSync(join(dir, f), 'latin1')]));
const visible = (dir: string): string[] => readdirSync(dir).filter((f) => !f.startsWith('.')).sort();
const temps = (dir: string): string[] => readdirSync(dir).filter((f) => /\.tmp-\d+$/.test(f));

const ioErrorOf = (run: () => unknown): IoError => errorOf(run, IoError);

describe('writeOutputsAtomically', () => {
  it('writes every file and a marker listing them, and leaves no temporary file', () => {
    const dir = fresh('new');
    const written = writeOutputsAtomically(dir, [artifact('a.txt', 'alpha'), artifact('b.txt', 'beta')], { force: false });
    expect(written).toEqual([join(dir, 'a.txt'), join(dir, 'b.txt')]);
    expect(snapshot(dir)).toEqual({ [MARKER]: 'a.txt\nb.txt\n', 'a.txt': 'alpha', 'b.txt': 'beta' });
  });

  it('on a rerun replaces its files, removes the ones it no longer writes and keeps the user\'s', () => {
    const dir = fresh('rerun');
    writeOutputsAtomically(dir, [artifact('a.txt', 'old a'), artifact('stale.txt', 'old')], { force: false });
    writeFileSync(join(dir, 'notes-by-user.txt'), 'mine');
    writeOutputsAtomically(dir, [artifact('a.txt', 'new a'), artifact('c.txt', 'new c')], { force: false });
    expect(snapshot(dir)).toEqual({ [MARKER]: 'a.txt\nc.txt\n', 'a.txt': 'new a', 'c.txt': 'new c', 'notes-by-user.txt': 'mine' });
  });

  it('refuses a folder it did not make unless forced, and then keeps what was there', () => {
    const dir = fresh('foreign');
    mkdirSync(dir);
    writeFileSync(join(dir, 'precious.txt'), 'keep me');
    const e = ioErrorOf(() => writeOutputsAtomically(dir, [artifact('a.txt', 'x')], { force: false }));
    expect(e.exitCode).toBe(2);
    expect(e.message).toContain('was not made by tunestrip');
    expect(snapshot(dir)).toEqual({ 'precious.txt': 'keep me' });
    writeOutputsAtomically(dir, [artifact('precious-not.txt', 'x')], { force: true });
    expect(snapshot(dir)).toEqual({ [MARKER]: 'precious-not.txt\n', 'precious-not.txt': 'x', 'precious.txt': 'keep me' });
  });

  it('accepts an existing empty folder without --force', () => {
    const dir = fresh('empty');
    mkdirSync(dir);
    writeOutputsAtomically(dir, [artifact('a.txt', 'x')], { force: false });
    expect(visible(dir)).toEqual(['a.txt']);
  });

  it('writes only plain names inside the folder', () => {
    const outside = fresh('outside');
    for (const path of ['../escape.txt', '../../escape.txt', '/tmp/escape.txt', 'sub/dir.txt', '.hidden', '', 'a b.txt', 'semi;colon', 'nul\0.txt', MARKER, 'ok.txt\n../x']) {
      const dir = join(outside, 'out');
      const e = ioErrorOf(() => writeOutputsAtomically(dir, [artifact('fine.txt', 'x'), artifact(path, 'escaped')], { force: true }));
      expect(e.exitCode, JSON.stringify(path)).toBe(1);
      expect(existsSync(outside), JSON.stringify(path)).toBe(false);
    }
    const dir = fresh('duplicate');
    expect(ioErrorOf(() => writeOutputsAtomically(dir, [artifact('a.txt', '1'), artifact('a.txt', '2')], { force: false })).exitCode).toBe(1);
    expect(existsSync(dir)).toBe(false);
  });

  it('ignores marker lines that are not plain names, so a rerun deletes nothing outside', () => {
    const parent = fresh('marker');
    const dir = join(parent, 'out');
    writeOutputsAtomically(dir, [artifact('a.txt', 'x')], { force: false });
    writeFileSync(join(parent, 'victim.txt'), 'safe');
    writeFileSync(join(dir, MARKER), `a.txt\n../victim.txt\n${join(parent, 'victim.txt')}\n`);
    writeOutputsAtomically(dir, [artifact('b.txt', 'y')], { force: false });
    expect(readFileSync(join(parent, 'victim.txt'), 'utf8')).toBe('safe');
    expect(visible(dir)).toEqual(['b.txt']);
  });

  it('clears temporary files a killed run left in its own folder', () => {
    const dir = fresh('leftover');
    writeOutputsAtomically(dir, [artifact('a.txt', 'x')], { force: false });
    writeFileSync(join(dir, '.a.txt.tmp-99999'), 'half');
    writeOutputsAtomically(dir, [artifact('a.txt', 'y')], { force: false });
    expect(temps(dir)).toEqual([]);
    expect(readFileSync(join(dir, 'a.txt'), 'utf8')).toBe('y');
  });

  it('gives one-line errors for a file in the way and an unwritable place', () => {
    const file = fresh('file');
    writeFileSync(file, 'not a folder');
    const e = ioErrorOf(() => writeOutputsAtomically(file, [artifact('a.txt', 'x')], { force: true }));
    expect(e.message).toContain('is not a folder');
    const below = ioErrorOf(() => writeOutputsAtomically(join(file, 'sub'), [artifact('a.txt', 'x')], { force: true }));
    expect(below.exitCode).toBe(2);
    expect(below.message).toMatch(/^cannot write into .*\(a part of the path is not a folder\)$/);
    expect(readFileSync(file, 'utf8')).toBe('not a folder');
    const runsAsRoot = typeof process.getuid === 'function' && process.getuid() === 0;
    if (runsAsRoot) console.warn('skip: permission check (root ignores file modes)');
    else {
      const locked = fresh('locked');
      mkdirSync(locked);
      chmodSync(locked, 0o555);
      const denied = ioErrorOf(() => writeOutputsAtomically(join(locked, 'out'), [artifact('a.txt', 'x')], { force: false }));
      expect(denied.message).toContain('permission denied');
    }
  });
});

describe('design output through main()', () => {
  const example = (name: string): string => join(root, 'templates', 'examples', `${name}.yaml`);

  function design(specPath: string, out: string | undefined, cwd = scratch, extra: string[] = []): { code: number; stderr: string } {
    const cap = captureIo(cwd);
    const argv = ['design', specPath, ...(out === undefined ? [] : ['--out', out]), ...extra];
    return { code: main(argv, cap.io, version), stderr: cap.err.join('') };
  }

  it('writes into out/<name> under the working folder and nowhere else', () => {
    const cwd = fresh('cwd');
    mkdirSync(cwd);
    const r = design(example('sensor-915'), undefined, cwd);
    expect(r.code, r.stderr).toBe(0);
    expect(readdirSync(cwd)).toEqual(['out']);
    expect(readdirSync(join(cwd, 'out'))).toEqual(['sensor-915']);
    expect(visible(join(cwd, 'out', 'sensor-915'))).toContain('design.json');
    expect(temps(join(cwd, 'out', 'sensor-915'))).toEqual([]);
  });

  it('refuses a folder it did not make, exit 2, and with --force keeps the foreign file', () => {
    const dir = fresh('foreign-design');
    mkdirSync(dir);
    writeFileSync(join(dir, 'precious.txt'), 'keep me');
    const r = design(example('sensor-915'), dir);
    expect(r.code).toBe(2);
    expect(r.stderr.trim().split('\n')).toEqual([expect.stringContaining('was not made by tunestrip')]);
    expect(readdirSync(dir)).toEqual(['precious.txt']);
    expect(design(example('sensor-915'), dir, scratch, ['--force']).code).toBe(0);
    expect(readFileSync(join(dir, 'precious.txt'), 'utf8')).toBe('keep me');
    // The folder is tunestrip's now: a rerun needs no --force.
    expect(design(example('sensor-915'), dir).code).toBe(0);
  });

  it('gives byte-identical files for the same spec whatever the order of runs', () => {
    const names = ['sensor-915', 'mixer-10g'];
    const outputs = (order: readonly string[]): Record<string, Record<string, string>> => {
      const base = fresh('order');
      const result: Record<string, Record<string, string>> = {};
      for (const n of order) {
        const r = design(example(n), join(base, n));
        expect(r.code, r.stderr).toBe(0);
        result[n] = snapshot(join(base, n));
      }
      return result;
    };
    const forward = outputs(names);
    const backward = outputs([...names].reverse());
    for (const n of names) {
      expect(Object.keys(forward[n]!).length).toBeGreaterThanOrEqual(6);
      expect(backward[n]).toEqual(forward[n]);
    }
  });
});

describe('a crash mid-write (child process, SIGKILL after N temporary files)', () => {
  const bin = join(root, 'dist', 'cli', 'bin.js');
  const has = existsSync(bin);
  if (!has) console.warn('skip: dist/cli/bin.js is missing (npm run build)');
  const spec = join(root, 'templates', 'examples', 'sensor-915.yaml');
  const crash = (out: string, after: number, specPath = spec) =>
    spawnSync(process.execPath, [bin, 'design', specPath, '--out', out], {
      cwd: scratch,
      encoding: 'utf8',
      env: { ...process.env, TUNESTRIP_TEST_CRASH_AFTER_TEMP_FILES: String(after) },
    });

  it.skipIf(!has || !existsSync('/proc/self'))('fails at once, exit 2, where the kernel will not make the output folder (/proc)', () => {
    // Node 20's recursive mkdir spins forever on this path; a child process with a time limit keeps a
    // regression from hanging the suite.
    const r = spawnSync(process.execPath, [bin, 'design', spec, '--out', '/proc/tunestrip-cannot-be-here/out'], { cwd: scratch, encoding: 'utf8', timeout: 30_000 });
    expect(r.error).toBeUndefined();
    expect(r.status).toBe(2);
    expect(r.stderr).toBe('tunestrip: cannot write into /proc/tunestrip-cannot-be-here/out (no such file)\n');
  });

  it.skipIf(!has)('leaves no visible file in a new folder, and the next run completes without --force', () => {
    const out = fresh('crash-new');
    const r = crash(out, 2);
    expect(r.signal).toBe('SIGKILL');
    expect(visible(out)).toEqual([]);
    expect(temps(out).length).toBe(2);
    const cap = captureIo(scratch);
    expect(main(['design', spec, '--out', out], cap.io, version), cap.err.join('')).toBe(0);
    expect(temps(out)).toEqual([]);
    expect(visible(out)).toContain('design.json');
  });

  it.skipIf(!has)('leaves every old file whole when it dies over a previous design, then replaces them all', () => {
    const out = fresh('crash-old');
    const cap = captureIo(scratch);
    expect(main(['design', spec, '--out', out], cap.io, version)).toBe(0);
    const old = Object.fromEntries(visible(out).map((f) => [f, readFileSync(join(out, f), 'latin1')]));
    const oldMtimes = visible(out).map((f) => statSync(join(out, f)).mtimeMs);
    // A different design into the same folder: another load, so design.json and the artwork change.
    const changed = join(scratch, 'sensor-changed.yaml');
    writeFileSync(changed, readFileSync(spec, 'utf8').replace(/^load: .*$/m, 'load: 25-j15'));
    const r = crash(out, visible(out).length, changed);
    expect(r.signal).toBe('SIGKILL');
    expect(visible(out)).toEqual(Object.keys(old));
    for (const [f, bytes] of Object.entries(old)) expect(readFileSync(join(out, f), 'latin1'), f).toBe(bytes);
    expect(visible(out).map((f) => statSync(join(out, f)).mtimeMs)).toEqual(oldMtimes);
    const again = captureIo(scratch);
    expect(main(['design', changed, '--out', out], again.io, version), again.err.join('')).toBe(0);
    expect(temps(out)).toEqual([]);
    expect(readFileSync(join(out, 'design.json'), 'latin1')).not.toBe(old['design.json']);
  });
});
