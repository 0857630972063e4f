import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cornerFileParse } from '../../core/corner/corner-file';
import { cornerRideFigures } from '../../core/corner/corner';
import { CAUTION_TEXT } from '../../core/safety/caution';
import { PROJECT_ROOT, runBin, runCli } from './run-cli';

const DEMO = `${PROJECT_ROOT}assets/demo/club-coupe-front-left.json`;

function tempFile(name: string, content: string): string {
  const dir = mkdtempSync(join(tmpdir(), 'rideledger-cli-'));
  const path = join(dir, name);
  writeFileSync(path, content);
  return path;
}

describe('rideledger analyze --json', () => {
  it('prints exactly the keys of the contract, in SI', async () => {
    const r = await runCli(['analyze', DEMO, '--json']);
    expect(r.code).toBe(0);
    expect(r.stderr).toBe('');
    const out = JSON.parse(r.stdout) as Record<string, unknown>;
    expect(Object.keys(out).sort()).toEqual(
      [
        'bump',
        'dampingClass',
        'dampingRatio',
        'frf',
        'modes',
        'randomRoad',
        'rideFrequencyHz',
        'rideRate',
        'step',
        'warnings',
        'wheelHopFrequencyHz',
        'wheelRate',
      ].sort(),
    );
    expect(Object.keys(out.dampingRatio as object).sort()).toEqual([
      'bump',
      'bumpHighSpeed',
      'rebound',
      'reboundHighSpeed',
    ]);
    expect(Object.keys(out.dampingClass as object).sort()).toEqual(['bump', 'rebound']);
    expect(Object.keys(out.modes as object).sort()).toEqual(['body', 'wheelHop']);
    expect(Object.keys((out.modes as Record<string, object>).body as object).sort()).toEqual([
      'dampingRatio',
      'frequencyHz',
    ]);
    expect(Object.keys(out.randomRoad as object).sort()).toEqual([
      'bodyAccelRms',
      'bodyAccelWeightedRms',
      'tireLoadRmsRatio',
      'travelRms',
    ]);
    expect(Object.keys(out.step as object).sort()).toEqual(['overshoot', 'settlingTime']);
    expect(Object.keys(out.bump as object).sort()).toEqual(
      [
        'peakBodyAccel',
        'maxCompression',
        'maxExtension',
        'minTireLoad',
        'maxTireLoad',
        'airborneTime',
        'peakBodyDisplacement',
        'bumpStopContactTime',
      ].sort(),
    );
    const frf = out.frf as { frequencyHz: number }[];
    expect(frf.map((row) => row.frequencyHz)).toEqual([0.5, 1, 2, 5, 10, 15, 25]);
    expect(Object.keys(frf[0] as object).sort()).toEqual(['bodyAccel', 'frequencyHz', 'tireLoad', 'travel']);
    expect(Array.isArray(out.warnings)).toBe(true);
  });

  it('prints the figures core computes for the demo corner', async () => {
    const out = JSON.parse((await runCli(['analyze', DEMO, '--json'])).stdout) as Record<string, number> & {
      dampingRatio: Record<string, number>;
      dampingClass: Record<string, string>;
    };
    // Hand check, DESIGN.md conventions: kw = 70 N/mm × 0.9² = 56.7 N/mm; ms = 257 kg; ride rate = kw·kt/(kw+kt).
    expect(out.wheelRate).toBeCloseTo(56_700, 9);
    const kr = (56_700 * 240_000) / (56_700 + 240_000);
    expect(out.rideRate).toBeCloseTo(kr, 9);
    expect(out.rideFrequencyHz).toBeCloseTo(Math.sqrt(kr / 257) / (2 * Math.PI), 12);
    expect(out.wheelHopFrequencyHz).toBeCloseTo(Math.sqrt((56_700 + 240_000) / 38) / (2 * Math.PI), 12);
    expect(out.dampingRatio.bump).toBeCloseTo((3200 * 0.81) / (2 * Math.sqrt(56_700 * 257)), 12);
    expect(out.dampingClass).toEqual({ bump: 'underdamped', rebound: 'underdamped' });
    const figures = cornerRideFigures(
      cornerFileParse(
        JSON.parse(JSON.stringify(await import(DEMO, { with: { type: 'json' } }).then((m) => m.default))),
      ).corner,
    );
    expect(out.dampingRatio.reboundHighSpeed).toBe(figures.dampingRatio.reboundHighSpeed);
  });

  it('evaluates the response at --frequencies', async () => {
    const out = JSON.parse(
      (await runCli(['analyze', DEMO, '--json', '--frequencies', '0.7, 3,12.5'])).stdout,
    ) as {
      frf: { frequencyHz: number }[];
    };
    expect(out.frf.map((r) => r.frequencyHz)).toEqual([0.7, 3, 12.5]);
  });

  it('leaves randomRoad out when the file has no road', async () => {
    const raw = JSON.parse(await import('node:fs').then((fs) => fs.readFileSync(DEMO, 'utf8'))) as Record<
      string,
      unknown
    >;
    delete raw.road;
    const r = await runCli(['analyze', tempFile('c.json', JSON.stringify(raw)), '--json']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout)).not.toHaveProperty('randomRoad');
  });
});

describe('rideledger analyze, readable output', () => {
  it('prints tables with units, the damping class in words, warnings and the caution (snapshot)', async () => {
    const r = await runCli(['analyze', DEMO]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('ride frequency');
    expect(r.stdout).toContain('underdamped');
    expect(r.stdout).toContain('N/mm');
    expect(r.stdout.replace(/\s+/g, ' ')).toContain(CAUTION_TEXT);
    expect(r.stdout).toMatchSnapshot();
  });

  it('prints US customary units with --units us', async () => {
    const r = await runCli(['analyze', DEMO, '--units', 'us']);
    expect(r.stdout).toContain('lbf/in');
    expect(r.stdout).toContain('mph');
    expect(r.stdout).toMatch(/spring rate\s+400 lbf\/in/); // 70 N/mm = 399.7 lbf/in
    expect(r.stdout).toMatchSnapshot();
  });

  it('lists warnings with what it saw', async () => {
    const raw = JSON.parse(await import('node:fs').then((fs) => fs.readFileSync(DEMO, 'utf8'))) as {
      corner: Record<string, unknown>;
    };
    raw.corner.damper = { bump: { lowSpeed: '5000 N*s/m' }, rebound: { lowSpeed: '3000 N*s/m' } };
    const r = await runCli(['analyze', tempFile('w.json', JSON.stringify(raw))]);
    expect(r.stdout).toMatch(/- Low-speed rebound damping \(2430 N·s\/m at the wheel\) is softer than bump/);
  });
});

describe('rideledger analyze, bad input', () => {
  it.each([
    [
      'a wrong unit',
      { corner: { springRate: '70 kg' } },
      /^rideledger analyze: corner\.springRate: got "70 kg" \(a mass\); expected a rate/,
    ],
    [
      'a missing field',
      { corner: { tireRate: undefined } },
      /^rideledger analyze: corner\.tireRate: is missing/,
    ],
    [
      'an impossible corner',
      { corner: { unsprungMass: '300 kg' } },
      /^rideledger analyze: corner\.unsprungMass: unsprung mass/,
    ],
  ])('%s: one line naming the field, exit 2', async (_what, change, message) => {
    const raw = JSON.parse(await import('node:fs').then((fs) => fs.readFileSync(DEMO, 'utf8'))) as {
      corner: Record<string, unknown>;
    };
    Object.assign(raw.corner, change.corner);
    const r = await runCli(['analyze', tempFile('bad.json', JSON.stringify(raw)), '--json']);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(message);
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
  });

  it.each([
    [
      'a missing file',
      ['analyze', 'no-such-file.json'],
      /^rideledger analyze: no-such-file\.json: cannot read the file: no such file\n$/,
    ],
    ['an empty file', ['analyze', tempFile('empty.json', '')], /the file is empty/],
    ['a file that is not JSON', ['analyze', tempFile('x.json', '{"corner": ')], /is not valid JSON/],
    ['no file', ['analyze'], /analyze needs exactly one corner file/],
    ['an unknown option', ['analyze', DEMO, '--colour'], /Unknown option '--colour'/],
    [
      'bad frequencies',
      ['analyze', DEMO, '--frequencies', '1,two'],
      /--frequencies: "two" is not a positive frequency in Hz/,
    ],
    ['negative frequencies', ['analyze', DEMO, '--frequencies', '-1'], /--frequencies/],
    ['bad units', ['analyze', DEMO, '--units', 'imperial'], /--units: got "imperial"; expected si or us/],
    ['an unknown command', ['analyse', DEMO], /unknown command "analyse"/],
  ])('%s: one line, exit 2', async (_what, args, message) => {
    const r = await runCli(args);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(message);
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
  });
});

describe('the installed command', () => {
  it('runs as a process: JSON on stdout, exit 0', () => {
    const r = runBin(['analyze', 'assets/demo/club-coupe-front-left.json', '--json']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout)).toHaveProperty('rideFrequencyHz');
  });

  it('exits 2 with one stderr line on bad input', () => {
    const path = tempFile('bad.json', JSON.stringify({ corner: { cornerMass: '300 kg' } }));
    const r = runBin(['analyze', path]);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/^rideledger analyze: corner\.unsprungMass: is missing\n$/);
  });
});
