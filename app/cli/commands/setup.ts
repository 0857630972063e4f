import { setupChangeText } from '../../../core/setup/setup-diff';
import { CAUTION_TEXT } from '../../../core/safety/caution';
import { clickSettingsText } from '../../../core/damper/click-settings';
import { damperDirectionSlopes } from '../../../core/damper/damper-curve';
import { InputError } from '../../../core/units/input-error';
import { setupFileParse } from '../../../core/setup/setup-file';
import { CORNER_POSITIONS, type SetupCorner } from '../../../core/setup/setup-sheet';
import { numberFormat, quantityFormat, type UnitSystem } from '../../../core/units/units';
import { apiCall } from '../../api/call';
import type { HandlerOutput } from '../../api/contract';
import { EXIT_OK, UsageError, type CliIo } from '../cli-io';
import { commandArgsParse, helpShown, jsonText as json } from '../command-args';
import { outputFileWrite } from '../output-file';
import { readJsonFile } from '../read-json-file';
import { revisionPairOf, revisionRefParse } from '../revision-ref';
import { withStore } from '../store-session';
import { tableFormat, textWrap } from '../table';
import { unitSystemParse } from './analyze';

export const SETUP_USAGE = `rideledger [--db FILE] setup save FILE [--vehicle NAME] [--based-on N] [--new-damper LABEL]… [--units si|us] [--json]
rideledger [--db FILE] setup show VEHICLE[@N] [--units si|us] [--file] [--out FILE [--force]] [--json]
rideledger [--db FILE] setup history VEHICLE [--json]
rideledger [--db FILE] setup diff VEHICLE@A [VEHICLE@B] [--vehicle NAME] [--units si|us] [--json]

  save     stores a setup file (format "rideledger-setup") as a new revision; nothing is
           ever overwritten. The parent is the newest revision, or the file's
           "basedOnRevision", or --based-on N. The line saying what changed is written in
           --units (the sheet itself is stored SI); a copy of the parent is refused. A
           damper unit the library lacks is refused (a typo must not become a new unit)
           unless --new-damper LABEL names it (repeat it for each new unit).
  show     a revision (the newest without @N) with each corner's ride figures, each damper
           at its clicks: the bench's curve there (a run, or between measured clicks), else
           the curve entered, and where each comes from; --file prints it as a setup file,
           --out FILE writes that file (edit it and save it again).
  history  every revision with date, event, name and what changed.
  diff     every changed field with old and new value, and the change of each corner's ride
           frequency, ζ bump and rebound and wheel hop. With one revision: against its parent.
           With --vehicle, revisions may be plain numbers: setup diff 3 5 --vehicle Coupe.`;

function cornerRows(corners: Record<string, SetupCorner>, system: UnitSystem): string[][] {
  const row = (label: string, cell: (c: SetupCorner) => string) => [
    label,
    ...CORNER_POSITIONS.map((p) => cell(corners[p] as SetupCorner)),
  ];
  const q = quantityFormat;
  const opt = (v: number | undefined, f: (x: number) => string) => (v === undefined ? '—' : f(v));
  return [
    ['', ...CORNER_POSITIONS],
    row('corner mass', (c) => q(c.analysis.cornerMass, 'mass', system)),
    row('unsprung mass', (c) => q(c.analysis.unsprungMass, 'mass', system)),
    row('spring rate', (c) => q(c.analysis.springRate, 'stiffness', system)),
    row('spring', (c) => c.springLabel || '—'),
    row('spring motion ratio', (c) => numberFormat(c.analysis.springMotionRatio, 3)),
    row('damper motion ratio', (c) => numberFormat(c.analysis.damperMotionRatio, 3)),
    row('tyre rate', (c) => q(c.analysis.tireRate, 'stiffness', system)),
    row('damper unit', (c) => c.damperUnit || '—'),
    row('clicks', (c) => clickSettingsText(c.clicks) || '—'),
    row('bump damping (entered)', (c) =>
      q(damperDirectionSlopes(c.analysis.damper.bump).lowSpeed, 'damping', system),
    ),
    row('rebound damping (entered)', (c) =>
      q(damperDirectionSlopes(c.analysis.damper.rebound).lowSpeed, 'damping', system),
    ),
    row('bump-stop gap', (c) => opt(c.analysis.bumpStop?.gap, (v) => q(v, 'length', system))),
    row('ride height', (c) => opt(c.rideHeight, (v) => q(v, 'length', system))),
    row('cold pressure', (c) => opt(c.tirePressureCold, (v) => q(v, 'pressure', system))),
    row('camber', (c) => opt(c.camber, (v) => q(v, 'angle', system))),
    row('toe (toe-in +)', (c) =>
      c.toe
        ? q(
            c.toe.value,
            c.toe.kind,
            system,
            c.toe.kind === 'length' ? { decimals: system === 'si' ? 1 : 3 } : {},
          )
        : '—',
    ),
  ];
}

function warningLines(warnings: HandlerOutput<'setupShow'>['warnings'], heading: string): string[] {
  const out = ['', heading];
  if (warnings.length === 0) out.push('  none from the model');
  for (const w of warnings)
    out.push(textWrap(`${w.position}: ${w.message}`, 96, '    ').replace(/^ {4}/, '  - '));
  return out;
}

function showHuman(out: HandlerOutput<'setupShow'>, system: UnitSystem): string {
  const sheet = setupFileParse(out.file).sheet;
  const r = out.revision;
  const where = [r.event, r.track, r.date, sheet.driver && `driver ${sheet.driver}`]
    .filter(Boolean)
    .join(', ');
  const lines = [
    `${out.vehicle.name} — revision ${r.number} "${r.name}"${r.parent ? ` (from revision ${r.parent})` : ''}`,
    ...(where ? [`  ${where}`] : []),
    `  saved ${r.savedAt.replace('T', ' ').slice(0, 16)} UTC; changes: ${r.summary}`,
    '',
    tableFormat([
      ['fuel load', sheet.fuelLoad === undefined ? '—' : quantityFormat(sheet.fuelLoad, 'mass', system)],
      ['anti-roll bar front', sheet.antiRollBar.front || '—'],
      ['anti-roll bar rear', sheet.antiRollBar.rear || '—'],
    ]),
    '',
    tableFormat(cornerRows(sheet.corners, system)),
    '',
    'Ride figures (linear model)',
    tableFormat([
      ['', ...CORNER_POSITIONS],
      [
        'wheel rate',
        ...CORNER_POSITIONS.map((p) => quantityFormat(out.figures[p].wheelRate, 'stiffness', system)),
      ],
      [
        'ride frequency',
        ...CORNER_POSITIONS.map((p) => `${numberFormat(out.figures[p].rideFrequencyHz, 2)} Hz`),
      ],
      [
        'wheel hop',
        ...CORNER_POSITIONS.map((p) => `${numberFormat(out.figures[p].wheelHopFrequencyHz, 2)} Hz`),
      ],
      ['ζ bump', ...CORNER_POSITIONS.map((p) => numberFormat(out.figures[p].dampingRatio.bump, 3))],
      ['ζ rebound', ...CORNER_POSITIONS.map((p) => numberFormat(out.figures[p].dampingRatio.rebound, 3))],
    ]),
  ];
  lines.push('', 'Damper curves the figures use');
  for (const d of out.dampers)
    lines.push(textWrap(`${d.position}: ${d.source.text}`, 96, '    ').replace(/^ {4}/, '  '));
  if (sheet.notes) lines.push('', textWrap(`Notes: ${sheet.notes}`, 96));
  lines.push(...warningLines(out.warnings, 'Warnings'), '', textWrap(`Caution: ${out.caution}`, 96), '');
  return lines.join('\n');
}

function figureText(value: number, unit: string): string {
  return unit === 'Hz' ? `${numberFormat(value, 2)} Hz` : numberFormat(value, 3);
}

function diffHuman(out: HandlerOutput<'setupDiff'>): string {
  const name = (s: HandlerOutput<'setupDiff'>['a']) => `${s.vehicle}@${s.revision} "${s.name}"`;
  const lines = [`Setup diff: ${name(out.a)} → ${name(out.b)}`, ''];
  const label = (f: HandlerOutput<'setupDiff'>['fields'][number]) =>
    `${f.position ? `${f.position} ` : ''}${f.label}`;
  // Quantities line up as numbers with their unit; texts read as before → after.
  const quantities = out.fields.filter((f) => f.unit !== '' || /^[-+\d.]/.test(f.before ?? f.after ?? ''));
  const texts = out.fields.filter((f) => !quantities.includes(f));
  if (out.fields.length === 0) lines.push('No field differs.');
  if (quantities.length > 0)
    lines.push(
      'Changed values',
      tableFormat([
        ['field', 'before', 'after', 'unit'],
        ...quantities.map((f) => {
          const [before, after] = setupChangeText(f);
          return [label(f), before ?? '—', after ?? '—', f.unit];
        }),
      ]),
    );
  if (texts.length > 0) {
    if (quantities.length > 0) lines.push('');
    lines.push('Changed texts');
    for (const f of texts)
      lines.push(
        textWrap(
          `${label(f)}: ${f.before === null ? '—' : `"${f.before}"`} → ${f.after === null ? '—' : `"${f.after}"`}`,
          96,
          '    ',
        ).replace(/^ {4}/, '  '),
      );
  }
  lines.push('', 'Ride figures (linear model)');
  if (out.figures.length === 0) lines.push('  unchanged');
  else
    lines.push(
      tableFormat([
        ['corner', 'figure', 'before', 'after', 'change'],
        ...out.figures.map((f) => [
          f.position,
          f.label,
          figureText(f.before, f.unit),
          figureText(f.after, f.unit),
          `${f.after >= f.before ? '+' : ''}${numberFormat((100 * (f.after - f.before)) / f.before, 1)} %`,
        ]),
      ]),
    );
  lines.push(
    ...warningLines(out.warnings, `Warnings for ${out.b.vehicle}@${out.b.revision}`),
    '',
    textWrap(`Caution: ${CAUTION_TEXT}`, 96),
    '',
  );
  return lines.join('\n');
}

function historyHuman(out: HandlerOutput<'setupHistory'>): string {
  if (out.revisions.length === 0)
    return `"${out.vehicle.name}" has no setup saved yet (rideledger setup save FILE --vehicle "${out.vehicle.name}").\n`;
  const rows = out.revisions.map((r) => [
    String(r.number),
    r.parent === null ? '—' : String(r.parent),
    r.date ?? r.savedAt.slice(0, 10),
    r.event,
    r.name,
    r.summary,
  ]);
  return `${out.vehicle.name}\n${tableFormat([['rev', 'parent', 'date', 'event', 'name', 'what changed'], ...rows])}\n`;
}

export async function setupCommand(args: string[], io: CliIo): Promise<number> {
  const [sub, ...rest] = args;
  const { values, positionals } = commandArgsParse(rest, {
    vehicle: { type: 'string' },
    'based-on': { type: 'string' },
    units: { type: 'string' },
    file: { type: 'boolean' },
    out: { type: 'string' },
    force: { type: 'boolean' },
    'new-damper': { type: 'string', multiple: true },
  });
  if (helpShown(values, sub, SETUP_USAGE, io)) return EXIT_OK;
  const units = unitSystemParse(values.units);
  const count = (n: number, what: string) => {
    if (positionals.length !== n)
      throw new UsageError(`${what} (got ${positionals.length} arguments); see rideledger setup --help`);
  };
  switch (sub) {
    case 'save': {
      count(1, 'setup save needs one setup file');
      const basedOn = values['based-on'];
      if (basedOn !== undefined && !/^\d+$/.test(basedOn))
        throw new UsageError(`--based-on: "${basedOn}" is not a revision number`);
      const file = await readJsonFile(positionals[0] as string);
      const input: Record<string, unknown> = { file };
      if (values.vehicle !== undefined) input.vehicle = values.vehicle;
      if (basedOn !== undefined) input.basedOnRevision = Number(basedOn);
      input.units = units;
      const newDampers = values['new-damper'];
      if (newDampers !== undefined) input.newDamperUnits = newDampers;
      const out = await withStore(values.db, io, 'write', (ctx) =>
        apiCall('setupSave', input, ctx).catch((e: unknown) => {
          // The option's own name, not the API's, in a message the command prints.
          if (e instanceof InputError && e.field === 'newDamperUnits')
            throw new InputError('--new-damper', e.problem);
          const unknown =
            e instanceof InputError ? /^damper unit (".*") is not in the library/.exec(e.problem) : null;
          if (e instanceof InputError && unknown)
            throw new InputError(e.field, `${e.problem} (--new-damper ${unknown[1]})`);
          throw e;
        }),
      );
      if (values.json) io.stdout(json(out));
      else {
        const lines = [
          `Saved ${out.vehicle.name} revision ${out.revision.number} "${out.revision.name}"${out.revision.parent ? ` from revision ${out.revision.parent}` : ''}: ${out.revision.summary}`,
        ];
        if (out.branched)
          lines.push(`  (revision ${out.revision.parent} is not the newest: this starts a branch from it)`);
        if (out.dampersCreated.length)
          lines.push(`  new damper units in the library: ${out.dampersCreated.join(', ')}`);
        io.stdout(`${lines.join('\n')}\n`);
      }
      return EXIT_OK;
    }
    case 'show': {
      count(1, 'setup show needs one revision, VEHICLE or VEHICLE@N');
      const ref = revisionRefParse(positionals[0] as string, 'revision', values.vehicle);
      const out = await withStore(values.db, io, 'read', (ctx) =>
        apiCall('setupShow', { ...ref, units }, ctx),
      );
      const fileText = `${JSON.stringify(out.file, null, 2)}\n`;
      if (values.out !== undefined) {
        outputFileWrite(values.out, fileText, values.force === true);
        io.stdout(
          `Wrote ${out.vehicle.name} revision ${out.revision.number} to ${values.out} (save it again after editing; it records revision ${out.revision.number} as its parent).\n`,
        );
      } else if (values.file) io.stdout(fileText);
      else io.stdout(values.json ? json(out) : showHuman(out, units));
      return EXIT_OK;
    }
    case 'history': {
      count(1, 'setup history needs the vehicle name');
      const out = await withStore(values.db, io, 'read', (ctx) =>
        apiCall('setupHistory', { vehicle: positionals[0] as string }, ctx),
      );
      io.stdout(values.json ? json(out) : historyHuman(out));
      return EXIT_OK;
    }
    case 'diff': {
      if (positionals.length < 1 || positionals.length > 2)
        throw new UsageError(
          `setup diff needs one or two revisions, e.g. "Coupe@3" "Coupe@5" (got ${positionals.length}); see rideledger setup --help`,
        );
      const out = await withStore(values.db, io, 'read', async (ctx) => {
        const pair = await revisionPairOf(positionals, values.vehicle, ctx);
        return apiCall('setupDiff', { ...pair, units }, ctx);
      });
      io.stdout(values.json ? json(out) : diffHuman(out));
      return EXIT_OK;
    }
    default:
      throw new UsageError(
        `setup needs save, show, history or diff${sub ? ` (got "${sub}")` : ''}; see rideledger setup --help`,
      );
  }
}
