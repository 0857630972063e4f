import { CORNER_POSITIONS } from '../../core/setup/setup-sheet';
import {
  numberFormat,
  quantityFormat,
  quantityToDisplay,
  quantityUnitLabel,
  type QuantityKind,
  type UnitSystem,
} from '../../core/units/units';
import { VALVING_HEADLINES, type ValvingHeadlineKey } from '../../core/valving/valving-rank';
import {
  VALVING_TARGET_KEYS,
  VALVING_TARGET_SPECS,
  valvingTargetAssignmentParse,
  type ValvingTargetKey,
} from '../../core/valving/valving-targets';
import { InputError } from '../../core/units/input-error';
import type { HandlerOutput } from '../api/contract';
import { UsageError } from './cli-io';
import { readJsonFile } from './read-json-file';
import { textWrap } from './table';

/** Words of the readable valving reports (choose, compare, damping-map), shared so they read alike. */

type Judged = Pick<
  HandlerOutput<'valvingChoose'>,
  'preset' | 'scenario' | 'scenarioSource' | 'targets' | 'objective'
>;
type Check = HandlerOutput<'valvingChoose'>['corners'][number]['best'][number]['checks'][number];
type Balance = HandlerOutput<'valvingChoose'>['balance'];

/** A value of `kind` in the display unit (a plain number to 3 decimals when kind is null); "—" for null. */
export function valvingValueText(
  v: number | null,
  kind: QuantityKind | null,
  system: UnitSystem,
  signed = false,
): string {
  if (v === null) return '—';
  const sign = signed && v > 0 ? '+' : '';
  if (kind === null) return `${sign}${numberFormat(v, 3)}`;
  if (kind === 'time') return `${sign}${numberFormat(v * 1000, 1)} ms`;
  return `${sign}${quantityFormat(v, kind, system)}`;
}

/** A headline figure as text. */
export function valvingHeadlineText(
  key: ValvingHeadlineKey,
  v: number | null,
  system: UnitSystem,
  signed = false,
): string {
  return valvingValueText(v, VALVING_HEADLINES[key].kind, system, signed);
}

function bandText(
  low: number | null,
  high: number | null,
  kind: QuantityKind | null,
  system: UnitSystem,
): string {
  const t = (v: number) => valvingValueText(v, kind, system);
  if (low !== null && high !== null) {
    // One unit for the band: "0.30–0.61", "1.00–2.50 Hz".
    const unit = kind === null ? '' : kind === 'time' ? ' ms' : ` ${quantityUnitLabel(kind, system)}`;
    const bare = (v: number) =>
      kind === null
        ? numberFormat(v, 2)
        : kind === 'time'
          ? numberFormat(v * 1000, 0)
          : numberFormat(quantityToDisplay(v, kind, system), 2);
    return `${bare(low)}–${bare(high)}${unit}`;
  }
  return high !== null ? `at most ${t(high)}` : `at least ${t(low as number)}`;
}

/** The scenario in one line. */
export function valvingScenarioText(s: Judged['scenario'], system: UnitSystem): string {
  const mm = (v: number) => quantityFormat(v, 'length', system);
  const speed = (v: number) => quantityFormat(v, 'speed', system);
  const m = (v: number) => quantityFormat(v, 'length', system, { decimals: system === 'si' ? 0 : 1 });
  return `ISO 8608 class ${s.road.roadClass} road at ${speed(s.road.speed)}; (1−cos) bump ${mm(s.bump.height)} high, ${m(s.bump.length)} long, at ${speed(s.bump.speed)}; curb ${mm(s.curb.height)} high (ramp ${m(s.curb.rise)}, top ${m(s.curb.hold)}, drop ${m(s.curb.drop)}) at ${speed(s.curb.speed)}`;
}

/** The preset, the scenario, every target with its band, weight and source, and the objective. */
export function valvingJudgedLines(j: Judged, system: UnitSystem, scenarioHead = 'Judged on'): string[] {
  const lines = [
    `Preset: ${j.preset.title} (${j.preset.name}) — ${j.preset.use}`,
    textWrap(
      `${scenarioHead}: ${valvingScenarioText(j.scenario, system)} [${j.scenarioSource.tag}: ${j.scenarioSource.text}]`,
      96,
      '    ',
    ).replace(/^ {4}/, '  '),
    '  Targets (band, weight, source):',
  ];
  for (const key of VALVING_TARGET_KEYS) {
    const t = j.targets[key];
    if (!t) continue;
    const kind = VALVING_TARGET_SPECS[key].kind;
    lines.push(
      textWrap(
        `${key}: ${bandText(t.low, t.high, kind, system)}, weight ${numberFormat(t.weight, t.weight % 1 === 0 ? 0 : 2)} [${t.source.tag}: ${t.source.text}]`,
        96,
        '        ',
      ).replace(/^ {8}/, '    '),
    );
  }
  lines.push(textWrap(`Objective: ${j.objective}`, 96, '    ').replace(/^ {4}/, '  '));
  return lines;
}

/** A check as a phrase: "ζ bump, high speed 0.149 — 0.151 below 0.30–0.50". */
export function valvingCheckText(c: Check, system: UnitSystem): string {
  const kind = VALVING_TARGET_SPECS[c.target as ValvingTargetKey].kind;
  const band = bandText(c.low, c.high, kind, system);
  const value = valvingValueText(c.value, kind, system);
  if (c.met) return `${c.figure} ${value} (${band})`;
  const by = valvingValueText(Math.abs(c.miss), kind, system);
  return `${c.figure} ${value} — ${by} ${c.miss > 0 ? 'above' : 'below'} ${band}`;
}

/** "meets …" and "misses …" lines of a pick's checks, wrapped. */
export function valvingCheckLines(checks: readonly Check[], system: UnitSystem, indent: string): string[] {
  const met = checks.filter((c) => c.met);
  const missed = checks.filter((c) => !c.met);
  const out: string[] = [];
  const wrap = (head: string, items: Check[]) =>
    textWrap(
      `${head} ${items.map((c) => valvingCheckText(c, system)).join('; ')}`,
      96,
      `${indent}    `,
    ).replace(new RegExp(`^${indent} {4}`), indent);
  if (missed.length) out.push(wrap('misses:', missed));
  if (met.length) out.push(wrap('meets:', met));
  return out;
}

/** Warnings as a list under a heading. */
export function valvingWarningLines(
  warnings: readonly { message: string }[],
  indent: string,
  prefix = '',
): string[] {
  if (warnings.length === 0) return [`${indent}none from the model`];
  return warnings.map((w) =>
    textWrap(`${prefix}${w.message}`, 96, `${indent}  `).replace(new RegExp(`^${indent} {2}`), `${indent}- `),
  );
}

/** The front/rear balance block. */
export function valvingBalanceLines(b: Balance, heading: string): string[] {
  if (!b) return [];
  const f2 = (v: number) => numberFormat(v, 2);
  return [
    heading,
    `  ride frequency   front ${f2(b.front.rideFrequencyHz)} Hz, rear ${f2(b.rear.rideFrequencyHz)} Hz, rear ÷ front ${f2(b.ratio.rideFrequency)} — ${b.flatRide.met ? 'within' : 'outside'} ${f2(b.flatRide.low)}–${f2(b.flatRide.high)} [${b.flatRide.source.tag}: ${b.flatRide.source.text}]`,
    `  ζ bump           front ${numberFormat(b.front.zetaBump, 3)}, rear ${numberFormat(b.rear.zetaBump, 3)}, rear ÷ front ${f2(b.ratio.zetaBump)}`,
    `  ζ rebound        front ${numberFormat(b.front.zetaRebound, 3)}, rear ${numberFormat(b.rear.zetaRebound, 3)}, rear ÷ front ${f2(b.ratio.zetaRebound)}`,
    `  ζ low-speed mean front ${numberFormat(b.front.lowSpeedMean, 3)}, rear ${numberFormat(b.rear.lowSpeedMean, 3)}, rear ÷ front ${f2(b.ratio.lowSpeedMean)}`,
  ];
}

/** The two cautions, wrapped. */
export function valvingCautionLines(out: { caution: string; valvingCaution: string }): string[] {
  return [textWrap(`Caution: ${out.caution}`, 96), textWrap(out.valvingCaution, 96)];
}

/** Corner positions from `--corner` values: FL, FR, RL, RR, comma lists, "front", "rear", "all". */
export function cornerListParse(values: readonly string[] | undefined): (typeof CORNER_POSITIONS)[number][] {
  if (!values || values.length === 0)
    throw new UsageError('give the corner(s) to choose for: --corner FL (or FR, RL, RR, front, rear, all)');
  const out = new Set<(typeof CORNER_POSITIONS)[number]>();
  for (const part of values.flatMap((v) => v.split(',')).map((p) => p.trim().toUpperCase())) {
    if (part === 'ALL') CORNER_POSITIONS.forEach((p) => out.add(p));
    else if (part === 'FRONT') ['FL', 'FR'].forEach((p) => out.add(p as 'FL'));
    else if (part === 'REAR') ['RL', 'RR'].forEach((p) => out.add(p as 'RL'));
    else if ((CORNER_POSITIONS as readonly string[]).includes(part)) out.add(part as 'FL');
    else
      throw new InputError(
        '--corner',
        `"${part}" is not a corner; expected FL, FR, RL, RR, front, rear or all`,
      );
  }
  return CORNER_POSITIONS.filter((p) => out.has(p));
}

/** The options with which choose and compare edit a preset (see valvingEditsFromOptions). */
export const VALVING_EDIT_OPTIONS = {
  preset: { type: 'string' },
  target: { type: 'string', multiple: true },
  weight: { type: 'string', multiple: true },
  targets: { type: 'string' },
  road: { type: 'string' },
  speed: { type: 'string' },
  units: { type: 'string' },
} as const;

/** What the targets options of choose and compare give: the API's edits of a preset. */
export type ValvingEditsInput = {
  preset?: string;
  scenario?: Record<string, unknown>;
  targets?: Record<string, unknown>;
  weights?: Record<string, unknown>;
};

function objectOf(raw: unknown, field: string): Record<string, unknown> | undefined {
  if (raw === undefined) return undefined;
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw))
    throw new InputError(field, 'expected an object');
  return raw as Record<string, unknown>;
}

/**
 * The preset edits from the command line: a targets file (JSON, our own form:
 * {"preset", "scenario", "targets", "weights"}), then --road/--speed, --target NAME=BAND and
 * --weight NAME=W on top of it.
 */
export async function valvingEditsFromOptions(values: {
  targets?: string | undefined;
  road?: string | undefined;
  speed?: string | undefined;
  target?: string[] | undefined;
  weight?: string[] | undefined;
}): Promise<ValvingEditsInput> {
  const edits: ValvingEditsInput = {};
  if (values.targets !== undefined) {
    const raw = objectOf(await readJsonFile(values.targets), values.targets) as Record<string, unknown>;
    const known = ['format', 'version', 'preset', 'scenario', 'targets', 'weights'];
    const extra = Object.keys(raw).find((k) => !known.includes(k));
    if (extra)
      throw new InputError(
        `${values.targets}, ${extra}`,
        `is not a field of a targets file (${known.join(', ')})`,
      );
    if (raw.preset !== undefined) {
      if (typeof raw.preset !== 'string')
        throw new InputError(`${values.targets}, preset`, 'expected a preset name');
      edits.preset = raw.preset;
    }
    const scenario = objectOf(raw.scenario, `${values.targets}, scenario`);
    const targets = objectOf(raw.targets, `${values.targets}, targets`);
    const weights = objectOf(raw.weights, `${values.targets}, weights`);
    if (scenario) edits.scenario = scenario;
    if (targets) edits.targets = targets;
    if (weights) edits.weights = weights;
  }
  if (values.road !== undefined || values.speed !== undefined) {
    const road = { ...(objectOf(edits.scenario?.road, 'scenario.road') ?? {}) };
    if (values.road !== undefined) road.class = values.road;
    if (values.speed !== undefined) road.speed = values.speed;
    edits.scenario = { ...edits.scenario, road };
  }
  for (const [list, key] of [
    [values.target, 'targets'],
    [values.weight, 'weights'],
  ] as const) {
    for (const text of list ?? []) {
      const [name, value] = valvingTargetAssignmentParse(text, key === 'targets' ? '--target' : '--weight');
      edits[key] = { ...edits[key], [name]: value.trim() };
    }
  }
  return edits;
}
