import { quantityFormat, type UnitSystem } from '../../../core/units/units';
import { benchRunLabel, type BenchRun } from '../damper-model';
import { MAX_SHOWN, orDash } from './dampers-shared';

export function RunsTable(props: {
  runs: BenchRun[];
  shown: number[];
  onToggle: (id: number) => void;
  units: UnitSystem;
}) {
  const u = props.units;
  return (
    <table className="figures runs-table" aria-label="Bench runs">
      <thead>
        <tr>
          <th scope="col">Show</th>
          <th scope="col">Run</th>
          <th scope="col">Clicks</th>
          <th scope="col">Date</th>
          <th scope="col">Stroke</th>
          <th scope="col">Test frequency</th>
          <th scope="col">Temperature</th>
          <th scope="col">Points</th>
          <th scope="col">From</th>
        </tr>
      </thead>
      <tbody>
        {props.runs.map((r) => {
          const on = props.shown.includes(r.id);
          const full = !on && props.shown.length >= MAX_SHOWN;
          return (
            <tr key={r.id} data-run={r.id}>
              <td>
                <input
                  type="checkbox"
                  id={`run-show-${r.id}`}
                  aria-label={`Show run ${benchRunLabel(r)} on the plot`}
                  checked={on}
                  disabled={full}
                  title={full ? `Up to ${MAX_SHOWN} runs at once` : undefined}
                  onChange={() => props.onToggle(r.id)}
                />
              </td>
              <th scope="row">#{r.id}</th>
              <td>{benchRunLabel(r).replace(/^#\d+ ?/, '') || '—'}</td>
              <td>{r.date ?? '—'}</td>
              <td>{orDash(r.stroke, (v) => quantityFormat(v, 'length', u))}</td>
              <td>{orDash(r.testFrequency, (v) => quantityFormat(v, 'frequency', u))}</td>
              <td>{orDash(r.temperature, (v) => quantityFormat(v, 'temperature', u))}</td>
              <td>
                {r.pointCount}
                {r.traceSamples !== null ? ` (from ${r.traceSamples} trace samples)` : ''}
              </td>
              <td>
                {r.sourceName}
                {r.sourceColumn ? ` (${r.sourceColumn})` : ''}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
