import type { FrequencyResponseMagnitude } from '../../core/corner/frequency-response';
import type { RandomRoadResponse } from '../../core/corner/random-road';
import type { BumpSpec, RoadSpec } from '../../core/corner/corner-file';
import { CORNER_POSITIONS, type CornerPosition } from '../../core/setup/setup-sheet';
import { quantityUnitLabel, type UnitSystem } from '../../core/units/units';
import type { BarSeries, PlotSeries } from './components/plot-data';
import { bumpText, roadText, stepText } from './analysis-options';
import type { AnalysisResult, CornerResult, ResponseHistory } from './analysis-result';
import { quantityDisplayFactor } from './quantity-field';

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

/** What the linear model's plots are drawn from: the road and each corner's linear results. */
export type LinearPlotSource = {
  road: RoadSpec;
  corners: Record<CornerPosition, Pick<CornerResult, 'stepHistory' | 'frf' | 'randomRoad'>>;
};

/** What the bump's plots are drawn from: the bump and each corner's history over it. */
export type BumpPlotSource = {
  bump: BumpSpec;
  corners: Record<CornerPosition, Pick<CornerResult, 'bumpHistory'>>;
};

const unitsOf = (system: UnitSystem) => ({
  len: quantityUnitLabel('length', system),
  force: quantityUnitLabel('force', system),
  accel: quantityUnitLabel('acceleration', system),
  kLen: quantityDisplayFactor('length', system),
  kForce: quantityDisplayFactor('force', system),
  kAccel: quantityDisplayFactor('acceleration', system),
});

/** Body acceleration, travel and tyre load against time, one series a corner. */
function historyPlots(
  prefix: 'step' | 'bump',
  heading: string,
  histories: Record<CornerPosition, ResponseHistory>,
  tireLabel: string,
  system: UnitSystem,
): LinePlotSpec[] {
  const { len, force, accel, kLen, kForce, kAccel } = unitsOf(system);
  return (
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
    series: CORNER_POSITIONS.map((p) => ({
      name: p,
      x: histories[p].time,
      y: scaled(signal(histories[p]), k),
    })),
  }));
}

/**
 * The linear model's plots in `system`: the step's time histories, the frequency response on
 * log axes, and the random-road bars per corner.
 */
export function analysisLinearPlots(
  source: LinearPlotSource,
  system: UnitSystem,
): Pick<AnalysisPlots, 'step' | 'frf' | 'randomRoad'> {
  const { len, force, accel, kLen, kForce, kAccel } = unitsOf(system);
  const corners = CORNER_POSITIONS.map((p) => ({ position: p, ...source.corners[p] }));
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
  const road = roadText(source.road, system);
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
  const steps = {} as Record<CornerPosition, ResponseHistory>;
  for (const p of CORNER_POSITIONS) steps[p] = source.corners[p].stepHistory;
  return {
    step: historyPlots(
      'step',
      `Road step of ${stepText(system)} (linear model)`,
      steps,
      'Dynamic tyre load',
      system,
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

/** The bump's time histories in `system`: body acceleration, travel and tyre load per corner. */
export function analysisBumpPlots(source: BumpPlotSource, system: UnitSystem): LinePlotSpec[] {
  const histories = {} as Record<CornerPosition, ResponseHistory>;
  for (const p of CORNER_POSITIONS) histories[p] = source.corners[p].bumpHistory;
  return historyPlots(
    'bump',
    `Bump ${bumpText(source.bump, system)} (nonlinear model)`,
    histories,
    'Tyre load',
    system,
  );
}

/**
 * The screen's plots of a result in `system`: the step and bump time histories (body
 * acceleration, travel, tyre load), the frequency response on log axes, and the random-road
 * bars per corner; one series per corner, axis labels with their units.
 */
export function analysisPlots(result: AnalysisResult, system: UnitSystem): AnalysisPlots {
  return {
    ...analysisLinearPlots({ road: result.options.road, corners: result.corners }, system),
    bump: analysisBumpPlots({ bump: result.options.bump, corners: result.corners }, system),
  };
}
