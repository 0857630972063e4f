import { describe, expect, it } from 'vitest';
import { cornerQuarterCar } from '../../../core/corner/corner';
import { eventBump, eventCurb } from '../../../core/events/event';
import { randomRoadResponse } from '../../../core/corner/random-road';
import { eventSimulate } from '../../../core/events/simulate';
import { valvingJobOf } from '../../../core/valving/valving';
import {
  VALVING_RANDOM_ROAD_REL_TOL,
  valvingComboEvaluate,
  valvingEvaluatorOf,
  valvingJobSize,
} from '../../../core/valving/valving-evaluate';
import { valvingCornerWith } from '../../../core/valving/valving-map';
import { VALVING_PRESETS } from '../../../core/valving/valving-presets';
import {
  ValvingSweepStopped,
  valvingChunkEvaluate,
  valvingChunkRanges,
  valvingSweepMerge,
  valvingSweepSerial,
} from '../../../core/valving/valving-sweep';
import { MILLBROOK_FRONT_LEFT } from '../demo-corner';
import { bilinear, cellOf } from '../valving-fixture';

const scenario = VALVING_PRESETS['track-day'].scenario;
// Cells 0 and 2 share their mean low-speed slope: the random road of one serves the other.
const cells = [
  cellOf({ rebound: 0 }, bilinear(3000, 0.05, 1000), bilinear(7000, 0.06, 2500)),
  cellOf({ rebound: 1 }, bilinear(3000, 0.05, 1000), bilinear(6000, 0.06, 2200)),
  cellOf({ rebound: 2 }, bilinear(4000, 0.07, 1200), bilinear(6000, 0.05, 2000)),
];
const job = valvingJobOf(
  { cells },
  [
    { position: 'FL', corner: MILLBROOK_FRONT_LEFT },
    { position: 'RL', corner: { ...MILLBROOK_FRONT_LEFT, cornerMass: 280, springRate: 60_000 } },
  ],
  scenario,
);

describe('valving sweep', () => {
  it('evaluates combination i as corner ⌊i/cells⌋ with cell i mod cells, from the engines themselves', () => {
    expect(valvingJobSize(job)).toBe(6);
    const f = valvingComboEvaluate(job, 4);
    const corner = valvingCornerWith(job.corners[1]!.corner, cells[1]!.damper);
    // The nonlinear events with the cell's curve, and the linear random road at its mean damping.
    expect(f.bump).toEqual(eventSimulate(corner, eventBump(scenario.bump)).metrics);
    expect(f.curb).toEqual(eventSimulate(corner, eventCurb(scenario.curb)).metrics);
    expect(f.randomRoad).toEqual(
      randomRoadResponse(cornerQuarterCar(corner), scenario.road, { relTol: VALVING_RANDOM_ROAD_REL_TOL }),
    );
    expect(() => valvingComboEvaluate(job, 6)).toThrow(RangeError);
    expect(() => valvingComboEvaluate(job, -1)).toThrow(RangeError);
    expect(() => valvingComboEvaluate(job, 0.5)).toThrow(RangeError);
  });

  it('keeps the random-road figures to 1e-9 of the default tolerance while it runs ten times fewer points', () => {
    const q = cornerQuarterCar(valvingCornerWith(MILLBROOK_FRONT_LEFT, cells[0]!.damper));
    for (const road of [
      { roadClass: 'A' as const, speed: 50 },
      { roadClass: 'C' as const, speed: 20 },
      { roadClass: 'E' as const, speed: 5 },
    ]) {
      const fast = randomRoadResponse(q, road, { relTol: VALVING_RANDOM_ROAD_REL_TOL });
      // [calc] the same integral at the module's default 1e-8.
      const reference = randomRoadResponse(q, road);
      for (const k of ['bodyAccelRms', 'bodyAccelWeightedRms', 'tireLoadRms', 'travelRms'] as const)
        expect(Math.abs(fast[k] / reference[k] - 1)).toBeLessThan(1e-9);
    }
  });

  it('gives the same figures in chunks as one by one, and its cache changes nothing', () => {
    const one = Array.from({ length: 6 }, (_, i) => valvingComboEvaluate(job, i));
    const evaluator = valvingEvaluatorOf(job);
    const chunks = valvingChunkRanges(6, 4).map((r) => valvingChunkEvaluate(evaluator, r.start, r.end));
    expect(chunks.map((c) => [c.start, c.figures.length])).toEqual([
      [0, 4],
      [4, 2],
    ]);
    const merged = valvingSweepMerge(job, [chunks[1]!, chunks[0]!]);
    expect(merged).toEqual([one.slice(0, 3), one.slice(3)]);
    expect(valvingSweepSerial(job)).toEqual(merged);
    // Cells 0 and 2 have the same mean low-speed damping, so one random-road result served both.
    expect(merged[0]![2]!.randomRoad).toBe(merged[0]![0]!.randomRoad);
  });

  it('reports progress after each combination and stops between combinations when asked', () => {
    const evaluator = valvingEvaluatorOf(job);
    const seen: number[] = [];
    const stopped = valvingChunkEvaluate(evaluator, 1, 6, {
      onProgress: (n) => seen.push(n),
      shouldStop: () => seen.length >= 2,
    });
    expect(seen).toEqual([1, 2]);
    expect(stopped).toMatchObject({ start: 1, stopped: true });
    expect(stopped.figures).toHaveLength(2);
    expect(() => valvingSweepSerial(job, { shouldStop: () => true })).toThrow(ValvingSweepStopped);
    expect(() => valvingChunkEvaluate(evaluator, 2, 9)).toThrow(RangeError);
    expect(valvingChunkEvaluate(evaluator, 3, 3).figures).toEqual([]);
  });

  it('merges a sweep whole or not at all', () => {
    const evaluator = valvingEvaluatorOf(job);
    const a = valvingChunkEvaluate(evaluator, 0, 3);
    const b = valvingChunkEvaluate(evaluator, 3, 6);
    expect(() => valvingSweepMerge(job, [a])).toThrow(/combination 3 has no result/);
    expect(() => valvingSweepMerge(job, [a, b, a])).toThrow(/evaluated twice/);
    expect(() => valvingSweepMerge(job, [a, { ...b, start: 4 }])).toThrow(/past the job/);
    expect(valvingChunkRanges(0, 8)).toEqual([]);
    expect(valvingChunkRanges(5, 0)).toHaveLength(5);
  });

  it('survives JSON: a job and its figures cross to a worker as they are', () => {
    expect(JSON.parse(JSON.stringify(job))).toEqual(job);
    const f = valvingComboEvaluate(job, 0);
    expect(JSON.parse(JSON.stringify(f))).toEqual(f);
  });
});
