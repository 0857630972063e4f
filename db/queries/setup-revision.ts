import type Database from 'better-sqlite3';
import type { SetupRevisionRow } from '../rows';
import { statement } from '../statement';

export type SetupRevisionInsert = Omit<SetupRevisionRow, 'id'>;

export function setupRevisionInsert(db: Database.Database, r: SetupRevisionInsert): number {
  const res = statement(
    db,
    `INSERT INTO setup_revision (vehicle_id, number, parent_id, name, event, track, driver, setup_date,
       fuel_load, anti_roll_bar_front, anti_roll_bar_rear, notes, summary, saved_at)
     VALUES (@vehicle_id, @number, @parent_id, @name, @event, @track, @driver, @setup_date,
       @fuel_load, @anti_roll_bar_front, @anti_roll_bar_rear, @notes, @summary, @saved_at)`,
  ).run(r);
  return Number(res.lastInsertRowid);
}

export function setupRevisionByNumber(
  db: Database.Database,
  vehicleId: number,
  number: number,
): SetupRevisionRow | undefined {
  return statement(db, 'SELECT * FROM setup_revision WHERE vehicle_id = ? AND number = ?').get(
    vehicleId,
    number,
  ) as SetupRevisionRow | undefined;
}

export function setupRevisionById(db: Database.Database, id: number): SetupRevisionRow | undefined {
  return statement(db, 'SELECT * FROM setup_revision WHERE id = ?').get(id) as SetupRevisionRow | undefined;
}

export function setupRevisionLatest(db: Database.Database, vehicleId: number): SetupRevisionRow | undefined {
  return statement(db, 'SELECT * FROM setup_revision WHERE vehicle_id = ? ORDER BY number DESC LIMIT 1').get(
    vehicleId,
  ) as SetupRevisionRow | undefined;
}

/** A revision with its parent's number, for the history. */
export type SetupRevisionListRow = SetupRevisionRow & { parent_number: number | null };

/** All revisions of a vehicle, oldest first. */
export function setupRevisionList(db: Database.Database, vehicleId: number): SetupRevisionListRow[] {
  return statement(
    db,
    `SELECT r.*, p.number AS parent_number FROM setup_revision r
     LEFT JOIN setup_revision p ON p.id = r.parent_id
     WHERE r.vehicle_id = ? ORDER BY r.number`,
  ).all(vehicleId) as SetupRevisionListRow[];
}

/** Deletes a vehicle's revisions, newest first so that no parent goes before its children. */
export function setupRevisionDeleteOfVehicle(db: Database.Database, vehicleId: number): number {
  const ids = statement(db, 'SELECT id FROM setup_revision WHERE vehicle_id = ? ORDER BY number DESC')
    .pluck()
    .all(vehicleId) as number[];
  const del = statement(db, 'DELETE FROM setup_revision WHERE id = ?');
  for (const id of ids) del.run(id);
  return ids.length;
}
