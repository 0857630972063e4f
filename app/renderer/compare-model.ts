import type { CornerPosition, SetupSheet } from '../../core/setup/setup-sheet';
import {
  valvingHeadlineVerdict,
  valvingScoreVerdict,
  type ValvingVerdict,
} from '../../core/valving/valving-compare';
import { VALVING_HEADLINE_KEYS, type ValvingHeadlineKey } from '../../core/valving/valving-rank';
import type { ValvingScore, ValvingTargets } from '../../core/valving/valving-targets';
import type { HandlerOutput } from '../api/contract';
import type { RevisionPick } from './app-context';

export type Compared = HandlerOutput<'setupCompare'>;
/** A revision on the Compare screen: its pick, name and sheet (SI). */
export type Loaded = { pick: RevisionPick; name: string; sheet: SetupSheet };

/** A revision's name as the Compare screen writes it. */
export const labelOf = (l: Loaded) => `${l.pick.vehicle} #${l.pick.revision} “${l.name}”`;

/** One headline figure at a corner: the baseline's value, and each other revision's with its verdict. */
export type CompareRow = {
  key: ValvingHeadlineKey;
  base: number | null;
  others: { v: number | null; verdict: ValvingVerdict }[];
};

/** The headline figures at `position` of the baseline (the first pair's a) and of each other revision. */
export function compareRows(
  compared: readonly Compared[],
  position: CornerPosition,
  targets: ValvingTargets,
): CompareRow[] {
  const [first] = compared;
  if (!first) return [];
  return VALVING_HEADLINE_KEYS.map((key) => {
    const corner = (c: Compared) => c.corners.find((x) => x.position === position);
    const base = corner(first)?.a.headline[key] ?? null;
    const others = compared.map((c) => {
      const v = corner(c)?.b.headline[key] ?? null;
      return { v, verdict: valvingHeadlineVerdict(key, base, v, targets) };
    });
    return { key, base, others };
  });
}

/** The baseline's score at `position` and each other revision's, with its verdict (lower is better). */
export type CompareScores = {
  base: ValvingScore;
  others: ({ s: ValvingScore; verdict: Exclude<ValvingVerdict, null> } | null)[];
};

export function compareScores(compared: readonly Compared[], position: CornerPosition): CompareScores | null {
  const side = (c: Compared, s: 'a' | 'b') => c.corners.find((x) => x.position === position)?.[s].score;
  const base = compared[0] ? side(compared[0], 'a') : undefined;
  if (!base) return null;
  return {
    base,
    others: compared.map((c) => {
      const s = side(c, 'b');
      return s ? { s, verdict: valvingScoreVerdict(base.score, s.score) } : null;
    }),
  };
}

/** The revisions after the baseline whose every headline figure is the baseline's, to the last digit. */
export function compareSameAsBaseline(loaded: readonly Loaded[], rows: readonly CompareRow[]): Loaded[] {
  return rows.length ? loaded.slice(1).filter((_, i) => rows.every((r) => r.others[i]?.v === r.base)) : [];
}
