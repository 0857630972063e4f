import type Database from 'better-sqlite3';
import { damperUnitRuns, setupSheetResolve } from '../../../db/damper-resolve';
import { CAUTION_TEXT, VALVING_CAUTION_TEXT } from '../../../core/safety/caution';
import { InputError } from '../../../core/units/input-error';
import { CORNER_POSITIONS, type CornerPosition, type SetupSheet } from '../../../core/setup/setup-sheet';
import { valvingJobOf, valvingSettingsOf, type ValvingSettings } from '../../../core/valving/valving';
import { valvingCompare } from '../../../core/valving/valving-compare';
import type { ValvingFigures } from '../../../core/valving/valving-evaluate';
import {
  valvingCellSlopes,
  valvingCurvesOf,
  valvingMapOf,
  type ValvingCurves,
  type ValvingRun,
} from '../../../core/valving/valving-map';
import { VALVING_PRESET_NAMES, VALVING_PRESETS } from '../../../core/valving/valving-presets';
import { valvingBalanceOf, valvingRank } from '../../../core/valving/valving-rank';
import {
  VALVING_OBJECTIVE,
  VALVING_TARGET_KEYS,
  VALVING_TARGET_SPECS,
  type ValvingSource,
} from '../../../core/valving/valving-targets';
import { damperUnitResolve } from '../../../db/damper-units';

import type { SetupRevisionRow, VehicleRow } from '../../../db/rows';

import { setupRevisionResolve, setupSheetRead } from '../../../db/setup-store';
import { vehicleResolve } from '../../../db/vehicle-ref';
import type { ApiContext } from '../context';
import type { HandlerOutput, HandlerParsedInput } from '../contract';
import { valvingSweepParallel } from '../valving-pool';
import { vehicleJudgedScenario } from './vehicle';

/** A damper unit's bench runs as the map reads them: clicks and the measured tables of their points. */
function valvingRunsOf(
  db: Database.Database,
  label: string,
  field: string,
): { label: string; runs: ValvingRun[] } {
  const unit = damperUnitResolve(db, label, field);
  return { label: unit.label, runs: damperUnitRuns(db, unit.id) };
}

function curvesOf(db: Database.Database, label: string, interpolate: boolean, field: string) {
  const { label: name, runs } = valvingRunsOf(db, label, field);
  try {
    return { label: name, curves: valvingCurvesOf(runs, { interpolate }, field) };
  } catch (e) {
    if (e instanceof InputError) throw new InputError(e.field, `damper "${name}" ${e.problem}`);
    throw e;
  }
}

function revisionOf(
  db: Database.Database,
  ref: { vehicle: string | number; revision?: number | undefined },
  field = '',
): { v: VehicleRow; r: SetupRevisionRow; sheet: SetupSheet } {
  const at = (k: string) => (field ? `${field}.${k}` : k);
  const v = vehicleResolve(db, ref.vehicle, at('vehicle'));
  const r = setupRevisionResolve(db, v, ref.revision, at('revision'));
  return { v, r, sheet: setupSheetRead(db, r) };
}

/** The damper label a corner is judged with: the one asked for, else the unit the corner records. */
function damperLabelOf(
  sheet: SetupSheet,
  p: CornerPosition,
  given: string | undefined,
  revision: number,
): string {
  if (given !== undefined) return given;
  const recorded = sheet.corners[p].damperUnit;
  if (recorded === '')
    throw new InputError(
      'damper',
      `revision ${revision} records no damper unit at ${p}; name the damper whose bench runs to use (--damper LABEL)`,
    );
  return recorded;
}

function judgedOn(settings: ValvingSettings, scenarioSource: ValvingSource) {
  const p = settings.preset;
  return {
    preset: { name: p.name, title: p.title, use: p.use },
    scenario: settings.scenario,
    scenarioSource,
    targets: settings.targets,
    objective: VALVING_OBJECTIVE,
    caution: CAUTION_TEXT,
    valvingCaution: VALVING_CAUTION_TEXT,
  };
}

/** Handler `valvingPresets`: every preset with its scenario and bands (each with its source), and the targets there are. */
export function valvingPresetsHandler(): HandlerOutput<'valvingPresets'> {
  return {
    presets: VALVING_PRESET_NAMES.map((n) => VALVING_PRESETS[n]),
    targets: VALVING_TARGET_KEYS.map((key) => ({
      key,
      label: VALVING_TARGET_SPECS[key].label,
      kind: VALVING_TARGET_SPECS[key].kind,
    })),
    objective: VALVING_OBJECTIVE,
  };
}

/**
 * Handler `valvingMap`: a damper unit's per-click damping map on one corner of a revision —
 * each cell's ζ at low and high shaft speed in bump and rebound, knees and linearised modes,
 * measured or (when allowed) interpolated between measured neighbours, marked as such.
 */
export function valvingMapHandler(
  input: HandlerParsedInput<'valvingMap'>,
  { store }: ApiContext,
): HandlerOutput<'valvingMap'> {
  const { v, r, sheet } = revisionOf(store.db, input);
  const p = input.corner;
  const { label, curves } = curvesOf(
    store.db,
    damperLabelOf(sheet, p, input.damper, r.number),
    input.interpolate === true,
    'damper',
  );
  const map = valvingMapOf(curves, sheet.corners[p].analysis);
  return {
    vehicle: { id: v.id, name: v.name },
    revision: r.number,
    position: p,
    damper: label,
    ...map,
    // The slopes each cell's curves give by the one rule; the tables stay in core.
    cells: map.cells.map((c) => ({ ...c, damper: valvingCellSlopes(c.damper) })),
  };
}

/**
 * Handler `valvingChoose`: for each corner asked for, every click combination of its damper
 * unit's map (bench runs; interpolated clicks only when allowed) evaluated on the preset's
 * scenario — linear ζ figures, random road, bump and curb on the nonlinear quarter car with
 * the measured curve — across worker threads, then ranked against the targets: the best few
 * with why, their sensitivity one click either way, the current clicks, the front/rear
 * balance, the objective and the cautions. Reads only; stores nothing.
 */
export async function valvingChooseHandler(
  input: HandlerParsedInput<'valvingChoose'>,
  ctx: ApiContext,
): Promise<HandlerOutput<'valvingChoose'>> {
  const db = ctx.store.db;
  const preset = valvingSettingsOf(input.preset, input);
  const { v, r, sheet } = revisionOf(db, input);
  // The vehicle's own scenario, not the preset's: one scenario per vehicle on every screen.
  const judged = vehicleJudgedScenario(ctx.store, v, input.scenario);
  const settings = { ...preset, scenario: judged.scenario };
  const positions = CORNER_POSITIONS.filter((p) => input.corners.includes(p));
  // One sweep per damper unit, over the corners that use it.
  const groups = new Map<string, { label: string; curves: ValvingCurves; positions: CornerPosition[] }>();
  for (const p of positions) {
    const { label, curves } = curvesOf(
      db,
      damperLabelOf(sheet, p, input.damper, r.number),
      input.interpolate === true,
      'damper',
    );
    const g = groups.get(label) ?? { label, curves, positions: [] };
    g.positions.push(p);
    groups.set(label, g);
  }
  const total = [...groups.values()].reduce((n, g) => n + g.curves.cells.length * g.positions.length, 0);
  let before = 0;
  const corners: HandlerOutput<'valvingChoose'>['corners'] = [];
  const bestFigures: { position: string; figures: ValvingFigures }[] = [];
  for (const g of groups.values()) {
    const job = valvingJobOf(
      g.curves,
      g.positions.map((p) => ({ position: p, corner: sheet.corners[p].analysis })),
      settings.scenario,
    );
    const options = {
      // A kept pool belongs to a server whose thread must stay free to answer; a one-off call works here too.
      inThread: ctx.valvingPool === undefined,
      ...(ctx.signal ? { signal: ctx.signal } : {}),
      onProgress: (done: number) => ctx.onProgress?.(before + done, total),
    };
    const figures = ctx.valvingPool
      ? await ctx.valvingPool.sweep(job, options)
      : await valvingSweepParallel(
          job,
          input.threads === undefined ? options : { ...options, threads: input.threads },
        );
    before += job.cells.length * job.corners.length;
    const ranking = valvingRank(job, g.curves, figures, settings.targets, {
      best: input.best ?? 3,
      current: g.positions.map((p) => sheet.corners[p].clicks),
      units: input.units,
    });
    ranking.corners.forEach((c, k) => {
      corners.push({ ...c, position: g.positions[k] as CornerPosition, damper: g.label });
      const best = c.best[0];
      const f = best ? figures[k]?.[best.cell] : undefined;
      if (f) bestFigures.push({ position: c.position, figures: f });
    });
  }
  corners.sort((a, b) => CORNER_POSITIONS.indexOf(a.position) - CORNER_POSITIONS.indexOf(b.position));
  return {
    vehicle: { id: v.id, name: v.name },
    revision: r.number,
    ...judgedOn(settings, judged.source),
    dampers: [...groups.values()].map((g) => ({
      label: g.label,
      positions: g.positions,
      axes: g.curves.axes,
      cells: g.curves.cells.length,
      measured: g.curves.cells.filter((c) => c.source === 'measured').length,
      interpolated: g.curves.cells.filter((c) => c.source === 'interpolated').length,
      interpolate: g.curves.interpolated,
      notes: g.curves.notes,
    })),
    combinations: total,
    corners,
    balance: valvingBalanceOf(bestFigures),
  };
}

/**
 * Handler `setupCompare`: two revisions side by side on a preset's scenario — per corner the
 * headline figures of each (its damper as the corner runs it at its clicks), the change, the targets
 * each meets, the model's warnings — with the front/rear balance and the cautions.
 */
export function setupCompareHandler(
  input: HandlerParsedInput<'setupCompare'>,
  { store }: ApiContext,
): HandlerOutput<'setupCompare'> {
  const preset = valvingSettingsOf(input.preset, input);
  const a = revisionOf(store.db, input.a, 'a');
  const b = revisionOf(store.db, input.b, 'b');
  // Judged on the first revision's vehicle's scenario; each corner runs the damper curve of its
  // clicks (db/damper-resolve.ts), as on every screen.
  const judged = vehicleJudgedScenario(store, a.v, input.scenario);
  const settings = { ...preset, scenario: judged.scenario };
  const compared = valvingCompare(
    setupSheetResolve(store.db, a.sheet).sheet,
    setupSheetResolve(store.db, b.sheet).sheet,
    settings.scenario,
    settings.targets,
    input.units,
  );
  return {
    a: { vehicle: a.v.name, revision: a.r.number, name: a.r.name },
    b: { vehicle: b.v.name, revision: b.r.number, name: b.r.name },
    ...judgedOn(settings, judged.source),
    ...compared,
  };
}
