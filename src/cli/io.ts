// The only place that touches the file system and the process. Everything the CLI needs from the
// outside world goes through the Io interface, so main() can be tested in-process.
import {
  closeSync,
  existsSync,
  fsyncSync,
  lstatSync,
  mkdirSync,
  openSync,
  readFileSync,
  readdirSync,
  renameSync,
  rmSync,
  statSync,
  writeSync,
} from 'node:fs';
import { dirname, isAbsolute, join, relative, resolve } from 'node:path';
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

/** A file name tunestrip writes or removes: no folder part, no leading dot, nothing odd. */
export const SAFE_FILE_NAME = /^[A-Za-z0-9][A-Za-z0-9._-]*$/;

/** Temporary files of an interrupted run: `.<name>.tmp-<pid>`. */
const TEMP_NAME = /^\.[A-Za-z0-9][A-Za-z0-9._-]*\.tmp-\d+$/;

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

const errno = (e: unknown): string => (e as NodeJS.ErrnoException)?.code ?? 'error';

const REASONS: Readonly<Record<string, string>> = {
  ENOENT: 'no such file',
  EACCES: 'permission denied',
  EPERM: 'permission denied',
  EISDIR: 'is a folder, not a file',
  ENOTDIR: 'a part of the path is not a folder',
  ELOOP: 'too many symbolic links',
  ENAMETOOLONG: 'the path is too long',
};
const reason = (e: unknown): string => REASONS[errno(e)] ?? errno(e);

/** Reads a regular file of at most maxBytes as UTF-8 (bad bytes become U+FFFD, which the spec reader refuses). */
function readTextFile(path: string, maxBytes: number): string {
  let size: number;
  try {
    const st = statSync(path);
    if (!st.isFile()) throw new IoError(`${path}: not a regular file${st.isDirectory() ? ' (it is a folder)' : ''}; give a spec file`);
    size = st.size;
  } catch (e) {
    if (e instanceof IoError) throw e;
    throw new IoError(`${path}: cannot read the file (${reason(e)})`);
  }
  if (size > maxBytes) throw new IoError(`${path}: the file is ${size} bytes; spec files are limited to ${maxBytes} bytes`);
  let bytes: Buffer;
  try {
    bytes = readFileSync(path);
  } catch (e) {
    throw new IoError(`${path}: cannot read the file (${reason(e)})`);
  }
  // The file may have grown between stat and read.
  if (bytes.length > maxBytes) throw new IoError(`${path}: the file is over ${maxBytes} bytes; spec files are limited to ${maxBytes} bytes`);
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

/** Writes text to a new file and flushes it to disk, so a rename never exposes a file the disk has not got. */
function writeDurably(path: string, text: string): void {
  const fd = openSync(path, 'wx', 0o644);
  try {
    const bytes = Buffer.from(text, 'utf8');
    let done = 0;
    while (done < bytes.length) done += writeSync(fd, bytes, done, bytes.length - done);
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
}

/**
 * mkdir -p, one level at a time. Node 20's own recursive mkdir never returns where the kernel answers
 * ENOENT for a folder whose parent exists (e.g. under /proc); here every failure is an error.
 */
function makeFolders(dir: string): void {
  const missing: string[] = [];
  let at = dir;
  while (!existsSync(at)) {
    missing.unshift(at);
    const parent = dirname(at);
    if (parent === at) break;
    at = parent;
  }
  for (const folder of missing) mkdirSync(folder);
}

/** The marker lists the files a run wrote; only plain names are taken from it. */
function markerFiles(marker: string): string[] {
  return readFileSync(marker, 'utf8')
    .split('\n')
    .filter((l) => SAFE_FILE_NAME.test(l) && l !== MARKER);
}

function writeMarker(dir: string, files: readonly string[], stamp: string): void {
  const temp = join(dir, `.${MARKER}.tmp-${stamp}`);
  writeDurably(temp, `${[...new Set(files)].sort().join('\n')}\n`);
  renameSync(temp, join(dir, MARKER));
}

/**
 * Writes each artifact to a temporary name in the output folder, then renames them all into
 * place: a crash leaves either the old file or the new one, never a partial one. Writes only
 * inside `dir`; refuses a folder tunestrip did not make unless `force`. A folder tunestrip makes
 * is marked before any artifact reaches it, so a rerun after a crash may write there again.
 */
export function writeOutputsAtomically(dir: string, artifacts: readonly Artifact[], options: { readonly force: boolean }): string[] {
  const names = new Set<string>();
  for (const a of artifacts) {
    const rel = relative(dir, resolve(dir, a.path));
    if (!SAFE_FILE_NAME.test(a.path) || a.path === MARKER || rel !== a.path || isAbsolute(rel) || names.has(a.path)) {
      throw new IoError(`refusing to write ${JSON.stringify(a.path)}: output files are plain, distinct names inside ${dir}`, 1);
    }
    names.add(a.path);
  }
  try {
    return writeInto(dir, artifacts, options);
  } catch (e) {
    if (e instanceof IoError) throw e;
    throw new IoError(`cannot write into ${dir} (${reason(e)})`, 2);
  }
}

function writeInto(dir: string, artifacts: readonly Artifact[], options: { readonly force: boolean }): string[] {
  const marker = join(dir, MARKER);
  const stamp = `${process.pid}`;
  let previous: string[] = [];
  let exists = true;
  try {
    lstatSync(dir);
  } catch (e) {
    if (errno(e) !== 'ENOENT') throw e;
    exists = false;
  }
  if (exists) {
    if (!statSync(dir).isDirectory()) throw new IoError(`${dir} exists and is not a folder; choose another --out`);
    const ours = existsSync(marker);
    if (ours) {
      previous = markerFiles(marker);
      // Temporary files left by a run that was killed mid-write are ours to clear.
      for (const e of readdirSync(dir)) if (TEMP_NAME.test(e)) rmSync(join(dir, e), { force: true });
    } else if (readdirSync(dir).length > 0 && !options.force) {
      throw new IoError(`${dir} exists and was not made by tunestrip; choose another --out or pass --force`);
    }
  } else {
    makeFolders(dir);
  }
  // Claim the folder, listing old and new names, before any artifact is renamed into it.
  const written = artifacts.map((a) => a.path);
  writeMarker(dir, [...previous, ...written], stamp);

  const temps: string[] = [];
  const limit = crashAfter();
  try {
    for (const a of artifacts) {
      const temp = join(dir, `.${a.path}.tmp-${stamp}`);
      rmSync(temp, { force: true });
      writeDurably(temp, a.text);
      temps.push(temp);
      if (limit !== null && temps.length >= limit) process.kill(process.pid, 'SIGKILL');
    }
  } catch (e) {
    for (const t of temps) rmSync(t, { force: true });
    throw new IoError(`cannot write into ${dir} (${reason(e)}); the files there are unchanged`, 1);
  }
  artifacts.forEach((a, i) => renameSync(temps[i]!, join(dir, a.path)));
  const keep = new Set(written);
  for (const old of previous) if (!keep.has(old)) rmSync(join(dir, old), { force: true });
  writeMarker(dir, written, stamp);
  return written.map((p) => join(dir, p));
}
