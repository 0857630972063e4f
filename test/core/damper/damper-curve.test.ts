import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cubicHermiteAt, cubicHermiteMonotone } from '../../../core/numeric/cubic-hermite';
import { damperCurveFit, damperDirectionFit } from '../../../core/damper/damper-fit';
import {
  damperCurveParse,
  damperCurveToFile,
  damperDirectionDataLimit,
  damperDirectionForce,
  damperDirectionParse,
  damperDirectionSlopes,
  damperDirectionToFile,
  damperForce,
  damperShaftForce,
  damperTablePointsOf,
  damperTableSlopeCurve,
  type DamperDirectionCurve,
  type DamperPoint,
} from '../../../core/damper/damper-curve';
import { seededRandom } from '../../../core/numeric/seeded-random';

/** Invented bench points of a digressive bump valving (Millbrook demo data). */
const BENCH: DamperDirectionCurve = {
  kind: 'table',
  points: [
    { velocity: 0.025, force: 150 },
    { velocity: 0.05, force: 280 },
    { velocity: 0.1, force: 400 },
    { velocity: 0.3, force: 620 },
    { velocity: 0.6, force: 850 },
  ],
};

describe('monotone cubic (Fritsch–Carlson)', () => {
  it('uses the weighted harmonic mean of the neighbouring secants as a knot slope', () => {
    // (0,0), (1,1), (2,4): secants 1 and 3, equal cells → harmonic mean 2·1·3/(1+3) = 1.5 [calc]
    const c = cubicHermiteMonotone([0, 1, 2], [0, 1, 4]);
    expect(c.slope[1]).toBeCloseTo(1.5, 15);
    // [pub] Moler, Numerical Computing with MATLAB §3.4 (pchipend): d = ((2h1 + h2)δ1 − h1δ2)/(h1 + h2).
    // Left: ((2 + 1)·1 − 1·3)/2 = 0 [calc]; right: ((2 + 1)·3 − 1·1)/2 = 4 [calc]
    expect(c.slope[0]).toBe(0);
    expect(c.slope[2]).toBe(4);
    // the straight continuation carries the end slope: 4 + 4·1 = 8, −0 below zero [calc]
    expect(cubicHermiteAt(c, 3)).toBe(8);
    expect(cubicHermiteAt(c, 2.5, 1)).toBe(4);
    expect(cubicHermiteAt(c, -1)).toBe(0);
  });

  it('takes the end slopes from the three-point formula of PCHIP, written out here', () => {
    // [pub] Fritsch & Carlson 1980 / Moler, Numerical Computing with MATLAB §3.4, pchipend:
    // d = ((2h1 + h2)δ1 − h1δ2)/(h1 + h2); d = 0 when sign(d) ≠ sign(δ1); d = 3δ1 when the
    // secants change sign and |d| > |3δ1|. Written out again independently of core [calc].
    const endSlope = (h1: number, h2: number, d1: number, d2: number) => {
      const d = ((2 * h1 + h2) * d1 - h1 * d2) / (h1 + h2);
      if (Math.sign(d) !== Math.sign(d1)) return 0;
      if (Math.sign(d1) !== Math.sign(d2) && Math.abs(d) > 3 * Math.abs(d1)) return 3 * d1;
      return d;
    };
    // A small progressive bump-stop table: x (mm) 0, 2, 5, 10 and force (N) 0, 100, 400, 1600.
    const x = [0, 2, 5, 10];
    const y = [0, 100, 400, 1600];
    const c = cubicHermiteMonotone(x, y);
    // δ = 50, 100, 240; h = 2, 3, 5.
    // left: ((4 + 3)·50 − 2·100)/5 = 30 [calc]; right: ((10 + 3)·240 − 5·100)/8 = 327.5 [calc]
    expect(c.slope[0]).toBeCloseTo(endSlope(2, 3, 50, 100), 12);
    expect(c.slope[0]).toBeCloseTo(30, 12);
    expect(c.slope[3]).toBeCloseTo(endSlope(5, 3, 240, 100), 12);
    expect(c.slope[3]).toBeCloseTo(327.5, 12);
    // Past the last point the force continues with that slope: 1600 + 327.5·2 = 2255 N [calc]
    expect(cubicHermiteAt(c, 12)).toBeCloseTo(2255, 9);
    // Data that turn at the end: (0, 0), (1, 3), (2, 2): δ = 3, −1; left ((2 + 1)·3 + 1)/2 = 5 ≤ 9 [calc];
    // right: ((2 + 1)·(−1) − 3)/2 = −3, |−3| ≤ |3·(−1)| kept [calc]
    const turn = cubicHermiteMonotone([0, 1, 2], [0, 3, 2]);
    expect(turn.slope[0]).toBeCloseTo(endSlope(1, 1, 3, -1), 12);
    expect(turn.slope[0]).toBeCloseTo(5, 12);
    expect(turn.slope[2]).toBeCloseTo(-3, 12);
    // A steep turn is limited to 3δ1: (0, 0), (1, 1), (1.1, 0): δ = 1, −10; h = 1, 0.1;
    // d = ((2 + 0.1)·1 + 10)/1.1 = 11 > 3 → 3 [calc]
    expect(cubicHermiteMonotone([0, 1, 1.1], [0, 1, 0]).slope[0]).toBeCloseTo(3, 12);
    // The sign rule: (0, 0), (1, 1), (2, 5): d = ((2 + 1)·1 − 4)/2 = −0.5, sign differs → 0 [calc]
    expect(cubicHermiteMonotone([0, 1, 2], [0, 1, 5]).slope[0]).toBe(0);
    // Two knots: both slopes the secant.
    const two = cubicHermiteMonotone([0, 2], [0, 6]);
    expect([two.slope[0], two.slope[1]]).toEqual([3, 3]);
  });

  it('puts a zero slope at a local extremum, so the curve never overshoots it', () => {
    const c = cubicHermiteMonotone([0, 1, 2, 3], [0, 2, 1, 1]);
    expect(c.slope[1]).toBe(0);
    expect(c.slope[2]).toBe(0);
    for (let x = 0; x <= 3; x += 0.01) expect(cubicHermiteAt(c, x)).toBeLessThanOrEqual(2 + 1e-15);
    for (let x = 2; x <= 3; x += 0.01) expect(cubicHermiteAt(c, x)).toBeCloseTo(1, 15);
  });

  it('is monotone between any monotone points, and stays between neighbouring values (property)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(
            fc.double({ min: 1e-4, max: 1, noNaN: true }),
            fc.double({ min: 0, max: 5000, noNaN: true }),
          ),
          {
            minLength: 1,
            maxLength: 12,
          },
        ),
        (steps) => {
          // Rising speeds and never-falling forces, as a damper table must be.
          const v: number[] = [0];
          const f: number[] = [0];
          for (const [dv, df] of steps) {
            v.push((v[v.length - 1] as number) + dv);
            f.push((f[f.length - 1] as number) + df);
          }
          const c = cubicHermiteMonotone(v, f);
          for (let i = 0; i + 1 < v.length; i++) {
            let last = -Infinity;
            for (let k = 0; k <= 20; k++) {
              const x = (v[i] as number) + (((v[i + 1] as number) - (v[i] as number)) * k) / 20;
              const y = cubicHermiteAt(c, x);
              const tol = 1e-9 * Math.max(1, f[f.length - 1] as number);
              expect(y).toBeGreaterThanOrEqual(last - tol);
              expect(y).toBeGreaterThanOrEqual((f[i] as number) - tol);
              expect(y).toBeLessThanOrEqual((f[i + 1] as number) + tol);
              last = y;
            }
          }
        },
      ),
      { numRuns: 300, seed: 8608 },
    );
  });
});

describe('tabulated damper direction', () => {
  it('passes through zero and every bench point, and continues past the last in a straight line', () => {
    expect(damperDirectionForce(BENCH, 0)).toBe(0);
    for (const p of (BENCH as { points: readonly DamperPoint[] }).points) {
      expect(damperDirectionForce(BENCH, p.velocity)).toBeCloseTo(p.force, 10);
    }
    // Past 0.6 m/s the PCHIP end slope [pub] (Moler §3.4): δ1 = (850 − 620)/0.3, δ2 = (620 − 400)/0.2,
    // ((2·0.3 + 0.2)·δ1 − 0.3·δ2)/0.5 = 566.7 N·s/m [calc]
    const slope = ((0.8 * 230) / 0.3 - (0.3 * 220) / 0.2) / 0.5;
    expect(damperDirectionForce(BENCH, 1)).toBeCloseTo(850 + 0.4 * slope, 9);
    expect(damperDirectionDataLimit(BENCH)).toBe(0.6);
    expect(damperDirectionDataLimit({ kind: 'linear', coefficient: 1000 })).toBeNull();
  });

  it('gives the linear figures the least-squares bilinear fit of the points, knee found from the data', () => {
    const s = damperDirectionSlopes(BENCH);
    // [calc] numpy lstsq of F = c_ls·min(v, k) + c_hs·max(v − k, 0) over a 200 001-knot scan and
    // scipy's bounded minimize_scalar of the residual in k: c_ls = 5680, c_hs = 889.474 N·s/m,
    // k = 0.068227 m/s (c_ls is then the fit through zero of the two points below the knee:
    // (0.025·150 + 0.05·280)/(0.025² + 0.05²) = 5680 [calc]).
    expect(s.lowSpeed).toBeCloseTo(5680, 4);
    expect(s.highSpeed).toBeCloseTo(889.4737, 3);
    expect(s.kneeSpeed as number).toBeCloseTo(0.068227, 5);
    // The same numbers as the bench fit of the same points: one rule.
    const fit = damperDirectionFit((BENCH as { points: readonly DamperPoint[] }).points).curve;
    expect([s.lowSpeed, s.highSpeed, s.kneeSpeed]).toEqual([fit.lowSpeed, fit.highSpeed, fit.kneeSpeed]);
    expect(damperTableSlopeCurve((BENCH as { points: readonly DamperPoint[] }).points)).toEqual(fit);
    // One point: its secant, one straight line [calc].
    const short = damperDirectionSlopes({ kind: 'table', points: [{ velocity: 0.03, force: 90 }] });
    expect(short.lowSpeed).toBeCloseTo(3000, 9);
    expect(short.highSpeed).toBeCloseTo(3000, 9);
    expect(short.kneeSpeed).toBeNull();
    // Two points: through both exactly, knee at the first: 90/0.03 = 3000, (150 − 90)/0.07 = 857.1 [calc].
    const two = damperDirectionSlopes({
      kind: 'table',
      points: [
        { velocity: 0.03, force: 90 },
        { velocity: 0.1, force: 150 },
      ],
    });
    expect(two.lowSpeed).toBeCloseTo(3000, 9);
    expect(two.highSpeed).toBeCloseTo(60 / 0.07, 9);
    expect(two.kneeSpeed).toBe(0.03);
  });

  it('makes measured points a table: rising speed, one averaged point per speed', () => {
    expect(
      damperTablePointsOf([
        { velocity: 0.2, force: 500 },
        { velocity: 0.05, force: 300 },
        { velocity: 0.2, force: 520 },
        { velocity: 0, force: 10 },
        { velocity: 0.1, force: NaN },
      ]),
    ).toEqual([
      { velocity: 0.05, force: 300 },
      { velocity: 0.2, force: 510 },
    ]);
  });

  it('signs the force by direction and adds the gas force only to the shaft force', () => {
    const curve = { bump: BENCH, rebound: { kind: 'linear', coefficient: 4000 } as const, gasForce: 180 };
    expect(damperForce(curve, 0.1)).toBeCloseTo(400, 10);
    expect(damperForce(curve, -0.1)).toBeCloseTo(-400, 10);
    expect(damperForce(curve, 0)).toBe(0);
    expect(damperShaftForce(curve, 0)).toBe(180);
    expect(damperShaftForce(curve, -0.1)).toBeCloseTo(-220, 10);
  });

  it('reads tables with units or SI numbers and writes them back the same', () => {
    const d = damperDirectionParse(
      {
        points: [
          ['1 in/s', '30 lbf'],
          [0.1, 400],
        ],
      },
      'bump',
    );
    expect(d.kind).toBe('table');
    const points = (d as { points: readonly DamperPoint[] }).points;
    expect(points[0]?.velocity).toBeCloseTo(0.0254, 12);
    expect(points[0]?.force).toBeCloseTo(133.4466, 3);
    const curve = damperCurveParse(
      {
        bump: {
          points: [
            [0.05, 280],
            [0.2, 500],
          ],
        },
        rebound: { lowSpeed: 4000 },
        gasForce: '40 lbf',
      },
      'damper',
    );
    expect(curve.gasForce).toBeCloseTo(177.929, 2);
    const again = damperCurveParse(damperCurveToFile(curve), 'damper');
    expect(again.bump).toEqual(curve.bump);
    expect(again.gasForce).toBeCloseTo(curve.gasForce as number, 9);
    for (const system of ['si', 'us'] as const) {
      const back = damperDirectionParse(damperDirectionToFile(BENCH, system), 'bump') as {
        points: readonly DamperPoint[];
      };
      back.points.forEach((p, i) => {
        const q = (BENCH as { points: readonly DamperPoint[] }).points[i] as DamperPoint;
        expect(p.velocity / q.velocity).toBeCloseTo(1, 9);
        expect(p.force / q.force).toBeCloseTo(1, 9);
      });
    }
  });

  it('rejects non-monotone and sign-inconsistent tables, naming the point', () => {
    const bad = (points: unknown, re: RegExp) =>
      expect(() => damperDirectionParse({ points }, 'corner.damper.rebound')).toThrow(re);
    bad(
      [
        [0.05, 420],
        [0.1, 380],
      ],
      /corner\.damper\.rebound\.points\[1\]: force 380 N is below the previous point's 420 N/,
    );
    bad(
      [
        [0.05, 420],
        [-0.1, 600],
      ],
      /points\[1\]: speed must be above zero .*magnitudes/,
    );
    bad([[0.05, -420]], /points\[0\]: force must be above zero/);
    bad(
      [
        [0.1, 420],
        [0.05, 600],
      ],
      /points\[1\]: speed 0\.05 m\/s is not above the previous point's 0\.1 m\/s/,
    );
    bad(
      [
        [0.1, 420],
        [0.1, 600],
      ],
      /points\[1\]: speed 0\.1 m\/s is not above/,
    );
    bad([], /points: has 0 points; needs at least 1/);
    bad('fast', /points: expected a list/);
    bad([[0.1]], /points\[0\]: expected a \[speed, force\] pair/);
    bad([['0.1 N', 400]], /points\[0\]: got "0\.1 N" \(a force\); expected a velocity/);
    bad([[NaN, 400]], /points\[0\]: got NaN/);
    expect(() => damperDirectionParse({ points: [[0.1, 400]], lowSpeed: 3000 }, 'bump')).toThrow(
      /bump\.lowSpeed: cannot be given with points/,
    );
    expect(() =>
      damperCurveParse({ bump: { lowSpeed: 1 }, rebound: { lowSpeed: 1 }, gasForce: -5 }, 'damper'),
    ).toThrow(/damper\.gasForce: must be zero or more/);
  });

  it('reads a huge bench sweep and still interpolates it', () => {
    const points = Array.from({ length: 20_000 }, (_, i) => [
      (i + 1) * 1e-4,
      3000 * (i + 1) * 1e-4 + 1e-3 * i,
    ]);
    const d = damperDirectionParse({ points }, 'bump');
    expect(damperDirectionForce(d, 1.00005)).toBeCloseTo(3000 * 1.00005 + 1e-3 * 9999.5, 6);
  });
});

describe('bilinear fit of bench points', () => {
  /** A bench sweep of a known bilinear curve with Gaussian force noise (seeded). */
  function sweep(low: number, knee: number, high: number, sigma: number, seed: number): DamperPoint[] {
    const next = seededRandom(seed);
    const gauss = () => Math.sqrt(-2 * Math.log(1 - next())) * Math.cos(2 * Math.PI * next());
    const curve = { kind: 'bilinear', lowSpeed: low, kneeSpeed: knee, highSpeed: high } as const;
    return Array.from({ length: 40 }, (_, i) => {
      const v = 0.01 + (0.5 * i) / 39;
      return { velocity: v, force: damperDirectionForce(curve, v) + sigma * gauss() };
    });
  }

  it('recovers the slopes and the knee from noisy synthetic points, with the noise as residual', () => {
    for (const [low, knee, high, seed] of [
      [5000, 0.06, 1200, 1],
      [3000, 0.1, 1800, 2],
      [1500, 0.08, 2500, 3], // progressive
    ] as const) {
      const sigma = 8;
      const fit = damperDirectionFit(sweep(low, knee, high, sigma, seed));
      expect(fit.curve.lowSpeed / low).toBeCloseTo(1, 1);
      expect(Math.abs(fit.curve.lowSpeed / low - 1)).toBeLessThan(0.05);
      expect(Math.abs(fit.curve.highSpeed / high - 1)).toBeLessThan(0.03);
      expect(Math.abs(fit.curve.kneeSpeed / knee - 1)).toBeLessThan(0.1);
      // the residual is the noise left over (σ, less the fitted parameters' share)
      expect(fit.rmsResidual).toBeGreaterThan(0.6 * sigma);
      expect(fit.rmsResidual).toBeLessThan(1.3 * sigma);
      expect(fit.points).toBe(40);
    }
  });

  it('fits both directions from signed points, taking off the gas force when it is given', () => {
    const gas = 150;
    const bump = sweep(4000, 0.08, 1000, 0, 4);
    const rebound = sweep(7000, 0.08, 2000, 0, 5);
    const signed = [
      ...bump.map((p) => ({ velocity: p.velocity, force: p.force + gas })),
      ...rebound.map((p) => ({ velocity: -p.velocity, force: -p.force + gas })),
    ];
    const fit = damperCurveFit(signed, { gasForce: gas });
    expect(fit.bump.curve.lowSpeed).toBeCloseTo(4000, 3);
    expect(fit.rebound.curve.highSpeed).toBeCloseTo(2000, 3);
    expect(fit.rebound.rmsResidual).toBeLessThan(1e-6);
    expect(() => damperDirectionFit([{ velocity: 0.1, force: 100 }])).toThrow(/at least 3 points/);
  });
});
