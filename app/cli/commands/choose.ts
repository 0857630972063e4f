import { clickSettingsText } from '../../../core/damper/click-settings';
import { numberFormat, type UnitSystem } from '../../../core/units/units';
import type { ValvingHeadlineKey } from '../../../core/valving/valving-rank';
import { VALVING_HEADLINES, valvingStepText } from '../../../core/valving/valving-rank';
import { ValvingSweepStopped } from '../../../core/valving/valving-sweep';
import { apiCall } from '../../api/call';
import type { HandlerOutput } from '../../api/contract';
import { EXIT_OK, UsageError, type CliIo } from '../cli-io';
import { commandArgsParse, helpShown, jsonText } from '../command-args';
import { revisionRefParse } from '../revision-ref';
import { withStore } from '../store-session';
import { tableFormat, textWrap } from '../table';
import {
  cornerListParse,
  valvingBalanceLines,
  valvingCautionLines,
  valvingCheckLines,
  VALVING_EDIT_OPTIONS,
  valvingEditsFromOptions,
  valvingHeadlineText,
  valvingJudgedLines,
  valvingWarningLines,
} from '../valving-report';
import { unitSystemParse } from './analyze';

export const CHOOSE_USAGE = `rideledger [--db FILE] choose --vehicle VEHICLE[@N] --corner FL --preset NAME [options] [--json]
rideledger choose --presets [--json]

  Sweeps every click combination of a damper unit's bench data on a corner of a revision
  (the newest without @N): the linear ζ figures, the random road, and the bump and curb on
  the nonlinear quarter car with the measured curves (each run's bench table), then ranks
  them against the preset's targets and shows the best few — which targets they meet and
  miss by how much, how the figures move to the next setting on the map either way (named
  in clicks), the clicks the corner runs now, and the front/rear balance when both axles
  are chosen. It reads only; nothing is stored.

  --corner C         FL, FR, RL, RR, front, rear or all (repeat, or a comma list)
  --damper LABEL     the damper unit whose bench runs to use (default: the corner's own)
  --preset NAME      road-comfort, track-day, rally-stage or high-downforce-circuit
  --presets          lists the presets: a suggested scenario and every target band with
                     its source
  --interpolate      also clicks between measured ones, interpolated between measured
                     neighbours (never beyond them) and marked * (interpolated)
  --target NAME=BAND a band: LOW..HIGH, ..HIGH or LOW.. (quantities with units, e.g.
                     "airborneTime=..20 ms"), or NAME=off (repeatable)
  --weight NAME=W    a target's weight; 0 shows it without scoring it (repeatable)
  --targets FILE     a JSON file {"preset", "scenario", "targets", "weights"} (the flags
                     apply on top of it); scenario {road: {class, speed}, bump: {height,
                     length, speed}, curb: {height, rise, hold, drop, speed}}
  --road CLASS --speed SPEED   the random road (ISO 8608 class A–H and speed); the road,
                     bump and curb not given are the vehicle's scenario (rideledger vehicle
                     scenario NAME shows and sets it)
  --best N           how many to show per corner (default 3)
  --threads N        worker threads (default one a core; 0 works in this thread only)
  --units si|us`;

type ChooseOut = HandlerOutput<'valvingChoose'>;

/** Exit code of a command stopped by Ctrl-C (128 + SIGINT), as shells report it. */
const EXIT_INTERRUPTED = 130;
type Pick = ChooseOut['corners'][number]['best'][number];

/** The columns of the ranking table: the headline figures a choice moves. */
const RANK_COLUMNS: readonly ValvingHeadlineKey[] = [
  'zetaBump',
  'zetaRebound',
  'zetaBumpHighSpeed',
  'zetaReboundHighSpeed',
  'bodyDampingRatio',
  'roadTireLoad',
  'bumpPeakAccel',
  'curbAirborneTime',
  'bumpStopTime',
];

/** Clicks with the interpolation mark. */
function clicksText(clicks: Pick['clicks'], source: string | null): string {
  return `${clickSettingsText(clicks) || '(no clicker)'}${source === 'interpolated' ? ' *' : ''}`;
}

function rankRows(c: ChooseOut['corners'][number], system: UnitSystem): string[][] {
  const row = (label: string, p: Pick) => [
    label,
    clicksText(p.clicks, p.source),
    numberFormat(p.score, 3),
    `${p.met} of ${p.met + p.missed}`,
    ...RANK_COLUMNS.map((k) => valvingHeadlineText(k, p.headline[k], system)),
  ];
  return [
    ['rank', 'clicks', 'score', 'targets met', ...RANK_COLUMNS.map((k) => VALVING_HEADLINES[k].short)],
    ...c.best.map((p) => row(String(p.rank), p)),
    ...(c.current ? [row(`now (${c.current.rank})`, c.current)] : []),
  ];
}

function sensitivityRows(p: Pick, system: UnitSystem): string[][] {
  const columns: ValvingHeadlineKey[] = [
    'zetaBump',
    'zetaRebound',
    'roadTireLoad',
    'bumpPeakAccel',
    'curbAirborneTime',
  ];
  return [
    ['step', 'clicks', 'score', ...columns.map((k) => `Δ ${VALVING_HEADLINES[k].short}`)],
    ...p.sensitivity.map((s) => [
      valvingStepText(s, p.clicks),
      clicksText(s.clicks, s.source),
      s.score === null ? 'not on the map' : numberFormat(s.score, 3),
      ...columns.map((k) => (s.change ? valvingHeadlineText(k, s.change[k], system, true) : '—')),
    ]),
  ];
}

function chooseHuman(out: ChooseOut, system: UnitSystem): string {
  const heads = RANK_COLUMNS.map((k) => `${VALVING_HEADLINES[k].short}: ${VALVING_HEADLINES[k].label}`);
  const lines = [
    `Valving choice: ${out.vehicle.name}@${out.revision}`,
    ...valvingJudgedLines(out, system),
    '',
  ];
  const legend = textWrap(`Columns — ${heads.join('; ')}.`, 96, '    ').replace(/^ {4}/, '  ');
  for (const d of out.dampers) {
    const range = d.axes
      .map((a) => `${a.adjuster} ${a.clicks[0]}–${a.clicks[a.clicks.length - 1]}`)
      .join(', ');
    lines.push(
      `Damper ${d.label} (${d.positions.join(', ')}): ${d.cells} click combinations${range ? ` (${range})` : ''}, ${d.measured} measured, ${d.interpolated} interpolated${d.interpolate ? ' (marked *)' : ' (not asked for: --interpolate)'}`,
    );
    for (const n of d.notes) lines.push(textWrap(`note: ${n}`, 96, '    ').replace(/^ {4}/, '  '));
  }
  lines.push(`${out.combinations} combinations evaluated.`, legend, '');
  for (const c of out.corners) {
    lines.push(
      `${c.position} — damper ${c.damper}: ${c.meetingAll} of ${c.evaluated} combinations meet every target${c.current ? `; now at ${clicksText(c.current.clicks, c.current.source)}, rank ${c.current.rank}` : ''}`,
      tableFormat(rankRows(c, system)),
    );
    const best = c.best[0];
    if (best) {
      lines.push(
        `  Why rank 1 (${clicksText(best.clicks, best.source)}${best.source === 'interpolated' ? `, interpolated between runs ${best.runIds.map((i) => `#${i}`).join(', ')}` : `, run ${best.runIds.map((i) => `#${i}`).join(', ')}`}):`,
        ...valvingCheckLines(best.checks, system, '    '),
        '  The next setting on the map either way from rank 1:',
        best.sensitivity.length
          ? tableFormat(sensitivityRows(best, system), { indent: 4 })
          : '    no other setting on the map',
        '  Warnings of the model for rank 1:',
        ...valvingWarningLines(best.warnings, '    '),
      );
    }
    lines.push('');
  }
  const shown = out.corners.flatMap((c) => [...c.best, ...(c.current ? [c.current] : [])]);
  if (
    shown.some((p) => p.source === 'interpolated' || p.sensitivity.some((s) => s.source === 'interpolated'))
  )
    lines.push('* interpolated between measured neighbours, not measured: confirm on the bench', '');
  const balance = valvingBalanceLines(out.balance, 'Front/rear balance of the rank-1 picks');
  if (balance.length) lines.push(...balance, '');
  lines.push(...valvingCautionLines(out), '');
  return lines.join('\n');
}

function presetsHuman(out: HandlerOutput<'valvingPresets'>, system: UnitSystem): string {
  const lines: string[] = [];
  for (const p of out.presets) {
    lines.push(
      ...valvingJudgedLines(
        {
          preset: p,
          scenario: p.scenario,
          scenarioSource: p.scenarioSource,
          targets: p.targets,
          objective: out.objective,
        },
        system,
        // A choice is judged on the vehicle's own scenario; a preset's is a suggestion for it.
        'Suggested scenario (vehicle scenario NAME … sets it)',
      ).slice(0, -1),
      '',
    );
  }
  lines.push(
    'Targets there are (a band in the unit of its figure; --target NAME=LOW..HIGH):',
    ...out.targets.map((t) => `  ${t.key.padEnd(16)} ${t.label}${t.kind ? ` (${t.kind})` : ''}`),
    '',
    textWrap(`Objective: ${out.objective}`, 96),
    '',
  );
  return lines.join('\n');
}

export async function chooseCommand(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = commandArgsParse(args, {
    vehicle: { type: 'string' },
    corner: { type: 'string', multiple: true },
    damper: { type: 'string' },
    presets: { type: 'boolean' },
    interpolate: { type: 'boolean' },
    best: { type: 'string' },
    threads: { type: 'string' },
    ...VALVING_EDIT_OPTIONS,
  });
  if (helpShown(values, undefined, CHOOSE_USAGE, io)) return EXIT_OK;
  const units = unitSystemParse(values.units);
  if (positionals.length > 0)
    throw new UsageError(`choose takes options only (got "${positionals[0]}"); see rideledger choose --help`);
  if (values.presets) {
    const out = await withStore(values.db, io, 'read', (ctx) => apiCall('valvingPresets', {}, ctx));
    io.stdout(values.json ? jsonText(out) : presetsHuman(out, units));
    return EXIT_OK;
  }
  if (values.vehicle === undefined)
    throw new UsageError(
      'choose needs --vehicle VEHICLE (or VEHICLE@N for a revision other than the newest)',
    );
  const ref = revisionRefParse(values.vehicle, '--vehicle');
  const corners = cornerListParse(values.corner);
  const edits = await valvingEditsFromOptions(values);
  const preset = values.preset ?? edits.preset;
  if (preset === undefined)
    throw new UsageError(
      'choose needs --preset NAME (road-comfort, track-day, rally-stage, high-downforce-circuit); --presets lists them',
    );
  const count = (text: string | undefined, flag: string) => {
    if (text === undefined) return undefined;
    if (!/^\d+$/.test(text.trim())) throw new UsageError(`${flag}: "${text}" is not a whole number`);
    return Number(text);
  };
  const input: Record<string, unknown> = { ...ref, corners, preset, ...edits };
  if (values.damper !== undefined) input.damper = values.damper;
  // JSON is SI throughout, its words included; the readable report speaks the chosen system.
  if (!values.json) input.units = units;
  if (values.interpolate) input.interpolate = true;
  const best = count(values.best, '--best');
  if (best !== undefined) input.best = best;
  const threads = count(values.threads, '--threads');
  if (threads !== undefined) input.threads = threads;
  // Ctrl-C stops the sweep between combinations and closes the database cleanly.
  const controller = new AbortController();
  const stop = () => controller.abort(new ValvingSweepStopped(0, 0));
  const showProgress = process.stderr.isTTY === true;
  let shown = -1;
  const onProgress = (done: number, total: number) => {
    const percent = Math.floor((100 * done) / total);
    if (percent === shown) return;
    shown = percent;
    io.stderr(
      `\rrideledger choose: ${done} of ${total} combinations (${percent} %)${done === total ? '\n' : ''}`,
    );
  };
  process.once('SIGINT', stop);
  let out: ChooseOut;
  try {
    out = await withStore(values.db, io, 'read', (ctx) =>
      apiCall('valvingChoose', input, {
        ...ctx,
        signal: controller.signal,
        ...(showProgress ? { onProgress } : {}),
      }),
    );
  } catch (e) {
    if (!(e instanceof ValvingSweepStopped)) throw e;
    io.stderr('\nrideledger choose: stopped before every combination was evaluated; nothing was chosen\n');
    return EXIT_INTERRUPTED;
  } finally {
    process.off('SIGINT', stop);
  }
  io.stdout(values.json ? jsonText(out) : chooseHuman(out, units));
  return EXIT_OK;
}
