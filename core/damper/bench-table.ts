import { csvHeaderRead, csvNumbersRead, csvTextClipped } from './bench-csv';
import {
  benchPointsBinned,
  traceVelocity,
  TRACE_BINS,
  TRACE_HALF_WINDOW,
  type BenchPoints,
} from './bench-trace';
import {
  CLICK_ADJUSTERS,
  clickSettingsFromText,
  clickSettingsText,
  type ClickSettings,
} from './click-settings';
import { InputError } from '../units/input-error';
import { quantityParse, type QuantityKind } from '../units/units';
import { benchHeaderCellParse, type BenchHeaderCell } from './bench-header';
export { benchHeaderCellParse, type BenchHeaderCell };

/** What a column of a bench file holds. */
export type BenchColumnRole = 'velocity' | 'force' | 'time' | 'displacement';

const ROLE_KIND: Record<BenchColumnRole, QuantityKind> = {
  velocity: 'velocity',
  force: 'force',
  time: 'time',
  displacement: 'length',
};
const ROLE_UNITS: Record<BenchColumnRole, string> = {
  velocity: 'm/s, mm/s, in/s',
  force: 'N, kN, lbf',
  time: 's, ms',
  displacement: 'm, mm, in',
};

/**
 * How to read a bench file. Columns are found by header name (`velocity`, `force`; or
 * `time`, `displacement`, `force` for a trace) unless named here; values are SI unless a
 * unit is given here or in the header (`velocity [in/s]`).
 */
export type BenchTableOptions = {
  /** A point table (velocity, force) or a raw trace (time, displacement, force); found from the header when absent. */
  kind?: 'points' | 'trace';
  columns?: Partial<Record<BenchColumnRole, string>>;
  units?: Partial<Record<BenchColumnRole, string>>;
  /** The sign the file gives compression (velocity, displacement growth and force); positive unless said. */
  compression?: 'positive' | 'negative';
  /** Clicker positions of every run in the file, merged with any a header gives. */
  clicks?: ClickSettings;
  /** Half-width of the trace velocity window, samples each side. */
  halfWindow?: number;
  /** Speed bins per direction when a trace is reduced to points. */
  bins?: number;
};

/** One run read from a bench file: signed points in SI, compression positive. */
export type BenchTableRun = {
  /** The header's clicker setting of this run's columns ("bump 3 rebound 6"), "" when there is none. */
  column: string;
  clicks: ClickSettings;
  source: 'points' | 'trace';
  points: BenchPoints;
  /** The raw trace (s, m, N; compression positive) for a run read from one. */
  trace?: { time: Float64Array; displacement: Float64Array; force: Float64Array };
};

/** The SI factor of a column's unit: what one of the file's units is in SI. */
function unitFactor(unit: string, role: BenchColumnRole, field: string): number {
  let factor: number;
  try {
    factor = quantityParse(`1 ${unit}`, ROLE_KIND[role], field);
  } catch {
    throw new InputError(
      field,
      `"${unit}" is not a unit of ${ROLE_KIND[role] === 'length' ? 'length' : role}; use e.g. ${ROLE_UNITS[role]}`,
    );
  }
  if (!(factor > 0)) throw new InputError(field, `"${unit}" is not a unit of ${role}`);
  return factor;
}

function clicksMerged(fromFile: ClickSettings, fromOptions: ClickSettings, field: string): ClickSettings {
  const out: ClickSettings = { ...fromOptions };
  for (const a of CLICK_ADJUSTERS) {
    const v = fromFile[a];
    if (v === undefined) continue;
    if (out[a] !== undefined && out[a] !== v)
      throw new InputError(field, `the header says ${a} ${v} but the clicks given say ${a} ${out[a]}`);
    out[a] = v;
  }
  return out;
}

type Located = { index: number; cell: BenchHeaderCell };

function columnsOfRole(
  cells: BenchHeaderCell[],
  role: BenchColumnRole,
  named: string | undefined,
): Located[] {
  const want = (named ?? role).trim().toLowerCase();
  return cells
    .map((cell, index) => ({ index, cell }))
    .filter(({ cell }) =>
      named ? cell.text.toLowerCase() === want || cell.name === want : cell.name === want,
    );
}

function oneColumn(cells: BenchHeaderCell[], role: BenchColumnRole, options: BenchTableOptions): Located {
  const found = columnsOfRole(cells, role, options.columns?.[role]);
  const named = options.columns?.[role];
  if (found.length === 0)
    throw new InputError(
      `--${role}-column`,
      `no column ${named ? `"${named}"` : `named "${role}"`} in the header (${csvTextClipped(cells.map((c) => c.text).join(', '), 160)})`,
    );
  if (found.length > 1)
    throw new InputError(`--${role}-column`, `${found.length} columns match "${named ?? role}"; name one`);
  return found[0] as Located;
}

function columnFactor(c: Located, role: BenchColumnRole, options: BenchTableOptions): number {
  const given = options.units?.[role];
  if (c.cell.unit !== undefined && given !== undefined && c.cell.unit !== given.trim())
    throw new InputError(
      `--${role}-unit`,
      `says "${given}" but the header "${c.cell.text}" says [${c.cell.unit}]`,
    );
  const unit = c.cell.unit ?? given;
  if (unit === undefined) return 1;
  return unitFactor(unit, role, c.cell.unit !== undefined ? `header "${c.cell.text}"` : `--${role}-unit`);
}

function settingOf(c: Located): { key: string; clicks: ClickSettings } {
  if (c.cell.setting === undefined) return { key: '', clicks: {} };
  const clicks = clickSettingsFromText(
    c.cell.setting,
    `header "${c.cell.text}" (clicker positions are written as (bump 3 rebound 6) or B3 R6, a unit as [in/s] or (in/s))`,
  );
  return { key: clickSettingsText(clicks), clicks };
}

/**
 * Forces must have the sign of velocity: a damper resists its motion, so with compression
 * positive both are positive in bump. Most rows the other way round means the file uses
 * another sign convention than the one stated.
 */
function signCheck(points: BenchPoints, what: string): void {
  let max = 0;
  for (const v of points.velocity) max = Math.max(max, Math.abs(v));
  let same = 0;
  let opposite = 0;
  let atRest = 0;
  for (let i = 0; i < points.velocity.length; i++) {
    const v = points.velocity[i] as number;
    const f = points.force[i] as number;
    // A reading at rest has no direction to agree with: it is the gas force, or an offset.
    if (v === 0) atRest++;
    if (v === 0 || Math.abs(v) < 0.05 * max || f === 0) continue;
    if (Math.sign(v) === Math.sign(f)) same++;
    else opposite++;
  }
  if (atRest === points.velocity.length)
    throw new InputError(
      what,
      `${atRest === 1 ? 'its one row is' : `all ${atRest} rows are`} at zero speed: a reading at rest is the gas force, not damping; a curve needs rows at shaft speeds above zero`,
    );
  if (opposite > same)
    throw new InputError(
      what,
      `in ${opposite} of ${same + opposite} rows force and velocity have opposite signs; a damper's force opposes its motion, so with compression positive both are positive in bump — is the sign convention right (--compression positive|negative), or are velocity and force in different conventions?`,
    );
}

function pointsRead(
  text: string,
  options: BenchTableOptions,
  cells: BenchHeaderCell[],
  header: ReturnType<typeof csvHeaderRead>,
): BenchTableRun[] {
  const single = options.columns?.velocity !== undefined || options.columns?.force !== undefined;
  const velocities = single
    ? [oneColumn(cells, 'velocity', options)]
    : columnsOfRole(cells, 'velocity', undefined);
  const forces = single ? [oneColumn(cells, 'force', options)] : columnsOfRole(cells, 'force', undefined);
  if (velocities.length === 0 || forces.length === 0)
    throw new InputError(
      'header',
      `a point table needs a "velocity" and a "force" column (header: ${csvTextClipped(cells.map((c) => c.text).join(', '), 160)})`,
    );
  type Pair = { key: string; clicks: ClickSettings; v: Located; f?: Located };
  const pairs = new Map<string, Pair>();
  for (const v of velocities) {
    const s = settingOf(v);
    if (pairs.has(s.key))
      throw new InputError(
        `header "${v.cell.text}"`,
        `a second velocity column for ${s.key ? `(${s.key})` : 'the same run'}`,
      );
    pairs.set(s.key, { ...s, v });
  }
  for (const f of forces) {
    const s = settingOf(f);
    const pair = pairs.get(s.key);
    if (!pair)
      throw new InputError(
        `header "${f.cell.text}"`,
        `has no velocity column with the same clicker setting${s.key ? ` (${s.key})` : ''}`,
      );
    if (pair.f)
      throw new InputError(
        `header "${f.cell.text}"`,
        `a second force column for ${s.key ? `(${s.key})` : 'the same run'}`,
      );
    pair.f = f;
  }
  const list = [...pairs.values()];
  for (const p of list)
    if (!p.f)
      throw new InputError(
        `header "${p.v.cell.text}"`,
        `has no force column with the same clicker setting${p.key ? ` (${p.key})` : ''}`,
      );
  const wanted = list.flatMap((p) => [p.v.index, (p.f as Located).index]);
  const numbers = csvNumbersRead(text, header, wanted, { allowEmpty: new Set(wanted) });
  if (numbers.rowCount === 0) throw new InputError('file', 'has a header but no rows of numbers');
  const sign = options.compression === 'negative' ? -1 : 1;
  return list.map((p) => {
    const f = p.f as Located;
    const vIn = numbers.columns.get(p.v.index) as Float64Array;
    const fIn = numbers.columns.get(f.index) as Float64Array;
    const kv = sign * columnFactor(p.v, 'velocity', options);
    const kf = sign * columnFactor(f, 'force', options);
    const velocity = new Float64Array(numbers.rowCount);
    const force = new Float64Array(numbers.rowCount);
    let n = 0;
    for (let i = 0; i < numbers.rowCount; i++) {
      const v = vIn[i] as number;
      const F = fIn[i] as number;
      const vEmpty = Number.isNaN(v);
      if (vEmpty !== Number.isNaN(F))
        throw new InputError(
          `line ${numbers.lines[i]}, column "${(vEmpty ? p.v : f).cell.text}"`,
          `is empty while "${(vEmpty ? f : p.v).cell.text}" has a value; a point needs both`,
        );
      if (vEmpty) continue;
      velocity[n] = v * kv;
      force[n] = F * kf;
      n++;
    }
    if (n === 0) throw new InputError(`header "${p.v.cell.text}"`, 'has no rows of numbers');
    const points = { velocity: velocity.slice(0, n), force: force.slice(0, n) };
    signCheck(points, p.key ? `columns (${p.key})` : 'file');
    return {
      column: p.key,
      clicks: clicksMerged(p.clicks, options.clicks ?? {}, `header "${p.v.cell.text}"`),
      source: 'points' as const,
      points,
    };
  });
}

function traceRead(
  text: string,
  options: BenchTableOptions,
  cells: BenchHeaderCell[],
  header: ReturnType<typeof csvHeaderRead>,
): BenchTableRun[] {
  const t = oneColumn(cells, 'time', options);
  const x = oneColumn(cells, 'displacement', options);
  const f = oneColumn(cells, 'force', options);
  const numbers = csvNumbersRead(text, header, [t.index, x.index, f.index]);
  if (numbers.rowCount === 0) throw new InputError('file', 'has a header but no rows of numbers');
  const sign = options.compression === 'negative' ? -1 : 1;
  const scaled = (c: Located, role: BenchColumnRole, s: number) => {
    const k = s * columnFactor(c, role, options);
    const src = numbers.columns.get(c.index) as Float64Array;
    const out = new Float64Array(src.length);
    for (let i = 0; i < src.length; i++) out[i] = (src[i] as number) * k;
    return out;
  };
  const time = scaled(t, 'time', 1);
  const displacement = scaled(x, 'displacement', sign);
  const force = scaled(f, 'force', sign);
  const velocity = traceVelocity(time, displacement, options.halfWindow ?? TRACE_HALF_WINDOW, numbers.lines);
  signCheck({ velocity, force }, 'file');
  const points = benchPointsBinned({ velocity, force }, options.bins ?? TRACE_BINS);
  let setting = { key: '', clicks: {} as ClickSettings };
  for (const c of [t, x, f]) if (c.cell.setting !== undefined) setting = settingOf(c);
  return [
    {
      column: setting.key,
      clicks: clicksMerged(setting.clicks, options.clicks ?? {}, 'header'),
      source: 'trace',
      points,
      trace: { time, displacement, force },
    },
  ];
}

/**
 * Reads a bench file's text into runs: a point table (velocity and force, optionally one
 * column pair per clicker setting, e.g. `velocity (bump 3 rebound 6)`), or a raw trace
 * (time, displacement, force → velocity by a smoothed central difference, then binned
 * averages per direction). Units per column, the compression sign as given.
 * @throws InputError naming the line, column or option that is wrong.
 */
export function benchTableRead(text: string, options: BenchTableOptions = {}): BenchTableRun[] {
  const header = csvHeaderRead(text);
  const cells = header.cells.map(benchHeaderCellParse);
  const seen = new Map<string, string>();
  for (const c of cells) {
    const key = c.text.toLowerCase();
    if (seen.has(key))
      throw new InputError(`line ${header.line}`, `the column "${c.text}" appears twice in the header`);
    seen.set(key, c.text);
  }
  if (
    options.halfWindow !== undefined &&
    !(Number.isInteger(options.halfWindow) && options.halfWindow >= 1 && options.halfWindow <= 500)
  )
    throw new InputError(
      '--smoothing',
      `got ${options.halfWindow}; expected a whole number of samples from 1 to 500`,
    );
  if (
    options.bins !== undefined &&
    !(Number.isInteger(options.bins) && options.bins >= 3 && options.bins <= 1000)
  )
    throw new InputError('--bins', `got ${options.bins}; expected a whole number from 3 to 1000`);
  for (const [role, unit] of Object.entries(options.units ?? {}) as [BenchColumnRole, string | undefined][])
    if (unit !== undefined) unitFactor(unit, role, `--${role}-unit`);
  // Naming a column says which kind of file this is; otherwise the header does.
  const named = options.columns ?? {};
  const kind =
    options.kind ??
    (named.velocity !== undefined
      ? 'points'
      : named.time !== undefined || named.displacement !== undefined
        ? 'trace'
        : undefined) ??
    (columnsOfRole(cells, 'velocity', options.columns?.velocity).length > 0
      ? 'points'
      : columnsOfRole(cells, 'time', options.columns?.time).length > 0 &&
          columnsOfRole(cells, 'displacement', options.columns?.displacement).length > 0
        ? 'trace'
        : undefined);
  if (kind === undefined)
    throw new InputError(
      'header',
      `found neither velocity and force columns (a point table) nor time, displacement and force (a trace) in "${csvTextClipped(header.cells.join(', '), 160)}"; name the columns, e.g. --velocity-column "Vel" --force-column "Load"`,
    );
  // An option for columns this kind of file does not have is a misunderstanding worth saying.
  const unused: BenchColumnRole[] = kind === 'points' ? ['time', 'displacement'] : ['velocity'];
  for (const role of unused) {
    for (const [what, given] of [
      ['unit', options.units?.[role]],
      ['column', options.columns?.[role]],
    ] as const)
      if (given !== undefined)
        throw new InputError(
          `--${role}-${what}`,
          `does not apply: the file is read as a ${kind === 'points' ? 'point table' : 'trace'}, which has no ${role} column`,
        );
  }
  return kind === 'points'
    ? pointsRead(text, options, cells, header)
    : traceRead(text, options, cells, header);
}
