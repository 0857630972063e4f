import { FIGURES } from '../units/figure-labels';
import type { RoadSpec } from '../corner/corner-file';
import type { ClickAdjuster, ClickSettings } from '../damper/click-settings';
import { cornerQuarterCar, cornerRideFigures, type CornerInput } from '../corner/corner';
import { eventWarnings } from '../events/event-warnings';
import { modesOf } from '../corner/modal';
import type { QuantityKind, UnitSystem } from '../units/units';
import {
  valvingEventsOf,
  type ValvingDamper,
  type ValvingEvents,
  type ValvingFigures,
  type ValvingJob,
} from './valving-evaluate';
import {
  valvingCellIndex,
  valvingCornerWith,
  type ValvingAxis,
  type ValvingCurves,
  type ValvingCellSource,
} from './valving-map';
import {
  VALVING_OBJECTIVE,
  valvingScoreOf,
  type ValvingScore,
  type ValvingSource,
  type ValvingTargets,
} from './valving-targets';
import { cornerWarnings, randomRoadWarnings, type ModelWarning } from '../corner/warnings';

/** The figures a crew reads first, for picks, sensitivities and comparisons. */
export const VALVING_HEADLINE_KEYS = [
  'rideFrequencyHz',
  'bodyFrequencyHz',
  'bodyDampingRatio',
  'zetaBump',
  'zetaRebound',
  'zetaBumpHighSpeed',
  'zetaReboundHighSpeed',
  'roadWeightedAccel',
  'roadTireLoad',
  'roadTravel',
  'bumpPeakAccel',
  'bumpAirborneTime',
  'curbPeakAccel',
  'curbAirborneTime',
  'bumpStopTime',
] as const;
export type ValvingHeadlineKey = (typeof VALVING_HEADLINE_KEYS)[number];

/** Headline figures, SI; null where a figure does not exist (a body mode that does not oscillate). */
export type ValvingHeadline = Record<ValvingHeadlineKey, number | null>;

/** Words (and a short form for table heads), kind of quantity (null: a plain number) and the figure of each headline. */
export const VALVING_HEADLINES: Record<
  ValvingHeadlineKey,
  { label: string; short: string; kind: QuantityKind | null; of: (f: ValvingFigures) => number | null }
> = {
  rideFrequencyHz: {
    label: FIGURES.rideFrequency.label,
    short: 'ride',
    kind: 'frequency',
    of: (f) => f.rideFrequencyHz,
  },
  bodyFrequencyHz: {
    label: FIGURES.bodyMode.label,
    short: 'body Hz',
    kind: 'frequency',
    of: (f) => f.modes.body?.frequencyHz ?? null,
  },
  bodyDampingRatio: {
    label: FIGURES.bodyModeDamping.label,
    short: 'body ζ',
    kind: null,
    of: (f) => f.modes.body?.dampingRatio ?? null,
  },
  zetaBump: { label: 'ζ bump', short: 'ζ b', kind: null, of: (f) => f.dampingRatio.bump },
  zetaRebound: { label: 'ζ rebound', short: 'ζ r', kind: null, of: (f) => f.dampingRatio.rebound },
  zetaBumpHighSpeed: {
    label: 'ζ bump high speed',
    short: 'ζ b hs',
    kind: null,
    of: (f) => f.dampingRatio.bumpHighSpeed,
  },
  zetaReboundHighSpeed: {
    label: 'ζ rebound high speed',
    short: 'ζ r hs',
    kind: null,
    of: (f) => f.dampingRatio.reboundHighSpeed,
  },
  roadWeightedAccel: {
    label: `road: ${FIGURES.roadBodyAccelWeighted.label}`,
    short: 'road Wk',
    kind: 'acceleration',
    of: (f) => f.randomRoad.bodyAccelWeightedRms,
  },
  roadTireLoad: {
    label: `road: ${FIGURES.roadTireLoad.label}`,
    short: 'road tyre',
    kind: null,
    of: (f) => f.randomRoad.tireLoadRmsRatio,
  },
  roadTravel: {
    label: `road: ${FIGURES.roadTravel.label}`,
    short: 'road travel',
    kind: 'length',
    of: (f) => f.randomRoad.travelRms,
  },
  bumpPeakAccel: {
    label: `bump: ${FIGURES.peakBodyAccel.label}`,
    short: 'bump accel',
    kind: 'acceleration',
    of: (f) => f.bump.peakBodyAccel,
  },
  bumpAirborneTime: {
    label: `bump: ${FIGURES.airborneTime.label}`,
    short: 'bump air',
    kind: 'time',
    of: (f) => f.bump.airborneTime,
  },
  curbPeakAccel: {
    label: `curb: ${FIGURES.peakBodyAccel.label}`,
    short: 'curb accel',
    kind: 'acceleration',
    of: (f) => f.curb.peakBodyAccel,
  },
  curbAirborneTime: {
    label: `curb: ${FIGURES.airborneTime.label}`,
    short: 'curb air',
    kind: 'time',
    of: (f) => f.curb.airborneTime,
  },
  bumpStopTime: {
    label: `${FIGURES.bumpStopTime.label} (the longer event)`,
    short: 'on stop',
    kind: 'time',
    of: (f) => Math.max(f.bump.bumpStopContactTime, f.curb.bumpStopContactTime),
  },
};

/** The headline figures of a combination. */
export function valvingHeadlineOf(f: ValvingFigures): ValvingHeadline {
  const out = {} as ValvingHeadline;
  for (const k of VALVING_HEADLINE_KEYS) out[k] = VALVING_HEADLINES[k].of(f);
  return out;
}

/** after − before of each headline (null where either is missing). */
export function valvingHeadlineChange(before: ValvingHeadline, after: ValvingHeadline): ValvingHeadline {
  const out = {} as ValvingHeadline;
  for (const k of VALVING_HEADLINE_KEYS) {
    const a = before[k];
    const b = after[k];
    out[k] = a === null || b === null ? null : b - a;
  }
  return out;
}

/**
 * The model's warnings for `corner` fitted with `damper`, from its linear figures, its random
 * road (`road`, when given) and its two events.
 */
export function valvingWarningsOf(
  corner: CornerInput,
  damper: ValvingDamper,
  figures: ValvingFigures,
  events: ValvingEvents,
  units: UnitSystem = 'si',
  road?: RoadSpec,
): ModelWarning[] {
  const c = valvingCornerWith(corner, damper);
  return [
    ...cornerWarnings(cornerRideFigures(c), modesOf(cornerQuarterCar(c)), undefined, units),
    ...(road ? randomRoadWarnings(figures.randomRoad, road, units) : []),
    ...eventWarnings(c, events.bump, figures.bump, units),
    ...eventWarnings(c, events.curb, figures.curb, units),
  ];
}

/** Plain words of each adjuster, for steps and warnings. */
const ADJUSTER_NAMES: Record<ClickAdjuster, string> = {
  bump: 'bump',
  rebound: 'rebound',
  bumpHighSpeed: 'high-speed bump',
  reboundHighSpeed: 'high-speed rebound',
};

/** The ζ headline each adjuster moves most directly. */
const ADJUSTER_ZETA: Record<ClickAdjuster, ValvingHeadlineKey> = {
  bump: 'zetaBump',
  rebound: 'zetaRebound',
  bumpHighSpeed: 'zetaBumpHighSpeed',
  reboundHighSpeed: 'zetaReboundHighSpeed',
};

/**
 * A sensitivity step named in clicks, from the pick at `from`: "bump +3 clicks" when the next
 * setting on the map is three clicks away (only some clicks measured), "rebound −1 click".
 */
export function valvingStepText(step: Pick<ValvingStep, 'adjuster' | 'clicks'>, from: ClickSettings): string {
  const moved = (step.clicks[step.adjuster] ?? 0) - (from[step.adjuster] ?? 0);
  const n = Math.abs(moved);
  return `${ADJUSTER_NAMES[step.adjuster]} ${moved < 0 ? '−' : '+'}${n} click${n === 1 ? '' : 's'}`;
}

/**
 * A warning when the best pick sits at the end of an adjuster's clicks on the map: the best
 * may lie beyond, so the range measured (or the adjuster's) may be too narrow. Which end —
 * stiffest or softest — is read from the ζ that adjuster moves, one step inward.
 */
function rangeEndWarnings(
  clicks: ClickSettings,
  axes: readonly ValvingAxis[],
  sensitivity: readonly ValvingStep[],
): ModelWarning[] {
  const out: ModelWarning[] = [];
  for (const axis of axes) {
    const v = clicks[axis.adjuster];
    if (v === undefined || axis.clicks.length < 2) continue;
    if (v !== axis.clicks[0] && v !== axis.clicks[axis.clicks.length - 1]) continue;
    const inward = sensitivity.find((s) => s.adjuster === axis.adjuster);
    const dz = inward?.change?.[ADJUSTER_ZETA[axis.adjuster]] ?? null;
    const end =
      dz === null || dz === 0 ? 'an end of the' : dz < 0 ? 'the stiffest of the' : 'the softest of the';
    const name = ADJUSTER_NAMES[axis.adjuster];
    out.push({
      code: `best-at-range-end-${axis.adjuster}`,
      field: `clicks.${axis.adjuster}`,
      message: `The best pick is at ${end} ${name} clicks on the map (${name} ${v}): the best may lie beyond it, so the range may be too narrow; check the maker's adjuster range, and bench-test clicks further out within it before going there.`,
    });
  }
  return out;
}

/** One click either way on one adjuster, from a pick: where it lands and how the figures move. */
export type ValvingStep = {
  adjuster: ClickAdjuster;
  direction: -1 | 1;
  clicks: ClickSettings;
  /** The grid has no cell there (the end of the range, or not measured): nothing to show. */
  available: boolean;
  source: ValvingCellSource | null;
  /** Its score, and each headline's change from the pick (after − pick). */
  score: number | null;
  change: ValvingHeadline | null;
};

/** A ranked click combination on one corner: why it stands where it does, and how it moves. */
export type ValvingPick = ValvingScore & {
  rank: number;
  cell: number;
  clicks: ClickSettings;
  source: ValvingCellSource;
  runIds: number[];
  headline: ValvingHeadline;
  sensitivity: ValvingStep[];
  warnings: ModelWarning[];
};

/** One corner's ranking: how many were evaluated and met everything, the best few, the current clicks. */
export type ValvingCornerRanking = {
  position: string;
  evaluated: number;
  /** How many combinations meet every target. */
  meetingAll: number;
  best: ValvingPick[];
  /** The clicks the corner runs now (when given and on the map), ranked like the rest. */
  current: ValvingPick | null;
};

/** One axle's figures: the mean over its corners of the picks shown. */
export type ValvingAxle = {
  positions: string[];
  rideFrequencyHz: number;
  zetaBump: number;
  zetaRebound: number;
  lowSpeedMean: number;
};

/**
 * Front/rear balance: each axle's ride frequency and low-speed ζ, the rear ÷ front ratios, and
 * the flat-ride rule of the trade (rear ride frequency 10–20 % above the front).
 */
export type ValvingBalance = {
  front: ValvingAxle;
  rear: ValvingAxle;
  ratio: { rideFrequency: number; zetaBump: number; zetaRebound: number; lowSpeedMean: number };
  flatRide: { low: number; high: number; met: boolean; source: ValvingSource };
};

/** The flat-ride band of rear ÷ front ride frequency, with its source. */
export const VALVING_FLAT_RIDE = {
  low: 1.1,
  high: 1.2,
  source: {
    tag: 'trade',
    text: 'flat ride: rear ride frequency about 10–20 % above the front (common practice)',
  },
} as const satisfies { low: number; high: number; source: ValvingSource };

const FRONT = ['FL', 'FR'];
const REAR = ['RL', 'RR'];

/** Front/rear balance of the figures by corner position (FL, FR, RL, RR); null without both axles. */
export function valvingBalanceOf(
  corners: readonly { position: string; figures: ValvingFigures }[],
): ValvingBalance | null {
  const axle = (names: string[]): ValvingAxle | null => {
    const on = corners.filter((c) => names.includes(c.position));
    if (on.length === 0) return null;
    const mean = (f: (x: ValvingFigures) => number) => on.reduce((s, c) => s + f(c.figures), 0) / on.length;
    return {
      positions: on.map((c) => c.position),
      rideFrequencyHz: mean((f) => f.rideFrequencyHz),
      zetaBump: mean((f) => f.dampingRatio.bump),
      zetaRebound: mean((f) => f.dampingRatio.rebound),
      lowSpeedMean: mean((f) => f.dampingRatio.lowSpeedMean),
    };
  };
  const front = axle(FRONT);
  const rear = axle(REAR);
  if (!front || !rear) return null;
  const rideFrequency = rear.rideFrequencyHz / front.rideFrequencyHz;
  return {
    front,
    rear,
    ratio: {
      rideFrequency,
      zetaBump: rear.zetaBump / front.zetaBump,
      zetaRebound: rear.zetaRebound / front.zetaRebound,
      lowSpeedMean: rear.lowSpeedMean / front.lowSpeedMean,
    },
    flatRide: {
      low: VALVING_FLAT_RIDE.low,
      high: VALVING_FLAT_RIDE.high,
      met: rideFrequency >= VALVING_FLAT_RIDE.low && rideFrequency <= VALVING_FLAT_RIDE.high,
      source: VALVING_FLAT_RIDE.source,
    },
  };
}

/** A sweep ranked: the objective in words, each corner's ranking and the balance. */
export type ValvingRanking = {
  objective: string;
  corners: ValvingCornerRanking[];
  /** Balance of each corner's best pick, when the corners chosen include both axles. */
  balance: ValvingBalance | null;
};

/** Order of two combinations by VALVING_OBJECTIVE: score, then centring, then grid order. */
function rankOrder(a: { score: number; centring: number; cell: number }, b: typeof a): number {
  return a.score - b.score || a.centring - b.centring || a.cell - b.cell;
}

/**
 * Ranks every combination of a sweep on each corner by VALVING_OBJECTIVE against `targets`
 * and returns the best few with their checks (targets met, and missed by how much), the
 * sensitivity one grid step either way on each adjuster, the model's warnings, the corner's
 * current clicks when given, and the front/rear balance of the best picks. Ranking needs no
 * simulation, so new targets or weights re-rank the same sweep at once.
 */
export function valvingRank(
  job: ValvingJob,
  curves: Pick<ValvingCurves, 'axes' | 'cells'>,
  figures: readonly (readonly ValvingFigures[])[],
  targets: ValvingTargets,
  options: { best?: number; current?: readonly (ClickSettings | null)[]; units?: UnitSystem } = {},
): ValvingRanking {
  const events = valvingEventsOf(job.scenario);
  const bestCount = Math.max(1, Math.floor(options.best ?? 3));
  const corners = job.corners.map((corner, k): ValvingCornerRanking => {
    const figs = figures[k] ?? [];
    const scores = figs.map((f, cell) => ({ cell, ...valvingScoreOf(f, targets) }));
    const ordered = [...scores].sort(rankOrder);
    const rankOf = new Map(ordered.map((s, i) => [s.cell, i + 1]));
    const pickOf = (cell: number): ValvingPick => {
      const f = figs[cell] as ValvingFigures;
      const c = curves.cells[cell] as ValvingCurves['cells'][number];
      const headline = valvingHeadlineOf(f);
      const sensitivity: ValvingStep[] = [];
      for (const axis of curves.axes) {
        const at = axis.clicks.indexOf(c.clicks[axis.adjuster] as number);
        for (const direction of [-1, 1] as const) {
          const v = axis.clicks[at + direction];
          if (v === undefined) continue;
          const clicks = { ...c.clicks, [axis.adjuster]: v };
          const j = valvingCellIndex(curves, clicks);
          const g = j >= 0 ? figs[j] : undefined;
          sensitivity.push({
            adjuster: axis.adjuster,
            direction,
            clicks,
            available: g !== undefined,
            source: j >= 0 ? (curves.cells[j] as ValvingCurves['cells'][number]).source : null,
            score: g ? (scores[j] as ValvingScore).score : null,
            change: g ? valvingHeadlineChange(headline, valvingHeadlineOf(g)) : null,
          });
        }
      }
      return {
        rank: rankOf.get(cell) as number,
        cell,
        clicks: c.clicks,
        source: c.source,
        runIds: c.runIds,
        ...(scores[cell] as ValvingScore),
        headline,
        sensitivity,
        warnings: [
          ...(rankOf.get(cell) === 1 ? rangeEndWarnings(c.clicks, curves.axes, sensitivity) : []),
          ...valvingWarningsOf(corner.corner, c.damper, f, events, options.units, job.scenario.road),
        ],
      };
    };
    const now = options.current?.[k];
    const currentCell = now ? valvingCellIndex(curves, now) : -1;
    return {
      position: corner.position,
      evaluated: figs.length,
      meetingAll: scores.filter((s) => s.missed === 0).length,
      best: ordered.slice(0, bestCount).map((s) => pickOf(s.cell)),
      current: currentCell >= 0 && currentCell < figs.length ? pickOf(currentCell) : null,
    };
  });
  const balance = valvingBalanceOf(
    corners.flatMap((c, k) => {
      const best = c.best[0];
      const f = best ? figures[k]?.[best.cell] : undefined;
      return f ? [{ position: c.position, figures: f }] : [];
    }),
  );
  return { objective: VALVING_OBJECTIVE, corners, balance };
}
