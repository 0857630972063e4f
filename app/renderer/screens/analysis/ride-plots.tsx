import { memo, useEffect, useMemo, useState, type ReactNode } from 'react';
import { flushSync } from 'react-dom';
import type { UnitSystem } from '../../../../core/units/units';
import {
  analysisBumpPlots,
  analysisLinearPlots,
  type BarPlotSpec,
  type BumpPlotSource,
  type LinearPlotSource,
  type LinePlotSpec,
} from '../../analysis-plots';
import { BarPlot } from '../../components/bar-plot';
import { LinePlot } from '../../components/plot';

/**
 * Plots drawn one a task, in the order asked: a chart with hundreds of points takes tens of
 * milliseconds to draw, and a dozen drawn at once would hold the page for the sum of them. Between
 * two charts the page reads keys and paints, so typing stays smooth while the plots catch up.
 */
const turns: (() => void)[] = [];
let turning = false;
/** While the user types, charts wait: the figures table shows each value, the plots the last. */
const TYPING_PAUSE_MS = 300;
let lastKey = -Infinity;
if (typeof document !== 'undefined')
  document.addEventListener('keydown', () => (lastKey = performance.now()), { capture: true, passive: true });
function plotTurnTake(draw: () => void): () => void {
  turns.push(draw);
  if (!turning) {
    turning = true;
    const next = () => {
      const typing = performance.now() - lastKey;
      if (typing < TYPING_PAUSE_MS) {
        setTimeout(next, TYPING_PAUSE_MS - typing);
        return;
      }
      const d = turns.shift();
      if (!d) {
        turning = false;
        return;
      }
      d();
      setTimeout(next, 0);
    };
    setTimeout(next, 0);
  }
  return () => {
    const i = turns.indexOf(draw);
    if (i >= 0) turns.splice(i, 1);
  };
}

/** Shows `spec` drawn by `draw` once its turn comes; the chart before it stays until then. */
function InTurn<T>(props: { spec: T; height: number; draw: (spec: T) => ReactNode }) {
  const [shown, setShown] = useState<T | null>(null);
  const { spec } = props;
  useEffect(() => plotTurnTake(() => flushSync(() => setShown(spec))), [spec]);
  if (shown === null) return <div className="plot-pending" style={{ minHeight: props.height }} aria-hidden />;
  return <>{props.draw(shown)}</>;
}

const drawLine = (height: number) => (p: LinePlotSpec) => <LinePlot {...p} height={height} />;
const drawBar = (p: BarPlotSpec) => <BarPlot {...p} valueText={(v) => v.toFixed(p.decimals)} height={250} />;

/**
 * The Ride figures' plots: the step and bump histories, the frequency response and the random
 * road. The linear model's plots are made again only when its results change, the bump's only
 * when the bump's do, and each chart is redrawn in its own turn.
 */
export const RidePlots = memo(function RidePlots(props: {
  linear: LinearPlotSource;
  events: BumpPlotSource;
  units: UnitSystem;
}) {
  const { units } = props;
  const linear = useMemo(() => analysisLinearPlots(props.linear, units), [props.linear, units]);
  const bump = useMemo(() => analysisBumpPlots(props.events, units), [props.events, units]);
  const line250 = useMemo(() => drawLine(250), []);
  const line260 = useMemo(() => drawLine(260), []);
  return (
    <>
      <h3>Step and bump responses</h3>
      <div className="plots three">
        {[...linear.step, ...bump].map((p) => (
          <InTurn key={p.id} spec={p} height={250} draw={line250} />
        ))}
      </div>
      <h3>Frequency response</h3>
      <div className="plots three">
        {linear.frf.map((p) => (
          <InTurn key={p.id} spec={p} height={260} draw={line260} />
        ))}
      </div>
      <h3>Random road</h3>
      <div className="plots three">
        {linear.randomRoad.map((p) => (
          <InTurn key={p.id} spec={p} height={250} draw={drawBar} />
        ))}
      </div>
    </>
  );
});
