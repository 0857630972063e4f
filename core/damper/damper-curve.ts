import { InputError, inputFieldPath } from '../units/input-error';
import { cubicHermiteAt, cubicHermiteThroughOrigin, type CubicHermite } from '../numeric/cubic-hermite';
import { pointTableParse, pointTableToFile } from './point-table';
import { quantityParse, quantityText, type UnitSystem } from '../units/units';
import { damperDirectionFit } from './damper-fit';

/** One bench point of one direction: shaft speed and force as magnitudes (m/s, N). */
export type DamperPoint = { velocity: number; force: number };

/**
 * Force–velocity curve of one damper direction, at the damper shaft, in SI.
 * Forces and velocities are magnitudes here; `damperForce` applies the sign.
 * - linear: F = c·v
 * - bilinear: F = c_ls·v up to the knee, then c_ls·v_knee + c_hs·(v − v_knee)
 *   (digressive when c_hs < c_ls, progressive when c_hs > c_ls)
 * - table: bench points, speed rising and force never falling, joined through (0, 0) by a
 *   monotone cubic (no overshoot between points; PCHIP end slopes, see cubic-hermite.ts) and
 *   continued as a straight line with the end slope past the last point. Treat the points as immutable: the interpolant is built once per table.
 */
export type DamperDirectionCurve =
  | { kind: 'linear'; coefficient: number }
  | { kind: 'bilinear'; lowSpeed: number; kneeSpeed: number; highSpeed: number }
  | { kind: 'table'; points: readonly DamperPoint[] };

/**
 * A damper: bump (compression, shaft velocity > 0) and rebound (extension) curves, and the
 * optional gas force (N, ≥ 0) with which the damper pushes its shaft out at rest.
 */
export type DamperCurve = { bump: DamperDirectionCurve; rebound: DamperDirectionCurve; gasForce?: number };

/** The slopes that the linear figures use: low-speed and high-speed coefficients (N·s/m) and the knee (m/s). */
export type DamperSlopes = { lowSpeed: number; highSpeed: number; kneeSpeed: number | null };

/** The bilinear (knee) form of a direction: F = c_ls·v up to the knee, then c_hs past it. */
export type DamperBilinear = Extract<DamperDirectionCurve, { kind: 'bilinear' }>;

/** The monotone cubic through (0, 0) and a table's points (Fritsch–Carlson; see cubic-hermite.ts). */
export function damperTableInterpolant(points: readonly DamperPoint[]): CubicHermite {
  return cubicHermiteThroughOrigin(
    points,
    (p) => p.velocity,
    (p) => p.force,
  );
}

/**
 * One direction's measured points (magnitudes) as a table's points: those of positive, finite
 * speed and finite force, by rising speed, points at one speed averaged into one. A bench run's
 * points become its curve this way (benchDirectionTables), and its slopes are this table's.
 */
export function damperTablePointsOf(points: readonly DamperPoint[]): DamperPoint[] {
  const sorted = points
    .filter((p) => p.velocity > 0 && Number.isFinite(p.velocity) && Number.isFinite(p.force))
    .sort((a, b) => a.velocity - b.velocity);
  const out: DamperPoint[] = [];
  for (let i = 0; i < sorted.length;) {
    const v = (sorted[i] as DamperPoint).velocity;
    let sum = 0;
    let n = 0;
    for (; i < sorted.length && (sorted[i] as DamperPoint).velocity === v; i++, n++)
      sum += (sorted[i] as DamperPoint).force;
    out.push({ velocity: v, force: sum / n });
  }
  return out;
}

/** Two slopes this close (relative) make one straight line: its knee means nothing. */
export const DAMPER_STRAIGHT_LINE_TOLERANCE = 1e-6;

const TABLE_SLOPES = new WeakMap<readonly DamperPoint[], DamperBilinear>();

/**
 * The one rule by which measured points become low- and high-speed slopes, wherever a table
 * or a bench run gives the curve (README, What the figures mean): the least-squares bilinear
 * fit through zero force at zero speed, with its knee found from the data, over every measured
 * point of the direction (damperDirectionFit). It uses every point rather than one secant at a
 * fixed speed, so one noisy point moves it little; it puts the knee where the valving's slope
 * changes rather than at a speed chosen in advance; and it is the straight-line reading of a
 * force–velocity plot that the bench library shows. Fewer points than a fit needs: one point
 * gives one slope (its secant, knee at the point); two give the secant to the first point and
 * the one from it to the second, knee at the first (the bilinear form through both exactly).
 * Computed once per points array: treat the array as immutable.
 * @example damperTableSlopeCurve([{ velocity: 0.05, force: 280 }]) // 5600 both sides, knee 0.05
 */
export function damperTableSlopeCurve(points: readonly DamperPoint[]): DamperBilinear {
  const known = TABLE_SLOPES.get(points);
  if (known) return known;
  const first = points[0];
  const second = points[1];
  let curve: DamperBilinear;
  if (!first) curve = { kind: 'bilinear', lowSpeed: 0, kneeSpeed: 0, highSpeed: 0 };
  else if (points.length === 1) {
    const c = first.force / first.velocity;
    curve = { kind: 'bilinear', lowSpeed: c, kneeSpeed: first.velocity, highSpeed: c };
  } else if (points.length === 2 && second) {
    curve = {
      kind: 'bilinear',
      lowSpeed: first.force / first.velocity,
      kneeSpeed: first.velocity,
      highSpeed: (second.force - first.force) / (second.velocity - first.velocity),
    };
  } else curve = damperDirectionFit(points).curve;
  TABLE_SLOPES.set(points, curve);
  return curve;
}

/**
 * The bilinear form of any direction by the one rule: itself when bilinear, one slope for a
 * linear curve (knee at zero), a table's least-squares fit (damperTableSlopeCurve).
 */
export function damperDirectionSlopeCurve(d: DamperDirectionCurve): DamperBilinear {
  switch (d.kind) {
    case 'linear':
      return { kind: 'bilinear', lowSpeed: d.coefficient, kneeSpeed: 0, highSpeed: d.coefficient };
    case 'bilinear':
      return d;
    case 'table':
      return damperTableSlopeCurve(d.points);
  }
}

/**
 * Low- and high-speed slopes of one direction, the ones every linear figure uses; a linear
 * curve has one slope for both. A table's are its least-squares bilinear fit
 * (damperTableSlopeCurve), its knee null when the two slopes make one straight line.
 */
export function damperDirectionSlopes(d: DamperDirectionCurve): DamperSlopes {
  switch (d.kind) {
    case 'linear':
      return { lowSpeed: d.coefficient, highSpeed: d.coefficient, kneeSpeed: null };
    case 'bilinear':
      return { lowSpeed: d.lowSpeed, highSpeed: d.highSpeed, kneeSpeed: d.kneeSpeed };
    case 'table': {
      if (d.points.length === 0) return { lowSpeed: 0, highSpeed: 0, kneeSpeed: null };
      const f = damperTableSlopeCurve(d.points);
      const straight =
        Math.abs(f.highSpeed - f.lowSpeed) <= DAMPER_STRAIGHT_LINE_TOLERANCE * Math.abs(f.lowSpeed);
      return { lowSpeed: f.lowSpeed, highSpeed: f.highSpeed, kneeSpeed: straight ? null : f.kneeSpeed };
    }
  }
}

/**
 * The highest shaft speed (m/s) a direction's curve rests on data for: a table's last point;
 * null for the linear and bilinear forms, which hold at any speed by definition.
 */
export function damperDirectionDataLimit(d: DamperDirectionCurve): number | null {
  if (d.kind !== 'table') return null;
  return d.points[d.points.length - 1]?.velocity ?? null;
}

/** Force magnitude (N) of one direction at shaft speed `speed` ≥ 0 (m/s). */
export function damperDirectionForce(d: DamperDirectionCurve, speed: number): number {
  switch (d.kind) {
    case 'linear':
      return d.coefficient * speed;
    case 'bilinear':
      return speed <= d.kneeSpeed
        ? d.lowSpeed * speed
        : d.lowSpeed * d.kneeSpeed + d.highSpeed * (speed - d.kneeSpeed);
    case 'table':
      return cubicHermiteAt(damperTableInterpolant(d.points), speed);
  }
}

/**
 * Damping force (N) at shaft velocity `v` (m/s), compression positive: positive in bump,
 * negative in rebound, zero at rest. It resists the motion, so it pushes the body up in bump.
 * The gas force is not included (see damperShaftForce).
 */
export function damperForce(curve: DamperCurve, v: number): number {
  return v >= 0 ? damperDirectionForce(curve.bump, v) : -damperDirectionForce(curve.rebound, -v);
}

/**
 * Total force on the shaft (N), compression positive, as a bench reads it: the damping force
 * plus the gas force, which pushes the shaft out at every velocity. On the car the gas force is
 * part of what holds the corner up at rest, so the event simulation, which works from static
 * equilibrium, uses the damping force alone.
 */
export function damperShaftForce(curve: DamperCurve, v: number): number {
  return damperForce(curve, v) + (curve.gasForce ?? 0);
}

function positiveDamping(raw: unknown, field: string): number {
  const c = quantityParse(raw, 'damping', field);
  if (!(c > 0)) throw new InputError(field, `must be greater than zero (got ${c} N·s/m)`);
  return c;
}

/** What a damper table from a file must satisfy (DamperDirectionCurve, kind 'table'). */
const DAMPER_TABLE_RULES = {
  x: { kind: 'velocity', name: 'speed' },
  y: { kind: 'force', name: 'force' },
  positive: true,
  nonDecreasing: true,
  minPoints: 1,
} as const;

/**
 * Reads one direction from a file: `{lowSpeed}` alone is linear; `{lowSpeed, kneeSpeed,
 * highSpeed}` is bilinear; `{points: [[speed, force], …]}` is a table of bench points
 * (magnitudes, speed rising, force never falling). Each value is a quantity with units.
 * @throws InputError naming the field, or the offending point of a table.
 */
export function damperDirectionParse(raw: unknown, field: string): DamperDirectionCurve {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
    throw new InputError(field, 'expected an object such as {"lowSpeed": "2500 N*s/m"}');
  }
  const o = raw as Record<string, unknown>;
  const known = new Set(['lowSpeed', 'kneeSpeed', 'highSpeed', 'points']);
  for (const key of Object.keys(o)) {
    if (!known.has(key))
      throw new InputError(
        inputFieldPath(field, key),
        'is not a damper field (lowSpeed, kneeSpeed, highSpeed, or points for a table)',
      );
  }
  if (o.points !== undefined) {
    const other = Object.keys(o).find((k) => k !== 'points');
    if (other) {
      throw new InputError(
        inputFieldPath(field, other),
        'cannot be given with points: a direction is either a table of points or slopes',
      );
    }
    const pointsField = inputFieldPath(field, 'points');
    const points = pointTableParse(o.points, pointsField, DAMPER_TABLE_RULES);
    return { kind: 'table', points: points.map(([velocity, force]) => ({ velocity, force })) };
  }
  if (o.lowSpeed === undefined) throw new InputError(inputFieldPath(field, 'lowSpeed'), 'is missing');
  const lowSpeed = positiveDamping(o.lowSpeed, inputFieldPath(field, 'lowSpeed'));
  if (o.kneeSpeed === undefined && o.highSpeed === undefined)
    return { kind: 'linear', coefficient: lowSpeed };
  if (o.kneeSpeed === undefined) {
    throw new InputError(
      inputFieldPath(field, 'kneeSpeed'),
      'is missing: a high-speed slope needs the knee velocity where it starts',
    );
  }
  if (o.highSpeed === undefined) {
    throw new InputError(
      inputFieldPath(field, 'highSpeed'),
      'is missing: a knee velocity needs the high-speed slope after it',
    );
  }
  const kneeField = inputFieldPath(field, 'kneeSpeed');
  const kneeSpeed = quantityParse(o.kneeSpeed, 'velocity', kneeField);
  if (!(kneeSpeed > 0)) throw new InputError(kneeField, `must be greater than zero (got ${kneeSpeed} m/s)`);
  const highSpeed = positiveDamping(o.highSpeed, inputFieldPath(field, 'highSpeed'));
  return { kind: 'bilinear', lowSpeed, kneeSpeed, highSpeed };
}

/** Reads a damper `{bump, rebound, gasForce?}` from a file. */
export function damperCurveParse(raw: unknown, field: string): DamperCurve {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
    throw new InputError(field, 'expected an object with "bump" and "rebound"');
  }
  const o = raw as Record<string, unknown>;
  for (const key of Object.keys(o)) {
    if (key !== 'bump' && key !== 'rebound' && key !== 'gasForce') {
      throw new InputError(inputFieldPath(field, key), 'is not a damper field (bump, rebound, gasForce)');
    }
  }
  if (o.bump === undefined) throw new InputError(inputFieldPath(field, 'bump'), 'is missing');
  if (o.rebound === undefined) throw new InputError(inputFieldPath(field, 'rebound'), 'is missing');
  const curve: DamperCurve = {
    bump: damperDirectionParse(o.bump, inputFieldPath(field, 'bump')),
    rebound: damperDirectionParse(o.rebound, inputFieldPath(field, 'rebound')),
  };
  if (o.gasForce !== undefined) {
    const gasField = inputFieldPath(field, 'gasForce');
    const gas = quantityParse(o.gasForce, 'force', gasField);
    if (!(gas >= 0)) throw new InputError(gasField, `must be zero or more (got ${gas} N)`);
    curve.gasForce = gas;
  }
  return curve;
}

/** The file form of one direction, quantities as unit strings in `system`. */
export function damperDirectionToFile(
  d: DamperDirectionCurve,
  system: UnitSystem = 'si',
): Record<string, string> | { points: [string, string][] } {
  switch (d.kind) {
    case 'table':
      return {
        points: pointTableToFile(
          d.points.map((p) => [p.velocity, p.force] as const),
          { x: 'velocity', y: 'force' },
          system,
        ),
      };
    case 'linear':
      return { lowSpeed: quantityText(d.coefficient, 'damping', system) };
    case 'bilinear':
      return {
        lowSpeed: quantityText(d.lowSpeed, 'damping', system),
        kneeSpeed: quantityText(d.kneeSpeed, 'velocity', system),
        highSpeed: quantityText(d.highSpeed, 'damping', system),
      };
  }
}

/** The file form of a damper. */
export function damperCurveToFile(curve: DamperCurve, system: UnitSystem = 'si'): Record<string, unknown> {
  const file: Record<string, unknown> = {
    bump: damperDirectionToFile(curve.bump, system),
    rebound: damperDirectionToFile(curve.rebound, system),
  };
  if (curve.gasForce !== undefined) file.gasForce = quantityText(curve.gasForce, 'force', system);
  return file;
}
