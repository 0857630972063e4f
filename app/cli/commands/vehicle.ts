import { InputError } from '../../../core/units/input-error';
import type { HandlerOutput } from '../../api/contract';
import { apiCall } from '../../api/call';
import { EXIT_OK, UsageError, type CliIo } from '../cli-io';
import { commandArgsParse, helpShown, jsonText as json } from '../command-args';
import { withStore } from '../store-session';
import { tableFormat } from '../table';
import { valvingScenarioText } from '../valving-report';
import { unitSystemParse } from './analyze';

export const VEHICLE_USAGE = `rideledger [--db FILE] vehicle add NAME [--kind TEXT] [--notes TEXT] [--json]
rideledger [--db FILE] vehicle list [--json]
rideledger [--db FILE] vehicle show NAME [--json]
rideledger [--db FILE] vehicle delete NAME --yes [--json]
rideledger [--db FILE] vehicle scenario NAME [--road CLASS] [--speed SPEED]
    [--bump-height H] [--bump-length L] [--bump-speed V] [--curb-height H] [--curb-rise L]
    [--curb-hold L] [--curb-drop L] [--curb-speed V] [--reset] [--units si|us] [--json]

  A vehicle is a name (unique, ignoring case), its class or type, and notes. delete needs
  --yes; it first writes a full backup of the database to the backups folder beside it.

  scenario shows the road, bump and curb the vehicle is judged on — by the Ride figures,
  Compare and Valving screens, and by compare and choose without --road/--speed — and
  with options changes the parts given (each with its unit: "80 km/h", "25 mm", "1 in");
  --reset goes back to the starting scenario. It is stored SI: the unit system only changes
  how it is written.`;

/** The scenario options of \`vehicle scenario\`: option → [part, field]. */
const SCENARIO_OPTIONS = {
  road: ['road', 'class'],
  speed: ['road', 'speed'],
  'bump-height': ['bump', 'height'],
  'bump-length': ['bump', 'length'],
  'bump-speed': ['bump', 'speed'],
  'curb-height': ['curb', 'height'],
  'curb-rise': ['curb', 'rise'],
  'curb-hold': ['curb', 'hold'],
  'curb-drop': ['curb', 'drop'],
  'curb-speed': ['curb', 'speed'],
} as const;
type ScenarioOption = keyof typeof SCENARIO_OPTIONS;

/** The scenario edits the options give; a bare number is refused, since a unit is easy to forget here. */
function scenarioEditsOf(
  values: Partial<Record<ScenarioOption, string>>,
): Record<string, Record<string, string>> {
  const edits: Record<string, Record<string, string>> = {};
  for (const [option, [part, field]] of Object.entries(SCENARIO_OPTIONS) as [
    ScenarioOption,
    (typeof SCENARIO_OPTIONS)[ScenarioOption],
  ][]) {
    const text = values[option];
    if (text === undefined) continue;
    if (option !== 'road' && /^\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*$/.test(text))
      throw new InputError(
        `--${option}`,
        `"${text}" has no unit; give one, e.g. "${field === 'speed' ? '80 km/h' : '25 mm'}"`,
      );
    edits[part] = { ...edits[part], [field]: text };
  }
  return edits;
}

function scenarioHuman(out: HandlerOutput<'vehicleScenario'>, units: 'si' | 'us'): string {
  return `${out.vehicle.name}: ${valvingScenarioText(out.scenario, units)}\n  source: ${out.note}\n`;
}

function onePositional(positionals: string[], what: string): string {
  if (positionals.length !== 1)
    throw new UsageError(`${what} (got ${positionals.length} arguments); see rideledger vehicle --help`);
  return positionals[0] as string;
}

export async function vehicleCommand(args: string[], io: CliIo): Promise<number> {
  const [sub, ...rest] = args;
  const { values, positionals } = commandArgsParse(rest, {
    kind: { type: 'string' },
    notes: { type: 'string' },
    yes: { type: 'boolean' },
    reset: { type: 'boolean' },
    units: { type: 'string' },
    road: { type: 'string' },
    speed: { type: 'string' },
    'bump-height': { type: 'string' },
    'bump-length': { type: 'string' },
    'bump-speed': { type: 'string' },
    'curb-height': { type: 'string' },
    'curb-rise': { type: 'string' },
    'curb-hold': { type: 'string' },
    'curb-drop': { type: 'string' },
    'curb-speed': { type: 'string' },
  } as const satisfies Record<ScenarioOption, { type: 'string' }> & Record<string, unknown>);
  if (helpShown(values, sub, VEHICLE_USAGE, io)) return EXIT_OK;
  switch (sub) {
    case 'add': {
      const name = onePositional(positionals, 'vehicle add needs the vehicle name');
      const out = await withStore(values.db, io, 'write', (ctx) =>
        apiCall('vehicleAdd', { name, kind: values.kind, notes: values.notes }, ctx),
      );
      io.stdout(
        values.json
          ? json(out)
          : `Added vehicle "${out.vehicle.name}"${out.vehicle.kind ? ` (${out.vehicle.kind})` : ''}.\n`,
      );
      return EXIT_OK;
    }
    case 'list': {
      if (positionals.length) throw new UsageError('vehicle list takes no arguments');
      const out = await withStore(values.db, io, 'read', (ctx) => apiCall('vehicleList', {}, ctx));
      if (values.json) io.stdout(json(out));
      else if (out.vehicles.length === 0)
        io.stdout(
          'No vehicles yet: add one with "rideledger vehicle add NAME" (or load the demo shop: "rideledger demo").\n',
        );
      else
        io.stdout(
          `${tableFormat([
            ['vehicle', 'class', 'revisions', 'last saved'],
            ...out.vehicles.map((v) => [
              v.name,
              v.kind,
              String(v.revisionCount),
              v.lastSavedAt?.slice(0, 10) ?? '—',
            ]),
          ])}\n`,
        );
      return EXIT_OK;
    }
    case 'show': {
      const vehicle = onePositional(positionals, 'vehicle show needs the vehicle name');
      const out = await withStore(values.db, io, 'read', (ctx) => apiCall('vehicleShow', { vehicle }, ctx));
      if (values.json) io.stdout(json(out));
      else {
        const v = out.vehicle;
        const lines = [`${v.name}${v.kind ? ` — ${v.kind}` : ''}`];
        if (v.notes) lines.push(`  ${v.notes}`);
        lines.push(`  ${v.revisionCount} setup revision${v.revisionCount === 1 ? '' : 's'}`);
        if (out.latest)
          lines.push(
            `  newest: revision ${out.latest.number} "${out.latest.name}"${out.latest.event ? `, ${out.latest.event}` : ''}${out.latest.date ? `, ${out.latest.date}` : ''}`,
          );
        if (out.dampers.length)
          lines.push(`  dampers fitted: ${out.dampers.map((d) => `${d.position} ${d.label}`).join(', ')}`);
        io.stdout(`${lines.join('\n')}\n`);
      }
      return EXIT_OK;
    }
    case 'delete': {
      const vehicle = onePositional(positionals, 'vehicle delete needs the vehicle name');
      if (!values.yes)
        throw new UsageError(
          `deleting "${vehicle}" removes it and all its setup revisions; run again with --yes to confirm (a full backup is written first)`,
        );
      const out = await withStore(values.db, io, 'write', (ctx) =>
        apiCall('vehicleDelete', { vehicle, confirm: true }, ctx),
      );
      io.stdout(
        values.json
          ? json(out)
          : `Deleted "${out.vehicle}" and its ${out.revisionsDeleted} revisions. A backup of the whole database made just before is at:\n  ${out.backupPath}\n`,
      );
      return EXIT_OK;
    }
    case 'scenario': {
      const vehicle = onePositional(positionals, 'vehicle scenario needs the vehicle name');
      const units = unitSystemParse(values.units);
      const edits = scenarioEditsOf(values);
      const changing = Object.keys(edits).length > 0;
      if (values.reset && changing)
        throw new UsageError('vehicle scenario takes --reset or the options that change it, not both');
      const out = await withStore(values.db, io, values.reset || changing ? 'write' : 'read', (ctx) =>
        values.reset
          ? apiCall('vehicleScenarioSet', { vehicle, scenario: null }, ctx)
          : changing
            ? apiCall('vehicleScenarioSet', { vehicle, scenario: edits }, ctx)
            : apiCall('vehicleScenario', { vehicle }, ctx),
      );
      io.stdout(values.json ? json(out) : scenarioHuman(out, units));
      return EXIT_OK;
    }
    default:
      throw new UsageError(
        `vehicle needs add, list, show, delete or scenario${sub ? ` (got "${sub}")` : ''}; see rideledger vehicle --help`,
      );
  }
}
