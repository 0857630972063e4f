import { describe, expect, it } from 'vitest';
import {
  analysisOptionTextsDefault,
  analysisOptionsRead,
  type AnalysisOptions,
} from '../../app/renderer/analysis-options';
import {
  analysisRequestAnswer,
  type AnalysisReply,
  type AnalysisRequest,
} from '../../app/renderer/analysis-request';
import { AnalysisCancelled, analysisRunner, type AnalysisWorker } from '../../app/renderer/analysis-run';
import { WORKED_CORNER, fourOf } from './worked-corner';

const CORNER = WORKED_CORNER;
const CORNERS = fourOf(CORNER);
const read = analysisOptionsRead(analysisOptionTextsDefault('si'), 'si');
const OPTIONS = (read as { options: AnalysisOptions }).options;

/**
 * A stand-in for the Web Worker: it answers each request with the same code the worker runs,
 * one reply per turn of the event loop as a real worker's messages arrive, until terminated.
 */
class FakeWorker implements AnalysisWorker {
  static started = 0;
  terminated = false;
  private readonly listeners = {
    message: new Set<(e: MessageEvent<AnalysisReply>) => void>(),
    error: new Set<(e: ErrorEvent) => void>(),
  };
  constructor() {
    FakeWorker.started++;
  }
  postMessage(request: AnalysisRequest): void {
    const replies: AnalysisReply[] = [];
    analysisRequestAnswer(structuredClone(request), (r) => replies.push(structuredClone(r)));
    const next = () => {
      const r = replies.shift();
      if (!r || this.terminated) return;
      for (const l of this.listeners.message) l({ data: r } as MessageEvent<AnalysisReply>);
      setTimeout(next, 0);
    };
    setTimeout(next, 0);
  }
  terminate(): void {
    this.terminated = true;
  }
  addEventListener(type: 'message' | 'error', l: never): void {
    (this.listeners[type] as Set<unknown>).add(l);
  }
  removeEventListener(type: 'message' | 'error', l: never): void {
    (this.listeners[type] as Set<unknown>).delete(l);
  }
  fail(message: string): void {
    for (const l of this.listeners.error) l({ message } as ErrorEvent);
  }
}

describe('analysisRunner', () => {
  it('reports progress and resolves with what the worker worked out', async () => {
    const run = analysisRunner(() => new FakeWorker());
    const seen: string[] = [];
    const result = await run(CORNERS, OPTIONS, {
      onProgress: (f, stage) => seen.push(`${f.toFixed(1)} ${stage}`),
    });
    expect(seen[0]).toBe('0.0 FL: figures, random road and the bump');
    expect(seen[seen.length - 1]).toBe('1.0 done');
    // The result crosses the worker boundary whole: figures and the typed arrays of the histories.
    expect(result.corners.RR.randomRoad.bodyAccelRms).toBeGreaterThan(0);
    expect(result.corners.FL.stepHistory.time).toBeInstanceOf(Float64Array);
  });

  it('keeps one worker between runs', async () => {
    const before = FakeWorker.started;
    const run = analysisRunner(() => new FakeWorker());
    await run(CORNERS, OPTIONS);
    await run(CORNERS, OPTIONS);
    expect(FakeWorker.started - before).toBe(1);
  });

  it('ends the worker when cancelled, rejects with AnalysisCancelled, and starts afresh after', async () => {
    const workers: FakeWorker[] = [];
    const run = analysisRunner(() => {
      const w = new FakeWorker();
      workers.push(w);
      return w;
    });
    const controller = new AbortController();
    const pending = run(CORNERS, OPTIONS, {
      signal: controller.signal,
      onProgress: () => controller.abort(),
    });
    await expect(pending).rejects.toBeInstanceOf(AnalysisCancelled);
    expect(workers[0]?.terminated).toBe(true);
    await expect(run(CORNERS, OPTIONS)).resolves.toBeDefined();
    expect(workers).toHaveLength(2);
  });

  it('does not start on a signal already aborted', async () => {
    const run = analysisRunner(() => new FakeWorker());
    const controller = new AbortController();
    controller.abort();
    await expect(run(CORNERS, OPTIONS, { signal: controller.signal })).rejects.toThrow(/Stopped/);
  });

  it('says what went wrong when the worker fails or a corner cannot be worked out', async () => {
    let w: FakeWorker | undefined;
    const run = analysisRunner(() => (w = new FakeWorker()));
    const crashing = run(CORNERS, OPTIONS);
    w?.fail('out of memory');
    await expect(crashing).rejects.toThrow('the analysis stopped unexpectedly: out of memory');
    expect(w?.terminated).toBe(true);
    const bad = { ...CORNERS, RL: { ...CORNER, cornerMass: Number.NaN } };
    await expect(run(bad, OPTIONS)).rejects.toThrow(
      'corners.RL.corner.cornerMass: corner mass must be a finite number (got NaN)',
    );
  });
});
