import type { CornerInput } from './corner';
import { damperDirectionSlopes } from '../damper/damper-curve';
import { InputError, inputFieldPath } from '../units/input-error';
import { numberRounded, quantityRounded } from '../units/number-text';
import type { UnitSystem } from '../units/units';
import type { ModelWarning } from './warnings';
import { PLAUSIBLE_RANGES, type PlausibleKey, type PlausibleRange } from './plausible-ranges';

export { PLAUSIBLE_RANGES, type PlausibleKey, type PlausibleRange } from './plausible-ranges';

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
