import type Database from 'better-sqlite3';
import { canonicalJson } from '../core/setup/canonical-json';
import { InputError } from '../core/units/input-error';
import {
  rideScenarioFromStored,
  rideScenarioParse,
  RIDE_SCENARIO_DEFAULT,
  type RideScenario,
} from '../core/valving/ride-scenario';
import { vehicleScenarioGet, vehicleScenarioPut } from './queries/vehicle-scenario';

/** A vehicle's scenario as the screens and commands use it: stored, or the starting one. */
export type VehicleScenario = { scenario: RideScenario; stored: boolean; updatedAt: string | null };

/** The scenario of a vehicle (by id): the one stored with it, else the starting scenario. */
export function vehicleScenarioRead(db: Database.Database, vehicleId: number): VehicleScenario {
  const row = vehicleScenarioGet(db, vehicleId);
  const stored = rideScenarioFromStored(row?.scenario_json ?? null);
  return stored
    ? { scenario: stored, stored: true, updatedAt: row?.scenario_updated_at ?? null }
    : { scenario: RIDE_SCENARIO_DEFAULT, stored: false, updatedAt: null };
}

/**
 * Sets a vehicle's scenario: `edits` (quantities with units, numbers SI) change the parts they
 * give of the scenario it has now; `null` removes the stored one, so the starting scenario
 * applies again. Stored SI, so that a unit switch never changes it.
 * @throws InputError naming the field; nothing is stored then.
 */
export function vehicleScenarioWrite(
  db: Database.Database,
  vehicleId: number,
  edits: unknown,
  now = new Date(),
): VehicleScenario {
  if (edits === null) {
    vehicleScenarioPut(db, vehicleId, { scenario_json: null, scenario_updated_at: null });
    return vehicleScenarioRead(db, vehicleId);
  }
  const scenario = rideScenarioParse(edits, vehicleScenarioRead(db, vehicleId).scenario);
  if (
    !vehicleScenarioPut(db, vehicleId, {
      scenario_json: canonicalJson(scenario),
      scenario_updated_at: now.toISOString(),
    })
  )
    throw new InputError('vehicle', 'this vehicle is being deleted; its scenario was not stored');
  return vehicleScenarioRead(db, vehicleId);
}
