import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TABLE_POINTS_MAX } from '../../app/api/input-bounds';
import { API_PREFIX, TOKEN_HEADER } from '../../app/server/http-server';
import { backendChildStart, type BackendChild } from './backend-child';

// One request cannot stall the others (issue 11, item 2): while a heavy call runs, a typical
// figures request (the revision's figures the page asks for on every screen) keeps its p99
// under 100 ms. Against the real backend process, on loopback.

let backend: BackendChild;
let vehicle: string;

type Answer = { status: number; ms: number; body: string };

/** A call; `input` already as JSON text is sent as it is (the heavy bodies are made once). */
async function call(name: string, input: unknown): Promise<Answer> {
  const body = typeof input === 'string' ? input : JSON.stringify(input);
  const started = performance.now();
  const r = await fetch(`${backend.origin}${API_PREFIX}call/${name}`, {
    method: 'POST',
    headers: { [TOKEN_HEADER]: backend.token, 'content-type': 'application/json' },
    body,
  });
  const text = await r.text();
  return { status: r.status, ms: performance.now() - started, body: text };
}

/** The rear demo corner with bench tables of `points` points each way, its events and 500 frequencies. */
function heavyCorner(points: number): unknown {
  const file = JSON.parse(readFileSync('assets/demo/club-coupe-rear-left.json', 'utf8')) as {
    corner: { damper: { bump: { points: unknown }; rebound: { points: unknown } } };
  };
  const table = Array.from({ length: points }, (_, i) => [0.001 * (i + 1), 100 + i]);
  file.corner.damper.bump.points = table;
  file.corner.damper.rebound.points = table;
  return { file, frequencies: Array.from({ length: 500 }, (_, i) => 0.1 + i * 0.05) };
}

const p99 = (samples: number[]) =>
  [...samples].sort((a, b) => a - b)[Math.ceil(samples.length * 0.99) - 1] as number;

beforeAll(async () => {
  backend = await backendChildStart();
  const demo = await call('loadDemo', {});
  expect(demo.status).toBe(200);
  vehicle = (JSON.parse(demo.body) as { value: { vehicles: string[] } }).value.vehicles[0] as string;
  // The pool's threads load their code at their first call: warm both before anything is timed.
  const warm = await Promise.all([1, 2].map(() => call('analyzeCorner', heavyCorner(TABLE_POINTS_MAX))));
  for (const w of warm) expect(w.status).toBe(200);
}, 120_000);
afterAll(() => backend.stop());

describe('a heavy call beside typical ones', () => {
  it('refuses a 10⁵-point damper table at once, naming the table', async () => {
    const r = await call('analyzeCorner', heavyCorner(100_000));
    expect(r.status).toBe(400);
    const error = (JSON.parse(r.body) as { error: { field: string; message: string } }).error;
    expect(error.field).toBe('file.corner.damper.bump.points');
    expect(error.message).toContain(`at most ${TABLE_POINTS_MAX} points`);
    // Refused before core reads a point: far quicker than the analysis it would have cost.
    expect(r.ms).toBeLessThan(5000);
  }, 60_000);

  it('keeps the p99 of typical figures requests under 100 ms while one heavy call runs', async () => {
    const typical = async () => {
      const r = await typical0();
      expect(r.status).toBe(200);
      return r.ms;
    };
    const typical0 = () => call('setupShow', { vehicle, units: 'si' });
    for (let i = 0; i < 30; i++) await typical();
    const heavyBody = JSON.stringify(heavyCorner(TABLE_POINTS_MAX));
    const heavy: Answer[] = [];
    const alone: number[] = [];
    const beside: number[] = [];
    // Blocks without and with the heavy call, in turn, so that both see the same machine.
    for (let block = 0; block < 8; block++) {
      for (let i = 0; i < 20; i++) alone.push(await typical());
      let running = true;
      const heavyLoop = (async () => {
        while (running) heavy.push(await call('analyzeCorner', heavyBody));
      })();
      try {
        for (let i = 0; i < 30; i++) beside.push(await typical());
      } finally {
        running = false;
        await heavyLoop;
      }
    }
    const heavyMs = heavy.filter((h) => h.status === 200).map((h) => h.ms);
    // The bound is 100 ms; only where this machine is itself slow without any heavy call (a
    // loaded test machine, its p99 alone above 33 ms) is it raised, to three times that p99.
    const bound = Math.max(100, 3 * p99(alone));
    const report =
      `typical p99 ${p99(beside).toFixed(1)} ms beside ${heavyMs.length} heavy calls of ` +
      `${Math.min(...heavyMs).toFixed(0)}–${Math.max(...heavyMs).toFixed(0)} ms ` +
      `(p99 alone ${p99(alone).toFixed(1)} ms; bound ${bound.toFixed(0)} ms)`;
    console.log(report);
    expect(heavyMs.length, report).toBeGreaterThanOrEqual(8);
    expect(p99(beside), report).toBeLessThan(bound);
  }, 300_000);
});
