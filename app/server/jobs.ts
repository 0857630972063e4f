import { randomUUID } from 'node:crypto';
import { Worker } from 'node:worker_threads';
import { storeClose, storeOpen, type Store } from '../../db/store';
import { apiCall } from '../api/call';
import type { HandlerName } from '../api/contract';
import { ValvingPool, valvingPoolDefaultThreads } from '../api/valving-pool';
import { jobErrorOf } from './api-failure';
import type { JobError } from './job-error';

/** A long call (a large bench import, a backup, a valving sweep) that leaves the server free to answer. */
export type JobState =
  | { state: 'running'; elapsedMs: number; stage: string; done?: number; total?: number }
  | { state: 'done'; elapsedMs: number; value: unknown }
  | { state: 'failed'; elapsedMs: number; error: JobError }
  | { state: 'cancelled'; elapsedMs: number };

export type { JobError } from './job-error';

/** `stop` ends the job's work: its thread terminated, or its signal aborted. */
type Job = { started: number; state: JobState; stop: () => Promise<void> };

export type JobMessage =
  | { kind: 'stage'; stage: string; done?: number; total?: number }
  | { kind: 'done'; value: unknown }
  | { kind: 'failed'; error: JobError };

/** How long a finished job's result is kept for the page to collect. */
const KEEP_MS = 10 * 60 * 1000;

/**
 * Handlers whose heavy work runs on the kept valving pool's threads: they run on this thread,
 * beside the server, which only reads the revision and ranks what the pool returns. Each must
 * only read, since nothing rolls back a cancelled one.
 */
const ON_POOL: ReadonlySet<HandlerName> = new Set<HandlerName>(['valvingChoose']);

export type JobRunnerOptions = {
  /** The script a threaded job runs (job-worker-boot.js). */
  workerUrl?: URL;
  /** Sweep threads of the kept pool (default: one a core, since this thread does not sweep). */
  valvingThreads?: number;
};

/**
 * Runs API calls as jobs. Most run in a worker thread of their own, each on its own
 * connection to the same database file (WAL lets them work beside the server's); cancelling
 * terminates the thread, and a handler's transaction that has not committed is rolled back by
 * SQLite, so nothing half-done is stored. A valving sweep instead runs on a pool of sweep
 * threads kept from start to close: starting a thread and its sweep workers for every sweep
 * costs more than a warm sweep takes. Cancelling it aborts its signal; it stores nothing.
 */
export class JobRunner {
  private readonly jobs = new Map<string, Job>();
  private readonly workerUrl: URL;
  private readonly storePath: string;
  /** The connection jobs on the pool read through, opened by the first. */
  private store: Store | null = null;
  /** Jobs running on the pool, settled once their handler has returned or thrown. */
  private readonly onPool = new Set<Promise<void>>();
  private closed = false;
  /**
   * Started with the runner, not at the first sweep: the worker is bundled and its threads are
   * up by the time a page asks (a first sweep some 0.3 s sooner, for the memory of idle
   * threads), and the server's ready line does not wait for them.
   */
  readonly valvingPool: ValvingPool;

  constructor(storePath: string, options: JobRunnerOptions = {}) {
    this.storePath = storePath;
    this.workerUrl = options.workerUrl ?? new URL('./job-worker-boot.js', import.meta.url);
    this.valvingPool = new ValvingPool(options.valvingThreads ?? valvingPoolDefaultThreads(false));
  }

  start(name: HandlerName, input: unknown): string {
    if (this.closed) throw new Error('the job runner is closed');
    const id = randomUUID();
    const job: Job = {
      started: Date.now(),
      state: { state: 'running', elapsedMs: 0, stage: 'starting' },
      stop: () => Promise.resolve(),
    };
    this.jobs.set(id, job);
    const finish = (state: JobState) => {
      if (job.state.state !== 'running') return;
      job.state = state;
      setTimeout(() => this.jobs.delete(id), KEEP_MS).unref();
    };
    const stage = (stage: string, done?: number, total?: number) => {
      if (job.state.state !== 'running') return;
      job.state = {
        state: 'running',
        elapsedMs: Date.now() - job.started,
        stage,
        ...(done !== undefined && total !== undefined ? { done, total } : {}),
      };
    };
    if (ON_POOL.has(name)) this.runOnPool(job, name, input, stage, finish);
    else this.runInThread(job, name, input, stage, finish);
    return id;
  }

  private runOnPool(
    job: Job,
    name: HandlerName,
    input: unknown,
    stage: (stage: string, done?: number, total?: number) => void,
    finish: (state: JobState) => void,
  ): void {
    const controller = new AbortController();
    stage('working');
    // Called once start has returned: the page has the job's id before the handler reads anything.
    const run = Promise.resolve()
      .then(() =>
        apiCall(name, input, {
          store: (this.store ??= storeOpen(this.storePath)),
          valvingPool: this.valvingPool,
          signal: controller.signal,
          onProgress: (done, total) => stage(`${done} of ${total}`, done, total),
        }),
      )
      .then(
        (value) => finish({ state: 'done', elapsedMs: Date.now() - job.started, value }),
        (e: unknown) =>
          finish({ state: 'failed', elapsedMs: Date.now() - job.started, error: jobErrorOf(e) }),
      );
    this.onPool.add(run);
    void run.then(() => this.onPool.delete(run));
    // The pool stops the sweep as the signal aborts; the handler's rejection follows.
    job.stop = () => {
      controller.abort();
      return Promise.resolve();
    };
  }

  private runInThread(
    job: Job,
    name: HandlerName,
    input: unknown,
    stage: (stage: string, done?: number, total?: number) => void,
    finish: (state: JobState) => void,
  ): void {
    const worker = new Worker(this.workerUrl, {
      workerData: { storePath: this.storePath, name, input },
    });
    job.stop = () => worker.terminate().then(() => undefined);
    worker.on('message', (m: JobMessage) => {
      const elapsedMs = Date.now() - job.started;
      if (m.kind === 'stage') stage(m.stage, m.done, m.total);
      else if (m.kind === 'done') finish({ state: 'done', elapsedMs, value: m.value });
      else finish({ state: 'failed', elapsedMs, error: m.error });
    });
    worker.on('error', (e) =>
      finish({
        state: 'failed',
        elapsedMs: Date.now() - job.started,
        error: { status: 500, message: `internal error: ${e.message}` },
      }),
    );
    worker.on('exit', () =>
      finish({
        state: 'failed',
        elapsedMs: Date.now() - job.started,
        error: { status: 500, message: 'the job stopped without a result' },
      }),
    );
  }

  get(id: string): JobState | undefined {
    const job = this.jobs.get(id);
    if (!job) return undefined;
    if (job.state.state === 'running') return { ...job.state, elapsedMs: Date.now() - job.started };
    return job.state;
  }

  /**
   * Marks a running job cancelled and stops it. The pool stops a sweep between combinations
   * and stays warm for the next; a sweep still waiting for the pool gives up when its turn comes.
   */
  async cancel(id: string): Promise<JobState | undefined> {
    const job = this.jobs.get(id);
    if (!job) return undefined;
    if (job.state.state === 'running') {
      job.state = { state: 'cancelled', elapsedMs: Date.now() - job.started };
      await job.stop();
    }
    return job.state;
  }

  /** Stops every job, the pool's threads and the runner's connection: nothing keeps the process alive. */
  async closeAll(): Promise<void> {
    this.closed = true;
    const jobs = [...this.jobs.values()];
    this.jobs.clear();
    await Promise.all([...jobs.map((j) => j.stop()), this.valvingPool.close()]);
    await Promise.all(this.onPool);
    if (this.store) storeClose(this.store);
    this.store = null;
  }
}
