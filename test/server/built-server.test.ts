import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { backendSpawn, type BackendProcess } from '../../app/main/backend-process';
import { TOKEN_HEADER } from '../../app/server/http-server';
import type { JobState } from '../../app/server/jobs';
import { storeClose, storeOpen } from '../../db/store';

// The backend as `npm run serve` and the desktop window start it: the build in dist/node, its
// job threads and sweep workers included, not the sources through tsx.
const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const SWEEP = {
  vehicle: 'Millbrook coupe #27',
  corners: ['FL', 'FR', 'RL', 'RR'],
  preset: 'track-day',
  damper: 'MB-DA-1',
  interpolate: true,
};

let dir: string;
let backend: BackendProcess;

async function post(path: string, input: unknown): Promise<unknown> {
  const res = await fetch(`${backend.origin}/api/${path}`, {
    method: 'POST',
    headers: { [TOKEN_HEADER]: backend.token, 'content-type': 'application/json' },
    body: JSON.stringify(input),
  });
  expect(res.status).toBe(200);
  return ((await res.json()) as { value: unknown }).value;
}

/** Starts `name` as a job and waits for its end. */
async function jobRun(name: string, input: unknown): Promise<JobState> {
  const { job } = (await post(`jobs/start/${name}`, input)) as { job: string };
  for (;;) {
    const res = await fetch(`${backend.origin}/api/jobs/${job}`, {
      headers: { [TOKEN_HEADER]: backend.token },
    });
    const state = ((await res.json()) as { value: JobState }).value;
    if (state.state !== 'running') return state;
    await new Promise((r) => setTimeout(r, 50));
  }
}

beforeAll(async () => {
  const built = spawnSync(process.execPath, ['app/node-build.js', '--if-stale'], {
    cwd: ROOT,
    encoding: 'utf8',
  });
  expect(built.status, built.stderr).toBe(0);
  dir = mkdtempSync(join(tmpdir(), 'rideledger-built-server-'));
  backend = await backendSpawn({
    nodePath: process.execPath,
    args: [join(ROOT, 'dist', 'node', 'server.js'), '--ready-line', '--db', join(dir, 'shop.sqlite')],
    cwd: ROOT,
  });
}, 60_000);

afterAll(async () => {
  if (backend) {
    const exited = new Promise((r) => backend.child.once('exit', r));
    backend.stop();
    await exited;
  }
  rmSync(dir, { recursive: true, force: true });
});

describe('the built backend', () => {
  it('serves the page, runs a job in a thread of its own and a sweep on its pool, as the sources do', async () => {
    const page = await fetch(`${backend.origin}/`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('<div id="root">');

    const demo = await jobRun('loadDemo', {});
    expect(demo.state).toBe('done');
    const sweep = await jobRun('valvingChoose', SWEEP);
    expect(sweep.state).toBe('done');

    // The same sweep, in this process from the sources, on the same database.
    const store = storeOpen(join(dir, 'shop.sqlite'));
    try {
      const direct = await apiCall('valvingChoose', SWEEP, { store });
      expect((sweep as { value: unknown }).value).toEqual(JSON.parse(JSON.stringify(direct)));
    } finally {
      storeClose(store);
    }
  }, 120_000);
});
