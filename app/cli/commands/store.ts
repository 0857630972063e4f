import { apiCall } from '../../api/call';
import { EXIT_FAILURE, EXIT_OK, UsageError, type CliIo } from '../cli-io';
import { commandArgsParse, helpShown, jsonText as json } from '../command-args';
import { cliStorePath, withStore } from '../store-session';
import { tableFormat } from '../table';

export const BACKUP_USAGE = `rideledger [--db FILE] backup OUT [--force] [--json]

  Copies the whole database to OUT with SQLite's online backup (safe while the desktop app
  is open), checks the copy, and only then gives it its name. An existing OUT is kept
  unless --force.`;

export const CHECK_USAGE = `rideledger [--db FILE] check [--json]

  Runs SQLite's integrity and foreign-key checks and RideLedger's own: four corners per
  revision, bench points against their checksums, and every record by the rules an import
  checks a bundle's by (clean texts within their lengths, clicks, dates, revisions numbered
  1 to N with earlier parents, fits equal to a refit of their points, no run stored twice).
  Exit code 0 when all is well, 1 if not.`;

export const DEMO_USAGE = `rideledger [--db FILE] demo [--json]

  Loads the invented demo shop "Millbrook": two vehicles with several setup revisions each,
  damper units and bench runs. Loading it again changes nothing.`;

export async function backupCommand(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = commandArgsParse(args, { force: { type: 'boolean' } });
  if (helpShown(values, undefined, BACKUP_USAGE, io)) return EXIT_OK;
  if (positionals.length !== 1)
    throw new UsageError(
      `backup needs one output file (got ${positionals.length}); see rideledger backup --help`,
    );
  const out = await withStore(values.db, io, 'existing', (ctx) =>
    apiCall('storeBackup', { path: positionals[0] as string, overwrite: values.force === true }, ctx),
  );
  io.stdout(
    values.json
      ? json(out)
      : `Backed up ${cliStorePath(values.db)} to ${out.path} (${(out.bytes / 1024).toFixed(0)} KiB; checked: ${out.counts.vehicles} vehicles, ${out.counts.revisions} revisions, ${out.counts.dampers} damper units, ${out.counts.benchRuns} bench runs).\n`,
  );
  return EXIT_OK;
}

export async function checkCommand(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = commandArgsParse(args, {});
  if (helpShown(values, undefined, CHECK_USAGE, io)) return EXIT_OK;
  if (positionals.length) throw new UsageError('check takes no arguments');
  const out = await withStore(values.db, io, 'existing', (ctx) => apiCall('storeCheck', {}, ctx));
  if (values.json) io.stdout(json(out));
  else {
    const c = out.counts;
    const lines = [
      out.ok
        ? 'Check passed: the database is whole.'
        : `Check FAILED: ${out.problems.length} problem${out.problems.length === 1 ? '' : 's'}.`,
      tableFormat([
        ['schema version', String(out.schemaVersion)],
        ['vehicles', String(c.vehicles)],
        ['setup revisions', String(c.revisions)],
        ['damper units', String(c.dampers)],
        ['bench runs', String(c.benchRuns)],
        ['bench points', String(c.benchPoints)],
      ]),
      ...out.problems.map((p) => `  - ${p}`),
    ];
    if (!out.ok)
      lines.push(
        'Restore from a backup (rideledger backup makes one) or keep this file aside before changing it.',
      );
    io.stdout(`${lines.join('\n')}\n`);
  }
  return out.ok ? EXIT_OK : EXIT_FAILURE;
}

export async function demoCommand(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = commandArgsParse(args, {});
  if (helpShown(values, undefined, DEMO_USAGE, io)) return EXIT_OK;
  if (positionals.length) throw new UsageError('demo takes no arguments');
  const out = await withStore(values.db, io, 'write', (ctx) => apiCall('loadDemo', {}, ctx));
  io.stdout(
    values.json
      ? json(out)
      : out.loaded
        ? `Loaded the invented Millbrook demo shop: ${out.vehicles.join(' and ')} (${out.revisions} revisions), ${out.dampers.length} damper units, ${out.benchRuns} bench runs.\nTry: rideledger setup history "${out.vehicles[0]}"\n`
        : `${out.message[0]?.toUpperCase()}${out.message.slice(1)}.\n`,
  );
  return EXIT_OK;
}
