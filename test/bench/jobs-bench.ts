/**
 * `npm run bench:jobs`: a valving sweep started as the page starts one — a job of the
 * backend — measured on this machine: 30 × 30 bench-measured clicks on the demo coupe's four
 * corners, 3,600 combinations. Each way it can run: in a thread of its own that starts its
 * own sweep workers (as the other jobs run), on a kept pool made as the sweep is asked for,
 * on one whose threads are already up, and on a warm one. For the warm pool it also measures
 * this thread — the server's, which must stay free to answer — by its busy time and its
 * longest stall (reading the revision and bench runs, ranking). A benchmark, not a test: it
 * prints medians and exits 1 when the longest stall passes its budget.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { monitorEventLoopDelay, performance } from 'node:perf_hooks';
import { Worker } from 'node:worker_threads';
import { apiCall } from '../../app/api/call';
import { benchSweepCells } from '../../app/cli/commands/bench-sweep';
import { JobRunner, type JobMessage, type JobState } from '../../app/server/jobs';
import { damperForce } from '../../core/damper/damper-curve';
import { storeClose, storeOpen } from '../../db/store';

const CLICKS = 30;
/** A request that comes during a sweep waits at most this long: about what still feels instant. */
const STALL_BUDGET_MS = 100;
const SWEEP = {
  vehicle: 'Millbrook coupe #27',
  corners: ['FL', 'FR', 'RL', 'RR'],
  preset: 'track-day',
  damper: 'BENCH-30',
};

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] as number;
}

/** One bench file a bump click, one column pair a rebound click, compression positive. */
function benchFiles(): { name: string; text: string }[] {
  const cells = benchSweepCells(CLICKS);
  const speeds = Array.from({ length: 21 }, (_, i) => -0.5 + i * 0.05).filter((v) => Math.abs(v) > 1e-9);
  const files = [];
  for (let b = 0; b < CLICKS; b++) {
    const row = cells.slice(b * CLICKS, (b + 1) * CLICKS);
    const header = row.flatMap((c) => {
      const at = `(bump ${c.clicks.bump} rebound ${c.clicks.rebound})`;
      return [`velocity ${at}`, `force ${at}`];
    });
    const lines = speeds.map((v) =>
      row
        .flatMap((c) => {
          const f = damperForce(c.damper, v);
          return [v.toFixed(4), f.toFixed(2)];
        })
        .join(','),
    );
    files.push({ name: `bench-30-bump-${b}.csv`, text: [header.join(','), ...lines, ''].join('\n') });
  }
  return files;
}

async function settle(runner: JobRunner, id: string): Promise<JobState> {
  for (;;) {
    const s = runner.get(id) as JobState;
    if (s.state !== 'running') return s;
    await new Promise((r) => setTimeout(r, 5));
  }
}

/** The sweep in a job thread of its own, as the runner ran every job before it kept a pool. */
function threadJob(dbPath: string): Promise<unknown> {
  const worker = new Worker(new URL('../../app/server/job-worker-boot.js', import.meta.url), {
    workerData: { storePath: dbPath, name: 'valvingChoose', input: SWEEP },
  });
  return new Promise((resolve, reject) => {
    worker.on('message', (m: JobMessage) => {
      if (m.kind === 'done') resolve(m.value);
      else if (m.kind === 'failed') reject(new Error(m.error.message));
    });
    worker.on('error', reject);
  });
}

const dir = mkdtempSync(join(tmpdir(), 'rideledger-bench-'));
const dbPath = join(dir, 'bench.sqlite');
let runner: JobRunner | null = null;
try {
  const store = storeOpen(dbPath);
  try {
    await apiCall('loadDemo', {}, { store });
    for (const f of benchFiles())
      await apiCall('benchImport', { damper: SWEEP.damper, source: f, date: '2025-02-15' }, { store });
  } finally {
    storeClose(store);
  }

  const rounds = 5;
  const thread: number[] = [];
  for (let i = 0; i < 3; i++) {
    const t = performance.now();
    await threadJob(dbPath);
    thread.push(performance.now() - t);
  }

  const pooled = async () => {
    const t = performance.now();
    const s = await settle(runner as JobRunner, (runner as JobRunner).start('valvingChoose', SWEEP));
    if (s.state !== 'done') throw new Error(`the sweep ended ${JSON.stringify(s)}`);
    return { ms: performance.now() - t, combinations: (s.value as { combinations: number }).combinations };
  };
  // The first sweep of a fresh runner. Asked for at once on this process's first pool, which
  // bundles the worker too: what a pool made at the first sweep would give it (one run; the
  // bundle is kept after). Asked for once the threads have had time to start: what the pool
  // made with the server gives the page's first sweep (their code not yet compiled hot).
  runner = new JobRunner(dbPath);
  const asked = (await pooled()).ms;
  const up: number[] = [];
  for (let i = 0; i < 3; i++) {
    await runner.closeAll();
    runner = new JobRunner(dbPath);
    await new Promise((r) => setTimeout(r, 3000));
    up.push((await pooled()).ms);
  }

  const warm: number[] = [];
  const busy: number[] = [];
  const stall: number[] = [];
  let combinations = 0;
  for (let i = 0; i < rounds; i++) {
    const delay = monitorEventLoopDelay({ resolution: 1 });
    delay.enable();
    // The monitor counts from its first tick: the job starts after it.
    await new Promise((r) => setTimeout(r, 20));
    const before = performance.eventLoopUtilization();
    const r = await pooled();
    delay.disable();
    const used = performance.eventLoopUtilization(before);
    warm.push(r.ms);
    busy.push(used.active);
    stall.push(delay.max / 1e6);
    combinations = r.combinations;
  }

  const rows = [
    { what: 'job in a thread of its own, with its own sweep workers', ms: median(thread) },
    { what: 'first job on a pool made as it is asked for (one run)', ms: asked },
    { what: 'first job on a pool whose threads are up', ms: median(up) },
    { what: 'job on the warm pool', ms: median(warm) },
    { what: 'server thread busy during a job on the warm pool', ms: median(busy) },
    { what: `server thread's longest stall during it (budget ${STALL_BUDGET_MS} ms)`, ms: median(stall) },
  ];
  console.log(
    `bench-jobs: ${combinations} combinations, ${(runner as JobRunner).valvingPool.threads} sweep thread(s); medians`,
  );
  for (const r of rows) console.log(`${r.ms.toFixed(1).padStart(8)} ms  ${r.what}`);
  if (median(stall) > STALL_BUDGET_MS) process.exitCode = 1;
} finally {
  await runner?.closeAll();
  rmSync(dir, { recursive: true, force: true });
}
