import { describe, expect, it } from 'vitest';
import type { CornerInput } from '../../../core/corner/corner';
import { eventBump } from '../../../core/events/event';
import { eventWarnings } from '../../../core/events/event-warnings';
import type { EventMetrics } from '../../../core/events/metrics';
import { MILLBROOK_FRONT_LEFT } from '../demo-corner';

const CORNER: CornerInput = {
  ...MILLBROOK_FRONT_LEFT,
  damper: {
    bump: { kind: 'table', points: [{ velocity: 0.5, force: 900 }] },
    rebound: { kind: 'linear', coefficient: 5000 },
  },
  reboundLimit: { travel: 0.04, rate: 1e6 },
  travelLimit: 0.05,
};

const QUIET: EventMetrics = {
  peakBodyAccel: 3,
  peakBodyAccelTime: 0.05,
  peakBodyDisplacement: 0.01,
  maxCompression: 0.02,
  maxExtension: 0.01,
  minTireLoad: 1500,
  maxTireLoad: 4000,
  airborneTime: 0,
  bumpStopContactTime: 0,
  bumpStopPeakForce: 0,
  reboundLimitContactTime: 0,
  settlingTime: 0.5,
  settled: true,
  peakDamperVelocityBump: 0.3,
  peakDamperVelocityRebound: 0.9,
  duration: 1.5,
};
const EVENT = eventBump({ height: 0.025, length: 0.6, speed: 14 });

describe('eventWarnings', () => {
  it('says nothing when the event stays within the model’s limits', () => {
    expect(eventWarnings(CORNER, EVENT, QUIET)).toEqual([]);
  });

  it('warns of lift-off, the bump stop, travel past the limit, top-out and a curve used past its data', () => {
    const m: EventMetrics = {
      ...QUIET,
      airborneTime: 0.021,
      bumpStopContactTime: 0.012,
      bumpStopPeakForce: 2300,
      maxCompression: 0.06, // 54 mm at the damper, past the 50 mm entered
      reboundLimitContactTime: 0.004,
      peakDamperVelocityBump: 0.8,
    };
    const w = eventWarnings(CORNER, EVENT, m);
    expect(w.map((x) => x.code)).toEqual([
      'tire-lift-off',
      'bump-stop-engaged',
      'travel-beyond-limit',
      'rebound-limit-reached',
      'damper-speed-beyond-data-bump',
    ]);
    expect(w.map((x) => x.field)).toEqual([
      'bump',
      'bumpStop',
      'travelLimit',
      'reboundLimit',
      'damper.bump.points',
    ]);
    expect(w[0]?.message).toMatch(/21 ms over the 25\.0 mm bump/);
    expect(w[2]?.message).toMatch(/compresses 54\.0 mm, beyond the 50\.0 mm/);
    expect(w[4]?.message).toMatch(/0\.800 m\/s in bump, past the last point of its curve \(0\.500 m\/s\)/);
  });

  it('writes every quantity, the event’s own words included, in the unit system asked for', () => {
    const m: EventMetrics = {
      ...QUIET,
      airborneTime: 0.021,
      bumpStopContactTime: 0.012,
      bumpStopPeakForce: 2300,
      maxCompression: 0.06,
      reboundLimitContactTime: 0.004,
      peakDamperVelocityBump: 0.8,
    };
    const si = eventWarnings(CORNER, EVENT, m, 'si');
    const us = eventWarnings(CORNER, EVENT, m, 'us');
    expect(us.map((w) => w.code)).toEqual(si.map((w) => w.code));
    // Written as a shop writes converted figures (three significant figures, numberShopFormat).
    // [calc] 25 mm = 0.984 in; 600 mm = 23.6 in; 14 m/s = 31.3 mph; 4000 N = 899 lbf; 2300 N = 517 lbf;
    // 54 mm = 2.13 in, 50 mm = 1.97 in; 40 mm = 1.57 in; 0.8 m/s = 31.5 in/s, 0.5 m/s = 19.7 in/s
    // (1 in = 25.4 mm, 1 mi = 1609.344 m, 1 lbf = 4.4482216152605 N: exact definitions).
    expect(us[0]?.message).toContain('over the 0.984 in bump, 23.6 in long, at 31.3 mph');
    expect(us[0]?.message).toContain('up to 899 lbf of tyre load');
    expect(us[1]?.message).toContain('up to 517 lbf at the damper');
    expect(us[2]?.message).toMatch(/compresses 2\.13 in, beyond the 1\.97 in/);
    expect(us[3]?.message).toContain('extends past 1.57 in');
    expect(us[4]?.message).toMatch(/31\.5 in\/s in bump, past the last point of its curve \(19\.7 in\/s\)/);
    for (const w of us) expect(w.message).not.toMatch(/\d (mm|N|m\/s|km\/h)\b/);
    expect(si[0]?.message).toContain('over the 25.0 mm bump, 600 mm long, at 50.4 km/h');
  });

  it('warns when the wheel drops past the point where the spring is unloaded, unless the damper tops out first', () => {
    // [calc] sprung weight 257·9.80665 = 2520 N, less 0.9 × 100 N of gas, over the wheel rate
    // 56 700 N/m: the spring is unloaded 42.9 mm below static.
    const corner = { ...CORNER, damper: { ...CORNER.damper, gasForce: 100 } };
    const codes = (ext: number, top = 0) =>
      eventWarnings(corner, EVENT, { ...QUIET, maxExtension: ext, reboundLimitContactTime: top }).map(
        (w) => w.code,
      );
    expect(codes(0.042)).toEqual([]);
    expect(codes(0.044)).toEqual(['spring-unloaded']);
    expect(codes(0.044, 0.01)).toEqual(['rebound-limit-reached']);
  });

  it('compares travel at the damper, where the limit is entered', () => {
    // 55 mm at the wheel is 49.5 mm at the damper (MRd 0.9): inside the 50 mm.
    expect(eventWarnings(CORNER, EVENT, { ...QUIET, maxCompression: 0.055 })).toEqual([]);
  });
});
