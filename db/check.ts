import { sha256Hex } from './bench-points';
import { cornerStoredCheck } from './corner-stored';
import { migrationsApplied, migrationsKnown, schemaVersionLatest } from './migrations';
import { benchRunBlobsEach } from './queries/bench-run';
import { statement } from './statement';
import type { Store } from './store';

export type StoreCheckReport = {
  ok: boolean;
  /** Each problem found, one line each; empty when ok. */
  problems: string[];
  schemaVersion: number;
  counts: { vehicles: number; revisions: number; dampers: number; benchRuns: number; benchPoints: number };
};

/**
 * Checks the database: SQLite's `PRAGMA integrity_check` and `PRAGMA foreign_key_check`,
 * the schema steps against the program's, and our own rules — every revision has its four
 * corners with a valid corner input, every bench run's points match their count and
 * checksum, no vehicle is left half-deleted.
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
    problems.push(`revision ${r.name}@${r.number} has ${r.n} corners, not 4`);
  for (const c of statement(
    db,
    `SELECT v.name, r.number, c.position, c.analysis_json FROM setup_corner c
     JOIN setup_revision r ON r.id = c.revision_id JOIN vehicle v ON v.id = r.vehicle_id`,
  ).iterate() as Iterable<{ name: string; number: number; position: string; analysis_json: string }>) {
    try {
      cornerStoredCheck(JSON.parse(c.analysis_json), `${c.name}@${c.number} ${c.position}`);
    } catch (e) {
      problems.push(`revision ${(e as Error).message}`);
    }
  }
  benchRunBlobsEach(db, (r) => {
    if (r.points.length !== 16 * r.point_count)
      problems.push(`bench run #${r.id}: ${r.points.length} bytes for ${r.point_count} points`);
    else if (sha256Hex(r.points) !== r.points_sha256)
      problems.push(`bench run #${r.id}: the points do not match their checksum`);
  });
  for (const name of statement(db, 'SELECT name FROM vehicle WHERE deleting = 1').pluck().all() as string[])
    problems.push(`vehicle "${name}" is marked as being deleted`);
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
