import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { JobRunner, type JobState } from '../../app/server/jobs';
import { storeClose, storeOpen } from '../../db/store';

let dir: string;
let dbPath: string;
let jobs: JobRunner;

async function settle(id: string, onRunning?: (s: JobState) => void): Promise<JobState> {
  for (;;) {
    const s = jobs.get(id) as JobState;
    if (s.state !== 'running') return s;
    onRunning?.(s);
    await new Promise((r) => setTimeout(r, 20));
  }
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'rideledger-jobs-'));
  dbPath = join(dir, 'shop.sqlite');
  const store = storeOpen(dbPath);
  await apiCall('loadDemo', {}, { store });
  storeClose(store);
  jobs = new JobRunner(dbPath);
});
afterAll(async () => {
  await jobs.closeAll();
  rmSync(dir, { recursive: true, force: true });
});

describe('jobs: long calls in worker threads', () => {
  it('runs a call on its own connection and keeps the result', async () => {
    const s = await settle(jobs.start('storeCheck', {}));
    expect(s.state).toBe('done');
    expect((s as { value: { ok: boolean } }).value.ok).toBe(true);
  });

  it('reports a valving sweep’s progress as it goes, then its ranking', async () => {
    const seen: number[] = [];
    // Interpolated clicks make the demo damper's 5 × 5 grid 13 × 13: 676 combinations over four corners.
    const id = jobs.start('valvingChoose', {
      vehicle: 'Millbrook coupe #27',
      corners: ['FL', 'FR', 'RL', 'RR'],
      preset: 'track-day',
      damper: 'MB-DA-1',
      interpolate: true,
    });
    const s = await settle(id, (r) => {
      if (r.state === 'running' && r.done !== undefined) seen.push(r.done / (r.total as number));
    });
    expect(s.state).toBe('done');
    expect(seen.length).toBeGreaterThan(0);
    expect(Math.max(...seen)).toBeLessThanOrEqual(1);
    const value = (s as { value: { corners: { best: unknown[] }[]; combinations: number } }).value;
    expect(value.combinations).toBe(676);
    expect(value.corners[0]?.best.length).toBeGreaterThan(0);
  });

  it('reports bad input with its field, as a call would', async () => {
    const s = await settle(
      jobs.start('valvingChoose', { vehicle: 'Millbrook coupe #27', corners: [], preset: 'track-day' }),
    );
    expect(s.state).toBe('failed');
    expect((s as { error: { field?: string; status: number } }).error).toMatchObject({
      field: 'corners',
      status: 400,
    });
  });

  it('stores nothing when a bench import is cancelled', async () => {
    const rows = ['velocity,force'];
    for (let i = 1; i <= 400_000; i++) rows.push(`${(i / 400_000).toFixed(6)},${(i / 100).toFixed(3)}`);
    const id = jobs.start('benchImport', {
      damper: 'Cancelled unit',
      source: { text: rows.join('\n'), name: 'big.csv' },
    });
    await new Promise((r) => setTimeout(r, 150));
    const cancelled = await jobs.cancel(id);
    expect(cancelled?.state).toBe('cancelled');
    const store = storeOpen(dbPath);
    try {
      const list = await apiCall('benchList', {}, { store });
      expect(list.dampers.map((d) => d.label)).not.toContain('Cancelled unit');
      expect((await apiCall('storeCheck', {}, { store })).ok).toBe(true);
    } finally {
      storeClose(store);
    }
  });
});
