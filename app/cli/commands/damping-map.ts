import { clickSettingsText } from '../../../core/damper/click-settings';
import { numberFormat, quantityFormat, type UnitSystem } from '../../../core/units/units';
import { apiCall } from '../../api/call';
import type { HandlerOutput } from '../../api/contract';
import { EXIT_OK, UsageError, type CliIo } from '../cli-io';
import { commandArgsParse, helpShown, jsonText } from '../command-args';
import { revisionRefParse } from '../revision-ref';
import { withStore } from '../store-session';
import { tableFormat, textWrap } from '../table';
import { cornerListParse } from '../valving-report';
import { unitSystemParse } from './analyze';

export const DAMPING_MAP_USAGE = `rideledger [--db FILE] damping-map --vehicle VEHICLE[@N] --corner FL [--damper LABEL] [--interpolate] [--units si|us] [--json]

  A damper unit's per-click damping map on one corner of a revision (the newest without @N):
  for each click combination of its bench runs, ζ at low and high shaft speed in bump and
  rebound (ζ = c·MRd² / 2√(kw·ms)), the knees and the body and wheel-hop modes of the
  linearised quarter car. With two adjusters, grids of clicks; otherwise a list.
  --damper LABEL   the damper unit (default: the one the corner records)
  --interpolate    also the clicks between measured ones, interpolated between measured
                   neighbours (never beyond them) and marked *`;

type MapOut = HandlerOutput<'valvingMap'>;
type Cell = MapOut['cells'][number];

const GRIDS: readonly [string, (c: Cell) => number | null][] = [
  ['ζ bump, low speed', (c) => c.figures.dampingRatio.bump],
  ['ζ rebound, low speed', (c) => c.figures.dampingRatio.rebound],
  ['ζ bump, high speed', (c) => c.figures.dampingRatio.bumpHighSpeed],
  ['ζ rebound, high speed', (c) => c.figures.dampingRatio.reboundHighSpeed],
  ['body mode ζ (linear model)', (c) => c.figures.modes.body?.dampingRatio ?? null],
];

const mark = (c: Cell) => (c.source === 'interpolated' ? '*' : '');

function mapHuman(out: MapOut, system: UnitSystem): string {
  const measured = out.cells.filter((c) => c.source === 'measured').length;
  const lines = [
    `Damping map: ${out.damper} on ${out.vehicle.name}@${out.revision} ${out.position}`,
    `  ride frequency ${numberFormat(out.corner.rideFrequencyHz, 2)} Hz, wheel hop ${numberFormat(out.corner.wheelHopFrequencyHz, 2)} Hz, critical damping ${quantityFormat(out.corner.criticalDamping, 'damping', system)} at the wheel`,
    `  ${out.cells.length} click combinations: ${measured} measured, ${out.cells.length - measured} interpolated${out.interpolated ? ' (marked *)' : ''}`,
  ];
  for (const n of out.notes) lines.push(textWrap(`note: ${n}`, 96, '    ').replace(/^ {4}/, '  '));
  lines.push('');
  const [rows, columns] = out.axes;
  if (out.axes.length === 2 && rows && columns) {
    const at = new Map(out.cells.map((c) => [`${c.clicks[rows.adjuster]},${c.clicks[columns.adjuster]}`, c]));
    for (const [title, of] of GRIDS) {
      lines.push(`${title} — rows: ${rows.adjuster} clicks, columns: ${columns.adjuster} clicks`);
      lines.push(
        tableFormat([
          ['', ...columns.clicks.map(String)],
          ...rows.clicks.map((r) => [
            String(r),
            ...columns.clicks.map((k) => {
              const c = at.get(`${r},${k}`);
              const v = c ? of(c) : null;
              return c && v !== null ? `${numberFormat(v, 3)}${mark(c)}` : '—';
            }),
          ]),
        ]),
        '',
      );
    }
  } else {
    const speed = (v: number | null) => (v === null ? '—' : quantityFormat(v, 'velocity', system));
    lines.push(
      tableFormat([
        [
          'clicks',
          'ζ bump',
          'ζ rebound',
          'ζ bump hs',
          'ζ rebound hs',
          'knee bump',
          'knee rebound',
          'body mode',
          'body ζ',
        ],
        ...out.cells.map((c) => {
          const f = c.figures;
          return [
            `${clickSettingsText(c.clicks) || '(no clicker)'}${c.source === 'interpolated' ? ' *' : ''}`,
            numberFormat(f.dampingRatio.bump, 3),
            numberFormat(f.dampingRatio.rebound, 3),
            numberFormat(f.dampingRatio.bumpHighSpeed, 3),
            numberFormat(f.dampingRatio.reboundHighSpeed, 3),
            speed(f.kneeSpeed.bump),
            speed(f.kneeSpeed.rebound),
            f.modes.body ? `${numberFormat(f.modes.body.frequencyHz, 2)} Hz` : 'overdamped',
            f.modes.body ? numberFormat(f.modes.body.dampingRatio, 3) : '—',
          ];
        }),
      ]),
      '',
    );
  }
  if (out.cells.some((c) => c.source === 'interpolated'))
    lines.push('* interpolated between measured neighbours, not measured', '');
  return lines.join('\n');
}

export async function dampingMapCommand(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = commandArgsParse(args, {
    vehicle: { type: 'string' },
    corner: { type: 'string' },
    damper: { type: 'string' },
    interpolate: { type: 'boolean' },
    units: { type: 'string' },
  });
  if (helpShown(values, undefined, DAMPING_MAP_USAGE, io)) return EXIT_OK;
  const units = unitSystemParse(values.units);
  if (positionals.length > 0)
    throw new UsageError(`damping-map takes options only (got "${positionals[0]}")`);
  if (values.vehicle === undefined) throw new UsageError('damping-map needs --vehicle VEHICLE[@N]');
  const corners = cornerListParse(values.corner === undefined ? undefined : [values.corner]);
  if (corners.length !== 1) throw new UsageError('damping-map shows one corner: --corner FL, FR, RL or RR');
  const input: Record<string, unknown> = {
    ...revisionRefParse(values.vehicle, '--vehicle'),
    corner: corners[0],
  };
  if (values.damper !== undefined) input.damper = values.damper;
  if (values.interpolate) input.interpolate = true;
  const out = await withStore(values.db, io, 'read', (ctx) => apiCall('valvingMap', input, ctx));
  io.stdout(values.json ? jsonText(out) : mapHuman(out, units));
  return EXIT_OK;
}
