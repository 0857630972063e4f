import type Database from 'better-sqlite3';
import type { BenchRunRow, BenchRunSummaryRow } from '../rows';
import { statement } from '../statement';

export type BenchRunInsert = Omit<BenchRunRow, 'id'>;

export function benchRunInsert(db: Database.Database, r: BenchRunInsert): number {
  const res = statement(
    db,
    `INSERT INTO bench_run (damper_unit_id, run_date, clicks_bump, clicks_rebound, clicks_bump_high_speed,
       clicks_rebound_high_speed, stroke, test_frequency, temperature, source_kind, source_name, source_column,
       source_sha256, point_count, points, points_sha256, trace_count, trace, fit_json, notes, imported_at)
     VALUES (@damper_unit_id, @run_date, @clicks_bump, @clicks_rebound, @clicks_bump_high_speed,
       @clicks_rebound_high_speed, @stroke, @test_frequency, @temperature, @source_kind, @source_name,
       @source_column, @source_sha256, @point_count, @points, @points_sha256, @trace_count, @trace, @fit_json,
       @notes, @imported_at)`,
  ).run(r);
  return Number(res.lastInsertRowid);
}

export function benchRunById(db: Database.Database, id: number): BenchRunRow | undefined {
  return statement(db, 'SELECT * FROM bench_run WHERE id = ?').get(id) as BenchRunRow | undefined;
}

const SUMMARY_COLUMNS = `id, damper_unit_id, run_date, clicks_bump, clicks_rebound, clicks_bump_high_speed,
  clicks_rebound_high_speed, stroke, test_frequency, temperature, source_kind, source_name, source_column,
  source_sha256, point_count, points_sha256, trace_count, fit_json, notes, imported_at`;

/** The runs of one damper unit without their blobs, oldest first. */
export function benchRunListOfDamper(db: Database.Database, damperUnitId: number): BenchRunSummaryRow[] {
  return statement(db, `SELECT ${SUMMARY_COLUMNS} FROM bench_run WHERE damper_unit_id = ? ORDER BY id`).all(
    damperUnitId,
  ) as BenchRunSummaryRow[];
}

/** The runs of one damper unit with their points but not their traces, oldest first. */
export function benchRunsWithPointsOfDamper(
  db: Database.Database,
  damperUnitId: number,
): (BenchRunSummaryRow & Pick<BenchRunRow, 'points'>)[] {
  return statement(
    db,
    `SELECT ${SUMMARY_COLUMNS}, points FROM bench_run WHERE damper_unit_id = ? ORDER BY id`,
  ).all(damperUnitId) as (BenchRunSummaryRow & Pick<BenchRunRow, 'points'>)[];
}

/** Full rows of a damper's runs, for export. */
export function benchRunRowsOfDamper(db: Database.Database, damperUnitId: number): BenchRunRow[] {
  return statement(db, 'SELECT * FROM bench_run WHERE damper_unit_id = ? ORDER BY id').all(
    damperUnitId,
  ) as BenchRunRow[];
}

/** Runs already imported from the same file content (and column pair) for the same damper. */
export function benchRunsFromSource(
  db: Database.Database,
  damperUnitId: number,
  sourceSha256: string,
): BenchRunSummaryRow[] {
  return statement(
    db,
    `SELECT ${SUMMARY_COLUMNS} FROM bench_run WHERE damper_unit_id = ? AND source_sha256 = ? ORDER BY id`,
  ).all(damperUnitId, sourceSha256) as BenchRunSummaryRow[];
}

/** Every run's id, count and blob sizes and checksums, for the store check. */
export function benchRunBlobsEach(
  db: Database.Database,
  each: (r: Pick<BenchRunRow, 'id' | 'point_count' | 'points' | 'points_sha256'>) => void,
): void {
  for (const r of statement(
    db,
    'SELECT id, point_count, points, points_sha256 FROM bench_run ORDER BY id',
  ).iterate())
    each(r as Pick<BenchRunRow, 'id' | 'point_count' | 'points' | 'points_sha256'>);
}
