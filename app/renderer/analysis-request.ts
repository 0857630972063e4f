import type { CornerInput } from '../../core/corner';
import type { CornerPosition } from '../../core/setup-sheet';
import { setupAnalyze, type AnalysisResult } from './analysis-result';
import { type AnalysisOptions } from './analysis-options';

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

/** Answers one request: progress as the corners are done, then the result or the failure. */
export function analysisRequestAnswer(request: AnalysisRequest, reply: (r: AnalysisReply) => void): void {
  const { id, corners, options } = request;
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
}
