import { InputError } from '../../core/units/input-error';
import type { ApiFailure } from './http-server';
import type { JobError } from './job-error';
import { PolicyRefusal } from './policy';

/** A refusal a handler made on a thread of the call pool, as it was described there. */
export class ThreadRefusal extends Error {
  constructor(readonly failure: ApiFailure) {
    super(failure.message);
    this.name = 'ThreadRefusal';
  }
}

/** Every thread is taken and the queue is full: the call is refused, to be tried again. */
export class ServerBusy extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ServerBusy';
  }
}

/** What the page sees of an error: bad input names its field; a refusal says why; anything else is internal. */
export function apiFailureOf(e: unknown): ApiFailure | undefined {
  if (e instanceof InputError) return { status: 400, field: e.field, message: e.message };
  if (e instanceof PolicyRefusal) return { status: 404, message: e.message };
  if (e instanceof ThreadRefusal) return e.failure;
  if (e instanceof ServerBusy) return { status: 503, message: e.message };
  return undefined;
}

/** A failed job's error as the page polls it: what a call would have answered, else an internal error. */
export function jobErrorOf(e: unknown): JobError {
  const failure = apiFailureOf(e);
  if (!failure) return { status: 500, message: `internal error: ${(e as Error).message}` };
  return {
    status: failure.status,
    message: failure.message,
    ...(failure.field !== undefined ? { field: failure.field } : {}),
  };
}
