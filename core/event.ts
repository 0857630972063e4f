import type { BumpSpec } from './corner-file';
import { InputError, inputFieldPath } from './input-error';
import { roadBump, roadCurb, roadPothole, roadStep, type CurbSpec, type RoadProfile } from './road';
import { quantityFormat } from './units';

/** The event window of DESIGN.md: every event starts at rest in static equilibrium and runs 1.5 s. */
export const EVENT_DURATION = 1.5;

/** Settling band, as a fraction of the road input's size (2 %, as the linear step uses). */
export const EVENT_SETTLING_BAND = 0.02;

export type EventKind = 'bump' | 'step' | 'curb' | 'pothole' | 'road';

/**
 * A road event: a road crossed at a constant speed for a time window, SI. `settle` says where
 * the body comes to rest after it and how close counts as settled (absent for roads that never
 * end, such as a random road). `start` offsets the start from rest in static equilibrium.
 */
export type RoadEvent = {
  kind: EventKind;
  /** Words for messages, e.g. "the 25.0 mm bump at 50.4 km/h". */
  label: string;
  road: RoadProfile;
  /** Speed over the road (m/s). */
  speed: number;
  /** Window (s); EVENT_DURATION unless given. */
  duration?: number;
  settle?: { target: number; band: number };
  start?: {
    bodyDisplacement?: number;
    wheelDisplacement?: number;
    bodyVelocity?: number;
    wheelVelocity?: number;
  };
};

function speedCheck(speed: number, field: string): void {
  if (!Number.isFinite(speed) || !(speed > 0)) {
    throw new InputError(
      inputFieldPath(field, 'speed'),
      `speed must be greater than zero (got ${speed} m/s)`,
    );
  }
}

const mm = (v: number) => quantityFormat(v, 'length', 'si');
const kmh = (v: number) => quantityFormat(v, 'speed', 'si');

/** The file's (1−cos) bump (DESIGN.md): height, length, speed. */
export function eventBump(spec: BumpSpec, field = 'bump'): RoadEvent {
  speedCheck(spec.speed, field);
  return {
    kind: 'bump',
    label: `the ${mm(spec.height)} bump, ${quantityFormat(spec.length, 'length', 'si', { decimals: 0 })} long, at ${kmh(spec.speed)}`,
    road: roadBump(spec.height, spec.length, field),
    speed: spec.speed,
    settle: { target: 0, band: EVENT_SETTLING_BAND * Math.abs(spec.height) },
  };
}

/** A road step of `height` rising over `rise` (m), at `speed` (m/s). */
export function eventStep(spec: { height: number; rise: number; speed: number }, field = 'step'): RoadEvent {
  speedCheck(spec.speed, field);
  return {
    kind: 'step',
    label: `the ${mm(spec.height)} step at ${kmh(spec.speed)}`,
    road: roadStep(spec.height, spec.rise, field),
    speed: spec.speed,
    settle: { target: spec.height, band: EVENT_SETTLING_BAND * Math.abs(spec.height) },
  };
}

/** A curb strike (ramp, top, drop) at `speed` (m/s). */
export function eventCurb(spec: CurbSpec & { speed: number }, field = 'curb'): RoadEvent {
  speedCheck(spec.speed, field);
  return {
    kind: 'curb',
    label: `the ${mm(spec.height)} curb at ${kmh(spec.speed)}`,
    road: roadCurb(spec, field),
    speed: spec.speed,
    settle: { target: 0, band: EVENT_SETTLING_BAND * spec.height },
  };
}

/** A (1−cos) pothole of `depth` over `length` (m) at `speed` (m/s). */
export function eventPothole(
  spec: { depth: number; length: number; speed: number },
  field = 'pothole',
): RoadEvent {
  speedCheck(spec.speed, field);
  return {
    kind: 'pothole',
    label: `the ${mm(spec.depth)} deep pothole at ${kmh(spec.speed)}`,
    road: roadPothole(spec.depth, spec.length, field),
    speed: spec.speed,
    settle: { target: 0, band: EVENT_SETTLING_BAND * spec.depth },
  };
}

/** Any road (a generated or measured profile) at `speed` (m/s); it has no settling target. */
export function eventRoad(road: RoadProfile, speed: number, label: string, field = 'road'): RoadEvent {
  speedCheck(speed, field);
  return { kind: 'road', label, road, speed };
}
