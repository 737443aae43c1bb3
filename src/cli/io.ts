// The only place that touches the file system and the process. Everything the CLI needs from the
// outside world goes through the Io interface, so main() can be tested in-process.
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Artifact } from '../seams.js';

export interface Io {
  readonly cwd: string;
  stdout(text: string): void;
  stderr(text: string): void;
  /** Reads a text file; throws an IoError with a one-line message. */
  readText(path: string, maxBytes: number): string;
  /** Preset name → YAML text, for each folder under templates/. */
  readPresets(folder: 'substrates' | 'fab'): Record<string, string>;
  writeOutputs(dir: string, artifacts: readonly Artifact[], options: { readonly force: boolean }): readonly string[];
}

export class IoError extends Error {
  constructor(message: string, readonly exitCode: 1 | 2 = 2) {
    super(message);
    this.name = 'IoError';
  }
}

/** Marks a folder as tunestrip's own and lists what it wrote there, so a rerun replaces exactly that. */
export const MARKER = '.tunestrip-output';

export const packageRoot = (): string => resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');

export function nodeIo(cwd = process.cwd()): Io {
  return {
    cwd,
    stdout: (t) => void process.stdout.write(t),
    stderr: (t) => void process.stderr.write(t),
    readText: (path, maxBytes) => readTextFile(resolve(cwd, path), maxBytes),
    readPresets: (folder) => readPresetFolder(join(packageRoot(), 'templates', folder)),
    writeOutputs: (dir, artifacts, options) => writeOutputsAtomically(resolve(cwd, dir), artifacts, options),
  };
}

function readTextFile(path: string, maxBytes: number): string {
  let size: number;
  try {
    const st = statSync(path);
    if (!st.isFile()) throw new IoError(`${path}: not a file`);
    size = st.size;
  } catch (e) {
    if (e instanceof IoError) throw e;
    throw new IoError(`${path}: cannot read the file (${(e as NodeJS.ErrnoException).code ?? 'error'})`);
  }
  if (size > maxBytes) throw new IoError(`${path}: the file is ${size} bytes; spec files are limited to ${maxBytes} bytes`);
  const bytes = readFileSync(path);
  return bytes.toString('utf8');
}

function readPresetFolder(folder: string): Record<string, string> {
  if (!existsSync(folder)) return {};
  const presets: Record<string, string> = {};
  for (const file of readdirSync(folder).sort()) {
    if (!/\.ya?ml$/.test(file)) continue;
    presets[file.replace(/\.ya?ml$/, '')] = readFileSync(join(folder, file), 'utf8');
  }
  return presets;
}

/** Hook for the crash test: stop the process after this many files have reached their temporary name. */
const crashAfter = (): number | null => {
  const v = process.env.TUNESTRIP_TEST_CRASH_AFTER_TEMP_FILES;
  return v && /^\d+$/.test(v) ? Number(v) : null;
};

/**
 * Writes each artifact to a temporary name in the output folder, then renames them all into
 * place: a crash leaves either the old file or the new one, never a partial one. Writes only
 * inside `dir`; refuses a folder tunestrip did not make unless `force`.
 */
export function writeOutputsAtomically(dir: string, artifacts: readonly Artifact[], options: { readonly force: boolean }): string[] {
  for (const a of artifacts) {
    const target = resolve(dir, a.path);
    if (!/^[A-Za-z0-9][A-Za-z0-9._-]*$/.test(a.path) || !target.startsWith(dir + sep)) {
      throw new IoError(`refusing to write ${JSON.stringify(a.path)} outside ${dir}`, 1);
    }
  }
  const marker = join(dir, MARKER);
  let previous: string[] = [];
  if (existsSync(dir)) {
    if (!statSync(dir).isDirectory()) throw new IoError(`${dir} exists and is not a folder`);
    // Temporary files left by a run that was killed mid-write are ours to clear.
    for (const e of readdirSync(dir)) if (/^\..+\.tmp-\d+$/.test(e)) rmSync(join(dir, e), { force: true });
    const entries = readdirSync(dir);
    if (existsSync(marker)) {
      previous = readFileSync(marker, 'utf8').split('\n').filter((l) => /^[A-Za-z0-9][A-Za-z0-9._-]*$/.test(l));
    } else if (entries.length > 0 && !options.force) {
      throw new IoError(`${dir} exists and was not made by tunestrip; choose another --out or pass --force`);
    }
  } else {
    mkdirSync(dir, { recursive: true });
  }
  const stamp = `${process.pid}`;
  const temps: string[] = [];
  const limit = crashAfter();
  try {
    for (const a of artifacts) {
      const temp = join(dir, `.${a.path}.tmp-${stamp}`);
      writeFileSync(temp, a.text, { encoding: 'utf8', flag: 'wx' });
      temps.push(temp);
      if (limit !== null && temps.length >= limit) process.kill(process.pid, 'SIGKILL');
    }
  } catch (e) {
    for (const t of temps) rmSync(t, { force: true });
    throw new IoError(`cannot write into ${dir}: ${(e as Error).message}`, 1);
  }
  artifacts.forEach((a, i) => renameSync(temps[i]!, join(dir, a.path)));
  const written = artifacts.map((a) => a.path);
  for (const old of previous) if (!written.includes(old)) rmSync(join(dir, old), { force: true });
  const markerTemp = join(dir, `.${MARKER}.tmp-${stamp}`);
  writeFileSync(markerTemp, `${written.join('\n')}\n`);
  renameSync(markerTemp, marker);
  return written.map((p) => join(dir, p));
}
