import { InputError, inputFieldPath } from '../units/input-error';
import { quantityParse, quantityText, type QuantityKind, type UnitSystem } from '../units/units';

/** What a table of [x, y] points from a file must satisfy, and the words its messages use. */
export type PointTableRules = {
  x: { kind: QuantityKind; name: string };
  y: { kind: QuantityKind; name: string };
  /** Both columns are magnitudes, above zero (curves through the origin give the origin implicitly). */
  positive: boolean;
  /** y may not fall as x rises (a damper or bump-stop curve). */
  nonDecreasing: boolean;
  /** Fewest points accepted. */
  minPoints: number;
};

/**
 * Reads a table of points from a file: a list of [x, y] pairs, each value a number in SI or a
 * string with units (`[["0.05 m/s", "420 N"], [0.1, 610]]`). x must rise strictly from point
 * to point; `rules` may also demand positive values and a y that never falls.
 * @throws InputError naming the offending point, e.g. `corner.damper.bump.points[3]`.
 */
export function pointTableParse(raw: unknown, field: string, rules: PointTableRules): [number, number][] {
  const pair = `[${rules.x.name}, ${rules.y.name}]`;
  if (!Array.isArray(raw)) {
    throw new InputError(field, `expected a list of ${pair} points, e.g. [["0.05 m/s", "420 N"]]`);
  }
  if (raw.length < rules.minPoints) {
    throw new InputError(
      field,
      `has ${raw.length} point${raw.length === 1 ? '' : 's'}; needs at least ${rules.minPoints}`,
    );
  }
  const out: [number, number][] = [];
  raw.forEach((point: unknown, i) => {
    const at = inputFieldPath(field, i);
    if (!Array.isArray(point) || point.length !== 2) throw new InputError(at, `expected a ${pair} pair`);
    const x = quantityParse(point[0], rules.x.kind, at);
    const y = quantityParse(point[1], rules.y.kind, at);
    const xText = quantityText(x, rules.x.kind);
    const yText = quantityText(y, rules.y.kind);
    if (rules.positive && !(x > 0)) {
      throw new InputError(
        at,
        `${rules.x.name} must be above zero (got ${xText}): points are magnitudes, the curve starts at zero by itself`,
      );
    }
    if (rules.positive && !(y > 0)) {
      throw new InputError(
        at,
        `${rules.y.name} must be above zero (got ${yText}): points are magnitudes, with the same sign as the ${rules.x.name}`,
      );
    }
    const prev = out[i - 1];
    if (prev && !(x > prev[0])) {
      throw new InputError(
        at,
        `${rules.x.name} ${xText} is not above the previous point's ${quantityText(prev[0], rules.x.kind)}: list the points by rising ${rules.x.name}`,
      );
    }
    if (prev && rules.nonDecreasing && y < prev[1]) {
      throw new InputError(
        at,
        `${rules.y.name} ${yText} is below the previous point's ${quantityText(prev[1], rules.y.kind)}: the table is not monotone (${rules.y.name} may not fall as ${rules.x.name} rises)`,
      );
    }
    out.push([x, y]);
  });
  return out;
}

/** The file form of a table: each point as two unit strings. */
export function pointTableToFile(
  points: readonly (readonly [number, number])[],
  kinds: { x: QuantityKind; y: QuantityKind },
  system: UnitSystem = 'si',
): [string, string][] {
  return points.map(([x, y]) => [quantityText(x, kinds.x, system), quantityText(y, kinds.y, system)]);
}
