import type { CornerInput } from '../../core/corner/corner';
import type { BumpSpec, RoadSpec } from '../../core/corner/corner-file';
import { CORNER_POSITIONS, type CornerPosition } from '../../core/setup/setup-sheet';
import {
  analysisLinearOf,
  cornerEventAnalyze,
  cornerLinearAnalyze,
  type AnalysisEvents,
  type AnalysisLinear,
  type CornerEvent,
  type CornerLinear,
} from './analysis-result';

/**
 * A part of the analysis the page asks of a worker: the linear model's figures on a road, or
 * the nonlinear bump. Each is asked for only when its own input (or the setup) changes.
 */
export type AnalysisJob =
  | { kind: 'linear'; corners: Record<CornerPosition, CornerInput>; road: RoadSpec }
  | { kind: 'events'; corners: Record<CornerPosition, CornerInput>; bump: BumpSpec };

/** What a job gives back. */
export type AnalysisJobResult<J extends AnalysisJob> = J extends { kind: 'linear' }
  ? AnalysisLinear
  : AnalysisEvents;

/** What the page tells the analysis worker: a job to do, or that one is no longer wanted. */
export type AnalysisRequest = ({ id: number } & AnalysisJob) | { id: number; kind: 'cancel' };

/** What the worker tells the page: progress, the result, or what went wrong. */
export type AnalysisReply =
  | { id: number; kind: 'progress'; fraction: number; stage: string }
  | { id: number; kind: 'done'; result: AnalysisLinear | AnalysisEvents }
  | { id: number; kind: 'failed'; message: string; field?: string };

/** One turn of the worker's event loop, so that a cancel or a newer job sent meanwhile is read. */
const turn = () => new Promise<void>((done) => setTimeout(done, 0));

/** The job was cancelled while it ran: it ends quietly. */
class JobDropped extends Error {}

/**
 * The worker's side: takes requests one at a time, in order, and works each job out corner by
 * corner, letting the event loop turn between corners so that a cancel is read and the
 * cancelled job dropped there — the worker stays warm for the next job instead of being ended
 * and started again.
 */
export function analysisWorkerServe(reply: (r: AnalysisReply) => void): (request: AnalysisRequest) => void {
  const cancelled = new Set<number>();
  let queue: Promise<void> = Promise.resolve();
  const check = (id: number) => {
    if (cancelled.has(id)) throw new JobDropped();
  };
  const answer = async (request: { id: number } & AnalysisJob) => {
    const { id } = request;
    try {
      check(id);
      const n = CORNER_POSITIONS.length;
      const progress = (i: number, stage: string) => reply({ id, kind: 'progress', fraction: i / n, stage });
      if (request.kind === 'linear') {
        const linear = {} as Record<CornerPosition, CornerLinear>;
        for (const [i, p] of CORNER_POSITIONS.entries()) {
          progress(i, `${p}: figures, step and random road`);
          linear[p] = cornerLinearAnalyze(p, request.corners[p], request.road);
          await turn();
          check(id);
        }
        reply({ id, kind: 'done', result: analysisLinearOf(request.corners, request.road, linear) });
      } else {
        const corners = {} as Record<CornerPosition, CornerEvent>;
        for (const [i, p] of CORNER_POSITIONS.entries()) {
          progress(i, `${p}: the bump`);
          corners[p] = cornerEventAnalyze(p, request.corners[p], request.bump);
          await turn();
          check(id);
        }
        reply({ id, kind: 'done', result: { bump: request.bump, corners } });
      }
    } catch (err) {
      if (err instanceof JobDropped) return;
      const field = (err as { field?: unknown }).field;
      reply({
        id,
        kind: 'failed',
        message: err instanceof Error ? err.message : String(err),
        ...(typeof field === 'string' ? { field } : {}),
      });
    } finally {
      cancelled.delete(id);
    }
  };
  return (request) => {
    if (request.kind === 'cancel') {
      cancelled.add(request.id);
      return;
    }
    queue = queue.then(() => answer(request));
  };
}
