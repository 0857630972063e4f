import { InputError } from '../../core/units/input-error';
import { ISO8608_CLASSES } from '../../core/corner/random-road';
import { rideScenarioEdits, rideScenarioParse, type RideScenario } from '../../core/valving/ride-scenario';
import {
  quantityFormat,
  quantityToDisplay,
  type QuantityKind,
  type UnitSystem,
} from '../../core/units/units';
import { quantityFieldValue } from './quantity-field';

/** The parts of a scenario a screen shows: Ride figures takes the road and the bump; choices and comparisons the curb too. */
export type ScenarioPart = 'road' | 'bump' | 'curb';

/** One field of the scenario: where it sits in the scenario, its words and its kind of quantity. */
export type ScenarioFieldSpec = {
  key: string;
  part: ScenarioPart;
  /** The name core's reader gives it (road.class, bump.height). */
  name: string;
  label: string;
  kind: QuantityKind | null;
};

/** Every field, in the order the screens show them. */
export const SCENARIO_FIELDS: readonly ScenarioFieldSpec[] = [
  { key: 'road.class', part: 'road', name: 'class', label: 'Road class (ISO 8608)', kind: null },
  { key: 'road.speed', part: 'road', name: 'speed', label: 'Road speed', kind: 'speed' },
  { key: 'bump.height', part: 'bump', name: 'height', label: 'Bump height', kind: 'length' },
  { key: 'bump.length', part: 'bump', name: 'length', label: 'Bump length', kind: 'length' },
  { key: 'bump.speed', part: 'bump', name: 'speed', label: 'Bump speed', kind: 'speed' },
  { key: 'curb.height', part: 'curb', name: 'height', label: 'Curb height', kind: 'length' },
  { key: 'curb.rise', part: 'curb', name: 'rise', label: 'Curb ramp length', kind: 'length' },
  { key: 'curb.hold', part: 'curb', name: 'hold', label: 'Curb top length', kind: 'length' },
  { key: 'curb.drop', part: 'curb', name: 'drop', label: 'Curb drop length', kind: 'length' },
  { key: 'curb.speed', part: 'curb', name: 'speed', label: 'Curb speed', kind: 'speed' },
];

export const SCENARIO_ROAD_CLASSES = ISO8608_CLASSES;

/** The SI value of a field in a scenario (the road class as its letter). */
export function scenarioFieldValue(s: RideScenario, spec: ScenarioFieldSpec): number | string {
  if (spec.key === 'road.class') return s.road.roadClass;
  return (s[spec.part] as Record<string, number>)[spec.name] as number;
}

/**
 * A field's text in a unit system: the SI value converted, to 4 significant figures. The text
 * is only what is shown: a field the user leaves alone keeps its SI value exactly.
 */
export function scenarioFieldText(s: RideScenario, spec: ScenarioFieldSpec, system: UnitSystem): string {
  const v = scenarioFieldValue(s, spec);
  if (typeof v === 'string' || spec.kind === null) return String(v);
  return String(Number(quantityToDisplay(v, spec.kind, system).toPrecision(4)));
}

/** Every field's text for a scenario in a unit system. */
export function scenarioTexts(s: RideScenario, system: UnitSystem): Record<string, string> {
  return Object.fromEntries(SCENARIO_FIELDS.map((f) => [f.key, scenarioFieldText(s, f, system)]));
}

/**
 * The scenario with one field changed to what the user typed (a bare number in the unit shown
 * beside it), read by core; or core's words for what is wrong with it.
 */
export function scenarioFieldEdit(
  s: RideScenario,
  key: string,
  text: string,
  system: UnitSystem,
): { scenario: RideScenario } | { problem: string } {
  const spec = SCENARIO_FIELDS.find((f) => f.key === key);
  if (!spec) return { problem: 'is not a field of the scenario' };
  const value = spec.kind === null ? text.trim() : quantityFieldValue(text, spec.kind, system);
  if (value === undefined || value === '') return { problem: 'is needed' };
  try {
    return { scenario: rideScenarioParse({ [spec.part]: { [spec.name]: value } }, s) };
  } catch (e) {
    if (e instanceof InputError) return { problem: e.problem };
    throw e;
  }
}

/** A scenario as the API's edits write it: every field, numbers SI. */
export const scenarioEditsOf = (s: RideScenario) => rideScenarioEdits(s);

/** A scenario in one line, in a unit system: what a result was worked out on. */
export function scenarioText(s: RideScenario, system: UnitSystem): string {
  const len = (v: number) => quantityFormat(v, 'length', system);
  const speed = (v: number) => quantityFormat(v, 'speed', system);
  return `ISO 8608 class ${s.road.roadClass} road at ${speed(s.road.speed)}; a ${len(s.bump.height)} bump ${len(s.bump.length)} long at ${speed(s.bump.speed)}; a ${len(s.curb.height)} curb at ${speed(s.curb.speed)}`;
}
