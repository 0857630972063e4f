import { describe, expect, it } from 'vitest';
import {
  benchFitCurve,
  benchPlotLabels,
  benchPlotSeries,
  benchPointsReach,
  benchRunDampingRatios,
  benchRunLabel,
  zetaCornerRead,
  zetaCornerTextsConvert,
  type BenchFitStored,
  type ZetaCornerTexts,
} from '../../app/renderer/damper-model';

const bilinear = (lowSpeed: number, kneeSpeed: number, highSpeed: number) => ({
  curve: { kind: 'bilinear' as const, lowSpeed, kneeSpeed, highSpeed },
  rmsResidual: 0,
  points: 10,
});

const FIT: BenchFitStored = {
  bump: bilinear(4000, 0.05, 1500),
  rebound: bilinear(7000, 0.06, 2000),
  basis: 'points',
};

/** M 300 kg, mu 40 kg, 70 N/mm, motion ratios 0.9. */
const CORNER = {
  cornerMass: 300,
  unsprungMass: 40,
  springRate: 70_000,
  springMotionRatio: 0.9,
  damperMotionRatio: 0.9,
};

describe('benchRunDampingRatios', () => {
  it('gives ζ = c·MRd² / 2√(kw·ms) for each slope', () => {
    // DESIGN.md conventions; kw = 70000·0.81 = 56700 N/m, ms = 260 kg, c_crit = 7679.06 N·s/m [calc, python].
    const z = benchRunDampingRatios(FIT, CORNER);
    expect(z.bump?.zeta).toBeCloseTo(0.42192650784464586, 12);
    expect(z.bumpHighSpeed?.zeta).toBeCloseTo(0.1582224404417422, 12);
    expect(z.rebound?.zeta).toBeCloseTo(0.7383713887281302, 12);
    expect(z.reboundHighSpeed?.zeta).toBeCloseTo(0.21096325392232293, 12);
    expect(z.bump?.class).toBe('underdamped');
    expect(z.bumpHighSpeed?.class).toBeUndefined();
  });

  it('classes a slope at ζ = 1 as critically damped and above as overdamped', () => {
    // c for ζ = 1 at this corner: 9480.324 N·s/m at the damper [calc, python].
    const at = (c: number) =>
      benchRunDampingRatios({ ...FIT, bump: bilinear(c, 0.05, c) }, CORNER).bump?.class;
    expect(at(9480.324)).toBe('critically damped');
    expect(at(12_000)).toBe('overdamped');
    expect(at(100)).toBe('underdamped');
  });

  it('scales with the damper motion ratio squared', () => {
    const a = benchRunDampingRatios(FIT, CORNER).bump?.zeta as number;
    const b = benchRunDampingRatios(FIT, { ...CORNER, damperMotionRatio: 0.45 }).bump?.zeta as number;
    expect(b / a).toBeCloseTo(0.25, 12);
  });

  it('has no ζ for a direction the run has no fit for', () => {
    const z = benchRunDampingRatios({ ...FIT, bump: null }, CORNER);
    expect(z.bump).toBeNull();
    expect(z.bumpHighSpeed).toBeNull();
    expect(z.rebound?.zeta).toBeGreaterThan(0);
  });
});

describe('benchFitCurve', () => {
  it('draws the bilinear fit through zero, compression positive, with the knee where it was fitted', () => {
    const c = benchFitCurve(FIT, { bump: 0.5, rebound: 0.4 }, 50);
    const at = (v: number) => c.force[c.velocity.findIndex((x) => Math.abs(x - v) < 1e-12)] as number;
    expect(at(0)).toBe(0);
    // DESIGN.md: F = c_ls·v up to the knee, then c_ls·v_knee + c_hs·(v − v_knee).
    expect(at(0.04)).toBeCloseTo(4000 * 0.04, 9);
    expect(at(0.5)).toBeCloseTo(4000 * 0.05 + 1500 * 0.45, 9);
    expect(at(-0.4)).toBeCloseTo(-(7000 * 0.06 + 2000 * 0.34), 9);
    expect(Math.min(...c.velocity)).toBeCloseTo(-0.4, 12);
    expect(Math.max(...c.velocity)).toBeCloseTo(0.5, 12);
    expect([...c.velocity].sort((a, b) => a - b)).toEqual(c.velocity);
  });

  it('draws only the direction a run has', () => {
    const c = benchFitCurve({ ...FIT, rebound: null }, { bump: 0.3, rebound: 0.3 }, 10);
    expect(Math.min(...c.velocity)).toBe(0);
    expect(c.force.every((f) => f >= 0)).toBe(true);
    expect(benchFitCurve({ bump: null, rebound: null, basis: 'points' }, { bump: 1, rebound: 1 })).toEqual({
      velocity: [],
      force: [],
    });
  });

  it('reaches as far as the measured points in each direction', () => {
    expect(
      benchPointsReach([
        [-0.3, -900],
        [0.1, 200],
        [0.25, 400],
      ]),
    ).toEqual({ bump: 0.25, rebound: 0.3 });
    expect(benchPointsReach([])).toEqual({ bump: 0, rebound: 0 });
  });
});

describe('the force–velocity plot', () => {
  const run = { id: 7, clicks: { bump: 3, rebound: 6 }, fit: FIT };
  const points: [number, number][] = [
    [-0.2, -900],
    [0.1, 350],
    [0.3, 650],
  ];

  it('names runs by their clicks, or their number alone', () => {
    expect(benchRunLabel(run)).toBe('#7 bump 3 rebound 6');
    expect(benchRunLabel({ id: 8, clicks: {} })).toBe('#8');
  });

  it('gives each run its measured points as markers and its fitted curve as a line, in one style', () => {
    const s = benchPlotSeries([{ run, points }], 'si');
    expect(s.map((x) => x.name)).toEqual(['#7 bump 3 rebound 6 measured', '#7 bump 3 rebound 6 fitted']);
    expect(s[0]?.points).toBe(true);
    expect(s[1]?.points).toBeUndefined();
    expect(s[0]?.style).toBe(s[1]?.style);
    expect(Array.from(s[0]?.y ?? [])).toEqual([-900, 350, 650]);
  });

  it('shows in/s and lbf in US units', () => {
    const si = benchPlotSeries([{ run, points }], 'si');
    const us = benchPlotSeries([{ run, points }], 'us');
    // NIST SP 811 [pub]: 1 in = 0.0254 m; 1 lbf = 4.4482216152605 N.
    expect(us[0]?.x[2]).toBeCloseTo(0.3 / 0.0254, 9);
    expect(us[0]?.y[2]).toBeCloseTo(650 / 4.4482216152605, 9);
    expect((us[1]?.y.length ?? 0) > 0 && us[1]?.y.length === si[1]?.y.length).toBe(true);
    expect(benchPlotLabels('us')).toEqual({
      x: 'Shaft velocity, compression + (in/s)',
      y: 'Damper force, compression + (lbf)',
    });
  });
});

describe('the corner entered for ζ', () => {
  const si: ZetaCornerTexts = {
    cornerMass: '300',
    unsprungMass: '40',
    springRate: '70',
    springMotionRatio: '0.9',
    damperMotionRatio: '',
  };
  const problems = (t: Partial<ZetaCornerTexts>, system: 'si' | 'us' = 'si') => {
    const r = zetaCornerRead({ ...si, ...t }, system);
    return 'problems' in r ? r.problems : new Map();
  };

  it('reads masses and the spring rate in the units shown; the damper ratio defaults to the spring’s', () => {
    const r = zetaCornerRead(si, 'si');
    expect('corner' in r && r.corner).toEqual({ ...CORNER, springRate: 70_000 });
    const us = zetaCornerRead({ ...si, cornerMass: '660', unsprungMass: '88', springRate: '400' }, 'us');
    // NIST SP 811 [pub]: 1 lb = 0.45359237 kg; 1 lbf/in = 175.126835 N/m.
    if (!('corner' in us)) throw new Error('expected a corner');
    expect(us.corner.cornerMass).toBeCloseTo(299.3709642, 6);
    expect(us.corner.springRate).toBeCloseTo(70050.734, 2);
  });

  it('names each wrong field: empty, zero, negative, not a number, a wrong unit, NaN', () => {
    expect(problems({ cornerMass: '' }).get('cornerMass')).toBe('is needed');
    expect(problems({ springRate: '0' }).get('springRate')).toMatch(/greater than zero/);
    expect(problems({ springMotionRatio: '-1' }).get('springMotionRatio')).toMatch(/greater than zero/);
    expect(problems({ damperMotionRatio: 'x' }).get('damperMotionRatio')).toMatch(/motion ratio/);
    expect(problems({ springRate: '70 kg' }).get('springRate')).toMatch(/expected a rate/);
    expect(problems({ unsprungMass: 'NaN' }).get('unsprungMass')).toBeDefined();
  });

  it('refuses an unsprung mass not below the corner mass', () => {
    expect(problems({ unsprungMass: '300' }).get('unsprungMass')).toMatch(/less than the corner mass/);
  });

  it('converts the entered quantities when the units switch, and keeps ratios', () => {
    const us = zetaCornerTextsConvert(si, 'si', 'us');
    // 300 kg = 661.387 lb, 70 N/mm = 399.71 lbf/in (NIST SP 811 [pub]), written as a shop does.
    expect(us.cornerMass).toBe('661');
    expect(us.springRate).toBe('400');
    // Back in SI, each reads as entered: the rounding was for the eye only.
    expect(zetaCornerTextsConvert(us, 'us', 'si')).toEqual(si);
    expect(us.springMotionRatio).toBe('0.9');
  });
});
