import type { CornerInput } from '../../core/corner/corner';
import { damperCurveParse } from '../../core/damper/damper-curve';
import { setupFileParse } from '../../core/setup/setup-file';
import { CORNER_POSITIONS, type CornerPosition, type SetupSheet } from '../../core/setup/setup-sheet';
import type { HandlerOutput } from '../api/contract';

/** Which damper curve a corner runs and where it comes from, as the API resolves it. */
export type CornerDamper = HandlerOutput<'setupShow'>['dampers'][number];

/**
 * A stored revision's sheet with each corner's damper curve replaced by the one its figures
 * use (the bench's at its clicks, or the entered one: the API decides, `setupShow.dampers`),
 * so that every screen computes a revision's figures with the same curves.
 */
export function revisionSheetOf(shown: Pick<HandlerOutput<'setupShow'>, 'file' | 'dampers'>): SetupSheet {
  const sheet = setupFileParse(shown.file).sheet;
  const corners = { ...sheet.corners };
  for (const d of shown.dampers) {
    const c = corners[d.position];
    const damper = damperCurveParse(d.curve, `dampers.${d.position}`);
    corners[d.position] = { ...c, analysis: { ...c.analysis, damper } };
  }
  return { ...sheet, corners };
}

/** The four corners of a stored revision as its figures are computed: each with the damper curve it runs. */
export function revisionCornersOf(
  shown: Pick<HandlerOutput<'setupShow'>, 'file' | 'dampers'>,
): Record<CornerPosition, CornerInput> {
  const sheet = revisionSheetOf(shown);
  const out = {} as Record<CornerPosition, CornerInput>;
  for (const p of CORNER_POSITIONS) out[p] = sheet.corners[p].analysis;
  return out;
}
