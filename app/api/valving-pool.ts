import { readFile } from 'node:fs/promises';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import {
  valvingEvaluatorOf,
  valvingJobSize,
  type ValvingFigures,
  type ValvingJob,
} from '../../core/valving/valving-evaluate';
import {
  ValvingSweepStopped,
  valvingChunkEvaluate,
  valvingChunkRanges,
  valvingSweepMerge,
  type ValvingChunk,
} from '../../core/valving/valving-sweep';
import { BUILT_DIR } from './built-output';

export type ValvingSweepOptions = {
  /**
   * This thread evaluates chunks too (default true). A worker takes the better part of a
   * second to start (it loads the program's modules); this thread works meanwhile, so a sweep
   * is never slower than evaluating it here alone. A server that must stay responsive passes false.
   */
  inThread?: boolean;
  /** Combinations a chunk holds (default: about 16 chunks a lane, at most 32 combinations). */
  chunkSize?: number;
  /** Stops the sweep between combinations; the promise then rejects with the signal's reason. */
  signal?: AbortSignal;
  /** Called as chunks finish, with combinations done and in all. */
  onProgress?: (done: number, total: number) => void;
};

/** The default number of worker threads: one a core, less one for this thread's own lane. */
export function valvingPoolDefaultThreads(inThread = true): number {
  return Math.max(inThread ? 0 : 1, availableParallelism() - (inThread ? 1 : 0));
}

const WORKER_SOURCE = fileURLToPath(new URL('./valving-worker.ts', import.meta.url));

let workerCode: Promise<string> | null = null;

/**
 * The worker as one script. The built program has it ready (dist/node/valving-worker.cjs, made
 * with the rest); from the sources it is bundled once a process with esbuild (tsx's own
 * compiler). A worker that loads the TypeScript modules one by one through tsx takes about a
 * second of a core to start; the bundle starts in about a tenth of that — the difference
 * between a cold sweep that gains from a second core and one that does not.
 */
export function valvingWorkerCode(): Promise<string> {
  workerCode ??= BUILT_DIR
    ? readFile(new URL('valving-worker.cjs', BUILT_DIR), 'utf8')
    : import('esbuild').then((esbuild) =>
        esbuild
          .build({
            entryPoints: [WORKER_SOURCE],
            bundle: true,
            platform: 'node',
            format: 'cjs',
            target: 'node20',
            write: false,
            logLevel: 'silent',
          })
          .then(async (r) => {
            const text = (r.outputFiles[0] as { text: string }).text;
            // esbuild's own process (some 90 MB) would idle beside a kept pool: the bundle is all it is needed for.
            await esbuild.stop();
            return text;
          }),
      );
  // A failed build is not kept: the next pool tries again.
  workerCode.catch(() => (workerCode = null));
  return workerCode;
}

/** Messages of the worker protocol (valving-worker.ts). */
export type ValvingWorkerRequest =
  | { type: 'job'; sweep: number; job: ValvingJob; stop: SharedArrayBuffer }
  | { type: 'range'; sweep: number; start: number; end: number };
export type ValvingWorkerReply = { type: 'ready' } | { type: 'chunk'; sweep: number; chunk: ValvingChunk };

type Lane = { worker: Worker; ready: boolean; busy: boolean; jobOf: number };

type Sweep = {
  id: number;
  job: ValvingJob;
  inThread: boolean;
  total: number;
  ranges: { start: number; end: number }[];
  next: number;
  chunks: ValvingChunk[];
  done: number;
  stop: Int32Array<SharedArrayBuffer>;
  settled: boolean;
  finish: (error?: unknown) => void;
};

/** Lets pending messages and the abort signal through between two chunks of this thread's lane. */
const nextTurn = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * Worker threads for valving sweeps, started once and kept for sweep after sweep (a server
 * or the desktop backend keeps one; the command uses `valvingSweepParallel`). Chunks of a
 * job's combinations go to whichever lane is free — a worker, or this thread — so fast and
 * slow lanes finish together. Every combination is evaluated alone from the same JSON job,
 * so the figures are those of `valvingComboEvaluate`, whichever lane made them. One sweep
 * runs at a time; others wait their turn.
 */
export class ValvingPool {
  private readonly lanes: Lane[] = [];
  private readonly wanted: number;
  private readonly starting: Promise<void>;
  private startError: unknown = undefined;
  private active: Sweep | null = null;
  private queue: Promise<unknown> = Promise.resolve();
  private sweeps = 0;
  private closed = false;

  /** Starts `threads` worker threads; they join sweeps as they become ready. */
  constructor(threads: number = valvingPoolDefaultThreads()) {
    this.wanted = Math.max(0, Math.floor(threads));
    this.starting =
      this.wanted === 0
        ? Promise.resolve()
        : valvingWorkerCode().then(
            (code) => {
              if (this.closed) return;
              for (let i = 0; i < this.wanted; i++) this.laneStart(code);
            },
            (e: unknown) => {
              // No workers: sweeps that take part in this thread still finish there.
              this.startError = e;
              if (this.active && !this.active.inThread) this.active.finish(e);
            },
          );
  }

  /** Worker threads the pool was asked for (some may still be starting). */
  get threads(): number {
    return this.wanted;
  }

  private laneStart(code: string): void {
    const lane: Lane = { worker: new Worker(code, { eval: true }), ready: false, busy: false, jobOf: -1 };
    this.lanes.push(lane);
    lane.worker.on('message', (m: ValvingWorkerReply) => {
      if (m.type === 'ready') lane.ready = true;
      else {
        lane.busy = false;
        const s = this.active;
        if (s && s.id === m.sweep) this.record(s, m.chunk);
      }
      this.dispatch(lane);
    });
    const lost = (error: Error) => {
      const i = this.lanes.indexOf(lane);
      if (i < 0) return;
      this.lanes.splice(i, 1);
      // The chunk it held is gone with it: the sweep cannot be whole.
      if (lane.busy && this.active) this.active.finish(error);
      if (this.closed) return;
      // A kept pool outlives its sweeps: a worker that had started is replaced (one that died
      // starting would die again). With none left, sweeps off this thread fail instead of waiting.
      if (lane.ready) this.laneStart(code);
      else if (this.lanes.length === 0) {
        this.startError = error;
        if (this.active && !this.active.inThread) this.active.finish(error);
      }
    };
    lane.worker.on('error', lost);
    lane.worker.on('exit', (code) => {
      if (!this.closed) lost(new Error(`a sweep worker thread stopped with exit code ${code}`));
    });
  }

  private take(s: Sweep): { start: number; end: number } | undefined {
    return s.settled || s.next >= s.ranges.length ? undefined : s.ranges[s.next++];
  }

  private dispatch(lane: Lane): void {
    const s = this.active;
    if (!s || !lane.ready || lane.busy) return;
    const range = this.take(s);
    if (!range) return;
    if (lane.jobOf !== s.id) {
      lane.worker.postMessage({
        type: 'job',
        sweep: s.id,
        job: s.job,
        stop: s.stop.buffer,
      } satisfies ValvingWorkerRequest);
      lane.jobOf = s.id;
    }
    lane.busy = true;
    lane.worker.postMessage({ type: 'range', sweep: s.id, ...range } satisfies ValvingWorkerRequest);
  }

  private record(s: Sweep, chunk: ValvingChunk, onProgress?: (done: number, total: number) => void): void {
    if (s.settled || chunk.stopped) return;
    s.chunks.push(chunk);
    s.done += chunk.figures.length;
    (onProgress ?? this.progress)?.(s.done, s.total);
    if (s.done === s.total) s.finish();
  }

  private progress: ((done: number, total: number) => void) | undefined;

  /**
   * Evaluates every combination of `job` across the pool's workers (and this thread, unless
   * `inThread` is false): figures[corner][cell].
   * @throws the signal's reason (a ValvingSweepStopped unless the caller gave another) when stopped.
   */
  sweep(job: ValvingJob, options: ValvingSweepOptions = {}): Promise<ValvingFigures[][]> {
    const run = this.queue.then(() => this.sweepNow(job, options));
    this.queue = run.catch(() => undefined);
    return run;
  }

  private sweepNow(job: ValvingJob, options: ValvingSweepOptions): Promise<ValvingFigures[][]> {
    if (this.closed) return Promise.reject(new Error('the sweep pool is closed'));
    const inThread = options.inThread ?? true;
    if (!inThread && this.wanted === 0)
      return Promise.reject(new RangeError('a sweep needs a worker thread or this thread'));
    if (!inThread && this.startError !== undefined) return Promise.reject(this.startError);
    const total = valvingJobSize(job);
    const laneCount = this.wanted + (inThread ? 1 : 0);
    const chunkSize = options.chunkSize ?? Math.min(32, Math.max(1, Math.ceil(total / (16 * laneCount))));
    const signal = options.signal;
    return new Promise((resolve, reject) => {
      const s: Sweep = {
        id: ++this.sweeps,
        job,
        inThread,
        total,
        ranges: valvingChunkRanges(total, chunkSize),
        next: 0,
        chunks: [],
        done: 0,
        stop: new Int32Array(new SharedArrayBuffer(4)),
        settled: false,
        finish: (error?: unknown) => {
          if (s.settled) return;
          s.settled = true;
          Atomics.store(s.stop, 0, 1);
          signal?.removeEventListener('abort', onAbort);
          if (this.active === s) {
            this.active = null;
            this.progress = undefined;
          }
          if (error !== undefined) return reject(error);
          try {
            resolve(valvingSweepMerge(job, s.chunks));
          } catch (e) {
            reject(e);
          }
        },
      };
      const onAbort = () => s.finish(signal?.reason ?? new ValvingSweepStopped(s.done, total));
      if (signal?.aborted) return onAbort();
      signal?.addEventListener('abort', onAbort, { once: true });
      if (total === 0) return s.finish();
      this.active = s;
      this.progress = options.onProgress;
      for (const lane of this.lanes) this.dispatch(lane);
      if (!inThread) return;
      void (async () => {
        const evaluator = valvingEvaluatorOf(job);
        for (let range = this.take(s); range; range = this.take(s)) {
          const chunk = valvingChunkEvaluate(evaluator, range.start, range.end, {
            shouldStop: () => s.settled || signal?.aborted === true,
          });
          this.record(s, chunk, options.onProgress);
          await nextTurn();
        }
      })().catch((e: unknown) => s.finish(e));
    });
  }

  /** Stops the workers; a sweep still running is stopped with them. */
  async close(): Promise<void> {
    this.closed = true;
    this.active?.finish(new ValvingSweepStopped(this.active.done, this.active.total));
    await this.starting;
    await Promise.all(this.lanes.map((l) => l.worker.terminate()));
    this.lanes.length = 0;
  }
}

/**
 * One sweep on a pool of its own, closed after: what the command runs. `threads` worker
 * threads (default: one a core, less one for this thread when it takes part).
 */
export async function valvingSweepParallel(
  job: ValvingJob,
  options: ValvingSweepOptions & { threads?: number } = {},
): Promise<ValvingFigures[][]> {
  const pool = new ValvingPool(options.threads ?? valvingPoolDefaultThreads(options.inThread ?? true));
  try {
    return await pool.sweep(job, options);
  } finally {
    await pool.close();
  }
}
