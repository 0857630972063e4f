import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { CORNER_POSITIONS, type CornerPosition } from '../../../core/setup/setup-sheet';
import type { QuantityKind, UnitSystem } from '../../../core/units/units';
import { apiCall, apiJob, type JobProgress } from '../api-client';
import { useApp, type RevisionPick } from '../app-context';
import { CornerChoice, PresetChoice } from '../components/choices';
import { CautionLine } from '../components/caution';
import { ScenarioPanel, useVehicleScenario } from '../components/scenario-panel';
import { RevisionPicker } from '../components/revision-pick';
import { ErrorLine, ProgressLine } from '../components/status';
import {
  MAP_FIGURES,
  mapFigureOf,
  targetEditsOf,
  targetsChanged,
  type TargetEdit,
  type TargetKinds,
  type ValvingChoice,
  type ValvingPresets,
} from '../valving-model';
import { HeatMap, MapTable } from './valving/damping-map';
import { Recommendation } from './valving/recommendation';
import { TargetsTable } from './valving/targets-table';
import { useDampingMap } from './valving/use-damping-map';

/**
 * Choosing valving: a damper's per-click damping map on a corner (a heat map over the click
 * grid), and the click combinations ranked for each corner against a preset's editable
 * targets — the sweep runs on the backend's worker threads with progress and a way to stop it.
 */
export function ValvingScreen() {
  const app = useApp();
  const id = useId();
  const [pick, setPick] = useState<RevisionPick | null>(app.revision ?? null);
  const scenario = useVehicleScenario(pick?.vehicle ?? null);
  const [presets, setPresets] = useState<ValvingPresets | null>(null);
  const [preset, setPreset] = useState('track-day');
  const [edits, setEdits] = useState<Record<string, TargetEdit>>({});
  const [corners, setCorners] = useState<CornerPosition[]>([...CORNER_POSITIONS]);
  const [interpolate, setInterpolate] = useState(false);
  const [mapCorner, setMapCorner] = useState<CornerPosition>('FL');
  const [mapFigure, setMapFigure] = useState('lowSpeedMean');
  // The ranking with the unit system its warnings were written in.
  const [choice, setChoice] = useState<(ValvingChoice & { units: UnitSystem }) | null>(null);
  const [progress, setProgress] = useState<JobProgress | null>(null);
  const [error, setError] = useState<unknown>(null);
  const stop = useRef<AbortController | null>(null);
  const { dampers, damper, setDamper, map } = useDampingMap({
    pick,
    corner: mapCorner,
    interpolate,
    dataVersion: app.dataVersion,
    onError: setError,
  });

  useEffect(() => {
    apiCall('valvingPresets', {}).then(setPresets, setError);
  }, [app.dataVersion]);

  const presetData = presets?.presets.find((p) => p.name === preset);
  const kinds: TargetKinds = useMemo(
    () => new Map((presets?.targets ?? []).map((t) => [t.key, t.kind as QuantityKind | null])),
    [presets],
  );
  // The preset's targets, shown in the unit system; edits start from them.
  useEffect(() => {
    if (!presetData || !presets) return;
    setEdits(targetEditsOf(presets, presetData, app.units));
  }, [presetData, presets, app.units]);

  const targetsEdit = useMemo(
    () => targetsChanged(presets, presetData, edits, app.units),
    [edits, presets, presetData, app.units],
  );

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

  const figure = mapFigureOf(mapFigure);
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
      <TargetsTable
        presets={presets}
        preset={presetData}
        edits={edits}
        onEdits={setEdits}
        units={app.units}
      />
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
      {choice ? <Recommendation choice={choice} units={app.units} kinds={kinds} /> : null}
    </section>
  );
}
