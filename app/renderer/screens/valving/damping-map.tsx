import { useState } from 'react';
import type { UnitSystem } from '../../../../core/units/units';
import {
  ADJUSTER_WORDS,
  MAP_FIGURES,
  bandOf,
  clicksText,
  heatMapGrid,
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
  const [at, setAt] = useState<Record<string, number>>({});
  const grid = heatMapGrid(map, at);
  if (!grid) return null;
  const { rows, cols } = grid;
  const values = grid.cells
    .flat()
    .map((c) => (c ? figure.value(c) : null))
    .filter((v): v is number => v !== null);
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const shade = (v: number) => {
    // Light to mid blue with black text throughout: the number is printed, the shade only helps.
    const t = hi > lo ? (v - lo) / (hi - lo) : 0.5;
    return `hsl(215 70% ${96 - 38 * t}%)`;
  };
  const slice = Object.entries(grid.at);
  return (
    <>
      {map.axes.slice(2).map((axis) => (
        <label key={axis.adjuster} className="toolbar">
          {ADJUSTER_WORDS[axis.adjuster]} clicks{' '}
          <select
            value={grid.at[axis.adjuster]}
            onChange={(e) => setAt({ ...at, [axis.adjuster]: Number(e.target.value) })}
          >
            {axis.clicks.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
        </label>
      ))}
      <table
        className="figures heat-map"
        aria-label={`${figure.label} over the clicks at ${map.position}`}
        data-testid="heat-map"
        data-vehicle={map.vehicle.name}
        data-revision={map.revision}
      >
        <caption style={{ textAlign: 'left', fontWeight: 700 }}>
          {figure.label} at {map.position} with {map.damper}: rows {ADJUSTER_WORDS[rows.adjuster]} clicks
          {cols ? `, columns ${ADJUSTER_WORDS[cols.adjuster]} clicks` : ''}
          {slice.length ? `, at ${slice.map(([a, v]) => `${ADJUSTER_WORDS[a] ?? a} ${v}`).join(', ')}` : ''}.
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
              {(grid.cells[i] ?? []).map((cell, j) => {
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
    </>
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
