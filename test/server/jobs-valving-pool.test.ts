import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Worker } from 'node:worker_threads';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { apiCall } from '../../app/api/call';
import type { HandlerOutput } from '../../app/api/contract';
import type { ValvingSweepOptions } from '../../app/api/valving-pool';
import type { ValvingJob } from '../../core/valving/valving-evaluate';
import { JobRunner, type JobState } from '../../app/server/jobs';
import { storeClose, storeOpen } from '../../db/store';
import { storeDigest } from '../db/store-fixture';

/** The demo damper's 5 × 5 measured clicks with those between them (13 × 13) on four corners: 676 combinations. */
const SWEEP = {
  vehicle: 'Millbrook coupe #27',
  corners: ['FL', 'FR', 'RL', 'RR'],
  preset: 'track-day',
  damper: 'MB-DA-1',
  interpolate: true,
};
const COMBINATIONS = 676;

let dir: string;
let dbPath: string;
let runner: JobRunner;
/** The same sweep called outright, without a kept pool (its own workers and this thread). */
let direct: HandlerOutput<'valvingChoose'>;
let digest: string;

function digestNow(): string {
  const store = storeOpen(dbPath);
  try {
    return storeDigest(store);
  } finally {
    storeClose(store);
  }
}

async function settle(id: string): Promise<JobState> {
  for (;;) {
    const s = runner.get(id) as JobState;
    if (s.state !== 'running') return s;
    await new Promise((r) => setTimeout(r, 20));
  }
}

/**
 * Watches the runner's pool: `each` sees every count the pool reports, after the job has
 * taken it; the returned spy holds each sweep's promise.
 */
function poolWatch(each: (done: number, total: number) => void) {
  const pool = runner.valvingPool;
  const sweep = pool.sweep.bind(pool);
  return vi.spyOn(pool, 'sweep').mockImplementation((job: ValvingJob, options: ValvingSweepOptions = {}) =>
    sweep(job, {
      ...options,
      onProgress: (done, total) => {
        options.onProgress?.(done, total);
        each(done, total);
      },
    }),
  );
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'rideledger-jobs-pool-'));
  dbPath = join(dir, 'shop.sqlite');
  const store = storeOpen(dbPath);
  try {
    await apiCall('loadDemo', {}, { store });
    direct = await apiCall('valvingChoose', SWEEP, { store });
    digest = storeDigest(store);
  } finally {
    storeClose(store);
  }
  runner = new JobRunner(dbPath);
});
afterAll(async () => {
  await runner?.closeAll();
  rmSync(dir, { recursive: true, force: true });
});

describe('jobs: valving sweeps on the kept pool', () => {
  it('runs a sweep on the runner’s pool, counting up to the whole, with the ranking a call without a pool gives', async () => {
    let id = '';
    const seen: JobState[] = [];
    const spy = poolWatch(() => seen.push(runner.get(id) as JobState));
    try {
      id = runner.start('valvingChoose', SWEEP);
      const s = await settle(id);
      expect(s.state).toBe('done');
      expect((s as { value: unknown }).value).toStrictEqual(direct);
      expect(direct.combinations).toBe(COMBINATIONS);
      expect(spy).toHaveBeenCalledTimes(1);
    } finally {
      spy.mockRestore();
    }
    const counts = seen.map((s) => (s.state === 'running' ? [s.done, s.total] : s.state));
    expect(counts.length).toBeGreaterThan(1);
    expect(counts.every((c) => Array.isArray(c) && c[1] === COMBINATIONS)).toBe(true);
    const done = counts.map((c) => (c as number[])[0] as number);
    expect(done.every((d, i) => i === 0 || d > (done[i - 1] as number))).toBe(true);
    expect(done.at(-1)).toBe(COMBINATIONS);
    expect(seen.at(-1)).toMatchObject({ stage: `${COMBINATIONS} of ${COMBINATIONS}` });
  });

  it('stops a cancelled sweep part-way and stores nothing; the pool then gives the next sweep the same ranking', async () => {
    let id = '';
    let cancelled: Promise<JobState | undefined> | undefined;
    const done: number[] = [];
    const spy = poolWatch((d) => {
      done.push(d);
      // As the page's cancel would come: on a later turn, while the workers are part-way.
      cancelled ??= new Promise((r) => setImmediate(r)).then(() => runner.cancel(id));
    });
    try {
      id = runner.start('valvingChoose', SWEEP);
      await vi.waitUntil(() => cancelled !== undefined);
      expect((await cancelled)?.state).toBe('cancelled');
      const stopped = spy.mock.results[0]?.value as Promise<unknown>;
      await expect(stopped).rejects.toThrow();
      await new Promise((r) => setImmediate(r));
      // The handler's rejection that follows leaves the job cancelled, not failed.
      expect(runner.get(id)?.state).toBe('cancelled');
      expect(Math.max(...done)).toBeLessThan(COMBINATIONS);
    } finally {
      spy.mockRestore();
    }
    expect(digestNow()).toBe(digest);
    const again = await settle(runner.start('valvingChoose', SWEEP));
    expect(again.state).toBe('done');
    expect((again as { value: unknown }).value).toStrictEqual(direct);
  });

  it('reports bad input with its field, as a call would, and reads nothing more', async () => {
    const none = await settle(runner.start('valvingChoose', { ...SWEEP, corners: [] }));
    expect(none).toMatchObject({ state: 'failed', error: { field: 'corners', status: 400 } });
    const unknown = await settle(runner.start('valvingChoose', { ...SWEEP, vehicle: 'No such car' }));
    expect(unknown).toMatchObject({ state: 'failed', error: { field: 'vehicle', status: 400 } });
    expect((unknown as { error: { message: string } }).error.message).toMatch(/No such car/);
  });

  it('reports a sweep thread that dies as an internal error, and the pool replaces it for the next sweep', async () => {
    const lanes = (runner.valvingPool as unknown as { lanes: { worker: Worker }[] }).lanes;
    let killed: Promise<number> | undefined;
    const spy = poolWatch(() => {
      killed ??= (lanes[0] as { worker: Worker }).worker.terminate();
    });
    let s: JobState;
    try {
      s = await settle(runner.start('valvingChoose', SWEEP));
    } finally {
      spy.mockRestore();
    }
    await killed;
    expect(s).toMatchObject({ state: 'failed', error: { status: 500 } });
    expect((s as { error: { message: string } }).error.message).toMatch(/sweep worker thread stopped/);
    const again = await settle(runner.start('valvingChoose', SWEEP));
    expect(again.state).toBe('done');
    expect((again as { value: unknown }).value).toStrictEqual(direct);
    expect(lanes.length).toBe(runner.valvingPool.threads);
  });

  it('ends the pool’s threads on closeAll: a process that ran a sweep on it exits by itself', async () => {
    const script = fileURLToPath(new URL('./pooled-sweep-exit.ts', import.meta.url));
    const child = spawn(process.execPath, ['--import', 'tsx', script, dbPath], {
      cwd: fileURLToPath(new URL('../..', import.meta.url)),
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    let err = '';
    child.stdout.on('data', (d: Buffer) => (out += d.toString()));
    child.stderr.on('data', (d: Buffer) => (err += d.toString()));
    // Not a timing: a process that some thread keeps alive would wait here forever.
    const watchdog = setTimeout(() => child.kill('SIGKILL'), 25_000);
    const code = await new Promise<number | null>((r) => child.once('exit', (c) => r(c)));
    clearTimeout(watchdog);
    expect(code, err).toBe(0);
    expect(JSON.parse(out)).toEqual({
      state: 'done',
      combinations: COMBINATIONS,
      threads: runner.valvingPool.threads,
      afterClose: 'the job runner is closed',
    });
  });
});
