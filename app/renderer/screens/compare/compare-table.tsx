import { numberFormat, quantityFormat, type UnitSystem } from '../../../../core/units/units';
import { VALVING_VERDICT_RULE, type ValvingVerdict } from '../../../../core/valving/valving-compare';
import { VALVING_HEADLINES, type ValvingHeadlineKey } from '../../../../core/valving/valving-rank';
import type { CornerPosition } from '../../../../core/setup/setup-sheet';
import { labelOf, type CompareRow, type CompareScores, type Loaded } from '../../compare-model';

function valueText(key: ValvingHeadlineKey, v: number | null, units: UnitSystem): string {
  if (v === null) return '—';
  const kind = VALVING_HEADLINES[key].kind;
  if (kind === 'time') return `${numberFormat(v * 1000, 1)} ms`;
  if (kind === 'frequency') return `${numberFormat(v, 2)} Hz`;
  return kind
    ? quantityFormat(v, kind, units, kind === 'length' ? { decimals: units === 'si' ? 2 : 3 } : {})
    : numberFormat(v, 3);
}

const VERDICT_TEXT: Record<Exclude<ValvingVerdict, null>, string> = {
  better: '▲ better',
  worse: '▼ worse',
  same: '= same',
};

/**
 * The headline figures of a corner: the baseline's, and each other revision's value, change
 * and verdict — the change always shown — then targets met and the score, and the rule the
 * verdicts follow.
 */
export function CompareTable(props: {
  rows: CompareRow[];
  scores: CompareScores | null;
  loaded: Loaded[];
  position: CornerPosition;
  units: UnitSystem;
}) {
  const { rows, scores, loaded, position, units } = props;
  return (
    <>
      {rows.length > 0 && loaded.length >= 2 ? (
        <table className="figures" aria-label={`Headline figures at ${position}`} data-testid="compare-table">
          <thead>
            <tr>
              <th scope="col">{position}</th>
              <th scope="col">{labelOf(loaded[0] as Loaded)}</th>
              {loaded.slice(1).map((l) => (
                <th scope="col" key={labelOf(l)} colSpan={3}>
                  {labelOf(l)}: value, change, verdict
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.key}>
                <th scope="row" style={{ textAlign: 'left' }}>
                  {VALVING_HEADLINES[r.key].label}
                </th>
                <td>{valueText(r.key, r.base, units)}</td>
                {r.others.map((o, i) => {
                  const d = r.base !== null && o.v !== null ? o.v - r.base : null;
                  const pct =
                    d !== null && r.base !== null && r.base !== 0 ? (100 * d) / Math.abs(r.base) : null;
                  return [
                    <td key={`v${i}`}>{valueText(r.key, o.v, units)}</td>,
                    <td key={`d${i}`}>
                      {d === null ? '—' : `${d >= 0 ? '+' : '−'}${valueText(r.key, Math.abs(d), units)}`}
                      {pct === null ? '' : ` (${pct >= 0 ? '+' : '−'}${numberFormat(Math.abs(pct), 1)} %)`}
                    </td>,
                    <td
                      key={`j${i}`}
                      className={o.verdict === 'better' ? 'better' : o.verdict === 'worse' ? 'worse' : ''}
                      data-verdict={o.verdict ?? ''}
                    >
                      {o.verdict ? VERDICT_TEXT[o.verdict] : '—'}
                    </td>,
                  ];
                })}
              </tr>
            ))}
            {scores ? (
              <>
                <tr>
                  <th scope="row" style={{ textAlign: 'left' }}>
                    Targets met
                  </th>
                  <td>
                    {scores.base.met} of {scores.base.met + scores.base.missed}
                  </td>
                  {scores.others.map((o, i) => [
                    <td key={`v${i}`}>{o ? `${o.s.met} of ${o.s.met + o.s.missed}` : '—'}</td>,
                    <td key={`d${i}`}>
                      {o
                        ? `${o.s.met - scores.base.met >= 0 ? '+' : '−'}${Math.abs(o.s.met - scores.base.met)}`
                        : '—'}
                    </td>,
                    <td key={`j${i}`} />,
                  ])}
                </tr>
                <tr data-figure="score">
                  <th scope="row" style={{ textAlign: 'left' }}>
                    Score (0 when every target is met; lower is better)
                  </th>
                  <td>{numberFormat(scores.base.score, 3)}</td>
                  {scores.others.map((o, i) => [
                    <td key={`v${i}`}>{o ? numberFormat(o.s.score, 3) : '—'}</td>,
                    <td key={`d${i}`}>
                      {o
                        ? `${o.s.score - scores.base.score >= 0 ? '+' : '−'}${numberFormat(Math.abs(o.s.score - scores.base.score), 3)}`
                        : '—'}
                    </td>,
                    <td
                      key={`j${i}`}
                      className={o?.verdict === 'better' ? 'better' : o?.verdict === 'worse' ? 'worse' : ''}
                      data-verdict={o?.verdict ?? ''}
                    >
                      {o ? VERDICT_TEXT[o.verdict] : '—'}
                    </td>,
                  ])}
                </tr>
              </>
            ) : null}
          </tbody>
        </table>
      ) : null}
      {rows.length > 0 && loaded.length >= 2 ? (
        <p className="muted" data-testid="verdict-rule">
          <strong>How the verdict is given:</strong> {VALVING_VERDICT_RULE}
        </p>
      ) : null}
    </>
  );
}
