import type Database from 'better-sqlite3';

import { clickSettingsText, type ClickSettings } from '../core/damper/click-settings';
import { cornerRideFigures, type CornerInput } from '../core/corner/corner';
import { InputError } from '../core/units/input-error';
import { nameKey } from '../core/units/text-field';
import { numberFormat } from '../core/units/units';
import {
  valvingCellIndex,
  valvingCornerWith,
  valvingCurvesOf,
  valvingRunOf,
  type ValvingCurves,
  type ValvingRun,
} from '../core/valving/valving-map';
import type { ModelWarning } from '../core/corner/warnings';
import { CORNER_POSITIONS, type CornerPosition, type SetupSheet } from '../core/setup/setup-sheet';
import { benchPointsDecode } from './bench-points';
import { benchRunsWithPointsOfDamper } from './queries/bench-run';
import { damperUnitByKey } from './queries/damper-unit';
import { clickSettingsOfColumns } from './setup-rows';

/**
 * Where a corner's damper curve comes from: a bench run at the corner's clicks, curves
 * interpolated between the runs at the measured clicks around them, or the curve entered on
 * the sheet (when the damper unit has no bench run that covers the clicks — `text` says why).
 */
export type DamperCurveSource = {
  kind: 'bench' | 'interpolated' | 'entered';
  /** The damper unit the corner names ("" when none). */
  damper: string;
  clicks: ClickSettings;
  /** The bench runs the curve comes from (none for an entered curve). */
  runIds: number[];
  /** One line for the sheet: "bench run #12 of MB-DA-1, bump 3 rebound 9", "entered on the sheet; …". */
  text: string;
};

/** A corner's damper as the figures use it: the corner with that curve, its source, and a disagreement. */
export type CornerDamperResolved = {
  /** The corner's analysis input with the curve the figures use. */
  analysis: CornerInput;
  source: DamperCurveSource;
  /** When the entered curve gives a low-speed ζ more than 10 % from the bench's at these clicks. */
  warning: ModelWarning | null;
};

/** What a corner names: its entered analysis input, damper unit and clicks. */
export type CornerDamperRef = { analysis: CornerInput; damperUnit: string; clicks: ClickSettings };

/**
 * Relative difference of low-speed ζ between the entered curve and the bench's beyond which
 * the sheet flags the entered one: 10 %, about what one or two clicks move a typical
 * adjuster (our choice; the demo damper's clicks move ζ 5–15 % each).
 */
export const DAMPER_DISAGREEMENT = 0.1;

/**
 * The bench runs of a damper unit as the per-click map reads them: each run's measured table
 * (the one rule for a table, core/damper), so that the sheet, the map and `choose` run the
 * same curves in their events too.
 */
export function damperUnitRuns(db: Database.Database, unitId: number): ValvingRun[] {
  return benchRunsWithPointsOfDamper(db, unitId).map((r) =>
    valvingRunOf(r.id, clickSettingsOfColumns(r), benchPointsDecode(r.points)),
  );
}

/** The bench runs of a damper unit, or null when no unit has the label. */
function damperRunsOf(db: Database.Database, label: string): { label: string; runs: ValvingRun[] } | null {
  const unit = damperUnitByKey(db, nameKey(label));
  return unit ? { label: unit.label, runs: damperUnitRuns(db, unit.id) } : null;
}

type DamperLookup = { label: string; curves: ValvingCurves } | { label: string; why: string };

/** A damper unit's curves over its click grid (interpolated between measured clicks), or why there are none. */
function damperLookup(db: Database.Database, label: string): DamperLookup {
  const found = damperRunsOf(db, label);
  if (!found) return { label, why: `damper unit "${label}" is not in the bench library` };
  if (found.runs.length === 0) return { label: found.label, why: `${found.label} has no bench runs` };
  try {
    return { label: found.label, curves: valvingCurvesOf(found.runs, { interpolate: true }) };
  } catch (e) {
    if (e instanceof InputError) return { label: found.label, why: `${found.label} ${e.problem}` };
    throw e;
  }
}

const runsText = (ids: readonly number[]) => {
  const tags = ids.map((id) => `#${id}`);
  if (tags.length <= 1) return tags.join('');
  return `${tags.slice(0, -1).join(', ')} and ${tags.at(-1) as string}`;
};

/** Where the bench's clicks lie, "bump 0–12, rebound 0–12". */
function gridText(curves: ValvingCurves): string {
  return curves.axes
    .map((a) => {
      const lo = a.measured[0];
      const hi = a.measured.at(-1);
      return `${a.adjuster} ${lo === hi ? `${lo}` : `${lo}–${hi}`}`;
    })
    .join(', ');
}

function disagreementOf(
  entered: CornerInput,
  bench: CornerInput,
  source: DamperCurveSource,
): ModelWarning | null {
  const e = cornerRideFigures(entered).dampingRatio;
  const b = cornerRideFigures(bench).dampingRatio;
  const off = (x: number, y: number) => Math.abs(x - y) > DAMPER_DISAGREEMENT * Math.abs(y);
  if (!off(e.bump, b.bump) && !off(e.rebound, b.rebound)) return null;
  const z = (x: { bump: number; rebound: number }) =>
    `ζ bump ${numberFormat(x.bump, 2)}, rebound ${numberFormat(x.rebound, 2)}`;
  return {
    code: 'damper-entered-differs',
    field: 'corner.damper',
    message:
      `The entered damper curve gives ${z(e)}; the bench at these clicks gives ${z(b)} ` +
      `(${source.text}). The figures use the bench; check the clicks, or the entered curve.`,
  };
}

function cornerResolve(ref: CornerDamperRef, lookup: (label: string) => DamperLookup): CornerDamperResolved {
  const clicks = ref.clicks;
  const entered = (why: string): CornerDamperResolved => ({
    analysis: ref.analysis,
    source: {
      kind: 'entered',
      damper: ref.damperUnit,
      clicks,
      runIds: [],
      text: `entered on the sheet; ${why}`,
    },
    warning: null,
  });
  const label = ref.damperUnit.trim();
  if (label === '') return entered('no damper unit named');
  const found = lookup(label);
  if ('why' in found) return entered(found.why);
  const at = clickSettingsText(clicks);
  if (at === '') return entered(`no clicks recorded for ${found.label}`);
  const i = valvingCellIndex(found.curves, clicks);
  const cell = found.curves.cells[i];
  if (!cell)
    return entered(`the bench runs of ${found.label} (${gridText(found.curves)}) do not cover ${at}`);
  const measured = cell.source === 'measured';
  const runs = runsText(cell.runIds);
  const source: DamperCurveSource = {
    kind: measured ? 'bench' : 'interpolated',
    damper: found.label,
    clicks,
    runIds: cell.runIds,
    text: measured
      ? `bench run${cell.runIds.length > 1 ? 's' : ''} ${runs} of ${found.label}, ${at}`
      : `interpolated between bench runs ${runs} of ${found.label}, ${at}`,
  };
  const analysis = valvingCornerWith(ref.analysis, cell.damper);
  return { analysis, source, warning: disagreementOf(ref.analysis, analysis, source) };
}

/**
 * Which damper curve each given corner runs — the one place this is decided. A corner that
 * names a damper unit with bench runs at (or between) its clicks runs the bench curve there
 * (the run's fitted curve, or the map's interpolation between measured clicks); otherwise
 * the curve entered on the sheet, with the reason. The entered curve's gas force is kept.
 */
export function cornerDampersResolve<K extends string>(
  db: Database.Database,
  corners: Readonly<Record<K, CornerDamperRef>>,
): Record<K, CornerDamperResolved> {
  const cache = new Map<string, DamperLookup>();
  const lookup = (label: string) => {
    const key = nameKey(label);
    let hit = cache.get(key);
    if (!hit) {
      hit = damperLookup(db, label);
      cache.set(key, hit);
    }
    return hit;
  };
  const out = {} as Record<K, CornerDamperResolved>;
  for (const k of Object.keys(corners) as K[]) out[k] = cornerResolve(corners[k], lookup);
  return out;
}

/** A sheet whose corners run the resolved curves, and each corner's source and disagreement. */
export type SetupSheetResolved = {
  sheet: SetupSheet;
  dampers: Record<CornerPosition, Omit<CornerDamperResolved, 'analysis'>>;
};

/** `cornerDampersResolve` over a whole sheet: the sheet with each corner's analysis input resolved. */
export function setupSheetResolve(db: Database.Database, sheet: SetupSheet): SetupSheetResolved {
  const refs = {} as Record<CornerPosition, CornerDamperRef>;
  for (const p of CORNER_POSITIONS) refs[p] = sheet.corners[p];
  const resolved = cornerDampersResolve(db, refs);
  const corners = { ...sheet.corners };
  const dampers = {} as SetupSheetResolved['dampers'];
  for (const p of CORNER_POSITIONS) {
    const r = resolved[p];
    corners[p] = { ...sheet.corners[p], analysis: r.analysis };
    dampers[p] = { source: r.source, warning: r.warning };
  }
  return { sheet: { ...sheet, corners }, dampers };
}
