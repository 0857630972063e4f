import { useEffect, useState } from 'react';
import type { HandlerOutput } from '../../api/contract';
import { apiCall } from '../api-client';
import { useApp, type RevisionPick } from '../app-context';
import { ErrorLine } from './status';

type Revision = HandlerOutput<'setupHistory'>['revisions'][number];

/**
 * Picks a stored revision: a vehicle, then one of its revisions (newest first). Reports the
 * pick when either changes; a new vehicle starts at its newest revision.
 */
export function RevisionPicker(props: {
  idPrefix: string;
  value: RevisionPick | null;
  onChange: (pick: RevisionPick) => void;
}) {
  const { dataVersion } = useApp();
  const [vehicles, setVehicles] = useState<string[] | null>(null);
  const [revisions, setRevisions] = useState<Revision[]>([]);
  const [error, setError] = useState<unknown>(null);
  const vehicle = props.value?.vehicle ?? '';
  const { onChange } = props;

  useEffect(() => {
    apiCall('vehicleList', {}).then(
      (r) => setVehicles(r.vehicles.filter((v) => v.revisionCount > 0).map((v) => v.name)),
      setError,
    );
  }, [dataVersion]);

  useEffect(() => {
    if (!vehicle) {
      setRevisions([]);
      return;
    }
    let gone = false;
    apiCall('setupHistory', { vehicle }).then((h) => {
      if (!gone) setRevisions(h.revisions);
    }, setError);
    return () => {
      gone = true;
    };
  }, [vehicle, dataVersion]);

  // With nothing picked yet, start on the first vehicle's newest revision.
  useEffect(() => {
    if (props.value || !vehicles || vehicles.length === 0) return;
    const first = vehicles[0] as string;
    apiCall('setupHistory', { vehicle: first }).then((h) => {
      const newest = h.revisions[h.revisions.length - 1];
      if (newest) onChange({ vehicle: first, revision: newest.number });
    }, setError);
  }, [props.value, vehicles, onChange]);

  const pickVehicle = async (name: string) => {
    const h = await apiCall('setupHistory', { vehicle: name });
    const newest = h.revisions[h.revisions.length - 1];
    if (newest) onChange({ vehicle: name, revision: newest.number });
  };

  if (vehicles && vehicles.length === 0)
    return <p>No vehicle has a saved setup yet: add one under Vehicles and enter its first setup.</p>;
  return (
    <div className="picker">
      <div className="field wide">
        <label htmlFor={`${props.idPrefix}-vehicle`}>Vehicle</label>
        <select
          id={`${props.idPrefix}-vehicle`}
          value={vehicle}
          onChange={(e) => void pickVehicle(e.target.value).catch(setError)}
        >
          {vehicle === '' ? <option value="">Pick a vehicle</option> : null}
          {(vehicles ?? []).map((v) => (
            <option key={v} value={v}>
              {v}
            </option>
          ))}
        </select>
      </div>
      <div className="field wide">
        <label htmlFor={`${props.idPrefix}-revision`}>Revision</label>
        <select
          id={`${props.idPrefix}-revision`}
          value={props.value?.revision ?? ''}
          onChange={(e) => onChange({ vehicle, revision: Number(e.target.value) })}
        >
          {[...revisions].reverse().map((r) => (
            <option key={r.number} value={r.number}>
              #{r.number} · {r.date ?? 'no date'} · {r.name}
            </option>
          ))}
        </select>
      </div>
      <ErrorLine error={error} />
    </div>
  );
}
