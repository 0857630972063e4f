import type { AnalysisJob, AnalysisJobResult, AnalysisReply, AnalysisRequest } from './analysis-request';

/** The analysis was stopped by the user (or replaced by a newer one) before it finished. */
export class AnalysisCancelled extends Error {
  constructor() {
    super('Stopped: the figures were not worked out.');
    this.name = 'AnalysisCancelled';
  }
}

/** The part of a Web Worker the runner uses. */
export type AnalysisWorker = {
  postMessage(request: AnalysisRequest): void;
  terminate(): void;
  addEventListener(type: 'message', listener: (e: MessageEvent<AnalysisReply>) => void): void;
  addEventListener(type: 'error', listener: (e: ErrorEvent) => void): void;
  removeEventListener(type: 'message', listener: (e: MessageEvent<AnalysisReply>) => void): void;
  removeEventListener(type: 'error', listener: (e: ErrorEvent) => void): void;
};

export type AnalysisRun = <J extends AnalysisJob>(
  job: J,
  hooks?: { onProgress?: (fraction: number, stage: string) => void; signal?: AbortSignal },
) => Promise<AnalysisJobResult<J>>;

/**
 * A runner of analysis jobs in a worker that `workerStart` starts. One worker is kept between
 * runs (starting one loads core and mathjs again). Aborting a run's signal rejects it at once
 * with AnalysisCancelled and tells the worker, which drops the job at its next corner and goes
 * on to the next; a worker that fails is ended, and the next run starts a fresh one.
 */
export function analysisRunner(workerStart: () => AnalysisWorker): AnalysisRun {
  let worker: AnalysisWorker | null = null;
  let nextId = 1;
  return <J extends AnalysisJob>(
    job: J,
    hooks: { onProgress?: (fraction: number, stage: string) => void; signal?: AbortSignal } = {},
  ) => {
    if (hooks.signal?.aborted) return Promise.reject(new AnalysisCancelled());
    const w = (worker ??= workerStart());
    const id = nextId++;
    return new Promise<AnalysisJobResult<J>>((done, fail) => {
      const finish = () => {
        w.removeEventListener('message', onMessage);
        w.removeEventListener('error', onError);
        hooks.signal?.removeEventListener('abort', onAbort);
      };
      const onMessage = (e: MessageEvent<AnalysisReply>) => {
        const r = e.data;
        if (r.id !== id) return;
        if (r.kind === 'progress') {
          hooks.onProgress?.(r.fraction, r.stage);
          return;
        }
        finish();
        if (r.kind === 'done') done(r.result as AnalysisJobResult<J>);
        else fail(new Error(r.message));
      };
      const onError = (e: ErrorEvent) => {
        finish();
        w.terminate();
        if (worker === w) worker = null;
        fail(new Error(`the analysis stopped unexpectedly: ${e.message || 'worker error'}`));
      };
      const onAbort = () => {
        finish();
        w.postMessage({ id, kind: 'cancel' });
        fail(new AnalysisCancelled());
      };
      w.addEventListener('message', onMessage);
      w.addEventListener('error', onError);
      hooks.signal?.addEventListener('abort', onAbort);
      w.postMessage({ id, ...job });
    });
  };
}

const workerStart = () => new Worker(new URL('./analysis.worker.ts', import.meta.url), { type: 'module' });

/**
 * The page's two analysis workers: the linear figures and the bump each in one of their own,
 * so that each is worked out alongside the other and a new road never waits for the bump.
 */
export const analysisRunLinear: AnalysisRun = analysisRunner(workerStart);
export const analysisRunEvents: AnalysisRun = analysisRunner(workerStart);
