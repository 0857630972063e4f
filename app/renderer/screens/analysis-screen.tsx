import { useCallback, useEffect, useMemo, useState } from 'react';
import type { CornerInput } from '../../../core/corner/corner';
import { CORNER_POSITIONS, type CornerPosition } from '../../../core/setup/setup-sheet';
import type { HandlerOutput } from '../../api/contract';
import { apiCall } from '../api-client';
import { useApp, type RevisionPick } from '../app-context';
import { analysisFigureGroups } from '../analysis-figures';
import type { AnalysisOptions } from '../analysis-options';
import { CautionLine, WarningList } from '../components/caution';
import { RevisionPicker } from '../components/revision-pick';
import { ScenarioPanel, useVehicleScenario } from '../components/scenario-panel';
import { ErrorLine, ProgressLine } from '../components/status';
import { FiguresTable } from './analysis/figures-table';
import { revisionCornersOf } from '../revision-dampers';
import { RidePlots } from './analysis/ride-plots';
import { useRideAnalysis } from './analysis/use-ride-analysis';

type Shown = {
  pick: RevisionPick;
  revision: HandlerOutput<'setupShow'>['revision'];
  corners: Record<CornerPosition, CornerInput>;
};

const LINEAR_GROUPS = ['linear', 'step', 'road'];

/**
 * Ride figures of one stored revision: the figures table per corner with the model's warnings
 * beside the figures they concern, and the step, bump, frequency-response and random-road
 * plots — all worked out here by core, in a worker, on the road and bump the user picks.
 */
export function AnalysisScreen() {
  const app = useApp();
  const { units } = app;
  const [shown, setShown] = useState<Shown | null>(null);
  const [loadError, setLoadError] = useState<unknown>(null);

  const pick = app.revision;
  const { openRevision } = app;
  const onPick = useCallback((p: RevisionPick) => openRevision(p), [openRevision]);
  // The road and bump are the vehicle's scenario, stored SI: the unit switch never changes them.
  const scenario = useVehicleScenario(pick?.vehicle ?? null);

  // Load the revision picked.
  useEffect(() => {
    if (!pick) return;
    let gone = false;
    setLoadError(null);
    apiCall('setupShow', { vehicle: pick.vehicle, revision: pick.revision, units: 'si' }).then(
      (r) => {
        if (gone) return;
        try {
          const corners = revisionCornersOf(r);
          // Data changed elsewhere (a scenario edit among them) need not be this revision: the
          // same corners keep their figures rather than being worked out again.
          setShown((old) =>
            old &&
            old.pick === pick &&
            old.revision.savedAt === r.revision.savedAt &&
            JSON.stringify(old.corners) === JSON.stringify(corners)
              ? old
              : { pick, revision: r.revision, corners },
          );
        } catch (e) {
          setLoadError(e);
        }
      },
      (e: unknown) => {
        if (!gone) setLoadError(e);
      },
    );
    return () => {
      gone = true;
    };
  }, [pick, app.dataVersion]);

  const current = scenario.shown?.vehicle === pick?.vehicle ? scenario.shown?.scenario : undefined;
  const options: AnalysisOptions | null = useMemo(
    () => (current ? { road: current.road, bump: current.bump } : null),
    [current],
  );
  const setup = useMemo(
    () => (shown ? { pick: shown.pick, savedAt: shown.revision.savedAt, corners: shown.corners } : null),
    [shown],
  );
  const analysis = useRideAnalysis(setup, options);
  const { result, stale, running } = analysis;
  const runError = analysis.error;
  const groups = useMemo(() => (result ? analysisFigureGroups(result, units) : null), [result, units]);
  // Groups being worked out again for new inputs; with a field that does not read, none is.
  const staleGroups = useMemo(
    () => new Set(options ? [...(stale.linear ? LINEAR_GROUPS : []), ...(stale.events ? ['bump'] : [])] : []),
    [stale.linear, stale.events, options],
  );

  return (
    <section aria-label="Ride figures">
      <h2>
        Ride figures
        {shown ? ` — ${shown.pick.vehicle}, #${shown.revision.number} “${shown.revision.name}”` : ''}
      </h2>
      <CautionLine />
      <div className="analysis-controls">
        <RevisionPicker idPrefix="analysis" value={pick} onChange={onPick} />
        {shown ? (
          <p className="muted">
            {shown.revision.date ?? 'no date'} · {shown.revision.event || 'no event'}
            {shown.revision.track ? ` · ${shown.revision.track}` : ''} · {shown.revision.summary}
          </p>
        ) : null}
        <ScenarioPanel idPrefix="analysis" parts={['road', 'bump']} state={scenario} />
      </div>
      <ErrorLine error={loadError} />
      {running?.visible ? (
        <ProgressLine
          label={`Working out the figures: ${running.stage}`}
          fraction={running.fraction}
          onCancel={analysis.stop}
        />
      ) : null}
      <ErrorLine error={runError} />
      {!pick ? <p>Pick a vehicle and one of its revisions.</p> : null}
      {(stale.linear || stale.events) && !options ? (
        <p className="status" role="status">
          The figures below are for the previous road and bump: fix the marked field, or change a value to
          work them out again.
        </p>
      ) : null}
      {result && groups ? (
        <>
          <FiguresTable groups={groups} stale={staleGroups} />
          <h3>Model warnings</h3>
          <div className="corner-warnings">
            {CORNER_POSITIONS.map((p) => {
              const w = result.corners[p].warnings[units];
              return (
                <div key={p} className="corner-warning-box" data-corner={p}>
                  <h4>{p}</h4>
                  {w.length === 0 ? (
                    <p className="muted">None for this corner.</p>
                  ) : (
                    <WarningList warnings={w} label={`${p} warnings`} />
                  )}
                </div>
              );
            })}
          </div>
          {analysis.linear && analysis.events ? (
            <RidePlots linear={analysis.linear} events={analysis.events} units={units} />
          ) : null}
        </>
      ) : pick && !loadError && !runError ? (
        <p>Working out the figures…</p>
      ) : null}
    </section>
  );
}
