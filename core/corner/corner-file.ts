import { REBOUND_LIMIT_DEFAULT_RATE, type BumpStop } from '../damper/bump-stop';
import { cornerValidate, type CornerInput } from './corner';
import { damperCurveParse, damperCurveToFile } from '../damper/damper-curve';
import { InputError, inputFieldPath } from '../units/input-error';
import { numberRounded } from '../units/number-text';
import { cornerPlausibleCheck, plausibleCheck, type PlausibleKey } from './plausible-range';
import { pointTableParse, pointTableToFile } from '../damper/point-table';
import { ISO8608_CLASSES, type Iso8608Class } from './random-road';
import { numberParse, quantityParse, quantityText, type QuantityKind, type UnitSystem } from '../units/units';

/** A random road: an ISO 8608 class driven at a speed (m/s). */
export type RoadSpec = { roadClass: Iso8608Class; speed: number };

/** A (1−cos) bump of height h and length L crossed at speed V (SI). */
export type BumpSpec = { height: number; length: number; speed: number };

/** Our corner file: one corner, optionally the road and the bump to judge it on. */
export type CornerFile = { name: string; corner: CornerInput; road?: RoadSpec; bump?: BumpSpec };

type Obj = Record<string, unknown>;

export function objectParse(raw: unknown, field: string, known: readonly string[]): Obj {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
    throw new InputError(field, `expected an object with ${known.join(', ')}`);
  }
  const o = raw as Obj;
  for (const key of Object.keys(o)) {
    if (!known.includes(key)) {
      throw new InputError(
        inputFieldPath(field, key),
        `is not a known field here (known: ${known.join(', ')})`,
      );
    }
  }
  return o;
}

function required(o: Obj, key: string, field: string): unknown {
  const v = o[key];
  if (v === undefined) throw new InputError(inputFieldPath(field, key), 'is missing');
  return v;
}

function requiredQuantity(o: Obj, key: string, kind: QuantityKind, field: string): number {
  return quantityParse(required(o, key, field), kind, inputFieldPath(field, key));
}

function positiveQuantity(o: Obj, key: string, kind: QuantityKind, field: string): number {
  const v = requiredQuantity(o, key, kind, field);
  if (!(v > 0))
    throw new InputError(
      inputFieldPath(field, key),
      `must be greater than zero (got ${numberRounded(v)} in SI)`,
    );
  return v;
}

/** A positive quantity inside the plausible range of `range` (PLAUSIBLE_RANGES). */
function plausibleQuantity(
  o: Obj,
  key: string,
  kind: QuantityKind,
  field: string,
  range: PlausibleKey,
): number {
  return plausibleCheck(positiveQuantity(o, key, kind, field), range, inputFieldPath(field, key));
}

const CORNER_KEYS = [
  'cornerMass',
  'unsprungMass',
  'springRate',
  'springMotionRatio',
  'damperMotionRatio',
  'tireRate',
  'tireDamping',
  'damper',
  'bumpStop',
  'reboundLimit',
  'travelLimit',
] as const;

/** A progressive bump stop's own force–compression curve, as a file gives it. */
const BUMP_STOP_CURVE_RULES = {
  x: { kind: 'length', name: 'compression' },
  y: { kind: 'force', name: 'force' },
  positive: true,
  nonDecreasing: true,
  minPoints: 1,
} as const;

/** Reads `{gap, rate}` or `{gap, curve: [[compression, force], …]}` (both at the damper). */
function bumpStopParse(raw: unknown, field: string): BumpStop {
  const b = objectParse(raw, field, ['gap', 'rate', 'curve']);
  const gap = requiredQuantity(b, 'gap', 'length', field);
  if (b.rate !== undefined && b.curve !== undefined) {
    throw new InputError(
      inputFieldPath(field, 'curve'),
      'cannot be given with rate: a bump stop has either a linear rate or a curve',
    );
  }
  if (b.curve !== undefined) {
    const points = pointTableParse(b.curve, inputFieldPath(field, 'curve'), BUMP_STOP_CURVE_RULES);
    return { gap, curve: points.map(([compression, force]) => ({ compression, force })) };
  }
  if (b.rate === undefined) {
    throw new InputError(
      inputFieldPath(field, 'rate'),
      'is missing: give the bump stop a rate, or a curve of [compression, force] points',
    );
  }
  return { gap, rate: requiredQuantity(b, 'rate', 'stiffness', field) };
}

/**
 * Reads and validates a corner (quantities as SI numbers or strings with units).
 * `damperMotionRatio` defaults to `springMotionRatio`, `tireDamping` to 0. Every quantity must
 * lie in its plausible range (PLAUSIBLE_RANGES, core/plausible-range.ts).
 * @throws InputError naming the field.
 */
export function cornerInputParse(raw: unknown, field = 'corner'): CornerInput {
  const o = objectParse(raw, field, CORNER_KEYS);
  const at = (k: string) => inputFieldPath(field, k);
  const cornerMass = requiredQuantity(o, 'cornerMass', 'mass', field);
  const unsprungMass = requiredQuantity(o, 'unsprungMass', 'mass', field);
  const springRate = requiredQuantity(o, 'springRate', 'stiffness', field);
  const springMotionRatio = numberParse(
    required(o, 'springMotionRatio', field),
    at('springMotionRatio'),
    'a motion ratio such as 0.88',
  );
  const corner: CornerInput = {
    cornerMass,
    unsprungMass,
    springRate,
    springMotionRatio,
    damperMotionRatio:
      o.damperMotionRatio === undefined
        ? springMotionRatio
        : numberParse(o.damperMotionRatio, at('damperMotionRatio'), 'a motion ratio such as 0.88'),
    tireRate: requiredQuantity(o, 'tireRate', 'stiffness', field),
    tireDamping: o.tireDamping === undefined ? 0 : quantityParse(o.tireDamping, 'damping', at('tireDamping')),
    damper: damperCurveParse(required(o, 'damper', field), at('damper')),
  };
  if (o.bumpStop !== undefined) corner.bumpStop = bumpStopParse(o.bumpStop, at('bumpStop'));
  if (o.reboundLimit !== undefined) {
    const r = objectParse(o.reboundLimit, at('reboundLimit'), ['travel', 'rate']);
    corner.reboundLimit = {
      travel: requiredQuantity(r, 'travel', 'length', at('reboundLimit')),
      rate:
        r.rate === undefined
          ? REBOUND_LIMIT_DEFAULT_RATE
          : quantityParse(r.rate, 'stiffness', inputFieldPath(at('reboundLimit'), 'rate')),
    };
  }
  if (o.travelLimit !== undefined)
    corner.travelLimit = quantityParse(o.travelLimit, 'length', at('travelLimit'));
  cornerValidate(corner, field);
  cornerPlausibleCheck(corner, field);
  return corner;
}

/** Reads a road `{class, speed}`; the class is one of ISO 8608's A–H, the speed within its plausible range. */
export function roadSpecParse(raw: unknown, field = 'road'): RoadSpec {
  const o = objectParse(raw, field, ['class', 'speed']);
  const cls = required(o, 'class', field);
  const name = typeof cls === 'string' ? cls.trim().toUpperCase() : '';
  if (!(ISO8608_CLASSES as readonly string[]).includes(name)) {
    throw new InputError(
      inputFieldPath(field, 'class'),
      `got ${JSON.stringify(cls)}; expected an ISO 8608 class, one of ${ISO8608_CLASSES.join(', ')}`,
    );
  }
  return {
    roadClass: name as Iso8608Class,
    speed: plausibleQuantity(o, 'speed', 'speed', field, 'eventSpeed'),
  };
}

/** Reads a bump `{height, length, speed}`, each within its plausible range (PLAUSIBLE_RANGES). */
export function bumpSpecParse(raw: unknown, field = 'bump'): BumpSpec {
  const o = objectParse(raw, field, ['height', 'length', 'speed']);
  return {
    height: plausibleQuantity(o, 'height', 'length', field, 'bumpHeight'),
    length: plausibleQuantity(o, 'length', 'length', field, 'bumpLength'),
    speed: plausibleQuantity(o, 'speed', 'speed', field, 'eventSpeed'),
  };
}

/**
 * Reads a whole corner file (DESIGN.md, The `rideledger` command).
 * @throws InputError naming the field.
 */
export function cornerFileParse(raw: unknown): CornerFile {
  const o = objectParse(raw, '', ['name', 'corner', 'road', 'bump']);
  const name = o.name === undefined ? '' : o.name;
  if (typeof name !== 'string') throw new InputError('name', 'expected a string');
  const file: CornerFile = { name, corner: cornerInputParse(required(o, 'corner', ''), 'corner') };
  if (o.road !== undefined) file.road = roadSpecParse(o.road);
  if (o.bump !== undefined) file.bump = bumpSpecParse(o.bump);
  return file;
}

/** The file form of a corner: quantities as unit strings in `system`, readable by `cornerInputParse`. */
export function cornerInputToFile(c: CornerInput, system: UnitSystem = 'si'): Record<string, unknown> {
  const file: Record<string, unknown> = {
    cornerMass: quantityText(c.cornerMass, 'mass', system),
    unsprungMass: quantityText(c.unsprungMass, 'mass', system),
    springRate: quantityText(c.springRate, 'stiffness', system),
    springMotionRatio: c.springMotionRatio,
    damperMotionRatio: c.damperMotionRatio,
    tireRate: quantityText(c.tireRate, 'stiffness', system),
    tireDamping: quantityText(c.tireDamping, 'damping', system),
    damper: damperCurveToFile(c.damper, system),
  };
  const b = c.bumpStop;
  if (b) {
    file.bumpStop =
      'rate' in b
        ? { gap: quantityText(b.gap, 'length', system), rate: quantityText(b.rate, 'stiffness', system) }
        : {
            gap: quantityText(b.gap, 'length', system),
            curve: pointTableToFile(
              b.curve.map((p) => [p.compression, p.force] as const),
              { x: 'length', y: 'force' },
              system,
            ),
          };
  }
  if (c.reboundLimit) {
    file.reboundLimit = {
      travel: quantityText(c.reboundLimit.travel, 'length', system),
      rate: quantityText(c.reboundLimit.rate, 'stiffness', system),
    };
  }
  if (c.travelLimit !== undefined) file.travelLimit = quantityText(c.travelLimit, 'length', system);
  return file;
}
