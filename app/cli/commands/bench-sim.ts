import { parseArgs } from 'node:util';
import { cornerFileParse } from '../../../core/corner/corner-file';
import { eventBump } from '../../../core/events/event';
import { InputError } from '../../../core/units/input-error';
import { eventSimulate } from '../../../core/events/simulate';
import { EXIT_OK, UsageError, type CliIo } from '../cli-io';
import { readJsonFile } from '../read-json-file';

export const BENCH_SIM_USAGE = `rideledger bench-sim FILE [--runs N] [--json]

  A benchmark, not a test: simulates the corner file's bump N times (default 2000) after a
  warm-up and reports the rate. --json prints {"runs", "seconds", "simulationsPerSecond",
  "peakBodyAccel", "stepsPerSimulation"}; the readable form also compares the peak body
  acceleration with a run at a much tighter tolerance (relative tolerance 1e-10).`;

/** The benchmark's figures. */
export type BenchSimReport = {
  runs: number;
  seconds: number;
  simulationsPerSecond: number;
  peakBodyAccel: number;
  stepsPerSimulation: number;
};

export async function benchSimCommand(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: {
      runs: { type: 'string' },
      json: { type: 'boolean' },
      help: { type: 'boolean', short: 'h' },
    },
  });
  if (values.help) {
    io.stdout(`${BENCH_SIM_USAGE}\n`);
    return EXIT_OK;
  }
  if (positionals.length !== 1) {
    throw new UsageError(`bench-sim needs exactly one corner file (got ${positionals.length})`);
  }
  const runs = values.runs === undefined ? 2000 : Number(values.runs);
  if (!Number.isInteger(runs) || runs < 1 || runs > 10_000_000) {
    throw new InputError('--runs', `expected a whole number from 1 to 10000000 (got "${values.runs}")`);
  }
  const file = cornerFileParse(await readJsonFile(positionals[0] as string));
  if (!file.bump) throw new InputError('bump', "is missing: the benchmark simulates the file's bump");
  const corner = file.corner;
  const event = eventBump(file.bump);
  // Warm-up, so that the timed runs measure compiled code rather than the JIT's start.
  for (let i = 0; i < Math.min(runs, 300); i++) eventSimulate(corner, event);
  let peak = 0;
  let steps = 0;
  const start = performance.now();
  for (let i = 0; i < runs; i++) {
    const r = eventSimulate(corner, event);
    peak = r.metrics.peakBodyAccel;
    steps += r.stats.steps;
  }
  const seconds = (performance.now() - start) / 1000;
  const report: BenchSimReport = {
    runs,
    seconds,
    simulationsPerSecond: runs / seconds,
    peakBodyAccel: peak,
    stepsPerSimulation: steps / runs,
  };
  if (values.json) {
    io.stdout(`${JSON.stringify(report)}\n`);
    return EXIT_OK;
  }
  const reference = eventSimulate(corner, event, { relTol: 1e-10 }).metrics.peakBodyAccel;
  io.stdout(
    [
      `bench-sim: ${runs} bump simulations of ${event.label} in ${seconds.toFixed(3)} s`,
      `  ${report.simulationsPerSecond.toFixed(0)} simulations per second, ${report.stepsPerSimulation.toFixed(1)} steps each`,
      `  peak body acceleration ${peak.toFixed(5)} m/s²; at relative tolerance 1e-10: ${reference.toFixed(5)} m/s² (difference ${((100 * (peak - reference)) / reference).toExponential(2)} %)`,
      '',
    ].join('\n'),
  );
  return EXIT_OK;
}
