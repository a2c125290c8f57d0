// Test helper: run a call that must throw a FitError and return that error (any other outcome fails the test).
import { FitError } from './fit-error';

/** The FitError thrown by `run`; throws when run succeeds or throws something else. */
export function fitErrorOf(run: () => unknown): FitError {
  try {
    run();
  } catch (e) {
    if (e instanceof FitError) return e;
    throw e;
  }
  throw new Error('expected a FitError');
}
