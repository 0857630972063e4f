import { describe, expect, it } from 'vitest';
import { InputError } from '../../core/units/input-error';
import { benchImport, type BenchImportRequest } from '../../db/bench-import';
import { benchPointsDecode } from '../../db/bench-points';
import { benchRunById, benchRunListOfDamper } from '../../db/queries/bench-run';
import { damperUnitList } from '../../db/queries/damper-unit';
import { benchPointTable } from './bench-fixture';
import { freshStore, storeDigest } from './store-fixture';

function importing(
  store: ReturnType<typeof freshStore>,
  text: string,
  more: Partial<BenchImportRequest> = {},
) {
  return benchImport(store, { damper: 'D-1', text, sourceName: 'run.csv', ...more });
}

describe('benchImport', () => {
  it('stores the points exactly and the fitted curve of a one-run file, creating the unit', () => {
    const store = freshStore();
    const text = benchPointTable(41);
    const r = importing(store, text, {
      date: '2025-02-15',
      stroke: 0.05,
      temperature: 303.15,
      table: { clicks: { rebound: 4 } },
    });
    expect(r.damperCreated).toBe(true);
    expect(r.runs).toHaveLength(1);
    const row = benchRunById(store.db, r.runs[0]?.id as number);
    expect(row?.point_count).toBe(41);
    expect(row?.clicks_rebound).toBe(4);
    expect(row?.source_name).toBe('run.csv');
    const points = benchPointsDecode(row?.points as Buffer);
    expect(points.velocity[0]).toBe(Number((-0.5 + 0.5 / 41).toFixed(7)));
    const fit = JSON.parse(row?.fit_json as string);
    expect(fit.bump.curve.lowSpeed).toBeCloseTo(3000, 0);
    expect(fit.rebound.curve.kneeSpeed).toBeCloseTo(0.06, 2);
  });

  it('stores one run per column pair of a click-grid file, all in one go', () => {
    const store = freshStore();
    const header = [0, 3, 6]
      .flatMap((r) => [`velocity (bump 2 rebound ${r})`, `force (bump 2 rebound ${r})`])
      .join(',');
    const rows = [-0.3, -0.2, -0.1, 0.1, 0.2, 0.3].map((v) =>
      [0, 3, 6].flatMap((r) => [v, v * (v > 0 ? 3000 : 6000 - 500 * r)]).join(','),
    );
    const r = importing(store, `${header}\n${rows.join('\n')}\n`);
    expect(r.runs.map((x) => x.run.clicks)).toEqual([
      { bump: 2, rebound: 0 },
      { bump: 2, rebound: 3 },
      { bump: 2, rebound: 6 },
    ]);
    const listed = benchRunListOfDamper(store.db, r.damper.id);
    expect(listed.map((x) => x.source_column)).toEqual([
      'bump 2 rebound 0',
      'bump 2 rebound 3',
      'bump 2 rebound 6',
    ]);
  });

  it('takes a gas force off every reading, says so on the run, and warns of one left in', () => {
    const store = freshStore();
    // Readings that include 150 N of gas force: imported as they are, the import says so.
    const text = benchPointTable(81, { offset: 150 });
    const raw = importing(store, text);
    expect(raw.warnings).toHaveLength(1);
    expect(raw.warnings[0]).toMatch(/carry about 150 N at zero speed in both directions, as a gas force/);
    // With the gas force given: the points and the fit are the damping alone.
    const less = importing(store, text, { gasForce: 150, again: true, notes: 'on the shop bench' });
    expect(less.warnings).toEqual([]);
    const row = benchRunById(store.db, less.runs[0]?.id as number);
    const points = benchPointsDecode(row?.points as Buffer);
    const first = benchPointsDecode(benchRunById(store.db, raw.runs[0]?.id as number)?.points as Buffer);
    expect(points.force[0]).toBeCloseTo((first.force[0] as number) - 150, 9);
    const fit = JSON.parse(row?.fit_json as string);
    expect(fit.bump.curve.lowSpeed).toBeCloseTo(3000, 0);
    expect(fit.rebound.curve.lowSpeed).toBeCloseTo(6000, 0);
    expect(row?.notes).toBe(
      'Gas force of 150.0 N subtracted from every reading at import (a raw trace is kept as recorded). on the shop bench',
    );
    // A wrong gas force leaves an offset the import names.
    const wrong = importing(store, text, { gasForce: 60, again: true });
    expect(wrong.warnings[0]).toMatch(/about 90 N at zero speed in both directions after the 60 N gas force/);
  });

  it('refuses the same file twice for a unit unless asked', () => {
    const store = freshStore();
    const text = benchPointTable(20);
    importing(store, text);
    const before = storeDigest(store);
    expect(() => importing(store, text)).toThrow(/already imported for damper "D-1" as run #1/);
    expect(storeDigest(store)).toBe(before);
    expect(importing(store, text, { again: true }).runs[0]?.id).toBe(2);
  });

  it('refuses a known label with another serial, storing nothing', () => {
    const store = freshStore();
    importing(store, benchPointTable(20), { unit: { serial: 'S-1' } });
    const before = storeDigest(store);
    expect(() => importing(store, benchPointTable(21), { unit: { serial: 'S-2' } })).toThrow(
      /already in the library with serial "S-1", not "S-2"/,
    );
    expect(storeDigest(store)).toBe(before);
  });

  it('keeps unicode labels, matching them as one unit ignoring case', () => {
    const store = freshStore();
    importing(store, benchPointTable(20), { damper: 'Dämpfer VL Ω' });
    importing(store, benchPointTable(22), { damper: 'DÄMPFER vl ω' });
    expect(damperUnitList(store.db).map((d) => [d.label, d.run_count])).toEqual([['Dämpfer VL Ω', 2]]);
  });

  // The bad-input corpus: each is one clear error naming the file, line or option, and nothing is stored.
  const corpus: [string, string, Partial<BenchImportRequest>, RegExp][] = [
    ['an empty file', '', {}, /^run\.csv: is empty/],
    ['a header only', 'velocity,force\n', {}, /^run\.csv: has a header but no rows/],
    [
      'a non-numeric cell',
      benchPointTable(10, { extra: '0.45,abc\n' }),
      {},
      /^run\.csv, line 12, column "force": "abc" is not a number/,
    ],
    [
      'NaN',
      benchPointTable(10, { extra: 'NaN,1\n' }),
      {},
      /line 12, column "velocity": "NaN" is not a finite number/,
    ],
    [
      'Infinity',
      benchPointTable(10, { extra: '0.45,Infinity\n' }),
      {},
      /line 12, column "force": "Infinity" is not a finite number/,
    ],
    [
      'mixed decimal separators',
      'velocity;force\n0,1;300\n0.2;600\n-0,1;-500\n',
      {},
      /line 3, column "velocity": "0.2" uses "." as decimal separator, but line 2 uses ","/,
    ],
    [
      'a wrong unit',
      benchPointTable(10),
      { table: { units: { velocity: 'kg' } } },
      /^--velocity-unit: "kg" is not a unit of velocity/,
    ],
    [
      'a unit of the wrong kind in the header',
      'velocity [N],force\n0.1,1\n',
      {},
      /header "velocity \[N\]": "N" is not a unit of velocity/,
    ],
    ['duplicate column names', 'velocity,force,Force\n0.1,1,1\n', {}, /the column "Force" appears twice/],
    [
      'two columns of one clicker setting',
      'velocity (bump 1),force (bump 1),velocity (bump  1)\n1,2,3\n',
      {},
      /a second velocity column for \(bump 1\)/,
    ],
    ['too few points to fit', 'velocity,force\n0.1,300\n-0.1,-500\n', {}, /at least 3 points/],
  ];
  for (const [what, text, more, message] of corpus) {
    it(`refuses ${what} with one message and stores nothing`, () => {
      const store = freshStore();
      importing(store, benchPointTable(12), { damper: 'Other' });
      const before = storeDigest(store);
      let error: unknown;
      try {
        importing(store, text, more);
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(InputError);
      expect((error as Error).message).toMatch(message);
      expect((error as Error).message).not.toMatch(/\n/);
      expect(storeDigest(store)).toBe(before);
    });
  }

  it('checks a 10⁶-row file to its last row: a bad row at the end stores nothing', () => {
    const store = freshStore();
    const text = benchPointTable(1_000_000, { extra: '0.49,12O0\n' });
    const before = storeDigest(store);
    expect(() => importing(store, text)).toThrow(
      /^run\.csv, line 1000002, column "force": "12O0" is not a number$/,
    );
    expect(storeDigest(store)).toBe(before);
    expect(damperUnitList(store.db)).toEqual([]);
  });
});
