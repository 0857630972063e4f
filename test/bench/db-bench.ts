/**
 * `npm run bench:db`: the storage budgets, measured on this machine — import 10⁶ bench points
 * (< 5 s), list 1 000 revisions of a vehicle (< 50 ms), diff two revisions (< 10 ms) — each
 * through the API handler the command and the desktop app call. A benchmark, not a test:
 * it prints medians and exits 1 when a budget is missed. Profile it with
 * `node --cpu-prof --import tsx test/bench/db-bench.ts`.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { apiCall } from '../../app/api/call';
import type { ApiContext } from '../../app/api/context';
import { storeClose, storeOpen } from '../../db/store';
import { setupFileFixture } from '../core/setup-fixture';
import { benchPointTable } from '../db/bench-fixture';

const dir = mkdtempSync(join(tmpdir(), 'rideledger-bench-'));

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] as number;
}

async function timed(times: number, fn: () => Promise<unknown>): Promise<number> {
  await fn(); // warm-up: prepared statements, JIT
  const ms: number[] = [];
  for (let i = 0; i < times; i++) {
    const t = performance.now();
    await fn();
    ms.push(performance.now() - t);
  }
  return median(ms);
}

const results: { what: string; ms: number; budget: number }[] = [];
try {
  const store = storeOpen(join(dir, 'bench.sqlite'));
  const ctx: ApiContext = { store };

  const csv = join(dir, 'million.csv');
  writeFileSync(csv, benchPointTable(1_000_000, { noise: 5 }));
  const importMs = await timed(3, () =>
    apiCall('benchImport', { damper: 'BENCH', source: { path: csv }, again: true }, ctx),
  );
  results.push({ what: 'import 10⁶ bench points (read, check, fit, store)', ms: importMs, budget: 5000 });

  await apiCall('vehicleAdd', { name: 'Bench coupe' }, ctx);
  for (let i = 0; i < 1000; i++) {
    const file = setupFileFixture();
    file.vehicle = 'Bench coupe';
    file.name = `Revision ${i + 1}`;
    file.corners.FL.corner.springRate = `${60 + (i % 30)} N/mm`;
    file.corners.RR.clicks = { bump: i % 12, rebound: (i * 7) % 12 };
    await apiCall('setupSave', { file }, ctx);
  }
  const listMs = await timed(20, () => apiCall('setupHistory', { vehicle: 'Bench coupe' }, ctx));
  results.push({ what: 'list 1 000 revisions of a vehicle', ms: listMs, budget: 50 });

  const diffMs = await timed(50, () =>
    apiCall(
      'setupDiff',
      { a: { vehicle: 'Bench coupe', revision: 17 }, b: { vehicle: 'Bench coupe', revision: 998 } },
      ctx,
    ),
  );
  results.push({ what: 'diff two revisions (fields and ride figures)', ms: diffMs, budget: 10 });
  storeClose(store);
} finally {
  rmSync(dir, { recursive: true, force: true });
}

let failed = false;
for (const r of results) {
  const ok = r.ms < r.budget;
  failed ||= !ok;
  console.log(
    `${ok ? 'ok  ' : 'SLOW'}  ${r.what.padEnd(52)} ${r.ms.toFixed(1).padStart(8)} ms   (budget ${r.budget} ms)`,
  );
}
process.exitCode = failed ? 1 : 0;
