import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cli } from './cli-fixture';

const COUPE = 'Millbrook coupe #27';

describe('rideledger setup show and damping-map: one ζ for a revision on the command line', () => {
  const dir = mkdtempSync(join(tmpdir(), 'rideledger-show-'));
  const db = join(dir, 'shop.sqlite');
  beforeAll(async () => {
    expect((await cli('demo', '--db', db)).code).toBe(0);
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  const json = async (...args: string[]) => {
    const r = await cli(...args, '--db', db, '--json');
    expect(r.code).toBe(0);
    return JSON.parse(r.stdout) as Record<string, unknown>;
  };

  it('says where each corner curve comes from, and its ζ is the damping map’s at the corner clicks', async () => {
    const human = await cli('setup', 'show', `${COUPE}@6`, '--db', db);
    expect(human.code).toBe(0);
    expect(human.stdout).toMatch(
      /Damper curves the figures use\n {2}FL: bench run #\d+ of MB-DA-1, bump 6 rebound 6\n/,
    );
    expect(human.stdout).toMatch(/ {2}FR: entered on the sheet; MB-DA-2 has no bench runs\n/);
    expect(human.stdout).toMatch(/FL: The entered damper curve gives ζ bump/);
    const shown = (await json('setup', 'show', `${COUPE}@6`)) as {
      figures: { FL: { dampingRatio: { bump: number; rebound: number } } };
    };
    const map = (await json('damping-map', '--vehicle', `${COUPE}@6`, '--corner', 'FL')) as {
      cells: {
        clicks: { bump: number; rebound: number };
        figures: { dampingRatio: { bump: number; rebound: number } };
      }[];
    };
    const cell = map.cells.find((c) => c.clicks.bump === 6 && c.clicks.rebound === 6);
    // The same curve on the same corner: the same number through either command [calc].
    expect(shown.figures.FL.dampingRatio.bump).toBeCloseTo(cell?.figures.dampingRatio.bump as number, 12);
    expect(shown.figures.FL.dampingRatio.rebound).toBeCloseTo(
      cell?.figures.dampingRatio.rebound as number,
      12,
    );
  });
});
