import { useEffect, useId, useState } from 'react';
import type { HandlerOutput } from '../../api/contract';
import { apiCall } from '../api-client';
import { useApp, type RevisionPick } from '../app-context';

type Vehicle = HandlerOutput<'vehicleList'>['vehicles'][number];
type Revision = HandlerOutput<'setupHistory'>['revisions'][number];

/** A vehicle and one of its revisions, chosen from the store; reports the pick. */
export function RevisionPicker(props: {
  label: string;
  onPick: (p: RevisionPick) => void;
  actionLabel?: string;
  initial?: RevisionPick | null;
}) {
  const app = useApp();
  const id = useId();
  const [vehicles, setVehicles] = useState<Vehicle[]>([]);
  const [vehicle, setVehicle] = useState(props.initial?.vehicle ?? app.vehicle ?? '');
  const [revisions, setRevisions] = useState<Revision[]>([]);
  const [revision, setRevision] = useState<number | ''>(props.initial?.revision ?? '');
  useEffect(() => {
    void apiCall('vehicleList', {}).then((r) => {
      setVehicles(r.vehicles);
      setVehicle((v) => v || r.vehicles[0]?.name || '');
    });
  }, [app.dataVersion]);
  useEffect(() => {
    if (!vehicle) return;
    void apiCall('setupHistory', { vehicle }).then((h) => {
      setRevisions(h.revisions);
      setRevision((r) =>
        r !== '' && h.revisions.some((x) => x.number === r)
          ? r
          : (h.revisions[h.revisions.length - 1]?.number ?? ''),
      );
    });
  }, [vehicle, app.dataVersion]);
  return (
    <fieldset className="toolbar" style={{ border: 0, padding: 0, margin: 0 }}>
      <legend className="muted" style={{ float: 'left', marginRight: 8 }}>
        {props.label}
      </legend>
      <label htmlFor={`${id}-vehicle`}>Vehicle</label>
      <select id={`${id}-vehicle`} value={vehicle} onChange={(e) => setVehicle(e.target.value)}>
        {vehicles.map((v) => (
          <option key={v.id} value={v.name}>
            {v.name}
          </option>
        ))}
      </select>
      <label htmlFor={`${id}-revision`}>Revision</label>
      <select id={`${id}-revision`} value={revision} onChange={(e) => setRevision(Number(e.target.value))}>
        {revisions.map((r) => (
          <option key={r.number} value={r.number}>
            #{r.number} {r.name}
          </option>
        ))}
      </select>
      <button
        type="button"
        className="secondary"
        disabled={!vehicle || revision === ''}
        onClick={() => revision !== '' && props.onPick({ vehicle, revision })}
      >
        {props.actionLabel ?? 'Show'}
      </button>
    </fieldset>
  );
}
