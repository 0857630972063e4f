import type Database from 'better-sqlite3';
import { statement } from '../statement';

/** A vehicle's stored scenario: SI JSON and when it was set; both null when none is stored. */
export type VehicleScenarioRow = { scenario_json: string | null; scenario_updated_at: string | null };

export function vehicleScenarioGet(db: Database.Database, vehicleId: number): VehicleScenarioRow | undefined {
  return statement(db, 'SELECT scenario_json, scenario_updated_at FROM vehicle WHERE id = ?').get(
    vehicleId,
  ) as VehicleScenarioRow | undefined;
}

/** Stores (or, with null, removes) a vehicle's scenario; false when there is no such vehicle. */
export function vehicleScenarioPut(
  db: Database.Database,
  vehicleId: number,
  row: VehicleScenarioRow,
): boolean {
  return (
    statement(
      db,
      'UPDATE vehicle SET scenario_json = @scenario_json, scenario_updated_at = @scenario_updated_at WHERE id = @id AND deleting = 0',
    ).run({ ...row, id: vehicleId }).changes > 0
  );
}
