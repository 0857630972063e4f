import type Database from 'better-sqlite3';
import { InputError } from '../core/units/input-error';
import { setupDiff, setupDiffSummary } from '../core/setup/setup-diff';
import { CORNER_POSITIONS, type SetupSheet } from '../core/setup/setup-sheet';
import { nameKey } from '../core/units/text-field';
import type { UnitSystem } from '../core/units/units';
import { damperUnitEnsure } from './damper-units';
import { damperUnitByKey, damperUnitList } from './queries/damper-unit';
import { setupCornerInsert, setupCornersOf } from './queries/setup-corner';
import {
  setupRevisionById,
  setupRevisionByNumber,
  setupRevisionInsert,
  setupRevisionLatest,
} from './queries/setup-revision';
import type { SetupRevisionRow, VehicleRow } from './rows';
import { setupCornerRowOf, setupRevisionColumnsOf, setupSheetOf } from './setup-rows';
import { storeTransaction, type Store } from './store';

/** What a save made. */
export type SetupSaveResult = {
  revision: SetupRevisionRow;
  parentNumber: number | null;
  /** The parent is not the vehicle's newest revision: the save branches from an older one. */
  branched: boolean;
  /** Damper labels the sheet named that were not in the library and were added to it. */
  dampersCreated: string[];
};

/** The sheet of a revision row. */
export function setupSheetRead(db: Database.Database, revision: SetupRevisionRow): SetupSheet {
  return setupSheetOf(revision, setupCornersOf(db, revision.id));
}

/**
 * A revision of a vehicle by number, or the newest when `number` is undefined.
 * @throws InputError naming `field` when there is none.
 */
export function setupRevisionResolve(
  db: Database.Database,
  vehicle: VehicleRow,
  number: number | undefined,
  field = 'revision',
): SetupRevisionRow {
  const row =
    number === undefined
      ? setupRevisionLatest(db, vehicle.id)
      : setupRevisionByNumber(db, vehicle.id, number);
  if (row) return row;
  const latest = setupRevisionLatest(db, vehicle.id);
  throw new InputError(
    field,
    latest
      ? `"${vehicle.name}" has no revision ${number}; its revisions are 1 to ${latest.number}`
      : `"${vehicle.name}" has no setup saved yet (setup save FILE --vehicle "${vehicle.name}")`,
  );
}

/** The library's labels for a message: quoted, the first twenty and how many more. */
function damperLabelsText(db: Database.Database): string {
  const labels = damperUnitList(db).map((d) => `"${d.label}"`);
  if (labels.length === 0) return 'the library is empty';
  const shown = labels.slice(0, 20).join(', ');
  return `the library has ${shown}${labels.length > 20 ? ` and ${labels.length - 20} more` : ''}`;
}

/**
 * The damper units a sheet names, checked against the library: a label the library lacks is
 * added only when `newDamperUnits` names it, so that a typo never becomes a new unit.
 * @throws InputError naming the corner's damperUnit (with the known labels), or a new label no corner uses.
 */
function sheetDamperUnitsCheck(
  db: Database.Database,
  sheet: SetupSheet,
  newDamperUnits: readonly string[],
  field: string,
): void {
  const declared = new Set(newDamperUnits.map(nameKey));
  const named = new Set<string>();
  for (const p of CORNER_POSITIONS) {
    const label = sheet.corners[p].damperUnit;
    if (label === '') continue;
    const key = nameKey(label);
    named.add(key);
    if (declared.has(key) || damperUnitByKey(db, key)) continue;
    throw new InputError(
      `corners.${p}.damperUnit`,
      `damper unit "${label}" is not in the library (${damperLabelsText(db)}); check the spelling, or name it as a new damper unit when saving`,
    );
  }
  for (const label of newDamperUnits)
    if (!named.has(nameKey(label)))
      throw new InputError(
        field,
        `"${label}" is named as a new damper unit but no corner of the sheet uses it; check its spelling against the sheet's damperUnit fields`,
      );
}

/**
 * Saves a sheet as a new revision of a vehicle, never overwriting: the next number, linked
 * to its parent (the newest revision unless another is named), with a one-line summary of
 * what changed from the parent. A damper label the library lacks is refused unless
 * `newDamperUnits` names it, when it is added. One transaction: on any error nothing is stored.
 * @throws InputError when the parent revision does not exist, when the sheet is its parent's
 * exactly, or when it names a damper unit that is neither in the library nor declared new.
 */
export function setupSave(
  store: Store,
  vehicle: VehicleRow,
  sheet: SetupSheet,
  options: {
    parentNumber?: number;
    now?: Date;
    units?: UnitSystem;
    /** Labels the sheet names that are to be added to the library as new damper units. */
    newDamperUnits?: readonly string[];
    /** The field that holds `newDamperUnits`, for messages. */
    newDamperUnitsField?: string;
  } = {},
): SetupSaveResult {
  const db = store.db;
  return storeTransaction(store, () => {
    sheetDamperUnitsCheck(
      db,
      sheet,
      options.newDamperUnits ?? [],
      options.newDamperUnitsField ?? 'newDamperUnits',
    );
    const now = (options.now ?? new Date()).toISOString();
    const latest = setupRevisionLatest(db, vehicle.id);
    const parent =
      options.parentNumber === undefined
        ? latest
        : setupRevisionResolve(db, vehicle, options.parentNumber, 'basedOnRevision');
    // The summary is written in the units the sheet was entered in; what is stored is SI.
    const diff = parent ? setupDiff(setupSheetRead(db, parent), sheet, options.units ?? 'si') : null;
    // A copy of its parent would only be a revision that says "no changes".
    if (parent && diff && diff.fields.length === 0)
      throw new InputError(
        'file',
        `nothing differs from revision ${parent.number}, so nothing was saved: change a field (or the event or date) first`,
      );
    const summary = diff ? setupDiffSummary(diff) : 'first setup';
    const dampersCreated: string[] = [];
    const damperIds = new Map<string, number>();
    for (const p of CORNER_POSITIONS) {
      const label = sheet.corners[p].damperUnit;
      if (label === '' || damperIds.has(nameKey(label))) continue;
      const { row, created } = damperUnitEnsure(db, label, undefined, now);
      damperIds.set(nameKey(label), row.id);
      if (created) dampersCreated.push(label);
    }
    const id = setupRevisionInsert(db, {
      vehicle_id: vehicle.id,
      number: (latest?.number ?? 0) + 1,
      parent_id: parent?.id ?? null,
      ...setupRevisionColumnsOf(sheet),
      summary,
      saved_at: now,
    });
    for (const p of CORNER_POSITIONS) {
      const c = sheet.corners[p];
      setupCornerInsert(
        db,
        setupCornerRowOf(
          id,
          p,
          c,
          c.damperUnit === '' ? null : (damperIds.get(nameKey(c.damperUnit)) ?? null),
        ),
      );
    }
    return {
      revision: setupRevisionById(db, id) as SetupRevisionRow,
      parentNumber: parent?.number ?? null,
      branched: parent !== undefined && latest !== undefined && parent.id !== latest.id,
      dampersCreated,
    };
  });
}
