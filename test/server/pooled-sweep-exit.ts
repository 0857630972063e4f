/**
 * Run by jobs-valving-pool.test.ts in a process of its own: one sweep through a JobRunner's
 * kept pool, then closeAll. It prints what it saw and returns without process.exit, so the
 * process ends only if closeAll left no thread running.
 */
import { JobRunner, type JobState } from '../../app/server/jobs';

const dbPath = process.argv[2] as string;
const runner = new JobRunner(dbPath);
const id = runner.start('valvingChoose', {
  vehicle: 'Millbrook coupe #27',
  corners: ['FL', 'FR', 'RL', 'RR'],
  preset: 'track-day',
  damper: 'MB-DA-1',
  interpolate: true,
});
let s = runner.get(id) as JobState;
while (s.state === 'running') {
  await new Promise((r) => setTimeout(r, 20));
  s = runner.get(id) as JobState;
}
await runner.closeAll();
let afterClose = 'started';
try {
  runner.start('storeCheck', {});
} catch (e) {
  afterClose = (e as Error).message;
}
process.stdout.write(
  JSON.stringify({
    state: s.state,
    combinations: s.state === 'done' ? (s.value as { combinations: number }).combinations : null,
    threads: runner.valvingPool.threads,
    afterClose,
  }),
);
