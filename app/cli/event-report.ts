import { eventLabel, type RoadEvent } from '../../core/events/event';
import type { EventMetrics } from '../../core/events/metrics';
import { figureLabel, figureText, type FigureKey } from '../../core/units/figure-labels';
import { numberFormat, type UnitSystem } from '../../core/units/units';
import { tableFormat } from './table';

/** The readable table of an event's metrics: a heading line, then the figures with units. */
export function eventMetricsLines(event: RoadEvent, m: EventMetrics, system: UnitSystem): string[] {
  // Names and units from the one table every screen uses.
  const f = (key: FigureKey) => figureLabel(key);
  const q = (key: FigureKey, v: number) => figureText(key, v, system);
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
        figureLabel('peakBodyAccel'),
        figureText('peakBodyAccel', m.peakBodyAccel, system),
        'at',
        `${numberFormat(m.peakBodyAccelTime, 3)} s`,
      ],
      [
        f('peakBodyDisplacement'),
        q('peakBodyDisplacement', m.peakBodyDisplacement),
        'body settling (2 %)',
        settling,
      ],
      [
        f('maxCompression'),
        q('maxCompression', m.maxCompression),
        f('maxExtension'),
        q('maxExtension', m.maxExtension),
      ],
      [f('minTireLoad'), q('minTireLoad', m.minTireLoad), f('maxTireLoad'), q('maxTireLoad', m.maxTireLoad)],
      [
        f('airborneTime'),
        q('airborneTime', m.airborneTime),
        f('bumpStopTime'),
        q('bumpStopTime', m.bumpStopContactTime),
      ],
      [
        f('bumpStopPeakForce'),
        q('bumpStopPeakForce', m.bumpStopPeakForce),
        f('reboundLimitTime'),
        q('reboundLimitTime', m.reboundLimitContactTime),
      ],
      [
        f('peakShaftSpeedBump'),
        q('peakShaftSpeedBump', m.peakDamperVelocityBump),
        f('peakShaftSpeedRebound'),
        q('peakShaftSpeedRebound', m.peakDamperVelocityRebound),
      ],
    ]),
  ];
}
