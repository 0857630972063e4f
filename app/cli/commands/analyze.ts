import { figureLabel, figureText } from '../../../core/units/figure-labels';
import { parseArgs } from 'node:util';
import { CAUTION_TEXT } from '../../../core/safety/caution';
import type { CornerAnalysis } from '../../../core/figures/corner-analysis';
import { InputError } from '../../../core/units/input-error';
import { STEP_HEIGHT } from '../../../core/corner/step-response';
import {
  numberFormat,
  quantityFormat,
  quantityToDisplay,
  quantityUnitLabel,
  type QuantityKind,
  type UnitSystem,
} from '../../../core/units/units';
import { analyzeCornerFile } from '../../api/handlers/analyze';
import { eventMetricsLines } from '../event-report';
import { EXIT_OK, UsageError, type CliIo } from '../cli-io';
import { readJsonFile } from '../read-json-file';
import { tableFormat, textWrap } from '../table';

export const ANALYZE_USAGE = `rideledger analyze FILE [--json] [--frequencies 0.5,1,2] [--units si|us]

  Reads a corner file and prints its ride figures: rates, ride and wheel-hop frequency,
  damping ratios and class, modes, the 10 mm step, frequency response, the random-road
  figures when the file has a road, and the bump on the nonlinear quarter car (damper
  curves, bump stop, tyre lift-off) when it has a bump. --json prints one JSON object in
  SI units.`;

/** Reads `--frequencies 0.5,1,2` (Hz). */
export function frequencyListParse(text: string): number[] {
  const parts = text.split(',').map((p) => p.trim());
  if (parts.length === 0 || parts.some((p) => p === '')) {
    throw new InputError(
      '--frequencies',
      `got "${text}"; expected a comma-separated list of frequencies in Hz, e.g. 0.5,1,2`,
    );
  }
  return parts.map((p) => {
    const f = Number(p);
    if (!Number.isFinite(f) || f <= 0 || !/^[\d.eE+-]+$/.test(p)) {
      throw new InputError('--frequencies', `"${p}" is not a positive frequency in Hz`);
    }
    return f;
  });
}

export function unitSystemParse(text: string | undefined): UnitSystem {
  if (text === undefined || text === 'si') return 'si';
  if (text === 'us') return 'us';
  throw new UsageError(`--units: got "${text}"; expected si or us`);
}

/** The readable report: tables with units, the damping class in words, warnings, the caution. */
export function analyzeHumanReport(a: CornerAnalysis, system: UnitSystem): string {
  const f = a.figures;
  const c = a.file.corner;
  // A quantity as two cells, number and unit, so that the numbers line up.
  const q = (v: number, kind: QuantityKind) => quantityFormat(v, kind, system);
  const n = (v: number, decimals: number, unit = '') =>
    `${numberFormat(v, decimals)}${unit ? ` ${unit}` : ''}`;
  const out: string[] = [];
  out.push(`RideLedger ride figures${a.name ? ` — ${a.name}` : ''}`, '');
  out.push('Corner');
  out.push(
    tableFormat([
      ['corner mass', q(c.cornerMass, 'mass'), 'sprung mass', q(f.sprungMass, 'mass')],
      ['unsprung mass', q(c.unsprungMass, 'mass'), 'unsprung ÷ sprung', n(f.unsprungRatio, 3)],
      ['spring rate', q(c.springRate, 'stiffness'), 'spring motion ratio', n(c.springMotionRatio, 3)],
      ['tyre rate', q(c.tireRate, 'stiffness'), 'damper motion ratio', n(c.damperMotionRatio, 3)],
      ['static tyre load', q(f.staticTireLoad, 'force'), 'tyre damping', q(c.tireDamping, 'damping')],
    ]),
  );
  out.push('', 'Ride');
  out.push(
    tableFormat([
      ['wheel rate', q(f.wheelRate, 'stiffness')],
      ['ride rate', q(f.rideRate, 'stiffness')],
      ['ride frequency', n(f.rideFrequencyHz, 2, 'Hz')],
      ['wheel-hop frequency', n(f.wheelHopFrequencyHz, 2, 'Hz')],
      ['critical damping', q(f.criticalDamping, 'damping')],
    ]),
  );
  out.push('', `Damping at the wheel (${quantityUnitLabel('damping', system)}) and damping ratio ζ`);
  const r = f.dampingRatio;
  const wd = f.wheelDamping;
  const dv = (v: number) => quantityFormat(v, 'damping', system, { withUnit: false });
  out.push(
    tableFormat([
      ['', 'bump', 'ζ', 'rebound', 'ζ'],
      ['low speed', dv(wd.bump), numberFormat(r.bump, 3), dv(wd.rebound), numberFormat(r.rebound, 3)],
      [
        'high speed',
        dv(wd.bumpHighSpeed),
        numberFormat(r.bumpHighSpeed, 3),
        dv(wd.reboundHighSpeed),
        numberFormat(r.reboundHighSpeed, 3),
      ],
    ]),
  );
  out.push(`  low speed: bump ${f.dampingClass.bump}, rebound ${f.dampingClass.rebound}`);
  out.push('', `Modes (linear model; damping the mean of bump and rebound at low speed)`);
  const modeRows: string[][] = [];
  if (a.modes.body)
    modeRows.push([
      'body',
      n(a.modes.body.frequencyHz, 2, 'Hz'),
      'ζ',
      numberFormat(a.modes.body.dampingRatio, 3),
    ]);
  if (a.modes.wheelHop) {
    modeRows.push([
      'wheel hop',
      n(a.modes.wheelHop.frequencyHz, 2, 'Hz'),
      'ζ',
      numberFormat(a.modes.wheelHop.dampingRatio, 3),
    ]);
  }
  for (const m of a.modes.overdamped) {
    modeRows.push(['overdamped, no oscillation', 'time constant', n(m.timeConstant, 4, 's')]);
  }
  out.push(tableFormat(modeRows));
  out.push('', `Road step of ${quantityFormat(STEP_HEIGHT, 'length', system)} (linear model)`);
  out.push(
    tableFormat([
      ['overshoot', n(100 * a.step.overshoot, 1, '%')],
      ['settling time (2 %)', n(a.step.settlingTime, 3, a.step.settled ? 's' : 's (not settled)')],
    ]),
  );
  if (a.randomRoad && a.file.road) {
    const rr = a.randomRoad;
    out.push(
      '',
      `Random road: ISO 8608 class ${a.file.road.roadClass} at ${quantityFormat(a.file.road.speed, 'speed', system)} (road RMS ${quantityFormat(rr.roadRms, 'length', system)})`,
    );
    out.push(
      tableFormat([
        [figureLabel('roadBodyAccel'), figureText('roadBodyAccel', rr.bodyAccelRms, system)],
        [
          figureLabel('roadBodyAccelWeighted'),
          figureText('roadBodyAccelWeighted', rr.bodyAccelWeightedRms, system),
        ],
        ['dynamic tyre load RMS', q(rr.tireLoadRms, 'force')],
        [figureLabel('roadTireLoad'), figureText('roadTireLoad', rr.tireLoadRmsRatio, system)],
        [figureLabel('roadTravel'), figureText('roadTravel', rr.travelRms, system)],
      ]),
    );
  }
  if (a.bump) out.push('', ...eventMetricsLines(a.bump.event, a.bump.metrics, system));
  const perRoad = quantityUnitLabel('length', system);
  const perMetre = quantityToDisplay(1, 'length', system);
  out.push('', `Frequency response, per ${perRoad} of road displacement`);
  out.push(
    tableFormat([
      ['frequency', 'body accel', 'tyre load', 'travel'],
      [
        'Hz',
        `m/s² per ${perRoad}`,
        `${quantityUnitLabel('force', system)} per ${perRoad}`,
        `${perRoad} per ${perRoad}`,
      ],
      ...a.frf.map((row) => [
        numberFormat(row.frequencyHz, 2),
        numberFormat(row.bodyAccel / perMetre, 4),
        numberFormat(quantityToDisplay(row.tireLoad, 'force', system) / perMetre, 2),
        numberFormat(row.travel, 3),
      ]),
    ]),
  );
  out.push('', 'Warnings');
  if (a.warnings.length === 0) out.push('  none from the model');
  for (const w of a.warnings) out.push(textWrap(w.message, 96, '    ').replace(/^ {4}/, '  - '));
  out.push('', textWrap(`Caution: ${CAUTION_TEXT}`, 96), '');
  return out.join('\n');
}

export async function analyzeCommand(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: {
      json: { type: 'boolean' },
      frequencies: { type: 'string' },
      units: { type: 'string' },
      help: { type: 'boolean', short: 'h' },
    },
  });
  if (values.help) {
    io.stdout(`${ANALYZE_USAGE}\n`);
    return EXIT_OK;
  }
  if (positionals.length !== 1) {
    throw new UsageError(
      `analyze needs exactly one corner file (got ${positionals.length}); usage: ${ANALYZE_USAGE.split('\n')[0]}`,
    );
  }
  const system = unitSystemParse(values.units);
  const options =
    values.frequencies === undefined ? {} : { frequencies: frequencyListParse(values.frequencies) };
  const raw = await readJsonFile(positionals[0] as string);
  // JSON is SI throughout (DESIGN.md), its warnings' words included; the table speaks the chosen system.
  const { analysis, report } = analyzeCornerFile(raw, values.json ? options : { ...options, units: system });
  io.stdout(values.json ? `${JSON.stringify(report, null, 2)}\n` : analyzeHumanReport(analysis, system));
  return EXIT_OK;
}
