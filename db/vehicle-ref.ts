import type Database from 'better-sqlite3';
import { InputError } from '../core/units/input-error';
import { nameKey } from '../core/units/text-field';
import { vehicleById, vehicleByKey, vehicleList } from './queries/vehicle';
import type { VehicleRow } from './rows';

/**
 * The vehicle a reference names: its name (compared as `nameKey` does) or its id.
 * @throws InputError naming `field`, with the vehicles there are.
 */
export function vehicleResolve(db: Database.Database, ref: string | number, field = 'vehicle'): VehicleRow {
  const row = typeof ref === 'number' ? vehicleById(db, ref) : vehicleByKey(db, nameKey(ref));
  if (row && row.deleting === 0) return row;
  const names = vehicleList(db).map((v) => `"${v.name}"`);
  const known =
    names.length === 0
      ? 'there are no vehicles yet (vehicle add NAME)'
      : `vehicles: ${names.slice(0, 12).join(', ')}${names.length > 12 ? ', …' : ''}`;
  throw new InputError(
    field,
    `no vehicle ${typeof ref === 'number' ? `with id ${ref}` : `named "${ref}"`}; ${known}`,
  );
}
