import type Database from 'better-sqlite3';
import { InputError } from '../core/units/input-error';
import { nameKey, textControlsEscaped, textFieldParse } from '../core/units/text-field';
import { sha256Hex } from './bench-points';
import { benchRunToBundle, bundleRevisionOf } from './bundle';
import { bundleRevisionChecked, bundleVehicleChecked, FIRST_SETUP_SUMMARY } from './bundle-check';
import { bundleDamperChecked, bundleRunChecked } from './bundle-check-bench';
import { migrationsApplied, migrationsKnown, schemaVersionLatest } from './migrations';
import { setupRevisionList } from './queries/setup-revision';
import type { BenchRunRow, DamperUnitRow, VehicleRow } from './rows';
import { statement } from './statement';
import type { Store } from './store';

export type StoreCheckReport = {
  ok: boolean;
  /** Each problem found, one line each; empty when ok. */
  problems: string[];
  schemaVersion: number;
  counts: { vehicles: number; revisions: number; dampers: number; benchRuns: number; benchPoints: number };
};

/** A stored text as a problem line may show it: control characters written as \u escapes. */
function textShown(text: string): string {
  return textControlsEscaped(text).replace(/\n/g, '\\n');
}

/** Runs `check` and gives its InputError as one problem line under `record`; other errors pass. */
function problemOf(record: string, check: () => void): string[] {
  try {
    check();
    return [];
  } catch (e) {
    if (e instanceof InputError) return [`${record}: ${e.field ? `${e.field}: ` : ''}${e.problem}`];
    throw e;
  }
}

/**
 * Two stored fits this close (relative, per number) are one: the fit is recomputed by the
 * program that checks, and a later, finer fit may differ in the last digits.
 */
export const STORED_FIT_RELATIVE_TOLERANCE = 1e-6;

type StoredDirectionFit = {
  curve: { lowSpeed: number; kneeSpeed: number; highSpeed: number };
  rmsResidual: number;
  points: number;
} | null;
type StoredFit = { bump: StoredDirectionFit; rebound: StoredDirectionFit; basis: string };

/** Where a stored fit differs from the one recomputed from its points, in words; null when they agree. */
function fitDifference(stored: StoredFit, recomputed: StoredFit): string | null {
  if (stored.basis !== recomputed.basis)
    return `the fit was made on ${stored.basis}, its points give one on ${recomputed.basis}`;
  for (const side of ['bump', 'rebound'] as const) {
    const a = stored[side];
    const b = recomputed[side];
    if ((a === null) !== (b === null))
      return `the ${side} fit is ${a === null ? 'missing' : 'there'}, its points give ${b === null ? 'none' : 'one'}`;
    if (!a || !b) continue;
    const pairs: [string, number, number][] = [
      ['low-speed coefficient', a.curve.lowSpeed, b.curve.lowSpeed],
      ['knee speed', a.curve.kneeSpeed, b.curve.kneeSpeed],
      ['high-speed coefficient', a.curve.highSpeed, b.curve.highSpeed],
      ['RMS residual', a.rmsResidual, b.rmsResidual],
      ['point count', a.points, b.points],
    ];
    for (const [what, x, y] of pairs) {
      const close =
        typeof x === 'number' &&
        Math.abs(x - y) <= STORED_FIT_RELATIVE_TOLERANCE * Math.max(Math.abs(x), Math.abs(y)) + 1e-12;
      if (!close)
        return `the stored ${side} ${what} ${Number(Number(x).toPrecision(4))} is not the ${Number(y.toPrecision(4))} its points give`;
    }
  }
  return null;
}

/**
 * Every record checked by the rules an import checks a bundle's by (db/bundle.ts): vehicles,
 * damper units, each revision as a setup sheet (texts, lengths, clicks, dates, quantities,
 * corner inputs), each bench run (points, fields, and its fit against a recomputation from
 * its points); and what holds between records: revisions of a vehicle numbered 1 to N,
 * parents earlier revisions of the same vehicle, a summary of "first setup" exactly where
 * there is no parent, no bench run stored twice.
 */
function recordProblems(db: Database.Database): string[] {
  const problems: string[] = [];
  const vehicles = statement(db, 'SELECT * FROM vehicle ORDER BY id').all() as VehicleRow[];
  for (const v of vehicles) {
    const name = textShown(v.name);
    problems.push(
      ...problemOf(`vehicle ${name}`, () =>
        bundleVehicleChecked({ name: v.name, kind: v.kind, notes: v.notes, createdAt: v.created_at }, ''),
      ),
    );
    if (v.name_key !== nameKey(v.name))
      problems.push(
        `vehicle ${name}: its name key does not match its name (two vehicles could share a name)`,
      );
    const revisions = setupRevisionList(db, v.id);
    const numbers = revisions.map((r) => r.number);
    const distinct = new Set(numbers).size;
    if (
      revisions.length > 0 &&
      (numbers[0] !== 1 || numbers.at(-1) !== revisions.length || distinct !== revisions.length)
    )
      problems.push(
        `vehicle ${name}: its ${revisions.length} revision${revisions.length === 1 ? ' is' : 's are'} numbered ${numbers[0]} to ${numbers.at(-1)}; they must be 1 to ${revisions.length}, each once`,
      );
    for (const r of revisions) {
      const record = `revision ${name}@${r.number}`;
      if (r.parent_id !== null) {
        const parent = statement(db, 'SELECT vehicle_id, number FROM setup_revision WHERE id = ?').get(
          r.parent_id,
        ) as { vehicle_id: number; number: number } | undefined;
        if (parent && (parent.vehicle_id !== v.id || parent.number >= r.number))
          problems.push(
            `${record}: its parent ${parent.vehicle_id !== v.id ? 'belongs to another vehicle' : `${parent.number} is not an earlier revision`}`,
          );
      }
      if ((r.parent_id === null) !== (r.summary === FIRST_SETUP_SUMMARY))
        problems.push(
          `${record}: its summary ${r.parent_id === null ? `is not "${FIRST_SETUP_SUMMARY}" though it has no parent` : `says "${FIRST_SETUP_SUMMARY}" though it has a parent`}`,
        );
      problems.push(...problemOf(record, () => textFieldParse(r.summary, 'summary')));
      const corners = statement(db, 'SELECT count(*) FROM setup_corner WHERE revision_id = ?')
        .pluck()
        .get(r.id);
      if (corners !== 4) continue; // reported above
      problems.push(
        ...problemOf(record, () =>
          bundleRevisionChecked(bundleRevisionOf(db, r), '', Number.MAX_SAFE_INTEGER),
        ),
      );
    }
  }
  for (const d of statement(db, 'SELECT * FROM damper_unit ORDER BY id').all() as DamperUnitRow[]) {
    if (d.label_key !== nameKey(d.label))
      problems.push(
        `damper unit ${textShown(d.label)}: its label key does not match its label (two units could share a label)`,
      );
    problems.push(
      ...problemOf(`damper unit ${textShown(d.label)}`, () =>
        bundleDamperChecked(
          {
            label: d.label,
            kind: d.kind,
            serial: d.serial,
            notes: d.notes,
            createdAt: d.created_at,
            runs: [],
          },
          '',
        ),
      ),
    );
  }
  const fits = new Map<string, string>();
  for (const row of statement(db, 'SELECT * FROM bench_run ORDER BY id').iterate() as Iterable<BenchRunRow>) {
    const record = `bench run #${row.id}`;
    if (row.points.length !== 16 * row.point_count) {
      problems.push(`${record}: ${row.points.length} bytes for ${row.point_count} points`);
      continue;
    }
    if (sha256Hex(row.points) !== row.points_sha256) {
      problems.push(`${record}: the points do not match their checksum`);
      continue;
    }
    let recomputed: string | undefined;
    problems.push(
      ...problemOf(record, () => {
        const bundled = benchRunToBundle({ ...row, points: Buffer.alloc(0), trace: null });
        const stored = { points: row.points, trace: row.trace };
        recomputed = bundleRunChecked({ ...bundled, traceCount: row.trace_count }, '', {
          fits,
          stored,
        }).fit_json;
      }),
    );
    if (recomputed === undefined) continue;
    let difference: string | null;
    try {
      difference = fitDifference(JSON.parse(row.fit_json) as StoredFit, JSON.parse(recomputed) as StoredFit);
    } catch {
      difference = 'the stored fit is not a fit';
    }
    if (difference) problems.push(`${record}: ${difference}`);
  }
  for (const r of statement(
    db,
    `SELECT group_concat(id, ', #') AS ids FROM bench_run
     GROUP BY damper_unit_id, points_sha256, source_sha256, source_column, imported_at HAVING count(*) > 1`,
  ).all() as { ids: string }[])
    problems.push(
      `bench runs #${r.ids} are one run stored more than once (same damper, points, source and time)`,
    );
  return problems;
}

/**
 * Checks the database: SQLite's `PRAGMA integrity_check` and `PRAGMA foreign_key_check`,
 * the schema steps against the program's, and our own rules — every revision has its four
 * corners, every bench run's points match their count and checksum, no vehicle is left
 * half-deleted — and every record by the rules an import checks a bundle's by, so that a
 * database broken by any route is reported (recordProblems).
 */
export function storeCheck(store: Store): StoreCheckReport {
  const db = store.db;
  const problems: string[] = [];
  const integrity = db.pragma('integrity_check') as { integrity_check: string }[];
  for (const r of integrity) if (r.integrity_check !== 'ok') problems.push(`integrity: ${r.integrity_check}`);
  const fk = db.pragma('foreign_key_check') as { table: string; rowid: number; parent: string }[];
  for (const r of fk) problems.push(`foreign key: ${r.table} row ${r.rowid} points to a missing ${r.parent}`);
  const applied = migrationsApplied(db);
  const known = migrationsKnown();
  if (applied.length !== schemaVersionLatest())
    problems.push(`schema: ${applied.length} of ${schemaVersionLatest()} steps applied`);
  for (const a of applied)
    if (known[a.version - 1]?.sha256 !== a.sha256)
      problems.push(`schema: step ${a.version} differs from this program's`);
  const count = (sql: string) => statement(db, sql).pluck().get() as number;
  for (const r of statement(
    db,
    `SELECT v.name, r.number, count(c.position) AS n FROM setup_revision r
     JOIN vehicle v ON v.id = r.vehicle_id LEFT JOIN setup_corner c ON c.revision_id = r.id
     GROUP BY r.id HAVING n <> 4`,
  ).all() as { name: string; number: number; n: number }[])
    problems.push(`revision ${textShown(r.name)}@${r.number} has ${r.n} corners, not 4`);
  problems.push(...recordProblems(db));
  for (const name of statement(db, 'SELECT name FROM vehicle WHERE deleting = 1').pluck().all() as string[])
    problems.push(`vehicle ${textShown(name)} is marked as being deleted`);
  return {
    ok: problems.length === 0,
    problems,
    schemaVersion: applied.length,
    counts: {
      vehicles: count('SELECT count(*) FROM vehicle'),
      revisions: count('SELECT count(*) FROM setup_revision'),
      dampers: count('SELECT count(*) FROM damper_unit'),
      benchRuns: count('SELECT count(*) FROM bench_run'),
      benchPoints: count('SELECT coalesce(sum(point_count), 0) FROM bench_run'),
    },
  };
}
