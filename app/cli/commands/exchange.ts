import { apiCall } from '../../api/call';
import { EXIT_OK, UsageError, type CliIo } from '../cli-io';
import { commandArgsParse, helpShown, jsonText as json } from '../command-args';
import { outputFileWrite } from '../output-file';
import { readJsonFile } from '../read-json-file';
import { withStore } from '../store-session';

export const EXPORT_USAGE = `rideledger [--db FILE] export VEHICLE --out FILE [--force] [--json]

  Writes one vehicle as a self-contained bundle (format "rideledger-bundle"): the vehicle,
  all its setup revisions, the damper units they fit and those units' bench runs, exact.`;

export const IMPORT_USAGE = `rideledger [--db FILE] import FILE [--as NAME] [--json]

  Reads a bundle into this database, all or nothing. Every record is checked as setup save
  and bench import check theirs (texts, lengths, clicks, dates, quantities, revision numbers
  and parents, no unknown field, no run twice); a wrong one refuses the whole bundle, naming
  the record and field. Fits are recomputed from the points and each revision's line of what
  changed from the sheets. A vehicle of the same name is never overwritten: import it under
  another name with --as. Damper units already here (same label, type and serial) are used,
  and bench runs already here are not added twice.`;

export async function exportCommand(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = commandArgsParse(args, {
    out: { type: 'string' },
    force: { type: 'boolean' },
  });
  if (helpShown(values, undefined, EXPORT_USAGE, io)) return EXIT_OK;
  if (positionals.length !== 1)
    throw new UsageError(
      `export needs one vehicle (got ${positionals.length}); see rideledger export --help`,
    );
  if (values.out === undefined) throw new UsageError('export needs --out FILE: where to write the bundle');
  const out = values.out;
  const { bundle } = await withStore(values.db, io, 'read', (ctx) =>
    apiCall('storeExport', { vehicle: positionals[0] as string }, ctx),
  );
  outputFileWrite(out, `${JSON.stringify(bundle)}\n`, values.force === true);
  const summary = {
    path: out,
    vehicle: bundle.vehicle.name,
    revisions: bundle.revisions.length,
    dampers: bundle.dampers.length,
    benchRuns: bundle.dampers.reduce((n, d) => n + d.runs.length, 0),
  };
  io.stdout(
    values.json
      ? json(summary)
      : `Exported "${summary.vehicle}": ${summary.revisions} revisions, ${summary.dampers} damper units, ${summary.benchRuns} bench runs → ${out}\n`,
  );
  return EXIT_OK;
}

export async function importCommand(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = commandArgsParse(args, {
    as: { type: 'string' },
  });
  if (helpShown(values, undefined, IMPORT_USAGE, io)) return EXIT_OK;
  if (positionals.length !== 1)
    throw new UsageError(
      `import needs one bundle file (got ${positionals.length}); see rideledger import --help`,
    );
  const bundle = await readJsonFile(positionals[0] as string);
  const out = await withStore(values.db, io, 'write', (ctx) =>
    apiCall('storeImport', values.as === undefined ? { bundle } : { bundle, asName: values.as }, ctx),
  );
  io.stdout(
    values.json
      ? json(out)
      : `Imported "${out.vehicle}": ${out.revisions} revisions, ${out.runsImported} bench runs${out.runsAlreadyPresent ? ` (${out.runsAlreadyPresent} already here)` : ''}${out.dampersCreated.length ? `; new damper units: ${out.dampersCreated.join(', ')}` : ''}.\n`,
  );
  return EXIT_OK;
}
