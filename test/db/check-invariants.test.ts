import { describe, expect, it } from 'vitest';
import { benchImport } from '../../db/bench-import';
import { storeCheck } from '../../db/check';
import type { Store } from '../../db/store';
import { freshStore, setupSaved, vehicleAdded } from './store-fixture';

/** A vehicle of three revisions (3 a branch of 1), a second vehicle, and a bench run. */
function shop(): Store {
  const store = freshStore();
  const v = vehicleAdded(store, 'Test coupe');
  setupSaved(store, v);
  setupSaved(store, v, (r) => (r.corners.FL.corner.springRate = '80 N/mm'));
  setupSaved(store, v, (r) => (r.corners.RL.corner.springRate = '55 N/mm'));
  setupSaved(store, vehicleAdded(store, 'Other car'));
  benchImport(store, {
    damper: 'T-1',
    text: 'velocity,force\n0.05,180\n0.1,300\n0.2,420\n0.3,520\n-0.05,-260\n-0.1,-500\n-0.2,-700\n-0.3,-860\n',
    sourceName: 't1.csv',
    date: '2025-04-10',
  });
  return store;
}

/** Raw SQL as any route could run it: the guarding triggers dropped first. */
function broken(sql: string): Store {
  const store = shop();
  store.db.exec(`
    DROP TRIGGER setup_revision_immutable;
    DROP TRIGGER setup_corner_immutable;
    DROP TRIGGER bench_run_immutable;
    DROP TRIGGER setup_revision_parent_check;
    ${sql}`);
  return store;
}

const REV = (n: number) => `(SELECT id FROM setup_revision WHERE vehicle_id = 1 AND number = ${n})`;

const CASES: [what: string, sql: string, problem: RegExp][] = [
  [
    'a revision number of 2^53 − 1',
    `UPDATE setup_revision SET number = 9007199254740991 WHERE id = ${REV(3)}`,
    /^vehicle Test coupe: its 3 revisions are numbered 1 to 9007199254740991; they must be 1 to 3, each once$/,
  ],
  [
    'a gap in the revision numbers',
    `UPDATE setup_revision SET number = 7 WHERE id = ${REV(3)}`,
    /^vehicle Test coupe: its 3 revisions are numbered 1 to 7; they must be 1 to 3, each once$/,
  ],
  [
    'a parent that is a later revision',
    `UPDATE setup_revision SET parent_id = ${REV(3)} WHERE id = ${REV(2)}`,
    /^revision Test coupe@2: its parent 3 is not an earlier revision$/,
  ],
  [
    'a parent of another vehicle',
    `UPDATE setup_revision SET parent_id = (SELECT id FROM setup_revision WHERE vehicle_id = 2) WHERE id = ${REV(3)}`,
    /^revision Test coupe@3: its parent belongs to another vehicle$/,
  ],
  [
    'a damper fit scaled ×1.8 with the real points kept',
    `UPDATE bench_run SET fit_json = json_set(fit_json, '$.bump.curve.lowSpeed',
       json_extract(fit_json, '$.bump.curve.lowSpeed') * 1.8)`,
    /^bench run #1: the stored bump low-speed coefficient [\d.]+ is not the [\d.]+ its points give$/,
  ],
  [
    'a terminal escape in a revision name',
    `UPDATE setup_revision SET name = 'Wet' || char(27) || '[2J' WHERE id = ${REV(2)}`,
    /^revision Test coupe@2: name: contains a control character$/,
  ],
  [
    'a terminal escape in a vehicle name (shown escaped)',
    `UPDATE vehicle SET name = 'Bad' || char(27) || '[2J' WHERE id = 2`,
    /^vehicle Bad\\u001b\[2J: name: contains a control character$/,
  ],
  [
    'a control character in a damper serial',
    `UPDATE damper_unit SET serial = 'SN' || char(7)`,
    /^damper unit T-1: serial: contains a control character$/,
  ],
  [
    'a newline in a bench run source name',
    `UPDATE bench_run SET source_name = 'a' || char(10) || 'b'`,
    /^bench run #1: sourceName: must be one line/,
  ],
  [
    'over-long notes',
    `UPDATE setup_revision SET notes = printf('%.4001c', 'x') WHERE id = ${REV(1)}`,
    /^revision Test coupe@1: notes: is 4001 characters long; at most 4000 are kept$/,
  ],
  [
    'a click out of range on a corner',
    `UPDATE setup_corner SET clicks_bump = 500 WHERE revision_id = ${REV(2)} AND position = 'RR'`,
    /^revision Test coupe@2: corners\.RR\.clicks\.bump: got 500; expected a whole number of clicks from 0 to 200$/,
  ],
  [
    'a click out of range on a bench run',
    `UPDATE bench_run SET clicks_rebound = 999`,
    /^bench run #1: clicks\.rebound: got 999/,
  ],
  [
    'a setup date that is not a day',
    `UPDATE setup_revision SET setup_date = '2025-02-30' WHERE id = ${REV(1)}`,
    /^revision Test coupe@1: date: "2025-02-30" is not a day of the calendar$/,
  ],
  [
    'a bench run date that is not a day',
    `UPDATE bench_run SET run_date = '2025-13-01'`,
    /^bench run #1: date: "2025-13-01" is not a day of the calendar$/,
  ],
  [
    'a time saved that is not a time',
    `UPDATE setup_revision SET saved_at = 'yesterday' WHERE id = ${REV(2)}`,
    /^revision Test coupe@2: savedAt: got "yesterday"; expected a time/,
  ],
  [
    'a "first setup" summary on a revision with a parent',
    `UPDATE setup_revision SET summary = 'first setup' WHERE id = ${REV(2)}`,
    /^revision Test coupe@2: its summary says "first setup" though it has a parent$/,
  ],
  [
    'a summary with a terminal escape',
    `UPDATE setup_revision SET summary = 'FL spring' || char(27) || '[2J' WHERE id = ${REV(3)}`,
    /^revision Test coupe@3: summary: contains a control character$/,
  ],
  [
    'a bench run stored twice',
    `INSERT INTO bench_run (damper_unit_id, run_date, clicks_bump, clicks_rebound, clicks_bump_high_speed,
       clicks_rebound_high_speed, stroke, test_frequency, temperature, source_kind, source_name, source_column,
       source_sha256, point_count, points, points_sha256, trace_count, trace, fit_json, notes, imported_at)
     SELECT damper_unit_id, run_date, clicks_bump, clicks_rebound, clicks_bump_high_speed,
       clicks_rebound_high_speed, stroke, test_frequency, temperature, source_kind, source_name, source_column,
       source_sha256, point_count, points, points_sha256, trace_count, trace, fit_json, notes, imported_at
     FROM bench_run WHERE id = 1`,
    /^bench runs #1, #2 are one run stored more than once/,
  ],
  [
    'an unknown key in a stored corner input',
    `UPDATE setup_corner SET analysis_json = json_set(analysis_json, '$.script', 'x')
     WHERE revision_id = ${REV(1)} AND position = 'FL'`,
    /^revision Test coupe@1: corners\.FL\.analysis\.script: is not a known field here$/,
  ],
  [
    'a vehicle name changed without its key',
    `UPDATE vehicle SET name = 'Renamed' WHERE id = 2`,
    /^vehicle Renamed: its name key does not match its name/,
  ],
  [
    'a damper label changed without its key',
    `UPDATE damper_unit SET label = 'T-9'`,
    /^damper unit T-9: its label key does not match its label/,
  ],
  [
    'an implausible ride height',
    `UPDATE setup_corner SET ride_height = 95 WHERE revision_id = ${REV(1)} AND position = 'FR'`,
    /^revision Test coupe@1: corners\.FR\.rideHeight: .*outside the plausible/,
  ],
];

describe('check verifies every invariant the importer relies on', () => {
  it('finds nothing wrong in an intact shop', () => {
    const report = storeCheck(shop());
    expect(report.problems).toEqual([]);
    expect(report.ok).toBe(true);
  });

  it.each(CASES)('reports %s', (_what, sql, problem) => {
    const report = storeCheck(broken(sql));
    expect(report.ok).toBe(false);
    expect(report.problems).toEqual(expect.arrayContaining([expect.stringMatching(problem)]));
    // No problem line carries a control character to the terminal that shows it.
    for (const p of report.problems)
      expect([...p].filter((ch) => ch.charCodeAt(0) < 0x20 || (ch >= '\u007f' && ch <= '\u009f'))).toEqual(
        [],
      );
  });
});
