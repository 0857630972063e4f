import { rideScenarioEdits, rideScenarioParse, type RideScenario } from '../core/ride-scenario';
import { vehicleScenarioPut } from './queries/vehicle-scenario';
import { vehicleScenarioRead } from './vehicle-scenario';
import { canonicalJson } from '../core/canonical-json';
import type { ClickSettings } from '../core/click-settings';
import { InputError } from '../core/input-error';
import { CORNER_POSITIONS, type CornerPosition } from '../core/setup-sheet';
import { nameFieldParse, nameKey } from '../core/text-field';
import { sha256Hex } from './bench-points';
import { cornerStoredCheck } from './corner-stored';
import { benchRunInsert, benchRunRowsOfDamper } from './queries/bench-run';
import { damperUnitByKey, damperUnitInsert, damperUnitsOfVehicle } from './queries/damper-unit';
import { setupCornerInsert, setupCornersOf } from './queries/setup-corner';
import { setupRevisionInsert, setupRevisionList } from './queries/setup-revision';
import { storeEventInsert } from './queries/store-event';
import { vehicleByKey, vehicleInsert } from './queries/vehicle';
import type { BenchRunRow } from './rows';
import { clickColumnsOf, clickSettingsOfColumns } from './setup-rows';
import { storeTransaction, type Store } from './store';
import { vehicleResolve } from './vehicle-ref';

/** The `format` tag of an exchange bundle. */
export const BUNDLE_FORMAT = 'rideledger-bundle' as const;
/** The bundle version this program writes and the newest it reads. */
export const BUNDLE_VERSION = 1 as const;

export type BundleCorner = {
  /** The corner input, SI, exactly as stored. */
  analysis: Record<string, unknown>;
  damperUnit: string | null;
  clicks: ClickSettings;
  springLabel: string;
  rideHeight: number | null;
  tirePressureCold: number | null;
  camber: number | null;
  toe: { kind: 'angle' | 'length'; value: number } | null;
  notes: string;
};

export type BundleRevision = {
  number: number;
  parent: number | null;
  name: string;
  event: string;
  track: string;
  driver: string;
  date: string | null;
  fuelLoad: number | null;
  antiRollBar: { front: string; rear: string };
  notes: string;
  summary: string;
  savedAt: string;
  corners: Record<CornerPosition, BundleCorner>;
};

export type BundleBenchRun = {
  date: string | null;
  clicks: ClickSettings;
  stroke: number | null;
  testFrequency: number | null;
  temperature: number | null;
  sourceKind: 'points' | 'trace';
  sourceName: string;
  sourceColumn: string;
  sourceSha256: string;
  pointCount: number;
  /** Base64 of the stored float64 pairs. */
  points: string;
  pointsSha256: string;
  traceCount: number | null;
  trace: string | null;
  fit: unknown;
  notes: string;
  importedAt: string;
};

export type BundleDamper = {
  label: string;
  kind: string;
  serial: string;
  notes: string;
  createdAt: string;
  runs: BundleBenchRun[];
};

/**
 * A self-contained copy of one vehicle: the vehicle, all its revisions, the damper units
 * they fit and those units' bench runs. SI and exact: numbers as stored, blobs in base64.
 */
export type Bundle = {
  format: typeof BUNDLE_FORMAT;
  version: typeof BUNDLE_VERSION;
  vehicle: { name: string; kind: string; notes: string; createdAt: string };
  /** The vehicle's scenario (SI), when one is stored (bundles before schema 4 have none). */
  scenario?: RideScenario;
  revisions: BundleRevision[];
  dampers: BundleDamper[];
};

function benchRunToBundle(r: BenchRunRow): BundleBenchRun {
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

/** The bundle of one vehicle (by name or id). */
export function bundleExport(store: Store, vehicleRef: string | number): Bundle {
  const db = store.db;
  // One read transaction: a save by the other program meanwhile is either wholly in or out.
  return db.transaction(() => {
    const v = vehicleResolve(db, vehicleRef);
    const revisions = setupRevisionList(db, v.id).map((r): BundleRevision => {
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
    });
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

function blobOf(base64: string, field: string): Buffer {
  if (!/^[A-Za-z0-9+/]*={0,2}$/.test(base64) || base64.length % 4 !== 0)
    throw new InputError(field, 'is not base64 data');
  return Buffer.from(base64, 'base64');
}

/**
 * Imports a bundle into this database in one transaction: the vehicle (under `asName` when
 * given) with every revision as it was (numbers, parents, dates, summaries), the damper
 * units it needs (a unit of the same label already here is used when its type and serial
 * agree) and their bench runs (a run already here is not added twice). Everything is
 * checked first — corner inputs, revision links, blob checksums — and nothing is stored
 * when anything is wrong.
 * @throws InputError naming the bundle field that is wrong, or the name already taken.
 */
export function bundleImport(
  store: Store,
  bundle: Bundle,
  options: { asName?: string; now?: Date } = {},
): BundleImportResult {
  const db = store.db;
  const name =
    options.asName === undefined
      ? bundle.vehicle.name
      : nameFieldParse(options.asName, '--as', 'a vehicle name');
  nameFieldParse(bundle.vehicle.name, 'vehicle.name', 'a vehicle name');
  const numbers = new Set<number>();
  bundle.revisions.forEach((r, i) => {
    const at = `revisions[${i}]`;
    if (numbers.has(r.number)) throw new InputError(`${at}.number`, `revision ${r.number} appears twice`);
    if (r.parent !== null && !(numbers.has(r.parent) && r.parent < r.number))
      throw new InputError(
        `${at}.parent`,
        `revision ${r.number}'s parent ${r.parent} is not an earlier revision in the bundle`,
      );
    numbers.add(r.number);
    for (const p of CORNER_POSITIONS) cornerStoredCheck(r.corners[p].analysis, `${at}.corners.${p}.analysis`);
  });
  const damperLabels = new Set(bundle.dampers.map((d) => nameKey(d.label)));
  bundle.revisions.forEach((r, i) => {
    for (const p of CORNER_POSITIONS) {
      const label = r.corners[p].damperUnit;
      if (label !== null && !damperLabels.has(nameKey(label)))
        throw new InputError(
          `revisions[${i}].corners.${p}.damperUnit`,
          `"${label}" is not among the bundle's dampers`,
        );
    }
  });
  const blobs = bundle.dampers.map((d, di) =>
    d.runs.map((run, ri) => {
      const at = `dampers[${di}].runs[${ri}]`;
      const points = blobOf(run.points, `${at}.points`);
      if (points.length !== 16 * run.pointCount || sha256Hex(points) !== run.pointsSha256)
        throw new InputError(
          `${at}.points`,
          'does not match its point count and checksum: the bundle is damaged',
        );
      const trace = run.trace === null ? null : blobOf(run.trace, `${at}.trace`);
      if (
        (trace === null) !== (run.traceCount === null) ||
        (trace && trace.length !== 24 * (run.traceCount ?? 0))
      )
        throw new InputError(`${at}.trace`, 'does not match its sample count: the bundle is damaged');
      return { points, trace };
    }),
  );
  const scenario =
    bundle.scenario === undefined ? undefined : rideScenarioParse(rideScenarioEdits(bundle.scenario));
  return storeTransaction(store, () => {
    const at = (options.now ?? new Date()).toISOString();
    if (vehicleByKey(db, nameKey(name)))
      throw new InputError(
        options.asName === undefined ? 'vehicle.name' : '--as',
        `a vehicle named "${name}" is already in this database; nothing was imported (import it under another name with --as NAME)`,
      );
    const vehicleId = vehicleInsert(db, {
      name,
      name_key: nameKey(name),
      kind: bundle.vehicle.kind,
      notes: bundle.vehicle.notes,
      created_at: bundle.vehicle.createdAt,
    });
    if (scenario)
      vehicleScenarioPut(db, vehicleId, { scenario_json: canonicalJson(scenario), scenario_updated_at: at });
    const result: BundleImportResult = {
      vehicle: name,
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
      d.runs.forEach((run, ri) => {
        if (present.has(`${run.pointsSha256}|${run.sourceSha256}|${run.sourceColumn}`)) {
          result.runsAlreadyPresent++;
          return;
        }
        const b = (blobs[di] as { points: Buffer; trace: Buffer | null }[])[ri] as {
          points: Buffer;
          trace: Buffer | null;
        };
        benchRunInsert(db, {
          damper_unit_id: id,
          run_date: run.date,
          ...clickColumnsOf(run.clicks),
          stroke: run.stroke,
          test_frequency: run.testFrequency,
          temperature: run.temperature,
          source_kind: run.sourceKind,
          source_name: run.sourceName,
          source_column: run.sourceColumn,
          source_sha256: run.sourceSha256,
          point_count: run.pointCount,
          points: b.points,
          points_sha256: run.pointsSha256,
          trace_count: run.traceCount,
          trace: b.trace,
          fit_json: canonicalJson(run.fit),
          notes: run.notes,
          imported_at: run.importedAt,
        });
        result.runsImported++;
      });
    });
    const revisionIds = new Map<number, number>();
    for (const r of [...bundle.revisions].sort((a, b) => a.number - b.number)) {
      const id = setupRevisionInsert(db, {
        vehicle_id: vehicleId,
        number: r.number,
        parent_id: r.parent === null ? null : (revisionIds.get(r.parent) as number),
        name: r.name,
        event: r.event,
        track: r.track,
        driver: r.driver,
        setup_date: r.date,
        fuel_load: r.fuelLoad,
        anti_roll_bar_front: r.antiRollBar.front,
        anti_roll_bar_rear: r.antiRollBar.rear,
        notes: r.notes,
        summary: r.summary,
        saved_at: r.savedAt,
      });
      revisionIds.set(r.number, id);
      for (const p of CORNER_POSITIONS) {
        const c = r.corners[p];
        setupCornerInsert(db, {
          revision_id: id,
          position: p,
          analysis_json: canonicalJson(c.analysis),
          damper_unit_id: c.damperUnit === null ? null : (damperIds.get(nameKey(c.damperUnit)) as number),
          ...clickColumnsOf(c.clicks),
          spring_label: c.springLabel,
          ride_height: c.rideHeight,
          tire_pressure_cold: c.tirePressureCold,
          camber: c.camber,
          toe: c.toe?.value ?? null,
          toe_kind: c.toe?.kind ?? null,
          notes: c.notes,
        });
      }
    }
    storeEventInsert(db, {
      at,
      kind: 'bundle-imported',
      detail: `vehicle "${name}" with ${result.revisions} revisions, ${result.runsImported} bench runs`,
    });
    return result;
  });
}
