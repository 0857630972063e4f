import { canonicalJson } from '../core/setup/canonical-json';
import {
  benchFit,
  benchOffsetText,
  benchPointsLessGas,
  benchZeroSpeedOffset,
  type BenchFit,
} from '../core/damper/bench-fit';
import { benchTableRead, type BenchTableOptions, type BenchTableRun } from '../core/damper/bench-table';
import { clickSettingsText } from '../core/damper/click-settings';
import { InputError } from '../core/units/input-error';
import { quantityParse, type QuantityKind } from '../core/units/units';
import { benchPointsEncode, benchTraceEncode, sha256Hex } from './bench-points';
import { benchRunInsert, benchRunsFromSource } from './queries/bench-run';
import { damperUnitEnsure, type DamperUnitFields } from './damper-units';
import type { DamperUnitRow } from './rows';

export type { DamperUnitFields };
import { clickColumnsOf } from './setup-rows';
import { storeTransaction, type Store } from './store';

/**
 * Reads a bench run's measured quantity (stroke, test frequency, temperature, gas force):
 * SI number or text with its unit, greater than zero. The one rule for a bench import and
 * a bundle's runs. `undefined` stays undefined.
 * @throws InputError naming `field`.
 */
export function benchQuantityParse(raw: unknown, kind: QuantityKind, field: string): number | undefined {
  if (raw === undefined) return undefined;
  const v = quantityParse(raw, kind, field);
  if (!(v > 0)) throw new InputError(field, `must be greater than zero (got ${v} in SI)`);
  return v;
}

/** One bench import: a file's text and what the shop says about the run(s) in it. */
export type BenchImportRequest = {
  damper: string;
  /** Fields of the unit when the label is new; when given for a known unit they must match it. */
  unit?: DamperUnitFields;
  text: string;
  /** The file's name, kept with the run. */
  sourceName: string;
  table?: BenchTableOptions;
  date?: string;
  /** Stroke (m), test frequency (Hz), temperature (K). */
  stroke?: number;
  testFrequency?: number;
  temperature?: number;
  /**
   * Gas force (N) the readings include, subtracted from every reading before the points are
   * stored and fitted, so the curve is the damping alone; the run's notes say so.
   */
  gasForce?: number;
  notes?: string;
  /** Import a file already imported for this damper (refused otherwise). */
  again?: boolean;
};

export type BenchImportedRun = {
  id: number;
  column: string;
  run: BenchTableRun;
  fit: BenchFit;
};

export type BenchImportResult = {
  damper: DamperUnitRow;
  damperCreated: boolean;
  runs: BenchImportedRun[];
  /** Doubts that do not stop the import (a peak speed unlike π·f·stroke). */
  warnings: string[];
};

/** The run with `gasForce` (N) taken off every reading; the raw trace, if any, stays as recorded. */
function gasForceRemoved(run: BenchTableRun, gasForce: number | undefined): BenchTableRun {
  return gasForce ? { ...run, points: benchPointsLessGas(run.points, gasForce) } : run;
}

function notesWithGasForce(notes: string, gasForce: number | undefined): string {
  if (!gasForce) return notes;
  const line = `Gas force of ${gasForce.toFixed(1)} N subtracted from every reading at import (a raw trace is kept as recorded).`;
  return notes ? `${line} ${notes}` : line;
}

/** Peak velocity of a sine test, π·f·S (stroke S peak to peak). */
function sinePeakVelocity(frequency: number, stroke: number): number {
  return Math.PI * frequency * stroke;
}

/**
 * Imports a bench file's run(s) for a damper unit (created when the label is new): reads
 * and checks the whole file and fits every run before writing anything, then stores the
 * unit, the runs, their points and fitted curves in one transaction — killed at any moment,
 * every run of the file is wholly there or wholly absent.
 * @throws InputError naming the line, column or option that is wrong; nothing is stored.
 */
export function benchImport(store: Store, req: BenchImportRequest, now = new Date()): BenchImportResult {
  let runs: BenchTableRun[];
  let fits: BenchFit[];
  try {
    runs = benchTableRead(req.text, req.table).map((r) => gasForceRemoved(r, req.gasForce));
    fits = runs.map((r) => benchFit(r.points, r.column ? `columns (${r.column})` : 'file'));
  } catch (e) {
    // Name the file in front of the line and column, unless the problem is an option's.
    if (e instanceof InputError && req.sourceName && !e.field.startsWith('--'))
      throw new InputError(e.field === 'file' ? req.sourceName : `${req.sourceName}, ${e.field}`, e.problem);
    throw e;
  }
  const warnings: string[] = [];
  for (const r of runs) {
    const offset = benchZeroSpeedOffset(r.points);
    if (offset === null) continue;
    const which = runs.length > 1 ? `run ${r.column || clickSettingsText(r.clicks)}: ` : '';
    warnings.push(`${which}${benchOffsetText(offset, req.gasForce, 'si')}`);
  }
  if (req.stroke !== undefined && req.testFrequency !== undefined) {
    const expected = sinePeakVelocity(req.testFrequency, req.stroke);
    for (const r of runs) {
      if (r.source !== 'trace') continue;
      let peak = 0;
      for (const v of r.points.velocity) peak = Math.max(peak, Math.abs(v));
      if (Math.abs(peak - expected) > 0.25 * expected)
        warnings.push(
          `the trace's peak binned velocity ${peak.toFixed(3)} m/s is far from π·f·stroke = ${expected.toFixed(3)} m/s: check the stroke, the frequency and the displacement unit`,
        );
    }
  }
  const fileSha = sha256Hex(req.text);
  const encoded = runs.map((r) => {
    const points = benchPointsEncode(r.points);
    return { points, pointsSha: sha256Hex(points), trace: r.trace ? benchTraceEncode(r.trace) : null };
  });
  return storeTransaction(store, () => {
    const at = now.toISOString();
    const { row: unit, created: damperCreated } = damperUnitEnsure(store.db, req.damper, req.unit, at);
    const earlier = damperCreated ? [] : benchRunsFromSource(store.db, unit.id, fileSha);
    if (earlier.length > 0 && !req.again)
      throw new InputError(
        req.sourceName || 'file',
        `this file was already imported for damper "${unit.label}" as run ${earlier.map((e) => `#${e.id}`).join(', ')}; nothing was imported (give --again to import it once more)`,
      );
    const imported = runs.map((run, i) => {
      const e = encoded[i] as (typeof encoded)[number];
      const id = benchRunInsert(store.db, {
        damper_unit_id: unit.id,
        run_date: req.date ?? null,
        ...clickColumnsOf(run.clicks),
        stroke: req.stroke ?? null,
        test_frequency: req.testFrequency ?? null,
        temperature: req.temperature ?? null,
        source_kind: run.source,
        source_name: req.sourceName,
        source_column: run.column,
        source_sha256: fileSha,
        point_count: run.points.velocity.length,
        points: e.points,
        points_sha256: e.pointsSha,
        trace_count: run.trace ? run.trace.time.length : null,
        trace: e.trace,
        fit_json: canonicalJson(fits[i]),
        notes: notesWithGasForce(req.notes ?? '', req.gasForce),
        imported_at: at,
      });
      return { id, column: run.column || clickSettingsText(run.clicks), run, fit: fits[i] as BenchFit };
    });
    return { damper: unit, damperCreated, runs: imported, warnings };
  });
}
