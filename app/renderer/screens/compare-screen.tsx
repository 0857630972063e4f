import { useEffect, useId, useMemo, useState } from 'react';
import type { CornerPosition } from '../../../core/setup/setup-sheet';
import type { ValvingTargets } from '../../../core/valving/valving-targets';
import type { HandlerOutput } from '../../api/contract';
import { apiCall } from '../api-client';
import { revisionSheetOf } from '../revision-dampers';
import { useApp, type RevisionPick } from '../app-context';
import {
  compareRows,
  compareSameAsBaseline,
  compareScores,
  labelOf,
  type Compared,
  type Loaded,
} from '../compare-model';
import { CornerChoice, PresetChoice } from '../components/choices';
import { CautionLine, WarningList } from '../components/caution';
import { RevisionPicker } from '../components/revision-pick';
import { ScenarioPanel, useVehicleScenario } from '../components/scenario-panel';
import { ErrorLine } from '../components/status';
import { ComparePlots } from './compare/compare-plots';
import { CompareTable } from './compare/compare-table';

type Presets = HandlerOutput<'valvingPresets'>;

/**
 * Two to four revisions (of one vehicle or several) side by side: the headline figures of each
 * corner on a preset's scenario with their change against the first, marked better or worse by
 * each figure's sense in words and arrows, and the frequency and bump responses overlaid.
 */
export function CompareScreen() {
  const app = useApp();
  const id = useId();
  const picks = app.comparePicks;
  const [presets, setPresets] = useState<Presets | null>(null);
  const [preset, setPreset] = useState('track-day');
  const [position, setPosition] = useState<CornerPosition>('FL');
  const [loaded, setLoaded] = useState<Loaded[]>([]);
  const [compared, setCompared] = useState<Compared[]>([]);
  const [error, setError] = useState<unknown>(null);
  const [candidate, setCandidate] = useState<RevisionPick | null>(null);

  useEffect(() => {
    apiCall('valvingPresets', {}).then(setPresets, setError);
  }, []);

  useEffect(() => {
    setError(null);
    let gone = false;
    (async () => {
      const sheets = await Promise.all(
        picks.map(async (pick) => {
          const r = await apiCall('setupShow', {
            vehicle: pick.vehicle,
            revision: pick.revision,
            units: 'si',
          });
          return { pick, name: r.revision.name, sheet: revisionSheetOf(r) };
        }),
      );
      const [first, ...rest] = picks;
      const pairs = first
        ? await Promise.all(
            rest.map((b) => apiCall('setupCompare', { a: first, b, preset, units: app.units })),
          )
        : [];
      if (!gone) {
        setLoaded(sheets);
        setCompared(pairs);
      }
    })().catch((e: unknown) => !gone && setError(e));
    return () => {
      gone = true;
    };
    // The units switch asks again for the warnings' words; what is shown stays until the answer.
  }, [picks, preset, app.units, app.dataVersion]);

  // Judged on the first revision's vehicle's scenario (the answer says which it used).
  const vehicleScenario = useVehicleScenario(picks[0]?.vehicle ?? null);
  const scenario = compared[0]?.scenario ?? vehicleScenario.shown?.scenario;
  const targets = (compared[0]?.targets ??
    presets?.presets.find((p) => p.name === preset)?.targets ??
    {}) as ValvingTargets;

  const add = (p: RevisionPick) => {
    if (picks.some((x) => x.vehicle === p.vehicle && x.revision === p.revision) || picks.length >= 4) return;
    app.setComparePicks([...picks, p]);
  };

  const rows = useMemo(() => compareRows(compared, position, targets), [compared, position, targets]);
  const scores = useMemo(() => compareScores(compared, position), [compared, position]);

  return (
    <section aria-label="Compare setups">
      <h2>Compare setups</h2>
      <CautionLine />
      <fieldset className="toolbar">
        <legend>Add a revision</legend>
        <RevisionPicker idPrefix={`${id}-add`} value={candidate} onChange={setCandidate} />
        <button
          type="button"
          className="secondary"
          disabled={!candidate || picks.length >= 4}
          onClick={() => candidate && add(candidate)}
        >
          Add to the comparison
        </button>
      </fieldset>
      <ul className="chips" aria-label="Revisions compared">
        {loaded.map((l, i) => (
          <li key={`${l.pick.vehicle}-${l.pick.revision}`}>
            <span className="chip">
              {i === 0 ? 'Baseline: ' : ''}
              {labelOf(l)}{' '}
              <button
                type="button"
                className="secondary"
                aria-label={`Remove ${labelOf(l)}`}
                onClick={() =>
                  app.setComparePicks(
                    picks.filter((x) => !(x.vehicle === l.pick.vehicle && x.revision === l.pick.revision)),
                  )
                }
              >
                Remove
              </button>
            </span>
          </li>
        ))}
      </ul>
      {picks.length < 2 ? (
        <p>Pick two to four revisions: here, or with “pick” in a vehicle’s history.</p>
      ) : null}
      <div className="toolbar">
        <PresetChoice
          label="Judged on"
          value={preset}
          presets={presets?.presets ?? []}
          onChange={setPreset}
        />
        <CornerChoice value={position} onChange={setPosition} />
      </div>
      {picks.length > 0 ? (
        <ScenarioPanel idPrefix={`${id}-scenario`} parts={['road', 'bump', 'curb']} state={vehicleScenario} />
      ) : null}
      {compared[0] ? <p className="muted">{compared[0].objective}</p> : null}
      <ErrorLine error={error} />
      {rows.length > 0 && loaded.length >= 2 ? (
        <CompareTable rows={rows} scores={scores} loaded={loaded} position={position} units={app.units} />
      ) : null}
      {compared.length > 0 ? (
        <>
          <WarningList
            titled
            label={`Model warnings, ${labelOf(loaded[0] as Loaded)}`}
            warnings={compared[0]?.corners.find((c) => c.position === position)?.a.warnings ?? []}
          />
          {compared.map((c, i) => (
            <WarningList
              titled
              key={i}
              label={`Model warnings, ${loaded[i + 1] ? labelOf(loaded[i + 1] as Loaded) : ''}`}
              warnings={c.corners.find((x) => x.position === position)?.b.warnings ?? []}
            />
          ))}
          {compared[0] ? <p className="muted">{compared[0].valvingCaution}</p> : null}
        </>
      ) : null}
      {loaded.length >= 2 ? (
        <ComparePlots
          loaded={loaded}
          position={position}
          scenario={scenario}
          units={app.units}
          sameAsBaseline={compareSameAsBaseline(loaded, rows)}
        />
      ) : null}
    </section>
  );
}
