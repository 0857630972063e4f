import type { UnitSystem } from '../../../core/units/units';
import { headlineFiguresOf } from './analyze';
import { CAUTION_TEXT } from '../../../core/safety/caution';
import { cornerQuarterCar, cornerRideFigures } from '../../../core/corner/corner';
import { InputError } from '../../../core/units/input-error';
import { modesOf } from '../../../core/corner/modal';
import { cornerInputWarnings } from '../../../core/corner/plausible-range';
import { SETUP_FIGURE_LABELS, setupDiff } from '../../../core/setup/setup-diff';
import { setupFileParse, setupFileWrite } from '../../../core/setup/setup-file';
import { clickSettingsParse } from '../../../core/damper/click-settings';
import { cornerInputParse } from '../../../core/corner/corner-file';
import { damperCurveToFile } from '../../../core/damper/damper-curve';
import { CORNER_POSITIONS, type CornerPosition, type SetupSheet } from '../../../core/setup/setup-sheet';
import { cornerWarnings } from '../../../core/corner/warnings';
import type Database from 'better-sqlite3';
import { setupRevisionById, setupRevisionList } from '../../../db/queries/setup-revision';
import type { SetupRevisionRow, VehicleRow } from '../../../db/rows';
import {
  cornerDampersResolve,
  setupSheetResolve,
  type CornerDamperRef,
  type CornerDamperResolved,
} from '../../../db/damper-resolve';
import { setupRevisionResolve, setupSave, setupSheetRead } from '../../../db/setup-store';
import { vehicleResolve } from '../../../db/vehicle-ref';
import type { ApiContext } from '../context';
import type { HandlerOutput, HandlerParsedInput } from '../contract';
import { revisionListViewOf, revisionViewOf } from '../record-views';

type CornerWarning = HandlerOutput<'setupShow'>['warnings'][number];

type CornerDamper = HandlerOutput<'setupShow'>['dampers'][number];

/**
 * The model's warnings for each corner of a sheet whose damper curves are resolved, tagged
 * with the corner; first, where the entered damper curve disagrees with the bench's.
 */
function sheetWarnings(
  resolved: { sheet: SetupSheet; dampers: Record<CornerPosition, Pick<CornerDamperResolved, 'warning'>> },
  units: UnitSystem,
): CornerWarning[] {
  return CORNER_POSITIONS.flatMap((p) => {
    const c = resolved.sheet.corners[p].analysis;
    const own = resolved.dampers[p].warning;
    return [
      ...(own ? [own] : []),
      ...cornerInputWarnings(c, units),
      ...cornerWarnings(cornerRideFigures(c), modesOf(cornerQuarterCar(c)), undefined, units),
    ].map((w) => ({ position: p, ...w }));
  });
}

/** A resolved corner damper as the contract gives it: the source, the curve (SI file form), the warning. */
function cornerDamperOf(
  p: CornerPosition,
  r: Omit<CornerDamperResolved, 'analysis'>,
  analysis: SetupSheet['corners'][CornerPosition]['analysis'],
): CornerDamper {
  return {
    position: p,
    source: r.source,
    curve: damperCurveToFile(analysis.damper, 'si'),
    warning: r.warning,
  };
}

function parentNumberOf(db: Database.Database, r: SetupRevisionRow): number | null {
  return r.parent_id === null ? null : (setupRevisionById(db, r.parent_id)?.number ?? null);
}

/** Handler `setupSave`: a setup file becomes a new revision of its vehicle; nothing is overwritten. */
export function setupSaveHandler(
  input: HandlerParsedInput<'setupSave'>,
  { store }: ApiContext,
): HandlerOutput<'setupSave'> {
  const file = setupFileParse(input.file);
  const ref = input.vehicle ?? file.vehicle;
  if (ref === undefined)
    throw new InputError(
      'vehicle',
      'say which vehicle this setup is for: --vehicle NAME, or "vehicle" in the file',
    );
  const v = vehicleResolve(store.db, ref);
  if (input.vehicle !== undefined && file.vehicle !== undefined) {
    const fromFile = vehicleResolve(store.db, file.vehicle, 'vehicle (in the file)');
    if (fromFile.id !== v.id)
      throw new InputError(
        'vehicle',
        `the file is for "${fromFile.name}" but the vehicle given is "${v.name}"; nothing was saved`,
      );
  }
  const parentNumber = input.basedOnRevision ?? file.basedOnRevision;
  const saved = setupSave(store, v, file.sheet, {
    units: input.units,
    newDamperUnits: input.newDamperUnits ?? [],
    ...(parentNumber === undefined ? {} : { parentNumber }),
  });
  return {
    vehicle: { id: v.id, name: v.name },
    revision: revisionViewOf(saved.revision, saved.parentNumber),
    branched: saved.branched,
    dampersCreated: saved.dampersCreated,
  };
}

function revisionOf(
  db: Database.Database,
  ref: { vehicle: string | number; revision?: number | undefined },
  field: string,
): { v: VehicleRow; r: SetupRevisionRow } {
  const v = vehicleResolve(db, ref.vehicle, `${field}.vehicle`);
  return { v, r: setupRevisionResolve(db, v, ref.revision, `${field}.revision`) };
}

/** Handler `setupShow`: one revision as a setup file, with each corner's ride figures, warnings and the caution. */
export function setupShowHandler(
  input: HandlerParsedInput<'setupShow'>,
  { store }: ApiContext,
): HandlerOutput<'setupShow'> {
  const v = vehicleResolve(store.db, input.vehicle);
  const r = setupRevisionResolve(store.db, v, input.revision);
  const sheet = setupSheetRead(store.db, r);
  // The figures use the damper curve each corner runs at its clicks; the file keeps what was entered.
  const resolved = setupSheetResolve(store.db, sheet);
  const figures = {} as HandlerOutput<'setupShow'>['figures'];
  for (const p of CORNER_POSITIONS) {
    figures[p] = headlineFiguresOf(cornerRideFigures(resolved.sheet.corners[p].analysis));
  }
  return {
    vehicle: { id: v.id, name: v.name },
    revision: revisionViewOf(r, parentNumberOf(store.db, r)),
    file: setupFileWrite({ vehicle: v.name, basedOnRevision: r.number, sheet }, input.units),
    figures,
    dampers: CORNER_POSITIONS.map((p) =>
      cornerDamperOf(p, resolved.dampers[p], resolved.sheet.corners[p].analysis),
    ),
    warnings: sheetWarnings(resolved, input.units),
    caution: CAUTION_TEXT,
  };
}

/** Handler `setupHistory`: every revision of a vehicle, oldest first, with what changed in each. */
export function setupHistoryHandler(
  input: HandlerParsedInput<'setupHistory'>,
  { store }: ApiContext,
): HandlerOutput<'setupHistory'> {
  const v = vehicleResolve(store.db, input.vehicle);
  return {
    vehicle: { id: v.id, name: v.name },
    revisions: setupRevisionList(store.db, v.id).map(revisionListViewOf),
  };
}

/**
 * Handler `setupDiff`: every field that differs between two revisions with old and new
 * value and unit, the change of each corner's headline ride figures, the warnings of the
 * second revision and the caution.
 */
export function setupDiffHandler(
  input: HandlerParsedInput<'setupDiff'>,
  { store }: ApiContext,
): HandlerOutput<'setupDiff'> {
  const db = store.db;
  const a = revisionOf(db, input.a, 'a');
  const b = revisionOf(db, input.b, 'b');
  const sa = setupSheetRead(db, a.r);
  const sb = setupSheetRead(db, b.r);
  // Fields as entered; figures with the damper curve each corner runs (a click change moves them).
  const fields = setupDiff(sa, sb, input.units).fields;
  const ra = setupSheetResolve(db, sa);
  const rb = setupSheetResolve(db, sb);
  const figures = setupDiff(ra.sheet, rb.sheet, input.units).figures;
  return {
    a: { vehicle: a.v.name, revision: a.r.number, name: a.r.name },
    b: { vehicle: b.v.name, revision: b.r.number, name: b.r.name },
    fields,
    figures: figures.map((f) => ({ ...f, ...SETUP_FIGURE_LABELS[f.figure] })),
    warnings: sheetWarnings(rb, input.units),
    caution: CAUTION_TEXT,
  };
}

/**
 * Handler `setupDampers`: which damper curve each corner being edited runs — the bench's at
 * its clicks (measured or interpolated), or the entered one — with the source and the
 * warning when they disagree. Reads only; a corner that does not read is named by its field.
 */
export function setupDampersHandler(
  input: HandlerParsedInput<'setupDampers'>,
  { store }: ApiContext,
): HandlerOutput<'setupDampers'> {
  const refs: Record<string, CornerDamperRef> = {};
  for (const c of input.corners) {
    const at = `corners.${c.position}`;
    refs[c.position] = {
      analysis: cornerInputParse(c.corner, `${at}.corner`),
      damperUnit: c.damperUnit,
      clicks: clickSettingsParse(c.clicks, `${at}.clicks`),
    };
  }
  const resolved = cornerDampersResolve(store.db, refs);
  return {
    dampers: input.corners.map((c) => {
      const r = resolved[c.position] as CornerDamperResolved;
      return cornerDamperOf(c.position, r, r.analysis);
    }),
  };
}
