import { apiCall } from '../../api/call';
import { EXIT_OK, UsageError, type CliIo } from '../cli-io';
import { commandArgsParse, helpShown, jsonText as json } from '../command-args';
import { withStore } from '../store-session';
import { tableFormat } from '../table';

export const VEHICLE_USAGE = `rideledger [--db FILE] vehicle add NAME [--kind TEXT] [--notes TEXT] [--json]
rideledger [--db FILE] vehicle list [--json]
rideledger [--db FILE] vehicle show NAME [--json]
rideledger [--db FILE] vehicle delete NAME --yes [--json]

  A vehicle is a name (unique, ignoring case), its class or type, and notes. delete needs
  --yes; it first writes a full backup of the database to the backups folder beside it.`;

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
  });
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
    default:
      throw new UsageError(
        `vehicle needs add, list, show or delete${sub ? ` (got "${sub}")` : ''}; see rideledger vehicle --help`,
      );
  }
}
