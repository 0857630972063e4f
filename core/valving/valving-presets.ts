import { bumpSpecParse, objectParse, roadSpecParse } from '../corner/corner-file';
import { InputError, inputFieldPath } from '../units/input-error';
import { quantityParse } from '../units/units';
import type { ValvingScenario } from './valving-evaluate';
import type { ValvingSource, ValvingTarget, ValvingTargets } from './valving-targets';

/** Our presets, by name: the starting points of the targets. */
export const VALVING_PRESET_NAMES = [
  'road-comfort',
  'track-day',
  'rally-stage',
  'high-downforce-circuit',
] as const;
export type ValvingPresetName = (typeof VALVING_PRESET_NAMES)[number];

/** A starting point for the targets: what it is for, the road it judges on, and every band with its source. */
export type ValvingPreset = {
  name: ValvingPresetName;
  title: string;
  use: string;
  scenario: ValvingScenario;
  scenarioSource: ValvingSource;
  targets: ValvingTargets;
};

const OURS: ValvingSource = {
  tag: 'ours',
  text: "RideLedger's starting value, not from a published source: set it to the car and the event",
};
const RACE_LOW_SPEED: ValvingSource = {
  tag: 'trade',
  text: 'race cars run ζ 0.6–0.7 at low shaft speed (common practice); taken here for the mean of bump and rebound, the ζ of the linear model',
};
const PASSENGER_LOW_SPEED: ValvingSource = {
  tag: 'mem',
  text: 'passenger cars ζ 0.2–0.4 (Gillespie, Fundamentals of Vehicle Dynamics, from memory); taken here for the mean of bump and rebound',
};
const RALLY_LOW_SPEED: ValvingSource = {
  tag: 'ours',
  text: 'between the passenger-car band 0.2–0.4 (Gillespie, from memory) and the race band 0.6–0.7 (common practice): rough stages want the wheel to follow the road',
};
const HIGH_SPEED: ValvingSource = { tag: 'trade', text: 'high-speed ζ 0.3–0.5 (common practice)' };
const REBOUND_TO_BUMP: ValvingSource = {
  tag: 'trade',
  text: 'rebound stiffer than bump, 1.3–3 : 1 at low shaft speed (common practice)',
};
const COMFORT: ValvingSource = {
  tag: 'mem',
  text: 'ISO 2631-1:1997 Annex C (from memory): below 0.315 m/s² not uncomfortable, 0.315–0.63 m/s² a little uncomfortable',
};
const rideSource = (text: string): ValvingSource => ({ tag: 'trade', text: `${text} (common practice)` });

const band = (
  low: number | null,
  high: number | null,
  source: ValvingSource,
  weight = 1,
  scale?: number,
): ValvingTarget => {
  const s = scale ?? (low !== null && high !== null ? (high - low) / 2 : Math.abs((high ?? low) as number));
  return { low, high, scale: s, weight, source };
};

/**
 * The low-speed bump and rebound bands implied by a band [m1, m2] on their mean with rebound ÷
 * bump in [r1, r2]: bump = 2m/(1 + r) and rebound = 2mr/(1 + r), at the extremes.
 */
function lowSpeedBands(
  mean: readonly [number, number],
  ratio: readonly [number, number],
): { bump: ValvingTarget; rebound: ValvingTarget } {
  const [m1, m2] = mean;
  const [r1, r2] = ratio;
  const round = (x: number) => Math.round(x * 100) / 100;
  const source: ValvingSource = {
    tag: 'calc',
    text: `implied by the low-speed mean band ${m1}–${m2} with rebound ÷ bump ${r1}–${r2}: bump = 2m/(1 + r), rebound = 2mr/(1 + r)`,
  };
  return {
    bump: band(round((2 * m1) / (1 + r2)), round((2 * m2) / (1 + r1)), source),
    rebound: band(round((2 * m1 * r1) / (1 + r1)), round((2 * m2 * r2) / (1 + r2)), source),
  };
}

const RATIO = [1.3, 3] as const;
const ms = (t: number) => t / 1000;
const kmh = (v: number) => v / 3.6;

function dampingTargets(
  mean: readonly [number, number],
  meanSource: ValvingSource,
  highSpeed: boolean,
): ValvingTargets {
  const low = lowSpeedBands(mean, RATIO);
  const t: ValvingTargets = {
    bumpLowSpeed: low.bump,
    reboundLowSpeed: low.rebound,
    lowSpeedMean: band(mean[0], mean[1], meanSource, 2),
    reboundToBump: band(RATIO[0], RATIO[1], REBOUND_TO_BUMP),
  };
  if (highSpeed) t.highSpeed = band(0.3, 0.5, HIGH_SPEED);
  return t;
}

/**
 * Our presets: the ζ bands of the trade (and Gillespie's passenger band), the ride-frequency
 * bands of each kind of car (weight 0: the clicks do not change it, so it is shown, not
 * scored), and our own starting values for the roads and the event limits — each value
 * carries its source, and every one can be changed.
 */
export const VALVING_PRESETS: Record<ValvingPresetName, ValvingPreset> = {
  'road-comfort': {
    name: 'road-comfort',
    title: 'Road comfort',
    use: 'a road car on public roads: comfort and a tyre that keeps its grip',
    scenario: {
      road: { roadClass: 'B', speed: kmh(80) },
      bump: { height: 0.02, length: 1.0, speed: kmh(40) },
      curb: { height: 0.03, rise: 0.15, hold: 0.3, drop: 0.05, speed: kmh(20) },
    },
    scenarioSource: OURS,
    targets: {
      ...dampingTargets([0.2, 0.4], PASSENGER_LOW_SPEED, false),
      rideFrequency: band(0.5, 1.5, rideSource('passenger cars 0.5–1.0 Hz, lowered or sporty 1.0–1.5 Hz'), 0),
      roadComfort: band(null, 0.63, COMFORT, 2, 0.315),
      roadTireLoad: band(null, 0.3, OURS, 1, 0.1),
      bumpPeakAccel: band(null, 5, OURS, 1, 2),
      airborneTime: band(null, 0, OURS, 1, ms(10)),
      bumpStopContact: band(null, 0, OURS, 1, ms(10)),
    },
  },
  'track-day': {
    name: 'track-day',
    title: 'Track day',
    use: 'a car without aerodynamic downforce on a circuit: body control and grip over kerbs',
    scenario: {
      road: { roadClass: 'A', speed: kmh(120) },
      bump: { height: 0.02, length: 1.5, speed: kmh(90) },
      curb: { height: 0.04, rise: 0.15, hold: 0.3, drop: 0.02, speed: kmh(60) },
    },
    scenarioSource: OURS,
    targets: {
      ...dampingTargets([0.6, 0.7], RACE_LOW_SPEED, true),
      rideFrequency: band(
        1.0,
        2.5,
        rideSource('lowered or sporty cars 1.0–1.5 Hz, race cars without aero 1.5–2.5 Hz'),
        0,
      ),
      roadTireLoad: band(null, 0.15, OURS, 1, 0.05),
      curbPeakAccel: band(null, 25, OURS, 1, 5),
      airborneTime: band(null, ms(20), OURS, 1, ms(10)),
      bumpStopContact: band(null, ms(50), OURS, 1, ms(20)),
    },
  },
  'rally-stage': {
    name: 'rally-stage',
    title: 'Rally stage',
    use: 'a rally car on rough, loose stages: the wheel following the ground',
    scenario: {
      road: { roadClass: 'D', speed: kmh(70) },
      bump: { height: 0.06, length: 1.5, speed: kmh(60) },
      curb: { height: 0.05, rise: 0.1, hold: 0.2, drop: 0.02, speed: kmh(40) },
    },
    scenarioSource: OURS,
    targets: {
      ...dampingTargets([0.4, 0.6], RALLY_LOW_SPEED, true),
      rideFrequency: band(1.5, 2.0, rideSource('rally cars 1.5–2.0 Hz'), 0),
      roadTireLoad: band(null, 0.5, OURS, 1, 0.1),
      airborneTime: band(null, ms(50), OURS, 1, ms(10)),
      bumpStopContact: band(null, ms(30), OURS, 1, ms(10)),
    },
  },
  'high-downforce-circuit': {
    name: 'high-downforce-circuit',
    title: 'High-downforce circuit',
    use: 'a car with high aerodynamic downforce on a smooth circuit: a steady platform',
    scenario: {
      road: { roadClass: 'A', speed: kmh(200) },
      bump: { height: 0.015, length: 2.0, speed: kmh(150) },
      curb: { height: 0.03, rise: 0.2, hold: 0.4, drop: 0.02, speed: kmh(120) },
    },
    scenarioSource: OURS,
    targets: {
      ...dampingTargets([0.6, 0.7], RACE_LOW_SPEED, true),
      rideFrequency: band(3.5, 5, rideSource('high-downforce cars 3.5–5 Hz and more'), 0),
      roadTireLoad: band(null, 0.15, OURS, 1, 0.05),
      airborneTime: band(null, 0, OURS, 1, ms(10)),
      bumpStopContact: band(null, ms(200), OURS, 1, ms(50)),
    },
  },
};

/**
 * A preset by name.
 * @throws InputError naming `field`, with the names there are.
 */
export function valvingPresetOf(name: string, field = 'preset'): ValvingPreset {
  const key = name.trim().toLowerCase();
  const preset = (VALVING_PRESETS as Record<string, ValvingPreset | undefined>)[key];
  if (!preset)
    throw new InputError(field, `"${name}" is not a preset (presets: ${VALVING_PRESET_NAMES.join(', ')})`);
  return preset;
}

/**
 * Applies edits to a scenario: `road` {class, speed}, `bump` {height, length, speed} and
 * `curb` {height, rise, hold, drop, speed}, each replacing the fields it gives (quantities
 * with units, as in a corner file).
 * @throws InputError naming the field.
 */
export function valvingScenarioEdit(
  base: ValvingScenario,
  raw: unknown,
  field = 'scenario',
): ValvingScenario {
  if (raw === undefined) return base;
  const o = objectParse(raw, field, ['road', 'bump', 'curb']);
  const out: ValvingScenario = { road: base.road, bump: base.bump, curb: base.curb };
  if (o.road !== undefined) {
    const r = objectParse(o.road, inputFieldPath(field, 'road'), ['class', 'speed']);
    out.road = roadSpecParse(
      { class: r.class ?? base.road.roadClass, speed: r.speed ?? base.road.speed },
      inputFieldPath(field, 'road'),
    );
  }
  if (o.bump !== undefined) {
    const b = objectParse(o.bump, inputFieldPath(field, 'bump'), ['height', 'length', 'speed']);
    out.bump = bumpSpecParse({ ...base.bump, ...b }, inputFieldPath(field, 'bump'));
  }
  if (o.curb !== undefined) {
    const at = inputFieldPath(field, 'curb');
    const c = objectParse(o.curb, at, ['height', 'rise', 'hold', 'drop', 'speed']);
    const merged = { ...base.curb, ...c };
    const positive = (key: 'height' | 'rise' | 'drop' | 'speed') => {
      const v = quantityParse(merged[key], key === 'speed' ? 'speed' : 'length', inputFieldPath(at, key));
      if (!(v > 0))
        throw new InputError(inputFieldPath(at, key), `must be greater than zero (got ${v} in SI)`);
      return v;
    };
    const hold = quantityParse(merged.hold, 'length', inputFieldPath(at, 'hold'));
    if (!(hold >= 0))
      throw new InputError(inputFieldPath(at, 'hold'), `must be zero or more (got ${hold} m)`);
    out.curb = {
      height: positive('height'),
      rise: positive('rise'),
      hold,
      drop: positive('drop'),
      speed: positive('speed'),
    };
  }
  return out;
}
