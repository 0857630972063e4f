import { describe, expect, it } from 'vitest';
import { valvingJobOf } from '../../../core/valving/valving';
import { valvingCompare } from '../../../core/valving/valving-compare';
import { valvingComboEvaluate } from '../../../core/valving/valving-evaluate';
import type { ValvingCurves } from '../../../core/valving/valving-map';
import { VALVING_PRESETS } from '../../../core/valving/valving-presets';
import { valvingBalanceOf, valvingRank, valvingStepText } from '../../../core/valving/valving-rank';
import { valvingSweepSerial } from '../../../core/valving/valving-sweep';
import type { ValvingTargets } from '../../../core/valving/valving-targets';
import { setupFileParse } from '../../../core/setup/setup-file';
import { setupFileFixture } from '../setup-fixture';
import { bilinear, cellOf, PLAIN_CORNER } from '../valving-fixture';

const user = { tag: 'user', text: 'test' } as const;
const CCRIT = 7634.632; // 2√(kw·ms) of PLAIN_CORNER [calc]
const MR2 = 0.81;

/**
 * An invented 5 × 5 damper: bump click b has low-speed slope 6000 − 800b N·s/m, rebound click r
 * 9000 − 1000r. Bands are set so that bump 2 (ζ 0.4668) and rebound 3 (ζ 0.6366) alone fall
 * inside them; every other target is wide, so exactly one combination meets every target.
 */
function syntheticCurves(): Pick<ValvingCurves, 'axes' | 'cells'> {
  const clicks = [0, 1, 2, 3, 4];
  return {
    axes: [
      { adjuster: 'bump', clicks, measured: clicks },
      { adjuster: 'rebound', clicks, measured: clicks },
    ],
    cells: clicks.flatMap((b) =>
      clicks.map((r) =>
        cellOf(
          { bump: b, rebound: r },
          bilinear(6000 - 800 * b, 0.06, 2000),
          bilinear(9000 - 1000 * r, 0.06, 3000),
          [10 * b + r],
        ),
      ),
    ),
  };
}

const zeta = (c: number) => (c * MR2) / CCRIT;

const TARGETS: ValvingTargets = {
  // [calc] ζ(bump 1, 2, 3) = 0.5517, 0.4668, 0.3820; ζ(rebound 2, 3, 4) = 0.7427, 0.6366, 0.5305.
  bumpLowSpeed: { low: 0.43, high: 0.51, scale: 0.04, weight: 1, source: user },
  reboundLowSpeed: { low: 0.59, high: 0.69, scale: 0.05, weight: 1, source: user },
  highSpeed: { low: 0.05, high: 1, scale: 0.1, weight: 1, source: user },
  roadTireLoad: { low: null, high: 1, scale: 0.1, weight: 1, source: user },
  curbPeakAccel: { low: null, high: 500, scale: 10, weight: 1, source: user },
  airborneTime: { low: null, high: 1, scale: 0.01, weight: 1, source: user },
  bumpStopContact: { low: null, high: 1.5, scale: 0.01, weight: 1, source: user },
};

describe('valving ranking', () => {
  const curves = syntheticCurves();
  const job = valvingJobOf(
    curves,
    [
      { position: 'FL', corner: PLAIN_CORNER },
      { position: 'RL', corner: { ...PLAIN_CORNER, springRate: 90_000 } },
    ],
    VALVING_PRESETS['track-day'].scenario,
  );
  const figures = valvingSweepSerial(job);

  it('picks the one click that meets every target, on a damper built so that one does', () => {
    expect(zeta(6000 - 800 * 2)).toBeCloseTo(0.4668, 4);
    expect(zeta(9000 - 1000 * 3)).toBeCloseTo(0.6366, 4);
    const fl = valvingRank(job, curves, figures, TARGETS, { best: 3 }).corners[0];
    const best = fl?.best[0];
    expect(best?.clicks).toEqual({ bump: 2, rebound: 3 });
    expect(best).toMatchObject({ rank: 1, score: 0, missed: 0, source: 'measured', runIds: [23] });
    expect(best?.checks.every((c) => c.met)).toBe(true);
    expect(fl?.meetingAll).toBe(1);
    // Every other combination misses something, and the runners-up miss by the least.
    for (const p of fl?.best.slice(1) ?? []) {
      expect(p.score).toBeGreaterThan(0);
      expect(p.missed).toBeGreaterThan(0);
    }
    expect(fl?.best.map((p) => p.rank)).toEqual([1, 2, 3]);
  });

  it('shows one click either way on each adjuster, with the figures' + "' change", () => {
    const best = valvingRank(job, curves, figures, TARGETS).corners[0]?.best[0];
    expect(best?.sensitivity.map((s) => [s.adjuster, s.direction, s.clicks])).toEqual([
      ['bump', -1, { bump: 1, rebound: 3 }],
      ['bump', 1, { bump: 3, rebound: 3 }],
      ['rebound', -1, { bump: 2, rebound: 2 }],
      ['rebound', 1, { bump: 2, rebound: 4 }],
    ]);
    const softerBump = best?.sensitivity[1];
    // One bump click softer: 800 N·s/m less at the damper, 800 × 0.81 / 7634.6 = −0.0849 in ζ [calc].
    expect(softerBump?.change?.zetaBump).toBeCloseTo(-0.0849, 4);
    expect(softerBump?.change?.zetaRebound).toBeCloseTo(0, 12);
    expect(softerBump?.score).toBeGreaterThan(0);
    // At the end of the range only one direction exists.
    const corner = valvingRank(job, curves, figures, {
      bumpLowSpeed: { ...TARGETS.bumpLowSpeed!, low: 0.7, high: 0.9 },
    }).corners[0]?.best[0];
    expect(corner?.clicks.bump).toBe(0);
    expect(corner?.sensitivity.filter((s) => s.adjuster === 'bump').map((s) => s.direction)).toEqual([1]);
  });

  it('ranks the clicks the corner runs now among the rest', () => {
    const r = valvingRank(job, curves, figures, TARGETS, {
      current: [
        { bump: 2, rebound: 3 },
        { bump: 9, rebound: 9 },
      ],
    });
    expect(r.corners[0]?.current).toMatchObject({ rank: 1, clicks: { bump: 2, rebound: 3 } });
    // Clicks not on the map: nothing to rank.
    expect(r.corners[1]?.current).toBeNull();
  });

  it('follows the weights: a target at weight 0 no longer decides', () => {
    const loose: ValvingTargets = { ...TARGETS, bumpLowSpeed: { ...TARGETS.bumpLowSpeed!, weight: 0 } };
    const fl = valvingRank(job, curves, figures, loose, { best: 5 }).corners[0];
    // Rebound 3 with any bump click now scores 0; centring, then grid order, splits them.
    expect(fl?.best.filter((p) => p.score === 0).map((p) => p.clicks.rebound)).toEqual([3, 3, 3, 3, 3]);
    expect(fl?.meetingAll).toBe(1);
  });

  it('gives the front/rear balance of the best picks', () => {
    const r = valvingRank(job, curves, figures, TARGETS);
    const b = r.balance;
    expect(b?.front.positions).toEqual(['FL']);
    expect(b?.rear.positions).toEqual(['RL']);
    // The stiffer rear spring (90 vs 70 N/mm, same masses): ride frequency rises with √(ride rate) [calc].
    const rideRate = (k: number) => (k * MR2 * 240_000) / (k * MR2 + 240_000);
    expect(b?.ratio.rideFrequency).toBeCloseTo(Math.sqrt(rideRate(90_000) / rideRate(70_000)), 9);
    expect(b?.flatRide).toMatchObject({ low: 1.1, high: 1.2, met: true, source: { tag: 'trade' } });
    expect(r.objective).toMatch(/^score = Σ weight × \(miss ÷ scale\)²/);
    expect(valvingBalanceOf([{ position: 'FL', figures: figures[0]?.[0] as never }])).toBeNull();
  });

  it('warns when the best pick sits at the stiffest or softest click on the map', () => {
    // Bump click 0 is the stiffest (6000 N·s/m), click 4 the softest (2800 N·s/m).
    const stiff = valvingRank(job, curves, figures, {
      bumpLowSpeed: { ...TARGETS.bumpLowSpeed!, low: 0.7, high: 0.9 },
    }).corners[0]?.best[0];
    expect(stiff?.clicks.bump).toBe(0);
    const atEnd = stiff?.warnings.find((w) => w.code === 'best-at-range-end-bump');
    expect(atEnd?.message).toMatch(
      /^The best pick is at the stiffest of the bump clicks on the map \(bump 0\)/,
    );
    expect(atEnd?.message).toMatch(/range may be too narrow; check the maker's adjuster range/);
    const soft = valvingRank(job, curves, figures, {
      bumpLowSpeed: { low: 0, high: 0.3, scale: 0.1, weight: 1, source: user },
    }).corners[0];
    expect(soft?.best[0]?.warnings.find((w) => w.code === 'best-at-range-end-bump')?.message).toMatch(
      /the softest of the bump clicks on the map \(bump 4\)/,
    );
    // Only the best pick is warned; a pick inside the range is not.
    expect(soft?.best[1]?.warnings.some((w) => w.code.startsWith('best-at-range-end'))).toBe(false);
    const inside = valvingRank(job, curves, figures, TARGETS).corners[0]?.best[0];
    expect(inside?.clicks).toEqual({ bump: 2, rebound: 3 });
    expect(inside?.warnings.some((w) => w.code.startsWith('best-at-range-end'))).toBe(false);
  });

  it('names a step in clicks where only some clicks were measured', () => {
    // Runs at bump 6 and 12 only: one step on the map from 6 is six clicks.
    const sparse: Pick<ValvingCurves, 'axes' | 'cells'> = {
      axes: [
        { adjuster: 'bump', clicks: [6, 12], measured: [6, 12] },
        { adjuster: 'rebound', clicks: [6, 12], measured: [6, 12] },
      ],
      cells: [6, 12].flatMap((b) =>
        [6, 12].map((r) =>
          cellOf(
            { bump: b, rebound: r },
            bilinear(6000 - 300 * b, 0.06, 2000),
            bilinear(9000 - 300 * r, 0.06, 3000),
          ),
        ),
      ),
    };
    const sparseJob = valvingJobOf(sparse, [{ position: 'FL', corner: PLAIN_CORNER }], job.scenario);
    const pick = valvingRank(sparseJob, sparse, valvingSweepSerial(sparseJob), TARGETS).corners[0]?.best.find(
      (p) => p.clicks.bump === 6 && p.clicks.rebound === 12,
    );
    expect(pick?.sensitivity.map((s) => valvingStepText(s, pick.clicks))).toEqual([
      'bump +6 clicks',
      'rebound −6 clicks',
    ]);
    expect(
      valvingStepText(
        { adjuster: 'reboundHighSpeed', clicks: { reboundHighSpeed: 3 } },
        { reboundHighSpeed: 4 },
      ),
    ).toBe('high-speed rebound −1 click');
  });

  it('carries the model warnings of each pick', () => {
    const soft = valvingRank(job, curves, figures, {
      bumpLowSpeed: { low: 0, high: 0.3, scale: 0.1, weight: 1, source: user },
    }).corners[0]?.best[0];
    expect(soft?.clicks.bump).toBe(4);
    expect(soft?.warnings.length).toBeGreaterThan(0);
    expect(soft?.warnings.every((w) => w.code && w.message)).toBe(true);
  });
});

describe('valving comparison', () => {
  it('compares two sheets corner by corner: b − a, targets and warnings', () => {
    const a = setupFileParse(setupFileFixture()).sheet;
    const raw = setupFileFixture();
    (raw.corners.FL.corner.damper as { rebound: { lowSpeed: string } }).rebound.lowSpeed = '7000 N*s/m';
    const b = setupFileParse(raw).sheet;
    const scenario = VALVING_PRESETS['track-day'].scenario;
    const c = valvingCompare(a, b, scenario, VALVING_PRESETS['track-day'].targets);
    expect(c.corners.map((x) => x.position)).toEqual(['FL', 'FR', 'RL', 'RR']);
    const fl = c.corners[0];
    // 1000 N·s/m more rebound at the damper: ζ rebound rises by 1000 × 0.81 / 2√(kw·ms) [calc].
    const ccrit = 2 * Math.sqrt(70_000 * 0.81 * (295 - 38));
    expect(fl?.change.zetaRebound).toBeCloseTo((1000 * 0.81) / ccrit, 9);
    expect(fl?.change.zetaBump).toBe(0);
    expect(c.corners[1]?.change.zetaRebound).toBe(0);
    expect(fl?.a.clicks).toEqual({ bump: 6, rebound: 6 });
    // The same figures a sweep computes for that corner.
    const job = valvingJobOf(
      { cells: [{ damper: b.corners.FL.analysis.damper }] },
      [{ position: 'FL', corner: b.corners.FL.analysis }],
      scenario,
    );
    expect(fl?.b.headline.bumpPeakAccel).toBe(valvingComboEvaluate(job, 0).bump.peakBodyAccel);
    expect(c.balance.a?.front.positions).toEqual(['FL', 'FR']);
    expect(fl?.b.score.checks.length).toBeGreaterThan(5);
  });
});
