// The InputError an action throws, for tests that check its field and rule.
import { InputError } from '../../src/index.ts';

/** Runs `action` and returns the InputError it throws; any other error is rethrown, and none fails the test. */
export function thrown(action: () => unknown): InputError {
  try {
    action();
  } catch (error) {
    if (error instanceof InputError) return error;
    throw error;
  }
  throw new Error('expected an InputError');
}
