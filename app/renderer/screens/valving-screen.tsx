import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { CAUTION_TEXT } from '../../../core/safety/caution';
import type { ClickSettings } from '../../../core/damper/click-settings';
import { setupFileParse } from '../../../core/setup/setup-file';
import { CORNER_POSITIONS, type CornerPosition } from '../../../core/setup/setup-sheet';
import {
  numberFormat,
  quantityFormat,
  quantityFromDisplay,
  quantityToDisplay,
  quantityUnitLabel,
  type QuantityKind,
  type UnitSystem,
} from '../../../core/units/units';
import { VALVING_HEADLINES, valvingStepText } from '../../../core/valving/valving-rank';
import type { ValvingTargetKey } from '../../../core/valving/valving-targets';
import type { HandlerOutput } from '../../api/contract';
import { apiCall, apiJob, ApiCallError, type JobProgress } from '../api-client';
import { scenarioText } from '../scenario-model';
import { useApp, type RevisionPick } from '../app-context';
import { CornerChoice, PresetChoice } from '../components/choices';
import { CautionLine, WarningList } from '../components/caution';
import { ScenarioPanel, useVehicleScenario } from '../components/scenario-panel';
import { RevisionPicker } from '../components/revision-pick';
import { ErrorLine, ProgressLine } from '../components/status';

type Presets = HandlerOutput<'valvingPresets'>;
type ValvingMap = HandlerOutput<'valvingMap'>;
type Choice = HandlerOutput<'valvingChoose'>;
type Pick = Choice['corners'][number]['best'][number];
/** A target as the table shows it; `band` and `weight` say what the user changed (only that is sent). */
type TargetEdit = {
  low: string;
  high: string;
  weight: string;
  off: boolean;
  band: boolean;
  weighted: boolean;
};

const ADJUSTER_WORDS: Record<string, string> = {
  bump: 'bump',
  rebound: 'rebound',
  bumpHighSpeed: 'bump high',
  reboundHighSpeed: 'rebound high',
};

export const clicksText = (c: ClickSettings) =>
  Object.entries(c)
    .map(([k, v]) => `${ADJUSTER_WORDS[k] ?? k} ${v}`)
    .join(', ') || 'no clicks';

type MapCell = ValvingMap['cells'][number];

/**
 * The map's figures a heat map can show, SI: ζ (with the target whose band marks them), the
 * damper's knee speeds and the linearised modes. null where a cell has none (a mode that does
 * not oscillate).
 */
const MAP_FIGURES: readonly {
  key: string;
  label: string;
  value: (c: MapCell) => number | null;
  text: (v: number, units: UnitSystem) => string;
  target?: ValvingTargetKey;
}[] = [
  ...(
    [
      ['lowSpeedMean', 'ζ low speed, mean', 'lowSpeedMean'],
      ['bump', 'ζ bump, low speed', 'bumpLowSpeed'],
      ['rebound', 'ζ rebound, low speed', 'reboundLowSpeed'],
      ['bumpHighSpeed', 'ζ bump, high speed', 'highSpeed'],
      ['reboundHighSpeed', 'ζ rebound, high speed', 'highSpeed'],
    ] as const
  ).map(([key, label, target]) => ({
    key,
    label,
    target,
    value: (c: MapCell) => c.figures.dampingRatio[key],
    text: (v: number) => numberFormat(v, 2),
  })),
  ...(['bump', 'rebound'] as const).map((dir) => ({
    key: `knee-${dir}`,
    label: `knee speed, ${dir}`,
    value: (c: MapCell) => c.figures.kneeSpeed[dir],
    text: (v: number, units: UnitSystem) => quantityFormat(v, 'velocity', units),
  })),
  ...(
    [
      ['body', 'body mode'],
      ['wheelHop', 'wheel-hop mode'],
    ] as const
  ).flatMap(([mode, words]) => [
    {
      key: `${mode}-frequency`,
      label: `${words}, frequency`,
      value: (c: MapCell) => c.figures.modes[mode]?.frequencyHz ?? null,
      text: (v: number) => `${numberFormat(v, 2)} Hz`,
    },
    {
      key: `${mode}-damping`,
      label: `${words}, ζ`,
      value: (c: MapCell) => c.figures.modes[mode]?.dampingRatio ?? null,
      text: (v: number) => numberFormat(v, 2),
    },
  ]),
];

function bandOf(t: { low: number | null; high: number | null } | undefined, v: number): boolean | null {
  if (!t || (t.low === null && t.high === null)) return null;
  return (t.low === null || v >= t.low) && (t.high === null || v <= t.high);
}

/** A target value in the unit system's display unit, or the plain number. */
const shown = (v: number | null, kind: string | null, units: UnitSystem) =>
  v === null
    ? ''
    : String(Number((kind ? quantityToDisplay(v, kind as QuantityKind, units) : v).toPrecision(4)));

function HeatMap(props: {
  map: ValvingMap;
  figure: (typeof MAP_FIGURES)[number];
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
function MapTable(props: { map: ValvingMap; units: UnitSystem }) {
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

type TargetKinds = ReadonlyMap<ValvingTargetKey, QuantityKind | null>;

/** A check's value in the unit system, with its unit where it has one. */
function checkNumber(
  v: number,
  kind: QuantityKind | null | undefined,
  units: UnitSystem,
  unit = true,
): string {
  if (!kind) return numberFormat(v, 3);
  const text = numberFormat(quantityToDisplay(v, kind, units), 3);
  return unit ? `${text} ${quantityUnitLabel(kind, units)}` : text;
}

function PickDetail(props: { pick: Pick; units: UnitSystem; title: string; kinds: TargetKinds }) {
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

/**
 * Choosing valving: a damper's per-click damping map on a corner (a heat map over the click
 * grid), and the click combinations ranked for each corner against a preset's editable
 * targets — the sweep runs on the backend's worker threads with progress and a way to stop it.
 */
export function ValvingScreen() {
  const app = useApp();
  const id = useId();
  const [pick, setPick] = useState<RevisionPick | null>(app.revision ?? null);
  const [presets, setPresets] = useState<Presets | null>(null);
  const [preset, setPreset] = useState('track-day');
  const [edits, setEdits] = useState<Record<string, TargetEdit>>({});
  const [corners, setCorners] = useState<CornerPosition[]>([...CORNER_POSITIONS]);
  // null until the bench library has answered: the map waits for it, so it is asked for once.
  const [dampers, setDampers] = useState<string[] | null>(null);
  const [damper, setDamper] = useState('');
  // The vehicle the damper was chosen for: another vehicle starts on its own corners' unit.
  const [damperFor, setDamperFor] = useState<string | null>(null);
  const [interpolate, setInterpolate] = useState(false);
  const [mapCorner, setMapCorner] = useState<CornerPosition>('FL');
  const [mapFigure, setMapFigure] = useState('lowSpeedMean');
  const [map, setMap] = useState<ValvingMap | null>(null);
  // The ranking with the unit system its warnings were written in.
  const [choice, setChoice] = useState<(Choice & { units: UnitSystem }) | null>(null);
  const [progress, setProgress] = useState<JobProgress | null>(null);
  const [error, setError] = useState<unknown>(null);
  const stop = useRef<AbortController | null>(null);
  const scenario = useVehicleScenario(pick?.vehicle ?? null);

  useEffect(() => {
    apiCall('valvingPresets', {}).then(setPresets, setError);
    apiCall('benchList', {}).then((r) => {
      const measured = r.dampers.filter((d) => d.runCount > 0).map((d) => d.label);
      setDampers(measured);
    }, setError);
  }, [app.dataVersion]);

  const presetData = presets?.presets.find((p) => p.name === preset);
  const kinds: TargetKinds = useMemo(
    () => new Map((presets?.targets ?? []).map((t) => [t.key, t.kind as QuantityKind | null])),
    [presets],
  );
  // The preset's targets, shown in the unit system; edits start from them.
  useEffect(() => {
    if (!presetData || !presets) return;
    const next: Record<string, TargetEdit> = {};
    for (const t of presets.targets) {
      const b = presetData.targets[t.key];
      next[t.key] = b
        ? {
            low: shown(b.low, t.kind, app.units),
            high: shown(b.high, t.kind, app.units),
            weight: String(b.weight),
            off: false,
            band: false,
            weighted: false,
          }
        : { low: '', high: '', weight: '1', off: true, band: false, weighted: false };
    }
    setEdits(next);
  }, [presetData, presets, app.units]);

  const mapVehicle = pick?.vehicle;
  const mapRevision = pick?.revision;
  // Chosen once a vehicle: a change of revision keeps the unit the user has picked.
  const pickKey = pick ? pick.vehicle : null;
  // Start each vehicle on the unit its corners record, the map's corner first, among the units
  // with bench data; a corner's recorded unit may have none yet, and then the first that has.
  useEffect(() => {
    if (mapVehicle === undefined || mapRevision === undefined || dampers === null || pickKey === null) return;
    if (damperFor === pickKey) return;
    let gone = false;
    apiCall('setupShow', { vehicle: mapVehicle, revision: mapRevision, units: 'si' }).then((r) => {
      if (gone) return;
      const corners = setupFileParse(r.file).sheet.corners;
      const recorded = [mapCorner, ...CORNER_POSITIONS].map((p) => corners[p].damperUnit);
      const measured = new Map(dampers.map((d) => [d.toLowerCase(), d]));
      const found = recorded.map((u) => measured.get(u.toLowerCase())).find((u) => u !== undefined);
      setDamper(found ?? dampers[0] ?? '');
      setDamperFor(pickKey);
    }, setError);
    return () => {
      gone = true;
    };
  }, [mapVehicle, mapRevision, pickKey, dampers, damperFor, mapCorner]);

  const damperReady = damperFor !== null && damperFor === pickKey;
  useEffect(() => {
    if (mapVehicle === undefined || mapRevision === undefined || !damperReady) return;
    // A newer choice replaces the map asked for before it, whichever answer comes back last.
    let gone = false;
    setMap(null);
    apiCall('valvingMap', {
      vehicle: mapVehicle,
      revision: mapRevision,
      corner: mapCorner,
      interpolate,
      ...(damper ? { damper } : {}),
    }).then(
      (m) => !gone && setMap(m),
      (e: unknown) => !gone && setError(e),
    );
    return () => {
      gone = true;
    };
  }, [mapVehicle, mapRevision, damperReady, mapCorner, damper, interpolate, app.dataVersion]);

  const targetsEdit = useMemo(() => {
    const targets: Record<string, unknown> = {};
    for (const t of presets?.targets ?? []) {
      const e = edits[t.key];
      if (!e) continue;
      const inPreset = presetData?.targets[t.key] !== undefined;
      if (e.off) {
        if (inPreset) targets[t.key] = 'off';
        continue;
      }
      // Only what the user changed goes: an unchanged target keeps the preset's band, scale and source.
      if (inPreset && !e.band && !e.weighted) continue;
      const num = (s: string) => {
        if (s.trim() === '') return null;
        const v = Number(s);
        if (!Number.isFinite(v))
          throw new ApiCallError(400, `${t.label}: "${s}" is not a number`, `targets.${t.key}`);
        return t.kind ? quantityFromDisplay(v, t.kind as QuantityKind, app.units) : v;
      };
      targets[t.key] = {
        ...(e.band || !inPreset ? { low: num(e.low), high: num(e.high) } : {}),
        weight: Number(e.weight),
      };
    }
    return targets;
  }, [edits, presets, presetData, app.units]);

  const run = async () => {
    if (!pick) return;
    setError(null);
    setChoice(null);
    const controller = new AbortController();
    stop.current = controller;
    setProgress({ elapsedMs: 0, stage: 'starting' });
    try {
      const r = await apiJob(
        'valvingChoose',
        {
          vehicle: pick.vehicle,
          revision: pick.revision,
          corners,
          preset,
          interpolate,
          targets: targetsEdit,
          best: 3,
          ...(damper ? { damper } : {}),
          units: app.units,
        },
        { onProgress: setProgress, signal: controller.signal },
      );
      setChoice({ ...r, units: app.units });
    } catch (e) {
      setError(e);
    } finally {
      setProgress(null);
      stop.current = null;
    }
  };

  const figure =
    MAP_FIGURES.find((f) => f.key === mapFigure) ?? (MAP_FIGURES[0] as (typeof MAP_FIGURES)[number]);
  const band =
    presetData && figure.target && !edits[figure.target]?.off ? presetData.targets[figure.target] : undefined;

  return (
    <section aria-label="Choose valving">
      <h2>Valving</h2>
      <CautionLine />
      <fieldset>
        <legend>Setup to choose for</legend>
        <RevisionPicker idPrefix={`${id}-setup`} value={pick} onChange={setPick} />
      </fieldset>
      {pick ? (
        <p>
          Choosing for{' '}
          <strong>
            {pick.vehicle} #{pick.revision}
          </strong>
          .
        </p>
      ) : (
        <p>Pick the setup whose corners to choose clicks for.</p>
      )}
      <div className="toolbar">
        <label htmlFor={`${id}-damper`}>Damper</label>
        <select id={`${id}-damper`} value={damper} onChange={(e) => setDamper(e.target.value)}>
          <option value="">each corner’s recorded unit</option>
          {(dampers ?? []).map((d) => (
            <option key={d} value={d}>
              {d}
            </option>
          ))}
        </select>
        <label>
          <input type="checkbox" checked={interpolate} onChange={(e) => setInterpolate(e.target.checked)} />{' '}
          interpolate clicks between measured ones
        </label>
      </div>
      <h3>Damping map</h3>
      <div className="toolbar">
        <CornerChoice value={mapCorner} onChange={setMapCorner} />
        <label htmlFor={`${id}-figure`}>Figure</label>
        <select id={`${id}-figure`} value={mapFigure} onChange={(e) => setMapFigure(e.target.value)}>
          {MAP_FIGURES.map((f) => (
            <option key={f.key} value={f.key}>
              {f.label}
            </option>
          ))}
        </select>
      </div>
      {map ? (
        <>
          <HeatMap map={map} figure={figure} units={app.units} {...(band ? { band } : {})} />
          <MapTable map={map} units={app.units} />
          {map.notes.length > 0 ? <p className="muted">{map.notes.join(' ')}</p> : null}
        </>
      ) : pick ? (
        <p>Loading the map…</p>
      ) : null}
      <ScenarioPanel idPrefix={`${id}-scenario`} parts={['road', 'bump', 'curb']} state={scenario} />
      <h3>Targets</h3>
      <div className="toolbar">
        <PresetChoice label="Preset" value={preset} presets={presets?.presets ?? []} onChange={setPreset} />
        {presetData ? <span className="muted">{presetData.use}</span> : null}
      </div>
      <table className="figures" aria-label="Targets">
        <thead>
          <tr>
            <th scope="col">Target</th>
            <th scope="col">Low</th>
            <th scope="col">High</th>
            <th scope="col">Unit</th>
            <th scope="col">Weight</th>
            <th scope="col">Off</th>
            <th scope="col">Source</th>
          </tr>
        </thead>
        <tbody>
          {(presets?.targets ?? []).map((t) => {
            const e = edits[t.key] ?? {
              low: '',
              high: '',
              weight: '1',
              off: true,
              band: false,
              weighted: false,
            };
            const set = (patch: Partial<TargetEdit>) => setEdits({ ...edits, [t.key]: { ...e, ...patch } });
            const source = presetData?.targets[t.key]?.source;
            return (
              <tr key={t.key}>
                <th scope="row" style={{ textAlign: 'left' }}>
                  {t.label}
                </th>
                <td>
                  <input
                    aria-label={`${t.label}, low`}
                    size={7}
                    value={e.low}
                    disabled={e.off}
                    onChange={(x) => set({ low: x.target.value, band: true })}
                  />
                </td>
                <td>
                  <input
                    aria-label={`${t.label}, high`}
                    size={7}
                    value={e.high}
                    disabled={e.off}
                    onChange={(x) => set({ high: x.target.value, band: true })}
                  />
                </td>
                <td>{t.kind ? quantityUnitLabel(t.kind as QuantityKind, app.units) : ''}</td>
                <td>
                  <input
                    aria-label={`${t.label}, weight`}
                    size={4}
                    value={e.weight}
                    disabled={e.off}
                    onChange={(x) => set({ weight: x.target.value, weighted: true })}
                  />
                </td>
                <td>
                  <input
                    type="checkbox"
                    aria-label={`${t.label}, off`}
                    checked={e.off}
                    onChange={(x) => set({ off: x.target.checked })}
                  />
                </td>
                <td className="muted" style={{ textAlign: 'left', fontSize: 13 }}>
                  {source ? `[${source.tag}] ${source.text}` : '—'}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <fieldset className="toolbar">
        <legend>Corners to choose for</legend>
        {CORNER_POSITIONS.map((p) => (
          <label key={p}>
            <input
              type="checkbox"
              checked={corners.includes(p)}
              onChange={(e) =>
                setCorners(
                  e.target.checked
                    ? CORNER_POSITIONS.filter((x) => x === p || corners.includes(x))
                    : corners.filter((x) => x !== p),
                )
              }
            />{' '}
            {p}
          </label>
        ))}
        <button
          type="button"
          className="primary"
          disabled={!pick || corners.length === 0 || progress !== null}
          onClick={() => void run()}
        >
          Find the best clicks
        </button>
      </fieldset>
      {progress ? (
        <ProgressLine
          label={
            progress.total
              ? `Evaluating ${progress.done} of ${progress.total} combinations`
              : 'Starting the sweep…'
          }
          {...(progress.total ? { fraction: (progress.done ?? 0) / progress.total } : {})}
          onCancel={() => stop.current?.abort()}
        />
      ) : null}
      <ErrorLine error={error} />
      {choice ? (
        <section aria-label="Recommendation" data-testid="recommendation">
          <h3>
            Starting points for testing on the car — {choice.vehicle.name} #{choice.revision},{' '}
            {choice.preset.title}
          </h3>
          <div className="caution-line" role="note" aria-label="Caution beside the recommendation">
            <strong>Caution:</strong> {CAUTION_TEXT} {choice.valvingCaution}
          </div>
          <p className="muted">
            {choice.combinations} combinations evaluated on {scenarioText(choice.scenario, app.units)}.{' '}
            {choice.objective}
            {choice.units !== app.units
              ? ` The model warnings below are written in ${choice.units === 'si' ? 'SI' : 'US'} units, as when the clicks were ranked: rank again to rewrite them.`
              : ''}
          </p>
          {choice.corners.map((c) => (
            <div key={c.position} className="corner-result">
              <h3>
                {c.position} with {c.damper}: {c.meetingAll} combination{c.meetingAll === 1 ? '' : 's'} meet
                every target
              </h3>
              {c.best.map((b) => (
                <PickDetail key={b.cell} pick={b} units={app.units} kinds={kinds} title={`#${b.rank}`} />
              ))}
              {c.current ? (
                <PickDetail
                  pick={c.current}
                  units={app.units}
                  kinds={kinds}
                  title={`As set now (rank ${c.current.rank} of ${c.evaluated})`}
                />
              ) : null}
            </div>
          ))}
          {choice.balance ? (
            <p className="status">
              Front/rear balance of the best picks: ride frequency rear ÷ front{' '}
              {numberFormat(choice.balance.ratio.rideFrequency, 2)} (
              {choice.balance.flatRide.met ? 'within' : 'outside'} the usual flat-ride{' '}
              {numberFormat(choice.balance.flatRide.low, 2)}–{numberFormat(choice.balance.flatRide.high, 2)});
              ζ low-speed mean rear ÷ front {numberFormat(choice.balance.ratio.lowSpeedMean, 2)}.{' '}
              {VALVING_HEADLINES.rideFrequencyHz.label} does not change with clicks.
            </p>
          ) : null}
        </section>
      ) : null}
    </section>
  );
}
