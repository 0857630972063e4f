/** A bench direction's points fitted by the one rule: two straight lines through zero, meeting at a knee found from the data. */
import { InputError } from '../units/input-error';
import type { DamperBilinear, DamperPoint } from './damper-curve';

/** A bilinear fit of bench points with its residual. */
export type DamperDirectionFit = {
  curve: DamperBilinear;
  /** RMS of force residuals (N). */
  rmsResidual: number;
  points: number;
};

/** Least squares of F = c_ls·min(v, vk) + c_hs·max(v − vk, 0) for a fixed knee vk: 2×2 normal equations. */
function bilinearAtKnee(
  points: readonly DamperPoint[],
  knee: number,
): { low: number; high: number; sse: number } {
  let s11 = 0;
  let s12 = 0;
  let s22 = 0;
  let b1 = 0;
  let b2 = 0;
  for (const p of points) {
    const x1 = Math.min(p.velocity, knee);
    const x2 = Math.max(p.velocity - knee, 0);
    s11 += x1 * x1;
    s12 += x1 * x2;
    s22 += x2 * x2;
    b1 += x1 * p.force;
    b2 += x2 * p.force;
  }
  const det = s11 * s22 - s12 * s12;
  let low: number;
  let high: number;
  if (s22 === 0 || Math.abs(det) <= 1e-14 * s11 * s22) {
    // No point past the knee: one slope.
    low = b1 / s11;
    high = low;
  } else {
    low = (b1 * s22 - b2 * s12) / det;
    high = (s11 * b2 - s12 * b1) / det;
  }
  let sse = 0;
  for (const p of points) {
    const r = low * Math.min(p.velocity, knee) + high * Math.max(p.velocity - knee, 0) - p.force;
    sse += r * r;
  }
  return { low, high, sse };
}

/**
 * Fits the bilinear (knee) form to one direction's bench points by least squares through
 * zero force at zero speed: for each trial knee the two slopes are linear least squares; the
 * knee is found by a scan over the points' speeds and a golden-section refinement.
 * @throws InputError when fewer than 3 points have positive speed.
 */
export function damperDirectionFit(points: readonly DamperPoint[], field = 'points'): DamperDirectionFit {
  const usable = points.filter(
    (p) => p.velocity > 0 && Number.isFinite(p.velocity) && Number.isFinite(p.force),
  );
  if (usable.length < 3) {
    throw new InputError(
      field,
      `needs at least 3 points with non-zero shaft speed to fit a curve (got ${usable.length})`,
    );
  }
  const speeds = [...new Set(usable.map((p) => p.velocity))].sort((a, b) => a - b);
  const vMin = speeds[0] as number;
  const vMax = speeds[speeds.length - 1] as number;
  // Candidate knees: every measured speed but the extremes, and a grid between them.
  const candidates = new Set<number>(speeds.slice(1, -1));
  for (let i = 1; i < 64; i++) candidates.add(vMin + ((vMax - vMin) * i) / 64);
  let bestKnee = vMax;
  let best = bilinearAtKnee(usable, vMax);
  for (const knee of candidates) {
    const fit = bilinearAtKnee(usable, knee);
    if (fit.sse < best.sse) {
      best = fit;
      bestKnee = knee;
    }
  }
  // Refine between the neighbouring candidates around the best one.
  const sorted = [...candidates, vMax].sort((a, b) => a - b);
  const i = sorted.indexOf(bestKnee);
  let lo = sorted[Math.max(0, i - 1)] ?? vMin;
  let hi = sorted[Math.min(sorted.length - 1, i + 1)] ?? vMax;
  const g = (Math.sqrt(5) - 1) / 2;
  for (let iter = 0; iter < 60 && hi - lo > 1e-9 * vMax; iter++) {
    const x1 = hi - g * (hi - lo);
    const x2 = lo + g * (hi - lo);
    if (bilinearAtKnee(usable, x1).sse < bilinearAtKnee(usable, x2).sse) hi = x2;
    else lo = x1;
  }
  const refinedKnee = (lo + hi) / 2;
  const refined = bilinearAtKnee(usable, refinedKnee);
  if (refined.sse < best.sse) {
    best = refined;
    bestKnee = refinedKnee;
  }
  return {
    curve: { kind: 'bilinear', lowSpeed: best.low, kneeSpeed: bestKnee, highSpeed: best.high },
    rmsResidual: Math.sqrt(best.sse / usable.length),
    points: usable.length,
  };
}

/**
 * Fits both directions from signed bench points (velocity and force compression-positive,
 * as `damperShaftForce` returns them): positive speeds are bump, negative rebound. When the
 * points include the damper's gas force, pass it in `options.gasForce` (N) and it is taken
 * off every point before the fit, so that the curves pass through zero.
 */
export function damperCurveFit(
  points: readonly DamperPoint[],
  options: { gasForce?: number } = {},
): {
  bump: DamperDirectionFit;
  rebound: DamperDirectionFit;
} {
  const gas = options.gasForce ?? 0;
  const bump = points
    .filter((p) => p.velocity > 0)
    .map((p) => ({ velocity: p.velocity, force: p.force - gas }));
  const rebound = points
    .filter((p) => p.velocity < 0)
    .map((p) => ({ velocity: -p.velocity, force: gas - p.force }));
  return {
    bump: damperDirectionFit(bump, 'bump points'),
    rebound: damperDirectionFit(rebound, 'rebound points'),
  };
}
