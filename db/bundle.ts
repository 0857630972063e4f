import { benchFit } from '../core/damper/bench-fit';
import { calendarDateParse, timestampParse } from '../core/units/calendar-date';
import { canonicalJson } from '../core/setup/canonical-json';
import { clickSettingsParse, type ClickSettings } from '../core/damper/click-settings';
import { cornerInputToFile, objectParse } from '../core/corner/corner-file';
import { InputError, inputFieldPath } from '../core/units/input-error';
import { setupDiff, setupDiffSummary } from '../core/setup/setup-diff';
import { SETUP_FILE_FORMAT, SETUP_FILE_VERSION, setupFileParse } from '../core/setup/setup-file';
import { CORNER_POSITIONS, type CornerPosition, type SetupSheet } from '../core/setup/setup-sheet';
import { nameFieldParse, nameKey, NOTES_MAX_LENGTH, textFieldParse } from '../core/units/text-field';
import { quantityText } from '../core/units/units';
import { benchQuantityParse } from './bench-import';
import { benchPointsDecode, sha256Hex } from './bench-points';
import { cornerStoredCheck } from './corner-stored';
import { benchRunInsert, benchRunRowsOfDamper, type BenchRunInsert } from './queries/bench-run';
import { damperUnitByKey, damperUnitInsert, damperUnitsOfVehicle } from './queries/damper-unit';
import { setupCornerInsert, setupCornersOf } from './queries/setup-corner';
import type Database from 'better-sqlite3';
import { setupRevisionInsert, setupRevisionList, type SetupRevisionListRow } from './queries/setup-revision';
import { storeEventInsert } from './queries/store-event';
import { vehicleByKey, vehicleInsert } from './queries/vehicle';
import type { BenchRunRow } from './rows';
import {
  clickColumnsOf,
  clickSettingsOfColumns,
  setupCornerRowOf,
  setupRevisionColumnsOf,
} from './setup-rows';
import { storeTransaction, type Store } from './store';
import { vehicleResolve } from './vehicle-ref';
import { rideScenarioParse, type RideScenario } from '../core/valving/ride-scenario';
import { vehicleScenarioPut } from './queries/vehicle-scenario';
import { vehicleScenarioRead } from './vehicle-scenario';

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
  /** What changed from the parent, as stored; an import recomputes it from the sheets. */
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
  /** The fitted curve as stored; an import refits the points and keeps only its own fit. */
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

const BUNDLE_KEYS = ['format', 'version', 'vehicle', 'revisions', 'dampers', 'scenario'] as const;
const VEHICLE_KEYS = ['name', 'kind', 'notes', 'createdAt'] as const;
const REVISION_KEYS = [
  'number',
  'parent',
  'name',
  'event',
  'track',
  'driver',
  'date',
  'fuelLoad',
  'antiRollBar',
  'notes',
  'summary',
  'savedAt',
  'corners',
] as const;
const CORNER_KEYS = [
  'analysis',
  'damperUnit',
  'clicks',
  'springLabel',
  'rideHeight',
  'tirePressureCold',
  'camber',
  'toe',
  'notes',
] as const;
const DAMPER_KEYS = ['label', 'kind', 'serial', 'notes', 'createdAt', 'runs'] as const;
const RUN_KEYS = [
  'date',
  'clicks',
  'stroke',
  'testFrequency',
  'temperature',
  'sourceKind',
  'sourceName',
  'sourceColumn',
  'sourceSha256',
  'pointCount',
  'points',
  'pointsSha256',
  'traceCount',
  'trace',
  'fit',
  'notes',
  'importedAt',
] as const;

/** The summary of a revision without a parent, as `setupSave` writes it. */
export const FIRST_SETUP_SUMMARY = 'first setup';

/** A revision of a bundle, checked as a setup file is: its sheet (SI), number, parent and time saved. */
export type CheckedRevision = {
  number: number;
  parent: number | null;
  sheet: SetupSheet;
  summary: string;
  savedAt: string;
};

/** A bench run of a bundle, checked, with its fit recomputed from its points. */
export type CheckedRun = Omit<BenchRunInsert, 'damper_unit_id'>;

type CheckedDamper = {
  label: string;
  kind: string;
  serial: string;
  notes: string;
  createdAt: string;
  runs: CheckedRun[];
};

type CheckedBundle = {
  vehicle: { name: string; kind: string; notes: string; createdAt: string };
  revisions: CheckedRevision[];
  dampers: CheckedDamper[];
  /** The vehicle's scenario (SI), checked by the scenario's own rules, when the bundle has one. */
  scenario: RideScenario | undefined;
};

function listParse(raw: unknown, field: string): unknown[] {
  if (!Array.isArray(raw)) throw new InputError(field, 'expected a list');
  return raw;
}

function blobOf(base64: unknown, field: string): Buffer {
  // Base64 as Node writes it: decoding and encoding again gives the same text (a regular
  // expression over megabytes of it is slow).
  const blob = typeof base64 === 'string' ? Buffer.from(base64, 'base64') : undefined;
  if (!blob || blob.toString('base64') !== base64) throw new InputError(field, 'is not base64 data');
  return blob;
}

function finiteCheck(values: Float64Array, field: string): void {
  for (const v of values)
    if (!Number.isFinite(v))
      throw new InputError(field, 'holds a value that is not a finite number: the data are damaged');
}

function countParse(raw: unknown, field: string): number {
  if (typeof raw !== 'number' || !Number.isSafeInteger(raw) || raw < 0)
    throw new InputError(field, `got ${JSON.stringify(raw)}; expected a whole number`);
  return raw;
}

function checksumParse(raw: unknown, field: string): string {
  if (typeof raw !== 'string' || !/^[0-9a-f]{64}$/.test(raw))
    throw new InputError(field, 'expected a SHA-256 checksum (64 lower-case hexadecimal digits)');
  return raw;
}

/** Checks a stored fit's keys only: the fit itself is recomputed from the points. */
function fitShapeCheck(raw: unknown, field: string): void {
  const fit = objectParse(raw, field, ['bump', 'rebound', 'basis']);
  for (const side of ['bump', 'rebound'] as const) {
    const at = inputFieldPath(field, side);
    if (fit[side] === null || fit[side] === undefined) continue;
    const d = objectParse(fit[side], at, ['curve', 'rmsResidual', 'points']);
    objectParse(d.curve, inputFieldPath(at, 'curve'), ['kind', 'lowSpeed', 'kneeSpeed', 'highSpeed']);
  }
}

/**
 * The line of what changed from `parent` to `sheet`, recomputed as `setupSave` writes it:
 * in SI, or in US units when that is how the given line was written (the units it was
 * entered in); never the given text itself.
 */
export function setupRevisionSummary(parent: SetupSheet | undefined, sheet: SetupSheet, given = ''): string {
  if (!parent) return FIRST_SETUP_SUMMARY;
  const si = setupDiffSummary(setupDiff(parent, sheet, 'si'));
  if (given === si) return si;
  const us = setupDiffSummary(setupDiff(parent, sheet, 'us'));
  return given === us ? us : si;
}

/** A setup file's field path as a bundle revision's: the corner input is `analysis` there. */
function bundleFieldOfSetupField(field: string): string {
  return field.replace(/^corners\.(FL|FR|RL|RR)\.corner(?=\.|$)/, 'corners.$1.analysis');
}

/**
 * One revision of a bundle, read through `setupFileParse` — the validation `setup save`
 * runs — so that texts, lengths, clicks, dates and quantities meet the same rules; the
 * corner inputs and toe keep their SI numbers bit for bit.
 */
export function bundleRevisionChecked(raw: unknown, at: string, count: number): CheckedRevision {
  const r = objectParse(raw, at, REVISION_KEYS);
  const f = (k: string) => inputFieldPath(at, k);
  const number = r.number;
  if (typeof number !== 'number' || !Number.isInteger(number) || number < 1 || number > count)
    throw new InputError(
      f('number'),
      `got ${JSON.stringify(number)}; the bundle's ${count} revision${count === 1 ? ' is' : 's are'} numbered 1 to ${count}, as a vehicle's revisions are`,
    );
  const parent = r.parent ?? null;
  if (
    parent !== null &&
    !(typeof parent === 'number' && Number.isInteger(parent) && parent >= 1 && parent < number)
  )
    throw new InputError(
      f('parent'),
      `revision ${number}'s parent ${JSON.stringify(parent)} is not an earlier revision in the bundle`,
    );
  const savedAt = timestampParse(r.savedAt, f('savedAt'));
  if (typeof r.summary !== 'string') throw new InputError(f('summary'), 'expected a text');
  const corners = objectParse(r.corners, f('corners'), CORNER_POSITIONS);
  const analyses = {} as Record<CornerPosition, SetupSheet['corners'][CornerPosition]['analysis']>;
  const toes = {} as Record<CornerPosition, { kind: 'angle' | 'length'; value: number } | undefined>;
  const fileCorners: Record<string, unknown> = {};
  for (const p of CORNER_POSITIONS) {
    const cAt = f(`corners.${p}`);
    if (corners[p] === undefined)
      throw new InputError(cAt, 'is missing; a setup has all four corners (FL, FR, RL, RR)');
    const c = objectParse(corners[p], cAt, CORNER_KEYS);
    analyses[p] = cornerStoredCheck(c.analysis, inputFieldPath(cAt, 'analysis'));
    const fileCorner: Record<string, unknown> = {
      corner: cornerInputToFile(analyses[p], 'si'),
      clicks: c.clicks,
      springLabel: c.springLabel,
      notes: c.notes,
    };
    for (const key of ['damperUnit', 'rideHeight', 'tirePressureCold', 'camber'] as const)
      if (c[key] !== null && c[key] !== undefined) fileCorner[key] = c[key];
    if (c.toe !== null && c.toe !== undefined) {
      const toeAt = inputFieldPath(cAt, 'toe');
      const t = objectParse(c.toe, toeAt, ['kind', 'value']);
      if (t.kind !== 'angle' && t.kind !== 'length')
        throw new InputError(
          inputFieldPath(toeAt, 'kind'),
          `got ${JSON.stringify(t.kind)}; expected "angle" or "length"`,
        );
      if (typeof t.value !== 'number' || !Number.isFinite(t.value))
        throw new InputError(
          inputFieldPath(toeAt, 'value'),
          `got ${JSON.stringify(t.value)}; expected a number in SI`,
        );
      toes[p] = { kind: t.kind, value: t.value };
      // The file form writes toe with its unit; the range is checked there, the number kept exact.
      fileCorner.toe = quantityText(t.value, t.kind, 'si');
    }
    fileCorners[p] = fileCorner;
  }
  const file: Record<string, unknown> = {
    format: SETUP_FILE_FORMAT,
    version: SETUP_FILE_VERSION,
    name: r.name,
    event: r.event,
    track: r.track,
    driver: r.driver,
    antiRollBar: r.antiRollBar,
    notes: r.notes,
    corners: fileCorners,
  };
  if (r.date !== null && r.date !== undefined) file.date = r.date;
  if (r.fuelLoad !== null && r.fuelLoad !== undefined) file.fuelLoad = r.fuelLoad;
  let sheet: SetupSheet;
  try {
    sheet = setupFileParse(file).sheet;
  } catch (e) {
    if (e instanceof InputError) throw new InputError(f(bundleFieldOfSetupField(e.field)), e.problem);
    throw e;
  }
  for (const p of CORNER_POSITIONS) {
    sheet.corners[p].analysis = analyses[p];
    const toe = toes[p];
    if (toe) sheet.corners[p].toe = toe;
  }
  return { number, parent: parent as number | null, sheet, summary: r.summary, savedAt };
}

/**
 * One bench run of a bundle, checked as a bench import checks its run: the points whole
 * (count, checksum, finite numbers), the run's fields by the same rules, and the fit
 * recomputed from the points — the bundle's own fit is never stored. `options.fits` keeps
 * the fit (canonical JSON) of points already fitted, by their checksum, for the runs checked
 * next; `options.stored` gives a stored run's blobs, already checked against their count and
 * checksum, in place of the base64 of a bundle.
 */
export function bundleRunChecked(
  raw: unknown,
  at: string,
  options: { fits?: Map<string, string>; stored?: { points: Buffer; trace: Buffer | null } } = {},
): CheckedRun {
  const fits = options.fits ?? new Map<string, string>();
  const r = objectParse(raw, at, RUN_KEYS);
  const f = (k: string) => inputFieldPath(at, k);
  const quantity = (
    key: 'stroke' | 'testFrequency' | 'temperature',
    kind: 'length' | 'frequency' | 'temperature',
  ) =>
    r[key] === null || r[key] === undefined ? null : (benchQuantityParse(r[key], kind, f(key)) as number);
  if (r.sourceKind !== 'points' && r.sourceKind !== 'trace')
    throw new InputError(
      f('sourceKind'),
      `got ${JSON.stringify(r.sourceKind)}; expected "points" or "trace"`,
    );
  const pointCount = countParse(r.pointCount, f('pointCount'));
  const pointsSha256 = checksumParse(r.pointsSha256, f('pointsSha256'));
  const points = options.stored?.points ?? blobOf(r.points, f('points'));
  if (!options.stored && (points.length !== 16 * pointCount || sha256Hex(points) !== pointsSha256))
    throw new InputError(f('points'), 'does not match its point count and checksum: the bundle is damaged');
  const traceCount =
    r.traceCount === null || r.traceCount === undefined ? null : countParse(r.traceCount, f('traceCount'));
  const trace = options.stored
    ? options.stored.trace
    : r.trace === null || r.trace === undefined
      ? null
      : blobOf(r.trace, f('trace'));
  if ((trace === null) !== (traceCount === null) || (trace && trace.length !== 24 * (traceCount ?? 0)))
    throw new InputError(f('trace'), 'does not match its sample count: the bundle is damaged');
  if ((trace !== null) !== (r.sourceKind === 'trace'))
    throw new InputError(
      f('trace'),
      `a run read from ${r.sourceKind === 'trace' ? 'a trace keeps it' : 'points has none'}`,
    );
  if (trace) {
    const samples = new Float64Array(trace.length / 8);
    for (let i = 0; i < samples.length; i++) samples[i] = trace.readDoubleLE(8 * i);
    finiteCheck(samples, f('trace'));
  }
  fitShapeCheck(r.fit, f('fit'));
  // The same points (by their checked checksum) give the same fit: a run imported again is fitted once.
  let fitJson = fits.get(pointsSha256);
  if (fitJson === undefined) {
    const decoded = benchPointsDecode(points);
    finiteCheck(decoded.velocity, f('points'));
    finiteCheck(decoded.force, f('points'));
    fitJson = canonicalJson(benchFit(decoded, f('points')));
    fits.set(pointsSha256, fitJson);
  }
  return {
    run_date: r.date === null || r.date === undefined ? null : calendarDateParse(r.date, f('date')),
    ...clickColumnsOf(clickSettingsParse(r.clicks, f('clicks'))),
    stroke: quantity('stroke', 'length'),
    test_frequency: quantity('testFrequency', 'frequency'),
    temperature: quantity('temperature', 'temperature'),
    source_kind: r.sourceKind,
    source_name: textFieldParse(r.sourceName, f('sourceName')),
    source_column: textFieldParse(r.sourceColumn, f('sourceColumn')),
    source_sha256: checksumParse(r.sourceSha256, f('sourceSha256')),
    point_count: pointCount,
    points,
    points_sha256: pointsSha256,
    trace_count: traceCount,
    trace,
    fit_json: fitJson,
    notes: textFieldParse(r.notes, f('notes'), { maxLength: NOTES_MAX_LENGTH, multiline: true }),
    imported_at: timestampParse(r.importedAt, f('importedAt')),
  };
}

export function bundleDamperChecked(
  raw: unknown,
  at: string,
  fits = new Map<string, string>(),
): CheckedDamper {
  const d = objectParse(raw, at, DAMPER_KEYS);
  const f = (k: string) => inputFieldPath(at, k);
  const runs = listParse(d.runs, f('runs')).map((run, i) =>
    bundleRunChecked(run, inputFieldPath(f('runs'), i), { fits }),
  );
  const seen = new Map<string, number>();
  runs.forEach((run, i) => {
    const key = `${run.points_sha256}|${run.source_sha256}|${run.source_column}|${run.imported_at}`;
    const earlier = seen.get(key);
    if (earlier !== undefined)
      throw new InputError(
        inputFieldPath(f('runs'), i),
        `is the same bench run as ${f('runs')}[${earlier}] (same points, source file and import time); a bundle lists each run once`,
      );
    seen.set(key, i);
  });
  return {
    label: nameFieldParse(d.label, f('label'), 'a damper label'),
    kind: textFieldParse(d.kind, f('kind')),
    serial: textFieldParse(d.serial, f('serial')),
    notes: textFieldParse(d.notes, f('notes'), { maxLength: NOTES_MAX_LENGTH, multiline: true }),
    createdAt: timestampParse(d.createdAt, f('createdAt')),
    runs,
  };
}

/** A bundle's vehicle record, checked as `vehicle add` checks one (and its time of creation). */
export function bundleVehicleChecked(raw: unknown, at: string): CheckedBundle['vehicle'] {
  const v = objectParse(raw, at, VEHICLE_KEYS);
  const f = (k: string) => inputFieldPath(at, k);
  return {
    name: nameFieldParse(v.name, f('name'), 'a vehicle name'),
    kind: textFieldParse(v.kind, f('kind')),
    notes: textFieldParse(v.notes, f('notes'), { maxLength: NOTES_MAX_LENGTH, multiline: true }),
    createdAt: timestampParse(v.createdAt, f('createdAt')),
  };
}

/**
 * A whole bundle checked record by record, by the rules of `setup save` (revisions) and
 * `bench import` (dampers and runs): strict keys everywhere, clean texts within their
 * lengths, clicks within the adjusters' range, real dates and times, revisions numbered
 * 1 to N once each with earlier parents, no run listed twice, fits recomputed from the
 * points and summaries from the sheets.
 * @throws InputError naming the record and field.
 */
/** A carried scenario, checked by the scenario's own rules (the road's class under `roadClass`, SI). */
function bundleScenarioChecked(raw: unknown): RideScenario {
  const o = objectParse(raw, 'scenario', ['road', 'bump', 'curb']);
  const road = objectParse(o.road, 'scenario.road', ['roadClass', 'speed']);
  return rideScenarioParse({
    road: { class: road.roadClass, speed: road.speed },
    bump: o.bump,
    curb: o.curb,
  });
}

function bundleChecked(raw: unknown): CheckedBundle {
  const o = objectParse(raw, '', BUNDLE_KEYS);
  if (o.format !== BUNDLE_FORMAT)
    throw new InputError('format', `got ${JSON.stringify(o.format)}; expected "${BUNDLE_FORMAT}"`);
  if (o.version !== BUNDLE_VERSION)
    throw new InputError(
      'version',
      `got ${JSON.stringify(o.version)}; this program reads bundle version ${BUNDLE_VERSION}`,
    );
  const vehicle = bundleVehicleChecked(o.vehicle, 'vehicle');
  const rawRevisions = listParse(o.revisions, 'revisions');
  const byNumber = new Map<number, number>();
  const revisions = rawRevisions.map((r, i) => {
    const at = `revisions[${i}]`;
    const checked = bundleRevisionChecked(r, at, rawRevisions.length);
    if (byNumber.has(checked.number))
      throw new InputError(`${at}.number`, `revision ${checked.number} appears twice`);
    byNumber.set(checked.number, i);
    return checked;
  });
  const dampers = listParse(o.dampers, 'dampers').map((d, i) => bundleDamperChecked(d, `dampers[${i}]`));
  const labels = new Map<string, number>();
  dampers.forEach((d, i) => {
    const earlier = labels.get(nameKey(d.label));
    if (earlier !== undefined)
      throw new InputError(`dampers[${i}].label`, `"${d.label}" is also dampers[${earlier}]'s label`);
    labels.set(nameKey(d.label), i);
  });
  revisions.forEach((r, i) => {
    for (const p of CORNER_POSITIONS) {
      const label = r.sheet.corners[p].damperUnit;
      if (label !== '' && !labels.has(nameKey(label)))
        throw new InputError(
          `revisions[${i}].corners.${p}.damperUnit`,
          `"${label}" is not among the bundle's dampers`,
        );
    }
  });
  // Each summary is recomputed from the revision's parent, never taken from the file.
  revisions.sort((a, b) => a.number - b.number);
  for (const r of revisions) {
    const parent = r.parent === null ? undefined : (revisions[r.parent - 1] as CheckedRevision).sheet;
    r.summary = setupRevisionSummary(parent, r.sheet, r.summary);
  }
  const scenario = o.scenario === undefined ? undefined : bundleScenarioChecked(o.scenario);
  return { vehicle, revisions, dampers, scenario };
}

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
