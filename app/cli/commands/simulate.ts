import { readFile, writeFile } from 'node:fs/promises';
import { parseArgs } from 'node:util';
import { CAUTION_TEXT } from '../../../core/safety/caution';
import { csvFormat } from '../../../core/units/csv';
import { cornerFileParse, type CornerFile } from '../../../core/corner/corner-file';
import {
  EVENT_DURATION,
  eventBump,
  eventCurb,
  eventPothole,
  eventRoad,
  eventStep,
  type EventKind,
  type RoadEvent,
} from '../../../core/events/event';
import { eventWarnings } from '../../../core/events/event-warnings';
import { InputError } from '../../../core/units/input-error';
import type { SimulationHistory } from '../../../core/events/metrics';
import { roadProfileIso8608, roadProfileMeasured } from '../../../core/events/road';
import { ISO8608_CLASSES, type Iso8608Class } from '../../../core/corner/random-road';
import { eventSimulate } from '../../../core/events/simulate';
import { quantityFormat, quantityParse, type QuantityKind } from '../../../core/units/units';
import { EXIT_OK, UsageError, type CliIo } from '../cli-io';
import { eventMetricsLines } from '../event-report';
import { readJsonFile } from '../read-json-file';
import { textWrap } from '../table';
import { unitSystemParse } from './analyze';

const EVENTS: readonly EventKind[] = ['bump', 'step', 'curb', 'pothole', 'road'];

/** Sizes used when neither the command line nor the file gives them (SI). */
export const EVENT_DEFAULTS = {
  step: { height: 0.025, rise: 0.05 },
  curb: { height: 0.04, rise: 0.15, hold: 0.3, drop: 0.02 },
  pothole: { depth: 0.04, length: 0.6 },
  road: { seed: 1 },
  historyPoints: 1501,
} as const;

export const SIMULATE_USAGE = `rideledger simulate FILE --event bump|step|curb|pothole|road [options]

  Runs one road event on the corner's nonlinear quarter car (damper curves, bump stop,
  rebound limit, tyre lift-off) for ${EVENT_DURATION} s from rest and prints its figures and warnings.

  --csv OUT       also write the time history as CSV (SI units; "-" writes it to stdout)
  --force         replace OUT when it exists
  --points N      rows of the history, evenly spaced (default ${EVENT_DEFAULTS.historyPoints})
  --json          print the figures as one JSON object (SI)
  --units si|us   units of the printed figures
  --speed V       speed over the event (default: the file's bump speed, else its road speed;
                  for --event road the other way round)
  --height H      bump, step or curb height, pothole depth (bump: the file's bump;
                  step ${EVENT_DEFAULTS.step.height * 1000} mm, curb ${EVENT_DEFAULTS.curb.height * 1000} mm, pothole ${EVENT_DEFAULTS.pothole.depth * 1000} mm)
  --length L      bump or pothole length (bump: the file's; pothole ${EVENT_DEFAULTS.pothole.length} m)
  --rise R        step rise length (${EVENT_DEFAULTS.step.rise * 1000} mm) or curb ramp length (${EVENT_DEFAULTS.curb.rise} m)
  --hold B        curb top length (${EVENT_DEFAULTS.curb.hold} m)
  --drop D        curb drop length (${EVENT_DEFAULTS.curb.drop * 1000} mm)
  --class C       ISO 8608 class A–H of the random road (default: the file's road class)
  --seed N        seed of the random road (default ${EVENT_DEFAULTS.road.seed}): the same seed, the same road
  --profile CSV   a measured road instead: rows of distance,elevation in metres
  --duration T    window (default ${EVENT_DURATION} s)

  Quantities may carry units: --speed "60 km/h", --height 30mm.`;

type Values = Record<string, string | boolean | undefined>;

function optionQuantity(values: Values, name: string, kind: QuantityKind): number | undefined {
  const v = values[name];
  return typeof v === 'string' ? quantityParse(v, kind, `--${name}`) : undefined;
}

function required(value: number | undefined, what: string): number {
  if (value === undefined) throw new UsageError(what);
  return value;
}

/** Reads a measured road: rows of distance,elevation (m); blank lines, # comments and a header are skipped. */
export function profileCsvParse(text: string, path: string): [number, number][] {
  const rows: [number, number][] = [];
  text.split(/\r?\n/).forEach((line, i) => {
    const trimmed = line.trim();
    if (trimmed === '' || trimmed.startsWith('#')) return;
    const cells = trimmed.split(/[,;\t ]+/);
    const numbers = cells.map(Number);
    if (cells.length < 2 || numbers.slice(0, 2).some((n) => !Number.isFinite(n))) {
      if (rows.length === 0 && /[a-z]/i.test(trimmed)) return; // the header
      throw new InputError(
        `${path} line ${i + 1}`,
        `expected "distance,elevation" in metres (got "${trimmed}")`,
      );
    }
    rows.push([numbers[0] as number, numbers[1] as number]);
  });
  return rows;
}

/** The event the command line asks for, on the corner file `file`. */
export async function eventFromOptions(
  kind: EventKind,
  values: Values,
  file: CornerFile,
): Promise<RoadEvent> {
  // A road event runs at the file's road speed, the others at its bump speed, when given.
  const fileSpeed =
    kind === 'road' ? (file.road?.speed ?? file.bump?.speed) : (file.bump?.speed ?? file.road?.speed);
  const speed = required(
    optionQuantity(values, 'speed', 'speed') ?? fileSpeed,
    '--speed is needed: the file has no bump or road speed (e.g. --speed "60 km/h")',
  );
  const height = optionQuantity(values, 'height', 'length');
  const length = optionQuantity(values, 'length', 'length');
  const rise = optionQuantity(values, 'rise', 'length');
  const duration = optionQuantity(values, 'duration', 'time');
  if (duration !== undefined && !(duration > 0 && duration <= 600)) {
    throw new InputError('--duration', `must be above zero and at most 600 s (got ${duration} s)`);
  }
  let event: RoadEvent;
  switch (kind) {
    case 'bump':
      event = eventBump(
        {
          height: required(height ?? file.bump?.height, '--height is needed: the file has no bump'),
          length: required(length ?? file.bump?.length, '--length is needed: the file has no bump'),
          speed,
        },
        '--bump',
      );
      break;
    case 'step':
      event = eventStep(
        { height: height ?? EVENT_DEFAULTS.step.height, rise: rise ?? EVENT_DEFAULTS.step.rise, speed },
        '--step',
      );
      break;
    case 'curb':
      event = eventCurb(
        {
          height: height ?? EVENT_DEFAULTS.curb.height,
          rise: rise ?? EVENT_DEFAULTS.curb.rise,
          hold: optionQuantity(values, 'hold', 'length') ?? EVENT_DEFAULTS.curb.hold,
          drop: optionQuantity(values, 'drop', 'length') ?? EVENT_DEFAULTS.curb.drop,
          speed,
        },
        '--curb',
      );
      break;
    case 'pothole':
      event = eventPothole(
        {
          depth: height ?? EVENT_DEFAULTS.pothole.depth,
          length: length ?? EVENT_DEFAULTS.pothole.length,
          speed,
        },
        '--pothole',
      );
      break;
    case 'road': {
      const window = duration ?? EVENT_DURATION;
      const profilePath = values.profile;
      if (typeof profilePath === 'string') {
        let text: string;
        try {
          text = await readFile(profilePath, 'utf8');
        } catch (e) {
          throw new InputError(profilePath, `cannot read the profile: ${(e as Error).message}`);
        }
        const road = roadProfileMeasured(profileCsvParse(text, profilePath), profilePath);
        event = eventRoad(
          road,
          speed,
          `the measured road ${profilePath} at ${quantityFormat(speed, 'speed', 'si')}`,
        );
        break;
      }
      const classText =
        typeof values.class === 'string' ? values.class.trim().toUpperCase() : file.road?.roadClass;
      if (classText === undefined)
        throw new UsageError('--class is needed: the file has no road class (A–H)');
      if (!(ISO8608_CLASSES as readonly string[]).includes(classText)) {
        throw new InputError(
          '--class',
          `got "${classText}"; expected an ISO 8608 class, one of ${ISO8608_CLASSES.join(', ')}`,
        );
      }
      const seedText = typeof values.seed === 'string' ? values.seed : String(EVENT_DEFAULTS.road.seed);
      const seed = Number(seedText);
      if (!Number.isInteger(seed) || seed < 0 || seed > 4294967295) {
        throw new InputError('--seed', `expected a whole number from 0 to 4294967295 (got "${seedText}")`);
      }
      const road = roadProfileIso8608(
        { roadClass: classText as Iso8608Class, seed, length: window * speed + 1 },
        '--road',
      );
      event = eventRoad(
        road,
        speed,
        `ISO 8608 class ${classText} road (seed ${seed}) at ${quantityFormat(speed, 'speed', 'si')}`,
      );
      break;
    }
  }
  if (duration !== undefined) event.duration = duration;
  return event;
}

const CSV_COLUMNS: readonly [keyof SimulationHistory, string][] = [
  ['time', 'time_s'],
  ['roadHeight', 'road_height_m'],
  ['bodyDisplacement', 'body_displacement_m'],
  ['wheelDisplacement', 'wheel_displacement_m'],
  ['travel', 'travel_m'],
  ['bodyVelocity', 'body_velocity_m_s'],
  ['wheelVelocity', 'wheel_velocity_m_s'],
  ['bodyAccel', 'body_accel_m_s2'],
  ['damperVelocity', 'damper_velocity_m_s'],
  ['tireLoad', 'tire_load_N'],
  ['bumpStopForce', 'bump_stop_force_N'],
];

/** The history as CSV: a header of column names with their SI units, one row per sample. */
export function historyCsv(h: SimulationHistory): string {
  const rows: (string | number)[][] = [CSV_COLUMNS.map(([, name]) => name)];
  for (let k = 0; k < h.time.length; k++)
    rows.push(CSV_COLUMNS.map(([key]) => Number((h[key][k] as number).toPrecision(10))));
  return csvFormat(rows, '\n');
}

export async function simulateCommand(args: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseArgs({
    args,
    allowPositionals: true,
    options: {
      event: { type: 'string' },
      csv: { type: 'string' },
      force: { type: 'boolean' },
      points: { type: 'string' },
      json: { type: 'boolean' },
      units: { type: 'string' },
      speed: { type: 'string' },
      height: { type: 'string' },
      length: { type: 'string' },
      rise: { type: 'string' },
      hold: { type: 'string' },
      drop: { type: 'string' },
      class: { type: 'string' },
      seed: { type: 'string' },
      profile: { type: 'string' },
      duration: { type: 'string' },
      help: { type: 'boolean', short: 'h' },
    },
  });
  if (values.help) {
    io.stdout(`${SIMULATE_USAGE}\n`);
    return EXIT_OK;
  }
  if (positionals.length !== 1) {
    throw new UsageError(
      `simulate needs exactly one corner file (got ${positionals.length}); usage: ${SIMULATE_USAGE.split('\n')[0]}`,
    );
  }
  const kind = values.event;
  if (kind === undefined || !(EVENTS as readonly string[]).includes(kind)) {
    throw new UsageError(
      `--event: got ${kind === undefined ? 'nothing' : `"${kind}"`}; expected one of ${EVENTS.join(', ')}`,
    );
  }
  const system = unitSystemParse(values.units);
  let points: number = EVENT_DEFAULTS.historyPoints;
  if (values.points !== undefined) {
    points = Number(values.points);
    if (!Number.isInteger(points) || points < 2 || points > 1_000_000) {
      throw new InputError('--points', `expected a whole number from 2 to 1000000 (got "${values.points}")`);
    }
  }
  const file = cornerFileParse(await readJsonFile(positionals[0] as string));
  const event = await eventFromOptions(kind as EventKind, values, file);
  const csv = values.csv;
  const result = eventSimulate(file.corner, event, { historyPoints: csv === undefined ? 0 : points });
  // JSON is SI throughout, its words included; the readable report speaks the chosen system.
  const warnings = eventWarnings(file.corner, event, result.metrics, values.json ? 'si' : system);

  if (csv !== undefined && result.history) {
    const text = historyCsv(result.history);
    if (csv === '-') {
      io.stdout(text);
      return EXIT_OK;
    }
    try {
      await writeFile(csv, text, { flag: values.force ? 'w' : 'wx' });
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      if (code === 'EEXIST') throw new InputError(csv, 'already exists; add --force to replace it');
      throw new InputError(csv, `cannot write the CSV: ${(e as Error).message}`);
    }
  }
  if (values.json) {
    io.stdout(
      `${JSON.stringify({ event: event.kind, label: event.label, metrics: result.metrics, warnings }, null, 2)}\n`,
    );
    return EXIT_OK;
  }
  const out = [
    `RideLedger event${file.name ? ` — ${file.name}` : ''}`,
    '',
    ...eventMetricsLines(event, result.metrics, system),
  ];
  out.push('', 'Warnings');
  if (warnings.length === 0) out.push('  none from the model');
  for (const w of warnings) out.push(textWrap(w.message, 96, '    ').replace(/^ {4}/, '  - '));
  if (csv !== undefined) out.push('', `Time history: ${points} rows written to ${csv}`);
  out.push('', textWrap(`Caution: ${CAUTION_TEXT}`, 96), '');
  io.stdout(out.join('\n'));
  return EXIT_OK;
}
