import { describe, expect, it, vi } from 'vitest';
import { ValvingPool } from '../../app/api/valving-pool';
import { valvingJobOf } from '../../core/valving/valving';
import { VALVING_PRESETS } from '../../core/valving/valving-presets';
import { valvingSweepSerial } from '../../core/valving/valving-sweep';
import { MILLBROOK_FRONT_LEFT } from '../core/demo-corner';
import { bilinear, cellOf } from '../core/valving-fixture';

// The worker script cannot be built (esbuild missing or broken on this machine).
vi.mock('esbuild', () => ({ build: () => Promise.reject(new Error('no compiler here')) }));

describe('valving pool without worker threads', () => {
  const job = valvingJobOf(
    { cells: [cellOf({ rebound: 0 }, bilinear(3000, 0.05, 1000), bilinear(6000, 0.06, 2000))] },
    [{ position: 'FL', corner: MILLBROOK_FRONT_LEFT }],
    VALVING_PRESETS['track-day'].scenario,
  );

  it('finishes the sweep in this thread, and says why when it may not use this thread', async () => {
    const pool = new ValvingPool(2);
    try {
      expect(await pool.sweep(job)).toEqual(valvingSweepSerial(job));
      await expect(pool.sweep(job, { inThread: false })).rejects.toThrow('no compiler here');
    } finally {
      await pool.close();
    }
  });
});
