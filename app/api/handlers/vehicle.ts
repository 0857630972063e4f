import { InputError } from '../../../core/units/input-error';
import { CORNER_POSITIONS } from '../../../core/setup/setup-sheet';
import { nameFieldParse, nameKey, NOTES_MAX_LENGTH, textFieldParse } from '../../../core/units/text-field';
import { setupCornersOf } from '../../../db/queries/setup-corner';
import { setupRevisionLatest } from '../../../db/queries/setup-revision';
import { vehicleByKey, vehicleInsert, vehicleList, vehicleListRowById } from '../../../db/queries/vehicle';
import type { VehicleListRow } from '../../../db/queries/vehicle';
import { storeTransaction } from '../../../db/store';
import { vehicleDeleteWithBackup } from '../../../db/vehicle-delete';
import { vehicleResolve } from '../../../db/vehicle-ref';
import type { ApiContext } from '../context';
import type { HandlerOutput, HandlerParsedInput } from '../contract';
import { revisionViewOf, vehicleViewOf } from '../record-views';

/** Handler `vehicleAdd`: a new vehicle; a name already taken (ignoring case and spacing) is refused. */
export function vehicleAdd(
  input: HandlerParsedInput<'vehicleAdd'>,
  { store }: ApiContext,
): HandlerOutput<'vehicleAdd'> {
  const name = nameFieldParse(input.name, 'name', 'a vehicle name');
  const kind = textFieldParse(input.kind, 'kind');
  const notes = textFieldParse(input.notes, 'notes', { maxLength: NOTES_MAX_LENGTH, multiline: true });
  const key = nameKey(name);
  const row = storeTransaction(store, () => {
    const existing = vehicleByKey(store.db, key);
    if (existing)
      throw new InputError(
        'name',
        existing.name === name
          ? `a vehicle named "${name}" already exists; nothing was added`
          : `"${name}" is the same name as the vehicle "${existing.name}" (names are compared ignoring case and spacing); nothing was added`,
      );
    const id = vehicleInsert(store.db, {
      name,
      name_key: key,
      kind,
      notes,
      created_at: new Date().toISOString(),
    });
    return vehicleListRowById(store.db, id) as VehicleListRow;
  });
  return { vehicle: vehicleViewOf(row) };
}

/** Handler `vehicleList`: every vehicle with its number of revisions. */
export function vehicleListHandler(
  _input: HandlerParsedInput<'vehicleList'>,
  { store }: ApiContext,
): HandlerOutput<'vehicleList'> {
  return { vehicles: vehicleList(store.db).map(vehicleViewOf) };
}

/** Handler `vehicleShow`: a vehicle, its newest revision and the dampers fitted in it. */
export function vehicleShow(
  input: HandlerParsedInput<'vehicleShow'>,
  { store }: ApiContext,
): HandlerOutput<'vehicleShow'> {
  const v = vehicleResolve(store.db, input.vehicle);
  const latest = setupRevisionLatest(store.db, v.id);
  const dampers: HandlerOutput<'vehicleShow'>['dampers'] = [];
  if (latest) {
    const corners = new Map(setupCornersOf(store.db, latest.id).map((c) => [c.position, c]));
    for (const p of CORNER_POSITIONS) {
      const label = corners.get(p)?.damper_label;
      if (label) dampers.push({ position: p, label });
    }
  }
  return {
    vehicle: vehicleViewOf(vehicleListRowById(store.db, v.id) as VehicleListRow),
    latest: latest ? revisionViewOf(latest, null) : null,
    dampers,
  };
}

/** Handler `vehicleDelete`: a full backup first, then the vehicle and its revisions go; the bench library stays. */
export async function vehicleDeleteHandler(
  input: HandlerParsedInput<'vehicleDelete'>,
  { store }: ApiContext,
): Promise<HandlerOutput<'vehicleDelete'>> {
  const v = vehicleResolve(store.db, input.vehicle);
  return vehicleDeleteWithBackup(store, v);
}
