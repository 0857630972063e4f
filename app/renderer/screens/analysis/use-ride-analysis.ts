import { useEffect, useMemo, useRef, useState } from 'react';
import type { CornerInput } from '../../../../core/corner/corner';
import type { CornerPosition } from '../../../../core/setup/setup-sheet';
import type { RevisionPick } from '../../app-context';
import type { AnalysisOptions } from '../../analysis-options';
import type { AnalysisJob, AnalysisJobResult } from '../../analysis-request';
import { analysisResultOf, type AnalysisEvents, type AnalysisLinear } from '../../analysis-result';
import {
  AnalysisCancelled,
  analysisRunEvents,
  analysisRunLinear,
  type AnalysisRun,
} from '../../analysis-run';

/** Progress is shown only for a run that is not done in a moment, so quick ones do not flicker. */
const PROGRESS_DELAY_MS = 150;

/** The revision whose figures are asked for: its pick, when it was saved, its corners (SI). */
export type RideSetup = {
  pick: RevisionPick;
  savedAt: string;
  corners: Record<CornerPosition, CornerInput>;
};

type Running = { fraction: number; stage: string; visible: boolean };
type Part<T> = { part: T; key: string; pick: RevisionPick };

/**
 * One part of the figures, worked out in its worker whenever its key changes: at once (the
 * worker is kept warm, and a newer key cancels the run before it), with its progress after a
 * moment, keeping the part last worked out on screen until the new one arrives.
 */
function usePart<J extends AnalysisJob>(
  run: AnalysisRun,
  setup: RideSetup | null,
  job: J | null,
  key: string | null,
) {
  const [part, setPart] = useState<Part<AnalysisJobResult<J>> | null>(null);
  const [running, setRunning] = useState<Running | null>(null);
  const [error, setError] = useState<unknown>(null);
  const abort = useRef<AbortController | null>(null);
  const pick = setup?.pick;
  // Another revision's figures go at once; the same revision's stay until the new ones come.
  useEffect(() => setPart((old) => (old && old.pick === pick ? old : null)), [pick]);
  useEffect(() => {
    if (!setup || !job || !key) return;
    const controller = new AbortController();
    abort.current = controller;
    setError(null);
    setRunning({ fraction: 0, stage: 'starting', visible: false });
    const progressTimer = setTimeout(
      () => setRunning((r) => (r ? { ...r, visible: true } : r)),
      PROGRESS_DELAY_MS,
    );
    run(job, {
      signal: controller.signal,
      onProgress: (fraction, stage) => setRunning((r) => (r ? { ...r, fraction, stage } : r)),
    })
      .then(
        (r) => setPart({ part: r, key, pick: setup.pick }),
        (e: unknown) => {
          if (!(e instanceof AnalysisCancelled) || abort.current === controller) setError(e);
        },
      )
      .finally(() => {
        clearTimeout(progressTimer);
        if (abort.current === controller) {
          abort.current = null;
          setRunning(null);
        }
      });
    return () => {
      clearTimeout(progressTimer);
      controller.abort();
    };
    // key stands for setup and job.
  }, [key]);
  return { part, running, error, stop: () => abort.current?.abort() };
}

/**
 * The Ride figures of a revision on a road and a bump, worked out in two workers: the linear
 * model's figures again only when the road (or the setup) changes, the bump's only when the bump
 * does — so a new road shows in the time of the linear model alone, and the bump follows.
 */
export function useRideAnalysis(setup: RideSetup | null, options: AnalysisOptions | null) {
  const base = setup ? [setup.pick, setup.savedAt] : null;
  const linearKey = base && options ? JSON.stringify([...base, options.road]) : null;
  const eventsKey = base && options ? JSON.stringify([...base, options.bump]) : null;
  const linearJob = useMemo(
    () => (setup && options ? { kind: 'linear' as const, corners: setup.corners, road: options.road } : null),
    [linearKey],
  );
  const eventsJob = useMemo(
    () => (setup && options ? { kind: 'events' as const, corners: setup.corners, bump: options.bump } : null),
    [eventsKey],
  );
  const linear = usePart<Extract<AnalysisJob, { kind: 'linear' }>>(
    analysisRunLinear,
    setup,
    linearJob,
    linearKey,
  );
  const events = usePart<Extract<AnalysisJob, { kind: 'events' }>>(
    analysisRunEvents,
    setup,
    eventsJob,
    eventsKey,
  );
  const linearPart: AnalysisLinear | null = linear.part?.part ?? null;
  const eventsPart: AnalysisEvents | null = events.part?.part ?? null;
  const result = useMemo(
    () => (linearPart && eventsPart ? analysisResultOf(linearPart, eventsPart) : null),
    [linearPart, eventsPart],
  );
  // Progress of whichever part is still running: the bump's, which takes longer, first.
  const running = events.running ?? linear.running;
  return {
    result,
    linear: linearPart,
    events: eventsPart,
    /** Each part on screen is for other inputs than those now asked for (it is being worked out again). */
    stale: {
      linear: linear.part !== null && linear.part.key !== linearKey,
      events: events.part !== null && events.part.key !== eventsKey,
    },
    running:
      running && (events.running?.visible || linear.running?.visible)
        ? { ...running, visible: true }
        : running,
    error: linear.error ?? events.error,
    stop: () => {
      linear.stop();
      events.stop();
    },
  };
}
