// The error a call throws, for tests that inspect it; fails when it returns or throws something else.
import { TunestripError } from '../../src/diagnostics.js';

export function errorOf(run: () => unknown): TunestripError;
export function errorOf<E extends Error>(run: () => unknown, kind: new (...args: never[]) => E): E;
export function errorOf(run: () => unknown, kind: new (...args: never[]) => Error = TunestripError): Error {
  try {
    run();
  } catch (error) {
    if (error instanceof kind) return error;
    throw error;
  }
  throw new Error(`expected a ${kind.name}, got a result`);
}
