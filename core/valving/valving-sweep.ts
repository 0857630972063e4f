import {
  valvingEvaluatorOf,
  valvingJobSize,
  type ValvingEvaluator,
  type ValvingFigures,
  type ValvingJob,
} from './valving-evaluate';

/** What a worker hands back: the figures of combinations start, start + 1, … (fewer when it was stopped). */
export type ValvingChunk = { start: number; figures: ValvingFigures[]; stopped: boolean };

/** A sweep's hooks: progress after each combination, and a stop asked between combinations. */
export type ValvingSweepHooks = {
  /** Called after each combination with how many of this call's are done. */
  onProgress?: (done: number) => void;
  /** Asked before each combination; true ends the call there, with what is done so far. */
  shouldStop?: () => boolean;
};

/**
 * Evaluates combinations [start, end) of the evaluator's job, one after the other: the piece
 * of a sweep a worker (worker thread or Web Worker) runs. Stops between combinations when
 * `shouldStop` says so; the chunk then holds those done and `stopped` is true.
 */
export function valvingChunkEvaluate(
  evaluator: ValvingEvaluator,
  start: number,
  end: number,
  hooks: ValvingSweepHooks = {},
): ValvingChunk {
  if (!Number.isInteger(start) || !Number.isInteger(end) || start < 0 || end > evaluator.size || end < start)
    throw new RangeError(`chunk ${start}…${end} is not within the job's 0…${evaluator.size}`);
  const figures: ValvingFigures[] = [];
  for (let i = start; i < end; i++) {
    if (hooks.shouldStop?.()) return { start, figures, stopped: true };
    figures.push(evaluator.evaluate(i));
    hooks.onProgress?.(figures.length);
  }
  return { start, figures, stopped: false };
}

/** Splits a job of `size` combinations into chunks of about `chunkSize`, in order. */
export function valvingChunkRanges(size: number, chunkSize: number): { start: number; end: number }[] {
  const step = Math.max(1, Math.floor(chunkSize));
  const out: { start: number; end: number }[] = [];
  for (let s = 0; s < size; s += step) out.push({ start: s, end: Math.min(size, s + step) });
  return out;
}

/**
 * The chunks of a sweep put back in order, by corner then cell (figures[corner][cell]).
 * @throws Error when a combination is missing or given twice: a sweep is merged whole or not at all.
 */
export function valvingSweepMerge(job: ValvingJob, chunks: readonly ValvingChunk[]): ValvingFigures[][] {
  const size = valvingJobSize(job);
  const all = new Array<ValvingFigures | undefined>(size);
  for (const c of chunks) {
    c.figures.forEach((f, k) => {
      const i = c.start + k;
      if (i >= size) throw new Error(`combination ${i} is past the job's ${size}`);
      if (all[i] !== undefined) throw new Error(`combination ${i} was evaluated twice`);
      all[i] = f;
    });
  }
  const missing = all.findIndex((f) => f === undefined);
  if (missing >= 0 || all.length !== size) throw new Error(`combination ${missing} has no result`);
  const cells = job.cells.length;
  return job.corners.map((_, k) => all.slice(k * cells, (k + 1) * cells) as ValvingFigures[]);
}

/** A sweep ended by its caller before every combination was evaluated. */
export class ValvingSweepStopped extends Error {
  constructor(done: number, size: number) {
    super(`the sweep was stopped after ${done} of ${size} combinations; nothing was chosen`);
    this.name = 'ValvingSweepStopped';
  }
}

/**
 * A whole sweep in this thread: every combination, one by one.
 * @throws ValvingSweepStopped when `shouldStop` ends it early.
 */
export function valvingSweepSerial(job: ValvingJob, hooks: ValvingSweepHooks = {}): ValvingFigures[][] {
  const evaluator = valvingEvaluatorOf(job);
  const chunk = valvingChunkEvaluate(evaluator, 0, evaluator.size, hooks);
  if (chunk.stopped) throw new ValvingSweepStopped(chunk.figures.length, evaluator.size);
  return valvingSweepMerge(job, [chunk]);
}
