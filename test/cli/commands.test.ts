import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { CAUTION_TEXT } from '../../core/safety/caution';
import { schemaVersionLatest } from '../../db/migrations';
import { storeClose, storeOpen } from '../../db/store';
import { tempFolder } from '../db/store-fixture';
import { cli, fileDigest } from './cli-fixture';

const DEMO = fileURLToPath(new URL('../../assets/demo/', import.meta.url));
const COUPE = 'Millbrook coupe #27';

afterEach(() => {
  vi.unstubAllEnvs();
});

describe('rideledger, as a shop uses it', () => {
  it('adds a vehicle, saves, edits and compares setups, imports bench data, exports, imports, backs up and checks', async () => {
    const dir = tempFolder();
    const db = join(dir, 'shop.sqlite');
    const ok = async (...args: string[]) => {
      const r = await cli(...args, '--db', db);
      expect(r.stderr.replace(/rideledger: made a new database at .*\n/, ''), args.join(' ')).toBe('');
      expect(r.code, args.join(' ')).toBe(0);
      return r.stdout;
    };
    expect(await ok('vehicle', 'add', COUPE, '--kind', 'club sprint coupe')).toMatch(/Added vehicle/);
    const baseline = join(DEMO, 'setups', 'coupe-27', '01-baseline.json');
    // Its damper units are new to the library, and a save says so explicitly.
    const refused = await cli('setup', 'save', baseline, '--db', db);
    expect(refused.code).toBe(2);
    expect(refused.stderr).toMatch(
      /corners\.FL\.damperUnit: damper unit "MB-DA-1" is not in the library \(the library is empty\).*--new-damper "MB-DA-1"/,
    );
    const newDampers = ['MB-DA-1', 'MB-DA-2', 'MB-DA-3', 'MB-DA-4'].flatMap((d) => ['--new-damper', d]);
    expect(await ok('setup', 'save', baseline, ...newDampers)).toMatch(
      /Saved Millbrook coupe #27 revision 1 "Baseline"[^\n]*\n {2}new damper units in the library: MB-DA-1, MB-DA-2, MB-DA-3, MB-DA-4/,
    );
    // Show it as a file, edit one spring, save it back: a child of revision 1.
    const edited = join(dir, 'edit.json');
    expect(await ok('setup', 'show', `${COUPE}@1`, '--out', edited)).toMatch(/Wrote/);
    const file = JSON.parse(readFileSync(edited, 'utf8'));
    file.name = 'Softer rear';
    file.corners.RL.corner.springRate = '55 N/mm';
    writeFileSync(edited, JSON.stringify(file));
    expect(await ok('setup', 'save', edited)).toMatch(
      /revision 2 "Softer rear" from revision 1: spring rate RL 60→55 N\/mm/,
    );
    const history = await ok('setup', 'history', COUPE);
    expect(history).toMatch(/1 +— +2025-03-22 +Shakedown +Baseline +first setup/);
    const diff = await ok('setup', 'diff', `${COUPE}@2`);
    expect(diff).toMatch(/RL spring rate +60 +55 +N\/mm/);
    expect(diff).toMatch(/RL +ride frequency/);
    expect(diff).not.toMatch(/^ +(FL|FR|RR) /m);
    expect(diff.replace(/\s+/g, ' ')).toContain(`Caution: ${CAUTION_TEXT}`);
    const shown = await ok('setup', 'show', COUPE, '--units', 'us');
    expect(shown).toMatch(/spring rate .*lbf\/in/);
    expect(shown.replace(/\s+/g, ' ')).toContain(CAUTION_TEXT);
    // The bench library.
    const imported = await ok(
      'bench',
      'import',
      join(DEMO, 'bench', 'mb-sa-1-trace-rebound-4.csv'),
      '--damper',
      'MB-SA-1',
      '--clicks',
      'rebound 4',
      '--compression',
      'negative',
      '--stroke',
      '50 mm',
      '--frequency',
      '2 Hz',
      '--json',
    );
    const runId = JSON.parse(imported).runs[0].id as number;
    expect(
      await ok('bench', 'import', join(DEMO, 'bench', 'mb-da-1-bump-6.csv'), '--damper', 'MB-DA-1'),
    ).toMatch(/Imported 5 runs for damper MB-DA-1/);
    expect(
      JSON.parse(await ok('bench', 'list', '--json')).dampers.map((d: { label: string }) => d.label),
    ).toContain('MB-SA-1');
    expect(await ok('bench', 'list', '--damper', 'mb-da-1')).toMatch(/bump 6 rebound 12/);
    expect(await ok('bench', 'show', String(runId), '--points')).toMatch(/raw trace, 2500 samples/);
    // Exchange: export, then import into another shop's database.
    const bundle = join(dir, 'coupe.json');
    expect(await ok('export', COUPE, '--out', bundle)).toMatch(/Exported "Millbrook coupe #27": 2 revisions/);
    const other = join(dir, 'other.sqlite');
    const into = await cli('import', bundle, '--db', other);
    expect(into.code).toBe(0);
    expect(into.stdout).toMatch(/Imported "Millbrook coupe #27": 2 revisions/);
    const again = join(dir, 'again.json');
    expect((await cli('export', COUPE, '--out', again, '--db', other)).code).toBe(0);
    expect(readFileSync(again, 'utf8')).toBe(readFileSync(bundle, 'utf8'));
    // Backup and check.
    expect(await ok('backup', join(dir, 'monday.sqlite'))).toMatch(/checked: 1 vehicles, 2 revisions/);
    expect(await ok('check')).toMatch(/Check passed/);
    expect(JSON.parse(await ok('check', '--json')).ok).toBe(true);
    // Deleting needs --yes, and leaves a backup.
    const deleted = await ok('vehicle', 'delete', COUPE, '--yes');
    expect(deleted).toMatch(/Deleted "Millbrook coupe #27" and its 2 revisions/);
    expect(readdirSync(join(dir, 'backups')).some((f) => f.includes('before-deleting'))).toBe(true);
    expect(JSON.parse(await ok('vehicle', 'list', '--json')).vehicles).toEqual([]);
  });

  it('loads the demo, prints every listing as JSON, and takes --db before the command or its subcommand', async () => {
    const db = join(tempFolder(), 'demo.sqlite');
    expect((await cli('--db', db, 'demo')).stdout).toMatch(/Loaded the invented Millbrook demo shop/);
    expect((await cli('vehicle', '--db', db, 'list')).stdout).toMatch(/Millbrook coupe #27/);
    expect((await cli('--db', db, 'demo')).stdout).toMatch(/already in this database; nothing was changed/);
    for (const args of [
      ['vehicle', 'list'],
      ['vehicle', 'show', COUPE],
      ['setup', 'history', COUPE],
      ['setup', 'show', `${COUPE}@3`],
      ['setup', 'diff', `${COUPE}@1`, `${COUPE}@6`],
      ['bench', 'list'],
      ['bench', 'list', '--damper', 'MB-DA-1'],
      ['bench', 'show', '1'],
    ]) {
      const r = await cli(`--db=${db}`, ...args, '--json');
      expect(r.code, args.join(' ')).toBe(0);
      expect(() => JSON.parse(r.stdout), args.join(' ')).not.toThrow();
    }
  });

  it('finds the database through RIDELEDGER_DB', async () => {
    const db = join(tempFolder(), 'env.sqlite');
    vi.stubEnv('RIDELEDGER_DB', db);
    expect((await cli('vehicle', 'add', 'Env car')).code).toBe(0);
    expect(existsSync(db)).toBe(true);
    expect((await cli('vehicle', 'list')).stdout).toMatch(/Env car/);
  });

  it('never makes a database for a command that only reads, and removes a new one a failed write made', async () => {
    const dir = tempFolder();
    const db = join(dir, 'none.sqlite');
    expect((await cli('vehicle', 'list', '--db', db)).stdout).toMatch(/No vehicles yet/);
    const check = await cli('check', '--db', db);
    expect(check.code).toBe(2);
    expect(check.stderr).toMatch(/none\.sqlite: there is no database here yet/);
    expect((await cli('setup', 'history', 'X', '--db', db)).stderr).toMatch(
      /no vehicle named "X"; there are no vehicles yet/,
    );
    const failed = await cli(
      'setup',
      'save',
      join(DEMO, 'setups', 'coupe-27', '01-baseline.json'),
      '--db',
      db,
    );
    expect(failed.code).toBe(2);
    expect(readdirSync(dir)).toEqual([]);
  });

  it('says check failed, exit code 1, on a damaged database', async () => {
    const db = join(tempFolder(), 'damaged.sqlite');
    await cli('demo', '--db', db);
    const store = storeOpen(db);
    store.db.exec('DROP TRIGGER bench_run_immutable');
    store.db.prepare('UPDATE bench_run SET points_sha256 = ? WHERE id = 3').run('0'.repeat(64));
    storeClose(store);
    const r = await cli('check', '--db', db);
    expect(r.code).toBe(1);
    expect(r.stdout).toMatch(
      /Check FAILED: 1 problem\.\n[\s\S]*bench run #3: the points do not match their checksum/,
    );
  });
});

describe('rideledger, given bad input', () => {
  async function shop() {
    const dir = tempFolder();
    const db = join(dir, 'shop.sqlite');
    await cli('demo', '--db', db);
    const notJson = join(dir, 'bad.json');
    writeFileSync(notJson, '{"format": "rideledger-setup",');
    const badSetup = join(dir, 'bad-setup.json');
    const setup = JSON.parse(readFileSync(join(DEMO, 'setups', 'coupe-27', '01-baseline.json'), 'utf8'));
    setup.corners.FR.corner.springRate = '70 kg';
    writeFileSync(badSetup, JSON.stringify(setup));
    const badCsv = join(dir, 'bad.csv');
    writeFileSync(badCsv, 'velocity,force\n0.1,300\n0.2,3OO\n');
    const existing = join(dir, 'existing.json');
    writeFileSync(existing, 'keep me');
    const damagedBundle = join(dir, 'damaged-bundle.json');
    await cli('export', 'Millbrook single-seater #9', '--out', damagedBundle, '--db', db);
    const bundle = JSON.parse(readFileSync(damagedBundle, 'utf8'));
    bundle.dampers[0].runs[0].pointsSha256 = 'f'.repeat(64);
    bundle.vehicle.name = 'Renamed so the name is free';
    writeFileSync(damagedBundle, JSON.stringify(bundle));
    const sameBundle = join(dir, 'coupe.json');
    await cli('export', COUPE, '--out', sameBundle, '--db', db);
    return { dir, db, notJson, badSetup, badCsv, existing, damagedBundle, sameBundle };
  }

  const cases: [string, (f: Awaited<ReturnType<typeof shop>>) => string[], RegExp][] = [
    ['an unknown command', () => ['frobnicate'], /^rideledger: unknown command "frobnicate"/],
    [
      'an unknown subcommand',
      () => ['vehicle', 'frob'],
      /^rideledger vehicle: vehicle needs add, list, show, delete or scenario \(got "frob"\)/,
    ],
    [
      'an unknown option',
      () => ['vehicle', 'list', '--colour', 'red'],
      /^rideledger vehicle: Unknown option '--colour'/,
    ],
    [
      'a duplicate vehicle name',
      () => ['vehicle', 'add', 'MILLBROOK COUPE #27'],
      /^rideledger vehicle: name: "MILLBROOK COUPE #27" is the same name as the vehicle "Millbrook coupe #27"/,
    ],
    [
      'a delete without --yes',
      () => ['vehicle', 'delete', COUPE],
      /^rideledger vehicle: deleting "Millbrook coupe #27" removes it .* run again with --yes/,
    ],
    [
      'an unknown vehicle',
      () => ['setup', 'history', 'Nope'],
      /^rideledger setup: vehicle: no vehicle named "Nope"; vehicles: "Millbrook coupe #27", "Millbrook single-seater #9"/,
    ],
    [
      'a revision that is not there',
      () => ['setup', 'show', `${COUPE}@99`],
      /^rideledger setup: revision: "Millbrook coupe #27" has no revision 99; its revisions are 1 to 6/,
    ],
    [
      'a revision that is not a number',
      () => ['setup', 'diff', `${COUPE}@two`, `${COUPE}@3`],
      /^rideledger setup: a: "two" after "@" is not a revision number/,
    ],
    [
      'a setup file that is not there',
      (f) => ['setup', 'save', join(f.dir, 'missing.json')],
      /missing\.json: cannot read the file: no such file/,
    ],
    ['a setup file that is not JSON', (f) => ['setup', 'save', f.notJson], /bad\.json: is not valid JSON/],
    [
      'a setup field in the wrong unit',
      (f) => ['setup', 'save', f.badSetup],
      /^rideledger setup: corners\.FR\.corner\.springRate: got "70 kg" \(a mass\); expected a rate/,
    ],
    [
      'units that are neither si nor us',
      () => ['setup', 'show', COUPE, '--units', 'metric'],
      /^rideledger setup: --units: got "metric"; expected si or us/,
    ],
    [
      'a bench file with a bad cell',
      (f) => ['bench', 'import', f.badCsv, '--damper', 'NEW-1'],
      /^rideledger bench: bad\.csv, line 3, column "force": "3OO" is not a number\n$/,
    ],
    [
      'a bench import without a damper',
      (f) => ['bench', 'import', f.badCsv],
      /^rideledger bench: bench import needs --damper LABEL/,
    ],
    [
      'a compression sign in words',
      (f) => ['bench', 'import', f.badCsv, '--damper', 'X', '--compression', 'up'],
      /--compression: got "up"; expected positive or negative/,
    ],
    [
      'a wrong velocity unit',
      (f) => ['bench', 'import', f.badCsv, '--damper', 'X', '--velocity-unit', 'psi'],
      /--velocity-unit: "psi" is not a unit of velocity/,
    ],
    [
      'a gas force in kilograms, naming the option typed',
      () => [
        'bench',
        'import',
        join(DEMO, 'bench', 'mb-da-1-bump-0.csv'),
        '--damper',
        'NEW-2',
        '--gas-force',
        '27 kg',
      ],
      /^rideledger bench: --gas-force: got "27 kg" \(a mass\); expected a force/,
    ],
    [
      'a test frequency that is no frequency',
      () => [
        'bench',
        'import',
        join(DEMO, 'bench', 'mb-da-1-bump-0.csv'),
        '--damper',
        'NEW-2',
        '--frequency',
        '2 m',
      ],
      /^rideledger bench: --frequency: got "2 m" \(a length\); expected a frequency/,
    ],
    [
      'a bench file imported twice',
      () => ['bench', 'import', join(DEMO, 'bench', 'mb-da-1-bump-0.csv'), '--damper', 'MB-DA-1'],
      /already imported for damper "MB-DA-1"/,
    ],
    [
      'a run that is not a number',
      () => ['bench', 'show', 'first'],
      /^rideledger bench: run: "first" is not a whole number/,
    ],
    [
      'an export over an existing file',
      (f) => ['export', COUPE, '--out', f.existing],
      /existing\.json: already exists; give a new file name \(or --force/,
    ],
    ['an export without --out', () => ['export', COUPE], /^rideledger export: export needs --out FILE/],
    [
      'a damaged bundle',
      (f) => ['import', f.damagedBundle],
      /^rideledger import: dampers\[0\]\.runs\[0\]\.points: does not match its point count and checksum/,
    ],
    [
      'a bundle of a vehicle already here',
      (f) => ['import', f.sameBundle],
      /^rideledger import: vehicle\.name: a vehicle named "Millbrook coupe #27" is already in this database; nothing was imported/,
    ],
    ['a backup over an existing file', (f) => ['backup', f.existing], /existing\.json: already exists/],
  ];
  for (const [what, args, message] of cases) {
    it(`refuses ${what}: one line on stderr, exit code 2, the database unchanged`, async () => {
      const f = await shop();
      const before = fileDigest(f.db);
      const r = await cli(...args(f), '--db', f.db);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toMatch(message);
      expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
      expect(fileDigest(f.db)).toBe(before);
      expect(readFileSync(f.existing, 'utf8')).toBe('keep me');
    });
  }

  it('refuses a database of a newer schema without touching it', async () => {
    const f = await shop();
    const store = storeOpen(f.db);
    store.db
      .prepare("INSERT INTO schema_migration VALUES (?, 'future', 'x', 'later')")
      .run(schemaVersionLatest() + 1);
    storeClose(store);
    const bytes = readFileSync(f.db);
    const r = await cli('vehicle', 'list', '--db', f.db);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(
      /was written by a newer RideLedger .* update RideLedger to open it; nothing was changed/,
    );
    expect(readFileSync(f.db).equals(bytes)).toBe(true);
  });
});
