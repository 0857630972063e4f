import { fileURLToPath } from 'node:url';
import { cornerFileParse } from '../../../core/corner/corner-file';
import { InputError } from '../../../core/units/input-error';
import { valvingJobOf } from '../../../core/valving/valving';
import type { ValvingJob } from '../../../core/valving/valving-evaluate';
import type { ValvingCurveCell } from '../../../core/valving/valving-map';
import { VALVING_PRESETS } from '../../../core/valving/valving-presets';
import { valvingSweepSerial } from '../../../core/valving/valving-sweep';
import { ValvingPool, valvingPoolDefaultThreads } from '../../api/valving-pool';
import { EXIT_OK, type CliIo } from '../cli-io';
import { commandArgsParse, helpShown } from '../command-args';
import { readJsonFile } from '../read-json-file';

export const BENCH_SWEEP_USAGE = `rideledger bench-sweep [--clicks N] [--threads N] [--serial] [--json]

  A benchmark, not a test: the valving sweep of a synthetic damper with N × N bump and
  rebound clicks (default 30) on the four corners of the invented demo coupe (left and right
  5 kg apart, so that no corner shares another's figures), each combination on the
  track-day preset's random road, bump and curb. It runs the sweep twice on one pool of
  worker threads plus this thread: cold (the workers start with it, as for the choose
  command) and warm (the pool already running, as in the desktop backend).
  --threads N   worker threads (default: one a core, less one for this thread)
  --serial      also time the sweep in this thread alone
  --json prints {"combinations", "threads", "coldSeconds", "warmSeconds",
  "combinationsPerSecond", "coldCombinationsPerSecond", "serialSeconds"}.`;

const DEMO = fileURLToPath(new URL('../../../assets/demo/', import.meta.url));

/**
 * An invented double-adjustable damper, n × n clicks counted from full stiff: each click
 * softens the low-speed slope, the knee moves up a little and the high-speed slope eases.
 */
export function benchSweepCells(n: number): ValvingCurveCell[] {
  const cells: ValvingCurveCell[] = [];
  const s = (k: number) => (n > 1 ? k / (n - 1) : 0);
  for (let b = 0; b < n; b++)
    for (let r = 0; r < n; r++)
      cells.push({
        clicks: { bump: b, rebound: r },
        source: 'measured',
        runIds: [],
        damper: {
          bump: {
            kind: 'bilinear',
            lowSpeed: 6000 / (1 + 2 * s(b)),
            kneeSpeed: 0.05 + 0.02 * s(b),
            highSpeed: 2000 / (1 + s(b)),
          },
          rebound: {
            kind: 'bilinear',
            lowSpeed: 10000 / (1 + 2 * s(r)),
            kneeSpeed: 0.06 + 0.02 * s(r),
            highSpeed: 3500 / (1 + s(r)),
          },
        },
      });
  return cells;
}

async function benchSweepJob(n: number): Promise<ValvingJob> {
  const front = cornerFileParse(await readJsonFile(`${DEMO}club-coupe-front-left.json`)).corner;
  const rear = cornerFileParse(await readJsonFile(`${DEMO}club-coupe-rear-left.json`)).corner;
  const heavier = (c: typeof front) => ({ ...c, cornerMass: c.cornerMass + 5 });
  return valvingJobOf(
    { cells: benchSweepCells(n) },
    [
      { position: 'FL', corner: front },
      { position: 'FR', corner: heavier(front) },
      { position: 'RL', corner: rear },
      { position: 'RR', corner: heavier(rear) },
    ],
    VALVING_PRESETS['track-day'].scenario,
  );
}

export type BenchSweepReport = {
  combinations: number;
  threads: number;
  coldSeconds: number;
  warmSeconds: number;
  combinationsPerSecond: number;
  coldCombinationsPerSecond: number;
  serialSeconds: number | null;
};

export async function benchSweepCommand(args: string[], io: CliIo): Promise<number> {
  const { values } = commandArgsParse(args, {
    clicks: { type: 'string' },
    threads: { type: 'string' },
    serial: { type: 'boolean' },
  });
  if (helpShown(values, undefined, BENCH_SWEEP_USAGE, io)) return EXIT_OK;
  const n = values.clicks === undefined ? 30 : Number(values.clicks);
  if (!Number.isInteger(n) || n < 1 || n > 100)
    throw new InputError('--clicks', `expected a whole number from 1 to 100 (got "${values.clicks}")`);
  const threads = values.threads === undefined ? valvingPoolDefaultThreads() : Number(values.threads);
  if (!Number.isInteger(threads) || threads < 0 || threads > 64)
    throw new InputError('--threads', `expected a whole number from 0 to 64 (got "${values.threads}")`);
  const job = await benchSweepJob(n);
  const combinations = job.corners.length * job.cells.length;
  let start = performance.now();
  const pool = new ValvingPool(threads);
  let coldSeconds: number;
  let warmSeconds: number;
  try {
    await pool.sweep(job);
    coldSeconds = (performance.now() - start) / 1000;
    start = performance.now();
    await pool.sweep(job);
    warmSeconds = (performance.now() - start) / 1000;
  } finally {
    await pool.close();
  }
  let serialSeconds: number | null = null;
  if (values.serial) {
    start = performance.now();
    valvingSweepSerial(job);
    serialSeconds = (performance.now() - start) / 1000;
  }
  const report: BenchSweepReport = {
    combinations,
    threads,
    coldSeconds,
    warmSeconds,
    combinationsPerSecond: combinations / warmSeconds,
    coldCombinationsPerSecond: combinations / coldSeconds,
    serialSeconds,
  };
  if (values.json) io.stdout(`${JSON.stringify(report)}\n`);
  else
    io.stdout(
      [
        `bench-sweep: ${n} × ${n} clicks on 4 corners = ${combinations} combinations (random road, bump and curb each), ${threads} worker thread(s) and this thread`,
        `  cold (workers starting): ${coldSeconds.toFixed(3)} s, ${report.coldCombinationsPerSecond.toFixed(0)} combinations per second`,
        `  warm (pool running):     ${warmSeconds.toFixed(3)} s, ${report.combinationsPerSecond.toFixed(0)} combinations per second`,
        ...(serialSeconds === null ? [] : [`  this thread alone:       ${serialSeconds.toFixed(3)} s`]),
        '',
      ].join('\n'),
    );
  return EXIT_OK;
}
