import type { CornerInput } from '../../core/corner';
import type { CornerPosition } from '../../core/setup-sheet';
import type { AnalysisOptions, AnalysisResult } from './analysis-model';
import type { AnalysisReply, AnalysisRequest } from './analysis.worker';

/** The analysis was stopped by the user (or replaced by a newer one) before it finished. */
export class AnalysisCancelled extends Error {
  constructor() {
    super('Stopped: the figures were not worked out.');
    this.name = 'AnalysisCancelled';
  }
}

let worker: Worker | null = null;
let nextId = 1;

function workerGet(): Worker {
  // One worker kept between runs: starting one loads core and mathjs again.
  worker ??= new Worker(new URL('./analysis.worker.ts', import.meta.url), { type: 'module' });
  return worker;
}

/**
 * Runs the analysis of one setup in the analysis worker, with progress; aborting the signal
 * ends the worker at once (a new one starts for the next run) and rejects with AnalysisCancelled.
 */
export function analysisRun(
  corners: Record<CornerPosition, CornerInput>,
  options: AnalysisOptions,
  hooks: { onProgress?: (fraction: number, stage: string) => void; signal?: AbortSignal } = {},
): Promise<AnalysisResult> {
  const w = workerGet();
  const id = nextId++;
  return new Promise((done, fail) => {
    const finish = () => {
      w.removeEventListener('message', onMessage);
      w.removeEventListener('error', onError);
      hooks.signal?.removeEventListener('abort', onAbort);
    };
    const onMessage = (e: MessageEvent<AnalysisReply>) => {
      const r = e.data;
      if (r.id !== id) return;
      if (r.kind === 'progress') hooks.onProgress?.(r.fraction, r.stage);
      else {
        finish();
        if (r.kind === 'done') done(r.result);
        else fail(new Error(r.message));
      }
    };
    const onError = (e: ErrorEvent) => {
      finish();
      w.terminate();
      if (worker === w) worker = null;
      fail(new Error(`the analysis stopped unexpectedly: ${e.message || 'worker error'}`));
    };
    const onAbort = () => {
      finish();
      w.terminate();
      if (worker === w) worker = null;
      fail(new AnalysisCancelled());
    };
    if (hooks.signal?.aborted) {
      onAbort();
      return;
    }
    w.addEventListener('message', onMessage);
    w.addEventListener('error', onError);
    hooks.signal?.addEventListener('abort', onAbort);
    const request: AnalysisRequest = { id, corners, options };
    w.postMessage(request);
  });
}
