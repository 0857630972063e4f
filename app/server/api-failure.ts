import { InputError } from '../../core/input-error';
import type { ApiFailure } from './http-server';
import { PolicyRefusal } from './policy';

/** What the page sees of an error: bad input names its field; a refusal says why; anything else is internal. */
export function apiFailureOf(e: unknown): ApiFailure | undefined {
  if (e instanceof InputError) return { status: 400, field: e.field, message: e.message };
  if (e instanceof PolicyRefusal) return { status: 404, message: e.message };
  return undefined;
}
