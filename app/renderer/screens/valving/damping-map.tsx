import type { UnitSystem } from '../../../../core/units';
import {
  ADJUSTER_WORDS,
  MAP_FIGURES,
  bandOf,
  clicksText,
  type MapFigure,
  type ValvingMap,
} from '../../valving-model';

/** One figure of a damper's map as a table over the click grid, shaded by value. */
export function HeatMap(props: {
  map: ValvingMap;
  figure: MapFigure;
  units: UnitSystem;
  band?: { low: number | null; high: number | null };
}) {
  const { map, figure, units } = props;
  const [rows, cols] = map.axes;
  const values = map.cells.map(figure.value).filter((v): v is number => v !== null);
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  if (!rows) return null;
  const cellAt = (i: number, j: number) => map.cells[cols ? i * cols.clicks.length + j : i];
  const shade = (v: number) => {
    // Light to mid blue with black text throughout: the number is printed, the shade only helps.
    const t = hi > lo ? (v - lo) / (hi - lo) : 0.5;
    return `hsl(215 70% ${96 - 38 * t}%)`;
  };
  return (
    <table
      className="figures heat-map"
      aria-label={`${figure.label} over the clicks at ${map.position}`}
      data-testid="heat-map"
      data-vehicle={map.vehicle.name}
      data-revision={map.revision}
    >
      <caption style={{ textAlign: 'left', fontWeight: 700 }}>
        {figure.label} at {map.position} with {map.damper}: rows {ADJUSTER_WORDS[rows.adjuster]} clicks
        {cols ? `, columns ${ADJUSTER_WORDS[cols.adjuster]} clicks` : ''}.
        {figure.target ? ' ✓ inside the target band;' : ''} i interpolated; — none.
      </caption>
      <thead>
        <tr>
          <th scope="col">
            {ADJUSTER_WORDS[rows.adjuster]} \ {cols ? ADJUSTER_WORDS[cols.adjuster] : ''}
          </th>
          {(cols?.clicks ?? [0]).map((c) => (
            <th scope="col" key={c}>
              {cols ? c : ''}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.clicks.map((r, i) => (
          <tr key={r}>
            <th scope="row">{r}</th>
            {(cols?.clicks ?? [0]).map((_, j) => {
              const cell = cellAt(i, j);
              const v = cell ? figure.value(cell) : null;
              if (!cell || v === null) return <td key={j}>—</td>;
              const inBand = bandOf(props.band, v);
              return (
                <td
                  key={j}
                  style={{ background: shade(v), textAlign: 'center' }}
                  title={clicksText(cell.clicks)}
                >
                  {figure.text(v, units)}
                  {inBand ? ' ✓' : ''}
                  {cell.source === 'interpolated' ? ' i' : ''}
                </td>
              );
            })}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** Every figure of every click of the map, one row a click combination. */
export function MapTable(props: { map: ValvingMap; units: UnitSystem }) {
  const { map, units } = props;
  return (
    <details>
      <summary>Every figure at each click ({map.cells.length} rows)</summary>
      <table className="figures" aria-label={`Every figure over the clicks at ${map.position}`}>
        <thead>
          <tr>
            <th scope="col">Clicks</th>
            {MAP_FIGURES.map((f) => (
              <th scope="col" key={f.key}>
                {f.label}
              </th>
            ))}
            <th scope="col">Bench runs</th>
          </tr>
        </thead>
        <tbody>
          {map.cells.map((c) => (
            <tr key={clicksText(c.clicks)}>
              <th scope="row">
                {clicksText(c.clicks)}
                {c.source === 'interpolated' ? ' (interpolated)' : ''}
              </th>
              {MAP_FIGURES.map((f) => {
                const v = f.value(c);
                return <td key={f.key}>{v === null ? '—' : f.text(v, units)}</td>;
              })}
              <td>{c.runIds.length ? c.runIds.map((id) => `#${id}`).join(' ') : '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </details>
  );
}
