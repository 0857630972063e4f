import type Database from 'better-sqlite3';
import type { SetupCornerRow } from '../rows';
import { statement } from '../statement';

export function setupCornerInsert(db: Database.Database, c: SetupCornerRow): void {
  statement(
    db,
    `INSERT INTO setup_corner (revision_id, position, analysis_json, damper_unit_id, clicks_bump, clicks_rebound,
       clicks_bump_high_speed, clicks_rebound_high_speed, spring_label, ride_height, tire_pressure_cold, camber,
       toe, toe_kind, notes)
     VALUES (@revision_id, @position, @analysis_json, @damper_unit_id, @clicks_bump, @clicks_rebound,
       @clicks_bump_high_speed, @clicks_rebound_high_speed, @spring_label, @ride_height, @tire_pressure_cold,
       @camber, @toe, @toe_kind, @notes)`,
  ).run(c);
}

const COLUMNS = `revision_id, position, analysis_json, damper_unit_id, clicks_bump, clicks_rebound,
  clicks_bump_high_speed, clicks_rebound_high_speed, spring_label, ride_height, tire_pressure_cold, camber,
  toe, toe_kind, notes`;

/** A corner with the label of its damper unit. */
export type SetupCornerReadRow = SetupCornerRow & { damper_label: string | null };

/** The four corners of a revision, in FL, FR, RL, RR order. */
export function setupCornersOf(db: Database.Database, revisionId: number): SetupCornerReadRow[] {
  return statement(
    db,
    `SELECT ${COLUMNS.replace(/(\w+)/g, 'c.$1')}, d.label AS damper_label
     FROM setup_corner c LEFT JOIN damper_unit d ON d.id = c.damper_unit_id
     WHERE c.revision_id = ?
     ORDER BY CASE c.position WHEN 'FL' THEN 1 WHEN 'FR' THEN 2 WHEN 'RL' THEN 3 ELSE 4 END`,
  ).all(revisionId) as SetupCornerReadRow[];
}

export function setupCornerDeleteOfVehicle(db: Database.Database, vehicleId: number): number {
  return statement(
    db,
    'DELETE FROM setup_corner WHERE revision_id IN (SELECT id FROM setup_revision WHERE vehicle_id = ?)',
  ).run(vehicleId).changes;
}
