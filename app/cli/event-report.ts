import { eventLabel, type RoadEvent } from '../../core/events/event';
import type { EventMetrics } from '../../core/events/metrics';
import { numberFormat, quantityFormat, type UnitSystem } from '../../core/units/units';
import { tableFormat } from './table';

/** The readable table of an event's metrics: a heading line, then the figures with units. */
export function eventMetricsLines(event: RoadEvent, m: EventMetrics, system: UnitSystem): string[] {
  const q = (v: number, kind: Parameters<typeof quantityFormat>[1]) => quantityFormat(v, kind, system);
  const ms = (seconds: number) => `${numberFormat(seconds * 1000, 1)} ms`;
  const settling =
    m.settlingTime === null
      ? 'no end to settle after'
      : m.settled
        ? `${numberFormat(m.settlingTime, 3)} s`
        : `not settled in ${numberFormat(m.duration, 1)} s`;
  return [
    `Event: ${eventLabel(event, system)} (nonlinear quarter car, ${numberFormat(m.duration, 1)} s from rest)`,
    tableFormat([
      [
        'peak body acceleration',
        `${numberFormat(m.peakBodyAccel, 2)} m/s²`,
        'at',
        `${numberFormat(m.peakBodyAccelTime, 3)} s`,
      ],
      ['peak body displacement', q(m.peakBodyDisplacement, 'length'), 'body settling (2 %)', settling],
      [
        'max compression (wheel)',
        q(m.maxCompression, 'length'),
        'max extension (wheel)',
        q(m.maxExtension, 'length'),
      ],
      ['min tyre load', q(m.minTireLoad, 'force'), 'max tyre load', q(m.maxTireLoad, 'force')],
      ['tyre airborne', ms(m.airborneTime), 'bump stop engaged', ms(m.bumpStopContactTime)],
      [
        'bump-stop peak force (damper)',
        q(m.bumpStopPeakForce, 'force'),
        'topped out',
        ms(m.reboundLimitContactTime),
      ],
      [
        'peak shaft speed, bump',
        q(m.peakDamperVelocityBump, 'velocity'),
        'peak shaft speed, rebound',
        q(m.peakDamperVelocityRebound, 'velocity'),
      ],
    ]),
  ];
}
