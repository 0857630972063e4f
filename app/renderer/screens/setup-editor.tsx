import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { CAUTION_TEXT } from '../../../core/safety/caution';
import { cornerQuarterCar, cornerRideFigures, type CornerFigures } from '../../../core/corner/corner';
import { modesOf, type Modes } from '../../../core/corner/modal';
import { CORNER_POSITIONS, type CornerPosition } from '../../../core/setup/setup-sheet';
import { numberFormat, quantityFormat } from '../../../core/units/units';
import { VALVING_FLAT_RIDE } from '../../../core/valving/valving-rank';
import { cornerWarnings, type ModelWarning } from '../../../core/corner/warnings';
import { apiCall } from '../api-client';
import { useApp } from '../app-context';
import { WarningList } from '../components/caution';
import { ErrorLine } from '../components/status';
import { menuCommandsListen, pagePrint } from '../native';
import {
  CORNER_FIELDS,
  TOP_FIELDS,
  damperDirectionTabulated,
  fieldUnitLabel,
  setupFormBlank,
  setupFormConvert,
  setupFormCorner,
  setupFormFromFile,
  setupFormProblems,
  setupFormSet,
  setupFormToFile,
  type FieldSpec,
  type SetupForm,
} from '../setup-form';

const CORNER_NAMES: Record<CornerPosition, string> = {
  FL: 'Front left',
  FR: 'Front right',
  RL: 'Rear left',
  RR: 'Rear right',
};

/** The usual flat-ride choice: rear ride frequency 10–20 % above the front [trade]. */
const FLAT_RIDE = VALVING_FLAT_RIDE;

type Draft = { form: SetupForm; basedOnRevision?: number; at: string };
const draftKey = (vehicle: string) => `draft:${vehicle}`;

type Live = { figures: CornerFigures; modes: Modes; warnings: ModelWarning[] } | { error: string };

/** A corner's live figures and warnings, the warnings written in the form's unit system. */
function liveFigures(form: SetupForm, p: CornerPosition): Live {
  const r = setupFormCorner(form, p);
  if ('error' in r) return { error: r.error.message.replace(`corners.${p}.corner.`, '') };
  const figures = cornerRideFigures(r.corner);
  const modes = modesOf(cornerQuarterCar(r.corner));
  return { figures, modes, warnings: cornerWarnings(figures, modes, undefined, form.system) };
}

function Field(props: {
  path: string;
  spec: FieldSpec;
  form: SetupForm;
  problem: string | undefined;
  onChange: (path: string, text: string) => void;
  idPrefix: string;
  list?: string;
}) {
  const { path, spec, form } = props;
  const id = `${props.idPrefix}-${path.replace(/[^A-Za-z0-9]+/g, '-')}`;
  const unit = fieldUnitLabel(spec.kind, form.system);
  const value = form.values[path] ?? '';
  const errorId = `${id}-error`;
  if (spec.kind === 'notes') {
    return (
      <div className="field wide">
        <label htmlFor={id}>{spec.label}</label>
        <textarea id={id} rows={2} value={value} onChange={(e) => props.onChange(path, e.target.value)} />
      </div>
    );
  }
  const wide = spec.kind === 'text' || spec.kind === 'date';
  return (
    <div className={wide ? 'field wide' : 'field'}>
      <label htmlFor={id}>
        {spec.label}
        {spec.required ? ' *' : ''}
      </label>
      <input
        id={id}
        name={path}
        value={value}
        inputMode={wide || spec.kind === 'toe' ? 'text' : 'decimal'}
        placeholder={spec.kind === 'date' ? 'YYYY-MM-DD' : undefined}
        aria-invalid={props.problem ? true : undefined}
        aria-describedby={props.problem ? errorId : undefined}
        list={props.list}
        onChange={(e) => props.onChange(path, e.target.value)}
      />
      {wide ? null : <span className="unit">{unit}</span>}
      {props.problem ? (
        <span className="error-text" id={errorId} role="alert">
          {props.problem}
        </span>
      ) : null}
    </div>
  );
}

function LivePanel(props: { live: Live; position: CornerPosition }) {
  const { units } = useApp();
  const l = props.live;
  if ('error' in l) {
    return (
      <div className="live" aria-label={`${props.position} live figures`}>
        <p className="muted">Figures appear when the corner reads: {l.error}</p>
      </div>
    );
  }
  const f = l.figures;
  return (
    <div
      className="live"
      aria-label={`${props.position} live figures`}
      data-testid={`live-${props.position}`}
    >
      <dl>
        <dt>Wheel rate</dt>
        <dd>{quantityFormat(f.wheelRate, 'stiffness', units)}</dd>
        <dt>Ride frequency</dt>
        <dd data-figure="rideFrequencyHz">{numberFormat(f.rideFrequencyHz, 2)} Hz</dd>
        <dt>Wheel hop</dt>
        <dd data-figure="wheelHopFrequencyHz">{numberFormat(f.wheelHopFrequencyHz, 1)} Hz</dd>
        <dt>ζ bump / rebound</dt>
        <dd data-figure="dampingRatio">
          {numberFormat(f.dampingRatio.bump, 2)} / {numberFormat(f.dampingRatio.rebound, 2)}
        </dd>
        <dt>ζ high speed b / r</dt>
        <dd>
          {numberFormat(f.dampingRatio.bumpHighSpeed, 2)} / {numberFormat(f.dampingRatio.reboundHighSpeed, 2)}
        </dd>
        <dt>Class (bump, rebound)</dt>
        <dd>
          {f.dampingClass.bump}, {f.dampingClass.rebound}
        </dd>
        <dt>Body mode</dt>
        <dd>
          {l.modes.body
            ? `${numberFormat(l.modes.body.frequencyHz, 2)} Hz, ζ ${numberFormat(l.modes.body.dampingRatio, 2)}`
            : 'overdamped'}
        </dd>
      </dl>
      <WarningList warnings={l.warnings} label={`${props.position} warnings`} />
    </div>
  );
}

/** Average ride frequency of an axle, when both its corners read. */
function axleFrequency(
  live: Record<CornerPosition, Live>,
  a: CornerPosition,
  b: CornerPosition,
): number | null {
  const x = live[a];
  const y = live[b];
  if ('error' in x || 'error' in y) return null;
  return (x.figures.rideFrequencyHz + y.figures.rideFrequencyHz) / 2;
}

/** The printable sheet: every field and the headline figures, no inputs. */
function PrintSheet(props: { form: SetupForm; vehicle: string; live: Record<CornerPosition, Live> }) {
  const { form } = props;
  const v = (path: string) => form.values[path] ?? '';
  return (
    <section className="print-sheet" aria-label="Setup sheet for printing">
      <h2>
        {props.vehicle} — {v('name')}
      </h2>
      <p>
        {TOP_FIELDS.filter((f) => f.key !== 'name')
          .map(
            (f) =>
              `${f.label}: ${v(f.key) || '—'}${v(f.key) && fieldUnitLabel(f.kind, form.system) ? ` ${fieldUnitLabel(f.kind, form.system)}` : ''}`,
          )
          .join(' · ')}
      </p>
      <table className="figures">
        <thead>
          <tr>
            <th scope="col">Field</th>
            {CORNER_POSITIONS.map((p) => (
              <th scope="col" key={p}>
                {p}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {CORNER_FIELDS.map((f) => (
            <tr key={f.key}>
              <td>
                {f.label}{' '}
                {fieldUnitLabel(f.kind, form.system) ? `(${fieldUnitLabel(f.kind, form.system)})` : ''}
              </td>
              {CORNER_POSITIONS.map((p) => (
                <td key={p}>{v(`corners.${p}.${f.key}`) || '—'}</td>
              ))}
            </tr>
          ))}
          <tr>
            <td>Ride frequency (Hz)</td>
            {CORNER_POSITIONS.map((p) => {
              const l = props.live[p];
              return <td key={p}>{'error' in l ? '—' : numberFormat(l.figures.rideFrequencyHz, 2)}</td>;
            })}
          </tr>
          <tr>
            <td>ζ bump / rebound</td>
            {CORNER_POSITIONS.map((p) => {
              const l = props.live[p];
              return (
                <td key={p}>
                  {'error' in l
                    ? '—'
                    : `${numberFormat(l.figures.dampingRatio.bump, 2)} / ${numberFormat(l.figures.dampingRatio.rebound, 2)}`}
                </td>
              );
            })}
          </tr>
        </tbody>
      </table>
      <p className="muted">Figures from RideLedger’s simplified model. {CAUTION_TEXT}</p>
    </section>
  );
}

/**
 * The setup sheet: four corners side by side and the vehicle fields, validated as you type,
 * with each corner's headline figures computed here by core. Save makes a new revision;
 * unsaved changes are kept as a draft with the shop's data.
 */
export function SetupEditor() {
  const app = useApp();
  const open = app.sheet;
  const [form, setForm] = useState<SetupForm | null>(null);
  const [basedOn, setBasedOn] = useState<number | undefined>(undefined);
  const [dirty, setDirty] = useState(false);
  const [error, setError] = useState<unknown>(null);
  const [message, setMessage] = useState('');
  const [draftOffer, setDraftOffer] = useState<Draft | null>(null);
  const [printView, setPrintView] = useState(false);
  const [dampers, setDampers] = useState<string[]>([]);
  const history = useRef<{ stack: SetupForm[]; at: number; lastPath: string; lastTime: number }>({
    stack: [],
    at: -1,
    lastPath: '',
    lastTime: 0,
  });

  // Load the revision (or a blank sheet), then look for a draft left unsaved.
  useEffect(() => {
    if (!open) return;
    let gone = false;
    setForm(null);
    setMessage('');
    setDirty(false);
    (async () => {
      let f: SetupForm;
      if (open.fromRevision !== undefined) {
        const r = await apiCall('setupShow', {
          vehicle: open.vehicle,
          revision: open.fromRevision,
          units: app.units,
        });
        f = setupFormFromFile(r.file, app.units);
      } else {
        f = setupFormBlank(app.units, '');
      }
      const draft = await apiCall('settingGet', { key: draftKey(open.vehicle) });
      if (gone) return;
      history.current = { stack: [f], at: 0, lastPath: '', lastTime: 0 };
      setForm(f);
      setBasedOn(open.fromRevision);
      setDraftOffer(draft.value ? (draft.value as Draft) : null);
      const list = await apiCall('benchList', {});
      if (!gone) setDampers(list.dampers.map((d) => d.label));
    })().catch(setError);
    return () => {
      gone = true;
    };
    // Only a new sheet reloads; the unit system is applied by conversion below.
  }, [open]);

  // Units switch: convert in place.
  useEffect(() => {
    setForm((f) => (f && f.system !== app.units ? setupFormConvert(f, app.units) : f));
  }, [app.units]);

  // Keep a draft of unsaved changes with the shop's data, a moment after each change.
  useEffect(() => {
    if (!dirty || !form || !open) return;
    const t = setTimeout(() => {
      const draft: Draft = {
        form,
        ...(basedOn !== undefined ? { basedOnRevision: basedOn } : {}),
        at: new Date().toISOString(),
      };
      void apiCall('settingSet', { key: draftKey(open.vehicle), value: draft }).catch(setError);
    }, 600);
    return () => clearTimeout(t);
  }, [form, dirty, basedOn, open]);

  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => {
      e.preventDefault();
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  const change = useCallback((path: string, text: string) => {
    setForm((f) => {
      if (!f) return f;
      const next = setupFormSet(f, path, text);
      const h = history.current;
      const now = Date.now();
      // Typing in one field is one step of undo.
      if (h.lastPath === path && now - h.lastTime < 1500) h.stack[h.at] = next;
      else {
        h.stack = [...h.stack.slice(0, h.at + 1), next];
        h.at = h.stack.length - 1;
      }
      h.lastPath = path;
      h.lastTime = now;
      return next;
    });
    setDirty(true);
    setMessage('');
  }, []);

  const step = useCallback(
    (by: -1 | 1) => {
      const h = history.current;
      const at = h.at + by;
      const f = h.stack[at];
      if (!f) return;
      h.at = at;
      h.lastPath = '';
      setForm(f.system === app.units ? f : setupFormConvert(f, app.units));
      setDirty(true);
    },
    [app.units],
  );

  const problems = useMemo(() => (form ? setupFormProblems(form) : new Map<string, string>()), [form]);
  const live = useMemo(() => {
    const out = {} as Record<CornerPosition, Live>;
    if (form) for (const p of CORNER_POSITIONS) out[p] = liveFigures(form, p);
    return out;
  }, [form]);

  const save = useCallback(async () => {
    if (!form || !open) return;
    // An untouched sheet would only add a revision that says "no changes".
    if (!dirty && basedOn !== undefined) {
      setMessage(`Nothing to save: the sheet is as revision #${basedOn} has it.`);
      return;
    }
    if (problems.size > 0) {
      setMessage(
        `Not saved: ${problems.size} field${problems.size === 1 ? ' needs' : 's need'} attention (marked).`,
      );
      return;
    }
    setError(null);
    try {
      const r = await apiCall('setupSave', {
        file: setupFormToFile(form),
        vehicle: open.vehicle,
        ...(basedOn !== undefined ? { basedOnRevision: basedOn } : {}),
        units: form.system,
      });
      await apiCall('settingSet', { key: draftKey(open.vehicle), value: null });
      setBasedOn(r.revision.number);
      setDirty(false);
      setDraftOffer(null);
      setMessage(
        `Saved as revision #${r.revision.number}${r.branched ? ` (a branch from #${r.revision.parent})` : ''}: ${r.revision.summary}`,
      );
      app.dataChanged();
    } catch (e) {
      setError(e);
    }
  }, [form, open, basedOn, dirty, problems, app]);

  useEffect(
    () =>
      menuCommandsListen((c) => {
        if (c === 'save') void save();
        if (c === 'undo') step(-1);
        if (c === 'redo') step(1);
        if (c === 'print') setPrintView(true);
      }),
    [save, step],
  );

  useEffect(() => {
    if (!printView) return;
    const t = setTimeout(() => {
      void pagePrint(`${open?.vehicle ?? 'setup'} ${form?.values.name ?? ''}.pdf`.trim()).finally(() =>
        setPrintView(false),
      );
    }, 50);
    return () => clearTimeout(t);
  }, [printView, open, form]);

  if (!open) {
    return (
      <section>
        <h2>Setup sheet</h2>
        <p>
          Open a vehicle’s history (Vehicles) and pick “New revision from …”, or “Enter the first setup” for a
          new vehicle.
        </p>
      </section>
    );
  }
  if (error && !form) return <ErrorLine error={error} />;
  if (!form) return <p>Loading the sheet…</p>;

  const front = axleFrequency(live, 'FL', 'FR');
  const rear = axleFrequency(live, 'RL', 'RR');
  const ratio = front && rear ? rear / front : null;
  const at = history.current;

  if (printView) return <PrintSheet form={form} vehicle={open.vehicle} live={live} />;

  return (
    <section aria-label="Setup sheet">
      <h2>
        Setup sheet — {open.vehicle}
        {basedOn !== undefined ? ` (new revision after #${basedOn})` : ' (first setup)'}
        {dirty ? ' • unsaved' : ''}
      </h2>
      {draftOffer ? (
        <div className="status" role="alert">
          Unsaved changes from {new Date(draftOffer.at).toLocaleString()} were kept.{' '}
          <button
            type="button"
            className="secondary"
            onClick={() => {
              setForm(
                draftOffer.form.system === app.units
                  ? draftOffer.form
                  : setupFormConvert(draftOffer.form, app.units),
              );
              setBasedOn(draftOffer.basedOnRevision);
              setDirty(true);
              setDraftOffer(null);
            }}
          >
            Restore them
          </button>{' '}
          <button
            type="button"
            className="secondary"
            onClick={() => {
              void apiCall('settingSet', { key: draftKey(open.vehicle), value: null });
              setDraftOffer(null);
            }}
          >
            Discard them
          </button>
        </div>
      ) : null}
      <div className="toolbar">
        <button type="button" className="primary" onClick={() => void save()}>
          Save as new revision
        </button>
        <button type="button" className="secondary" disabled={at.at <= 0} onClick={() => step(-1)}>
          Undo
        </button>
        <button
          type="button"
          className="secondary"
          disabled={at.at >= at.stack.length - 1}
          onClick={() => step(1)}
        >
          Redo
        </button>
        <button type="button" className="secondary" onClick={() => setPrintView(true)}>
          Print sheet / PDF
        </button>
        <span role="status" aria-live="polite">
          {message}
        </span>
      </div>
      <ErrorLine error={error} />
      <datalist id="damper-units">
        {dampers.map((d) => (
          <option key={d} value={d} />
        ))}
      </datalist>
      <fieldset>
        <legend>Vehicle</legend>
        <div className="vehicle-fields">
          {TOP_FIELDS.map((spec) => (
            <Field
              key={spec.key}
              path={spec.key}
              spec={spec}
              form={form}
              problem={problems.get(spec.key)}
              onChange={change}
              idPrefix="top"
            />
          ))}
        </div>
      </fieldset>
      <p className="status" data-testid="balance">
        Front/rear ride frequency:{' '}
        {ratio && front && rear
          ? `front ${numberFormat(front, 2)} Hz, rear ${numberFormat(rear, 2)} Hz, rear ÷ front ${numberFormat(ratio, 2)} — ${
              ratio >= FLAT_RIDE.low && ratio <= FLAT_RIDE.high
                ? 'within the usual flat-ride choice (rear 10–20 % above front)'
                : ratio < FLAT_RIDE.low
                  ? 'rear less than 10 % above front: the usual flat-ride choice is rear 10–20 % above, so that the car settles level after a bump'
                  : 'rear more than 20 % above front: beyond the usual flat-ride choice of 10–20 %'
            } (common practice).`
          : 'appears when all four corners read.'}
      </p>
      <div className="corners">
        {CORNER_POSITIONS.map((p) => (
          <div className="corner-card" key={p} aria-label={`${CORNER_NAMES[p]} (${p})`} role="group">
            <h3>
              {CORNER_NAMES[p]} ({p})
            </h3>
            {CORNER_FIELDS.map((spec) => {
              const dir = /^corner\.damper\.(bump|rebound)\./.exec(spec.key)?.[1] as
                'bump' | 'rebound' | undefined;
              if (dir && damperDirectionTabulated(form, p, dir)) {
                return spec.key.endsWith('lowSpeed') ? (
                  <p key={spec.key} className="muted">
                    {dir === 'bump' ? 'Bump' : 'Rebound'}: a tabulated bench curve (kept as loaded).
                  </p>
                ) : null;
              }
              const path = `corners.${p}.${spec.key}`;
              return (
                <Field
                  key={spec.key}
                  path={path}
                  spec={spec}
                  form={form}
                  problem={problems.get(path)}
                  onChange={change}
                  idPrefix={p}
                  {...(spec.key === 'damperUnit' ? { list: 'damper-units' } : {})}
                />
              );
            })}
            <LivePanel live={live[p]} position={p} />
          </div>
        ))}
      </div>
    </section>
  );
}
