import { cornerQuarterCar, cornerRideFigures, type CornerInput } from '../corner/corner';
import type { BumpSpec, RoadSpec } from '../corner/corner-file';
import type { DamperDirectionCurve } from '../damper/damper-curve';
import { eventBump, eventCurb, type RoadEvent } from '../events/event';
import type { EventMetrics } from '../events/metrics';
import { randomRoadResponse, type RandomRoadResponse } from '../corner/random-road';
import type { CurbSpec } from '../events/road';
import { eventSimulate } from '../events/simulate';
import { valvingCellFiguresOf, valvingCornerWith, type ValvingCellFigures } from './valving-map';

/** The road a valving choice is judged on: an ISO 8608 class at a speed, a (1−cos) bump and a curb strike, SI. */
export type ValvingScenario = {
  road: RoadSpec;
  bump: BumpSpec;
  curb: CurbSpec & { speed: number };
};

/** Everything one click combination gives on one corner, SI. */
export type ValvingFigures = ValvingCellFigures & {
  rideFrequencyHz: number;
  wheelHopFrequencyHz: number;
  /** The linear quarter car on the scenario's random road. */
  randomRoad: RandomRoadResponse;
  /** The nonlinear quarter car with the measured curve over the bump and the curb. */
  bump: EventMetrics;
  curb: EventMetrics;
};

/** A damper's two directions, as a cell of the map holds them. */
export type ValvingDamper = { bump: DamperDirectionCurve; rebound: DamperDirectionCurve };

/**
 * A sweep: every cell (click combination) of a damper's map on every corner, JSON only, so
 * that it crosses to a worker thread or a Web Worker as it is. Combination i is corner
 * ⌊i / cells⌋ with cell i mod cells.
 */
export type ValvingJob = {
  corners: readonly { position: string; corner: CornerInput }[];
  cells: readonly { damper: ValvingDamper }[];
  scenario: ValvingScenario;
};

/**
 * Relative accuracy of each random-road integral in a sweep. Checked against the default
 * 1e-8 over classes A–E, 5–50 m/s and damping ×0.1–×4: the RMS figures agree to 1e-11, at a
 * tenth of the cost.
 */
export const VALVING_RANDOM_ROAD_REL_TOL = 1e-6;

/** The scenario's two nonlinear events, built once: their labels are formatted with units. */
export type ValvingEvents = { bump: RoadEvent; curb: RoadEvent };

/** The scenario's (1−cos) bump and curb strike as road events (DESIGN.md, Nonlinear events), SI. */
export function valvingEventsOf(scenario: ValvingScenario): ValvingEvents {
  return { bump: eventBump(scenario.bump, 'scenario.bump'), curb: eventCurb(scenario.curb, 'scenario.curb') };
}

/**
 * The figures of `corner` with `damper` on `scenario`: the linear ζ figures and modes, the
 * random-road RMS figures of the linear quarter car, and the bump and curb on the nonlinear
 * quarter car with the curve itself. `randomRoad`, when given, supplies the random-road
 * figures for a linear quarter car (a cache: they depend only on its mean low-speed damping).
 */
export function valvingFiguresOf(
  corner: CornerInput,
  damper: ValvingDamper,
  scenario: ValvingScenario,
  events: ValvingEvents = valvingEventsOf(scenario),
  randomRoad: (wheelDamping: number, compute: () => RandomRoadResponse) => RandomRoadResponse = (_c, f) =>
    f(),
): ValvingFigures {
  const c = valvingCornerWith(corner, damper);
  const ride = cornerRideFigures(c);
  const q = cornerQuarterCar(c);
  return {
    ...valvingCellFiguresOf(corner, damper),
    rideFrequencyHz: ride.rideFrequencyHz,
    wheelHopFrequencyHz: ride.wheelHopFrequencyHz,
    randomRoad: randomRoad(q.wheelDamping, () =>
      randomRoadResponse(q, scenario.road, { relTol: VALVING_RANDOM_ROAD_REL_TOL }),
    ),
    bump: eventSimulate(c, events.bump).metrics,
    curb: eventSimulate(c, events.curb).metrics,
  };
}

/** How many combinations a job has: corners × cells. */
export function valvingJobSize(job: ValvingJob): number {
  return job.corners.length * job.cells.length;
}

/** Evaluates a job's combinations by index, with the events built once and the random road cached. */
export type ValvingEvaluator = { readonly size: number; evaluate(index: number): ValvingFigures };

/**
 * An evaluator for `job`. The linear quarter car of a corner changes with the clicks only
 * through its mean low-speed wheel damping (DESIGN.md: the linear model's c), so its
 * random-road figures are kept per corner and damping value and reused by every cell that
 * shares them: a cache, not an approximation — the figures are those computed for that value.
 */
export function valvingEvaluatorOf(job: ValvingJob): ValvingEvaluator {
  const events = valvingEventsOf(job.scenario);
  const caches = job.corners.map(() => new Map<number, RandomRoadResponse>());
  const cells = job.cells.length;
  return {
    size: valvingJobSize(job),
    evaluate(index) {
      if (!Number.isInteger(index) || index < 0 || index >= this.size)
        throw new RangeError(`combination ${index} is outside the job's 0…${this.size - 1}`);
      const k = Math.floor(index / cells);
      const corner = job.corners[k] as ValvingJob['corners'][number];
      const cache = caches[k] as Map<number, RandomRoadResponse>;
      const cell = job.cells[index % cells] as ValvingJob['cells'][number];
      return valvingFiguresOf(corner.corner, cell.damper, job.scenario, events, (c, compute) => {
        let r = cache.get(c);
        if (!r) {
          r = compute();
          cache.set(c, r);
        }
        return r;
      });
    },
  };
}

/** One combination on its own, from scratch: what a sweep's result for index i must equal. */
export function valvingComboEvaluate(job: ValvingJob, index: number): ValvingFigures {
  return valvingEvaluatorOf(job).evaluate(index);
}
