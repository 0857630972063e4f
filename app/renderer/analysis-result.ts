import { cornerQuarterCar, cornerValidate, type CornerFigures, type CornerInput } from '../../core/corner';
import { cornerAnalyze } from '../../core/corner-analysis';
import { eventBump } from '../../core/event';
import { eventWarnings } from '../../core/event-warnings';
import { frequencyResponseGrid, type FrequencyResponseMagnitude } from '../../core/frequency-response';
import type { EventMetrics } from '../../core/metrics';
import type { Modes } from '../../core/modal';
import type { RandomRoadResponse } from '../../core/random-road';
import { setupFileParse } from '../../core/setup-file';
import { CORNER_POSITIONS, type CornerPosition } from '../../core/setup-sheet';
import { eventSimulate } from '../../core/simulate';
import { stepResponseHistory, type StepResponse } from '../../core/step-response';
import type { UnitSystem } from '../../core/units';
import { cornerWarnings, type ModelWarning } from '../../core/warnings';
import type { AnalysisOptions } from './analysis-options';

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
