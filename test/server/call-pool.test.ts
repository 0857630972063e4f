import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import type { HandlerName } from '../../app/api/contract';
import { apiFailureOf } from '../../app/server/api-failure';
import { CALL_QUEUE_MAX, CallPool } from '../../app/server/call-pool';
import { storeClose, storeOpen } from '../../db/store';

let dir: string;
let dbPath: string;
let pool: CallPool;
let vehicle: string;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'rideledger-pool-'));
  dbPath = join(dir, 'shop.sqlite');
  const store = storeOpen(dbPath);
  vehicle = (await apiCall('loadDemo', {}, { store })).vehicles[0] as string;
  storeClose(store);
  pool = new CallPool(dbPath, { threads: 2 });
}, 60_000);
afterAll(async () => {
  await pool.close();
  rmSync(dir, { recursive: true, force: true });
});

const demoCorner = readFileSync('assets/demo/club-coupe-front-left.json', 'utf8');

/** What the server would answer for a call's failure. */
async function failureOf(p: Promise<unknown>) {
  try {
    await p;
  } catch (e) {
    return apiFailureOf(e) ?? { status: 500, message: (e as Error).message };
  }
  throw new Error('the call did not fail');
}

describe('the call pool: calls read and run on kept threads', () => {
  it('answers as the handler does on this thread', async () => {
    const body = JSON.stringify({ file: JSON.parse(demoCorner) });
    const there = (await pool.run('analyzeCorner', body)) as { rideFrequencyHz: number };
    const here = await apiCall('analyzeCorner', JSON.parse(body), {} as never);
    expect(there).toEqual(here);
  }, 60_000);

  it('reads the database on its own connection', async () => {
    const map = (await pool.run(
      'valvingMap',
      JSON.stringify({ vehicle, corner: 'FL', interpolate: false }),
    )) as { vehicle: { name: string } };
    expect(map.vehicle.name).toBe(vehicle);
  }, 60_000);

  it('writes on its own connection what the server’s connection then reads', async () => {
    const store = storeOpen(dbPath);
    try {
      const { bundle } = await apiCall('storeExport', { vehicle }, { store });
      const imported = (await pool.run('storeImport', JSON.stringify({ bundle, asName: 'Pool copy' }))) as {
        vehicle: string;
      };
      expect(imported.vehicle).toBe('Pool copy');
      const names = (await apiCall('vehicleList', {}, { store })).vehicles.map((v) => v.name);
      expect(names).toContain('Pool copy');
    } finally {
      storeClose(store);
    }
  }, 60_000);

  it('refuses bad input with the field named, bad JSON and a path from the page, 400', async () => {
    expect(await failureOf(pool.run('analyzeCorner', JSON.stringify({ file: { corner: 3 } })))).toMatchObject(
      {
        status: 400,
        field: expect.stringContaining('corner'),
      },
    );
    expect(await failureOf(pool.run('analyzeCorner', '{nope'))).toMatchObject({ status: 400 });
    expect(
      await failureOf(
        pool.run('benchImport', JSON.stringify({ damper: 'X', source: { path: '/etc/passwd' } })),
      ),
    ).toMatchObject({ status: 400, field: 'source.path' });
  }, 60_000);
});

const standIn = new URL('./dying-call-worker.js', import.meta.url);

describe('the call pool: threads', () => {
  it('runs two calls at once on two threads, and queues a third', async () => {
    const two = new CallPool(dbPath, { threads: 2, workerUrl: standIn });
    try {
      const answers = (await Promise.all(
        ['a', 'b', 'c'].map((body) => two.run('hold' as HandlerName, body)),
      )) as { echoed: string; threadId: number }[];
      expect(answers.map((a) => a.echoed)).toEqual(['a', 'b', 'c']);
      expect(new Set(answers.map((a) => a.threadId)).size).toBe(2);
    } finally {
      await two.close();
    }
  });

  it('answers its call as an error, is replaced, and the pool serves on', async () => {
    const dying = new CallPool(dbPath, {
      threads: 1,
      workerUrl: standIn,
    });
    try {
      expect(await dying.run('analyzeCorner' as HandlerName, 'a')).toMatchObject({ echoed: 'a' });
      const lost = await failureOf(dying.run('die' as HandlerName, ''));
      expect(lost.status).toBe(500);
      expect(lost.message).toContain('stopped');
      expect(await dying.run('analyzeCorner' as HandlerName, 'b')).toMatchObject({ echoed: 'b' });
    } finally {
      await dying.close();
    }
  });

  it('gives up on threads that cannot start, after three, and says so', async () => {
    const failing = new CallPool(dbPath, {
      threads: 1,
      workerUrl: new URL('./failing-call-worker.js', import.meta.url),
    });
    try {
      const waiting = failureOf(failing.run('analyzeCorner' as HandlerName, 'a'));
      expect((await waiting).message).toMatch(/stopped|could not start/);
      for (let i = 0; i < 200 && failing.available; i++) await new Promise((r) => setTimeout(r, 50));
      expect(failing.available).toBe(false);
      expect((await failureOf(failing.run('analyzeCorner' as HandlerName, 'b'))).message).toContain(
        'this thread cannot start',
      );
    } finally {
      await failing.close();
    }
  });

  it('refuses calls beyond its queue, 503, rather than holding them', async () => {
    const stuck = new CallPool(dbPath, {
      threads: 1,
      workerUrl: standIn,
    });
    try {
      const calls = Array.from({ length: CALL_QUEUE_MAX + 1 }, (_, i) =>
        stuck.run('analyzeCorner' as HandlerName, String(i)),
      );
      expect(await failureOf(stuck.run('analyzeCorner' as HandlerName, 'over'))).toMatchObject({
        status: 503,
      });
      expect((await Promise.all(calls)).length).toBe(CALL_QUEUE_MAX + 1);
    } finally {
      await stuck.close();
    }
  });
});
