// The built command, run as a child process the way a user runs it (ecosystem.md: CommonJS
// packages imported the wrong way pass vitest but crash plain node, so one test spawns the build).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

const root = resolve(import.meta.dirname, '..', '..');
const bin = join(root, 'dist', 'cli', 'bin.js');
const run = (args: string[], cwd = root) => spawnSync(process.execPath, [bin, ...args], { cwd, encoding: 'utf8' });

// One scratch folder for every run's output, removed afterwards.
const scratch = mkdtempSync(join(tmpdir(), 'tunestrip-cli-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

beforeAll(() => {
  if (!existsSync(bin)) throw new Error('dist/cli/bin.js is missing: run npm run build (npm test does)');
});

describe('tunestrip command', () => {
  it('prints help naming its commands', () => {
    const r = run(['--help']);
    expect(r.status).toBe(0);
    for (const c of ['design', 'solve', 'line']) expect(r.stdout).toContain(c);
  });

  it('designs the bundled example and writes every artwork file', () => {
    const out = mkdtempSync(join(scratch, 'run-'));
    const dir = join(out, 'receiver');
    const r = run(['design', 'templates/examples/receiver-5g8.yaml', '--out', dir]);
    expect(r.stderr).not.toMatch(/at .*\.js:\d+/); // no stack trace
    expect(r.status).toBe(0);
    const files = readdirSync(dir);
    for (const f of ['layout.dxf', 'layout.svg', 'design.json', 'report.md', 'response.s1p']) expect(files).toContain(f);
    expect(files.some((f) => f.endsWith('.gbr'))).toBe(true);
    const record = JSON.parse(readFileSync(join(dir, 'design.json'), 'utf8'));
    expect(record.frequency_hz).toBe(5.8e9);
    expect(record.load_ohm).toEqual([22, -31]);
    expect(r.stdout).toContain('receiver-5g8');
  });

  it('writes the drill file for a short-stub design with vias', () => {
    const out = mkdtempSync(join(scratch, 'run-'));
    const r = run(['design', 'templates/examples/mixer-10g.yaml', '--out', join(out, 'm')]);
    expect(r.status, r.stderr).toBe(0);
    const record = JSON.parse(readFileSync(join(out, 'm', 'design.json'), 'utf8'));
    expect(record.solution.termination).toBe('short');
    expect(record.vias.length).toBe(2);
    expect(readdirSync(join(out, 'm')).some((f) => /\.(drl|xln)$|drill/.test(f))).toBe(true);
  });

  it('gives one line, exit 2 and no files for a bad spec', () => {
    const out = mkdtempSync(join(scratch, 'run-'));
    const spec = join(out, 'bad.yaml');
    writeFileSync(spec, 'name: bad\nfrequency: 5.8 parsecs\nload: 22-j31\nsubstrate: { er: 3.66, height: 0.508 mm }\n');
    const r = run(['design', spec, '--out', join(out, 'o')]);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toContain('frequency');
    expect(existsSync(join(out, 'o'))).toBe(false);
  });

  it('exits 1 with a reason for a purely reactive load', () => {
    const r = run(['solve', '--load', '0-j40']);
    expect(r.status).toBe(1);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/reactive|passive/);
  });

  it('same spec, same bytes', () => {
    const out = mkdtempSync(join(scratch, 'run-'));
    expect(run(['design', 'templates/examples/receiver-5g8.yaml', '--out', join(out, 'a')]).status).toBe(0);
    expect(run(['design', 'templates/examples/mixer-10g.yaml', '--out', join(out, 'x')]).status).toBe(0);
    expect(run(['design', 'templates/examples/receiver-5g8.yaml', '--out', join(out, 'b')]).status).toBe(0);
    for (const f of readdirSync(join(out, 'a'))) {
      expect(readFileSync(join(out, 'b', f), 'utf8'), f).toBe(readFileSync(join(out, 'a', f), 'utf8'));
    }
  });

  it('refuses to write into a folder it did not make, unless --force', () => {
    const out = mkdtempSync(join(scratch, 'run-'));
    writeFileSync(join(out, 'precious.txt'), 'keep me');
    const r = run(['design', 'templates/examples/receiver-5g8.yaml', '--out', out]);
    expect(r.status).toBe(2);
    expect(readdirSync(out)).toEqual(['precious.txt']);
    expect(run(['design', 'templates/examples/receiver-5g8.yaml', '--out', out, '--force']).status).toBe(0);
    expect(readFileSync(join(out, 'precious.txt'), 'utf8')).toBe('keep me');
  });
});
