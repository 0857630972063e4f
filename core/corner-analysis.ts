import { cornerQuarterCar, cornerRideFigures, type CornerFigures, type QuarterCarLinear } from './corner';
import type { CornerFile } from './corner-file';
import {
  DEFAULT_RESPONSE_FREQUENCIES_HZ,
  frequencyResponseMagnitudeAt,
  type FrequencyResponseMagnitude,
} from './frequency-response';
import { modesOf, type Modes } from './modal';
import { randomRoadResponse, type RandomRoadResponse } from './random-road';
import { stepResponseLinear, type StepResponse } from './step-response';
import { cornerWarnings, type ModelWarning } from './warnings';

/** Everything the linear analysis of one corner file gives, SI. */
export type CornerAnalysis = {
  name: string;
  /** The file as read, SI. */
  file: CornerFile;
  figures: CornerFigures;
  quarterCar: QuarterCarLinear;
  modes: Modes;
  frf: FrequencyResponseMagnitude[];
  randomRoad?: RandomRoadResponse;
  step: StepResponse;
  warnings: ModelWarning[];
};

/**
 * The linear analysis of a corner file: ride figures, modes, frequency response at
 * `frequencies` (Hz), random-road RMS figures when the file has a road, the 10 mm step,
 * and the warnings.
 */
export function cornerAnalyze(
  file: CornerFile,
  options: { frequencies?: readonly number[] } = {},
): CornerAnalysis {
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
    warnings: cornerWarnings(figures, modes, step),
  };
  if (file.road) analysis.randomRoad = randomRoadResponse(quarterCar, file.road);
  return analysis;
}
