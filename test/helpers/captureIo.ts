// An in-memory Io for running the CLI's main() in-process: captures what it prints, reads the
// repository's templates, and writes nothing unless a folder is given.
import { nodeIo, type Io } from '../../src/cli/io.js';

export interface Captured {
  readonly io: Io;
  readonly out: string[];
  readonly err: string[];
}

export function captureIo(cwd = process.cwd()): Captured {
  const out: string[] = [];
  const err: string[] = [];
  const real = nodeIo(cwd);
  return {
    out,
    err,
    io: { ...real, stdout: (t) => void out.push(t), stderr: (t) => void err.push(t) },
  };
}
