import { randomUUID } from 'node:crypto';
import { Worker } from 'node:worker_threads';
import type { HandlerName } from '../api/contract';

/** A long call (a large bench import, a backup) running in a worker thread so the server stays responsive. */
export type JobState =
  | { state: 'running'; elapsedMs: number; stage: string }
  | { state: 'done'; elapsedMs: number; value: unknown }
  | { state: 'failed'; elapsedMs: number; error: { field?: string; message: string; status: number } }
  | { state: 'cancelled'; elapsedMs: number };

type Job = { worker: Worker; started: number; state: JobState };

export type JobMessage =
  | { kind: 'stage'; stage: string }
  | { kind: 'done'; value: unknown }
  | { kind: 'failed'; error: { field?: string; message: string; status: number } };

/** How long a finished job's result is kept for the page to collect. */
const KEEP_MS = 10 * 60 * 1000;

/**
 * Runs API calls in worker threads, each on its own connection to the same database file
 * (WAL lets them work beside the server's). Cancelling terminates the thread: a handler's
 * transaction that has not committed is rolled back by SQLite, so nothing half-done is stored.
 */
export class JobRunner {
  private readonly jobs = new Map<string, Job>();
  private readonly workerUrl: URL;
  private readonly storePath: string;

  constructor(storePath: string, workerUrl = new URL('./job-worker-boot.js', import.meta.url)) {
    this.storePath = storePath;
    this.workerUrl = workerUrl;
  }

  start(name: HandlerName, input: unknown): string {
    const id = randomUUID();
    const worker = new Worker(this.workerUrl, {
      workerData: { storePath: this.storePath, name, input },
    });
    const job: Job = {
      worker,
      started: Date.now(),
      state: { state: 'running', elapsedMs: 0, stage: 'starting' },
    };
    this.jobs.set(id, job);
    const finish = (state: JobState) => {
      if (job.state.state !== 'running') return;
      job.state = state;
      setTimeout(() => this.jobs.delete(id), KEEP_MS).unref();
    };
    worker.on('message', (m: JobMessage) => {
      const elapsedMs = Date.now() - job.started;
      if (m.kind === 'stage' && job.state.state === 'running')
        job.state = { state: 'running', elapsedMs, stage: m.stage };
      else if (m.kind === 'done') finish({ state: 'done', elapsedMs, value: m.value });
      else if (m.kind === 'failed') finish({ state: 'failed', elapsedMs, error: m.error });
    });
    worker.on('error', (e) =>
      finish({
        state: 'failed',
        elapsedMs: Date.now() - job.started,
        error: { status: 500, message: `internal error: ${e.message}` },
      }),
    );
    worker.on('exit', () => {
      if (job.state.state === 'running') {
        finish({
          state: 'failed',
          elapsedMs: Date.now() - job.started,
          error: { status: 500, message: 'the job stopped without a result' },
        });
      }
    });
    return id;
  }

  get(id: string): JobState | undefined {
    const job = this.jobs.get(id);
    if (!job) return undefined;
    if (job.state.state === 'running') return { ...job.state, elapsedMs: Date.now() - job.started };
    return job.state;
  }

  async cancel(id: string): Promise<JobState | undefined> {
    const job = this.jobs.get(id);
    if (!job) return undefined;
    if (job.state.state === 'running') {
      job.state = { state: 'cancelled', elapsedMs: Date.now() - job.started };
      await job.worker.terminate();
    }
    return job.state;
  }

  async closeAll(): Promise<void> {
    await Promise.all([...this.jobs.values()].map((j) => j.worker.terminate()));
    this.jobs.clear();
  }
}
