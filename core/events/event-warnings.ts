import { cornerSprungMass, cornerWheelRate, STANDARD_GRAVITY, type CornerInput } from '../corner/corner';
import { damperDirectionDataLimit } from '../damper/damper-curve';
import { eventLabel, type RoadEvent } from './event';
import type { EventMetrics } from './metrics';
import { quantityFormat, type UnitSystem } from '../units/units';
import type { ModelWarning } from '../corner/warnings';

const msText = (seconds: number) => `${(seconds * 1000).toFixed(seconds < 0.01 ? 1 : 0)} ms`;

/**
 * Warnings from an event's metrics (DESIGN.md, Cautions): tyre lift-off, bump stop engaged,
 * travel beyond the entered limit, the rebound limit reached, shaft speeds past the last point
 * of a tabulated damper curve (where the force is extrapolated), and extension past the point
 * where the spring is unloaded (the model's spring would pull there; a real one goes slack).
 * Quantities are written in `units`.
 */
export function eventWarnings(
  corner: CornerInput,
  event: RoadEvent,
  m: EventMetrics,
  units: UnitSystem = 'si',
): ModelWarning[] {
  const mm = (metres: number) => quantityFormat(metres, 'length', units);
  const newtons = (n: number) => quantityFormat(n, 'force', units);
  const speed = (v: number) => quantityFormat(v, 'velocity', units);
  const label = eventLabel(event, units);
  const out: ModelWarning[] = [];
  const mr = corner.damperMotionRatio;
  if (m.airborneTime > 0) {
    out.push({
      code: 'tire-lift-off',
      field: event.kind,
      message: `The tyre leaves the road for ${msText(m.airborneTime)} over ${label}: there is no grip while it is in the air, and it lands with up to ${newtons(m.maxTireLoad)} of tyre load.`,
    });
  }
  if (m.bumpStopContactTime > 0) {
    out.push({
      code: 'bump-stop-engaged',
      field: 'bumpStop',
      message: `The bump stop is engaged for ${msText(m.bumpStopContactTime)} over ${label}, up to ${newtons(m.bumpStopPeakForce)} at the damper: the wheel rate rises steeply while it is, and the tyre load with it.`,
    });
  }
  const compression = m.maxCompression * mr;
  if (corner.travelLimit !== undefined && compression > corner.travelLimit) {
    out.push({
      code: 'travel-beyond-limit',
      field: 'travelLimit',
      message: `Over ${label} the damper compresses ${mm(compression)}, beyond the ${mm(corner.travelLimit)} of travel entered: on the car it would reach full bump; check the clearances and the bump stop.`,
    });
  }
  if (m.reboundLimitContactTime > 0 && corner.reboundLimit) {
    out.push({
      code: 'rebound-limit-reached',
      field: 'reboundLimit',
      message: `The damper tops out (extends past ${mm(corner.reboundLimit.travel)}) for ${msText(m.reboundLimitContactTime)} over ${label}: the wheel hangs from the damper and the tyre unloads.`,
    });
  }
  // At rest the spring carries the sprung weight less the gas force's share (at the wheel):
  // extended further than that, it has nothing left to push with.
  const springPreload = cornerSprungMass(corner) * STANDARD_GRAVITY - mr * (corner.damper.gasForce ?? 0);
  const slackAt = springPreload / cornerWheelRate(corner);
  if (m.maxExtension > slackAt && m.reboundLimitContactTime === 0) {
    out.push({
      code: 'spring-unloaded',
      field: 'springRate',
      message: `Over ${label} the wheel drops ${mm(m.maxExtension)} below static, past the ${mm(slackAt)} at which the spring is unloaded: on the car it would go slack (or a helper spring or droop limiter takes over), while the model keeps it pulling, so its figures past that point are not to be trusted; enter the rebound limit if the damper tops out first.`,
    });
  }
  const peaks = { bump: m.peakDamperVelocityBump, rebound: m.peakDamperVelocityRebound } as const;
  for (const dir of ['bump', 'rebound'] as const) {
    const limit = damperDirectionDataLimit(corner.damper[dir]);
    if (limit !== null && peaks[dir] > limit) {
      out.push({
        code: `damper-speed-beyond-data-${dir}`,
        field: `damper.${dir}.points`,
        message: `Over ${label} the damper reaches ${speed(peaks[dir])} in ${dir}, past the last point of its curve (${speed(limit)}): beyond it the force is extrapolated in a straight line, so the figures there rest on no data.`,
      });
    }
  }
  return out;
}
