import { describe, expect, it } from 'vitest';
import {
  analysisOptionTextsDefault,
  analysisOptionsRead,
  type AnalysisOptions,
} from '../../app/renderer/analysis-options';
import {
  analysisWorkerServe,
  type AnalysisReply,
  type AnalysisRequest,
} from '../../app/renderer/analysis-request';
import {
  FRF_RANGE,
  analysisResultOf,
  cornerLinearAnalyze,
  setupAnalyze,
} from '../../app/renderer/analysis-result';
import { cornerAnalyze } from '../../core/figures/corner-analysis';
import { frequencyResponseGrid } from '../../core/corner/frequency-response';
import { AnalysisCancelled, analysisRunner, type AnalysisWorker } from '../../app/renderer/analysis-run';
import { WORKED_CORNER, fourOf } from './worked-corner';

const CORNER = WORKED_CORNER;
const CORNERS = fourOf(CORNER);
const read = analysisOptionsRead(analysisOptionTextsDefault('si'), 'si');
const OPTIONS = (read as { options: AnalysisOptions }).options;
const LINEAR = { kind: 'linear' as const, corners: CORNERS, road: OPTIONS.road };
const EVENTS = { kind: 'events' as const, corners: CORNERS, bump: OPTIONS.bump };

/**
 * A stand-in for the Web Worker: it serves each request with the same code the worker runs,
 * messages crossing by structured clone one turn of the event loop later, as a real worker's do.
 */
class FakeWorker implements AnalysisWorker {
  static started = 0;
  terminated = false;
  /** Jobs the serving code was handed, by kind. */
  readonly received: string[] = [];
  private readonly listeners = {
    message: new Set<(e: MessageEvent<AnalysisReply>) => void>(),
    error: new Set<(e: ErrorEvent) => void>(),
  };
  private readonly serve = analysisWorkerServe((r) => {
    const data = structuredClone(r);
    setTimeout(() => {
      if (this.terminated) return;
      for (const l of this.listeners.message) l({ data } as MessageEvent<AnalysisReply>);
    }, 0);
  });
  constructor() {
    FakeWorker.started++;
  }
  postMessage(request: AnalysisRequest): void {
    const data = structuredClone(request);
    setTimeout(() => {
      this.received.push(data.kind);
      if (!this.terminated) this.serve(data);
    }, 0);
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
    const linear = await run(LINEAR, { onProgress: (f, stage) => seen.push(`${f.toFixed(2)} ${stage}`) });
    expect(seen).toEqual([
      '0.00 FL: figures, step and random road',
      '0.25 FR: figures, step and random road',
      '0.50 RL: figures, step and random road',
      '0.75 RR: figures, step and random road',
    ]);
    // The result crosses the worker boundary whole: figures and the typed arrays of the histories.
    expect(linear.corners.RR.randomRoad.bodyAccelRms).toBeGreaterThan(0);
    expect(linear.corners.FL.stepHistory.time).toBeInstanceOf(Float64Array);
    const events = await run(EVENTS);
    expect(events.corners.FL.bumpHistory.time).toBeInstanceOf(Float64Array);
  });

  it('gives, in its two parts, exactly the whole analysis', async () => {
    const run = analysisRunner(() => new FakeWorker());
    const [linear, events] = await Promise.all([run(LINEAR), run(EVENTS)]);
    const whole = setupAnalyze(CORNERS, OPTIONS);
    const parts = analysisResultOf(linear, events);
    expect(parts.options).toEqual(whole.options);
    expect(parts.stepWindow).toBe(whole.stepWindow);
    for (const p of ['FL', 'RR'] as const) {
      expect(parts.corners[p].figures).toEqual(whole.corners[p].figures);
      expect(parts.corners[p].bump).toEqual(whole.corners[p].bump);
      expect(parts.corners[p].randomRoad).toEqual(whole.corners[p].randomRoad);
      expect(parts.corners[p].warnings).toEqual(whole.corners[p].warnings);
      expect([...parts.corners[p].bumpHistory.travel]).toEqual([...whole.corners[p].bumpHistory.travel]);
      expect([...parts.corners[p].stepHistory.tireLoad]).toEqual([...whole.corners[p].stepHistory.tireLoad]);
    }
  });

  it('keeps one worker between runs', async () => {
    const before = FakeWorker.started;
    const run = analysisRunner(() => new FakeWorker());
    await run(LINEAR);
    await run(EVENTS);
    expect(FakeWorker.started - before).toBe(1);
  });

  it('drops a cancelled run in the worker, which stays warm and answers the next', async () => {
    const workers: FakeWorker[] = [];
    const run = analysisRunner(() => {
      const w = new FakeWorker();
      workers.push(w);
      return w;
    });
    const controller = new AbortController();
    const finished: string[] = [];
    const pending = run(EVENTS, { signal: controller.signal, onProgress: () => controller.abort() });
    pending.then(
      () => finished.push('cancelled run'),
      () => undefined,
    );
    await expect(pending).rejects.toBeInstanceOf(AnalysisCancelled);
    const next = await run(LINEAR);
    expect(next.corners.FL.figures.rideFrequencyHz).toBeGreaterThan(0);
    expect(workers).toHaveLength(1);
    expect(workers[0]?.terminated).toBe(false);
    expect(workers[0]?.received).toEqual(['events', 'cancel', 'linear']);
    expect(finished).toEqual([]);
  });

  it('does not start on a signal already aborted', async () => {
    const run = analysisRunner(() => new FakeWorker());
    const controller = new AbortController();
    controller.abort();
    await expect(run(LINEAR, { signal: controller.signal })).rejects.toThrow(/Stopped/);
  });

  it('says what went wrong when the worker fails or a corner cannot be worked out', async () => {
    let w: FakeWorker | undefined;
    const run = analysisRunner(() => (w = new FakeWorker()));
    const crashing = run(LINEAR);
    w?.fail('out of memory');
    await expect(crashing).rejects.toThrow('the analysis stopped unexpectedly: out of memory');
    expect(w?.terminated).toBe(true);
    const bad = { ...CORNERS, RL: { ...CORNER, cornerMass: Number.NaN } };
    await expect(run({ ...LINEAR, corners: bad })).rejects.toThrow(
      'corners.RL.corner.cornerMass: corner mass must be a finite number (got NaN)',
    );
    await expect(run({ ...EVENTS, corners: bad })).rejects.toThrow(/^corners\.RL\.corner\.cornerMass: /);
  });
});

describe('cornerLinearAnalyze', () => {
  it('gives what core’s cornerAnalyze gives, and works the step out once a corner, whatever the road', () => {
    const a = cornerLinearAnalyze('FL', CORNER, OPTIONS.road);
    const core = cornerAnalyze(
      { name: 'FL', corner: CORNER, road: OPTIONS.road },
      { frequencies: frequencyResponseGrid(FRF_RANGE.low, FRF_RANGE.high, FRF_RANGE.perDecade) },
    );
    expect(a.figures).toEqual(core.figures);
    expect(a.modes).toEqual(core.modes);
    expect(a.step).toEqual(core.step);
    expect(a.frf).toEqual(core.frf);
    expect(a.randomRoad).toEqual(core.randomRoad);
    expect(a.warnings.si).toEqual(core.warnings);
    // Twice the speed: the same step (not worked out again), another random road.
    const b = cornerLinearAnalyze('FL', CORNER, { ...OPTIONS.road, speed: 2 * OPTIONS.road.speed });
    expect(b.step).toBe(a.step);
    expect(b.randomRoad.bodyAccelRms).not.toBe(a.randomRoad.bodyAccelRms);
    // Another corner gets its own.
    const stiffer = cornerLinearAnalyze('FL', { ...CORNER, springRate: 2 * CORNER.springRate }, OPTIONS.road);
    expect(stiffer.step).not.toBe(a.step);
  });
});

describe('analysisWorkerServe', () => {
  it('does the jobs one at a time, in order, and skips one cancelled before it starts', async () => {
    const replies: AnalysisReply[] = [];
    const serve = analysisWorkerServe((r) => replies.push(r));
    serve({ id: 1, ...LINEAR });
    serve({ id: 2, ...EVENTS });
    serve({ id: 3, ...LINEAR });
    serve({ id: 2, kind: 'cancel' });
    await new Promise((done) => setTimeout(done, 0));
    await expect.poll(() => replies.filter((r) => r.kind === 'done').map((r) => r.id)).toEqual([1, 3]);
    // Each job's progress before its result, never interleaved with another's.
    const order = replies.map((r) => r.id);
    expect(order.slice(0, order.lastIndexOf(1) + 1).every((id) => id === 1)).toBe(true);
  });

  it('drops a job cancelled while it runs at the next corner, and goes on to the next job', async () => {
    const replies: AnalysisReply[] = [];
    const serve: (r: AnalysisRequest) => void = analysisWorkerServe((r) => {
      replies.push(r);
      // The cancel arrives while the first corner is being worked out.
      if (r.id === 1 && r.kind === 'progress') serve({ id: 1, kind: 'cancel' });
    });
    serve({ id: 1, ...EVENTS });
    serve({ id: 2, ...LINEAR });
    await expect.poll(() => replies.some((r) => r.id === 2 && r.kind === 'done')).toBe(true);
    expect(replies.filter((r) => r.id === 1).map((r) => r.kind)).toEqual(['progress']);
  });
});
