import { setupChangeText } from '../../../core/setup/setup-diff';
import { useEffect, useState, type FormEvent } from 'react';
import type { HandlerOutput } from '../../api/contract';
import { apiCall } from '../api-client';
import { useApp, type RevisionPick } from '../app-context';
import { CautionLine, WarningList } from '../components/caution';
import { ErrorLine } from '../components/status';
import { textFileSave } from '../native';
import { textFilePick } from '../file-pick';

type Vehicle = HandlerOutput<'vehicleList'>['vehicles'][number];
type Revision = HandlerOutput<'setupHistory'>['revisions'][number];
type Diff = HandlerOutput<'setupDiff'>;

const samePick = (a: RevisionPick, b: RevisionPick) => a.vehicle === b.vehicle && a.revision === b.revision;

function VehicleAddForm(props: { onAdded: (name: string) => void }) {
  const [name, setName] = useState('');
  const [kind, setKind] = useState('');
  const [error, setError] = useState<unknown>(null);
  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setError(null);
    try {
      const r = await apiCall('vehicleAdd', { name, kind, notes: '' });
      setName('');
      setKind('');
      props.onAdded(r.vehicle.name);
    } catch (err) {
      setError(err);
    }
  };
  return (
    <form onSubmit={(e) => void submit(e)} aria-label="Add a vehicle">
      <h3>Add a vehicle</h3>
      <div className="field wide">
        <label htmlFor="new-vehicle-name">Name</label>
        <input id="new-vehicle-name" value={name} onChange={(e) => setName(e.target.value)} required />
      </div>
      <div className="field wide">
        <label htmlFor="new-vehicle-kind">Class or type</label>
        <input
          id="new-vehicle-kind"
          value={kind}
          onChange={(e) => setKind(e.target.value)}
          placeholder="e.g. club sprint coupe"
        />
      </div>
      <button type="submit" className="primary">
        Add vehicle
      </button>
      <ErrorLine error={error} />
    </form>
  );
}

/** The changes between two revisions and what they do to each corner's headline figures. */
export function DiffView(props: { a: RevisionPick; b: RevisionPick }) {
  const { units } = useApp();
  const [diff, setDiff] = useState<Diff | null>(null);
  const [error, setError] = useState<unknown>(null);
  useEffect(() => {
    let gone = false;
    setDiff(null);
    apiCall('setupDiff', { a: props.a, b: props.b, units }).then(
      (d) => !gone && setDiff(d),
      (e: unknown) => !gone && setError(e),
    );
    return () => {
      gone = true;
    };
  }, [props.a, props.b, units]);
  if (error) return <ErrorLine error={error} />;
  if (!diff) return <p>Working out the differences…</p>;
  return (
    <section aria-label="Differences" data-testid="diff">
      <h3>
        {diff.a.vehicle} #{diff.a.revision} “{diff.a.name}” → {diff.b.vehicle} #{diff.b.revision} “
        {diff.b.name}”
      </h3>
      <CautionLine />
      {diff.fields.length === 0 ? (
        <p>No field differs.</p>
      ) : (
        <table className="figures" aria-label="Changed fields">
          <thead>
            <tr>
              <th scope="col">Field</th>
              <th scope="col">Corner</th>
              <th scope="col">Before</th>
              <th scope="col">After</th>
              <th scope="col">Unit</th>
            </tr>
          </thead>
          <tbody>
            {diff.fields.map((f) => (
              <tr key={`${f.position ?? ''}-${f.field}`}>
                <td>{f.label}</td>
                <td>{f.position ?? '—'}</td>
                {setupChangeText(f).map((t, i) => (
                  <td key={i}>{t ?? '—'}</td>
                ))}
                <td>{f.unit}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <h3>Headline figures that change</h3>
      {diff.figures.length === 0 ? (
        <p>The ride figures do not change.</p>
      ) : (
        <table className="figures" aria-label="Changed figures">
          <thead>
            <tr>
              <th scope="col">Corner</th>
              <th scope="col">Figure</th>
              <th scope="col">Before</th>
              <th scope="col">After</th>
              <th scope="col">Change</th>
            </tr>
          </thead>
          <tbody>
            {diff.figures.map((f) => (
              <tr key={`${f.position}-${f.figure}`}>
                <td>{f.position}</td>
                <td>{f.label}</td>
                <td>
                  {f.before.toFixed(3)} {f.unit}
                </td>
                <td>
                  {f.after.toFixed(3)} {f.unit}
                </td>
                <td>
                  {f.after - f.before >= 0 ? '+' : '−'}
                  {Math.abs(f.after - f.before).toFixed(3)} (
                  {f.before !== 0 ? `${(((f.after - f.before) / f.before) * 100).toFixed(1)} %` : '—'})
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <WarningList warnings={diff.warnings} label={`Model warnings for #${diff.b.revision}`} />
    </section>
  );
}

function Timeline(props: { vehicle: string }) {
  const app = useApp();
  const [revisions, setRevisions] = useState<Revision[] | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [diff, setDiff] = useState<{ a: RevisionPick; b: RevisionPick } | null>(null);
  useEffect(() => {
    let gone = false;
    setRevisions(null);
    setDiff(null);
    apiCall('setupHistory', { vehicle: props.vehicle }).then(
      (h) => !gone && setRevisions(h.revisions),
      (e: unknown) => !gone && setError(e),
    );
    return () => {
      gone = true;
    };
  }, [props.vehicle, app.dataVersion]);
  const picks = app.comparePicks;
  const toggle = (p: RevisionPick) =>
    app.setComparePicks(
      picks.some((x) => samePick(x, p)) ? picks.filter((x) => !samePick(x, p)) : [...picks, p].slice(-4),
    );
  const exportBundle = async () => {
    const { bundle } = await apiCall('storeExport', { vehicle: props.vehicle });
    await textFileSave(
      `${props.vehicle.replace(/[^A-Za-z0-9._-]+/g, '-')}.rideledger.json`,
      JSON.stringify(bundle, null, 2),
      {
        name: 'RideLedger bundle',
        extensions: ['json'],
      },
    );
  };
  if (error) return <ErrorLine error={error} />;
  if (!revisions) return <p>Loading the history…</p>;
  const newest = revisions[revisions.length - 1];
  return (
    <section aria-label={`Setup history of ${props.vehicle}`}>
      <div className="toolbar">
        <button
          type="button"
          className="primary"
          onClick={() =>
            app.openSheet(
              newest ? { vehicle: props.vehicle, fromRevision: newest.number } : { vehicle: props.vehicle },
            )
          }
        >
          {newest ? `New revision from #${newest.number}` : 'Enter the first setup'}
        </button>
        <button
          type="button"
          className="secondary"
          disabled={picks.length !== 2}
          onClick={() => setDiff({ a: picks[0] as RevisionPick, b: picks[1] as RevisionPick })}
        >
          Diff the two picked
        </button>
        <button
          type="button"
          className="secondary"
          disabled={picks.length < 2}
          onClick={() => app.go('compare')}
        >
          Compare picked ({picks.length})
        </button>
        <button type="button" className="secondary" onClick={() => void exportBundle().catch(setError)}>
          Export vehicle
        </button>
      </div>
      {revisions.length === 0 ? <p>No setup saved yet.</p> : null}
      <ol className="timeline" aria-label="Revisions, oldest first">
        {revisions.map((r) => {
          const pick = { vehicle: props.vehicle, revision: r.number };
          const picked = picks.some((x) => samePick(x, pick));
          return (
            <li key={r.number} data-revision={r.number}>
              <div className="rev-head">
                #{r.number} · {r.date ?? 'no date'} · {r.event || 'no event'} · “{r.name}”
                {r.parent !== null && r.parent !== r.number - 1 ? ` (branched from #${r.parent})` : ''}
              </div>
              <div className="muted">{r.summary}</div>
              <div className="rev-actions">
                <label>
                  <input type="checkbox" checked={picked} onChange={() => toggle(pick)} /> pick #{r.number}
                </label>
                <button type="button" className="secondary" onClick={() => app.openRevision(pick)}>
                  Ride figures
                </button>
                <button
                  type="button"
                  className="secondary"
                  onClick={() => app.openSheet({ vehicle: props.vehicle, fromRevision: r.number })}
                >
                  New revision from this
                </button>
              </div>
            </li>
          );
        })}
      </ol>
      {diff ? <DiffView a={diff.a} b={diff.b} /> : null}
    </section>
  );
}

/** Vehicles and their setup history: add, open, duplicate as a new revision, diff and compare. */
export function VehiclesScreen() {
  const app = useApp();
  const [vehicles, setVehicles] = useState<Vehicle[] | null>(null);
  const [error, setError] = useState<unknown>(null);
  const [message, setMessage] = useState('');
  useEffect(() => {
    apiCall('vehicleList', {}).then((r) => setVehicles(r.vehicles), setError);
  }, [app.dataVersion]);
  const importBundle = async () => {
    const file = await textFilePick({
      accept: '.json',
      title: 'Import a RideLedger bundle',
      filterName: 'RideLedger bundle',
      extensions: ['json'],
    });
    if (!file) return;
    let bundle: unknown;
    try {
      bundle = JSON.parse(file.content);
    } catch {
      throw new Error(`${file.name} is not a JSON file`);
    }
    const r = await apiCall('storeImport', { bundle: bundle as never });
    setMessage(`Imported ${r.vehicle}: ${r.revisions} revisions, ${r.runsImported} bench runs.`);
    app.dataChanged();
  };
  return (
    <div className="two-col">
      <aside aria-label="Vehicles">
        <h2>Vehicles</h2>
        <ErrorLine error={error} />
        {vehicles && vehicles.length === 0 ? <p>No vehicle yet: add one below.</p> : null}
        <ul className="list">
          {(vehicles ?? []).map((v) => (
            <li key={v.id}>
              <button
                type="button"
                aria-current={app.vehicle === v.name}
                onClick={() => app.setVehicle(v.name)}
              >
                <strong>{v.name}</strong>
                <br />
                <span className="muted">
                  {v.kind || 'no class'} · {v.revisionCount} revision{v.revisionCount === 1 ? '' : 's'}
                </span>
              </button>
            </li>
          ))}
        </ul>
        <VehicleAddForm
          onAdded={(name) => {
            app.setVehicle(name);
            app.dataChanged();
          }}
        />
        <div className="toolbar">
          <button type="button" className="secondary" onClick={() => void importBundle().catch(setError)}>
            Import a bundle…
          </button>
        </div>
        {message ? <p className="status">{message}</p> : null}
      </aside>
      <section>
        {app.vehicle ? (
          <>
            <h2>{app.vehicle}</h2>
            <Timeline vehicle={app.vehicle} />
          </>
        ) : (
          <p>Pick a vehicle to see its setup history.</p>
        )}
      </section>
    </div>
  );
}
