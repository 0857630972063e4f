import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUTION_TEXT, VALVING_CAUTION_TEXT } from '../../core/safety/caution';
import { storeDigest, tempFolder } from '../db/store-fixture';
import { cli, fileDigest } from './cli-fixture';
import { runBin } from './run-cli';
import { storeClose, storeOpen } from '../../db/store';

const COUPE = 'Millbrook coupe #27';
const flat = (s: string) => s.replace(/\s+/g, ' ');

describe('rideledger choose, compare and damping-map on the demo shop', () => {
  // One demo database for the file: the commands here only read it.
  const dir = mkdtempSync(join(tmpdir(), 'rideledger-valving-'));
  const db = join(dir, 'shop.sqlite');
  beforeAll(async () => {
    expect((await cli('demo', '--db', db)).code).toBe(0);
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  const run = (...args: string[]) => cli(...args, '--db', db);
  /** choose for FL with the demo damper, in this thread, plus `more`. */
  const chooseFL = (...more: string[]) =>
    run('choose', '--vehicle', COUPE, '--damper', 'MB-DA-1', '--corner', 'FL', '--threads', '0', ...more);

  it('chooses clicks for a corner, with why, one click either way, the current clicks and the cautions', async () => {
    const r = await chooseFL('--preset', 'track-day');
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^Valving choice: Millbrook coupe #27@6/);
    expect(r.stdout).toMatch(/Preset: Track day \(track-day\)/);
    expect(r.stdout).toMatch(/lowSpeedMean: 0\.60–0\.70, weight 2 \[trade: race cars run ζ 0\.6–0\.7/);
    expect(r.stdout).toMatch(
      /FL — damper MB-DA-1: \d+ of 25 combinations meet every target; now at bump 6 rebound 6, rank \d+/,
    );
    expect(r.stdout).toMatch(/^ {2}1 +bump \d+ rebound \d+ /m);
    expect(r.stdout).toMatch(/Why rank 1 \(bump \d+ rebound \d+, run #\d+\):/);
    expect(r.stdout).toMatch(/The next setting on the map either way from rank 1:/);
    // The demo's runs are 3 clicks apart: a step on the map is named in clicks.
    expect(r.stdout).toMatch(/^ {4}(bump|rebound) [+−]3 clicks {2,}bump \d+ rebound \d+ /m);
    expect(r.stdout).not.toMatch(/^ {4}(bump|rebound) [+−]1 /m);
    expect(r.stdout).toMatch(/Warnings of the model for rank 1:/);
    expect(flat(r.stdout)).toContain(`Caution: ${CAUTION_TEXT}`);
    expect(flat(r.stdout)).toContain(VALVING_CAUTION_TEXT);
    expect(flat(r.stdout)).toMatch(/Objective: score = Σ weight × \(miss ÷ scale\)²/);
  });

  it('marks interpolated clicks and gives the front/rear balance for a whole vehicle', async () => {
    const r = await run(
      'choose',
      '--vehicle',
      `${COUPE}@3`,
      '--damper',
      'MB-DA-1',
      '--corner',
      'all',
      '--preset',
      'road-comfort',
      '--interpolate',
      '--best',
      '1',
      '--threads',
      '0',
      '--target',
      'airborneTime=..5 ms',
      '--weight',
      'roadComfort=3',
    );
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Valving choice: Millbrook coupe #27@3/);
    expect(r.stdout).toMatch(
      /169 click combinations \(bump 0–12, rebound 0–12\), 25 measured, 144 interpolated \(marked \*\)/,
    );
    expect(flat(r.stdout)).toMatch(/airborneTime: at most 5\.0 ms, weight 1 \[user: set for this choice\]/);
    expect(flat(r.stdout)).toMatch(/roadComfort: at most 0\.63 m\/s², weight 3 \[mem: ISO 2631-1/);
    expect(r.stdout).toMatch(/Front\/rear balance of the rank-1 picks/);
    expect(r.stdout).toMatch(/^(FL|FR|RL|RR) — damper MB-DA-1: \d+ of 169/m);
    if (/ \*\s/.test(r.stdout))
      expect(r.stdout).toMatch(/\* interpolated between measured neighbours, not measured/);
  });

  it('prints the choice as JSON with the objective, weights, targets and cautions', async () => {
    const r = await run(
      'choose',
      '--vehicle',
      COUPE,
      '--damper',
      'MB-DA-1',
      '--corner',
      'FL,RL',
      '--preset',
      'track-day',
      '--threads',
      '0',
      '--json',
      '--road',
      'B',
      '--speed',
      '100km/h',
    );
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual([
      'vehicle',
      'revision',
      'preset',
      'scenario',
      'scenarioSource',
      'targets',
      'objective',
      'caution',
      'valvingCaution',
      'dampers',
      'combinations',
      'corners',
      'balance',
    ]);
    expect(out.caution).toBe(CAUTION_TEXT);
    expect(out.scenario.road.roadClass).toBe('B');
    expect(out.scenario.road.speed).toBeCloseTo(100 / 3.6, 12);
    expect(out.targets.lowSpeedMean.weight).toBe(2);
    expect(out.corners[0].best[0].checks[0]).toHaveProperty('penalty');
  });

  it('lists the presets with their sources', async () => {
    const r = await run('choose', '--presets');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Preset: Rally stage \(rally-stage\)/);
    expect(r.stdout).toMatch(/rideFrequency: 3\.50–5\.00 Hz, weight 0 \[trade: high-downforce cars/);
    const json = JSON.parse((await run('choose', '--presets', '--json')).stdout);
    expect(json.presets).toHaveLength(4);
  });

  it('reads a targets file, the flags on top of it', async () => {
    const file = join(tempFolder(), 'targets.json');
    writeFileSync(
      file,
      JSON.stringify({
        format: 'rideledger-targets',
        preset: 'rally-stage',
        scenario: { bump: { height: '50 mm' } },
        targets: { bumpLowSpeed: '0.2..0.4', roadTireLoad: 'off' },
        weights: { reboundToBump: 0 },
      }),
    );
    const r = await chooseFL('--targets', file, '--target', 'bumpLowSpeed=0.25..0.45', '--json');
    expect(r.stderr).toBe('');
    const out = JSON.parse(r.stdout);
    expect(out.preset.name).toBe('rally-stage');
    expect(out.scenario.bump.height).toBeCloseTo(0.05, 12);
    expect(out.targets.bumpLowSpeed).toMatchObject({ low: 0.25, high: 0.45 });
    expect(out.targets.roadTireLoad).toBeUndefined();
    expect(out.targets.reboundToBump.weight).toBe(0);
  });

  it('prints the track-day sheet of two revisions, and of one against its parent', async () => {
    const r = await run('compare', `${COUPE}@1`, `${COUPE}@6`, '--road', 'C', '--speed', '120km/h');
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^Track-day sheet: Millbrook coupe #27@1 "Baseline" → Millbrook coupe #27@6/);
    expect(r.stdout).toMatch(/ISO 8608 class C road at 120\.0 km\/h/);
    expect(r.stdout).toMatch(/^FL: MB-DA-1 bump 6 rebound 6 → MB-DA-1 bump \d+ rebound \d+/m);
    expect(r.stdout).toMatch(/^ {2}ride frequency +\d\.\d\d Hz +\d\.\d\d Hz +[+-]\d\.\d\d Hz/m);
    expect(r.stdout).toMatch(/^ {2}targets met +\d+ of \d+ +\d+ of \d+/m);
    expect(r.stdout).toMatch(/Front\/rear balance @1/);
    expect(flat(r.stdout)).toContain(`Caution: ${CAUTION_TEXT}`);
    expect(flat(r.stdout)).toContain(VALVING_CAUTION_TEXT);
    const parent = JSON.parse((await run('compare', `${COUPE}@6`, '--json')).stdout);
    // Revision 6 was saved from revision 4 (5 is a branch for the wet).
    expect([parent.a.revision, parent.b.revision]).toEqual([4, 6]);
    expect(parent.preset.name).toBe('track-day');
    const numbers = JSON.parse(
      (await run('compare', '2', '4', '--vehicle', COUPE, '--json', '--preset', 'rally-stage')).stdout,
    );
    expect([numbers.a.revision, numbers.b.revision, numbers.preset.name]).toEqual([2, 4, 'rally-stage']);
  });

  it('prints a damping map as grids of clicks, or a list for one adjuster', async () => {
    const grid = await run('damping-map', '--vehicle', COUPE, '--corner', 'FL');
    expect(grid.code).toBe(0);
    expect(grid.stdout).toMatch(/^Damping map: MB-DA-1 on Millbrook coupe #27@6 FL/);
    expect(grid.stdout).toMatch(/ζ bump, low speed — rows: bump clicks, columns: rebound clicks/);
    expect(grid.stdout).toMatch(/^ {2}12 +0\.\d{3} +0\.\d{3}/m);
    const filled = await run('damping-map', '--vehicle', COUPE, '--corner', 'FL', '--interpolate');
    expect(filled.stdout).toMatch(/169 click combinations: 25 measured, 144 interpolated \(marked \*\)/);
    expect(filled.stdout).toMatch(/0\.\d{3}\*/);
    const list = await run(
      'damping-map',
      '--vehicle',
      'Millbrook single-seater #9',
      '--corner',
      'RL',
      '--damper',
      'MB-SA-1',
    );
    expect(list.stdout).toMatch(/^ {2}rebound 4 +0\.\d{3} /m);
    const json = JSON.parse(
      (await run('damping-map', '--vehicle', COUPE, '--corner', 'FL', '--json')).stdout,
    );
    expect(json.cells).toHaveLength(25);
  });

  /** The command line of choose for FL on the track-day preset, plus `more`. */
  const chooseFlTrack = (...more: string[]) => [
    'choose',
    '--vehicle',
    COUPE,
    '--corner',
    'FL',
    '--preset',
    'track-day',
    ...more,
  ];
  const bad: [string, string[], RegExp][] = [
    ['no preset', ['choose', '--vehicle', COUPE, '--corner', 'FL'], /choose needs --preset NAME/],
    [
      'an unknown preset',
      ['choose', '--vehicle', COUPE, '--corner', 'FL', '--preset', 'drift'],
      /preset: "drift" is not a preset/,
    ],
    [
      'no corner',
      ['choose', '--vehicle', COUPE, '--preset', 'track-day'],
      /give the corner\(s\) to choose for/,
    ],
    [
      'a corner that is none',
      ['choose', '--vehicle', COUPE, '--corner', 'FX', '--preset', 'track-day'],
      /--corner: "FX" is not a corner/,
    ],
    ['a target that is none', chooseFlTrack('--target', 'grip=1..2'), /--target: "grip" is not a target/],
    [
      'a band in the wrong unit',
      chooseFlTrack('--target', 'airborneTime=..5 mm'),
      /targets\.airborneTime: got "5 mm" \(a length\); expected a time/,
    ],
    ['a road class that is none', chooseFlTrack('--road', 'Q'), /scenario\.road\.class: got "Q"/],
    [
      'a damper without bench runs',
      ['choose', '--vehicle', COUPE, '--corner', 'FR', '--preset', 'track-day'],
      /damper: damper "MB-DA-2" has no bench runs/,
    ],
    [
      'a missing targets file',
      chooseFlTrack('--targets', 'nope.json'),
      /nope\.json: cannot read the file: no such file/,
    ],
    ['threads in words', chooseFlTrack('--threads', 'many'), /--threads: "many" is not a whole number/],
    ['compare without revisions', ['compare'], /compare needs one or two revisions/],
    [
      'compare of the first revision alone',
      ['compare', `${COUPE}@1`],
      /is the first revision; give a second one/,
    ],
    [
      'compare of a revision that is not there',
      ['compare', `${COUPE}@1`, `${COUPE}@40`],
      /^rideledger compare: b\.revision: /,
    ],
    [
      'a map of two corners',
      ['damping-map', '--vehicle', COUPE, '--corner', 'front'],
      /damping-map shows one corner/,
    ],
  ];
  for (const [what, args, message] of bad)
    it(`refuses ${what} with one line, exit 2, and the database unchanged`, async () => {
      const before = fileDigest(db);
      const r = await run(...args);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toMatch(message);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(fileDigest(db)).toBe(before);
    });

  it('runs the sweep on worker threads from the installed command', () => {
    const r = runBin([
      'choose',
      '--db',
      db,
      '--vehicle',
      COUPE,
      '--damper',
      'MB-DA-1',
      '--corner',
      'FL',
      '--preset',
      'track-day',
      '--threads',
      '1',
      '--json',
    ]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.corners[0].evaluated).toBe(25);
    // Opened read-only in spirit: the file's rows are as they were.
    const store = storeOpen(db);
    try {
      expect(storeDigest(store)).toBe(fileDigest(db));
    } finally {
      storeClose(store);
    }
  });
});
