import type { CornerInput } from '../../core/corner';
import type { CornerPosition } from '../../core/setup-sheet';
import { setupAnalyze, type AnalysisOptions, type AnalysisResult } from './analysis-model';

/** What the page asks of the analysis worker. */
export type AnalysisRequest = {
  id: number;
  corners: Record<CornerPosition, CornerInput>;
  options: AnalysisOptions;
};

/** What the worker tells the page: progress, the result, or what went wrong. */
export type AnalysisReply =
  | { id: number; kind: 'progress'; fraction: number; stage: string }
  | { id: number; kind: 'done'; result: AnalysisResult }
  | { id: number; kind: 'failed'; message: string; field?: string };

const reply = (r: AnalysisReply) => self.postMessage(r);

// The sweeps and the nonlinear simulation run here, off the page's thread, so that typing and
// scrolling never wait for them; the page cancels by ending this worker.
self.addEventListener('message', (e: MessageEvent<AnalysisRequest>) => {
  const { id, corners, options } = e.data;
  try {
    const result = setupAnalyze(corners, options, (fraction, stage) =>
      reply({ id, kind: 'progress', fraction, stage }),
    );
    reply({ id, kind: 'done', result });
  } catch (err) {
    const field = (err as { field?: unknown }).field;
    reply({
      id,
      kind: 'failed',
      message: err instanceof Error ? err.message : String(err),
      ...(typeof field === 'string' ? { field } : {}),
    });
  }
});
