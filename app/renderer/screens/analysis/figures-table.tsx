import { memo } from 'react';
import { CORNER_POSITIONS } from '../../../../core/setup/setup-sheet';
import type { FigureGroup } from '../../analysis-figures';

/**
 * The figures per corner in groups, each value with the warnings that concern it; a group
 * being worked out again for new inputs is marked so (its old values stay until the new come).
 */
export const FiguresTable = memo(function FiguresTable(props: {
  groups: FigureGroup[];
  stale?: ReadonlySet<string>;
}) {
  return (
    <table className="figures analysis-figures" aria-label="Ride figures per corner">
      <thead>
        <tr>
          <th scope="col">Figure</th>
          {CORNER_POSITIONS.map((p) => (
            <th scope="col" key={p}>
              {p}
            </th>
          ))}
        </tr>
      </thead>
      {props.groups.map((g) => (
        <tbody
          key={g.key}
          data-group={g.key}
          aria-busy={props.stale?.has(g.key) ? true : undefined}
          className={props.stale?.has(g.key) ? 'stale' : undefined}
        >
          <tr className="group-row">
            <th scope="colgroup" colSpan={CORNER_POSITIONS.length + 1}>
              {g.title}
              {props.stale?.has(g.key) ? (
                <span className="muted"> — working out the new figures…</span>
              ) : null}
            </th>
          </tr>
          {g.rows.map((r) => (
            <tr key={r.key} data-figure={r.key}>
              <th scope="row">{r.label}</th>
              {CORNER_POSITIONS.map((p) => {
                const w = r.warnings[p];
                return (
                  <td key={p} data-corner={p} className={w.length ? 'has-warning' : undefined}>
                    {w.length ? (
                      <span
                        className="warn-mark"
                        role="img"
                        aria-label={`warning: ${w.map((x) => x.message).join(' ')}`}
                        title={w.map((x) => x.message).join('\n')}
                      >
                        ⚠{' '}
                      </span>
                    ) : null}
                    {r.cells[p]}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      ))}
    </table>
  );
});
