import { InputError } from '../../../core/units/input-error';
import { clickSettingsText } from '../../../core/damper/click-settings';
import { numberFormat, quantityFormat, type UnitSystem } from '../../../core/units/units';
import { apiCall } from '../../api/call';
import type { HandlerOutput } from '../../api/contract';
import { EXIT_OK, UsageError, type CliIo } from '../cli-io';
import { commandArgsParse, helpShown, jsonText as json } from '../command-args';
import { withStore } from '../store-session';
import { tableFormat } from '../table';
import { unitSystemParse } from './analyze';

export const BENCH_USAGE = `rideledger [--db FILE] bench import FILE.csv --damper LABEL [options] [--json]
rideledger [--db FILE] bench list [--damper LABEL] [--json]
rideledger [--db FILE] bench show RUN [--points] [--units si|us] [--json]

  import reads a point table (columns "velocity" and "force", or one pair per clicker
  setting: "velocity (bump 3 rebound 6)", "force (bump 3 rebound 6)") or a raw trace
  ("time", "displacement", "force"), fits the bilinear curve of each run and stores the
  runs for the damper unit (added to the library when the label is new). One transaction:
  a file with a bad row stores nothing. Units are SI unless given in the header
  ("velocity [in/s]", "Velocity (in/s)", "velocity_in_s", "Force_lbf") or by an option;
  clicks may follow the name ("Velocity [in/s] B0 R0", "Force (lbf) bump 3 rebound 6").

  --clicks "bump 3 rebound 6"     clicker positions of the run(s)
  --date YYYY-MM-DD --stroke "50 mm" --frequency "2 Hz" --temperature "35 degC" --notes TEXT
  --velocity-unit in/s --force-unit lbf --time-unit ms --displacement-unit mm
  --velocity-column NAME --force-column NAME --time-column NAME --displacement-column NAME
  --compression positive|negative  the sign the file gives compression (default positive)
  --gas-force "120 N"              the gas force the readings include: taken off every reading
                                   before the points are stored and fitted (noted on the run)
  --trace | --points               read the file as that kind (default: from the header)
  --smoothing N                    trace velocity window: N samples each side (default 3)
  --bins N                         trace speed bins per direction (default 24)
  --type TEXT --serial TEXT        the unit's type and serial (a new unit's, or checked)
  --again                          import a file already imported for this unit`;

type RunView = HandlerOutput<'benchList'>['runs'][number];

/** The import's fields as the API names them, and the options that give them. */
const IMPORT_OPTION_OF: Readonly<Record<string, string>> = {
  stroke: '--stroke',
  testFrequency: '--frequency',
  temperature: '--temperature',
  gasForce: '--gas-force',
  clicks: '--clicks',
  date: '--date',
  damper: '--damper',
  type: '--type',
  serial: '--serial',
  notes: '--notes',
};

function fitText(run: RunView, dir: 'bump' | 'rebound', system: UnitSystem): string {
  const f = run.fit[dir];
  if (!f) return '—';
  const c = f.curve;
  const d = (v: number) => quantityFormat(v, 'damping', system, { withUnit: false });
  return `${d(c.lowSpeed)}/${d(c.highSpeed)} @${quantityFormat(c.kneeSpeed, 'velocity', system, { withUnit: false })}`;
}

function runRows(runs: RunView[], system: UnitSystem): string[][] {
  const dampingUnit = system === 'si' ? 'N·s/m' : 'lbf·s/in';
  const speedUnit = system === 'si' ? 'm/s' : 'in/s';
  return [
    ['run', 'date', 'clicks', 'source', 'points', `bump low/high @knee`, `rebound low/high @knee`],
    ['', '', '', '', '', `${dampingUnit} @${speedUnit}`, `${dampingUnit} @${speedUnit}`],
    ...runs.map((r) => [
      `#${r.id}`,
      r.date ?? r.importedAt.slice(0, 10),
      clickSettingsText(r.clicks) || '—',
      r.source === 'trace' ? `trace (${r.traceSamples} samples)` : 'points',
      String(r.pointCount),
      fitText(r, 'bump', system),
      fitText(r, 'rebound', system),
    ]),
  ];
}

function quantityOption(text: string | undefined): string | undefined {
  return text === undefined ? undefined : text;
}

function wholeNumberOption(text: string | undefined, flag: string): number | undefined {
  if (text === undefined) return undefined;
  if (!/^\d+$/.test(text.trim())) throw new UsageError(`${flag}: "${text}" is not a whole number`);
  return Number(text);
}

export async function benchCommand(args: string[], io: CliIo): Promise<number> {
  const [sub, ...rest] = args;
  const { values, positionals } = commandArgsParse(rest, {
    damper: { type: 'string' },
    clicks: { type: 'string' },
    date: { type: 'string' },
    stroke: { type: 'string' },
    frequency: { type: 'string' },
    temperature: { type: 'string' },
    'gas-force': { type: 'string' },
    notes: { type: 'string' },
    type: { type: 'string' },
    serial: { type: 'string' },
    'velocity-unit': { type: 'string' },
    'force-unit': { type: 'string' },
    'time-unit': { type: 'string' },
    'displacement-unit': { type: 'string' },
    'velocity-column': { type: 'string' },
    'force-column': { type: 'string' },
    'time-column': { type: 'string' },
    'displacement-column': { type: 'string' },
    compression: { type: 'string' },
    trace: { type: 'boolean' },
    points: { type: 'boolean' },
    smoothing: { type: 'string' },
    bins: { type: 'string' },
    again: { type: 'boolean' },
    units: { type: 'string' },
  });
  if (helpShown(values, sub, BENCH_USAGE, io)) return EXIT_OK;
  const units = unitSystemParse(values.units);
  switch (sub) {
    case 'import': {
      if (positionals.length !== 1)
        throw new UsageError(
          `bench import needs one bench file (got ${positionals.length}); see rideledger bench --help`,
        );
      if (values.damper === undefined)
        throw new UsageError('bench import needs --damper LABEL: the damper unit the run belongs to');
      if (
        values.compression !== undefined &&
        values.compression !== 'positive' &&
        values.compression !== 'negative'
      )
        throw new UsageError(`--compression: got "${values.compression}"; expected positive or negative`);
      if (values.trace && values.points)
        throw new UsageError('--trace and --points contradict each other; give one');
      const pick = (names: Record<string, string | undefined>) => {
        const o: Record<string, string> = {};
        for (const [k, v] of Object.entries(names)) if (v !== undefined) o[k] = v;
        return Object.keys(o).length ? o : undefined;
      };
      const input: Record<string, unknown> = {
        damper: values.damper,
        source: { path: positionals[0] as string },
        kind: values.trace ? 'trace' : values.points ? 'points' : undefined,
        columns: pick({
          velocity: values['velocity-column'],
          force: values['force-column'],
          time: values['time-column'],
          displacement: values['displacement-column'],
        }),
        units: pick({
          velocity: values['velocity-unit'],
          force: values['force-unit'],
          time: values['time-unit'],
          displacement: values['displacement-unit'],
        }),
        compression: values.compression,
        clicks: values.clicks,
        date: values.date,
        stroke: quantityOption(values.stroke),
        testFrequency: quantityOption(values.frequency),
        temperature: quantityOption(values.temperature),
        gasForce: quantityOption(values['gas-force']),
        notes: values.notes,
        type: values.type,
        serial: values.serial,
        again: values.again,
        smoothing: wholeNumberOption(values.smoothing, '--smoothing'),
        bins: wholeNumberOption(values.bins, '--bins'),
      };
      for (const k of Object.keys(input)) if (input[k] === undefined) delete input[k];
      const out = await withStore(values.db, io, 'write', (ctx) => apiCall('benchImport', input, ctx)).catch(
        (e: unknown) => {
          // The API names its fields; the command's user typed options.
          const option = e instanceof InputError ? IMPORT_OPTION_OF[e.field] : undefined;
          throw option ? new InputError(option, (e as InputError).problem) : e;
        },
      );
      if (values.json) io.stdout(json(out));
      else {
        const lines = [
          `Imported ${out.runs.length} run${out.runs.length === 1 ? '' : 's'} for damper ${out.damper.label}${out.damperCreated ? ' (new in the library)' : ''}:`,
          tableFormat(runRows(out.runs, units)),
        ];
        for (const w of out.warnings) lines.push(`  warning: ${w}`);
        io.stdout(`${lines.join('\n')}\n`);
      }
      return EXIT_OK;
    }
    case 'list': {
      if (positionals.length)
        throw new UsageError('bench list takes no arguments (use --damper LABEL for one unit)');
      const out = await withStore(values.db, io, 'read', (ctx) =>
        apiCall('benchList', values.damper === undefined ? {} : { damper: values.damper }, ctx),
      );
      if (values.json) io.stdout(json(out));
      else if (values.damper !== undefined) {
        const d = out.dampers[0];
        io.stdout(
          `${d?.label}${d?.kind ? ` — ${d.kind}` : ''}${d?.serial ? `, serial ${d.serial}` : ''}\n${out.runs.length ? tableFormat(runRows(out.runs, units)) : '  no bench runs yet'}\n`,
        );
      } else if (out.dampers.length === 0)
        io.stdout('The damper library is empty: rideledger bench import FILE.csv --damper LABEL\n');
      else
        io.stdout(
          `${tableFormat([
            ['damper', 'type', 'serial', 'bench runs', 'last run'],
            ...out.dampers.map((d) => [
              d.label,
              d.kind || '—',
              d.serial || '—',
              String(d.runCount),
              d.lastRunDate ?? '—',
            ]),
          ])}\n`,
        );
      return EXIT_OK;
    }
    case 'show': {
      if (positionals.length !== 1)
        throw new UsageError('bench show needs one run number, e.g. bench show 12');
      const id = wholeNumberOption((positionals[0] as string).replace(/^#/, ''), 'run');
      const out = await withStore(values.db, io, 'read', (ctx) =>
        apiCall('benchShow', { run: id, points: values.points === true }, ctx),
      );
      if (values.json) {
        io.stdout(json(out));
        return EXIT_OK;
      }
      const r = out.run;
      const lines = [
        `Bench run #${r.id} of ${r.damper}: ${r.source === 'trace' ? `raw trace, ${r.traceSamples} samples, binned to ${r.pointCount} points` : `${r.pointCount} points`} from ${r.sourceName}${r.sourceColumn ? ` (${r.sourceColumn})` : ''}`,
        tableFormat([
          ['date', r.date ?? '—'],
          ['clicks', clickSettingsText(r.clicks) || '—'],
          ['stroke', r.stroke === null ? '—' : quantityFormat(r.stroke, 'length', units)],
          ['test frequency', r.testFrequency === null ? '—' : `${numberFormat(r.testFrequency, 2)} Hz`],
          ['temperature', r.temperature === null ? '—' : quantityFormat(r.temperature, 'temperature', units)],
          ['imported', r.importedAt.replace('T', ' ').slice(0, 16)],
        ]),
        '',
        `Fitted bilinear curve (least squares${r.fit.basis === 'binned' ? ', on binned averages' : ''})`,
      ];
      const dirRow = (dir: 'bump' | 'rebound') => {
        const f = r.fit[dir];
        if (!f) return [dir, 'too few points', '', '', ''];
        return [
          dir,
          quantityFormat(f.curve.lowSpeed, 'damping', units),
          quantityFormat(f.curve.kneeSpeed, 'velocity', units),
          quantityFormat(f.curve.highSpeed, 'damping', units),
          quantityFormat(f.rmsResidual, 'force', units),
        ];
      };
      lines.push(
        tableFormat([
          ['', 'low speed', 'knee', 'high speed', 'RMS residual'],
          dirRow('bump'),
          dirRow('rebound'),
        ]),
      );
      if (out.points) {
        lines.push('', 'Points (compression positive)');
        lines.push(
          tableFormat([
            ['velocity', 'force'],
            ...out.points.map(([v, f]) => [
              quantityFormat(v, 'velocity', units),
              quantityFormat(f, 'force', units),
            ]),
          ]),
        );
      }
      io.stdout(`${lines.join('\n')}\n`);
      return EXIT_OK;
    }
    default:
      throw new UsageError(
        `bench needs import, list or show${sub ? ` (got "${sub}")` : ''}; see rideledger bench --help`,
      );
  }
}
