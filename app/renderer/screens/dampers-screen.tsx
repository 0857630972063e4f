import { benchOffsetText } from '../../../core/bench-fit';
import { useEffect, useMemo, useRef, useState } from 'react';
import { cornerSprungMass, cornerWheelRate, type CornerInput } from '../../../core/corner';
import { InputError } from '../../../core/input-error';
import { CORNER_POSITIONS, type CornerPosition } from '../../../core/setup-sheet';
import { numberFormat, quantityFormat, quantityUnitLabel, type UnitSystem } from '../../../core/units';
import type { HandlerOutput } from '../../api/contract';
import { analysisCornersOf } from '../analysis-result';
import { ApiCallError, apiCall, apiJob } from '../api-client';
import { useApp, type RevisionPick } from '../app-context';
import {
  KIND_ROLES,
  LIVE_CHECK_MAX_CHARS,
  ROLE_UNITS,
  benchFilePreview,
  benchHeaderUnit,
  benchImportInput,
  benchMappingCheck,
  benchMappingDefault,
  benchProblemText,
  benchRunFieldUnit,
  type BenchFilePreview,
  type BenchMapping,
} from '../bench-import-model';
import { CautionLine } from '../components/caution';
import { LinePlot } from '../components/plot';
import { RevisionPicker } from '../components/revision-pick';
import { ErrorLine, ProgressLine } from '../components/status';
import { TextInputField } from '../components/text-input-field';
import {
  ZETA_CORNER_FIELDS,
  benchPlotLabels,
  benchPlotSeries,
  benchRunDampingRatios,
  benchRunLabel,
  zetaCornerRead,
  zetaCornerTextsConvert,
  type BenchRun,
  type ZetaCorner,
  type ZetaCornerTexts,
  type ZetaFigure,
} from '../damper-model';
import { textFilePick } from '../file-pick';
import { quantityFieldConvert } from '../quantity-field';

type Damper = HandlerOutput<'benchList'>['dampers'][number];
type ImportResult = HandlerOutput<'benchImport'>;
type Points = [number, number][];

/** The plot tells runs apart by colour, dash and marker; past six they would repeat. */
const MAX_SHOWN = 6;
const DEFAULT_SHOWN = 4;

const orDash = (v: number | null, f: (v: number) => string) => (v === null ? '—' : f(v));

/** The first run's zero-speed offset in words, as the import would report it; "" without one. */
function offsetNote(runs: readonly { label: string; offset: number | null }[], units: UnitSystem): string {
  const r = runs.find((x) => x.offset !== null);
  return r
    ? ` ${r.label}: ${benchOffsetText(r.offset as number, undefined, units)} (enter it under Gas force).`
    : '';
}

function RunsTable(props: {
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

const zetaText = (z: ZetaFigure) =>
  z ? `${numberFormat(z.zeta, 2)}${z.class ? ` (${z.class})` : ''}` : '— (no fit)';

/** Where the ζ table's corner comes from: a corner of a stored setup, or one entered here. */
function ZetaPanel(props: { runs: BenchRun[]; units: UnitSystem }) {
  const app = useApp();
  const u = props.units;
  const [source, setSource] = useState<'setup' | 'entered'>('setup');
  const [pick, setPick] = useState<RevisionPick | null>(app.revision);
  const [position, setPosition] = useState<CornerPosition>('FL');
  const [corners, setCorners] = useState<Record<CornerPosition, CornerInput> | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [texts, setTexts] = useState<ZetaCornerTexts>(() =>
    u === 'si'
      ? {
          cornerMass: '300',
          unsprungMass: '40',
          springRate: '70',
          springMotionRatio: '0.9',
          damperMotionRatio: '',
        }
      : {
          cornerMass: '660',
          unsprungMass: '88',
          springRate: '400',
          springMotionRatio: '0.9',
          damperMotionRatio: '',
        },
  );
  const textsUnits = useRef(u);
  useEffect(() => {
    if (textsUnits.current === u) return;
    setTexts((t) => zetaCornerTextsConvert(t, textsUnits.current, u));
    textsUnits.current = u;
  }, [u]);

  useEffect(() => {
    if (source !== 'setup' || !pick) return;
    let gone = false;
    setError(null);
    apiCall('setupShow', { vehicle: pick.vehicle, revision: pick.revision, units: 'si' }).then((r) => {
      if (gone) return;
      try {
        setCorners(analysisCornersOf(r.file));
      } catch (e) {
        setError(e);
      }
    }, setError);
    return () => {
      gone = true;
    };
  }, [source, pick, app.dataVersion]);

  const entered = useMemo(() => zetaCornerRead(texts, textsUnits.current), [texts, u]);
  const corner: ZetaCorner | null =
    source === 'setup' ? (corners?.[position] ?? null) : 'corner' in entered ? entered.corner : null;
  const problems = 'problems' in entered ? entered.problems : new Map<keyof ZetaCornerTexts, string>();

  return (
    <section aria-label="Damping ratio at a corner" className="zeta-panel">
      <h3>Damping ratio ζ at a corner</h3>
      <fieldset>
        <legend>Corner</legend>
        <div className="toolbar">
          <label>
            <input
              type="radio"
              name="zeta-source"
              checked={source === 'setup'}
              onChange={() => setSource('setup')}
            />{' '}
            A corner of a stored setup
          </label>
          <label>
            <input
              type="radio"
              name="zeta-source"
              checked={source === 'entered'}
              onChange={() => setSource('entered')}
            />{' '}
            A corner entered here
          </label>
        </div>
        {source === 'setup' ? (
          <div className="zeta-setup">
            <RevisionPicker idPrefix="zeta" value={pick} onChange={setPick} />
            <div className="field wide">
              <label htmlFor="zeta-corner">Corner</label>
              <select
                id="zeta-corner"
                value={position}
                onChange={(e) => setPosition(e.target.value as CornerPosition)}
              >
                {CORNER_POSITIONS.map((p) => (
                  <option key={p} value={p}>
                    {p}
                  </option>
                ))}
              </select>
            </div>
          </div>
        ) : (
          <div className="option-fields">
            {ZETA_CORNER_FIELDS.map((f) => (
              <TextInputField
                key={f.key}
                id={`zeta-${f.key}`}
                label={f.label}
                value={texts[f.key]}
                unit={f.kind === 'ratio' ? '' : quantityUnitLabel(f.kind, u)}
                problem={problems.get(f.key)}
                placeholder={f.key === 'damperMotionRatio' ? 'as spring' : undefined}
                numeric
                onChange={(text) => setTexts({ ...texts, [f.key]: text })}
              />
            ))}
          </div>
        )}
      </fieldset>
      <ErrorLine error={error} />
      {corner ? (
        <>
          <p data-testid="zeta-corner">
            Wheel rate {quantityFormat(cornerWheelRate(corner), 'stiffness', u)}, sprung mass{' '}
            {quantityFormat(cornerSprungMass(corner), 'mass', u)}, damper motion ratio{' '}
            {numberFormat(corner.damperMotionRatio, 3)}: ζ = c_damper · MRd² / 2√(wheel rate · sprung mass),
            from each run&apos;s fitted slopes.
          </p>
          <table className="figures" aria-label="Damping ratio per run">
            <thead>
              <tr>
                <th scope="col">Run</th>
                <th scope="col">ζ bump, low speed</th>
                <th scope="col">ζ bump, high speed</th>
                <th scope="col">ζ rebound, low speed</th>
                <th scope="col">ζ rebound, high speed</th>
              </tr>
            </thead>
            <tbody>
              {props.runs.map((r) => {
                const z = benchRunDampingRatios(r.fit, corner);
                return (
                  <tr key={r.id} data-run={r.id}>
                    <th scope="row">{benchRunLabel(r)}</th>
                    <td>{zetaText(z.bump)}</td>
                    <td>{zetaText(z.bumpHighSpeed)}</td>
                    <td>{zetaText(z.rebound)}</td>
                    <td>{zetaText(z.reboundHighSpeed)}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </>
      ) : source === 'setup' && pick && !error ? (
        <p>Loading the corner…</p>
      ) : null}
    </section>
  );
}

function UnitDetail(props: { damper: Damper; units: UnitSystem; highlight: number[] }) {
  const app = useApp();
  const [runs, setRuns] = useState<BenchRun[] | null>(null);
  const [shown, setShown] = useState<number[]>([]);
  const [points, setPoints] = useState<Map<number, Points>>(new Map());
  const [error, setError] = useState<unknown>(null);
  const label = props.damper.label;
  const { highlight } = props;

  useEffect(() => {
    let gone = false;
    setRuns(null);
    apiCall('benchList', { damper: label }).then((r) => {
      if (gone) return;
      setRuns(r.runs);
      const fresh = r.runs.filter((x) => highlight.includes(x.id)).map((x) => x.id);
      setShown(fresh.length ? fresh.slice(0, MAX_SHOWN) : r.runs.slice(0, DEFAULT_SHOWN).map((x) => x.id));
    }, setError);
    return () => {
      gone = true;
    };
  }, [label, app.dataVersion, highlight]);

  useEffect(() => {
    const missing = shown.filter((id) => !points.has(id));
    if (missing.length === 0) return;
    let gone = false;
    Promise.all(missing.map((id) => apiCall('benchShow', { run: id, points: true }))).then((rs) => {
      if (gone) return;
      setPoints((old) => {
        const next = new Map(old);
        for (const r of rs) next.set(r.run.id, r.points ?? []);
        return next;
      });
    }, setError);
    return () => {
      gone = true;
    };
  }, [shown, points]);

  const series = useMemo(() => {
    if (!runs) return [];
    const list = shown
      .map((id) => ({ run: runs.find((r) => r.id === id), points: points.get(id) }))
      .filter((x): x is { run: BenchRun; points: Points } => x.run !== undefined && x.points !== undefined);
    return benchPlotSeries(list, props.units);
  }, [runs, shown, points, props.units]);

  const toggle = (id: number) =>
    setShown((s) => (s.includes(id) ? s.filter((x) => x !== id) : s.length < MAX_SHOWN ? [...s, id] : s));

  const labels = benchPlotLabels(props.units);
  return (
    <section aria-label={`Damper unit ${label}`}>
      <h2>
        {label}
        {props.damper.kind ? ` — ${props.damper.kind}` : ''}
      </h2>
      <p className="muted">
        {props.damper.serial ? `Serial ${props.damper.serial} · ` : ''}
        {props.damper.runCount} run{props.damper.runCount === 1 ? '' : 's'}
        {props.damper.notes ? ` · ${props.damper.notes}` : ''}
      </p>
      <ErrorLine error={error} />
      {runs === null ? <p>Loading the runs…</p> : null}
      {runs && runs.length === 0 ? <p>No bench run stored for this unit yet.</p> : null}
      {runs && runs.length > 0 ? (
        <>
          <p>
            Pick up to {MAX_SHOWN} runs to draw: each run&apos;s measured points are markers, its fitted curve
            a line of the same colour and pattern.
          </p>
          <div className="runs-scroll">
            <RunsTable runs={runs} shown={shown} onToggle={toggle} units={props.units} />
          </div>
          <LinePlot
            id={`force-velocity-${label.replace(/[^A-Za-z0-9._-]+/g, '-')}`}
            title={`${label}: force vs shaft velocity, measured points and fitted curve per clicker setting`}
            xLabel={labels.x}
            yLabel={labels.y}
            series={series}
            height={460}
          />
          <ZetaPanel runs={runs} units={props.units} />
        </>
      ) : null}
    </section>
  );
}

const ROLE_WORDS = {
  velocity: 'Velocity',
  force: 'Force',
  time: 'Time',
  displacement: 'Displacement',
} as const;

/** The mapping step: preview the file, choose what its columns hold, then import it as a job. */
function ImportPanel(props: {
  preview: BenchFilePreview;
  dampers: Damper[];
  units: UnitSystem;
  initialDamper: string;
  onClose: () => void;
  onImported: (r: ImportResult) => void;
}) {
  const { preview, units } = props;
  const [mapping, setMapping] = useState<BenchMapping>(() =>
    benchMappingDefault(preview, props.initialDamper),
  );
  const mappingUnits = useRef(units);
  const [job, setJob] = useState<{ stage: string; controller: AbortController } | null>(null);
  const [failure, setFailure] = useState<string | null>(null);

  useEffect(() => {
    if (mappingUnits.current === units) return;
    const from = mappingUnits.current;
    setMapping((m) => ({
      ...m,
      stroke: quantityFieldConvert(m.stroke, 'length', from, units),
      temperature: quantityFieldConvert(m.temperature, 'temperature', from, units),
      gasForce: quantityFieldConvert(m.gasForce, 'force', from, units),
    }));
    mappingUnits.current = units;
  }, [units]);

  const live = preview.text.length <= LIVE_CHECK_MAX_CHARS;
  const check = useMemo(
    () => (live ? benchMappingCheck(preview, mapping, mappingUnits.current) : null),
    [preview, mapping, live, units],
  );
  const problems = check && !check.ok ? check.problems : new Map<string, string>();
  const set = (patch: Partial<BenchMapping>) => {
    setFailure(null);
    setMapping((m) => ({ ...m, ...patch }));
  };
  const existing = props.dampers.find((d) => d.label.toLowerCase() === mapping.damper.trim().toLowerCase());

  const importNow = async () => {
    const controller = new AbortController();
    setFailure(null);
    setJob({ stage: 'starting', controller });
    try {
      const r = await apiJob('benchImport', benchImportInput(preview, mapping, mappingUnits.current), {
        signal: controller.signal,
        onProgress: (p) => setJob((j) => (j ? { ...j, stage: p.stage } : j)),
      });
      props.onImported(r);
    } catch (e) {
      setFailure(
        e instanceof ApiCallError && e.status === 499
          ? 'Import cancelled: nothing was stored.'
          : `Not imported, nothing was stored: ${benchProblemText(new InputError('', e instanceof Error ? e.message : String(e)))}`,
      );
    } finally {
      setJob(null);
    }
  };

  const text = (
    key: 'date' | 'stroke' | 'testFrequency' | 'temperature' | 'gasForce' | 'clicks' | 'notes',
    label: string,
    unit: string,
    placeholder?: string,
  ) => (
    <TextInputField
      key={key}
      id={`bench-${key}`}
      label={label}
      value={mapping[key]}
      unit={unit}
      problem={problems.get(key)}
      placeholder={placeholder}
      numeric={key === 'stroke' || key === 'testFrequency' || key === 'temperature' || key === 'gasForce'}
      onChange={(t) => set({ [key]: t })}
    />
  );

  return (
    <section className="import-panel" aria-label="Import a bench file">
      <h2>Import a bench file: {preview.name}</h2>
      <p className="muted">
        Header on line {preview.header.line}, {preview.header.cells.length} columns separated by{' '}
        {preview.header.delimiter === '\t'
          ? 'tabs'
          : preview.header.delimiter === ';'
            ? 'semicolons'
            : 'commas'}
        . The first rows:
      </p>
      <div className="preview">
        <table className="figures" aria-label="First rows of the file">
          <thead>
            <tr>
              {preview.header.cells.map((c, i) => (
                <th scope="col" key={i}>
                  {c}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {preview.rows.map((r, i) => (
              <tr key={i}>
                {r.map((c, k) => (
                  <td key={k}>{c}</td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="mapping">
        <fieldset>
          <legend>What the file holds</legend>
          <label>
            <input
              type="radio"
              name="bench-kind"
              checked={mapping.kind === 'points'}
              onChange={() => set({ kind: 'points' })}
            />{' '}
            A table of points (velocity, force)
          </label>
          <br />
          <label>
            <input
              type="radio"
              name="bench-kind"
              checked={mapping.kind === 'trace'}
              onChange={() => set({ kind: 'trace' })}
            />{' '}
            A raw trace (time, displacement, force)
          </label>
        </fieldset>
        <fieldset>
          <legend>Columns and units</legend>
          {KIND_ROLES[mapping.kind].map((role) => {
            const headerUnit = benchHeaderUnit(preview, mapping, role);
            const si = ROLE_UNITS[role][0] as string;
            return (
              <div className="field mapping-role" key={role}>
                <label htmlFor={`bench-column-${role}`}>{ROLE_WORDS[role]} column</label>
                <select
                  id={`bench-column-${role}`}
                  value={mapping.columns[role]}
                  onChange={(e) => set({ columns: { ...mapping.columns, [role]: e.target.value } })}
                >
                  <option value="">
                    {mapping.kind === 'points'
                      ? `Every “${role}” column, one run per clicker setting`
                      : `The “${role}” column`}
                  </option>
                  {preview.header.cells.map((c) => (
                    <option key={c} value={c}>
                      {c}
                    </option>
                  ))}
                </select>
                {headerUnit !== undefined ? (
                  <span className="unit" id={`bench-unit-${role}`}>
                    {headerUnit} (from the header)
                  </span>
                ) : (
                  <select
                    id={`bench-unit-${role}`}
                    aria-label={`${ROLE_WORDS[role]} unit`}
                    value={mapping.units[role]}
                    onChange={(e) => set({ units: { ...mapping.units, [role]: e.target.value } })}
                  >
                    <option value="">{si} (SI)</option>
                    {ROLE_UNITS[role].slice(1).map((x) => (
                      <option key={x} value={x}>
                        {x}
                      </option>
                    ))}
                  </select>
                )}
              </div>
            );
          })}
          <fieldset className="inner">
            <legend>Compression sign in the file</legend>
            <label>
              <input
                type="radio"
                name="bench-compression"
                checked={mapping.compression === 'positive'}
                onChange={() => set({ compression: 'positive' })}
              />{' '}
              Compression (bump) is positive
            </label>
            <br />
            <label>
              <input
                type="radio"
                name="bench-compression"
                checked={mapping.compression === 'negative'}
                onChange={() => set({ compression: 'negative' })}
              />{' '}
              Compression is negative (bump values below zero)
            </label>
          </fieldset>
        </fieldset>
        <fieldset>
          <legend>The run</legend>
          <TextInputField
            id="bench-damper"
            label="Damper unit (existing or new) *"
            value={mapping.damper}
            unit={mapping.damper.trim() ? (existing ? 'existing' : 'new') : ''}
            problem={problems.get('damper')}
            list="bench-damper-units"
            onChange={(t) => set({ damper: t })}
          />
          <datalist id="bench-damper-units">
            {props.dampers.map((d) => (
              <option key={d.id} value={d.label} />
            ))}
          </datalist>
          {text('clicks', 'Clicks', '', 'bump 3 rebound 6')}
          {text('date', 'Date', '', 'YYYY-MM-DD')}
          {text('stroke', 'Stroke', benchRunFieldUnit('stroke', units))}
          {text('testFrequency', 'Test frequency', benchRunFieldUnit('testFrequency', units))}
          {text('temperature', 'Temperature', benchRunFieldUnit('temperature', units))}
          {text('gasForce', 'Gas force in the readings', benchRunFieldUnit('gasForce', units))}
          {text('notes', 'Notes', '')}
          <label>
            <input
              type="checkbox"
              checked={mapping.again}
              onChange={(e) => set({ again: e.target.checked })}
            />{' '}
            Import again if this file is already stored for this unit
          </label>
        </fieldset>
      </div>
      <div className="check" aria-live="polite" data-testid="bench-check">
        {check === null ? (
          <p>This file is large: it is checked when imported.</p>
        ) : check.ok ? (
          <p className="status">
            Reads as {check.runs.length} run{check.runs.length === 1 ? '' : 's'}:{' '}
            {check.runs.map((r) => `${r.label} (${r.points} points, fitted in ${r.fitted})`).join('; ')}.
            {offsetNote(check.runs, units)}
          </p>
        ) : problems.has('file') ? (
          <p className="status error" role="alert">
            The file does not read this way: {problems.get('file')}
          </p>
        ) : (
          <p className="status error">Fix the marked fields to import.</p>
        )}
      </div>
      {job ? (
        <ProgressLine label={`Importing: ${job.stage}`} onCancel={() => job.controller.abort()} />
      ) : null}
      {failure ? (
        <p className="status error" role="alert">
          {failure}
        </p>
      ) : null}
      <div className="toolbar">
        <button
          type="button"
          className="primary"
          disabled={job !== null || (check !== null && !check.ok)}
          onClick={() => void importNow()}
        >
          Import
        </button>
        <button type="button" className="secondary" disabled={job !== null} onClick={props.onClose}>
          Close without importing
        </button>
      </div>
    </section>
  );
}

/**
 * The damper library: units and their bench runs, force–velocity curves with the fitted curve
 * over the measured points, the resulting ζ at a corner, and the import of a bench file through
 * a mapping step.
 */
export function DampersScreen() {
  const app = useApp();
  const [dampers, setDampers] = useState<Damper[] | null>(null);
  const [selected, setSelected] = useState<string | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [preview, setPreview] = useState<BenchFilePreview | null>(null);
  const [imported, setImported] = useState<ImportResult | null>(null);
  const [highlight, setHighlight] = useState<number[]>([]);

  useEffect(() => {
    apiCall('benchList', {}).then((r) => {
      setDampers(r.dampers);
      setSelected((s) => s ?? r.dampers.find((d) => d.runCount > 0)?.label ?? r.dampers[0]?.label ?? null);
    }, setError);
  }, [app.dataVersion]);

  const pickFile = async () => {
    setError(null);
    const file = await textFilePick({
      accept: '.csv,.txt,.tsv',
      title: 'Import a bench file',
      filterName: 'Bench file (CSV)',
      extensions: ['csv', 'txt', 'tsv'],
    });
    if (!file) return;
    setImported(null);
    setPreview(benchFilePreview(file.name, file.content));
  };

  const damper = dampers?.find((d) => d.label === selected) ?? null;
  return (
    <div className="two-col">
      <aside aria-label="Damper units">
        <h2>Dampers</h2>
        <div className="toolbar">
          <button type="button" className="primary" onClick={() => void pickFile().catch(setError)}>
            Import a bench file…
          </button>
        </div>
        <ErrorLine error={error} />
        {dampers && dampers.length === 0 ? <p>No damper unit yet: import a bench file.</p> : null}
        <ul className="list">
          {(dampers ?? []).map((d) => (
            <li key={d.id}>
              <button type="button" aria-current={selected === d.label} onClick={() => setSelected(d.label)}>
                <strong>{d.label}</strong>
                <br />
                <span className="muted">
                  {d.kind || 'no type'} · {d.runCount} run{d.runCount === 1 ? '' : 's'}
                  {d.lastRunDate ? ` · last ${d.lastRunDate}` : ''}
                </span>
              </button>
            </li>
          ))}
        </ul>
      </aside>
      <div>
        <CautionLine />
        {imported ? (
          <div className="status" role="status" data-testid="bench-imported">
            Stored {imported.runs.length} run{imported.runs.length === 1 ? '' : 's'} for{' '}
            {imported.damper.label}
            {imported.damperCreated ? ' (a new unit)' : ''}:{' '}
            {imported.runs.map((r) => benchRunLabel(r)).join(', ')}.
            {imported.warnings.length ? (
              <ul className="warning-list" aria-label="Import warnings">
                {imported.warnings.map((w, i) => (
                  <li key={i}>{w}</li>
                ))}
              </ul>
            ) : null}
          </div>
        ) : null}
        {preview && dampers ? (
          <ImportPanel
            key={`${preview.name}-${preview.text.length}`}
            preview={preview}
            dampers={dampers}
            units={app.units}
            initialDamper={selected ?? ''}
            onClose={() => setPreview(null)}
            onImported={(r) => {
              setPreview(null);
              setImported(r);
              setSelected(r.damper.label);
              setHighlight(r.runs.map((x) => x.id));
              app.dataChanged();
            }}
          />
        ) : null}
        {damper ? <UnitDetail damper={damper} units={app.units} highlight={highlight} /> : null}
      </div>
    </div>
  );
}
