import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { contract } from '../../app/api/contract';
import {
  PREVIEW_ROWS,
  benchFilePreview,
  benchHeaderUnit,
  benchImportInput,
  benchMappingCheck,
  benchMappingDefault,
  benchProblemText,
  type BenchMapping,
} from '../../app/renderer/bench-import-model';
import { InputError } from '../../core/units/input-error';
import { storeDigest } from '../db/store-fixture';
import { freshContext } from '../api/api-fixture';
import { benchPointTable } from '../db/bench-fixture';

const demo = (name: string) =>
  benchFilePreview(name, readFileSync(new URL(`../../assets/demo/bench/${name}`, import.meta.url), 'utf8'));

const POINTS = demo('mb-da-1-bump-0.csv');
const SEMICOLON = demo('mb-da-1-bump-9.csv');
const INCHES = demo('mb-da-1-bump-12.csv');
const TRACE = demo('mb-sa-1-trace-rebound-4.csv');

const mappingOf = (p: typeof POINTS, patch: Partial<BenchMapping> = {}): BenchMapping => ({
  ...benchMappingDefault(p),
  damper: 'MB-TEST-1',
  ...patch,
});

const problemsOf = (p: typeof POINTS, patch: Partial<BenchMapping>) => {
  const c = benchMappingCheck(p, mappingOf(p, patch), 'si');
  if (c.ok) throw new Error('expected problems');
  return c.problems;
};

describe('the bench file preview', () => {
  it('reads the header and the first rows as the file writes them', () => {
    expect(POINTS.header.line).toBe(2); // a # comment line comes first
    expect(POINTS.header.cells[0]).toBe('velocity (bump 0 rebound 0)');
    expect(POINTS.rows).toHaveLength(PREVIEW_ROWS);
    expect(POINTS.rows[0]?.[0]).toBe('-0.4995');
    expect(POINTS.kindGuess).toBe('points');
    expect(TRACE.kindGuess).toBe('trace');
    expect(TRACE.cells.map((c) => c.unit)).toEqual(['ms', 'mm', 'N']);
  });

  it('finds a semicolon-separated file with decimal commas', () => {
    expect(SEMICOLON.header.delimiter).toBe(';');
    expect(SEMICOLON.rows[0]?.[0]).toBe('-0,4985');
  });

  it('keeps quoted cells whole and shows fewer rows when the file has fewer', () => {
    const p = benchFilePreview('q.csv', 'velocity,force,note\n0.1,200,"a, b"\n\n# gap\n0.2,300,c\n');
    expect(p.rows).toEqual([
      ['0.1', '200', 'a, b'],
      ['0.2', '300', 'c'],
    ]);
  });

  it('says what is wrong with an empty file, a comment-only file and a one-column header', () => {
    expect(() => benchFilePreview('e.csv', '')).toThrow(/is empty/);
    expect(() => benchFilePreview('c.csv', '# only\n# comments\n')).toThrow(/only comment lines/);
    expect(() => benchFilePreview('o.csv', 'velocity\n0.1\n')).toThrow(InputError);
  });

  it('tells which unit the header gives a column', () => {
    const m = mappingOf(INCHES);
    expect(benchHeaderUnit(INCHES, m, 'velocity')).toBe('in/s');
    expect(benchHeaderUnit(INCHES, m, 'force')).toBe('lbf');
    expect(benchHeaderUnit(POINTS, mappingOf(POINTS), 'velocity')).toBeUndefined();
  });
});

describe('the mapping check (core’s reader, before anything is sent)', () => {
  it('reads every velocity/force pair of a sweep as one run per clicker setting', () => {
    const c = benchMappingCheck(POINTS, mappingOf(POINTS), 'si');
    if (!c.ok) throw new Error([...c.problems.values()].join('; '));
    expect(c.runs.map((r) => r.label)).toEqual([
      'bump 0 rebound 0',
      'bump 0 rebound 3',
      'bump 0 rebound 6',
      'bump 0 rebound 9',
      'bump 0 rebound 12',
    ]);
    expect(c.runs.every((r) => r.points === 22 && r.fitted === 'bump and rebound')).toBe(true);
  });

  it('points out a gas force in the readings, and the fit without it once it is entered', () => {
    const demoRuns = benchMappingCheck(POINTS, mappingOf(POINTS), 'si');
    expect(demoRuns.ok && demoRuns.runs.every((r) => r.offset === null)).toBe(true);
    const gassy = benchFilePreview('gas.csv', benchPointTable(81, { offset: 150 }));
    const raw = benchMappingCheck(gassy, mappingOf(gassy), 'si');
    expect(raw.ok && raw.runs[0]?.offset).toBeCloseTo(150, 0);
    // 150 N is 33.72 lbf (1 lbf = 4.4482216152605 N, NIST SP 811 [pub]), typed in US units.
    const less = benchMappingCheck(gassy, mappingOf(gassy, { gasForce: '33.72' }), 'us');
    expect(less.ok && less.runs[0]?.offset).toBeNull();
    expect(benchImportInput(gassy, mappingOf(gassy, { gasForce: '33.72' }), 'us').gasForce).toBe('33.72 lbf');
    expect(problemsOf(gassy, { gasForce: '-5' }).get('gasForce')).toMatch(/greater than zero/);
  });

  it('reads one chosen pair as one run, with the clicks given', () => {
    const c = benchMappingCheck(
      POINTS,
      mappingOf(POINTS, {
        columns: {
          velocity: 'velocity (bump 0 rebound 6)',
          force: 'force (bump 0 rebound 6)',
          time: '',
          displacement: '',
        },
      }),
      'si',
    );
    expect(c.ok && c.runs.map((r) => r.label)).toEqual(['bump 0 rebound 6']);
  });

  it('reads a trace into binned points', () => {
    const c = benchMappingCheck(
      TRACE,
      mappingOf(TRACE, { compression: 'negative', clicks: 'rebound 4' }),
      'si',
    );
    expect(c.ok && c.runs).toEqual([
      { label: 'rebound 4', points: 48, fitted: 'bump and rebound', offset: null },
    ]);
  });

  it('names the field for a bad damper label, date, clicks, stroke and temperature', () => {
    const p = problemsOf(POINTS, {
      damper: '',
      date: '2025-13-01',
      clicks: 'bump x',
      stroke: '-50',
      temperature: 'hot',
    });
    expect(p.get('damper')).toMatch(/damper label/);
    expect(p.get('date')).toMatch(/not a day of the calendar/);
    expect(p.get('clicks')).toBeDefined();
    expect(p.get('stroke')).toMatch(/greater than zero/);
    expect(p.get('temperature')).toMatch(/temperature/);
  });

  it('names the line and column of a bad cell, in the form’s words for its options', () => {
    const broken = benchFilePreview('b.csv', 'velocity,force\n0.1,200\n0.2,abc\n0.3,400\n');
    const p = problemsOf(broken, {});
    expect(p.get('file')).toBe('line 3, column "force": "abc" is not a number');
    const wrongColumn = problemsOf(POINTS, {
      columns: { velocity: 'speed', force: '', time: '', displacement: '' },
    });
    expect(wrongColumn.get('file')).toMatch(/^the velocity column: no column "speed"/);
    const conflict = problemsOf(INCHES, {
      units: { velocity: 'm/s', force: '', time: '', displacement: '' },
    });
    expect(conflict.get('file')).toMatch(/the velocity unit: says "m\/s" but the header/);
  });

  it('refuses a trace read as a point table', () => {
    expect(problemsOf(TRACE, { kind: 'points' }).get('file')).toMatch(/velocity/);
  });

  it('puts the command’s option names into the form’s words', () => {
    expect(benchProblemText(new InputError('--force-column', 'no column "x"'))).toBe(
      'the force column: no column "x"',
    );
    expect(benchProblemText(new InputError('', 'is the sign right (--compression positive|negative)?'))).toBe(
      'is the sign right (the compression sign)?',
    );
  });
});

describe('the import call', () => {
  it('is an input the contract accepts, with bare numbers sent in the units shown', () => {
    const m = mappingOf(TRACE, {
      compression: 'negative',
      clicks: ' rebound 4 ',
      date: '2025-02-22',
      stroke: '50',
      testFrequency: '2',
      temperature: '32',
      notes: 'sine',
    });
    const si = benchImportInput(TRACE, m, 'si');
    expect(contract.benchImport.input.safeParse(si).success).toBe(true);
    expect(si).toEqual({
      damper: 'MB-TEST-1',
      source: { text: TRACE.text, name: 'mb-sa-1-trace-rebound-4.csv' },
      kind: 'trace',
      compression: 'negative',
      clicks: 'rebound 4',
      date: '2025-02-22',
      stroke: '50 mm',
      testFrequency: '2 Hz',
      temperature: '32 degC',
      notes: 'sine',
    });
    const us = benchImportInput(TRACE, { ...m, stroke: '2', temperature: '90' }, 'us');
    expect(us).toMatchObject({ stroke: '2 in', temperature: '90 degF' });
    expect(contract.benchImport.input.safeParse(us).success).toBe(true);
  });

  it('sends only the columns and units of the kind of file, and none left to the header', () => {
    const m = mappingOf(POINTS, {
      columns: { velocity: '', force: '', time: 'x', displacement: 'y' },
      units: { velocity: 'mm/s', force: '', time: 'ms', displacement: '' },
      again: true,
    });
    const input = benchImportInput(POINTS, m, 'si');
    expect(input.columns).toBeUndefined();
    expect(input.units).toEqual({ velocity: 'mm/s' });
    expect(input.again).toBe(true);
    expect(contract.benchImport.input.safeParse(input).success).toBe(true);
  });

  it('stores what the check said it would, and nothing when the file is wrong', async () => {
    const ctx = freshContext();
    const m = mappingOf(POINTS, { date: '2025-02-15', stroke: '50' });
    const check = benchMappingCheck(POINTS, m, 'si');
    const out = await apiCall('benchImport', benchImportInput(POINTS, m, 'si'), ctx);
    expect(check.ok && check.runs.length).toBe(out.runs.length);
    expect(out.runs.map((r) => r.pointCount)).toEqual([22, 22, 22, 22, 22]);
    expect(out.runs[0]?.stroke).toBeCloseTo(0.05, 12);
    const before = storeDigest(ctx.store);
    const broken = benchFilePreview('b.csv', 'velocity,force\n0.1,200\n0.2,abc\n0.3,400\n');
    await expect(
      apiCall('benchImport', benchImportInput(broken, mappingOf(broken), 'si'), ctx),
    ).rejects.toThrow(/line 3, column "force"/);
    expect(storeDigest(ctx.store)).toBe(before);
  });
});

// NIST SP 811 (2008) Appendix B [pub]: 1 in = 0.0254 m and 1 lbf = 4.4482216152605 N, exactly.
const INCH = 0.0254;
const LBF = 4.4482216152605;

/** A bench file as a shop's software writes it: one header style, the same three points in in/s and lbf. */
function styled(velocity: string, force: string): string {
  return `${velocity},${force}\n1,50\n2,90\n4,150\n-1,-70\n-2,-120\n-4,-200\n`;
}

describe('bench files with common headers, in the mapping step', () => {
  const styles: [string, string, string, string][] = [
    ['units in parentheses', 'Velocity (in/s)', 'Force (lbf)', ''],
    [
      'units in brackets and clicks after them',
      'Velocity [in/s] B0 R0',
      'Force [lbf] B0 R0',
      'bump 0 rebound 0',
    ],
    ['units joined by underscores', 'velocity_in_s', 'Force_lbf', ''],
    [
      'units in parentheses and clicks in words',
      'Velocity (in/s) bump 3 rebound 6',
      'Force (lbf) bump 3 rebound 6',
      'bump 3 rebound 6',
    ],
    [
      'clicks in parentheses after a bracketed unit',
      'Velocity [in/s] (B3 R6)',
      'Force [lbf] (B3 R6)',
      'bump 3 rebound 6',
    ],
  ];
  for (const [what, v, f, clicks] of styles) {
    it(`reads ${what} (${v}, ${f}) with the header's units, and the import is allowed`, () => {
      const p = benchFilePreview('styled.csv', styled(v, f));
      expect(p.kindGuess).toBe('points');
      const mapping = mappingOf(p);
      expect(benchHeaderUnit(p, mapping, 'velocity')).toBe('in/s');
      expect(benchHeaderUnit(p, mapping, 'force')).toBe('lbf');
      const check = benchMappingCheck(p, mapping, 'si');
      expect(check).toEqual({
        ok: true,
        runs: [
          { label: clicks || 'no clicks recorded', points: 6, fitted: 'bump and rebound', offset: null },
        ],
      });
      // Mapped by hand, column by column, it reads the same: the Import button is not held back.
      const byHand = mappingOf(p, { columns: { velocity: v, force: f, time: '', displacement: '' } });
      expect(benchMappingCheck(p, byHand, 'si').ok).toBe(true);
    });

    it(`stores ${what} in SI`, async () => {
      const ctx = freshContext();
      const p = benchFilePreview('styled.csv', styled(v, f));
      const out = await apiCall('benchImport', benchImportInput(p, mappingOf(p), 'si'), ctx);
      expect(out.runs).toHaveLength(1);
      const shown = await apiCall('benchShow', { run: out.runs[0]?.id as number, points: true }, ctx);
      const fastest = (shown.points ?? []).reduce((a, b) => (b[0] > a[0] ? b : a), [0, 0]);
      // 4 in/s = 0.1016 m/s and 150 lbf = 667.23 N [calc: NIST factors above].
      expect(fastest[0]).toBeCloseTo(4 * INCH, 12);
      expect(fastest[1]).toBeCloseTo(150 * LBF, 9);
    });
  }

  it('starts with the damper field empty, whatever unit was viewed last', () => {
    expect(benchMappingDefault(POINTS).damper).toBe('');
  });
});
