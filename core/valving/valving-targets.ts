import { FIGURES } from '../units/figure-labels';
import { objectParse } from '../corner/corner-file';
import { InputError, inputFieldPath } from '../units/input-error';
import { quantityParse, type QuantityKind } from '../units/units';
import type { ValvingFigures } from './valving-evaluate';

/** The figures a valving choice is judged by, each with a band. */
export const VALVING_TARGET_KEYS = [
  'bumpLowSpeed',
  'reboundLowSpeed',
  'lowSpeedMean',
  'highSpeed',
  'reboundToBump',
  'rideFrequency',
  'roadComfort',
  'roadTireLoad',
  'bumpPeakAccel',
  'curbPeakAccel',
  'airborneTime',
  'bumpStopContact',
] as const;
export type ValvingTargetKey = (typeof VALVING_TARGET_KEYS)[number];

/**
 * Where a value comes from, tagged as the project's reference notes tag them: a published
 * source, one from memory of a named source, common practice of the trade, derived by
 * calculation from other bands, our own starting value, or set by the user for this run.
 */
export type ValvingSourceTag = 'pub' | 'mem' | 'trade' | 'calc' | 'ours' | 'user';
export type ValvingSource = { tag: ValvingSourceTag; text: string };

/**
 * A band for one target, in the figure's SI unit: a figure inside [low, high] meets it (a
 * null end is open). Outside, it misses by its distance to the band; `scale` is the distance
 * that counts as one unit of miss in the score, `weight` how much the target counts.
 */
export type ValvingTarget = {
  low: number | null;
  high: number | null;
  scale: number;
  weight: number;
  source: ValvingSource;
};

export type ValvingTargets = Partial<Record<ValvingTargetKey, ValvingTarget>>;

type TargetFigure = { figure: string; of: (f: ValvingFigures) => number };

/** What each target measures: words, the kind of quantity (null: a plain ratio), and the figures it checks. */
export const VALVING_TARGET_SPECS: Record<
  ValvingTargetKey,
  { label: string; kind: QuantityKind | null; figures: readonly TargetFigure[] }
> = {
  bumpLowSpeed: {
    label: 'ζ bump, low speed',
    kind: null,
    figures: [{ figure: 'ζ bump, low speed', of: (f) => f.dampingRatio.bump }],
  },
  reboundLowSpeed: {
    label: 'ζ rebound, low speed',
    kind: null,
    figures: [{ figure: 'ζ rebound, low speed', of: (f) => f.dampingRatio.rebound }],
  },
  lowSpeedMean: {
    label: 'ζ low speed, mean of bump and rebound',
    kind: null,
    figures: [{ figure: 'ζ low speed, mean', of: (f) => f.dampingRatio.lowSpeedMean }],
  },
  highSpeed: {
    label: 'ζ high speed, bump and rebound',
    kind: null,
    figures: [
      { figure: 'ζ bump, high speed', of: (f) => f.dampingRatio.bumpHighSpeed },
      { figure: 'ζ rebound, high speed', of: (f) => f.dampingRatio.reboundHighSpeed },
    ],
  },
  reboundToBump: {
    label: 'rebound ÷ bump damping, low speed',
    kind: null,
    figures: [
      { figure: 'rebound ÷ bump, low speed', of: (f) => f.dampingRatio.rebound / f.dampingRatio.bump },
    ],
  },
  rideFrequency: {
    label: 'ride frequency',
    kind: 'frequency',
    figures: [{ figure: FIGURES.rideFrequency.label, of: (f) => f.rideFrequencyHz }],
  },
  roadComfort: {
    label: 'Wk-weighted body acceleration RMS on the random road',
    kind: 'acceleration',
    figures: [
      {
        figure: `road: ${FIGURES.roadBodyAccelWeighted.label}`,
        of: (f) => f.randomRoad.bodyAccelWeightedRms,
      },
    ],
  },
  roadTireLoad: {
    label: 'dynamic tyre load RMS ÷ static load on the random road',
    kind: null,
    figures: [{ figure: `road: ${FIGURES.roadTireLoad.label}`, of: (f) => f.randomRoad.tireLoadRmsRatio }],
  },
  bumpPeakAccel: {
    label: 'peak body acceleration over the bump',
    kind: 'acceleration',
    figures: [{ figure: `bump: ${FIGURES.peakBodyAccel.label}`, of: (f) => f.bump.peakBodyAccel }],
  },
  curbPeakAccel: {
    label: 'peak body acceleration over the curb',
    kind: 'acceleration',
    figures: [{ figure: `curb: ${FIGURES.peakBodyAccel.label}`, of: (f) => f.curb.peakBodyAccel }],
  },
  airborneTime: {
    label: `${FIGURES.airborneTime.label}, over the bump and over the curb`,
    kind: 'time',
    figures: [
      { figure: `bump: ${FIGURES.airborneTime.label}`, of: (f) => f.bump.airborneTime },
      { figure: `curb: ${FIGURES.airborneTime.label}`, of: (f) => f.curb.airborneTime },
    ],
  },
  bumpStopContact: {
    label: `${FIGURES.bumpStopTime.label}, over the bump and over the curb`,
    kind: 'time',
    figures: [
      { figure: `bump: ${FIGURES.bumpStopTime.label}`, of: (f) => f.bump.bumpStopContactTime },
      { figure: `curb: ${FIGURES.bumpStopTime.label}`, of: (f) => f.curb.bumpStopContactTime },
    ],
  },
};

/** One figure checked against its target's band. */
export type ValvingTargetCheck = {
  target: ValvingTargetKey;
  figure: string;
  value: number;
  low: number | null;
  high: number | null;
  met: boolean;
  /** How far outside the band, in the figure's unit: positive above it, negative below, 0 inside. */
  miss: number;
  weight: number;
  /** weight · (miss / scale)²: this check's share of the score. */
  penalty: number;
};

/** A combination's standing against the targets (lower score and centring are better). */
export type ValvingScore = {
  score: number;
  centring: number;
  checks: ValvingTargetCheck[];
  met: number;
  missed: number;
};

/** The objective, in words, as every result states it. */
export const VALVING_OBJECTIVE =
  'score = Σ weight × (miss ÷ scale)² over the figures of every target, where miss is how far a figure lies outside its band (0 inside); lower is better. Equal scores are split by centring, the weighted mean of ((figure − band centre) ÷ half the band)² over the two-ended bands (lower is nearer the middle), then by the order of the click grid.';

/**
 * How a combination's figures stand against `targets` (VALVING_OBJECTIVE): every figure of
 * every target checked, the score Σ weight·(miss/scale)² and the centring.
 */
export function valvingScoreOf(figures: ValvingFigures, targets: ValvingTargets): ValvingScore {
  const checks: ValvingTargetCheck[] = [];
  let score = 0;
  let centring = 0;
  let centringWeight = 0;
  for (const key of VALVING_TARGET_KEYS) {
    const t = targets[key];
    if (!t) continue;
    for (const { figure, of } of VALVING_TARGET_SPECS[key].figures) {
      const value = of(figures);
      const below = t.low !== null && value < t.low ? value - t.low : 0;
      const above = t.high !== null && value > t.high ? value - t.high : 0;
      // NaN (a figure that could not be formed) misses every band.
      const miss = Number.isNaN(value) ? Infinity : below + above;
      const penalty = miss === 0 ? 0 : t.weight * (miss / t.scale) ** 2;
      score += penalty;
      if (t.low !== null && t.high !== null && t.high > t.low && t.weight > 0) {
        const half = (t.high - t.low) / 2;
        centring += t.weight * ((value - (t.low + half)) / half) ** 2;
        centringWeight += t.weight;
      }
      checks.push({
        target: key,
        figure,
        value,
        low: t.low,
        high: t.high,
        met: miss === 0,
        miss,
        weight: t.weight,
        penalty,
      });
    }
  }
  const met = checks.filter((c) => c.met).length;
  return {
    score,
    centring: centringWeight > 0 ? centring / centringWeight : 0,
    checks,
    met,
    missed: checks.length - met,
  };
}

const USER_SOURCE: ValvingSource = { tag: 'user', text: 'set for this choice' };

/** The default scale of a band: half its width, or the size of its one end. */
function scaleOf(low: number | null, high: number | null): number | null {
  if (low !== null && high !== null && high > low) return (high - low) / 2;
  const end = high ?? low;
  return end !== null && end !== 0 ? Math.abs(end) : null;
}

function boundParse(raw: unknown, kind: QuantityKind | null, field: string): number {
  if (kind === null) {
    const n = typeof raw === 'string' && raw.trim() !== '' ? Number(raw.trim()) : raw;
    if (typeof n !== 'number' || !Number.isFinite(n))
      throw new InputError(field, `got ${JSON.stringify(raw)}; expected a plain number such as 0.65`);
    return n;
  }
  return quantityParse(raw, kind, field);
}

/** Reads "LOW..HIGH", "..HIGH", "LOW.." or "off" into the ends of a band. */
function bandTextParse(
  text: string,
  kind: QuantityKind | null,
  field: string,
): { low: number | null; high: number | null } | 'off' {
  const t = text.trim();
  if (t.toLowerCase() === 'off') return 'off';
  const parts = t.split('..');
  if (parts.length !== 2)
    throw new InputError(
      field,
      `got "${text}"; expected a band LOW..HIGH (either end may be left out, e.g. "..0.02 s") or "off"`,
    );
  const [lo, hi] = parts.map((p) => p.trim()) as [string, string];
  return {
    low: lo === '' ? null : boundParse(lo, kind, field),
    high: hi === '' ? null : boundParse(hi, kind, field),
  };
}

function targetBuild(
  key: ValvingTargetKey,
  base: ValvingTarget | undefined,
  patch: { low?: number | null; high?: number | null; weight?: number; scale?: number },
  field: string,
): ValvingTarget {
  const low = patch.low !== undefined ? patch.low : (base?.low ?? null);
  const high = patch.high !== undefined ? patch.high : (base?.high ?? null);
  if (low === null && high === null)
    throw new InputError(field, 'a band needs a low end, a high end or both');
  if (low !== null && high !== null && !(low <= high))
    throw new InputError(field, `the low end (${low}) is above the high end (${high})`);
  const bandChanged = patch.low !== undefined || patch.high !== undefined;
  const scale = patch.scale ?? (bandChanged || !base ? scaleOf(low, high) : base.scale);
  if (scale === null)
    throw new InputError(
      field,
      `a band whose only end is 0 needs a scale: how far past it counts as one unit of miss (e.g. "scale": ${VALVING_TARGET_SPECS[key].kind === 'time' ? '"10 ms"' : '0.1'})`,
    );
  const weight = patch.weight ?? base?.weight ?? 1;
  return {
    low,
    high,
    scale,
    weight,
    source: bandChanged || patch.scale !== undefined || !base ? USER_SOURCE : base.source,
  };
}

function weightParse(raw: unknown, field: string): number {
  const w = typeof raw === 'string' && raw.trim() !== '' ? Number(raw.trim()) : raw;
  if (typeof w !== 'number' || !Number.isFinite(w) || w < 0 || w > 1000)
    throw new InputError(
      field,
      `got ${JSON.stringify(raw)}; expected a weight from 0 to 1000 (0: shown, not scored)`,
    );
  return w;
}

function keyCheck(key: string, field: string): ValvingTargetKey {
  if (!(VALVING_TARGET_KEYS as readonly string[]).includes(key))
    throw new InputError(field, `"${key}" is not a target (targets: ${VALVING_TARGET_KEYS.join(', ')})`);
  return key as ValvingTargetKey;
}

/**
 * Applies edits to a preset's targets: an object by target name, each "off", a band text
 * "LOW..HIGH" (an end may be left out; quantities with units, e.g. "..20 ms"), or an object
 * {low, high, scale, weight} whose fields replace the preset's. Weights alone may come in
 * `weights` ({name: number}). Edited bands are tagged as set by the user.
 * @throws InputError naming the target.
 */
export function valvingTargetsEdit(
  base: ValvingTargets,
  edits: unknown,
  weights: unknown = undefined,
  field = 'targets',
): ValvingTargets {
  const out: ValvingTargets = { ...base };
  if (edits !== undefined) {
    const o = objectParse(edits, field, VALVING_TARGET_KEYS);
    for (const [name, raw] of Object.entries(o)) {
      const key = keyCheck(name, field);
      const at = inputFieldPath(field, key);
      const kind = VALVING_TARGET_SPECS[key].kind;
      if (typeof raw === 'string') {
        const band = bandTextParse(raw, kind, at);
        if (band === 'off') delete out[key];
        else out[key] = targetBuild(key, out[key], band, at);
        continue;
      }
      const b = objectParse(raw, at, ['low', 'high', 'scale', 'weight']);
      const patch: { low?: number | null; high?: number | null; weight?: number; scale?: number } = {};
      for (const end of ['low', 'high'] as const) {
        if (b[end] === null) patch[end] = null;
        else if (b[end] !== undefined) patch[end] = boundParse(b[end], kind, inputFieldPath(at, end));
      }
      if (b.weight !== undefined) patch.weight = weightParse(b.weight, inputFieldPath(at, 'weight'));
      if (b.scale !== undefined) {
        const s = boundParse(b.scale, kind, inputFieldPath(at, 'scale'));
        if (!(s > 0))
          throw new InputError(inputFieldPath(at, 'scale'), `must be greater than zero (got ${s})`);
        patch.scale = s;
      }
      out[key] = targetBuild(key, out[key], patch, at);
    }
  }
  if (weights !== undefined) {
    const o = objectParse(weights, 'weights', VALVING_TARGET_KEYS);
    for (const [name, raw] of Object.entries(o)) {
      const key = keyCheck(name, 'weights');
      const at = inputFieldPath('weights', key);
      const t = out[key];
      if (!t) throw new InputError(at, `the target "${key}" is off; give it a band first`);
      out[key] = { ...t, weight: weightParse(raw, at) };
    }
  }
  return out;
}

/**
 * Reads a command line's "NAME=VALUE" (`--target bumpLowSpeed=0.5..0.7`, `--weight
 * airborneTime=3`) into a name and its text, for `valvingTargetsEdit`.
 * @throws InputError naming `field`.
 */
export function valvingTargetAssignmentParse(text: string, field: string): [ValvingTargetKey, string] {
  const eq = text.indexOf('=');
  if (eq <= 0)
    throw new InputError(field, `got "${text}"; expected NAME=VALUE, e.g. "bumpLowSpeed=0.5..0.7"`);
  return [keyCheck(text.slice(0, eq).trim(), field), text.slice(eq + 1)];
}
