// The error a call throws, for tests that inspect it; fails when it returns or throws something else.
import { TunestripError } from '../../src/diagnostics.js';

export function errorOf(run: () => unknown): TunestripError {
  try {
    run();
  } catch (error) {
    if (error instanceof TunestripError) return error;
    throw error;
  }
  throw new Error('expected a TunestripError, got a result');
}
