import type { FrequencyResponseMagnitude } from '../../core/frequency-response';
import type { RandomRoadResponse } from '../../core/random-road';
import { CORNER_POSITIONS } from '../../core/setup-sheet';
import { quantityUnitLabel, type UnitSystem } from '../../core/units';
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
