import { InputError } from '../units/input-error';
import type { ValvingScenario } from './valving-evaluate';
import { valvingScenarioEdit } from './valving-presets';

/**
 * A vehicle's scenario: the random road, the (1−cos) bump and the curb every screen and
 * command judges it on, SI. One per vehicle, stored with it; the unit system only changes how
 * it is written.
 */
export type RideScenario = ValvingScenario;

/**
 * The scenario of a vehicle that has none stored: an average road (ISO 8608 class C) at a
 * fast-road speed, a 25 mm bump half a metre long at a corner-exit speed, and a 40 mm curb
 * at 60 km/h. Our own starting values, not from a published source: set them to the car.
 */
export const RIDE_SCENARIO_DEFAULT: RideScenario = {
  road: { roadClass: 'C', speed: 80 / 3.6 },
  bump: { height: 0.025, length: 0.5, speed: 50 / 3.6 },
  curb: { height: 0.04, rise: 0.15, hold: 0.3, drop: 0.02, speed: 60 / 3.6 },
};

/** Where a scenario comes from, in words for the screens and the command. */
export const RIDE_SCENARIO_DEFAULT_NOTE =
  "RideLedger's starting scenario (not stored for this vehicle yet): set it to the car and its use";

/**
 * Reads a scenario: `raw` gives {road: {class, speed}, bump: {height, length, speed}, curb:
 * {height, rise, hold, drop, speed}} — quantities with units as in a corner file, numbers as
 * SI — and any part it leaves out is taken from `base`.
 * @throws InputError naming the field (`scenario.bump.height`).
 * @example rideScenarioParse({ bump: { height: '1 in' } }).bump.height // 0.0254
 */
export function rideScenarioParse(
  raw: unknown,
  base: RideScenario = RIDE_SCENARIO_DEFAULT,
  field = 'scenario',
): RideScenario {
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw))
    throw new InputError(field, 'expected an object {road, bump, curb}');
  return valvingScenarioEdit(base, raw, field);
}

/**
 * A stored scenario (SI JSON, as `rideScenarioParse` wrote it) read back; a part missing or
 * unreadable is the default's, so that a scenario written by another version still opens.
 */
export function rideScenarioFromStored(json: string | null): RideScenario | null {
  if (json === null) return null;
  let raw: unknown;
  try {
    raw = JSON.parse(json);
  } catch {
    return null;
  }
  if (raw === null || typeof raw !== 'object') return null;
  const o = raw as Record<string, unknown>;
  let out = RIDE_SCENARIO_DEFAULT;
  for (const part of ['road', 'bump', 'curb'] as const) {
    if (o[part] === undefined) continue;
    const given = o[part] as Record<string, unknown>;
    // Stored road classes are under roadClass; the reader's field is class.
    const edit =
      part === 'road' && given && typeof given === 'object'
        ? { class: given.roadClass, speed: given.speed }
        : given;
    try {
      out = valvingScenarioEdit(out, { [part]: edit });
    } catch {
      // keeps the default's part
    }
  }
  return out;
}

/**
 * A scenario as `rideScenarioParse` reads it (the road's class under `class`), numbers SI: the
 * form in which a stored or carried scenario is checked again.
 */
export function rideScenarioEdits(s: {
  road: { roadClass: string; speed: number };
  bump: Record<string, number>;
  curb: Record<string, number>;
}): { road: { class: string; speed: number }; bump: Record<string, number>; curb: Record<string, number> } {
  return { road: { class: s.road.roadClass, speed: s.road.speed }, bump: { ...s.bump }, curb: { ...s.curb } };
}
