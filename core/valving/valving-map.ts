import {
  CLICK_ADJUSTERS,
  clickSettingsText,
  type ClickAdjuster,
  type ClickSettings,
} from '../damper/click-settings';
import { cornerQuarterCar, cornerRideFigures, type CornerInput, type DampingClass } from '../corner/corner';
import type { BenchPoints } from '../damper/bench-trace';
import { benchDirectionTables } from '../damper/bench-fit';
import {
  damperDirectionSlopeCurve,
  damperDirectionSlopes,
  DAMPER_STRAIGHT_LINE_TOLERANCE,
  type DamperCurve,
  type DamperDirectionCurve,
} from '../damper/damper-curve';
import { InputError } from '../units/input-error';
import { modesOf } from '../corner/modal';

/** A direction's slopes as the map shows them: the bilinear (knee) form of the one rule. */
export type ValvingDirectionCurve = Extract<DamperDirectionCurve, { kind: 'bilinear' }>;

/**
 * One bench run as the map reads it: its clicker positions and the curve of each direction
 * (null where the run had too few points in that direction), at the damper — from the bench,
 * the table of its measured points (valvingRunOf).
 */
export type ValvingRun = {
  id: number;
  clicks: ClickSettings;
  bump: { curve: DamperDirectionCurve } | null;
  rebound: { curve: DamperDirectionCurve } | null;
};

/**
 * A bench run as the map reads it, from its stored points: each direction's measured table
 * (benchDirectionTables), the curve the events run on and the slopes are fitted to.
 */
export function valvingRunOf(id: number, clicks: ClickSettings, points: BenchPoints): ValvingRun {
  const t = benchDirectionTables(points);
  return {
    id,
    clicks,
    bump: t.bump ? { curve: t.bump } : null,
    rebound: t.rebound ? { curve: t.rebound } : null,
  };
}

/** One clicker adjuster of the map: every setting on the grid, and those measured on the bench. */
export type ValvingAxis = {
  adjuster: ClickAdjuster;
  /** The grid's settings, rising: the measured ones, or every whole click between them when interpolating. */
  clicks: number[];
  /** The settings some complete bench run was made at, rising. */
  measured: number[];
};

/** Where a cell's curves come from: a bench run at those clicks, or its measured neighbours. */
export type ValvingCellSource = 'measured' | 'interpolated';

/** The damper's curves at one click combination, at the damper shaft. */
export type ValvingCurveCell = {
  clicks: ClickSettings;
  source: ValvingCellSource;
  /** The run(s) the curves come from: the newest run at these clicks, or the measured neighbours. */
  runIds: number[];
  /** The curves themselves: a bench run's measured tables, or the blend of their fits where interpolated. */
  damper: { bump: DamperDirectionCurve; rebound: DamperDirectionCurve };
};

/**
 * A damper unit's curves over its click grid: the axes (the adjusters its runs record), the
 * cells that have curves (measured, or interpolated where allowed), and notes on runs left out.
 */
export type ValvingCurves = {
  axes: ValvingAxis[];
  cells: ValvingCurveCell[];
  interpolated: boolean;
  notes: string[];
};

/** A mode as the map shows it. */
export type ValvingMode = { frequencyHz: number; dampingRatio: number };

/** The linear figures of one cell on one corner (DESIGN.md, Conventions). */
export type ValvingCellFigures = {
  /** ζ = c·MRd² / 2√(kw·ms) for each slope, and the linear model's ζ of the mean low-speed slope. */
  dampingRatio: {
    bump: number;
    rebound: number;
    bumpHighSpeed: number;
    reboundHighSpeed: number;
    lowSpeedMean: number;
  };
  dampingClass: { bump: DampingClass; rebound: DampingClass };
  /** Knee shaft speed of each direction at the damper (m/s); null where the curve is one straight line. */
  kneeSpeed: { bump: number | null; rebound: number | null };
  /** Linearised modes (mean low-speed damping); null where the mode does not oscillate. */
  modes: { body: ValvingMode | null; wheelHop: ValvingMode | null; overdamped: number };
};

/** A cell of the map: its curves and its figures on the corner. */
export type ValvingMapCell = ValvingCurveCell & { figures: ValvingCellFigures };

/** The per-click damping map of a damper unit on one corner: a grid of cells, for a table or a heat map. */
export type ValvingMap = {
  axes: ValvingAxis[];
  cells: ValvingMapCell[];
  interpolated: boolean;
  notes: string[];
  /** Figures that do not depend on the clicks. */
  corner: { rideFrequencyHz: number; wheelHopFrequencyHz: number; criticalDamping: number };
};

const clickKey = (axes: readonly ClickAdjuster[], clicks: ClickSettings) =>
  axes.map((a) => clicks[a] ?? '').join(',');

/** The settings of `values`, rising, without repeats. */
const rising = (values: Iterable<number>) => [...new Set(values)].sort((a, b) => a - b);

const positive = (x: number) => Number.isFinite(x) && x > 0;

function curveCheck(curve: DamperDirectionCurve): boolean {
  switch (curve.kind) {
    case 'linear':
      return positive(curve.coefficient);
    case 'bilinear':
      return [curve.lowSpeed, curve.kneeSpeed, curve.highSpeed].every(positive);
    case 'table':
      return (
        curve.points.length > 0 &&
        curve.points.every((p) => positive(p.velocity) && Number.isFinite(p.force)) &&
        positive(damperDirectionSlopes(curve).lowSpeed)
      );
  }
}

/**
 * A blend of curves with weights summing to one, for a click no run measured: the bilinear
 * form whose low-speed slope, knee and high-speed slope are the weighted sums of the
 * neighbours' (their slope curves by the one rule, damperDirectionSlopeCurve). Blending the
 * tables' forces instead would give a curve with two knees whose fitted slopes can fall
 * outside both neighbours'; this keeps every slope between them.
 */
function curveBlend(parts: readonly { w: number; curve: DamperDirectionCurve }[]): DamperDirectionCurve {
  let lowSpeed = 0;
  let kneeSpeed = 0;
  let highSpeed = 0;
  for (const { w, curve } of parts) {
    const c = damperDirectionSlopeCurve(curve);
    lowSpeed += w * c.lowSpeed;
    kneeSpeed += w * c.kneeSpeed;
    highSpeed += w * c.highSpeed;
  }
  return { kind: 'bilinear', lowSpeed, kneeSpeed, highSpeed };
}

/**
 * The damper's curves over its click grid, from its bench runs' curves (their measured tables).
 *
 * The axes are the adjusters the runs record. At each click combination the newest run (the
 * highest id) with a fit of a direction gives that direction; a combination with both
 * directions is measured. With `interpolate`, every whole click between the lowest and highest
 * measured setting of each axis is on the grid, and a combination not measured gets curves
 * interpolated multilinearly (low-speed slope, knee and high-speed slope of the neighbours'
 * fits each linear in the clicks; see curveBlend) between the measured neighbours that enclose
 * it on every axis — only when all of them are measured, so nothing is ever extrapolated or
 * bridged over a gap.
 * @throws InputError naming `field` when no run gives a complete curve.
 */
export function valvingCurvesOf(
  runs: readonly ValvingRun[],
  options: { interpolate?: boolean } = {},
  field = 'damper',
): ValvingCurves {
  const notes: string[] = [];
  const adjusters = CLICK_ADJUSTERS.filter((a) => runs.some((r) => r.clicks[a] !== undefined));
  const usable = runs.filter((r) => {
    const missing = adjusters.filter((a) => r.clicks[a] === undefined);
    if (missing.length === 0) return true;
    notes.push(
      `run #${r.id} records no ${missing.join(' or ')} clicks while other runs do; it is left out of the map`,
    );
    return false;
  });
  type Side = { id: number; curve: DamperDirectionCurve };
  const byClicks = new Map<string, { clicks: ClickSettings; bump?: Side; rebound?: Side }>();
  for (const r of [...usable].sort((a, b) => a.id - b.id)) {
    const clicks: ClickSettings = {};
    for (const a of adjusters) clicks[a] = r.clicks[a] as number;
    const key = clickKey(adjusters, clicks);
    const entry = byClicks.get(key) ?? { clicks };
    for (const dir of ['bump', 'rebound'] as const) {
      const fit = r[dir];
      if (fit && curveCheck(fit.curve)) entry[dir] = { id: r.id, curve: fit.curve };
      else if (fit) notes.push(`run #${r.id} has an unusable ${dir} fit; it is not used for ${dir}`);
    }
    byClicks.set(key, entry);
  }
  const complete = new Map<string, ValvingCurveCell>();
  for (const [key, e] of byClicks) {
    if (!e.bump || !e.rebound) {
      const lacking = e.bump ? 'rebound' : 'bump';
      const where = clickSettingsText(e.clicks) || 'its setting';
      notes.push(`no run at ${where} has a ${lacking} curve; that setting is left out of the map`);
      continue;
    }
    complete.set(key, {
      clicks: e.clicks,
      source: 'measured',
      runIds: rising([e.bump.id, e.rebound.id]),
      damper: { bump: e.bump.curve, rebound: e.rebound.curve },
    });
  }
  if (complete.size === 0)
    throw new InputError(
      field,
      runs.length === 0
        ? 'has no bench runs (bench import FILE --damper LABEL adds them)'
        : 'has no bench run with both a bump and a rebound curve at the same clicks',
    );
  const measured = adjusters.map((a) => rising([...complete.values()].map((c) => c.clicks[a] as number)));
  const interpolated = options.interpolate === true;
  const axes: ValvingAxis[] = adjusters.map((adjuster, i) => {
    const m = measured[i] as number[];
    const lo = m[0] as number;
    const hi = m[m.length - 1] as number;
    const clicks = interpolated ? Array.from({ length: hi - lo + 1 }, (_, k) => lo + k) : m;
    return { adjuster, clicks, measured: m };
  });
  const cells: ValvingCurveCell[] = [];
  // Every combination of the axes' settings, the first axis slowest: a stable order for grids.
  const combos: ClickSettings[] = axes.reduce<ClickSettings[]>(
    (acc, axis) => acc.flatMap((c) => axis.clicks.map((v) => ({ ...c, [axis.adjuster]: v }))),
    [{}],
  );
  for (const clicks of combos) {
    const hit = complete.get(clickKey(adjusters, clicks));
    if (hit) {
      cells.push(hit);
      continue;
    }
    if (!interpolated) continue;
    const cell = cellInterpolated(axes, clicks, complete, adjusters);
    if (cell) cells.push(cell);
  }
  return { axes, cells, interpolated, notes };
}

/** The cell at `clicks` blended from the measured cells enclosing it, or null when one is missing. */
function cellInterpolated(
  axes: readonly ValvingAxis[],
  clicks: ClickSettings,
  complete: ReadonlyMap<string, ValvingCurveCell>,
  adjusters: readonly ClickAdjuster[],
): ValvingCurveCell | null {
  // Per axis: the measured settings below and above (equal when the click is measured) and the weight of the upper.
  const spans = axes.map((axis) => {
    const v = clicks[axis.adjuster] as number;
    if (axis.measured.includes(v)) return { lo: v, hi: v, t: 0 };
    const lo = Math.max(...axis.measured.filter((m) => m < v));
    const hi = Math.min(...axis.measured.filter((m) => m > v));
    return { lo, hi, t: (v - lo) / (hi - lo) };
  });
  let corners: { clicks: ClickSettings; w: number }[] = [{ clicks: {}, w: 1 }];
  axes.forEach((axis, i) => {
    const s = spans[i] as { lo: number; hi: number; t: number };
    corners = corners.flatMap((c) =>
      s.lo === s.hi
        ? [{ clicks: { ...c.clicks, [axis.adjuster]: s.lo }, w: c.w }]
        : [
            { clicks: { ...c.clicks, [axis.adjuster]: s.lo }, w: c.w * (1 - s.t) },
            { clicks: { ...c.clicks, [axis.adjuster]: s.hi }, w: c.w * s.t },
          ],
    );
  });
  const parts: { w: number; cell: ValvingCurveCell }[] = [];
  for (const c of corners) {
    const cell = complete.get(clickKey(adjusters, c.clicks));
    if (!cell) return null;
    parts.push({ w: c.w, cell });
  }
  return {
    clicks,
    source: 'interpolated',
    runIds: rising(parts.flatMap((p) => p.cell.runIds)),
    damper: {
      bump: curveBlend(parts.map((p) => ({ w: p.w, curve: p.cell.damper.bump }))),
      rebound: curveBlend(parts.map((p) => ({ w: p.w, curve: p.cell.damper.rebound }))),
    },
  };
}

/** The corner with its damper's bump and rebound curves replaced by `damper`'s (its gas force kept). */
export function valvingCornerWith(
  corner: CornerInput,
  damper: { bump: DamperDirectionCurve; rebound: DamperDirectionCurve },
): CornerInput {
  const curve: DamperCurve = { bump: damper.bump, rebound: damper.rebound };
  if (corner.damper.gasForce !== undefined) curve.gasForce = corner.damper.gasForce;
  return { ...corner, damper: curve };
}

/** A direction's knee by the one rule (damperDirectionSlopes); null for one straight line. */
function kneeOf(curve: DamperDirectionCurve): number | null {
  const s = damperDirectionSlopes(curve);
  const straight =
    s.kneeSpeed === null ||
    Math.abs(s.highSpeed - s.lowSpeed) <= DAMPER_STRAIGHT_LINE_TOLERANCE * Math.abs(s.lowSpeed);
  return straight ? null : s.kneeSpeed;
}

/** A cell's curves as the slopes of the one rule (damperDirectionSlopeCurve): what a map shows of them. */
export function valvingCellSlopes(damper: { bump: DamperDirectionCurve; rebound: DamperDirectionCurve }): {
  bump: ValvingDirectionCurve;
  rebound: ValvingDirectionCurve;
} {
  return { bump: damperDirectionSlopeCurve(damper.bump), rebound: damperDirectionSlopeCurve(damper.rebound) };
}

/**
 * The linear figures of a corner fitted with `damper` (DESIGN.md, Conventions): ζ of each
 * slope, c·MRd²/2√(kw·ms) (Milliken & Milliken, ch. 16, for the motion ratio), the linear
 * model's ζ of the mean low-speed slope, the knees, and the modes of the linearised quarter car.
 */
export function valvingCellFiguresOf(
  corner: CornerInput,
  damper: { bump: DamperDirectionCurve; rebound: DamperDirectionCurve },
): ValvingCellFigures {
  const c = valvingCornerWith(corner, damper);
  const f = cornerRideFigures(c);
  const q = cornerQuarterCar(c);
  const modes = modesOf(q);
  const mode = (m: { frequencyHz: number; dampingRatio: number } | undefined) =>
    m ? { frequencyHz: m.frequencyHz, dampingRatio: m.dampingRatio } : null;
  return {
    dampingRatio: { ...f.dampingRatio, lowSpeedMean: q.wheelDamping / f.criticalDamping },
    dampingClass: { ...f.dampingClass },
    kneeSpeed: { bump: kneeOf(damper.bump), rebound: kneeOf(damper.rebound) },
    modes: { body: mode(modes.body), wheelHop: mode(modes.wheelHop), overdamped: modes.overdamped.length },
  };
}

/** The per-click damping map of `curves` on `corner`: each cell's linear figures. */
export function valvingMapOf(curves: ValvingCurves, corner: CornerInput): ValvingMap {
  const f = cornerRideFigures(corner);
  return {
    axes: curves.axes,
    cells: curves.cells.map((cell) => ({ ...cell, figures: valvingCellFiguresOf(corner, cell.damper) })),
    interpolated: curves.interpolated,
    notes: curves.notes,
    corner: {
      rideFrequencyHz: f.rideFrequencyHz,
      wheelHopFrequencyHz: f.wheelHopFrequencyHz,
      criticalDamping: f.criticalDamping,
    },
  };
}

/** The index of the cell at `clicks` (every axis given, nothing else), or −1 when the grid has none there. */
export function valvingCellIndex(map: Pick<ValvingCurves, 'axes' | 'cells'>, clicks: ClickSettings): number {
  const adjusters = map.axes.map((a) => a.adjuster);
  if (CLICK_ADJUSTERS.some((a) => clicks[a] !== undefined && !adjusters.includes(a))) return -1;
  const key = clickKey(adjusters, clicks);
  return map.cells.findIndex((c) => clickKey(adjusters, c.clicks) === key);
}
