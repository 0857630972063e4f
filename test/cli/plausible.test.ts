import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cli, fileDigest } from './cli-fixture';

const DEMO = fileURLToPath(new URL('../../assets/demo/', import.meta.url));
const COUPE = 'Millbrook coupe #27';
const NEW_DAMPERS = ['MB-DA-1', 'MB-DA-2', 'MB-DA-3', 'MB-DA-4'].flatMap((d) => ['--new-damper', d]);

type Json = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

function demoJson(path: string): Json {
  return JSON.parse(readFileSync(join(DEMO, path), 'utf8')) as Json;
}

/** Each absurd quantity of issue 11: what to change in a corner, and the message it must give. */
const ABSURD_CORNERS: [string, (c: Json) => void, RegExp][] = [
  [
    'a corner mass of 1e300 kg',
    (c) => (c.cornerMass = 1e300),
    /corner\.cornerMass: corner mass 1e\+300 kg is outside the plausible 5–5000 kg \(from a kart's corner to a heavy truck's\)/,
  ],
  [
    'a spring of 1e-300 N/mm',
    (c) => (c.springRate = '1e-300 N/mm'),
    /corner\.springRate: spring rate 1e-300 N\/mm is outside the plausible 1–5000 N\/mm/,
  ],
  [
    'a spring of 1e300 N/mm',
    (c) => (c.springRate = '1e300 N/mm'),
    /corner\.springRate: spring rate 1e\+300 N\/mm is outside the plausible 1–5000 N\/mm/,
  ],
  [
    'masses of 1e-9 kg',
    (c) => {
      c.cornerMass = 1e-9;
      c.unsprungMass = 1e-10;
    },
    /corner\.cornerMass: corner mass 1e-9 kg is outside the plausible 5–5000 kg/,
  ],
  [
    'a motion ratio of 3',
    (c) => (c.springMotionRatio = 3),
    /corner\.springMotionRatio: motion ratio 3 is outside the plausible 0\.2–2 \(spring or damper travel ÷ wheel travel/,
  ],
];

describe('rideledger refuses physics that cannot be', () => {
  let dir = '';
  let db = '';
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'rideledger-plausible-'));
    db = join(dir, 'shop.sqlite');
    expect((await cli('vehicle', 'add', COUPE, '--db', db)).code).toBe(0);
    const saved = await cli(
      'setup',
      'save',
      join(DEMO, 'setups/coupe-27/01-baseline.json'),
      ...NEW_DAMPERS,
      '--db',
      db,
    );
    expect(saved.code).toBe(0);
  });

  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  /** Runs the command on the database; it must exit 2 with one line naming the field, and store nothing. */
  async function refused(args: string[], message: RegExp): Promise<string> {
    const before = fileDigest(db);
    // analyze and simulate read files only; the database must not change all the same.
    const r = await cli(...args, ...(['setup'].includes(args[0] as string) ? ['--db', db] : []));
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(message);
    expect(r.stderr).not.toMatch(/internal error|NaN|\n\s+at /);
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(fileDigest(db)).toBe(before);
    return r.stderr;
  }

  for (const [what, change, message] of ABSURD_CORNERS) {
    it(`refuses ${what} in a setup file: exit 2, the field named, nothing stored`, async () => {
      const setup = demoJson('setups/coupe-27/01-baseline.json');
      setup.name = 'Absurd';
      change(setup.corners.RL.corner);
      const file = join(dir, 'absurd-setup.json');
      writeFileSync(file, JSON.stringify(setup));
      await refused(
        ['setup', 'save', file],
        new RegExp(`^rideledger setup: corners\\.RL\\.${message.source}`),
      );
    });

    it(`refuses ${what} in a corner file given to analyze, naming the field`, async () => {
      const corner = demoJson('club-coupe-front-left.json');
      change(corner.corner);
      const file = join(dir, 'absurd-corner.json');
      writeFileSync(file, JSON.stringify(corner));
      await refused(['analyze', file], new RegExp(`^rideledger analyze: ${message.source}`));
    });
  }

  const ABSURD_BUMPS: [string, (b: Json) => void, RegExp][] = [
    [
      'a bump crossed at 1e6 m/s',
      (b) => (b.speed = '1e6 m/s'),
      /^rideledger analyze: bump\.speed: speed 3600000 km\/h is outside the plausible 1\.8–432 km\/h \(from walking pace to a top-speed run\)/,
    ],
    [
      'a bump 1 nm long',
      (b) => (b.length = '1 nm'),
      /^rideledger analyze: bump\.length: length 0\.000001 mm is outside the plausible 50–100000 mm \(a tyre's contact patch/,
    ],
  ];
  for (const [what, change, message] of ABSURD_BUMPS) {
    it(`refuses ${what} in a corner file instead of skipping it`, async () => {
      const corner = demoJson('club-coupe-front-left.json');
      change(corner.bump);
      const file = join(dir, 'absurd-bump.json');
      writeFileSync(file, JSON.stringify(corner));
      await refused(['analyze', file], message);
    });
  }

  it('refuses an event too short or too fast for the simulation, naming the event', async () => {
    const file = join(DEMO, 'club-coupe-front-left.json');
    await refused(
      ['simulate', file, '--event', 'bump', '--length', '1 nm'],
      /^rideledger simulate: --bump\.length: the 25\.0 mm bump, 0 mm long, at 50\.4 km\/h is crossed in 7\.143e-11 s, too short or too fast for the simulation to follow \(at least 0\.2 ms/,
    );
    await refused(
      ['simulate', file, '--event', 'curb', '--speed', '1e6 m/s'],
      /^rideledger simulate: --curb\.speed: speed 3600000 km\/h is outside the plausible 1\.8–432 km\/h/,
    );
  });

  it('refuses a damper unit the library lacks, listing the known ones, and adds it when named new', async () => {
    const setup = demoJson('setups/coupe-27/01-baseline.json');
    setup.name = 'Typo';
    setup.corners.RR.damperUnit = 'MB-DA-44';
    const file = join(dir, 'typo.json');
    writeFileSync(file, JSON.stringify(setup));
    await refused(
      ['setup', 'save', file],
      /^rideledger setup: corners\.RR\.damperUnit: damper unit "MB-DA-44" is not in the library \(the library has "MB-DA-1", "MB-DA-2", "MB-DA-3", "MB-DA-4"\); check the spelling, or name it as a new damper unit when saving \(--new-damper "MB-DA-44"\)\n$/,
    );
    await refused(
      ['setup', 'save', file, '--new-damper', 'MB-DA-44', '--new-damper', 'MB-DA-5'],
      /^rideledger setup: --new-damper: "MB-DA-5" is named as a new damper unit but no corner of the sheet uses it/,
    );
    const r = await cli('setup', 'save', file, '--new-damper', 'MB-DA-44', '--db', db);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/revision 2 "Typo".*\n {2}new damper units in the library: MB-DA-44\n$/);
  });
});
