import {
  cornerQuarterCar,
  cornerValidate,
  type CornerFigures,
  type CornerInput,
} from '../../core/corner/corner';
import { cornerAnalyze } from '../../core/figures/corner-analysis';
import { bumpSpecParse, roadSpecParse, type BumpSpec, type RoadSpec } from '../../core/corner/corner-file';
import { eventBump } from '../../core/events/event';
import { eventWarnings } from '../../core/events/event-warnings';
import { figureLabel, figureText, type FigureKey } from '../../core/units/figure-labels';
import { frequencyResponseGrid, type FrequencyResponseMagnitude } from '../../core/corner/frequency-response';
import { InputError } from '../../core/units/input-error';
import type { EventMetrics } from '../../core/events/metrics';
import type { Modes } from '../../core/corner/modal';
import type { RandomRoadResponse } from '../../core/corner/random-road';
import { ISO8608_CLASSES } from '../../core/corner/random-road';
import { setupFileParse } from '../../core/setup/setup-file';
import { CORNER_POSITIONS, type CornerPosition } from '../../core/setup/setup-sheet';
import { eventSimulate } from '../../core/events/simulate';
import { stepResponseHistory, STEP_HEIGHT, type StepResponse } from '../../core/corner/step-response';
import {
  numberFormat,
  quantityFormat,
  quantityUnitLabel,
  type QuantityKind,
  type UnitSystem,
} from '../../core/units/units';
import { cornerWarnings, type ModelWarning } from '../../core/corner/warnings';
import { cornerInputWarnings } from '../../core/corner/plausible-range';
import type { BarSeries, PlotSeries } from './components/plot-data';
import { quantityDisplayFactor, quantityFieldConvert, quantityFieldValue } from './quantity-field';

/** What the user picks for the road and the bump, as typed (numbers in the unit system's units). */
export type AnalysisOptionTexts = {
  roadClass: string;
  roadSpeed: string;
  bumpHeight: string;
  bumpLength: string;
  bumpSpeed: string;
};

/** The road and bump the figures are taken on, SI. */
export type AnalysisOptions = { road: RoadSpec; bump: BumpSpec };

const OPTION_KINDS = {
  roadSpeed: 'speed',
  bumpHeight: 'length',
  bumpLength: 'length',
  bumpSpeed: 'speed',
} as const satisfies Record<Exclude<keyof AnalysisOptionTexts, 'roadClass'>, QuantityKind>;

/**
 * The defaults: ISO 8608 class C (an average road) at a fast-road speed, and a 25 mm bump half
 * a metre long crossed at a corner-exit speed — round numbers in each unit system.
 */
export function analysisOptionTextsDefault(system: UnitSystem): AnalysisOptionTexts {
  return system === 'si'
    ? { roadClass: 'C', roadSpeed: '80', bumpHeight: '25', bumpLength: '500', bumpSpeed: '50' }
    : { roadClass: 'C', roadSpeed: '50', bumpHeight: '1', bumpLength: '20', bumpSpeed: '30' };
}

/**
 * The texts shown in another unit system: defaults left as they were become the new system's
 * round defaults; every other value that reads is converted, and the rest kept as typed.
 */
export function analysisOptionTextsConvert(
  texts: AnalysisOptionTexts,
  from: UnitSystem,
  to: UnitSystem,
): AnalysisOptionTexts {
  if (from === to) return texts;
  const fromDefaults = analysisOptionTextsDefault(from);
  const toDefaults = analysisOptionTextsDefault(to);
  const out = { ...texts };
  for (const [key, kind] of Object.entries(OPTION_KINDS) as [keyof typeof OPTION_KINDS, QuantityKind][])
    out[key] =
      texts[key].trim() === fromDefaults[key]
        ? toDefaults[key]
        : quantityFieldConvert(texts[key], kind, from, to);
  return out;
}

/** Which text each field path of core's road and bump readers comes from. */
const OPTION_FIELDS: Record<string, keyof AnalysisOptionTexts> = {
  'road.class': 'roadClass',
  'road.speed': 'roadSpeed',
  'bump.height': 'bumpHeight',
  'bump.length': 'bumpLength',
  'bump.speed': 'bumpSpeed',
};

/**
 * Reads the option texts with core's road and bump readers (a bare number is in the unit shown
 * beside its field). Problems come back by text key, with core's message.
 */
export function analysisOptionsRead(
  texts: AnalysisOptionTexts,
  system: UnitSystem,
): { options: AnalysisOptions } | { problems: Map<keyof AnalysisOptionTexts, string> } {
  const problems = new Map<keyof AnalysisOptionTexts, string>();
  const value = (key: keyof typeof OPTION_KINDS) => {
    const v = quantityFieldValue(texts[key], OPTION_KINDS[key], system);
    if (v === undefined) problems.set(key, 'is needed');
    return v;
  };
  const attempt = <T>(read: () => T): T | undefined => {
    try {
      return read();
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      const key = OPTION_FIELDS[e.field];
      if (key) problems.set(key, e.problem);
      else throw e;
      return undefined;
    }
  };
  const roadSpeed = value('roadSpeed');
  const road =
    roadSpeed === undefined
      ? undefined
      : attempt(() => roadSpecParse({ class: texts.roadClass, speed: roadSpeed }, 'road'));
  const bumpTexts = {
    height: value('bumpHeight'),
    length: value('bumpLength'),
    speed: value('bumpSpeed'),
  };
  let bump: BumpSpec | undefined;
  if (bumpTexts.height !== undefined && bumpTexts.length !== undefined && bumpTexts.speed !== undefined) {
    // core stops at the first wrong field; a wrong one is set aside and the rest read again,
    // so that every wrong field is marked at once.
    const trial: Record<string, string> = { ...bumpTexts } as Record<string, string>;
    for (let pass = 0; pass < 3 && !bump; pass++) {
      const before = problems.size;
      bump = attempt(() => bumpSpecParse(trial, 'bump'));
      if (!bump && problems.size === before) break;
      for (const [key, placeholder] of [
        // Stand-ins inside every plausible range (core/plausible-range.ts), so they raise nothing.
        ['height', '25 mm'],
        ['length', '1 m'],
        ['speed', '10 m/s'],
      ] as const)
        if (problems.has(OPTION_FIELDS[`bump.${key}`] as keyof AnalysisOptionTexts)) trial[key] = placeholder;
    }
    if (problems.size > 0) bump = undefined;
  }
  if (problems.size > 0 || !road || !bump) return { problems };
  return { options: { road, bump } };
}

/** The four corners of a stored revision's setup file, read by core (quantities with units). */
export function analysisCornersOf(file: unknown): Record<CornerPosition, CornerInput> {
  const sheet = setupFileParse(file).sheet;
  const out = {} as Record<CornerPosition, CornerInput>;
  for (const p of CORNER_POSITIONS) out[p] = sheet.corners[p].analysis;
  return out;
}

/** Time histories for the plots, SI: one typed array per signal. */
export type ResponseHistory = {
  time: Float64Array;
  bodyAccel: Float64Array;
  /** Suspension travel at the wheel, compression positive (m). */
  travel: Float64Array;
  /** Tyre load (N): the dynamic part for the linear step, the total for the bump. */
  tireLoad: Float64Array;
};

/** Everything the screen shows for one corner, SI. */
export type CornerResult = {
  position: CornerPosition;
  figures: CornerFigures;
  modes: Modes;
  step: StepResponse;
  randomRoad: RandomRoadResponse;
  bump: EventMetrics;
  /** core's corner warnings (figures, modes, step) and the bump event's, written in each unit system. */
  warnings: Record<UnitSystem, ModelWarning[]>;
  stepHistory: ResponseHistory;
  bumpHistory: ResponseHistory;
  frf: FrequencyResponseMagnitude[];
};

export type AnalysisResult = {
  options: AnalysisOptions;
  corners: Record<CornerPosition, CornerResult>;
  /** The step plot's window (s). */
  stepWindow: number;
};

/** Frequency range and density of the frequency-response plots (Hz). */
export const FRF_RANGE = { low: 0.3, high: 40, perDecade: 40 } as const;
/**
 * Samples of each plotted time history: over the 1.5 s event, one each 3.75 ms, some 19 in a
 * 14 Hz wheel-hop period — smooth curves, and few enough that nine plots redraw quickly.
 */
export const HISTORY_POINTS = 400;

/**
 * The step plot's window: long enough to show the slowest corner settle (1.2 × its settling
 * time), at least the nonlinear event's 1.5 s so both plots share a scale, at most 5 s.
 */
function stepWindowOf(steps: readonly StepResponse[]): number {
  const slowest = Math.max(...steps.map((s) => s.settlingTime));
  return Math.min(5, Math.max(1.5, 1.2 * slowest));
}

/**
 * The whole analysis of one setup, corner by corner, by core: ride figures, modes, the linear
 * 10 mm step with its history, the frequency response on a log grid, the random-road RMS
 * figures and the bump on the nonlinear quarter car with its history, with every warning.
 * `progress` is told after each corner (fraction done, what comes next).
 * @throws InputError naming the corner's field when a corner is not one a car could have.
 */
export function setupAnalyze(
  corners: Record<CornerPosition, CornerInput>,
  options: AnalysisOptions,
  progress?: (fraction: number, stage: string) => void,
): AnalysisResult {
  const frequencies = frequencyResponseGrid(FRF_RANGE.low, FRF_RANGE.high, FRF_RANGE.perDecade);
  const partial = {} as Record<CornerPosition, Omit<CornerResult, 'stepHistory'>>;
  CORNER_POSITIONS.forEach((p, i) => {
    progress?.(i / (CORNER_POSITIONS.length + 1), `${p}: figures, random road and the bump`);
    const corner = corners[p];
    // Corners read from a file are checked already; one handed over otherwise is checked here.
    cornerValidate(corner, `corners.${p}.corner`);
    const linear = cornerAnalyze({ name: p, corner, road: options.road }, { frequencies });
    const event = eventBump(options.bump);
    const sim = eventSimulate(corner, event, { historyPoints: HISTORY_POINTS });
    const h = sim.history;
    if (!h) throw new Error('the simulation returned no history');
    const warningsIn = (units: UnitSystem) => [
      ...cornerInputWarnings(corner, units),
      ...cornerWarnings(linear.figures, linear.modes, linear.step, units),
      ...eventWarnings(corner, event, sim.metrics, units),
    ];
    partial[p] = {
      position: p,
      figures: linear.figures,
      modes: linear.modes,
      step: linear.step,
      randomRoad: linear.randomRoad as RandomRoadResponse,
      bump: sim.metrics,
      // Both systems now, so the units switch rewrites the words without running anything again.
      warnings: { si: warningsIn('si'), us: warningsIn('us') },
      bumpHistory: { time: h.time, bodyAccel: h.bodyAccel, travel: h.travel, tireLoad: h.tireLoad },
      frf: linear.frf,
    };
  });
  progress?.(CORNER_POSITIONS.length / (CORNER_POSITIONS.length + 1), 'step responses');
  const stepWindow = stepWindowOf(CORNER_POSITIONS.map((p) => partial[p].step));
  const out = {} as Record<CornerPosition, CornerResult>;
  for (const p of CORNER_POSITIONS) {
    // The linear model's travel is zu − zs, compression positive, as the event's.
    const s = stepResponseHistory(cornerQuarterCar(corners[p]), stepWindow, HISTORY_POINTS);
    out[p] = {
      ...partial[p],
      stepHistory: { time: s.time, bodyAccel: s.bodyAccel, travel: s.travel, tireLoad: s.tireLoad },
    };
  }
  progress?.(1, 'done');
  return { options, corners: out, stepWindow };
}

/** One figure of the table: its text per corner (unit included) and the warnings that concern it. */
export type FigureRow = {
  key: string;
  label: string;
  cells: Record<CornerPosition, string>;
  warnings: Record<CornerPosition, ModelWarning[]>;
};
export type FigureGroup = { key: string; title: string; rows: FigureRow[] };

type RowSpec = {
  key: string;
  label: string;
  text: (c: CornerResult, system: UnitSystem) => string;
  /** Warning codes (or code prefixes ending in "-") shown beside this figure. */
  codes?: readonly string[];
};

/** A row showing one quantity of the corner's result, in the unit system's unit. */
const quantityRow = (
  key: string,
  label: string,
  kind: QuantityKind,
  value: (c: CornerResult) => number,
  codes?: readonly string[],
  decimals?: number,
): RowSpec => ({
  key,
  label,
  text: (c, u) => quantityFormat(value(c), kind, u, decimals === undefined ? {} : { decimals }),
  ...(codes ? { codes } : {}),
});

const zeta = (z: number) => numberFormat(z, 2);
const percent = (x: number) => `${numberFormat(x * 100, 1)} %`;
const modeText = (m: Modes['body']) =>
  m ? `${numberFormat(m.frequencyHz, 2)} Hz, ζ ${zeta(m.dampingRatio)}` : 'does not oscillate (overdamped)';

const LINEAR_ROWS: readonly RowSpec[] = [
  quantityRow('wheelRate', 'Wheel rate', 'stiffness', (c) => c.figures.wheelRate),
  quantityRow('rideRate', 'Ride rate', 'stiffness', (c) => c.figures.rideRate),
  quantityRow('rideFrequency', 'Ride frequency', 'frequency', (c) => c.figures.rideFrequencyHz, [
    'ride-frequency-low',
    'ride-frequency-high',
  ]),
  quantityRow(
    'wheelHopFrequency',
    'Wheel-hop frequency',
    'frequency',
    (c) => c.figures.wheelHopFrequencyHz,
    ['wheel-hop-low', 'wheel-hop-high', 'unsprung-ratio'],
    1,
  ),
  {
    key: 'zetaBump',
    label: 'ζ bump, low speed (class)',
    text: (c) => `${zeta(c.figures.dampingRatio.bump)} (${c.figures.dampingClass.bump})`,
    codes: ['damping-low-bump', 'damping-high-bump'],
  },
  {
    key: 'zetaBumpHigh',
    label: 'ζ bump, high speed',
    text: (c) => zeta(c.figures.dampingRatio.bumpHighSpeed),
  },
  {
    key: 'zetaRebound',
    label: 'ζ rebound, low speed (class)',
    text: (c) => `${zeta(c.figures.dampingRatio.rebound)} (${c.figures.dampingClass.rebound})`,
    codes: ['damping-low-rebound', 'damping-high-rebound', 'rebound-softer-than-bump'],
  },
  {
    key: 'zetaReboundHigh',
    label: 'ζ rebound, high speed',
    text: (c) => zeta(c.figures.dampingRatio.reboundHighSpeed),
    codes: ['rebound-softer-than-bump-high-speed'],
  },
  {
    key: 'bodyMode',
    label: 'Body mode',
    text: (c) => modeText(c.modes.body),
    codes: ['suspension-locked', 'body-mode-overdamped'],
  },
  { key: 'wheelHopMode', label: 'Wheel-hop mode', text: (c) => modeText(c.modes.wheelHop) },
  {
    key: 'overdampedModes',
    label: 'Modes that do not oscillate',
    text: (c, u) =>
      c.modes.overdamped.length === 0
        ? 'none'
        : c.modes.overdamped
            .map((m) => `time constant ${quantityFormat(m.timeConstant, 'time', u)}`)
            .join('; '),
  },
];

const STEP_ROWS: readonly RowSpec[] = [
  { key: 'stepOvershoot', label: 'Overshoot', text: (c) => percent(c.step.overshoot) },
  {
    key: 'stepSettling',
    label: 'Settling time (2 %)',
    text: (c, u) =>
      c.step.settled
        ? quantityFormat(c.step.settlingTime, 'time', u, { decimals: 2 })
        : `not settled within ${quantityFormat(c.step.settlingTime, 'time', u, { decimals: 0 })}`,
    codes: ['step-not-settled'],
  },
];

/** A row of a figure from core's one table of names and units (figure-labels.ts). */
const figureRow = (
  key: string,
  figure: FigureKey,
  value: (c: CornerResult) => number,
  codes?: readonly string[],
): RowSpec => ({
  key,
  label: figureLabel(figure, true),
  text: (c, u) => figureText(figure, value(c), u),
  ...(codes ? { codes } : {}),
});

const ROAD_ROWS: readonly RowSpec[] = [
  figureRow('roadBodyAccel', 'roadBodyAccel', (c) => c.randomRoad.bodyAccelRms),
  figureRow('roadBodyAccelWeighted', 'roadBodyAccelWeighted', (c) => c.randomRoad.bodyAccelWeightedRms),
  figureRow('roadTireLoad', 'roadTireLoad', (c) => c.randomRoad.tireLoadRmsRatio),
  figureRow('roadTravel', 'roadTravel', (c) => c.randomRoad.travelRms),
];

const BUMP_ROWS: readonly RowSpec[] = [
  figureRow('bumpPeakAccel', 'peakBodyAccel', (c) => c.bump.peakBodyAccel),
  figureRow('bumpPeakBody', 'peakBodyDisplacement', (c) => c.bump.peakBodyDisplacement),
  figureRow('bumpMaxCompression', 'maxCompression', (c) => c.bump.maxCompression, ['travel-beyond-limit']),
  figureRow('bumpMaxExtension', 'maxExtension', (c) => c.bump.maxExtension, [
    'rebound-limit-reached',
    'spring-unloaded',
  ]),
  figureRow('bumpMinTireLoad', 'minTireLoad', (c) => c.bump.minTireLoad),
  figureRow('bumpMaxTireLoad', 'maxTireLoad', (c) => c.bump.maxTireLoad),
  figureRow('bumpAirborne', 'airborneTime', (c) => c.bump.airborneTime, ['tire-lift-off']),
  figureRow('bumpStopTime', 'bumpStopTime', (c) => c.bump.bumpStopContactTime, ['bump-stop-engaged']),
  {
    key: 'bumpShaftSpeed',
    label: 'Peak shaft speed, bump / rebound',
    text: (c, u) =>
      `${quantityFormat(c.bump.peakDamperVelocityBump, 'velocity', u)} / ${quantityFormat(c.bump.peakDamperVelocityRebound, 'velocity', u)}`,
    codes: ['damper-speed-beyond-data-'],
  },
];

/** Words for the road the random-road figures are taken on, in `system`. */
export function roadText(road: RoadSpec, system: UnitSystem): string {
  return `ISO 8608 class ${road.roadClass} at ${quantityFormat(road.speed, 'speed', system)}`;
}

/** Words for the bump, in `system`. */
export function bumpText(bump: BumpSpec, system: UnitSystem): string {
  return `${quantityFormat(bump.height, 'length', system)} high, ${quantityFormat(bump.length, 'length', system)} long, at ${quantityFormat(bump.speed, 'speed', system)}`;
}

const stepText = (system: UnitSystem) => quantityFormat(STEP_HEIGHT, 'length', system);

const codeMatches = (codes: readonly string[] | undefined, code: string) =>
  (codes ?? []).some((c) => (c.endsWith('-') ? code.startsWith(c) : code === c));

/**
 * The figures table of a result in `system`, in groups (linear figures and modes, the 10 mm
 * step, the random road, the bump), each value with its unit, each row with the warnings that
 * concern it.
 */
export function analysisFigureGroups(result: AnalysisResult, system: UnitSystem): FigureGroup[] {
  const groups: { key: string; title: string; specs: readonly RowSpec[] }[] = [
    { key: 'linear', title: 'Rates, frequencies, damping and modes (linear model)', specs: LINEAR_ROWS },
    { key: 'step', title: `Road step of ${stepText(system)} (linear model)`, specs: STEP_ROWS },
    {
      key: 'road',
      title: `Random road: ${roadText(result.options.road, system)} (linear model)`,
      specs: ROAD_ROWS,
    },
    {
      key: 'bump',
      title: `Bump: ${bumpText(result.options.bump, system)} (nonlinear model)`,
      specs: BUMP_ROWS,
    },
  ];
  return groups.map((g) => ({
    key: g.key,
    title: g.title,
    rows: g.specs.map((spec) => {
      const cells = {} as Record<CornerPosition, string>;
      const warnings = {} as Record<CornerPosition, ModelWarning[]>;
      for (const p of CORNER_POSITIONS) {
        const c = result.corners[p];
        cells[p] = spec.text(c, system);
        warnings[p] = c.warnings[system].filter((w) => codeMatches(spec.codes, w.code));
      }
      return { key: spec.key, label: spec.label, cells, warnings };
    }),
  }));
}

/** A line plot ready to draw, in the unit system it was made for. */
export type LinePlotSpec = {
  id: string;
  title: string;
  xLabel: string;
  yLabel: string;
  series: PlotSeries[];
  xLog?: boolean;
  yLog?: boolean;
};

/** A bar plot ready to draw. */
export type BarPlotSpec = {
  id: string;
  title: string;
  categoryLabel: string;
  yLabel: string;
  categories: string[];
  series: BarSeries[];
  decimals: number;
};

export type AnalysisPlots = {
  step: LinePlotSpec[];
  bump: LinePlotSpec[];
  frf: LinePlotSpec[];
  randomRoad: BarPlotSpec[];
};

const scaled = (values: ArrayLike<number>, factor: number) =>
  Float64Array.from(values as ArrayLike<number>, (v) => v * factor);

/**
 * The screen's plots of a result in `system`: the step and bump time histories (body
 * acceleration, travel, tyre load), the frequency response on log axes, and the random-road
 * bars per corner; one series per corner, axis labels with their units.
 */
export function analysisPlots(result: AnalysisResult, system: UnitSystem): AnalysisPlots {
  const len = quantityUnitLabel('length', system);
  const force = quantityUnitLabel('force', system);
  const accel = quantityUnitLabel('acceleration', system);
  const kLen = quantityDisplayFactor('length', system);
  const kForce = quantityDisplayFactor('force', system);
  const kAccel = quantityDisplayFactor('acceleration', system);
  const corners = CORNER_POSITIONS.map((p) => result.corners[p]);
  const history = (
    prefix: 'step' | 'bump',
    heading: string,
    pick: (c: CornerResult) => ResponseHistory,
    tireLabel: string,
  ): LinePlotSpec[] =>
    (
      [
        ['body-accel', 'body acceleration', `Acceleration (${accel})`, (h) => h.bodyAccel, kAccel],
        ['travel', 'suspension travel, compression positive', `Travel (${len})`, (h) => h.travel, kLen],
        ['tire-load', tireLabel.toLowerCase(), `Load (${force})`, (h) => h.tireLoad, kForce],
      ] as const satisfies readonly (readonly [
        string,
        string,
        string,
        (h: ResponseHistory) => Float64Array,
        number,
      ])[]
    ).map(([id, what, yLabel, signal, k]) => ({
      id: `${prefix}-${id}`,
      title: `${heading}: ${what} vs time`,
      xLabel: 'Time (s)',
      yLabel,
      series: corners.map((c) => ({ name: c.position, x: pick(c).time, y: scaled(signal(pick(c)), k) })),
    }));
  const frfPlot = (
    id: string,
    what: string,
    yLabel: string,
    signal: (f: FrequencyResponseMagnitude) => number,
    k: number,
  ): LinePlotSpec => ({
    id: `frf-${id}`,
    title: `Frequency response (linear model): ${what} per unit of road height`,
    xLabel: 'Frequency (Hz)',
    yLabel,
    xLog: true,
    yLog: true,
    series: corners.map((c) => ({
      name: c.position,
      x: Float64Array.from(c.frf, (f) => f.frequencyHz),
      y: Float64Array.from(c.frf, (f) => signal(f) * k),
    })),
  });
  const road = roadText(result.options.road, system);
  const bar = (
    id: string,
    what: string,
    yLabel: string,
    series: { name: string; value: (r: RandomRoadResponse) => number }[],
    decimals: number,
  ): BarPlotSpec => ({
    id: `road-${id}`,
    title: `Random road, ${road} (linear model): ${what} per corner`,
    categoryLabel: 'Corner',
    yLabel,
    categories: [...CORNER_POSITIONS],
    series: series.map((s) => ({ name: s.name, values: corners.map((c) => s.value(c.randomRoad)) })),
    decimals,
  });
  return {
    step: history(
      'step',
      `Road step of ${stepText(system)} (linear model)`,
      (c) => c.stepHistory,
      'Dynamic tyre load',
    ),
    bump: history(
      'bump',
      `Bump ${bumpText(result.options.bump, system)} (nonlinear model)`,
      (c) => c.bumpHistory,
      'Tyre load',
    ),
    frf: [
      frfPlot(
        'body-accel',
        'body acceleration',
        `${accel} per ${len} of road`,
        (f) => f.bodyAccel,
        kAccel / kLen,
      ),
      frfPlot(
        'tire-load',
        'dynamic tyre load',
        `${force} per ${len} of road`,
        (f) => f.tireLoad,
        kForce / kLen,
      ),
      frfPlot('travel', 'suspension travel', 'Travel ÷ road height', (f) => f.travel, 1),
    ],
    randomRoad: [
      bar(
        'body-accel',
        'body acceleration RMS',
        `RMS (${accel})`,
        [
          { name: 'Body acceleration RMS', value: (r) => r.bodyAccelRms * kAccel },
          { name: 'Wk-weighted (ISO 2631-1)', value: (r) => r.bodyAccelWeightedRms * kAccel },
        ],
        2,
      ),
      bar(
        'tire-load',
        'dynamic tyre load RMS',
        'RMS ÷ static load (%)',
        [{ name: 'Dynamic tyre load RMS ÷ static', value: (r) => r.tireLoadRmsRatio * 100 }],
        1,
      ),
      bar(
        'travel',
        'suspension travel RMS',
        `RMS (${len})`,
        [{ name: 'Suspension travel RMS', value: (r) => r.travelRms * kLen }],
        system === 'si' ? 1 : 2,
      ),
    ],
  };
}

/** The road classes a user may pick, smoothest first. */
export const ROAD_CLASSES = ISO8608_CLASSES;
