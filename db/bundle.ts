import { canonicalJson } from '../core/setup/canonical-json';
import { InputError } from '../core/units/input-error';
import { CORNER_POSITIONS, type CornerPosition } from '../core/setup/setup-sheet';
import { nameFieldParse, nameKey } from '../core/units/text-field';
import { benchRunInsert, benchRunRowsOfDamper } from './queries/bench-run';
import { damperUnitByKey, damperUnitInsert, damperUnitsOfVehicle } from './queries/damper-unit';
import { setupCornerInsert, setupCornersOf } from './queries/setup-corner';
import type Database from 'better-sqlite3';
import { setupRevisionInsert, setupRevisionList, type SetupRevisionListRow } from './queries/setup-revision';
import { storeEventInsert } from './queries/store-event';
import { vehicleByKey, vehicleInsert } from './queries/vehicle';
import type { BenchRunRow } from './rows';
import { clickSettingsOfColumns, setupCornerRowOf, setupRevisionColumnsOf } from './setup-rows';
import { storeTransaction, type Store } from './store';
import { vehicleResolve } from './vehicle-ref';
import { vehicleScenarioPut } from './queries/vehicle-scenario';
import { vehicleScenarioRead } from './vehicle-scenario';
import { bundleChecked } from './bundle-check';
import {
  BUNDLE_FORMAT,
  BUNDLE_VERSION,
  type Bundle,
  type BundleBenchRun,
  type BundleCorner,
  type BundleDamper,
  type BundleRevision,
} from './bundle-format';

export { BUNDLE_FORMAT, BUNDLE_VERSION };
export type { Bundle, BundleBenchRun, BundleCorner, BundleDamper, BundleRevision };

/** A bench run row in bundle form. */
export function benchRunToBundle(r: BenchRunRow): BundleBenchRun {
  return {
    date: r.run_date,
    clicks: clickSettingsOfColumns(r),
    stroke: r.stroke,
    testFrequency: r.test_frequency,
    temperature: r.temperature,
    sourceKind: r.source_kind,
    sourceName: r.source_name,
    sourceColumn: r.source_column,
    sourceSha256: r.source_sha256,
    pointCount: r.point_count,
    points: r.points.toString('base64'),
    pointsSha256: r.points_sha256,
    traceCount: r.trace_count,
    trace: r.trace ? r.trace.toString('base64') : null,
    fit: JSON.parse(r.fit_json) as unknown,
    notes: r.notes,
    importedAt: r.imported_at,
  };
}

/** A revision row (with its parent's number) and its corners in bundle form. */
export function bundleRevisionOf(db: Database.Database, r: SetupRevisionListRow): BundleRevision {
  const corners = {} as Record<CornerPosition, BundleCorner>;
  for (const c of setupCornersOf(db, r.id)) {
    corners[c.position] = {
      analysis: JSON.parse(c.analysis_json) as Record<string, unknown>,
      damperUnit: c.damper_label,
      clicks: clickSettingsOfColumns(c),
      springLabel: c.spring_label,
      rideHeight: c.ride_height,
      tirePressureCold: c.tire_pressure_cold,
      camber: c.camber,
      toe: c.toe !== null && c.toe_kind !== null ? { kind: c.toe_kind, value: c.toe } : null,
      notes: c.notes,
    };
  }
  return {
    number: r.number,
    parent: r.parent_number,
    name: r.name,
    event: r.event,
    track: r.track,
    driver: r.driver,
    date: r.setup_date,
    fuelLoad: r.fuel_load,
    antiRollBar: { front: r.anti_roll_bar_front, rear: r.anti_roll_bar_rear },
    notes: r.notes,
    summary: r.summary,
    savedAt: r.saved_at,
    corners,
  };
}

/** The bundle of one vehicle (by name or id). */
export function bundleExport(store: Store, vehicleRef: string | number): Bundle {
  const db = store.db;
  // One read transaction: a save by the other program meanwhile is either wholly in or out.
  return db.transaction(() => {
    const v = vehicleResolve(db, vehicleRef);
    const revisions = setupRevisionList(db, v.id).map((r) => bundleRevisionOf(db, r));
    const dampers = damperUnitsOfVehicle(db, v.id).map((d): BundleDamper => ({
      label: d.label,
      kind: d.kind,
      serial: d.serial,
      notes: d.notes,
      createdAt: d.created_at,
      runs: benchRunRowsOfDamper(db, d.id).map(benchRunToBundle),
    }));
    const scenario = vehicleScenarioRead(db, v.id);
    return {
      format: BUNDLE_FORMAT,
      version: BUNDLE_VERSION,
      vehicle: { name: v.name, kind: v.kind, notes: v.notes, createdAt: v.created_at },
      ...(scenario.stored ? { scenario: scenario.scenario } : {}),
      revisions,
      dampers,
    };
  })();
}

/** What an import added. */
export type BundleImportResult = {
  vehicle: string;
  revisions: number;
  dampersCreated: string[];
  dampersMatched: string[];
  runsImported: number;
  runsAlreadyPresent: number;
};

/**
 * Imports a bundle into this database in one transaction: the vehicle (under `asName` when
 * given) with every revision as it was (numbers, parents, dates), the damper units it needs
 * (a unit of the same label already here is used when its type and serial agree) and their
 * bench runs (a run already here is not added twice). Every record is checked first, by
 * the rules of `setup save` and `bench import` (bundleChecked); summaries and fits are
 * recomputed. Nothing is stored when anything is wrong.
 * @throws InputError naming the bundle record and field that is wrong, or the name already taken.
 */
export function bundleImport(
  store: Store,
  raw: unknown,
  options: { asName?: string; now?: Date } = {},
): BundleImportResult {
  const db = store.db;
  const name =
    options.asName === undefined ? undefined : nameFieldParse(options.asName, '--as', 'a vehicle name');
  const bundle = bundleChecked(raw);
  const vehicleName = name ?? bundle.vehicle.name;
  return storeTransaction(store, () => {
    const at = (options.now ?? new Date()).toISOString();
    if (vehicleByKey(db, nameKey(vehicleName)))
      throw new InputError(
        name === undefined ? 'vehicle.name' : '--as',
        `a vehicle named "${vehicleName}" is already in this database; nothing was imported (import it under another name with --as NAME)`,
      );
    const vehicleId = vehicleInsert(db, {
      name: vehicleName,
      name_key: nameKey(vehicleName),
      kind: bundle.vehicle.kind,
      notes: bundle.vehicle.notes,
      created_at: bundle.vehicle.createdAt,
    });
    if (bundle.scenario)
      vehicleScenarioPut(db, vehicleId, {
        scenario_json: canonicalJson(bundle.scenario),
        scenario_updated_at: at,
      });
    const result: BundleImportResult = {
      vehicle: vehicleName,
      revisions: bundle.revisions.length,
      dampersCreated: [],
      dampersMatched: [],
      runsImported: 0,
      runsAlreadyPresent: 0,
    };
    const damperIds = new Map<string, number>();
    bundle.dampers.forEach((d, di) => {
      const key = nameKey(d.label);
      const existing = damperUnitByKey(db, key);
      let id: number;
      const present = new Set<string>();
      if (existing) {
        for (const [field, mine, theirs] of [
          ['kind', existing.kind, d.kind],
          ['serial', existing.serial, d.serial],
        ] as const) {
          if (mine !== theirs)
            throw new InputError(
              `dampers[${di}].${field}`,
              `damper "${d.label}" is already here with ${field} "${mine}", the bundle says "${theirs}"; nothing was imported`,
            );
        }
        id = existing.id;
        result.dampersMatched.push(existing.label);
        for (const r of benchRunRowsOfDamper(db, id))
          present.add(`${r.points_sha256}|${r.source_sha256}|${r.source_column}`);
      } else {
        id = damperUnitInsert(db, {
          label: d.label,
          label_key: key,
          kind: d.kind,
          serial: d.serial,
          notes: d.notes,
          created_at: d.createdAt,
        });
        result.dampersCreated.push(d.label);
      }
      damperIds.set(key, id);
      for (const run of d.runs) {
        if (present.has(`${run.points_sha256}|${run.source_sha256}|${run.source_column}`)) {
          result.runsAlreadyPresent++;
          continue;
        }
        benchRunInsert(db, { damper_unit_id: id, ...run });
        result.runsImported++;
      }
    });
    const revisionIds = new Map<number, number>();
    for (const r of bundle.revisions) {
      const id = setupRevisionInsert(db, {
        vehicle_id: vehicleId,
        number: r.number,
        parent_id: r.parent === null ? null : (revisionIds.get(r.parent) as number),
        ...setupRevisionColumnsOf(r.sheet),
        summary: r.summary,
        saved_at: r.savedAt,
      });
      revisionIds.set(r.number, id);
      for (const p of CORNER_POSITIONS) {
        const c = r.sheet.corners[p];
        setupCornerInsert(
          db,
          setupCornerRowOf(
            id,
            p,
            c,
            c.damperUnit === '' ? null : (damperIds.get(nameKey(c.damperUnit)) as number),
          ),
        );
      }
    }
    storeEventInsert(db, {
      at,
      kind: 'bundle-imported',
      detail: `vehicle "${vehicleName}" with ${result.revisions} revisions, ${result.runsImported} bench runs`,
    });
    return result;
  });
}
