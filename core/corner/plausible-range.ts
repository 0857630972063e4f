import type { CornerInput } from './corner';
import { damperDirectionSlopes } from '../damper/damper-curve';
import { InputError, inputFieldPath } from '../units/input-error';
import { numberRounded, quantityRounded } from '../units/number-text';
import type { QuantityKind, UnitSystem } from '../units/units';
import type { ModelWarning } from './warnings';

/**
 * The range a quantity of a real vehicle can take (SI), and inside it the usual range of the
 * cars and trucks the program is for. Outside `low`–`high` the value is refused (a typo, a
 * missing unit, a mass in grams); between those and `usualLow`–`usualHigh` it is read with a
 * warning. `kind` 'ratio' is a plain number. The reason says where the limits come from.
 */
export type PlausibleRange = {
  kind: QuantityKind | 'ratio';
  /** What it is, in words: "corner mass". */
  what: string;
  low: number;
  high: number;
  usualLow: number;
  usualHigh: number;
  reason: string;
  /** How to write it with its unit, for values that look like a unit was left out. */
  hint?: string;
};

const DEG = Math.PI / 180;
const KMH = 1 / 3.6;

/**
 * Every quantity of the corner file, the setup file and the road events, with its plausible
 * and usual range and the reason for them (common practice of the trade, wide on purpose:
 * a value inside `low`–`high` is never refused). README.md states the same table.
 */
export const PLAUSIBLE_RANGES = {
  cornerMass: {
    kind: 'mass',
    what: 'corner mass',
    low: 5,
    high: 5000,
    usualLow: 30,
    usualHigh: 1500,
    reason: "from a kart's corner to a heavy truck's",
    hint: '"295 kg"',
  },
  unsprungMass: {
    kind: 'mass',
    what: 'unsprung mass',
    low: 1,
    high: 1000,
    usualLow: 5,
    usualHigh: 150,
    reason: "from a kart's wheel to a truck's axle end",
    hint: '"38 kg"',
  },
  sprungMass: {
    kind: 'mass',
    what: 'sprung mass (corner mass less unsprung mass)',
    low: 2,
    high: 5000,
    usualLow: 20,
    usualHigh: 1400,
    reason: 'the body a corner carries is at least a few kilograms',
  },
  springRate: {
    kind: 'stiffness',
    what: 'spring rate',
    low: 1e3,
    high: 5e6,
    usualLow: 5e3,
    usualHigh: 1e6,
    reason: "from a soft road car's coil to the stiffest race spring or torsion bar",
    hint: '"70 N/mm" or "400 lbf/in"',
  },
  motionRatio: {
    kind: 'ratio',
    what: 'motion ratio',
    low: 0.2,
    high: 2,
    usualLow: 0.4,
    usualHigh: 1.2,
    reason:
      'spring or damper travel ÷ wheel travel: no linkage moves its spring less than a fifth or more than twice the wheel',
  },
  tireRate: {
    kind: 'stiffness',
    what: 'tyre rate',
    low: 2e4,
    high: 5e6,
    usualLow: 8e4,
    usualHigh: 1e6,
    reason: "from a soft off-road tyre to a truck's",
    hint: '"240 N/mm" or "1370 lbf/in"',
  },
  tireDamping: {
    kind: 'damping',
    what: 'tyre damping',
    low: 0,
    high: 2e4,
    usualLow: 0,
    usualHigh: 2000,
    reason: "a tyre's own damping is tens to hundreds of N·s/m",
  },
  damping: {
    kind: 'damping',
    what: 'damping coefficient',
    low: 10,
    high: 2e5,
    usualLow: 200,
    usualHigh: 40000,
    reason: "from a bicycle shock to a heavy truck's damper, at the shaft",
    hint: '"3200 N*s/m" or "18 lbf*s/in"',
  },
  kneeSpeed: {
    kind: 'velocity',
    what: 'knee speed',
    low: 0.002,
    high: 2,
    usualLow: 0.01,
    usualHigh: 0.5,
    reason: "a damper's low-speed circuit hands over between a few mm/s and a few m/s of shaft speed",
    hint: '"0.08 m/s"',
  },
  gasForce: {
    kind: 'force',
    what: 'gas force',
    low: 0,
    high: 10000,
    usualLow: 0,
    usualHigh: 2000,
    reason: 'a gas-charged damper pushes its shaft out with tens to a few thousand newtons',
  },
  bumpStopGap: {
    kind: 'length',
    what: 'bump-stop gap',
    low: 0,
    high: 0.3,
    usualLow: 0,
    usualHigh: 0.15,
    reason: 'room before the stop touches, at the damper: no damper has more than 300 mm of it',
    hint: '"30 mm"',
  },
  bumpStopRate: {
    kind: 'stiffness',
    what: 'bump-stop rate',
    low: 1e3,
    high: 5e7,
    usualLow: 1e4,
    usualHigh: 5e6,
    reason: 'from a soft foam stop to a solid rubber block',
    hint: '"250 N/mm"',
  },
  travel: {
    kind: 'length',
    what: 'travel',
    low: 0.001,
    high: 0.5,
    usualLow: 0.005,
    usualHigh: 0.3,
    reason: 'damper travel from static, from a millimetre to half a metre',
    hint: '"60 mm"',
  },
  topOutRate: {
    kind: 'stiffness',
    what: 'top-out rate',
    low: 1e3,
    high: 1e9,
    usualLow: 1e4,
    usualHigh: 1e8,
    reason: 'from a soft rebound spring to a hard elastomer',
  },
  rideHeight: {
    kind: 'length',
    what: 'ride height',
    low: 0,
    high: 1,
    usualLow: 0.01,
    usualHigh: 0.4,
    reason: "at the shop's own measuring point, from the ground up to a metre",
    hint: '"95 mm"',
  },
  tirePressureCold: {
    kind: 'pressure',
    what: 'cold tyre pressure',
    low: 20e3,
    high: 1e6,
    usualLow: 60e3,
    usualHigh: 400e3,
    reason: 'gauge pressure, from a low off-road tyre to a truck tyre',
    hint: '"1.6 bar" or "24 psi"',
  },
  camber: {
    kind: 'angle',
    what: 'camber',
    low: -15 * DEG,
    high: 15 * DEG,
    usualLow: -6 * DEG,
    usualHigh: 3 * DEG,
    reason: 'no wheel runs leaning more than 15° either way',
    hint: '"-2.5 deg"',
  },
  toeAngle: {
    kind: 'angle',
    what: 'toe',
    low: -5 * DEG,
    high: 5 * DEG,
    usualLow: -1 * DEG,
    usualHigh: 1 * DEG,
    reason: 'toe is set in tenths of a degree; 5° is a bent arm',
    hint: '"0.1 deg"',
  },
  toeLength: {
    kind: 'length',
    what: 'toe',
    low: -0.025,
    high: 0.025,
    usualLow: -0.006,
    usualHigh: 0.006,
    reason: 'toe at the rim is set in millimetres; 25 mm is a bent arm',
    hint: '"1.5 mm"',
  },
  fuelLoad: {
    kind: 'mass',
    what: 'fuel load',
    low: 0,
    high: 500,
    usualLow: 0,
    usualHigh: 150,
    reason: "from an empty tank to a long-distance racer's",
    hint: '"25 kg"',
  },
  eventSpeed: {
    kind: 'speed',
    what: 'speed',
    low: 0.5,
    high: 120,
    usualLow: 5 * KMH,
    usualHigh: 320 * KMH,
    reason: 'from walking pace to a top-speed run',
    hint: '"50 km/h"',
  },
  bumpHeight: {
    kind: 'length',
    what: 'height',
    low: 0.0005,
    high: 0.5,
    usualLow: 0.002,
    usualHigh: 0.15,
    reason: 'from a seam in the road to half a metre; higher is a wall, not a bump',
    hint: '"25 mm"',
  },
  bumpLength: {
    kind: 'length',
    what: 'length',
    low: 0.05,
    high: 100,
    usualLow: 0.15,
    usualHigh: 30,
    reason:
      "a tyre's contact patch is about 0.1 m long and bridges anything much shorter, which a point-contact model cannot follow; longer than 100 m it is a hill",
    hint: '"0.6 m"',
  },
} as const satisfies Record<string, PlausibleRange>;

export type PlausibleKey = keyof typeof PLAUSIBLE_RANGES;

function valueText(value: number, r: PlausibleRange): string {
  return r.kind === 'ratio' ? numberRounded(value) : quantityRounded(value, r.kind);
}

/** A range in words, SI display units: "5–5000 kg", "0.2–2". */
export function plausibleRangeText(key: PlausibleKey, usual = false): string {
  const r: PlausibleRange = PLAUSIBLE_RANGES[key];
  const [low, high] = usual ? [r.usualLow, r.usualHigh] : [r.low, r.high];
  // A dash after a minus sign reads badly: "-15 to 15 °", not "-15–15 °".
  const dash = low < 0 ? ' to ' : '–';
  if (r.kind === 'ratio') return `${numberRounded(low)}${dash}${numberRounded(high)}`;
  const lowText = valueText(low, r).replace(/ [^ ]+$/, '');
  return `${lowText}${dash}${valueText(high, r)}`;
}

/**
 * `value` (SI) when it lies inside the plausible range of `key`.
 * @throws InputError naming `field`, the value, the range and its reason.
 */
export function plausibleCheck(value: number, key: PlausibleKey, field: string): number {
  const r: PlausibleRange = PLAUSIBLE_RANGES[key];
  // A limit written in another unit comes back a rounding away from itself ("1 N/mm" → 999.99… N/m).
  const slack = 1e-9;
  if (value >= r.low - slack * Math.abs(r.low) && value <= r.high + slack * Math.abs(r.high)) return value;
  const hint = r.hint
    ? `; check the value and its unit, e.g. ${r.hint} (a number without a unit is read in SI)`
    : '';
  throw new InputError(
    field,
    `${r.what} ${valueText(value, r)} is outside the plausible ${plausibleRangeText(key)} (${r.reason})${hint}`,
  );
}

/** A warning when `value` (SI, already plausible) lies outside the usual range of `key`; quantities in `units`. */
export function plausibleUsualWarning(
  value: number,
  key: PlausibleKey,
  field: string,
  units: UnitSystem = 'si',
): ModelWarning | undefined {
  const r: PlausibleRange = PLAUSIBLE_RANGES[key];
  if (value >= r.usualLow && value <= r.usualHigh) return undefined;
  const text = (v: number) => (r.kind === 'ratio' ? numberRounded(v) : quantityRounded(v, r.kind, units));
  const dash = r.usualLow < 0 ? ' to ' : '–';
  const range =
    r.kind === 'ratio'
      ? `${numberRounded(r.usualLow)}${dash}${numberRounded(r.usualHigh)}`
      : `${text(r.usualLow).replace(/ [^ ]+$/, '')}${dash}${text(r.usualHigh)}`;
  return {
    code: `unusual-${key}`,
    field,
    message: `The ${r.what} ${text(value)} is outside the usual ${range}, though possible (${r.reason}): check the value and its unit.`,
  };
}

/** The quantities of a corner, each with the range it is judged by and its field in the corner file. */
function cornerQuantities(c: CornerInput): { value: number; key: PlausibleKey; field: string }[] {
  const out: { value: number; key: PlausibleKey; field: string }[] = [
    { value: c.cornerMass, key: 'cornerMass', field: 'cornerMass' },
    { value: c.unsprungMass, key: 'unsprungMass', field: 'unsprungMass' },
    { value: c.cornerMass - c.unsprungMass, key: 'sprungMass', field: 'unsprungMass' },
    { value: c.springRate, key: 'springRate', field: 'springRate' },
    { value: c.springMotionRatio, key: 'motionRatio', field: 'springMotionRatio' },
    { value: c.damperMotionRatio, key: 'motionRatio', field: 'damperMotionRatio' },
    { value: c.tireRate, key: 'tireRate', field: 'tireRate' },
    { value: c.tireDamping, key: 'tireDamping', field: 'tireDamping' },
  ];
  for (const dir of ['bump', 'rebound'] as const) {
    const d = c.damper[dir];
    const at = `damper.${dir}`;
    if (d.kind === 'linear') out.push({ value: d.coefficient, key: 'damping', field: `${at}.lowSpeed` });
    else if (d.kind === 'bilinear') {
      out.push({ value: d.lowSpeed, key: 'damping', field: `${at}.lowSpeed` });
      out.push({ value: d.kneeSpeed, key: 'kneeSpeed', field: `${at}.kneeSpeed` });
      out.push({ value: d.highSpeed, key: 'damping', field: `${at}.highSpeed` });
    } else {
      const s = damperDirectionSlopes(d);
      out.push({ value: s.lowSpeed, key: 'damping', field: `${at}.points` });
      out.push({ value: s.highSpeed, key: 'damping', field: `${at}.points` });
    }
  }
  if (c.damper.gasForce !== undefined)
    out.push({ value: c.damper.gasForce, key: 'gasForce', field: 'damper.gasForce' });
  const b = c.bumpStop;
  if (b) {
    out.push({ value: b.gap, key: 'bumpStopGap', field: 'bumpStop.gap' });
    if ('rate' in b) out.push({ value: b.rate, key: 'bumpStopRate', field: 'bumpStop.rate' });
  }
  if (c.reboundLimit) {
    out.push({ value: c.reboundLimit.travel, key: 'travel', field: 'reboundLimit.travel' });
    out.push({ value: c.reboundLimit.rate, key: 'topOutRate', field: 'reboundLimit.rate' });
  }
  if (c.travelLimit !== undefined) out.push({ value: c.travelLimit, key: 'travel', field: 'travelLimit' });
  return out;
}

/**
 * The shortest time (s) in which a corner's damping may stop either mass, m ÷ c with c the
 * stiffest damper slope carried to the wheel (plus the tyre's, for the wheel). Below it the
 * equations are too stiff for the event integrator, and no real corner comes near: a race
 * car's wheel is stopped in tens of milliseconds.
 */
export const CORNER_SHORTEST_DAMPING_TIME = 2e-4;

/**
 * Refuses a corner with a quantity outside its plausible range (PLAUSIBLE_RANGES), or whose
 * damping would stop a mass faster than CORNER_SHORTEST_DAMPING_TIME. Run after `cornerValidate`.
 * @throws InputError naming the field, the value, the range and its reason.
 */
export function cornerPlausibleCheck(c: CornerInput, field = 'corner'): void {
  for (const q of cornerQuantities(c)) plausibleCheck(q.value, q.key, inputFieldPath(field, q.field));
  let stiffest = 0;
  for (const dir of ['bump', 'rebound'] as const) {
    const s = damperDirectionSlopes(c.damper[dir]);
    stiffest = Math.max(stiffest, s.lowSpeed, s.highSpeed);
  }
  const wheelDamping = stiffest * c.damperMotionRatio * c.damperMotionRatio;
  const sprung = c.cornerMass - c.unsprungMass;
  for (const [mass, damping, what] of [
    [c.unsprungMass, wheelDamping + c.tireDamping, 'unsprung'],
    [sprung, wheelDamping, 'sprung'],
  ] as const) {
    const time = mass / damping;
    if (time < CORNER_SHORTEST_DAMPING_TIME)
      throw new InputError(
        inputFieldPath(field, 'damper'),
        `damping of ${quantityRounded(damping, 'damping')} at the wheel would stop the ${quantityRounded(mass, 'mass')} ${what} mass in ${quantityRounded(time, 'time')}, faster than the ${quantityRounded(CORNER_SHORTEST_DAMPING_TIME, 'time')} any real corner allows: check the damper coefficients, the damper motion ratio and the masses`,
      );
  }
}

/** Warnings for a corner's quantities outside their usual range (inside the plausible one); fields as in the corner file. */
export function cornerInputWarnings(c: CornerInput, units: UnitSystem = 'si'): ModelWarning[] {
  const out: ModelWarning[] = [];
  const seen = new Set<string>();
  for (const q of cornerQuantities(c)) {
    const w = plausibleUsualWarning(q.value, q.key, q.field, units);
    if (!w || seen.has(`${w.code} ${w.field}`)) continue;
    seen.add(`${w.code} ${w.field}`);
    out.push(w);
  }
  return out;
}

/**
 * The final guard of a result: every number in `value` (objects, arrays, typed arrays) must be
 * finite, so that no NaN or infinity ever reaches a screen or a file as a figure.
 * @throws InputError naming `field` and the first figure that is not finite.
 */
export function figuresFiniteCheck(value: unknown, field: string, path = ''): void {
  const fail = (at: string, v: unknown) => {
    throw new InputError(
      field,
      `the figure ${at || 'result'} came out as ${String(v)}: the inputs are beyond what the model can compute; check the masses, rates and damping`,
    );
  };
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) fail(path, value);
    return;
  }
  if (typeof value !== 'object' || value === null) return;
  if (ArrayBuffer.isView(value)) {
    const a = value as unknown as ArrayLike<number>;
    for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i])) fail(`${path}[${i}]`, a[i]);
    return;
  }
  if (Array.isArray(value)) {
    value.forEach((v, i) => figuresFiniteCheck(v, field, `${path}[${i}]`));
    return;
  }
  for (const [k, v] of Object.entries(value)) {
    if (typeof v === 'function') continue;
    figuresFiniteCheck(v, field, path ? `${path}.${k}` : k);
  }
}
