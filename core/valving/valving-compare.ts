import type { UnitSystem } from '../units/units';
import type { ClickSettings } from '../damper/click-settings';
import { CORNER_POSITIONS, type CornerPosition, type SetupSheet } from '../setup/setup-sheet';
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
  type ValvingHeadlineKey,
} from './valving-rank';
import {
  valvingScoreOf,
  type ValvingScore,
  type ValvingTargetKey,
  type ValvingTargets,
} from './valving-targets';
import type { ModelWarning } from '../corner/warnings';

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
  units: UnitSystem = 'si',
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
      warnings: valvingWarningsOf(corner.analysis, corner.analysis.damper, f, events, units, scenario.road),
    };
  };
  const corners = CORNER_POSITIONS.map((p, i) => {
    const sa = side(a, p, (fa[i] as (typeof fa)[number]).figures);
    const sb = side(b, p, (fb[i] as (typeof fb)[number]).figures);
    return { position: p, a: sa, b: sb, change: valvingHeadlineChange(sa.headline, sb.headline) };
  });
  return { corners, balance: { a: valvingBalanceOf(fa), b: valvingBalanceOf(fb) } };
}

/**
 * Which way is better for each headline figure: lower (accelerations, tyre-load variation,
 * travel, time in the air or on the bump stop), inside the target band of the named target
 * (damping ratios, ride frequency), or neither (the body mode's own figures, which follow).
 */
export const VALVING_HEADLINE_SENSE: Record<
  ValvingHeadlineKey,
  { sense: 'lower' } | { sense: 'band'; target: ValvingTargetKey } | { sense: 'none' }
> = {
  rideFrequencyHz: { sense: 'band', target: 'rideFrequency' },
  bodyFrequencyHz: { sense: 'none' },
  bodyDampingRatio: { sense: 'none' },
  zetaBump: { sense: 'band', target: 'bumpLowSpeed' },
  zetaRebound: { sense: 'band', target: 'reboundLowSpeed' },
  zetaBumpHighSpeed: { sense: 'band', target: 'highSpeed' },
  zetaReboundHighSpeed: { sense: 'band', target: 'highSpeed' },
  roadWeightedAccel: { sense: 'lower' },
  roadTireLoad: { sense: 'lower' },
  roadTravel: { sense: 'lower' },
  bumpPeakAccel: { sense: 'lower' },
  bumpAirborneTime: { sense: 'lower' },
  curbPeakAccel: { sense: 'lower' },
  curbAirborneTime: { sense: 'lower' },
  bumpStopTime: { sense: 'lower' },
};

/** A change judged by its figure's sense; null where the figure has none or a value is missing. */
export type ValvingVerdict = 'better' | 'worse' | 'same' | null;

/**
 * Changes smaller than this, relative to the larger of the two values, are called the same:
 * half a percent, below what the inputs of a setup (weights, rates, curves measured on a bench)
 * can tell apart — our judgement, not a published figure. Tables print the change to 0.1 %.
 */
export const VALVING_SAME_RELATIVE = 0.005;

function bandDistance(v: number, t: { low: number | null; high: number | null }): number {
  if (t.low !== null && v < t.low) return t.low - v;
  if (t.high !== null && v > t.high) return v - t.high;
  return 0;
}

/** The rule valvingHeadlineVerdict judges by, in words, for every screen and report that shows a verdict. */
export const VALVING_VERDICT_RULE =
  'Better or worse by each figure’s sense: lower is better for accelerations, tyre-load variation, travel and time in the air or on the bump stop; a figure with a target band is better nearer the middle of its band (nearer the band, where the band is open at one end); the score (Σ weight × (miss ÷ scale)², 0 when every target is met) is better lower; a change under 0.5 % is the same. The change is shown whatever the verdict.';

/**
 * Whether going from `before` to `after` is better or worse for `key` (VALVING_VERDICT_RULE):
 * a change under VALVING_SAME_RELATIVE is the same; otherwise lower is better for the event and
 * road figures, and for a banded figure nearer the band's middle is better — inside the band
 * too, so that a ride frequency moving +4.7 % within its band is still judged — or, for a band
 * open at one end, nearer the band (anywhere inside it the same). Without the target (switched
 * off), a banded figure has no verdict.
 */
export function valvingHeadlineVerdict(
  key: ValvingHeadlineKey,
  before: number | null,
  after: number | null,
  targets: ValvingTargets,
): ValvingVerdict {
  if (before === null || after === null) return null;
  const s = VALVING_HEADLINE_SENSE[key];
  const scale = Math.max(Math.abs(before), Math.abs(after), Number.MIN_VALUE);
  if (s.sense === 'none') return null;
  if (Math.abs(after - before) <= VALVING_SAME_RELATIVE * scale) return 'same';
  if (s.sense === 'lower') return after < before ? 'better' : 'worse';
  const t = targets[s.target];
  if (!t || (t.low === null && t.high === null)) return null;
  const { low, high } = t;
  const off =
    low !== null && high !== null
      ? (v: number) => Math.abs(v - (low + high) / 2)
      : (v: number) => bandDistance(v, t);
  const da = off(before);
  const db = off(after);
  if (Math.abs(db - da) <= VALVING_SAME_RELATIVE * scale) return 'same';
  return db < da ? 'better' : 'worse';
}

/**
 * Whether going from score `before` to `after` (valvingScoreOf: 0 when every target is met) is
 * better or worse: lower is better, and a change under VALVING_SAME_RELATIVE is the same.
 */
export function valvingScoreVerdict(before: number, after: number): Exclude<ValvingVerdict, null> {
  const scale = Math.max(Math.abs(before), Math.abs(after));
  if (Math.abs(after - before) <= VALVING_SAME_RELATIVE * scale) return 'same';
  return after < before ? 'better' : 'worse';
}
