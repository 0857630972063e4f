import { useEffect, useState } from 'react';
import { setupFileParse } from '../../../../core/setup/setup-file';
import { CORNER_POSITIONS, type CornerPosition } from '../../../../core/setup/setup-sheet';
import { apiCall } from '../../api-client';
import type { RevisionPick } from '../../app-context';
import type { ValvingMap } from '../../valving-model';

/**
 * The dampers with bench runs, the one the map is drawn for (chosen per vehicle, then the
 * user's), and the map of a corner of the picked revision: asked again when any of them changes.
 */
export function useDampingMap(args: {
  pick: RevisionPick | null;
  corner: CornerPosition;
  interpolate: boolean;
  dataVersion: number;
  onError: (e: unknown) => void;
}) {
  const { pick, corner: mapCorner, interpolate, dataVersion, onError: setError } = args;
  // null until the bench library has answered: the map waits for it, so it is asked for once.
  const [dampers, setDampers] = useState<string[] | null>(null);
  const [damper, setDamper] = useState('');
  // The vehicle the damper was chosen for: another vehicle starts on its own corners' unit.
  const [damperFor, setDamperFor] = useState<string | null>(null);
  const [map, setMap] = useState<ValvingMap | null>(null);

  useEffect(() => {
    apiCall('benchList', {}).then((r) => {
      const measured = r.dampers.filter((d) => d.runCount > 0).map((d) => d.label);
      setDampers(measured);
    }, setError);
  }, [dataVersion, setError]);

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
  }, [mapVehicle, mapRevision, pickKey, dampers, damperFor, mapCorner, setError]);

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
  }, [mapVehicle, mapRevision, damperReady, mapCorner, damper, interpolate, dataVersion, setError]);

  return { dampers, damper, setDamper, map };
}
