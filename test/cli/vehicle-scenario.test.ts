import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { tempFolder } from '../db/store-fixture';
import { cli, fileDigest } from './cli-fixture';

const COUPE = 'Millbrook coupe #27';

describe('rideledger vehicle scenario', () => {
  it('shows the starting scenario, sets parts of it in either unit system, and compare and choose use it', async () => {
    const db = join(tempFolder(), 'shop.sqlite');
    const run = (...args: string[]) => cli(...args, '--db', db);
    expect((await run('demo')).code).toBe(0);
    const first = await run('vehicle', 'scenario', COUPE);
    expect(first.stdout).toMatch(
      /class C road at 80\.0 km\/h; \(1−cos\) bump 25\.0 mm high, 500 mm long, at 50\.0 km\/h/,
    );
    expect(first.stdout).toMatch(/starting scenario/);
    const set = await run(
      'vehicle',
      'scenario',
      COUPE,
      '--road',
      'D',
      '--speed',
      '40 mph',
      '--bump-height',
      '1.5 in',
      '--units',
      'us',
    );
    expect(set.code).toBe(0);
    expect(set.stdout).toMatch(/class D road at 40 mph; \(1−cos\) bump 1\.5 in high/);
    // The same scenario written in SI: 1.5 in = 38.1 mm, 40 mph = 64.37 km/h (NIST SP 811, exact factors) [pub]
    const si = await run('vehicle', 'scenario', COUPE, '--json');
    const out = JSON.parse(si.stdout);
    expect(out.stored).toBe(true);
    expect(out.scenario.bump.height).toBeCloseTo(0.0381, 12);
    expect(out.scenario.road.speed).toBeCloseTo((40 * 1609.344) / 3600, 12);
    const compared = await run('compare', `${COUPE}@1`, `${COUPE}@6`);
    expect(compared.code).toBe(0);
    expect(compared.stdout.replace(/\s+/g, ' ')).toMatch(
      /Judged on: ISO 8608 class D road at 64\.4 km\/h; \(1−cos\) bump 38\.1 mm high/,
    );
    const chosen = await run(
      'choose',
      '--vehicle',
      COUPE,
      '--corner',
      'FL',
      '--preset',
      'track-day',
      '--threads',
      '0',
      '--json',
    );
    expect(JSON.parse(chosen.stdout).scenario).toEqual(out.scenario);
    // --road/--speed still override the road for one run.
    const once = await run('compare', `${COUPE}@1`, `${COUPE}@6`, '--road', 'A', '--json');
    expect(JSON.parse(once.stdout).scenario.road.roadClass).toBe('A');
    expect(JSON.parse(once.stdout).scenario.bump.height).toBeCloseTo(0.0381, 12);
    const reset = await run('vehicle', 'scenario', COUPE, '--reset');
    expect(reset.stdout).toMatch(/class C road at 80\.0 km\/h/);
  });

  it('refuses a value without a unit or of the wrong kind, naming the option, and stores nothing', async () => {
    const db = join(tempFolder(), 'shop.sqlite');
    const run = (...args: string[]) => cli(...args, '--db', db);
    await run('vehicle', 'add', 'Coupe');
    const before = fileDigest(db);
    const bare = await run('vehicle', 'scenario', 'Coupe', '--bump-height', '25');
    expect(bare.code).toBe(2);
    expect(bare.stderr).toMatch(/--bump-height: "25" has no unit; give one, e.g. "25 mm"/);
    const wrong = await run('vehicle', 'scenario', 'Coupe', '--curb-speed', '20 mm');
    expect(wrong.code).toBe(2);
    expect(wrong.stderr).toMatch(/scenario\.curb\.speed: got "20 mm"/);
    expect(fileDigest(db)).toBe(before);
  });
});
