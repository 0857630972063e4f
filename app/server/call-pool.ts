import { Worker } from 'node:worker_threads';
import type { HandlerName } from '../api/contract';
import { ServerBusy, ThreadRefusal } from './api-failure';
import type { ApiFailure } from './http-server';

/**
 * Handlers whose cost grows with their input (a corner run through its events, a preset's
 * scenario on four corners, a damping map, a bench file, a bundle): the server runs them on
 * the pool's threads, so that while one runs the others' calls are answered at once.
 */
export const OFF_THREAD: ReadonlySet<HandlerName> = new Set<HandlerName>([
  'analyzeCorner',
  'setupCompare',
  'valvingMap',
  'benchImport',
  'storeImport',
]);

/** Calls waiting for a thread beyond which a new one is refused (503) rather than held. */
export const CALL_QUEUE_MAX = 64;

/** A call as the thread gets it: the request body's text, read there (see dispatchText). */
export type CallRequest = { id: number; name: HandlerName; body: string };
/** What a thread says: that it is ready (once, at start), or the answer to a call. */
export type CallReply =
  | { ready: true }
  | { id: number; ok: true; value: unknown }
  | { id: number; ok: false; failure?: ApiFailure; message: string; stack?: string };

type Pending = {
  id: number;
  name: HandlerName;
  body: string;
  done: (value: unknown) => void;
  fail: (e: unknown) => void;
};

/** `ready`: the thread has loaded its code and opened its connection. */
type Slot = { worker: Worker; busy: Pending | null; ready: boolean };

export type CallPoolOptions = {
  /** Threads kept (default 2: one heavy call leaves one free). */
  threads?: number;
  /** The script a thread runs (call-worker-boot.js). */
  workerUrl?: URL;
};

/**
 * Threads kept from start to close, each on its own connection to the database file (WAL lets
 * them read and write beside the server's). A call goes to a free thread, else waits its turn;
 * a thread that dies is replaced and its call answered as an internal error.
 */
export class CallPool {
  private readonly slots: Slot[] = [];
  private readonly queue: Pending[] = [];
  private readonly workerUrl: URL;
  private nextId = 1;
  private closed = false;
  /** Threads in a row that died before they were ready. */
  private startFailures = 0;
  /** Why the pool gave up starting threads; undefined while it works. */
  private broken: string | undefined;

  constructor(
    private readonly storePath: string,
    options: CallPoolOptions = {},
  ) {
    this.workerUrl = options.workerUrl ?? new URL('./call-worker-boot.js', import.meta.url);
    const threads = Math.max(1, options.threads ?? 2);
    for (let i = 0; i < threads; i++) this.slots.push(this.slotStart());
  }

  private slotStart(): Slot {
    const worker = new Worker(this.workerUrl, { workerData: { storePath: this.storePath } });
    const slot: Slot = { worker, busy: null, ready: false };
    worker.unref();
    worker.on('message', (reply: CallReply) => {
      if ('ready' in reply) {
        slot.ready = true;
        this.startFailures = 0;
        return;
      }
      const call = slot.busy;
      if (!call || call.id !== reply.id) return;
      slot.busy = null;
      if (reply.ok) call.done(reply.value);
      else if (reply.failure) call.fail(new ThreadRefusal(reply.failure));
      else call.fail(Object.assign(new Error(reply.message), { stack: reply.stack ?? reply.message }));
      this.pump();
    });
    const lost = (why: string) => {
      const index = this.slots.indexOf(slot);
      if (index === -1) return;
      const call = slot.busy;
      slot.busy = null;
      call?.fail(new Error(`the thread running ${call.name} stopped: ${why}`));
      if (this.closed) return;
      // A thread that cannot even start is not started again and again: after three in a row
      // the pool gives up, and the server runs these calls on its own thread.
      if (!slot.ready && ++this.startFailures >= 3) {
        this.broken = `the call threads could not start: ${why}`;
        this.slots.splice(index, 1);
        for (const waiting of this.queue.splice(0)) waiting.fail(new Error(this.broken));
        return;
      }
      this.slots[index] = this.slotStart();
      this.pump();
    };
    worker.on('error', (e) => lost(e.message));
    worker.on('exit', (code) => lost(`exit code ${code}`));
    return slot;
  }

  /**
   * Runs a handler on a thread, on a request body's JSON text (the thread reads it, so a large
   * input is never parsed nor cloned on the server's thread); resolves with its output, rejects
   * as the handler would.
   */
  run(name: HandlerName, body: string): Promise<unknown> {
    if (this.closed) return Promise.reject(new Error('the call pool is closed'));
    if (this.broken !== undefined) return Promise.reject(new Error(this.broken));
    if (this.queue.length >= CALL_QUEUE_MAX)
      return Promise.reject(new ServerBusy(`${CALL_QUEUE_MAX} calls are already waiting; try again shortly`));
    return new Promise((done, fail) => {
      this.queue.push({ id: this.nextId++, name, body, done, fail });
      this.pump();
    });
  }

  private pump(): void {
    for (const slot of this.slots) {
      if (slot.busy) continue;
      const call = this.queue.shift();
      if (!call) return;
      slot.busy = call;
      slot.worker.postMessage({ id: call.id, name: call.name, body: call.body } satisfies CallRequest);
    }
  }

  /** Whether calls can run here; false once threads have failed to start (see `broken`). */
  get available(): boolean {
    return !this.closed && this.broken === undefined;
  }

  /** Stops every thread; calls still waiting are refused. */
  async close(): Promise<void> {
    this.closed = true;
    for (const call of this.queue.splice(0)) call.fail(new Error('the server is stopping'));
    const slots = this.slots.splice(0);
    await Promise.all(slots.map((s) => s.worker.terminate()));
    for (const s of slots) s.busy?.fail(new Error('the server is stopping'));
  }
}
