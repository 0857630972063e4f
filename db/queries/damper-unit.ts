import type Database from 'better-sqlite3';
import type { DamperUnitRow } from '../rows';
import { statement } from '../statement';

export type DamperUnitInsert = Omit<DamperUnitRow, 'id'>;

export function damperUnitInsert(db: Database.Database, d: DamperUnitInsert): number {
  const r = statement(
    db,
    `INSERT INTO damper_unit (label, label_key, kind, serial, notes, created_at)
     VALUES (@label, @label_key, @kind, @serial, @notes, @created_at)`,
  ).run(d);
  return Number(r.lastInsertRowid);
}

export function damperUnitByKey(db: Database.Database, labelKey: string): DamperUnitRow | undefined {
  return statement(db, 'SELECT * FROM damper_unit WHERE label_key = ?').get(labelKey) as
    DamperUnitRow | undefined;
}

export function damperUnitById(db: Database.Database, id: number): DamperUnitRow | undefined {
  return statement(db, 'SELECT * FROM damper_unit WHERE id = ?').get(id) as DamperUnitRow | undefined;
}

/** A damper unit with its number of bench runs and of corners that fit it. */
export type DamperUnitListRow = DamperUnitRow & { run_count: number; last_run_date: string | null };

export function damperUnitList(db: Database.Database): DamperUnitListRow[] {
  return statement(
    db,
    `SELECT d.*, (SELECT count(*) FROM bench_run b WHERE b.damper_unit_id = d.id) AS run_count,
            (SELECT max(coalesce(b.run_date, substr(b.imported_at, 1, 10))) FROM bench_run b
             WHERE b.damper_unit_id = d.id) AS last_run_date
     FROM damper_unit d ORDER BY d.label_key`,
  ).all() as DamperUnitListRow[];
}

/** The damper units fitted to any corner of any revision of a vehicle. */
export function damperUnitsOfVehicle(db: Database.Database, vehicleId: number): DamperUnitRow[] {
  return statement(
    db,
    `SELECT * FROM damper_unit WHERE id IN (
       SELECT c.damper_unit_id FROM setup_corner c JOIN setup_revision r ON r.id = c.revision_id
       WHERE r.vehicle_id = ? AND c.damper_unit_id IS NOT NULL)
     ORDER BY label_key`,
  ).all(vehicleId) as DamperUnitRow[];
}
