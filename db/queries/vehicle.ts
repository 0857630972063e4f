import type Database from 'better-sqlite3';
import type { VehicleRow } from '../rows';
import { statement } from '../statement';

export type VehicleInsert = Pick<VehicleRow, 'name' | 'name_key' | 'kind' | 'notes' | 'created_at'>;

export function vehicleInsert(db: Database.Database, v: VehicleInsert): number {
  const r = statement(
    db,
    'INSERT INTO vehicle (name, name_key, kind, notes, created_at) VALUES (@name, @name_key, @kind, @notes, @created_at)',
  ).run(v);
  return Number(r.lastInsertRowid);
}

export function vehicleByKey(db: Database.Database, nameKey: string): VehicleRow | undefined {
  return statement(db, 'SELECT * FROM vehicle WHERE name_key = ?').get(nameKey) as VehicleRow | undefined;
}

export function vehicleById(db: Database.Database, id: number): VehicleRow | undefined {
  return statement(db, 'SELECT * FROM vehicle WHERE id = ?').get(id) as VehicleRow | undefined;
}

/** A vehicle with how many revisions it has and when the last was saved. */
export type VehicleListRow = VehicleRow & { revision_count: number; last_saved_at: string | null };

const LIST = `SELECT v.*, count(r.id) AS revision_count, max(r.saved_at) AS last_saved_at
  FROM vehicle v LEFT JOIN setup_revision r ON r.vehicle_id = v.id`;

/** Every vehicle (not being deleted), by name. */
export function vehicleList(db: Database.Database): VehicleListRow[] {
  return statement(
    db,
    `${LIST} WHERE v.deleting = 0 GROUP BY v.id ORDER BY v.name_key`,
  ).all() as VehicleListRow[];
}

export function vehicleListRowById(db: Database.Database, id: number): VehicleListRow | undefined {
  return statement(db, `${LIST} WHERE v.id = ? GROUP BY v.id`).get(id) as VehicleListRow | undefined;
}

/** Marks a vehicle for deletion: its revisions may then be deleted (schema 2 triggers). */
export function vehicleMarkDeleting(db: Database.Database, id: number): void {
  statement(db, 'UPDATE vehicle SET deleting = 1 WHERE id = ?').run(id);
}

export function vehicleDelete(db: Database.Database, id: number): void {
  statement(db, 'DELETE FROM vehicle WHERE id = ?').run(id);
}
