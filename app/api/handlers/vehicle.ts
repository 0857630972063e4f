import { InputError } from '../../../core/units/input-error';
import { RIDE_SCENARIO_DEFAULT_NOTE } from '../../../core/valving/ride-scenario';
import { valvingScenarioEdit } from '../../../core/valving/valving-presets';
import { CORNER_POSITIONS } from '../../../core/setup/setup-sheet';
import { nameFieldParse, nameKey, NOTES_MAX_LENGTH, textFieldParse } from '../../../core/units/text-field';
import { setupCornersOf } from '../../../db/queries/setup-corner';
import { setupRevisionLatest } from '../../../db/queries/setup-revision';
import { vehicleByKey, vehicleInsert, vehicleList, vehicleListRowById } from '../../../db/queries/vehicle';
import type { VehicleListRow } from '../../../db/queries/vehicle';
import { storeTransaction } from '../../../db/store';
import { vehicleDeleteWithBackup } from '../../../db/vehicle-delete';
import { vehicleResolve } from '../../../db/vehicle-ref';
import {
  vehicleScenarioRead,
  vehicleScenarioWrite,
  type VehicleScenario,
} from '../../../db/vehicle-scenario';
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

function scenarioViewOf(
  v: { id: number; name: string },
  s: VehicleScenario,
): HandlerOutput<'vehicleScenario'> {
  return {
    vehicle: { id: v.id, name: v.name },
    ...s,
    note: s.stored ? `the scenario set for "${v.name}"` : RIDE_SCENARIO_DEFAULT_NOTE,
  };
}

/** Handler `vehicleScenario`: the road, bump and curb a vehicle is judged on (the starting scenario when none is stored). */
export function vehicleScenarioHandler(
  input: HandlerParsedInput<'vehicleScenario'>,
  { store }: ApiContext,
): HandlerOutput<'vehicleScenario'> {
  const v = vehicleResolve(store.db, input.vehicle);
  return scenarioViewOf(v, vehicleScenarioRead(store.db, v.id));
}

/** Handler `vehicleScenarioSet`: changes the parts of a vehicle's scenario given (null: back to the starting one). */
export function vehicleScenarioSetHandler(
  input: HandlerParsedInput<'vehicleScenarioSet'>,
  { store }: ApiContext,
): HandlerOutput<'vehicleScenarioSet'> {
  return storeTransaction(store, () => {
    const v = vehicleResolve(store.db, input.vehicle);
    return scenarioViewOf(v, vehicleScenarioWrite(store.db, v.id, input.scenario));
  });
}

/**
 * The scenario a choice or a comparison of `vehicleId` is judged on: the vehicle's (stored or
 * the starting one) with the request's own scenario edits on top, and where it comes from.
 */
export function vehicleJudgedScenario(
  store: ApiContext['store'],
  vehicle: { id: number; name: string },
  edits: unknown,
): { scenario: VehicleScenario['scenario']; source: { tag: 'user' | 'ours'; text: string } } {
  const s = vehicleScenarioRead(store.db, vehicle.id);
  const scenario = valvingScenarioEdit(s.scenario, edits);
  const words = s.stored ? `the scenario set for "${vehicle.name}"` : RIDE_SCENARIO_DEFAULT_NOTE;
  return {
    scenario,
    source: {
      tag: s.stored || edits !== undefined ? 'user' : 'ours',
      text: edits === undefined ? words : `${words}, with this request's changes`,
    },
  };
}
