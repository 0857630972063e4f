import type { ClickSettings } from './click-settings';
import { CORNER_POSITIONS, type CornerPosition, type SetupSheet } from './setup-sheet';
import {
  valvingEventsOf,
  valvingFiguresOf,
  type ValvingFigures,
  type ValvingScenario,
} from './valving-evaluate';
import {
  valvingBalanceOf,
  valvingHeadlineChange,
  valvingHeadlineOf,
  valvingWarningsOf,
  type ValvingBalance,
  type ValvingHeadline,
} from './valving-rank';
import { valvingScoreOf, type ValvingScore, type ValvingTargets } from './valving-targets';
import type { ModelWarning } from './warnings';

/** One revision's corner as the track-day sheet shows it. */
export type ValvingCompareSide = {
  damperUnit: string;
  clicks: ClickSettings;
  headline: ValvingHeadline;
  score: ValvingScore;
  warnings: ModelWarning[];
};

/** One corner of the sheet: each revision's side and the change b − a. */
export type ValvingCompareCorner = {
  position: CornerPosition;
  a: ValvingCompareSide;
  b: ValvingCompareSide;
  /** b − a of each headline figure. */
  change: ValvingHeadline;
};

/** Two setups side by side on one scenario: per corner, figures, deltas, targets and warnings; and balance. */
export type ValvingCompare = {
  corners: ValvingCompareCorner[];
  balance: { a: ValvingBalance | null; b: ValvingBalance | null };
};

/**
 * Compares two setup sheets corner by corner on `scenario` against `targets`: each corner as
 * the sheet enters it (its own damper curve), through the same figures a sweep computes —
 * linear ζ and modes, the random road, the bump and the curb on the nonlinear quarter car —
 * with the change b − a, the targets each meets, the model's warnings and the front/rear balance.
 */
export function valvingCompare(
  a: SetupSheet,
  b: SetupSheet,
  scenario: ValvingScenario,
  targets: ValvingTargets,
): ValvingCompare {
  const events = valvingEventsOf(scenario);
  const figuresOf = (s: SetupSheet) =>
    CORNER_POSITIONS.map((p) => {
      const c = s.corners[p].analysis;
      return { position: p, figures: valvingFiguresOf(c, c.damper, scenario, events) };
    });
  const fa = figuresOf(a);
  const fb = figuresOf(b);
  const side = (s: SetupSheet, p: CornerPosition, f: ValvingFigures): ValvingCompareSide => {
    const corner = s.corners[p];
    return {
      damperUnit: corner.damperUnit,
      clicks: corner.clicks,
      headline: valvingHeadlineOf(f),
      score: valvingScoreOf(f, targets),
      warnings: valvingWarningsOf(corner.analysis, corner.analysis.damper, f, events),
    };
  };
  const corners = CORNER_POSITIONS.map((p, i) => {
    const sa = side(a, p, (fa[i] as (typeof fa)[number]).figures);
    const sb = side(b, p, (fb[i] as (typeof fb)[number]).figures);
    return { position: p, a: sa, b: sb, change: valvingHeadlineChange(sa.headline, sb.headline) };
  });
  return { corners, balance: { a: valvingBalanceOf(fa), b: valvingBalanceOf(fb) } };
}
