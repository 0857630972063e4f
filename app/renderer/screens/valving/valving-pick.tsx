import { valvingStepText } from '../../../../core/valving/valving-rank';
import { numberFormat, type UnitSystem } from '../../../../core/units/units';
import { WarningList } from '../../components/caution';
import { checkNumber, clicksText, type TargetKinds, type ValvingPick } from '../../valving-model';

/** One ranked click combination: its checks against the targets, one click either way, its warnings. */
export function PickDetail(props: {
  pick: ValvingPick;
  units: UnitSystem;
  title: string;
  kinds: TargetKinds;
}) {
  const p = props.pick;
  const { units, kinds } = props;
  return (
    <details open={p.rank === 1}>
      <summary>
        <strong>{props.title}</strong>: {clicksText(p.clicks)} — meets {p.met} of {p.met + p.missed} checks,
        score {numberFormat(p.score, 3)}
        {p.source === 'interpolated' ? ' (interpolated clicks, not measured)' : ''}
      </summary>
      <table className="figures" aria-label={`Checks of ${clicksText(p.clicks)}`}>
        <thead>
          <tr>
            <th scope="col">Figure</th>
            <th scope="col">Value</th>
            <th scope="col">Band</th>
            <th scope="col">Meets?</th>
          </tr>
        </thead>
        <tbody>
          {p.checks.map((c, i) => {
            const kind = kinds.get(c.target);
            return (
              <tr key={i}>
                <td>{c.figure}</td>
                <td>{checkNumber(c.value, kind, units)}</td>
                <td>
                  {c.low === null ? '…' : checkNumber(c.low, kind, units, false)} to{' '}
                  {c.high === null ? '…' : checkNumber(c.high, kind, units)}
                </td>
                <td className={c.met ? 'better' : 'worse'}>
                  {c.met ? '✓ yes' : `✗ misses by ${checkNumber(Math.abs(c.miss), kind, units)}`}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {p.sensitivity.length > 0 ? (
        <table
          className="figures"
          aria-label={`The next setting on the map either way from ${clicksText(p.clicks)}`}
        >
          <thead>
            <tr>
              <th scope="col">Step (in clicks)</th>
              <th scope="col">Clicks</th>
              <th scope="col">Score</th>
              <th scope="col">ζ bump change</th>
              <th scope="col">ζ rebound change</th>
              <th scope="col">Bump peak accel. change</th>
            </tr>
          </thead>
          <tbody>
            {p.sensitivity.map((s, i) => (
              <tr key={i}>
                <td>{valvingStepText(s, p.clicks)}</td>
                <td>{s.available ? clicksText(s.clicks) : `${clicksText(s.clicks)}: not measured`}</td>
                <td>{s.score === null ? '—' : numberFormat(s.score, 3)}</td>
                <td>{s.change?.zetaBump === null || !s.change ? '—' : numberFormat(s.change.zetaBump, 3)}</td>
                <td>
                  {s.change?.zetaRebound === null || !s.change ? '—' : numberFormat(s.change.zetaRebound, 3)}
                </td>
                <td>
                  {s.change?.bumpPeakAccel === null || !s.change
                    ? '—'
                    : `${numberFormat(s.change.bumpPeakAccel, 2)} m/s²`}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      <WarningList warnings={p.warnings} label={`Model warnings for ${clicksText(p.clicks)}`} />
    </details>
  );
}
