import type { BumpSpec } from '../corner/corner-file';
import { InputError, inputFieldPath } from '../units/input-error';
import { roadBump, roadCurb, roadPothole, roadStep, type CurbSpec, type RoadProfile } from './road';
import { numberRounded, quantityRounded } from '../units/number-text';
import { plausibleCheck } from '../corner/plausible-range';
import { quantityFormat, type UnitSystem } from '../units/units';

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
  /** Words for messages in SI, e.g. "the 25.0 mm bump at 50.4 km/h"; `eventLabel` writes them in either system. */
  label: string;
  /** The sizes the words name (m): the height (a pothole's depth) and, for a bump, its length. */
  sizes?: { height: number; length?: number };
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

/**
 * The shortest time (s) in which an event's feature may be crossed. Shorter, the tyre would
 * bridge it (a contact patch is about 0.1 m long) and the integrator's steps, sized for the
 * corner's own motion, would have nothing to follow: the answer would be a silent zero.
 */
export const EVENT_SHORTEST_CROSSING = 2e-4;

function speedCheck(speed: number, field: string): void {
  if (!Number.isFinite(speed) || !(speed > 0)) {
    throw new InputError(
      inputFieldPath(field, 'speed'),
      `speed must be greater than zero (got ${numberRounded(speed)} m/s)`,
    );
  }
  plausibleCheck(speed, 'eventSpeed', inputFieldPath(field, 'speed'));
}

/** Refuses an event whose feature of `length` (m) passes in less than EVENT_SHORTEST_CROSSING. */
function crossingCheck<E extends RoadEvent>(event: E, length: number, field: string): E {
  const time = length / event.speed;
  if (time >= EVENT_SHORTEST_CROSSING) return event;
  const shortest = EVENT_SHORTEST_CROSSING * event.speed;
  throw new InputError(
    field,
    `${event.label} is crossed in ${quantityRounded(time, 'time')}, too short or too fast for the simulation to follow (at least ${numberRounded(EVENT_SHORTEST_CROSSING * 1000)} ms; a tyre bridges anything shorter): make it at least ${quantityRounded(shortest, 'length')} long at this speed, or slower`,
  );
}

/** An event's words in `units`, e.g. "the 25.0 mm bump, 1500 mm long, at 50.4 km/h" or "the 0.98 in bump, …". */
export function eventLabel(
  event: Pick<RoadEvent, 'kind' | 'label' | 'sizes' | 'speed'>,
  units: UnitSystem,
): string {
  const s = event.sizes;
  if (!s) return event.label;
  const size = (v: number) => quantityFormat(v, 'length', units);
  const at = quantityFormat(event.speed, 'speed', units);
  switch (event.kind) {
    case 'bump': {
      const long =
        s.length === undefined
          ? ''
          : `, ${quantityFormat(s.length, 'length', units, units === 'si' ? { decimals: 0 } : {})} long`;
      return `the ${size(s.height)} bump${long}, at ${at}`;
    }
    case 'step':
      return `the ${size(s.height)} step at ${at}`;
    case 'curb':
      return `the ${size(s.height)} curb at ${at}`;
    case 'pothole':
      return `the ${size(s.height)} deep pothole at ${at}`;
    case 'road':
      return event.label;
  }
}

/** An event of `kind` with its SI words made from its sizes. */
function eventNamed<E extends Omit<RoadEvent, 'label'>>(e: E): E & { label: string } {
  return { ...e, label: eventLabel({ ...e, label: '' }, 'si') };
}

/** The file's (1−cos) bump (DESIGN.md): height, length, speed. */
export function eventBump(spec: BumpSpec, field = 'bump'): RoadEvent {
  speedCheck(spec.speed, field);
  const event = eventNamed({
    kind: 'bump',
    sizes: { height: spec.height, length: spec.length },
    road: roadBump(spec.height, spec.length, field),
    speed: spec.speed,
    settle: { target: 0, band: EVENT_SETTLING_BAND * Math.abs(spec.height) },
  });
  return crossingCheck(event, spec.length, inputFieldPath(field, 'length'));
}

/** A road step of `height` rising over `rise` (m), at `speed` (m/s). */
export function eventStep(spec: { height: number; rise: number; speed: number }, field = 'step'): RoadEvent {
  speedCheck(spec.speed, field);
  const event = eventNamed({
    kind: 'step',
    sizes: { height: spec.height },
    road: roadStep(spec.height, spec.rise, field),
    speed: spec.speed,
    settle: { target: spec.height, band: EVENT_SETTLING_BAND * Math.abs(spec.height) },
  });
  return crossingCheck(event, spec.rise, inputFieldPath(field, 'rise'));
}

/** A curb strike (ramp, top, drop) at `speed` (m/s). */
export function eventCurb(spec: CurbSpec & { speed: number }, field = 'curb'): RoadEvent {
  speedCheck(spec.speed, field);
  const event = eventNamed({
    kind: 'curb',
    sizes: { height: spec.height },
    road: roadCurb(spec, field),
    speed: spec.speed,
    settle: { target: 0, band: EVENT_SETTLING_BAND * spec.height },
  });
  return crossingCheck(event, spec.rise + spec.hold + spec.drop, inputFieldPath(field, 'rise'));
}

/** A (1−cos) pothole of `depth` over `length` (m) at `speed` (m/s). */
export function eventPothole(
  spec: { depth: number; length: number; speed: number },
  field = 'pothole',
): RoadEvent {
  speedCheck(spec.speed, field);
  const event = eventNamed({
    kind: 'pothole',
    sizes: { height: spec.depth },
    road: roadPothole(spec.depth, spec.length, field),
    speed: spec.speed,
    settle: { target: 0, band: EVENT_SETTLING_BAND * spec.depth },
  });
  return crossingCheck(event, spec.length, inputFieldPath(field, 'length'));
}

/** Any road (a generated or measured profile) at `speed` (m/s); it has no settling target. */
export function eventRoad(road: RoadProfile, speed: number, label: string, field = 'road'): RoadEvent {
  speedCheck(speed, field);
  return { kind: 'road', label, road, speed };
}
