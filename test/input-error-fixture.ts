import { InputError } from '../core/units/input-error';

/** The InputError `fn` throws; any other outcome fails the test. */
export function inputErrorOf(fn: () => unknown): InputError {
  try {
    fn();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError');
}
