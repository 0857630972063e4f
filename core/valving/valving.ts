import type { CornerInput } from '../corner/corner';
import type { ValvingDamper, ValvingJob, ValvingScenario } from './valving-evaluate';
import { valvingPresetOf, valvingScenarioEdit, type ValvingPreset } from './valving-presets';
import { valvingTargetsEdit, type ValvingTargets } from './valving-targets';

/**
 * Choosing valving, in pieces that run anywhere (Node, a browser, a worker):
 * 1. valvingCurvesOf (valving-map.ts): a damper's bench runs → its curves over the click grid;
 *    valvingMapOf gives each cell's ζ figures and modes on a corner, for a table or a heat map.
 * 2. valvingSettingsOf (here): a preset with the user's edits → the scenario and the targets.
 * 3. valvingJobOf (here): curves × corners × scenario → a JSON job.
 * 4. valvingChunkEvaluate (valving-sweep.ts): a worker evaluates a range of the job's
 *    combinations, with progress and a stop between combinations; valvingSweepMerge puts the
 *    chunks back in order (valvingSweepSerial does it all in one thread).
 * 5. valvingRank (valving-rank.ts): the figures and the targets → the best few per corner,
 *    why, their sensitivity one click either way, and the front/rear balance.
 */

/** What a choice is judged on: the preset it starts from, the scenario and the targets after edits. */
export type ValvingSettings = { preset: ValvingPreset; scenario: ValvingScenario; targets: ValvingTargets };

/** The edits a user may make to a preset; see valvingScenarioEdit and valvingTargetsEdit. */
export type ValvingEdits = { scenario?: unknown; targets?: unknown; weights?: unknown };

/**
 * A preset by name with the user's edits applied.
 * @throws InputError naming the preset or the edited field.
 */
export function valvingSettingsOf(presetName: string, edits: ValvingEdits = {}): ValvingSettings {
  const preset = valvingPresetOf(presetName);
  return {
    preset,
    scenario: valvingScenarioEdit(preset.scenario, edits.scenario),
    targets: valvingTargetsEdit(preset.targets, edits.targets, edits.weights),
  };
}

/** The sweep of every cell of `curves` on every corner over `scenario`. */
export function valvingJobOf(
  curves: { cells: readonly { damper: ValvingDamper }[] },
  corners: readonly { position: string; corner: CornerInput }[],
  scenario: ValvingScenario,
): ValvingJob {
  return {
    corners: corners.map((c) => ({ position: c.position, corner: c.corner })),
    cells: curves.cells.map((c) => ({ damper: c.damper })),
    scenario,
  };
}
