import { benchPointsBinned, type BenchPoints } from './bench-trace';
import { damperDirectionFit, type DamperDirectionFit, type DamperPoint } from './damper-curve';
import { InputError } from './input-error';

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

/**
 * Fits a bench run's signed points (compression positive, m/s and N) with the bilinear
 * least-squares fit of `damperDirectionFit`, bump from the positive velocities, rebound
 * from the negative ones as magnitudes.
 * @throws InputError when neither direction has the 3 points a fit needs.
 */
export function benchFit(points: BenchPoints, field = 'points'): BenchFit {
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
  const fit: BenchFit = {
    bump: directionFit(bump, `${field} (bump)`),
    rebound: directionFit(rebound, `${field} (rebound)`),
    basis: dense ? 'binned' : 'points',
  };
  if (!fit.bump && !fit.rebound)
    throw new InputError(
      field,
      `a curve needs at least 3 points of non-zero speed in bump or in rebound (got ${bump.length} bump, ${rebound.length} rebound)`,
    );
  return fit;
}
