import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/units/input-error';
import {
  valvingCellIndex,
  valvingCellSlopes,
  valvingCurvesOf,
  valvingMapOf,
  type ValvingCurveCell,
  type ValvingRun,
} from '../../../core/valving/valving-map';
import { inputErrorOf } from '../../input-error-fixture';
import { benchRunOf, bilinear, bilinearForce, PLAIN_CORNER } from '../valving-fixture';

const linear = (c: number) => (v: number) => c * v;

/** A cell's slopes by the one rule (the least-squares bilinear fit of its curves). */
const slopesOf = (cell: ValvingCurveCell | undefined) => valvingCellSlopes((cell as ValvingCurveCell).damper);

/** A grid of runs, bump × rebound clicks, each click softening the low-speed slope by `step`. */
function gridRuns(
  bumps: number[],
  rebounds: number[],
  skip: (b: number, r: number) => boolean = () => false,
) {
  const runs: ValvingRun[] = [];
  let id = 1;
  for (const b of bumps)
    for (const r of rebounds) {
      if (skip(b, r)) continue;
      runs.push(
        benchRunOf(
          id++,
          { bump: b, rebound: r },
          bilinearForce(bilinear(4000 - 200 * b, 0.06, 1500 - 50 * b)),
          bilinearForce(bilinear(7000 - 300 * r, 0.06, 2500 - 80 * r)),
        ),
      );
    }
  return runs;
}

describe('valving map: ζ per click', () => {
  it('reproduces hand-computed ζ = c·MR²/(2√(kw·ms)) for a linear-damper bench run', () => {
    const runs = [benchRunOf(7, { bump: 3, rebound: 5 }, linear(4000), linear(6000))];
    const map = valvingMapOf(valvingCurvesOf(runs), PLAIN_CORNER);
    const cell = map.cells[0];
    // Hand computation [calc]: kw = 70 000 × 0.9² = 56 700 N/m, ms = 295 − 38 = 257 kg,
    // c_crit = 2√(56 700 × 257) = 7634.632 N·s/m; wheel damping = c × MR² (Milliken & Milliken,
    // Race Car Vehicle Dynamics ch. 16 [mem]): ζ bump = 4000 × 0.81 / 7634.632 = 0.424382,
    // ζ rebound = 6000 × 0.81 / 7634.632 = 0.636573, linear model's mean 0.530477.
    expect(map.corner.criticalDamping).toBeCloseTo(7634.632, 2);
    expect(cell?.figures.dampingRatio.bump).toBeCloseTo(0.424382, 5);
    expect(cell?.figures.dampingRatio.rebound).toBeCloseTo(0.636573, 5);
    // A straight line has the same slope at high speed, and no knee to speak of.
    expect(cell?.figures.dampingRatio.bumpHighSpeed).toBeCloseTo(0.424382, 5);
    expect(cell?.figures.dampingRatio.reboundHighSpeed).toBeCloseTo(0.636573, 5);
    expect(cell?.figures.dampingRatio.lowSpeedMean).toBeCloseTo(0.530477, 5);
    expect(cell?.figures.kneeSpeed).toEqual({ bump: null, rebound: null });
    expect(cell).toMatchObject({ clicks: { bump: 3, rebound: 5 }, source: 'measured', runIds: [7] });
    expect(cell?.figures.dampingClass).toEqual({ bump: 'underdamped', rebound: 'underdamped' });
  });

  it('gives each cell the body and wheel-hop modes of the linearised quarter car', () => {
    const map = valvingMapOf(
      valvingCurvesOf([benchRunOf(1, { rebound: 0 }, linear(4000), linear(6000))]),
      PLAIN_CORNER,
    );
    const modes = map.cells[0]?.figures.modes;
    // Two complex pairs for ζ ≈ 0.5 on this corner: body below 3 Hz, wheel hop near √((kw+kt)/mu)/2π = 14.2 Hz [calc].
    expect(modes?.body?.frequencyHz).toBeGreaterThan(1.5);
    expect(modes?.body?.frequencyHz).toBeLessThan(3);
    expect(modes?.wheelHop?.frequencyHz).toBeGreaterThan(12);
    expect(modes?.overdamped).toBe(0);
    expect(map.corner.wheelHopFrequencyHz).toBeCloseTo(Math.sqrt((56_700 + 240_000) / 38) / (2 * Math.PI), 9);
  });

  it('keeps the knee and both slopes of a bilinear run', () => {
    const runs = [
      benchRunOf(
        1,
        { bump: 0, rebound: 0 },
        bilinearForce(bilinear(3000, 0.06, 1000)),
        bilinearForce(bilinear(6000, 0.06, 2000)),
      ),
    ];
    const cell = valvingMapOf(valvingCurvesOf(runs), PLAIN_CORNER).cells[0];
    // The fit of noise-free bilinear points recovers the curve [calc: least squares of exact data].
    expect(slopesOf(cell).bump.lowSpeed).toBeCloseTo(3000, 3);
    expect(slopesOf(cell).bump.highSpeed).toBeCloseTo(1000, 3);
    expect(cell?.figures.kneeSpeed.bump).toBeCloseTo(0.06, 6);
    expect(cell?.figures.dampingRatio.bumpHighSpeed).toBeCloseTo((1000 * 0.81) / 7634.632, 5);
  });

  it('holds the measured clicks only, unless interpolation is allowed', () => {
    const runs = gridRuns([0, 3, 6], [0, 4]);
    const measured = valvingCurvesOf(runs);
    expect(measured.axes).toEqual([
      { adjuster: 'bump', clicks: [0, 3, 6], measured: [0, 3, 6] },
      { adjuster: 'rebound', clicks: [0, 4], measured: [0, 4] },
    ]);
    expect(measured.cells).toHaveLength(6);
    expect(measured.cells.every((c) => c.source === 'measured')).toBe(true);
    const filled = valvingCurvesOf(runs, { interpolate: true });
    expect(filled.axes[0]?.clicks).toEqual([0, 1, 2, 3, 4, 5, 6]);
    expect(filled.cells).toHaveLength(7 * 5);
    expect(filled.cells.filter((c) => c.source === 'measured')).toHaveLength(6);
    // First axis slowest: a stable order for a grid.
    expect(filled.cells.slice(0, 6).map((c) => c.clicks)).toEqual([
      { bump: 0, rebound: 0 },
      { bump: 0, rebound: 1 },
      { bump: 0, rebound: 2 },
      { bump: 0, rebound: 3 },
      { bump: 0, rebound: 4 },
      { bump: 1, rebound: 0 },
    ]);
  });

  it('interpolates between the measured neighbours, linearly in the clicks, and names them', () => {
    const runs = gridRuns([0, 3], [0, 4]);
    const curves = valvingCurvesOf(runs, { interpolate: true });
    const at = (b: number, r: number) => curves.cells[valvingCellIndex(curves, { bump: b, rebound: r })];
    const lo = at(0, 0);
    const hi = at(3, 0);
    const mid = at(1, 0);
    expect(mid?.source).toBe('interpolated');
    expect(mid?.runIds).toEqual([lo?.runIds[0], hi?.runIds[0]].sort((a, b) => (a as number) - (b as number)));
    // One third of the way from click 0 to click 3 [calc].
    const third = (x: number, y: number) => x + (y - x) / 3;
    expect(slopesOf(mid).bump.lowSpeed).toBeCloseTo(
      third(slopesOf(lo).bump.lowSpeed as number, slopesOf(hi).bump.lowSpeed as number),
      9,
    );
    expect(slopesOf(mid).bump.highSpeed).toBeCloseTo(
      third(slopesOf(lo).bump.highSpeed as number, slopesOf(hi).bump.highSpeed as number),
      9,
    );
    // Both axes between measured settings: the four corners, bilinearly [calc].
    const centre = at(1, 2);
    const corners = [at(0, 0), at(0, 4), at(3, 0), at(3, 4)];
    const w = [(2 / 3) * 0.5, (2 / 3) * 0.5, (1 / 3) * 0.5, (1 / 3) * 0.5];
    const expected = corners.reduce(
      (s, c, i) => s + (w[i] as number) * (slopesOf(c).rebound.lowSpeed as number),
      0,
    );
    expect(slopesOf(centre).rebound.lowSpeed).toBeCloseTo(expected, 9);
    expect(centre?.runIds).toHaveLength(4);
  });

  it('never extrapolates nor bridges a setting that was not measured', () => {
    // (3, 4) was not measured: cells that need it as a neighbour stay off the map.
    const runs = gridRuns([0, 3, 6], [0, 4], (b, r) => b === 3 && r === 4);
    const curves = valvingCurvesOf(runs, { interpolate: true });
    expect(valvingCellIndex(curves, { bump: 3, rebound: 4 })).toBe(-1);
    expect(valvingCellIndex(curves, { bump: 2, rebound: 2 })).toBe(-1);
    expect(valvingCellIndex(curves, { bump: 4, rebound: 4 })).toBe(-1);
    // Between the measured (3, 0) and (6, 0) it is still whole.
    expect(valvingCellIndex(curves, { bump: 4, rebound: 0 })).toBeGreaterThanOrEqual(0);
    // Nothing beyond the measured range: the grid stops at the last measured click.
    expect(curves.axes[0]?.clicks.at(-1)).toBe(6);
    expect(valvingCellIndex(curves, { bump: 7, rebound: 0 })).toBe(-1);
    expect(valvingCellIndex(curves, { bump: 0, rebound: 0, bumpHighSpeed: 1 })).toBe(-1);
  });

  it('takes the newest run at a setting, and says which runs it leaves out and why', () => {
    const older = benchRunOf(1, { bump: 0, rebound: 0 }, linear(3000), linear(5000));
    const newer = benchRunOf(2, { bump: 0, rebound: 0 }, linear(3500), linear(5500));
    const noClicks = benchRunOf(3, {}, linear(9000), linear(9000));
    const bumpOnly: ValvingRun = {
      ...benchRunOf(4, { bump: 3, rebound: 0 }, linear(2000), linear(4000)),
      rebound: null,
    };
    const broken: ValvingRun = {
      ...benchRunOf(5, { bump: 6, rebound: 0 }, linear(2000), linear(4000)),
      bump: { curve: bilinear(NaN, 0.05, 100) },
    };
    const curves = valvingCurvesOf([newer, older, noClicks, bumpOnly, broken]);
    expect(curves.cells).toHaveLength(1);
    expect(curves.cells[0]?.runIds).toEqual([2]);
    expect(slopesOf(curves.cells[0]).bump.lowSpeed).toBeCloseTo(3500, 3);
    expect(curves.notes.join('\n')).toMatch(/run #3 records no bump or rebound clicks/);
    expect(curves.notes.join('\n')).toMatch(/no run at bump 3 rebound 0 has a rebound curve/);
    expect(curves.notes.join('\n')).toMatch(/run #5 has an unusable bump fit/);
  });

  it('maps a single-adjustable damper along its one axis', () => {
    const runs = [0, 4, 8].map((r, i) =>
      benchRunOf(i + 1, { rebound: r }, linear(3000), linear(7000 - 400 * r)),
    );
    const map = valvingMapOf(valvingCurvesOf(runs, { interpolate: true }), PLAIN_CORNER);
    expect(map.axes.map((a) => a.adjuster)).toEqual(['rebound']);
    expect(map.cells).toHaveLength(9);
    const zeta = map.cells.map((c) => c.figures.dampingRatio.rebound);
    for (let i = 1; i < zeta.length; i++) expect(zeta[i]).toBeLessThan(zeta[i - 1] as number);
  });

  it('refuses a damper with no usable run, naming the field', () => {
    expect(inputErrorOf(() => valvingCurvesOf([])).message).toMatch(/^damper: has no bench runs/);
    const bumpOnly: ValvingRun = { ...benchRunOf(1, { bump: 0 }, linear(1), linear(1)), rebound: null };
    expect(inputErrorOf(() => valvingCurvesOf([bumpOnly], {}, 'bench')).message).toMatch(
      /^bench: has no bench run with both a bump and a rebound curve/,
    );
    expect(() => valvingCurvesOf([])).toThrow(InputError);
  });
});

describe('valving map: properties', () => {
  const corner = fc.record({
    cornerMass: fc.double({ min: 150, max: 700, noNaN: true }),
    unsprungFraction: fc.double({ min: 0.05, max: 0.25, noNaN: true }),
    springRate: fc.double({ min: 20_000, max: 300_000, noNaN: true }),
    motionRatio: fc.double({ min: 0.4, max: 1.2, noNaN: true }),
  });
  const curve = fc.record({
    low: fc.double({ min: 500, max: 12_000, noNaN: true }),
    knee: fc.double({ min: 0.03, max: 0.15, noNaN: true }),
    high: fc.double({ min: 200, max: 6000, noNaN: true }),
  });

  it('a stiffer click never gives a lower low-speed ζ when its curves are stiffer', () => {
    fc.assert(
      fc.property(
        corner,
        curve,
        curve,
        fc.double({ min: 1, max: 3, noNaN: true }),
        fc.double({ min: 0, max: 2000, noNaN: true }),
        (k, b, r, scale, bleed) => {
          const c = {
            ...PLAIN_CORNER,
            cornerMass: k.cornerMass,
            unsprungMass: k.cornerMass * k.unsprungFraction,
            springRate: k.springRate,
            springMotionRatio: k.motionRatio,
            damperMotionRatio: k.motionRatio,
          };
          const soft = { bump: bilinear(b.low, b.knee, b.high), rebound: bilinear(r.low, r.knee, r.high) };
          // Click 0 (full stiff): every force scaled up and a linear bleed added — stiffer at every speed.
          const stiffer = (d: typeof soft.bump) => (v: number) => scale * bilinearForce(d)(v) + bleed * v;
          const runs = [
            benchRunOf(1, { bump: 0, rebound: 0 }, stiffer(soft.bump), stiffer(soft.rebound)),
            benchRunOf(2, { bump: 1, rebound: 1 }, bilinearForce(soft.bump), bilinearForce(soft.rebound)),
          ];
          const map = valvingMapOf(valvingCurvesOf(runs, { interpolate: true }), c);
          const z0 = map.cells[valvingCellIndex(map, { bump: 0, rebound: 0 })]?.figures.dampingRatio;
          const z1 = map.cells[valvingCellIndex(map, { bump: 1, rebound: 1 })]?.figures.dampingRatio;
          const slack = 1e-9;
          expect(z0?.bump).toBeGreaterThanOrEqual((z1?.bump as number) * (1 - slack));
          expect(z0?.rebound).toBeGreaterThanOrEqual((z1?.rebound as number) * (1 - slack));
          expect(z0?.lowSpeedMean).toBeGreaterThanOrEqual((z1?.lowSpeedMean as number) * (1 - slack));
        },
      ),
      { numRuns: 60 },
    );
  });

  it('an interpolated click lies between its measured neighbours', () => {
    fc.assert(
      fc.property(curve, curve, fc.integer({ min: 2, max: 8 }), (a, b, gap) => {
        const runs = [
          benchRunOf(1, { rebound: 0 }, linear(3000), bilinearForce(bilinear(a.low, a.knee, a.high))),
          benchRunOf(2, { rebound: gap }, linear(3000), bilinearForce(bilinear(b.low, b.knee, b.high))),
        ];
        const map = valvingMapOf(valvingCurvesOf(runs, { interpolate: true }), PLAIN_CORNER);
        const ends = [map.cells[0], map.cells[gap]].map((c) => c?.figures.dampingRatio.rebound as number);
        const [lo, hi] = [Math.min(...ends), Math.max(...ends)];
        for (const c of map.cells.slice(1, gap)) {
          expect(c.source).toBe('interpolated');
          expect(c.figures.dampingRatio.rebound).toBeGreaterThanOrEqual(lo * (1 - 1e-12));
          expect(c.figures.dampingRatio.rebound).toBeLessThanOrEqual(hi * (1 + 1e-12));
        }
      }),
      { numRuns: 60 },
    );
  });
});
