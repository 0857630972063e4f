import { benchPointsBinned, type BenchPoints } from './bench-trace';
import { damperTablePointsOf, type DamperDirectionCurve, type DamperPoint } from './damper-curve';
import { damperDirectionFit, type DamperDirectionFit } from './damper-fit';
import { InputError } from '../units/input-error';
import { quantityFormat, type UnitSystem } from '../units/units';

/**
 * A bench run's fitted curve: a bilinear fit per direction (null where the run has too few
 * points in that direction, e.g. a bump-only test), and what the fit was made on.
 */
export type BenchFit = {
  bump: DamperDirectionFit | null;
  rebound: DamperDirectionFit | null;
  /** "points": every point; "binned": binned averages, for a run with very many points. */
  basis: 'points' | 'binned';
};

/**
 * Above this many points the fit is made on binned averages: the knee search costs
 * points × candidate knees, and a dense run's bins average out the same curve.
 */
export const BENCH_FIT_MAX_POINTS = 4000;
/** Speed bins per direction for the fit of a dense run. */
export const BENCH_FIT_BINS = 200;

function directionFit(points: DamperPoint[], field: string): DamperDirectionFit | null {
  try {
    return damperDirectionFit(points, field);
  } catch (e) {
    if (e instanceof InputError) return null;
    throw e;
  }
}

/** A bench run's curve of one direction: a table of its points. */
export type BenchTable = Extract<DamperDirectionCurve, { kind: 'table' }>;

/**
 * A bench run's curves: each direction's points (binned averages for a run of more than
 * BENCH_FIT_MAX_POINTS) as a table (damperTablePointsOf: rising speed, one point per speed);
 * null where a direction has fewer than the 3 points a fit needs. These are the curves the
 * events run on, and their least-squares bilinear fits (damperTableSlopeCurve) are the slopes
 * every figure uses: benchFit fits exactly these points.
 */
export function benchDirectionTables(points: BenchPoints): {
  bump: BenchTable | null;
  rebound: BenchTable | null;
  basis: 'points' | 'binned';
  counts: { bump: number; rebound: number };
} {
  const dense = points.velocity.length > BENCH_FIT_MAX_POINTS;
  const basis = dense ? benchPointsBinned(points, BENCH_FIT_BINS, 1) : points;
  const bump: DamperPoint[] = [];
  const rebound: DamperPoint[] = [];
  for (let i = 0; i < basis.velocity.length; i++) {
    const v = basis.velocity[i] as number;
    const f = basis.force[i] as number;
    if (v > 0) bump.push({ velocity: v, force: f });
    else if (v < 0) rebound.push({ velocity: -v, force: -f });
  }
  const table = (side: DamperPoint[]): BenchTable | null => {
    const t = damperTablePointsOf(side);
    return t.length >= 3 ? { kind: 'table', points: t } : null;
  };
  return {
    bump: table(bump),
    rebound: table(rebound),
    basis: dense ? 'binned' : 'points',
    counts: { bump: bump.length, rebound: rebound.length },
  };
}

/**
 * Fits a bench run's signed points (compression positive, m/s and N) with the bilinear
 * least-squares fit of `damperDirectionFit`, over the points of its tables
 * (benchDirectionTables): bump from the positive velocities, rebound from the negative ones
 * as magnitudes, one point per speed. The same fit as damperTableSlopeCurve of those tables.
 * @throws InputError when neither direction has the 3 points a fit needs.
 */
export function benchFit(points: BenchPoints, field = 'points'): BenchFit {
  const tables = benchDirectionTables(points);
  const fit: BenchFit = {
    bump: tables.bump ? directionFit([...tables.bump.points], `${field} (bump)`) : null,
    rebound: tables.rebound ? directionFit([...tables.rebound.points], `${field} (rebound)`) : null,
    basis: tables.basis,
  };
  if (!fit.bump && !fit.rebound)
    throw new InputError(
      field,
      `a curve needs at least 3 points of non-zero speed in bump or in rebound (got ${tables.counts.bump} bump, ${tables.counts.rebound} rebound)`,
    );
  return fit;
}

/** A zero-speed offset smaller than this share of the run's largest force is not reported. */
export const BENCH_OFFSET_SHARE = 0.03;

/** Least-squares intercept of F = a + b·v over the given points (v, F signed). */
function lineIntercept(v: readonly number[], f: readonly number[]): number {
  const n = v.length;
  let sv = 0;
  let sf = 0;
  for (let i = 0; i < n; i++) {
    sv += v[i] as number;
    sf += f[i] as number;
  }
  const mv = sv / n;
  const mf = sf / n;
  let svv = 0;
  let svf = 0;
  for (let i = 0; i < n; i++) {
    const dv = (v[i] as number) - mv;
    svv += dv * dv;
    svf += dv * ((f[i] as number) - mf);
  }
  return svv > 0 ? mf - (svf / svv) * mv : mf;
}

/** Points of the offset search at most: a run with more is binned first (per direction). */
const OFFSET_MAX_POINTS = 120;

/** Sum of squared residuals of the two directions' bilinear fits to the points less `offset`. */
function bilinearSse(bump: readonly DamperPoint[], rebound: readonly DamperPoint[], offset: number): number {
  let sse = 0;
  for (const [side, sign] of [
    [bump, 1],
    [rebound, -1],
  ] as const) {
    const fit = damperDirectionFit(
      side.map((p) => ({ velocity: p.velocity, force: p.force - sign * offset })),
      'points',
    );
    sse += fit.rmsResidual * fit.rmsResidual * fit.points;
  }
  return sse;
}

/**
 * The force a run's readings carry at zero speed, as a gas force included in them gives
 * (compression positive: the gas pushes the rod out, so it adds the same force to bump and
 * rebound readings). A damper's own force passes through zero there. Each direction's slowest
 * quarter of points (at least 3) is fitted with a straight line and extended to zero speed: a
 * digressive or progressive knee only bends the two lines apart in opposite senses, so only
 * intercepts of one sign on both sides are taken for an offset. The offset is then the one
 * whose removal lets the bilinear form (through zero) fit both directions best, found by
 * golden-section search between zero and twice the intercepts' mean. Reported when it is more
 * than BENCH_OFFSET_SHARE of the run's largest force; null otherwise, or when a side has too
 * few points to tell.
 */
export function benchZeroSpeedOffset(points: BenchPoints): number | null {
  const basis =
    points.velocity.length > OFFSET_MAX_POINTS ? benchPointsBinned(points, OFFSET_MAX_POINTS / 2, 1) : points;
  const bump: DamperPoint[] = [];
  const rebound: DamperPoint[] = [];
  let largest = 0;
  for (let i = 0; i < basis.velocity.length; i++) {
    const v = basis.velocity[i] as number;
    const f = basis.force[i] as number;
    largest = Math.max(largest, Math.abs(f));
    if (v > 0) bump.push({ velocity: v, force: f });
    else if (v < 0) rebound.push({ velocity: -v, force: -f });
  }
  if (bump.length < 3 || rebound.length < 3) return null;
  // Intercepts in the signed convention: the rebound side's force is −(its magnitude).
  const intercept = (side: DamperPoint[], sign: 1 | -1) => {
    const slow = [...side]
      .sort((a, b) => a.velocity - b.velocity)
      .slice(0, Math.max(3, Math.ceil(side.length / 4)));
    return lineIntercept(
      slow.map((p) => sign * p.velocity),
      slow.map((p) => sign * p.force),
    );
  };
  const a = intercept(bump, 1);
  const b = intercept(rebound, -1);
  if (Math.sign(a) !== Math.sign(b) || !Number.isFinite(a + b)) return null;
  let lo = Math.min(0, a + b);
  let hi = Math.max(0, a + b);
  const phi = (Math.sqrt(5) - 1) / 2;
  let x1 = hi - phi * (hi - lo);
  let x2 = lo + phi * (hi - lo);
  let f1 = bilinearSse(bump, rebound, x1);
  let f2 = bilinearSse(bump, rebound, x2);
  for (let i = 0; i < 48 && hi - lo > 1e-6 * largest; i++) {
    if (f1 <= f2) {
      hi = x2;
      x2 = x1;
      f2 = f1;
      x1 = hi - phi * (hi - lo);
      f1 = bilinearSse(bump, rebound, x1);
    } else {
      lo = x1;
      x1 = x2;
      f1 = f2;
      x2 = lo + phi * (hi - lo);
      f2 = bilinearSse(bump, rebound, x2);
    }
  }
  const offset = (lo + hi) / 2;
  return Math.abs(offset) > BENCH_OFFSET_SHARE * largest ? offset : null;
}

/**
 * Words for a run's zero-speed offset (N) in `units`: before any gas force was taken off, or
 * left after `gasForce` (N) was.
 */
export function benchOffsetText(offset: number, gasForce: number | undefined, units: UnitSystem): string {
  const about = `the readings carry about ${quantityFormat(offset, 'force', units)} at zero speed in both directions`;
  return gasForce === undefined
    ? `${about}, as a gas force included in them would: the fitted curve counts it as damping (give the gas force at import to take it off)`
    : `${about} after the ${quantityFormat(gasForce, 'force', units)} gas force was taken off: check the gas force and the compression sign`;
}

/** A run's points with `gasForce` (N) taken off every reading: the damping force alone. */
export function benchPointsLessGas(points: BenchPoints, gasForce: number): BenchPoints {
  return { velocity: points.velocity, force: points.force.map((f) => f - gasForce) };
}
