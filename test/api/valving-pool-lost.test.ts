import { describe, expect, it, vi } from 'vitest';
import { ValvingPool } from '../../app/api/valving-pool';
import { valvingJobOf } from '../../core/valving/valving';
import { VALVING_PRESETS } from '../../core/valving/valving-presets';
import { valvingSweepSerial } from '../../core/valving/valving-sweep';
import { MILLBROOK_FRONT_LEFT } from '../core/demo-corner';
import { bilinear, cellOf } from '../core/valving-fixture';

// Worker threads that stop as they start, before they are ready (a broken worker script).
vi.mock('esbuild', () => ({
  build: () => Promise.resolve({ outputFiles: [{ text: 'process.exit(3)' }] }),
  stop: () => Promise.resolve(),
}));

describe('valving pool whose worker threads all stop', () => {
  const job = valvingJobOf(
    { cells: [cellOf({ rebound: 0 }, bilinear(3000, 0.05, 1000), bilinear(6000, 0.06, 2000))] },
    [{ position: 'FL', corner: MILLBROOK_FRONT_LEFT }],
    VALVING_PRESETS['track-day'].scenario,
  );

  it('fails a sweep that may not use this thread, rather than waiting for ever, and still sweeps here', async () => {
    const pool = new ValvingPool(2);
    try {
      await expect(pool.sweep(job, { inThread: false })).rejects.toThrow('exit code 3');
      await expect(pool.sweep(job, { inThread: false })).rejects.toThrow('exit code 3');
      expect(await pool.sweep(job)).toEqual(valvingSweepSerial(job));
    } finally {
      await pool.close();
    }
  });
});
