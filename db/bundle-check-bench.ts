/** A bundle's damper units and bench runs, checked as `bench import` checks them; fits recomputed. */
import { benchFit } from '../core/damper/bench-fit';
import { calendarDateParse, timestampParse } from '../core/units/calendar-date';
import { canonicalJson } from '../core/setup/canonical-json';
import { clickSettingsParse } from '../core/damper/click-settings';
import { objectParse } from '../core/corner/corner-file';
import { InputError, inputFieldPath } from '../core/units/input-error';
import { nameFieldParse, NOTES_MAX_LENGTH, textFieldParse } from '../core/units/text-field';
import { benchQuantityParse } from './bench-import';
import { benchPointsDecode, sha256Hex } from './bench-points';
import { type BenchRunInsert } from './queries/bench-run';
import { clickColumnsOf } from './setup-rows';

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

/** A bench run of a bundle, checked, with its fit recomputed from its points. */
export type CheckedRun = Omit<BenchRunInsert, 'damper_unit_id'>;

export type CheckedDamper = {
  label: string;
  kind: string;
  serial: string;
  notes: string;
  createdAt: string;
  runs: CheckedRun[];
};

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

/** A list in a bundle, or an InputError naming the field. */
export function listParse(raw: unknown, field: string): unknown[] {
  if (!Array.isArray(raw)) throw new InputError(field, 'expected a list');
  return raw;
}
