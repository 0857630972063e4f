import type { ClickSettings } from '../../core/damper/click-settings';
import type { CornerInput } from '../../core/corner/corner';
import {
  valvingRunOf,
  type ValvingCurveCell,
  type ValvingDirectionCurve,
  type ValvingRun,
} from '../../core/valving/valving-map';
import { MILLBROOK_FRONT_LEFT } from './demo-corner';

/** Bench points of a damper, compression positive, from −0.5 to 0.5 m/s: what a dyno sweep records. */
export function benchPointsOf(
  bump: (v: number) => number,
  rebound: (v: number) => number,
  n = 24,
): { velocity: Float64Array; force: Float64Array } {
  const velocity = new Float64Array(n);
  const force = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const v = -0.5 + (i + 0.5) / n;
    velocity[i] = v;
    force[i] = v > 0 ? bump(v) : -rebound(-v);
  }
  return { velocity, force };
}

/** F(v) of a bilinear direction (magnitudes). */
export function bilinearForce(c: ValvingDirectionCurve): (v: number) => number {
  return (v) =>
    v <= c.kneeSpeed ? c.lowSpeed * v : c.lowSpeed * c.kneeSpeed + c.highSpeed * (v - c.kneeSpeed);
}

/** A bench run at `clicks` whose points come from the given force curves, read as the map reads a stored run. */
export function benchRunOf(
  id: number,
  clicks: ClickSettings,
  bump: (v: number) => number,
  rebound: (v: number) => number,
): ValvingRun {
  return valvingRunOf(id, clicks, benchPointsOf(bump, rebound));
}

export const bilinear = (lowSpeed: number, kneeSpeed: number, highSpeed: number): ValvingDirectionCurve => ({
  kind: 'bilinear',
  lowSpeed,
  kneeSpeed,
  highSpeed,
});

/** A cell of an invented damper map: bump and rebound curves at `clicks`, taken as measured. */
export function cellOf(
  clicks: ClickSettings,
  bump: ValvingDirectionCurve,
  rebound: ValvingDirectionCurve,
  runIds: number[] = [],
): ValvingCurveCell {
  return { clicks, source: 'measured', runIds, damper: { bump, rebound } };
}

/**
 * The invented Millbrook front corner with a plain linear damper and no bump stop: ms 257 kg,
 * kw = 70 000 × 0.9² = 56 700 N/m, so c_crit = 2√(kw·ms) = 7634.63 N·s/m at the wheel.
 */
const { bumpStop: _bumpStop, ...plain } = MILLBROOK_FRONT_LEFT;
export const PLAIN_CORNER: CornerInput = plain;
