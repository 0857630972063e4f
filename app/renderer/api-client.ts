import type { HandlerInput, HandlerName, HandlerOutput } from '../api/contract';
import { messagePlain } from './plain-words';

/** An API call that failed; `field` names the bad input where there is one. */
export class ApiCallError extends Error {
  readonly status: number;
  readonly field: string | undefined;
  constructor(status: number, message: string, field?: string) {
    // The screens speak of their own fields and buttons, not of the command's options.
    super(messagePlain(message, field));
    this.name = 'ApiCallError';
    this.status = status;
    this.field = field;
  }
}

const TOKEN_KEY = 'rideledger-token';

/**
 * The per-start token arrives in the address's fragment (#token=…), which the browser never
 * sends anywhere; it is kept for this tab only and removed from the address bar.
 */
export function apiTokenTake(): string | null {
  const hash = new URLSearchParams(window.location.hash.slice(1));
  const fromHash = hash.get('token');
  if (fromHash) {
    sessionStorage.setItem(TOKEN_KEY, fromHash);
    history.replaceState(null, '', window.location.pathname + window.location.search);
    return fromHash;
  }
  return sessionStorage.getItem(TOKEN_KEY);
}

let token: string | null = null;

/** Calls a handler of the API contract on the backend that served this page. */
export async function apiCall<N extends HandlerName>(
  name: N,
  input: HandlerInput<N>,
): Promise<HandlerOutput<N>> {
  token ??= apiTokenTake();
  if (!token)
    throw new ApiCallError(
      401,
      'This page was opened without its access token: open the address RideLedger printed.',
    );
  const res = await fetch(`api/call/${name}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-rideledger-token': token },
    body: JSON.stringify(input),
  });
  const body = (await res.json().catch(() => ({}))) as {
    value?: unknown;
    error?: { message?: string; field?: string };
  };
  if (!res.ok)
    throw new ApiCallError(
      res.status,
      body.error?.message ?? `request failed (${res.status})`,
      body.error?.field,
    );
  return body.value as HandlerOutput<N>;
}

/** What a long call reports while it runs. */
export type JobProgress = { elapsedMs: number; stage: string; done?: number; total?: number };

type JobState =
  | { state: 'running'; elapsedMs: number; stage: string; done?: number; total?: number }
  | { state: 'done'; elapsedMs: number; value: unknown }
  | { state: 'failed'; elapsedMs: number; error: { field?: string; message: string; status: number } }
  | { state: 'cancelled'; elapsedMs: number };

async function jobRequest(path: string, method: 'GET' | 'POST', body?: unknown): Promise<unknown> {
  token ??= apiTokenTake();
  if (!token)
    throw new ApiCallError(
      401,
      'This page was opened without its access token: open the address RideLedger printed.',
    );
  const res = await fetch(`api/jobs/${path}`, {
    method,
    headers: { 'content-type': 'application/json', 'x-rideledger-token': token },
    ...(body === undefined ? {} : { body: JSON.stringify(body) }),
  });
  const out = (await res.json().catch(() => ({}))) as {
    value?: unknown;
    error?: { message?: string; field?: string };
  };
  if (!res.ok)
    throw new ApiCallError(
      res.status,
      out.error?.message ?? `request failed (${res.status})`,
      out.error?.field,
    );
  return out.value;
}

/**
 * Runs a handler as a job on the backend (off the server's thread — a thread of its own, or the
 * kept sweep pool for a valving sweep — so a large import never stalls the
 * app), polling its progress; aborting the signal cancels it, and a cancelled job stores nothing.
 */
export async function apiJob<N extends HandlerName>(
  name: N,
  input: HandlerInput<N>,
  options: { onProgress?: (p: JobProgress) => void; signal?: AbortSignal } = {},
): Promise<HandlerOutput<N>> {
  const { job } = (await jobRequest(`start/${name}`, 'POST', input)) as { job: string };
  for (;;) {
    if (options.signal?.aborted) {
      await jobRequest(`${job}/cancel`, 'POST');
      throw new ApiCallError(499, 'Cancelled: nothing was stored.');
    }
    const s = (await jobRequest(job, 'GET')) as JobState;
    if (s.state === 'done') return s.value as HandlerOutput<N>;
    if (s.state === 'failed') throw new ApiCallError(s.error.status, s.error.message, s.error.field);
    if (s.state === 'cancelled') throw new ApiCallError(499, 'Cancelled: nothing was stored.');
    options.onProgress?.({
      elapsedMs: s.elapsedMs,
      stage: s.stage,
      ...(s.done !== undefined && s.total !== undefined ? { done: s.done, total: s.total } : {}),
    });
    await new Promise((r) => setTimeout(r, 150));
  }
}
