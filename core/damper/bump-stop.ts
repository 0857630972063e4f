import { cubicHermiteAt, cubicHermiteThroughOrigin, type CubicHermite } from '../numeric/cubic-hermite';

/** One point of a progressive bump stop: its own compression (m) and force (N), magnitudes. */
export type BumpStopPoint = { compression: number; force: number };

/**
 * Bump stop at the damper (DESIGN.md: both at the damper): the free gap from static ride height
 * to contact (m), then a linear rate (N/m), or a tabulated force–compression curve of the stop
 * itself, joined through (0, 0) by a monotone cubic (PCHIP, see cubic-hermite.ts) and continued
 * linearly with its end slope past its last point.
 */
export type BumpStop = { gap: number; rate: number } | { gap: number; curve: readonly BumpStopPoint[] };

/**
 * The droop (rebound) limit at the damper: shaft extension available from static ride height
 * to top-out (m), and the rate of the top-out stop (N/m) beyond it.
 */
export type ReboundLimit = { travel: number; rate: number };

/**
 * Top-out rate used when a file gives the rebound travel only (N/m): 1000 N/mm, a stiff
 * elastomer. It makes the limit firm without a rigid impact, which no quarter car of point
 * masses can represent honestly; a measured top-out rate should replace it.
 */
export const REBOUND_LIMIT_DEFAULT_RATE = 1e6;

/** The monotone cubic through (0, 0) and a bump stop's curve points (see cubic-hermite.ts). */
export function bumpStopInterpolant(curve: readonly BumpStopPoint[]): CubicHermite {
  return cubicHermiteThroughOrigin(
    curve,
    (p) => p.compression,
    (p) => p.force,
  );
}

/**
 * Force of the bump stop itself (N, pushing the damper out) at its own compression `squeeze`
 * (m past contact): rate·squeeze, or the tabulated curve; zero when not in contact.
 */
export function bumpStopForceAt(b: BumpStop, squeeze: number): number {
  if (!(squeeze > 0)) return 0;
  return 'rate' in b ? b.rate * squeeze : cubicHermiteAt(bumpStopInterpolant(b.curve), squeeze);
}

/**
 * Bump-stop force (N) at damper compression `damperCompression` from static (m): zero until
 * the gap closes, then bumpStopForceAt(compression − gap).
 */
export function bumpStopForce(b: BumpStop, damperCompression: number): number {
  return bumpStopForceAt(b, damperCompression - b.gap);
}
