import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { testCorner } from '../test-corner';
import {
  CRITICAL_DAMPING_TOLERANCE,
  cornerQuarterCar,
  cornerRideFigures,
  cornerRideRate,
  cornerValidate,
  cornerWheelRate,
  dampingClassOf,
  type CornerInput,
} from '../../../core/corner/corner';
import { InputError } from '../../../core/units/input-error';

const corner = testCorner;

describe('wheel rate, ride rate, ride frequency', () => {
  it('reproduces the worked front and rear ride-frequency example', () => {
    // Engineering forum worked example, recomputed [pub; REFERENCES §3]: kt = 318 030 N/m.
    const kt = 318_030;
    const front = cornerWheelRate({ springRate: 140_101, springMotionRatio: 0.7334 });
    expect(front).toBeCloseTo(75_357, -1); // Kw 75 357 N/m
    const frontRide = cornerRideRate(front, kt);
    expect(frontRide).toBeCloseTo(60_922, -1); // ride rate 60 922 N/m
    expect(Math.sqrt(frontRide / 312) / (2 * Math.PI)).toBeCloseTo(2.22, 2); // 2.22 Hz, sprung 312 kg
    const rear = cornerWheelRate({ springRate: 210_152, springMotionRatio: 0.6822 });
    expect(rear).toBeCloseTo(97_804, -1); // Kw 97 804 N/m
    const rearRide = cornerRideRate(rear, kt);
    expect(rearRide).toBeCloseTo(74_801, -1); // ride rate 74 801 N/m
    expect(Math.sqrt(rearRide / 294) / (2 * Math.PI)).toBeCloseTo(2.54, 2); // 2.54 Hz, sprung 294 kg
  });

  it('agrees with the static-deflection rule f = 15.76/√δ[mm]', () => {
    // f = √(g/δ)/2π [calc; REFERENCES §3]: 1 Hz ↔ 248 mm of static deflection at the ride rate.
    const c = corner();
    const f = cornerRideFigures(c);
    const deflectionMm = ((f.sprungMass * 9.80665) / f.rideRate) * 1000;
    expect(f.rideFrequencyHz).toBeCloseTo(15.76 / Math.sqrt(deflectionMm), 2);
  });

  it('agrees with the US rule f = 3.127·√(K[lbf/in] / W[lb])', () => {
    // [calc; REFERENCES §3] from f = √(K·g/W)/2π with g in in/s².
    const c = corner();
    const f = cornerRideFigures(c);
    const kLbfIn = f.rideRate * (0.0254 / 4.4482216152605);
    const wLb = f.sprungMass / 0.45359237;
    expect(f.rideFrequencyHz).toBeCloseTo(3.127 * Math.sqrt(kLbfIn / wLb), 3);
  });

  it('computes every figure by DESIGN.md conventions', () => {
    const f = cornerRideFigures(corner());
    const kw = 60_000 * 0.64;
    expect(f.sprungMass).toBe(260);
    expect(f.wheelRate).toBeCloseTo(kw, 9);
    expect(f.rideRate).toBeCloseTo((kw * 250_000) / (kw + 250_000), 9);
    expect(f.wheelHopFrequencyHz).toBeCloseTo(Math.sqrt((kw + 250_000) / 40) / (2 * Math.PI), 12);
    const ccrit = 2 * Math.sqrt(kw * 260);
    expect(f.criticalDamping).toBeCloseTo(ccrit, 9);
    expect(f.dampingRatio.bump).toBeCloseTo((3000 * 0.64) / ccrit, 12);
    expect(f.dampingRatio.rebound).toBeCloseTo((5000 * 0.64) / ccrit, 12);
    expect(f.dampingRatio.bumpHighSpeed).toBeCloseTo((1000 * 0.64) / ccrit, 12);
    expect(f.dampingRatio.reboundHighSpeed).toBeCloseTo((1800 * 0.64) / ccrit, 12);
    expect(f.staticTireLoad).toBeCloseTo(300 * 9.80665, 9);
    expect(cornerQuarterCar(corner()).wheelDamping).toBeCloseTo(((3000 + 5000) / 2) * 0.64, 9);
  });

  it('scales wheel rate with the square of the motion ratio (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e3, max: 1e6, noNaN: true }),
        fc.double({ min: 0.2, max: 2, noNaN: true }),
        fc.double({ min: 0.1, max: 3, noNaN: true }),
        (k, mr, s) => {
          const a = cornerWheelRate({ springRate: k, springMotionRatio: mr });
          const b = cornerWheelRate({ springRate: k, springMotionRatio: mr * s });
          return Math.abs(b / a - s * s) < 1e-9 * s * s;
        },
      ),
    );
  });

  it('uses the damper motion ratio, not the spring one, for damping', () => {
    const f = cornerRideFigures(corner({ damperMotionRatio: 1 }));
    expect(f.wheelDamping.bump).toBeCloseTo(3000, 9);
  });
});

describe('damping class', () => {
  it('names the three cases, with critical within the stated tolerance', () => {
    expect(CRITICAL_DAMPING_TOLERANCE).toBe(0.01);
    expect(dampingClassOf(0.3)).toBe('underdamped');
    expect(dampingClassOf(0.989)).toBe('underdamped');
    expect(dampingClassOf(0.995)).toBe('critically damped');
    expect(dampingClassOf(1)).toBe('critically damped');
    expect(dampingClassOf(1.009)).toBe('critically damped');
    expect(dampingClassOf(1.2)).toBe('overdamped');
  });

  it('reports a critically damped corner when c_wheel = 2√(kw·ms)', () => {
    const kw = 60_000 * 0.64;
    const c = (2 * Math.sqrt(kw * 260)) / 0.64;
    const f = cornerRideFigures(
      corner({
        damper: { bump: { kind: 'linear', coefficient: c }, rebound: { kind: 'linear', coefficient: 2 * c } },
      }),
    );
    expect(f.dampingClass).toEqual({ bump: 'critically damped', rebound: 'overdamped' });
  });
});

describe('cornerValidate', () => {
  const bad: [string, Partial<CornerInput>, RegExp][] = [
    [
      'unsprung equal to the corner mass',
      { unsprungMass: 300 },
      /corner\.unsprungMass: unsprung mass \(300 kg\) must be less than the corner mass/,
    ],
    ['unsprung above the corner mass', { unsprungMass: 400 }, /corner\.unsprungMass/],
    ['zero corner mass', { cornerMass: 0 }, /corner\.cornerMass: corner mass must be greater than zero/],
    ['negative spring rate', { springRate: -1 }, /corner\.springRate: spring rate must be greater than zero/],
    ['zero motion ratio', { springMotionRatio: 0 }, /corner\.springMotionRatio/],
    ['negative damper motion ratio', { damperMotionRatio: -0.5 }, /corner\.damperMotionRatio/],
    ['NaN tyre rate', { tireRate: NaN }, /corner\.tireRate: tyre rate must be a finite number/],
    ['negative tyre damping', { tireDamping: -5 }, /corner\.tireDamping/],
    ['zero unsprung mass', { unsprungMass: 0 }, /corner\.unsprungMass/],
    ['a negative bump-stop gap', { bumpStop: { gap: -0.01, rate: 1e5 } }, /corner\.bumpStop\.gap/],
    ['a zero bump-stop rate', { bumpStop: { gap: 0.01, rate: 0 } }, /corner\.bumpStop\.rate/],
  ];
  it.each(bad)('rejects %s, naming the field', (_what, over, message) => {
    expect(() => cornerValidate(corner(over))).toThrowError(InputError);
    expect(() => cornerValidate(corner(over))).toThrowError(message);
  });

  it('accepts a sound corner', () => {
    expect(() => cornerValidate(corner({ bumpStop: { gap: 0, rate: 2e5 } }))).not.toThrow();
  });
});
