import { useEffect, useMemo, useState } from 'react';
import type { UnitSystem } from '../../../core/units/units';
import { apiCall } from '../api-client';
import { useApp } from '../app-context';
import { LinePlot } from '../components/plot';
import { ErrorLine } from '../components/status';
import { benchPlotLabels, benchPlotSeries, type BenchRun } from '../damper-model';
import type { Damper, Points } from './dampers-shared';
import { MAX_SHOWN, DEFAULT_SHOWN } from './dampers-shared';
import { RunsTable } from './dampers-runs-table';
import { ZetaPanel } from './dampers-zeta-panel';

export function UnitDetail(props: { damper: Damper; units: UnitSystem; highlight: number[] }) {
  const app = useApp();
  const [runs, setRuns] = useState<BenchRun[] | null>(null);
  const [shown, setShown] = useState<number[]>([]);
  const [points, setPoints] = useState<Map<number, Points>>(new Map());
  const [error, setError] = useState<unknown>(null);
  const label = props.damper.label;
  const { highlight } = props;

  useEffect(() => {
    let gone = false;
    setRuns(null);
    apiCall('benchList', { damper: label }).then((r) => {
      if (gone) return;
      setRuns(r.runs);
      const fresh = r.runs.filter((x) => highlight.includes(x.id)).map((x) => x.id);
      setShown(fresh.length ? fresh.slice(0, MAX_SHOWN) : r.runs.slice(0, DEFAULT_SHOWN).map((x) => x.id));
    }, setError);
    return () => {
      gone = true;
    };
  }, [label, app.dataVersion, highlight]);

  useEffect(() => {
    const missing = shown.filter((id) => !points.has(id));
    if (missing.length === 0) return;
    let gone = false;
    Promise.all(missing.map((id) => apiCall('benchShow', { run: id, points: true }))).then((rs) => {
      if (gone) return;
      setPoints((old) => {
        const next = new Map(old);
        for (const r of rs) next.set(r.run.id, r.points ?? []);
        return next;
      });
    }, setError);
    return () => {
      gone = true;
    };
  }, [shown, points]);

  const series = useMemo(() => {
    if (!runs) return [];
    const list = shown
      .map((id) => ({ run: runs.find((r) => r.id === id), points: points.get(id) }))
      .filter((x): x is { run: BenchRun; points: Points } => x.run !== undefined && x.points !== undefined);
    return benchPlotSeries(list, props.units);
  }, [runs, shown, points, props.units]);

  const toggle = (id: number) =>
    setShown((s) => (s.includes(id) ? s.filter((x) => x !== id) : s.length < MAX_SHOWN ? [...s, id] : s));

  const labels = benchPlotLabels(props.units);
  return (
    <section aria-label={`Damper unit ${label}`}>
      <h2>
        {label}
        {props.damper.kind ? ` — ${props.damper.kind}` : ''}
      </h2>
      <p className="muted">
        {props.damper.serial ? `Serial ${props.damper.serial} · ` : ''}
        {props.damper.runCount} run{props.damper.runCount === 1 ? '' : 's'}
        {props.damper.notes ? ` · ${props.damper.notes}` : ''}
      </p>
      <ErrorLine error={error} />
      {runs === null ? <p>Loading the runs…</p> : null}
      {runs && runs.length === 0 ? <p>No bench run stored for this unit yet.</p> : null}
      {runs && runs.length > 0 ? (
        <>
          <p>
            Pick up to {MAX_SHOWN} runs to draw: each run&apos;s measured points are markers, its fitted curve
            a line of the same colour and pattern.
          </p>
          <div className="runs-scroll">
            <RunsTable runs={runs} shown={shown} onToggle={toggle} units={props.units} />
          </div>
          <LinePlot
            id={`force-velocity-${label.replace(/[^A-Za-z0-9._-]+/g, '-')}`}
            title={`${label}: force vs shaft velocity, measured points and fitted curve per clicker setting`}
            xLabel={labels.x}
            yLabel={labels.y}
            series={series}
            height={460}
          />
          <ZetaPanel runs={runs} units={props.units} />
        </>
      ) : null}
    </section>
  );
}
