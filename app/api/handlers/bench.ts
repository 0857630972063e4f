import { basename } from 'node:path';
import type { BenchTableOptions } from '../../../core/damper/bench-table';
import { calendarDateParse } from '../../../core/units/calendar-date';
import { clickSettingsFromText, clickSettingsParse } from '../../../core/damper/click-settings';
import { InputError } from '../../../core/units/input-error';
import { nameFieldParse, NOTES_MAX_LENGTH, textFieldParse } from '../../../core/units/text-field';
import { benchImport, benchQuantityParse as positiveQuantity } from '../../../db/bench-import';
import { benchPointsDecode } from '../../../db/bench-points';
import { benchRunById, benchRunListOfDamper } from '../../../db/queries/bench-run';
import { damperUnitById, damperUnitList } from '../../../db/queries/damper-unit';
import { damperUnitResolve } from '../../../db/damper-units';
import type { BenchRunSummaryRow } from '../../../db/rows';
import { textFileRead } from '../../../db/text-file';
import type { ApiContext } from '../context';
import type { HandlerOutput, HandlerParsedInput } from '../contract';
import { benchRunViewOf, damperViewOf } from '../record-views';

/**
 * Handler `benchImport`: reads a bench file (a point table, one column pair per clicker
 * setting, or a raw trace) and stores its run(s) with their fitted curves for a damper
 * unit, created when the label is new. All or nothing.
 */
export function benchImportHandler(
  input: HandlerParsedInput<'benchImport'>,
  { store }: ApiContext,
): HandlerOutput<'benchImport'> {
  const damper = nameFieldParse(input.damper, 'damper', 'a damper label such as "MB-DA-1"');
  const table: BenchTableOptions = {};
  if (input.kind) table.kind = input.kind;
  if (input.columns) table.columns = input.columns;
  if (input.units) table.units = input.units;
  if (input.compression) table.compression = input.compression;
  if (input.clicks !== undefined)
    table.clicks =
      typeof input.clicks === 'string'
        ? clickSettingsFromText(input.clicks, 'clicks')
        : clickSettingsParse(input.clicks, 'clicks');
  if (input.smoothing !== undefined) table.halfWindow = input.smoothing;
  if (input.bins !== undefined) table.bins = input.bins;
  const source =
    'path' in input.source
      ? { text: textFileRead(input.source.path), name: basename(input.source.path) }
      : { text: input.source.text, name: textFieldParse(input.source.name, 'source.name') };
  const unit = {
    kind: textFieldParse(input.type, 'type'),
    serial: textFieldParse(input.serial, 'serial'),
    notes: textFieldParse(input.notes, 'notes', { maxLength: NOTES_MAX_LENGTH, multiline: true }),
  };
  const request: Parameters<typeof benchImport>[1] = {
    damper,
    unit,
    text: source.text,
    sourceName: source.name,
    table,
  };
  if (input.date !== undefined) request.date = calendarDateParse(input.date, 'date');
  const stroke = positiveQuantity(input.stroke, 'length', 'stroke');
  if (stroke !== undefined) request.stroke = stroke;
  const testFrequency = positiveQuantity(input.testFrequency, 'frequency', 'testFrequency');
  if (testFrequency !== undefined) request.testFrequency = testFrequency;
  const temperature = positiveQuantity(input.temperature, 'temperature', 'temperature');
  if (temperature !== undefined) request.temperature = temperature;
  const gasForce = positiveQuantity(input.gasForce, 'force', 'gasForce');
  if (gasForce !== undefined) request.gasForce = gasForce;
  if (unit.notes) request.notes = unit.notes;
  if (input.again) request.again = true;
  const result = benchImport(store, request);
  const ids = new Set(result.runs.map((r) => r.id));
  const runs = benchRunListOfDamper(store.db, result.damper.id).filter((r) => ids.has(r.id));
  const listed = damperUnitList(store.db).find((d) => d.id === result.damper.id);
  return {
    damper: damperViewOf(listed ?? result.damper),
    damperCreated: result.damperCreated,
    runs: runs.map((r) => benchRunViewOf(r, result.damper.label)),
    warnings: result.warnings,
  };
}

/** Handler `benchList`: the damper library; with a label, that unit and its runs. */
export function benchListHandler(
  input: HandlerParsedInput<'benchList'>,
  { store }: ApiContext,
): HandlerOutput<'benchList'> {
  const all = damperUnitList(store.db);
  if (input.damper === undefined) return { dampers: all.map(damperViewOf), runs: [] };
  const found = damperUnitResolve(store.db, input.damper);
  const runs: BenchRunSummaryRow[] = benchRunListOfDamper(store.db, found.id);
  return {
    dampers: all.filter((d) => d.id === found.id).map(damperViewOf),
    runs: runs.map((r) => benchRunViewOf(r, found.label)),
  };
}

/** Handler `benchShow`: one bench run, its fitted curve and, when asked, its points. */
export function benchShowHandler(
  input: HandlerParsedInput<'benchShow'>,
  { store }: ApiContext,
): HandlerOutput<'benchShow'> {
  const row = benchRunById(store.db, input.run);
  if (!row)
    throw new InputError('run', `there is no bench run #${input.run} (bench list --damper LABEL lists them)`);
  const damper = damperUnitById(store.db, row.damper_unit_id);
  const view = benchRunViewOf(row, damper?.label ?? '');
  const out: HandlerOutput<'benchShow'> = { run: view, fit: view.fit };
  if (input.points) {
    const p = benchPointsDecode(row.points);
    out.points = Array.from(p.velocity, (v, i) => [v, p.force[i] as number] as [number, number]);
  }
  return out;
}
