import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import type { CornerInput } from '../../../core/corner';
import { CORNER_POSITIONS, type CornerPosition } from '../../../core/setup-sheet';
import { quantityUnitLabel, type UnitSystem } from '../../../core/units';
import type { HandlerOutput } from '../../api/contract';
import { apiCall } from '../api-client';
import { useApp, type RevisionPick } from '../app-context';
import {
  ROAD_CLASSES,
  analysisOptionTextsConvert,
  analysisOptionTextsDefault,
  analysisOptionsRead,
  type AnalysisOptionTexts,
  type AnalysisOptions,
} from '../analysis-options';
import { analysisCornersOf, type AnalysisResult } from '../analysis-result';
import { analysisFigureGroups, type FigureGroup } from '../analysis-figures';
import { analysisPlots } from '../analysis-plots';
import { AnalysisCancelled, analysisRun } from '../analysis-run';
import { BarPlot } from '../components/bar-plot';
import { CautionLine, WarningList } from '../components/caution';
import { LinePlot } from '../components/plot';
import { RevisionPicker } from '../components/revision-pick';
import { ErrorLine, ProgressLine } from '../components/status';
import { TextInputField } from '../components/text-input-field';

type Shown = {
  pick: RevisionPick;
  revision: HandlerOutput<'setupShow'>['revision'];
  corners: Record<CornerPosition, CornerInput>;
};

/** Progress is shown only for a run that is not done in a moment, so quick ones do not flicker. */
const PROGRESS_DELAY_MS = 150;
/** Typing pauses this long before the figures are worked out again. */
const RECOMPUTE_DELAY_MS = 250;

const OPTION_FIELDS: { key: keyof AnalysisOptionTexts; label: string; kind: 'speed' | 'length' }[] = [
  { key: 'roadSpeed', label: 'Road speed', kind: 'speed' },
  { key: 'bumpHeight', label: 'Bump height', kind: 'length' },
  { key: 'bumpLength', label: 'Bump length', kind: 'length' },
  { key: 'bumpSpeed', label: 'Bump speed', kind: 'speed' },
];

function OptionsForm(props: {
  texts: AnalysisOptionTexts;
  units: UnitSystem;
  problems: Map<keyof AnalysisOptionTexts, string>;
  onChange: (texts: AnalysisOptionTexts) => void;
}) {
  const { texts, problems } = props;
  return (
    <fieldset className="analysis-options">
      <legend>Road and bump</legend>
      <div className="option-fields">
        <div className="field">
          <label htmlFor="analysis-road-class">Road class (ISO 8608)</label>
          <select
            id="analysis-road-class"
            value={texts.roadClass}
            onChange={(e) => props.onChange({ ...texts, roadClass: e.target.value })}
          >
            {ROAD_CLASSES.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
          <span className="unit" />
        </div>
        {OPTION_FIELDS.map((f) => (
          <TextInputField
            key={f.key}
            id={`analysis-${f.key}`}
            label={f.label}
            value={texts[f.key]}
            unit={quantityUnitLabel(f.kind, props.units)}
            problem={problems.get(f.key)}
            numeric
            onChange={(text) => props.onChange({ ...texts, [f.key]: text })}
          />
        ))}
      </div>
    </fieldset>
  );
}

function FiguresTable(props: { groups: FigureGroup[] }) {
  return (
    <table className="figures analysis-figures" aria-label="Ride figures per corner">
      <thead>
        <tr>
          <th scope="col">Figure</th>
          {CORNER_POSITIONS.map((p) => (
            <th scope="col" key={p}>
              {p}
            </th>
          ))}
        </tr>
      </thead>
      {props.groups.map((g) => (
        <tbody key={g.key}>
          <tr className="group-row">
            <th scope="colgroup" colSpan={CORNER_POSITIONS.length + 1}>
              {g.title}
            </th>
          </tr>
          {g.rows.map((r) => (
            <tr key={r.key} data-figure={r.key}>
              <th scope="row">{r.label}</th>
              {CORNER_POSITIONS.map((p) => {
                const w = r.warnings[p];
                return (
                  <td key={p} data-corner={p} className={w.length ? 'has-warning' : undefined}>
                    {w.length ? (
                      <span
                        className="warn-mark"
                        role="img"
                        aria-label={`warning: ${w.map((x) => x.message).join(' ')}`}
                        title={w.map((x) => x.message).join('\n')}
                      >
                        ⚠{' '}
                      </span>
                    ) : null}
                    {r.cells[p]}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      ))}
    </table>
  );
}

function Plots(props: { result: AnalysisResult; units: UnitSystem }) {
  const plots = useMemo(() => analysisPlots(props.result, props.units), [props.result, props.units]);
  return (
    <>
      <h3>Step and bump responses</h3>
      <div className="plots three">
        {[...plots.step, ...plots.bump].map((p) => (
          <LinePlot key={p.id} {...p} height={250} />
        ))}
      </div>
      <h3>Frequency response</h3>
      <div className="plots three">
        {plots.frf.map((p) => (
          <LinePlot key={p.id} {...p} height={260} />
        ))}
      </div>
      <h3>Random road</h3>
      <div className="plots three">
        {plots.randomRoad.map((p) => (
          <BarPlot key={p.id} {...p} valueText={(v) => v.toFixed(p.decimals)} height={250} />
        ))}
      </div>
    </>
  );
}

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
  const [texts, setTexts] = useState<AnalysisOptionTexts>(() => analysisOptionTextsDefault(units));
  const textsUnits = useRef<UnitSystem>(units);
  const [result, setResult] = useState<{ result: AnalysisResult; key: string; pick: RevisionPick } | null>(
    null,
  );
  const [running, setRunning] = useState<{ fraction: number; stage: string; visible: boolean } | null>(null);
  const [runError, setRunError] = useState<unknown>(null);
  const abort = useRef<AbortController | null>(null);

  const pick = app.revision;
  const { openRevision } = app;
  const onPick = useCallback((p: RevisionPick) => openRevision(p), [openRevision]);

  // Load the revision picked.
  useEffect(() => {
    if (!pick) return;
    let gone = false;
    setLoadError(null);
    apiCall('setupShow', { vehicle: pick.vehicle, revision: pick.revision, units: 'si' }).then(
      (r) => {
        if (gone) return;
        try {
          setResult((old) => (old && old.pick === pick ? old : null));
          setShown({ pick, revision: r.revision, corners: analysisCornersOf(r.file) });
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

  // The units switch converts the road and bump fields in place.
  useEffect(() => {
    if (textsUnits.current === units) return;
    setTexts((t) => analysisOptionTextsConvert(t, textsUnits.current, units));
    textsUnits.current = units;
  }, [units]);

  // The texts are read in the system they were typed in; the switch converts them just after.
  const read = useMemo(() => analysisOptionsRead(texts, textsUnits.current), [texts, units]);
  const options: AnalysisOptions | null = 'options' in read ? read.options : null;
  const problems = 'problems' in read ? read.problems : new Map<keyof AnalysisOptionTexts, string>();
  const runKey = shown && options ? JSON.stringify([shown.pick, shown.revision.savedAt, options]) : null;

  // Work the figures out again a moment after the inputs settle; a newer run cancels an older one.
  useEffect(() => {
    if (!shown || !options || !runKey) return;
    const controller = new AbortController();
    let progressTimer: ReturnType<typeof setTimeout> | undefined;
    const start = setTimeout(() => {
      abort.current = controller;
      setRunError(null);
      setRunning({ fraction: 0, stage: 'starting', visible: false });
      progressTimer = setTimeout(
        () => setRunning((r) => (r ? { ...r, visible: true } : r)),
        PROGRESS_DELAY_MS,
      );
      analysisRun(shown.corners, options, {
        signal: controller.signal,
        onProgress: (fraction, stage) => setRunning((r) => (r ? { ...r, fraction, stage } : r)),
      })
        .then(
          (r) => setResult({ result: r, key: runKey, pick: shown.pick }),
          (e: unknown) => {
            if (!(e instanceof AnalysisCancelled) || abort.current === controller) setRunError(e);
          },
        )
        .finally(() => {
          clearTimeout(progressTimer);
          if (abort.current === controller) {
            abort.current = null;
            setRunning(null);
          }
        });
    }, RECOMPUTE_DELAY_MS);
    return () => {
      clearTimeout(start);
      clearTimeout(progressTimer);
      controller.abort();
    };
    // runKey stands for shown and options.
  }, [runKey]);

  const groups = useMemo(() => (result ? analysisFigureGroups(result.result, units) : null), [result, units]);
  const stale = result !== null && result.key !== runKey;

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
        <OptionsForm texts={texts} units={units} problems={problems} onChange={setTexts} />
      </div>
      <ErrorLine error={loadError} />
      {running?.visible ? (
        <ProgressLine
          label={`Working out the figures: ${running.stage}`}
          fraction={running.fraction}
          onCancel={() => abort.current?.abort()}
        />
      ) : null}
      <ErrorLine error={runError} />
      {!pick ? <p>Pick a vehicle and one of its revisions.</p> : null}
      {stale && !options ? (
        <p className="status" role="status">
          The figures below are for the previous road and bump: fix the marked field, or change a value to
          work them out again.
        </p>
      ) : null}
      {result && groups ? (
        <>
          <FiguresTable groups={groups} />
          <h3>Model warnings</h3>
          <div className="corner-warnings">
            {CORNER_POSITIONS.map((p) => {
              const w = result.result.corners[p].warnings[units];
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
          <Plots result={result.result} units={units} />
        </>
      ) : pick && !loadError && !runError ? (
        <p>Working out the figures…</p>
      ) : null}
    </section>
  );
}
