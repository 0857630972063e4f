import { clickSettingsText } from '../../../core/damper/click-settings';
import { numberFormat, type UnitSystem } from '../../../core/units/units';
import {
  VALVING_VERDICT_RULE,
  valvingHeadlineVerdict,
  valvingScoreVerdict,
} from '../../../core/valving/valving-compare';
import { VALVING_HEADLINE_KEYS, VALVING_HEADLINES } from '../../../core/valving/valving-rank';
import type { ValvingTargets } from '../../../core/valving/valving-targets';
import { apiCall } from '../../api/call';
import type { HandlerOutput } from '../../api/contract';
import { EXIT_OK, UsageError, type CliIo } from '../cli-io';
import { commandArgsParse, helpShown, jsonText } from '../command-args';
import { revisionPairOf } from '../revision-ref';
import { withStore } from '../store-session';
import { tableFormat, textWrap } from '../table';
import {
  valvingBalanceLines,
  valvingCautionLines,
  valvingCheckLines,
  VALVING_EDIT_OPTIONS,
  valvingEditsFromOptions,
  valvingHeadlineText,
  valvingJudgedLines,
  valvingValueText,
  valvingWarningLines,
} from '../valving-report';
import { unitSystemParse } from './analyze';

export const COMPARE_USAGE = `rideledger [--db FILE] compare VEHICLE@A [VEHICLE@B] [--road CLASS --speed SPEED] [options] [--json]

  The track-day sheet: two revisions side by side, corner by corner, each damper at its
  clicks (the bench's curve there, else the one entered) — ride and body-mode figures, ζ,
  the random road, the bump and the curb on the nonlinear quarter car — with the change,
  the targets each meets and misses, the model's warnings and the front/rear balance.
  With one revision: against its parent.
  With --vehicle, revisions may be plain numbers: compare 3 5 --vehicle Coupe.

  --preset NAME      the targets (default track-day; choose --presets lists them)
  --road CLASS --speed SPEED   the random road (ISO 8608 class A–H and speed); without
                     them, the first vehicle's scenario (rideledger vehicle scenario NAME)
  --target NAME=BAND, --weight NAME=W, --targets FILE   as for choose
  --units si|us`;

type CompareOut = HandlerOutput<'setupCompare'>;

function compareHuman(out: CompareOut, system: UnitSystem): string {
  const tag = (s: CompareOut['a']) => `@${s.revision}`;
  const lines = [
    `Track-day sheet: ${out.a.vehicle}@${out.a.revision} "${out.a.name}" → ${out.b.vehicle}@${out.b.revision} "${out.b.name}"`,
    ...valvingJudgedLines(out, system),
    textWrap(`Verdicts: ${VALVING_VERDICT_RULE}`, 96, '    ').replace(/^ {4}/, '  '),
    '',
  ];
  for (const c of out.corners) {
    const damper = (s: CompareOut['corners'][number]['a']) =>
      `${s.damperUnit || 'damper'}${clickSettingsText(s.clicks) ? ` ${clickSettingsText(s.clicks)}` : ''}`;
    lines.push(
      `${c.position}: ${damper(c.a)} → ${damper(c.b)}`,
      tableFormat([
        ['figure', tag(out.a), tag(out.b), 'change', 'verdict'],
        ...VALVING_HEADLINE_KEYS.map((k) => [
          VALVING_HEADLINES[k].label,
          valvingHeadlineText(k, c.a.headline[k], system),
          valvingHeadlineText(k, c.b.headline[k], system),
          valvingHeadlineText(k, c.change[k], system, true),
          valvingHeadlineVerdict(k, c.a.headline[k], c.b.headline[k], out.targets as ValvingTargets) ?? '',
        ]),
        [
          'targets met',
          `${c.a.score.met} of ${c.a.score.met + c.a.score.missed}`,
          `${c.b.score.met} of ${c.b.score.met + c.b.score.missed}`,
          '',
          '',
        ],
        [
          'score',
          numberFormat(c.a.score.score, 3),
          numberFormat(c.b.score.score, 3),
          valvingValueText(c.b.score.score - c.a.score.score, null, system, true),
          valvingScoreVerdict(c.a.score.score, c.b.score.score),
        ],
      ]),
    );
    for (const [s, side] of [
      [out.a, c.a],
      [out.b, c.b],
    ] as const) {
      lines.push(
        `  ${tag(s)}:`,
        ...valvingCheckLines(side.score.checks, system, '    '),
        '    warnings:',
        ...valvingWarningLines(side.warnings, '      '),
      );
    }
    lines.push('');
  }
  for (const [s, b] of [
    [out.a, out.balance.a],
    [out.b, out.balance.b],
  ] as const)
    lines.push(...valvingBalanceLines(b, `Front/rear balance ${tag(s)}`));
  lines.push('', ...valvingCautionLines(out), '');
  return lines.join('\n');
}

export async function compareCommand(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = commandArgsParse(args, {
    vehicle: { type: 'string' },
    ...VALVING_EDIT_OPTIONS,
  });
  if (helpShown(values, undefined, COMPARE_USAGE, io)) return EXIT_OK;
  const units = unitSystemParse(values.units);
  if (positionals.length < 1 || positionals.length > 2)
    throw new UsageError(
      `compare needs one or two revisions, e.g. "Coupe@3" "Coupe@5" (got ${positionals.length}); see rideledger compare --help`,
    );
  const edits = await valvingEditsFromOptions(values);
  const preset = values.preset ?? edits.preset ?? 'track-day';
  const out = await withStore(values.db, io, 'read', async (ctx) => {
    const pair = await revisionPairOf(positionals, values.vehicle, ctx);
    // JSON is SI throughout, its words included; the readable sheet speaks the chosen system.
    return apiCall('setupCompare', { ...pair, preset, ...edits, units: values.json ? 'si' : units }, ctx);
  });
  io.stdout(values.json ? jsonText(out) : compareHuman(out, units));
  return EXIT_OK;
}
