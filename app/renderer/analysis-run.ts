import type { CornerInput } from '../../core/corner';
import type { CornerPosition } from '../../core/setup-sheet';
import type { AnalysisOptions } from './analysis-options';
import type { AnalysisResult } from './analysis-result';
import type { AnalysisReply, AnalysisRequest } from './analysis-request';

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

export type AnalysisRun = (
  corners: Record<CornerPosition, CornerInput>,
  options: AnalysisOptions,
  hooks?: { onProgress?: (fraction: number, stage: string) => void; signal?: AbortSignal },
) => Promise<AnalysisResult>;

/**
 * A runner of analyses in a worker that `workerStart` starts. One worker is kept between runs
 * (starting one loads core and mathjs again); aborting a run's signal ends that worker at once,
 * rejects with AnalysisCancelled, and the next run starts a fresh one.
 */
export function analysisRunner(workerStart: () => AnalysisWorker): AnalysisRun {
  let worker: AnalysisWorker | null = null;
  let nextId = 1;
  return (corners, options, hooks = {}) => {
    const w = (worker ??= workerStart());
    const id = nextId++;
    return new Promise((done, fail) => {
      const finish = () => {
        w.removeEventListener('message', onMessage);
        w.removeEventListener('error', onError);
        hooks.signal?.removeEventListener('abort', onAbort);
      };
      const end = () => {
        finish();
        w.terminate();
        if (worker === w) worker = null;
      };
      const onMessage = (e: MessageEvent<AnalysisReply>) => {
        const r = e.data;
        if (r.id !== id) return;
        if (r.kind === 'progress') {
          hooks.onProgress?.(r.fraction, r.stage);
          return;
        }
        finish();
        if (r.kind === 'done') done(r.result);
        else fail(new Error(r.message));
      };
      const onError = (e: ErrorEvent) => {
        end();
        fail(new Error(`the analysis stopped unexpectedly: ${e.message || 'worker error'}`));
      };
      const onAbort = () => {
        end();
        fail(new AnalysisCancelled());
      };
      if (hooks.signal?.aborted) {
        onAbort();
        return;
      }
      w.addEventListener('message', onMessage);
      w.addEventListener('error', onError);
      hooks.signal?.addEventListener('abort', onAbort);
      w.postMessage({ id, corners, options });
    });
  };
}

/** Runs the analysis of one setup in the page's analysis worker. */
export const analysisRun: AnalysisRun = analysisRunner(
  () => new Worker(new URL('./analysis.worker.ts', import.meta.url), { type: 'module' }),
);
