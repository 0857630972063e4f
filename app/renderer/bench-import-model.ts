import { csvHeaderRead, csvRowsPreview, type CsvHeader } from '../../core/damper/bench-csv';
import { benchFit, benchPointsLessGas, benchZeroSpeedOffset } from '../../core/damper/bench-fit';
import {
  benchHeaderCellParse,
  benchTableRead,
  type BenchColumnRole,
  type BenchHeaderCell,
  type BenchTableOptions,
} from '../../core/damper/bench-table';
import { calendarDateParse } from '../../core/units/calendar-date';
import {
  clickSettingsFromText,
  clickSettingsText,
  type ClickSettings,
} from '../../core/damper/click-settings';
import { InputError } from '../../core/units/input-error';
import { nameFieldParse } from '../../core/units/text-field';
import { quantityParse, quantityUnitLabel, type QuantityKind, type UnitSystem } from '../../core/units/units';
import type { HandlerInput } from '../api/contract';
import { quantityFieldValue } from './quantity-field';

/** A bench file picked for import: its text, a preview of its first rows, and its header read. */
export type BenchFilePreview = {
  name: string;
  text: string;
  header: CsvHeader;
  cells: BenchHeaderCell[];
  rows: string[][];
  /** What the header suggests the file is: a point table, a raw trace, or neither. */
  kindGuess: 'points' | 'trace' | null;
};

/** Rows the preview shows. */
export const PREVIEW_ROWS = 8;

/** Reads a picked file's header and first rows by core's CSV reader. @throws InputError naming the line. */
export function benchFilePreview(name: string, text: string): BenchFilePreview {
  const header = csvHeaderRead(text);
  const cells = header.cells.map(benchHeaderCellParse);
  const has = (role: string) => cells.some((c) => c.name === role);
  const kindGuess = has('velocity') ? 'points' : has('time') && has('displacement') ? 'trace' : null;
  return { name, text, header, cells, rows: csvRowsPreview(text, header, PREVIEW_ROWS), kindGuess };
}

/** The units a column of each role may be given in (mathjs spellings, as core reads them). */
export const ROLE_UNITS: Record<BenchColumnRole, readonly string[]> = {
  velocity: ['m/s', 'mm/s', 'in/s'],
  force: ['N', 'kN', 'lbf'],
  time: ['s', 'ms'],
  displacement: ['m', 'mm', 'in'],
};

/** The roles a file of each kind has, in the order the mapping step asks for them. */
export const KIND_ROLES: Record<'points' | 'trace', readonly BenchColumnRole[]> = {
  points: ['velocity', 'force'],
  trace: ['time', 'displacement', 'force'],
};

/**
 * The user's choices in the mapping step, as typed. A column of '' means "found by its header
 * name" — for a point table, every velocity/force pair, one run per clicker setting in the
 * header. A unit of '' means the header's own unit (in brackets) or, without one, SI.
 */
export type BenchMapping = {
  kind: 'points' | 'trace';
  columns: Record<BenchColumnRole, string>;
  units: Record<BenchColumnRole, string>;
  compression: 'positive' | 'negative';
  /** Clicker positions of the run(s): "bump 3 rebound 6"; merged with the header's. */
  clicks: string;
  damper: string;
  date: string;
  stroke: string;
  testFrequency: string;
  temperature: string;
  /** The gas force the readings include, taken off every reading at import. */
  gasForce: string;
  notes: string;
  /** Import a file already imported for this damper once more. */
  again: boolean;
};

const blankRoles = (): Record<BenchColumnRole, string> => ({
  velocity: '',
  force: '',
  time: '',
  displacement: '',
});

/**
 * The mapping a file starts with: its kind as the header suggests, columns by name, SI,
 * compression positive, and no damper — the unit last viewed is not a guess worth making,
 * since a run stored under the wrong unit is hard to see and cannot be moved.
 */
export function benchMappingDefault(preview: BenchFilePreview): BenchMapping {
  return {
    kind: preview.kindGuess ?? 'points',
    columns: blankRoles(),
    units: blankRoles(),
    compression: 'positive',
    clicks: '',
    damper: '',
    date: '',
    stroke: '',
    testFrequency: '',
    temperature: '',
    gasForce: '',
    notes: '',
    again: false,
  };
}

/** The unit a column's header gives in brackets (`velocity [in/s]`), for the role as mapped. */
export function benchHeaderUnit(
  preview: BenchFilePreview,
  mapping: BenchMapping,
  role: BenchColumnRole,
): string | undefined {
  const named = mapping.columns[role];
  const cell = named
    ? preview.cells.find((c) => c.text === named)
    : preview.cells.find((c) => c.name === role);
  return cell?.unit;
}

const RUN_FIELDS = [
  { key: 'stroke', kind: 'length' },
  { key: 'testFrequency', kind: 'frequency' },
  { key: 'temperature', kind: 'temperature' },
  { key: 'gasForce', kind: 'force' },
] as const satisfies readonly { key: keyof BenchMapping; kind: QuantityKind }[];

/** The unit shown beside a run field in `system` (mm, Hz, °C). */
export function benchRunFieldUnit(key: (typeof RUN_FIELDS)[number]['key'], system: UnitSystem): string {
  return quantityUnitLabel(RUN_FIELDS.find((f) => f.key === key)?.kind ?? 'length', system);
}

/**
 * The API call the mapping stands for (the contract's benchImport input): the file's text,
 * the columns and units the user chose, the sign, the clicks and the run's details — bare
 * numbers sent with the unit shown beside their field, empty fields left out.
 */
export function benchImportInput(
  preview: Pick<BenchFilePreview, 'name' | 'text'> & Partial<BenchFilePreview>,
  mapping: BenchMapping,
  system: UnitSystem,
): HandlerInput<'benchImport'> {
  const input: HandlerInput<'benchImport'> = {
    damper: mapping.damper.trim(),
    source: { text: preview.text, name: preview.name },
    kind: mapping.kind,
    compression: mapping.compression,
  };
  const roles = KIND_ROLES[mapping.kind];
  const columns: Partial<Record<BenchColumnRole, string>> = {};
  const units: Partial<Record<BenchColumnRole, string>> = {};
  for (const role of roles) {
    if (mapping.columns[role]) columns[role] = mapping.columns[role];
    if (mapping.units[role]) units[role] = mapping.units[role];
  }
  if (Object.keys(columns).length > 0) input.columns = columns;
  if (Object.keys(units).length > 0) input.units = units;
  if (mapping.clicks.trim()) input.clicks = mapping.clicks.trim();
  if (mapping.date.trim()) input.date = mapping.date.trim();
  for (const f of RUN_FIELDS) {
    const v = quantityFieldValue(mapping[f.key], f.kind, system);
    if (v !== undefined) input[f.key] = v;
  }
  if (mapping.notes.trim()) input.notes = mapping.notes.trim();
  if (mapping.again) input.again = true;
  return input;
}

/**
 * A bench reader's message in the mapping step's words: core names options as the command
 * spells them (--velocity-column, --compression), the form has its own labels.
 */
export function benchProblemText(e: InputError): string {
  const words = (t: string) =>
    t
      .replace(/--(velocity|force|time|displacement)-(column|unit)/g, 'the $1 $2')
      .replace(/\(--compression positive\|negative\)/g, '(the compression sign)')
      .replace(/--smoothing/g, 'the smoothing')
      .replace(/--bins/g, 'the bins');
  return e.field ? `${words(e.field)}: ${words(e.problem)}` : words(e.problem);
}

/** What an import of the mapping would store, as core reads it here before anything is sent. */
export type BenchMappingCheck =
  | {
      ok: true;
      /** `offset`: the force (N) the readings carry at zero speed once the gas force is off, if any. */
      runs: { label: string; points: number; fitted: string; offset: number | null }[];
    }
  | { ok: false; problems: Map<string, string> };

/** Texts bigger than this are checked when imported, not as the mapping is edited. */
export const LIVE_CHECK_MAX_CHARS = 1_000_000;

/**
 * Reads the file as the mapping says with core's bench reader and fit — the same reading the
 * import makes — so that a wrong column, unit or sign shows before anything is stored. Problems
 * are keyed by the mapping field they concern ('file' for the file's own lines).
 */
export function benchMappingCheck(
  preview: Pick<BenchFilePreview, 'text'>,
  mapping: BenchMapping,
  system: UnitSystem,
): BenchMappingCheck {
  const problems = new Map<string, string>();
  const attempt = (key: string, f: () => void) => {
    try {
      f();
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      problems.set(key, e.problem);
    }
  };
  attempt('damper', () => nameFieldParse(mapping.damper, 'damper', 'a damper label such as "MB-DA-1"'));
  if (mapping.date.trim()) attempt('date', () => calendarDateParse(mapping.date.trim(), 'date'));
  for (const f of RUN_FIELDS) {
    const v = quantityFieldValue(mapping[f.key], f.kind, system);
    if (v !== undefined)
      attempt(f.key, () => {
        if (!(quantityParse(v, f.kind, f.key) > 0)) throw new InputError(f.key, 'must be greater than zero');
      });
  }
  let clicks: ClickSettings | undefined;
  if (mapping.clicks.trim())
    attempt('clicks', () => (clicks = clickSettingsFromText(mapping.clicks, 'clicks')));
  const options: BenchTableOptions = { kind: mapping.kind, compression: mapping.compression };
  const columns: Partial<Record<BenchColumnRole, string>> = {};
  const units: Partial<Record<BenchColumnRole, string>> = {};
  for (const role of KIND_ROLES[mapping.kind]) {
    if (mapping.columns[role]) columns[role] = mapping.columns[role];
    if (mapping.units[role]) units[role] = mapping.units[role];
  }
  options.columns = columns;
  options.units = units;
  if (clicks) options.clicks = clicks;
  const runs: { label: string; points: number; fitted: string; offset: number | null }[] = [];
  const gasText = quantityFieldValue(mapping.gasForce, 'force', system);
  const gas =
    gasText === undefined || problems.has('gasForce')
      ? undefined
      : quantityParse(gasText, 'force', 'gasForce');
  try {
    for (const read of benchTableRead(preview.text, options)) {
      // The same correction the import makes, so the fit and the offset are those it would store.
      const run = gas === undefined ? read : { ...read, points: benchPointsLessGas(read.points, gas) };
      const fit = benchFit(run.points);
      const dirs = [fit.bump ? 'bump' : '', fit.rebound ? 'rebound' : ''].filter(Boolean).join(' and ');
      runs.push({
        label: clickSettingsText(run.clicks) || 'no clicks recorded',
        points: run.points.velocity.length,
        fitted: dirs,
        offset: benchZeroSpeedOffset(run.points),
      });
    }
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    problems.set('file', benchProblemText(e));
  }
  if (problems.size > 0) return { ok: false, problems };
  return { ok: true, runs };
}
