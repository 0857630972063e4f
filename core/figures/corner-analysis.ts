import type { UnitSystem } from '../units/units';
import {
  cornerQuarterCar,
  cornerRideFigures,
  type CornerFigures,
  type QuarterCarLinear,
} from '../corner/corner';
import type { CornerFile } from '../corner/corner-file';
import { eventBump, type RoadEvent } from '../events/event';
import { eventWarnings } from '../events/event-warnings';
import {
  DEFAULT_RESPONSE_FREQUENCIES_HZ,
  frequencyResponseMagnitudeAt,
  type FrequencyResponseMagnitude,
} from '../corner/frequency-response';
import type { EventMetrics } from '../events/metrics';
import { modesOf, type Modes } from '../corner/modal';
import { cornerInputWarnings, figuresFiniteCheck, plausibleUsualWarning } from '../corner/plausible-range';
import { randomRoadResponse, type RandomRoadResponse } from '../corner/random-road';
import { eventSimulate } from '../events/simulate';
import { stepResponseLinear, type StepResponse } from '../corner/step-response';
import { cornerWarnings, randomRoadWarnings, type ModelWarning } from '../corner/warnings';

/** Everything the analysis of one corner file gives, SI. */
export type CornerAnalysis = {
  name: string;
  /** The file as read, SI. */
  file: CornerFile;
  figures: CornerFigures;
  quarterCar: QuarterCarLinear;
  modes: Modes;
  frf: FrequencyResponseMagnitude[];
  randomRoad?: RandomRoadResponse;
  /** The file's bump on the nonlinear quarter car, when the file has one. */
  bump?: { event: RoadEvent; metrics: EventMetrics };
  step: StepResponse;
  warnings: ModelWarning[];
};

/**
 * The analysis of a corner file: ride figures, modes, frequency response at `frequencies`
 * (Hz), random-road RMS figures when the file has a road, the linear 10 mm step, the file's
 * bump simulated on the nonlinear quarter car when it has one, and the warnings of all of them.
 */
export function cornerAnalyze(
  file: CornerFile,
  options: { frequencies?: readonly number[]; units?: UnitSystem } = {},
): CornerAnalysis {
  const units = options.units ?? 'si';
  const figures = cornerRideFigures(file.corner);
  const quarterCar = cornerQuarterCar(file.corner);
  const modes = modesOf(quarterCar);
  const step = stepResponseLinear(quarterCar);
  const analysis: CornerAnalysis = {
    name: file.name,
    file,
    figures,
    quarterCar,
    modes,
    frf: (options.frequencies ?? DEFAULT_RESPONSE_FREQUENCIES_HZ).map((f) =>
      frequencyResponseMagnitudeAt(quarterCar, f),
    ),
    step,
    warnings: [...cornerInputWarnings(file.corner, units), ...cornerWarnings(figures, modes, step, units)],
  };
  if (file.road) {
    analysis.randomRoad = randomRoadResponse(quarterCar, file.road);
    analysis.warnings.push(...randomRoadWarnings(analysis.randomRoad, file.road, units));
    const w = plausibleUsualWarning(file.road.speed, 'eventSpeed', 'road.speed', units);
    if (w) analysis.warnings.push(w);
  }
  if (file.bump) {
    const event = eventBump(file.bump);
    const metrics = eventSimulate(file.corner, event).metrics;
    analysis.bump = { event, metrics };
    for (const [value, key, field] of [
      [file.bump.height, 'bumpHeight', 'bump.height'],
      [file.bump.length, 'bumpLength', 'bump.length'],
      [file.bump.speed, 'eventSpeed', 'bump.speed'],
    ] as const) {
      const w = plausibleUsualWarning(value, key, field, units);
      if (w) analysis.warnings.push(w);
    }
    analysis.warnings.push(...eventWarnings(file.corner, event, metrics, units));
  }
  // The final guard: a figure that is not a finite number is an error, never a figure.
  const { file: _file, bump, warnings: _warnings, ...figuresOnly } = analysis;
  figuresFiniteCheck({ ...figuresOnly, bump: bump?.metrics }, 'corner');
  return analysis;
}
