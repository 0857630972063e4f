import {
  cornerQuarterCar,
  cornerRideFigures,
  cornerValidate,
  type CornerFigures,
  type CornerInput,
  type QuarterCarLinear,
} from '../../core/corner/corner';
import { eventBump } from '../../core/events/event';
import { eventWarnings } from '../../core/events/event-warnings';
import {
  frequencyResponseGrid,
  frequencyResponseMagnitudeAt,
  type FrequencyResponseMagnitude,
} from '../../core/corner/frequency-response';
import type { EventMetrics } from '../../core/events/metrics';
import { modesOf, type Modes } from '../../core/corner/modal';
import { randomRoadResponse, type RandomRoadResponse } from '../../core/corner/random-road';
import { setupFileParse } from '../../core/setup/setup-file';
import { CORNER_POSITIONS, type CornerPosition } from '../../core/setup/setup-sheet';
import { eventSimulate } from '../../core/events/simulate';
import { stepResponseHistory, stepResponseLinear, type StepResponse } from '../../core/corner/step-response';
import type { UnitSystem } from '../../core/units/units';
import { cornerWarnings, randomRoadWarnings, type ModelWarning } from '../../core/corner/warnings';
import { cornerInputWarnings } from '../../core/corner/plausible-range';
import type { BumpSpec, RoadSpec } from '../../core/corner/corner-file';
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

/** One corner's linear-model results, SI, with its warnings in each unit system. */
export type CornerLinear = Pick<
  CornerResult,
  'position' | 'figures' | 'modes' | 'step' | 'randomRoad' | 'frf'
> & {
  warnings: Record<UnitSystem, ModelWarning[]>;
};

/** One corner's nonlinear bump, SI, with its warnings in each unit system. */
export type CornerEvent = Pick<CornerResult, 'bump' | 'bumpHistory'> & {
  warnings: Record<UnitSystem, ModelWarning[]>;
};

/** The linear model's results of a setup on a road: they change with the road, never with the bump. */
export type AnalysisLinear = {
  road: RoadSpec;
  corners: Record<CornerPosition, CornerLinear & { stepHistory: ResponseHistory }>;
  stepWindow: number;
};

/** The nonlinear bump's results of a setup: they change with the bump, never with the road. */
export type AnalysisEvents = { bump: BumpSpec; corners: Record<CornerPosition, CornerEvent> };

const FRF_GRID = () => frequencyResponseGrid(FRF_RANGE.low, FRF_RANGE.high, FRF_RANGE.perDecade);

/** Step responses already worked out, by corner: the step does not change with the road. */
const STEPS = new Map<string, StepResponse>();
const STEPS_KEPT = 64;
function stepOf(corner: CornerInput, q: QuarterCarLinear): StepResponse {
  const key = JSON.stringify(corner);
  let step = STEPS.get(key);
  if (!step) {
    step = stepResponseLinear(q);
    STEPS.set(key, step);
    if (STEPS.size > STEPS_KEPT) STEPS.delete(STEPS.keys().next().value as string);
  }
  return step;
}

/**
 * One corner on the linear model, as core's cornerAnalyze composes it: ride figures, modes,
 * the 10 mm step, the frequency response at `frequencies` and the random-road RMS figures, with
 * their warnings. The step, the slowest of them and the same on every road, is worked out once
 * a corner, so that a new road costs only the random-road integral.
 * @throws InputError naming the corner's field when it is not one a car could have.
 */
export function cornerLinearAnalyze(
  position: CornerPosition,
  corner: CornerInput,
  road: RoadSpec,
  frequencies: readonly number[] = FRF_GRID(),
): CornerLinear {
  // Corners read from a file are checked already; one handed over otherwise is checked here.
  cornerValidate(corner, `corners.${position}.corner`);
  const figures = cornerRideFigures(corner);
  const q = cornerQuarterCar(corner);
  const modes = modesOf(q);
  const step = stepOf(corner, q);
  const randomRoad = randomRoadResponse(q, road);
  const warningsIn = (units: UnitSystem) => [
    ...cornerInputWarnings(corner, units),
    ...cornerWarnings(figures, modes, step, units),
    ...randomRoadWarnings(randomRoad, road, units),
  ];
  return {
    position,
    figures,
    modes,
    step,
    randomRoad,
    frf: frequencies.map((f) => frequencyResponseMagnitudeAt(q, f)),
    // Both systems now, so the units switch rewrites the words without running anything again.
    warnings: { si: warningsIn('si'), us: warningsIn('us') },
  };
}

/**
 * The linear step's histories of all four corners on one window (the slowest corner's, see
 * stepWindowOf), added to their linear results.
 */
export function analysisLinearOf(
  corners: Record<CornerPosition, CornerInput>,
  road: RoadSpec,
  linear: Record<CornerPosition, CornerLinear>,
): AnalysisLinear {
  const stepWindow = stepWindowOf(CORNER_POSITIONS.map((p) => linear[p].step));
  const out = {} as AnalysisLinear['corners'];
  for (const p of CORNER_POSITIONS) {
    // The linear model's travel is zu − zs, compression positive, as the event's.
    const s = stepResponseHistory(cornerQuarterCar(corners[p]), stepWindow, HISTORY_POINTS);
    out[p] = {
      ...linear[p],
      stepHistory: { time: s.time, bodyAccel: s.bodyAccel, travel: s.travel, tireLoad: s.tireLoad },
    };
  }
  return { road, corners: out, stepWindow };
}

/**
 * One corner over the bump on the nonlinear quarter car: its peak figures and history, with
 * the event's warnings.
 */
export function cornerEventAnalyze(
  position: CornerPosition,
  corner: CornerInput,
  bump: BumpSpec,
): CornerEvent {
  cornerValidate(corner, `corners.${position}.corner`);
  const event = eventBump(bump);
  const sim = eventSimulate(corner, event, { historyPoints: HISTORY_POINTS });
  const h = sim.history;
  if (!h) throw new Error('the simulation returned no history');
  const warningsIn = (units: UnitSystem) => eventWarnings(corner, event, sim.metrics, units);
  return {
    bump: sim.metrics,
    bumpHistory: { time: h.time, bodyAccel: h.bodyAccel, travel: h.travel, tireLoad: h.tireLoad },
    warnings: { si: warningsIn('si'), us: warningsIn('us') },
  };
}

/** The screen's whole result from its two parts: the linear model's on a road, the bump's. */
export function analysisResultOf(linear: AnalysisLinear, events: AnalysisEvents): AnalysisResult {
  const corners = {} as Record<CornerPosition, CornerResult>;
  for (const p of CORNER_POSITIONS) {
    const l = linear.corners[p];
    const e = events.corners[p];
    corners[p] = {
      ...l,
      bump: e.bump,
      bumpHistory: e.bumpHistory,
      warnings: { si: [...l.warnings.si, ...e.warnings.si], us: [...l.warnings.us, ...e.warnings.us] },
    };
  }
  return { options: { road: linear.road, bump: events.bump }, corners, stepWindow: linear.stepWindow };
}

/**
 * The whole analysis of one setup, corner by corner, by core: ride figures, modes, the linear
 * 10 mm step with its history, the frequency response on a log grid, the random-road RMS
 * figures and the bump on the nonlinear quarter car with its history, with every warning.
 * `progress` is told after each corner (fraction done, what comes next). The page works the
 * linear part and the bump out apart (analysis-request.ts), each when its own input changes.
 * @throws InputError naming the corner's field when a corner is not one a car could have.
 */
export function setupAnalyze(
  corners: Record<CornerPosition, CornerInput>,
  options: AnalysisOptions,
  progress?: (fraction: number, stage: string) => void,
): AnalysisResult {
  const frequencies = FRF_GRID();
  const linear = {} as Record<CornerPosition, CornerLinear>;
  const events = {} as Record<CornerPosition, CornerEvent>;
  CORNER_POSITIONS.forEach((p, i) => {
    progress?.(i / (CORNER_POSITIONS.length + 1), `${p}: figures, random road and the bump`);
    linear[p] = cornerLinearAnalyze(p, corners[p], options.road, frequencies);
    events[p] = cornerEventAnalyze(p, corners[p], options.bump);
  });
  progress?.(CORNER_POSITIONS.length / (CORNER_POSITIONS.length + 1), 'step responses');
  const result = analysisResultOf(analysisLinearOf(corners, options.road, linear), {
    bump: options.bump,
    corners: events,
  });
  progress?.(1, 'done');
  return result;
}
