import { describe, expect, it } from 'vitest';
import {
  valvingCellSlopes,
  valvingCurvesOf,
  valvingMapOf,
  type ValvingRun,
} from '../../core/valving/valving-map';
import { heatMapGrid } from '../../app/renderer/valving-model';

const side = (lowSpeed: number) => ({
  curve: { kind: 'bilinear' as const, lowSpeed, kneeSpeed: 0.08, highSpeed: lowSpeed / 3 },
});
const run = (id: number, clicks: ValvingRun['clicks']): ValvingRun => ({
  id,
  clicks,
  // Firmer with each click, so that every cell's ζ differs and a misplaced cell shows.
  bump: side(1500 + 100 * (clicks.bump ?? 0)),
  rebound: side(3000 + 150 * (clicks.rebound ?? 0) + 10 * (clicks.bumpHighSpeed ?? 0)),
});
const CORNER = {
  cornerMass: 300,
  unsprungMass: 40,
  springRate: 70_000,
  springMotionRatio: 0.9,
  damperMotionRatio: 0.9,
  tireRate: 250_000,
  damper: {
    bump: { kind: 'linear' as const, coefficient: 2000 },
    rebound: { kind: 'linear' as const, coefficient: 4000 },
  },
};
/** The map as the API gives it to the page: each cell's damper as its slopes. */
const mapOf = (runs: ValvingRun[], interpolate = false) => {
  const map = valvingMapOf(
    valvingCurvesOf(runs, { interpolate }),
    CORNER as Parameters<typeof valvingMapOf>[1],
  );
  return { ...map, cells: map.cells.map((c) => ({ ...c, damper: valvingCellSlopes(c.damper) })) };
};
const clicksOf = (grid: NonNullable<ReturnType<typeof heatMapGrid>>) =>
  grid.cells.map((row) => row.map((c) => (c ? `${c.clicks.bump}/${c.clicks.rebound}` : null)));

describe('heatMapGrid', () => {
  it('puts each cell of a sparse click grid in the row and column of its own clicks', () => {
    // Runs only at bump 6 / rebound 6 and 12 / 12: the other two combinations have no data.
    const grid = heatMapGrid(mapOf([run(1, { bump: 6, rebound: 6 }), run(2, { bump: 12, rebound: 12 })]));
    expect(grid?.rows.clicks).toEqual([6, 12]);
    expect(grid?.cols?.clicks).toEqual([6, 12]);
    expect(clicksOf(grid!)).toEqual([
      ['6/6', null],
      [null, '12/12'],
    ]);
  });

  it('places a full grid and a grid with one hole alike', () => {
    const runs = [
      run(1, { bump: 2, rebound: 4 }),
      run(2, { bump: 2, rebound: 8 }),
      run(3, { bump: 5, rebound: 8 }),
    ];
    expect(clicksOf(heatMapGrid(mapOf(runs))!)).toEqual([
      ['2/4', '2/8'],
      [null, '5/8'],
    ]);
    const full = heatMapGrid(mapOf([...runs, run(4, { bump: 5, rebound: 4 })]))!;
    expect(clicksOf(full)).toEqual([
      ['2/4', '2/8'],
      ['5/4', '5/8'],
    ]);
  });

  it('leaves the interpolated grid where nothing encloses a click empty, in the right places', () => {
    // Interpolating 6/6 and 12/12 alone finds no enclosing square: only the two measured cells.
    const grid = heatMapGrid(
      mapOf([run(1, { bump: 6, rebound: 6 }), run(2, { bump: 12, rebound: 12 })], true),
    )!;
    expect(grid.rows.clicks).toHaveLength(7);
    const placed = grid.cells.flatMap((row, i) =>
      row.flatMap((c, j) =>
        c ? [[grid.rows.clicks[i], grid.cols?.clicks[j], c.clicks.bump, c.clicks.rebound]] : [],
      ),
    );
    expect(placed).toEqual([
      [6, 6, 6, 6],
      [12, 12, 12, 12],
    ]);
  });

  it('draws a map of three adjusters at one setting of the third', () => {
    const runs = [
      run(1, { bump: 1, rebound: 1, bumpHighSpeed: 3 }),
      run(2, { bump: 1, rebound: 1, bumpHighSpeed: 5 }),
      run(3, { bump: 2, rebound: 1, bumpHighSpeed: 5 }),
    ];
    const map = mapOf(runs);
    const first = heatMapGrid(map)!;
    expect(first.at).toEqual({ bumpHighSpeed: 3 });
    expect(first.cells.map((row) => row.map((c) => c?.clicks.bumpHighSpeed ?? null))).toEqual([[3], [null]]);
    const fifth = heatMapGrid(map, { bumpHighSpeed: 5 })!;
    expect(fifth.cells.map((row) => row.map((c) => c?.clicks.bump ?? null))).toEqual([[1], [2]]);
  });

  it('has no grid for a map without axes', () => {
    expect(heatMapGrid({ axes: [], cells: [] })).toBeNull();
  });
});
