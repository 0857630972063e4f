import { useMemo } from 'react';
import { cornerQuarterCar } from '../../../../core/corner/corner';
import type { BumpSpec } from '../../../../core/corner/corner-file';
import { eventBump } from '../../../../core/events/event';
import {
  frequencyResponseGrid,
  frequencyResponseMagnitudeAt,
} from '../../../../core/corner/frequency-response';
import type { CornerPosition } from '../../../../core/setup/setup-sheet';
import { eventSimulate } from '../../../../core/events/simulate';
import { quantityToDisplay, quantityUnitLabel, type UnitSystem } from '../../../../core/units/units';
import { labelOf, type Loaded } from '../../compare-model';
import { LinePlot, type PlotSeries } from '../../components/plot';

/** Line widths of the compared revisions' curves, the baseline widest. */
const CURVE_WIDTHS = [6, 3.5, 2, 1.5];

/**
 * The compared revisions' frequency responses and bump histories at one corner, overlaid:
 * each curve over the one before, narrower and with its own dash, so that identical ones show.
 */
export function ComparePlots(props: {
  loaded: Loaded[];
  position: CornerPosition;
  scenario: { bump: BumpSpec } | undefined;
  units: UnitSystem;
  sameAsBaseline: Loaded[];
}) {
  const { loaded, position, scenario, units, sameAsBaseline } = props;
  const plots = useMemo(() => {
    if (!scenario || loaded.length === 0) return null;
    const freqs = frequencyResponseGrid(0.3, 30, 40);
    const perMetre = quantityToDisplay(1, 'length', units);
    const frf = { accel: [] as PlotSeries[], tire: [] as PlotSeries[], travel: [] as PlotSeries[] };
    const bump = { accel: [] as PlotSeries[], travel: [] as PlotSeries[], tire: [] as PlotSeries[] };
    const event = eventBump(scenario.bump);
    for (const [i, l] of loaded.entries()) {
      const corner = l.sheet.corners[position].analysis;
      const q = cornerQuarterCar(corner);
      const m = freqs.map((f) => frequencyResponseMagnitudeAt(q, f));
      // Widest first, each later one inside it with its own dash: identical curves both show.
      const width = CURVE_WIDTHS[i] ?? 1.5;
      const name = labelOf(l);
      frf.accel.push({ name, x: freqs, width, y: m.map((r) => r.bodyAccel / perMetre) });
      frf.tire.push({
        name,
        x: freqs,
        width,
        y: m.map((r) => quantityToDisplay(r.tireLoad, 'force', units) / perMetre),
      });
      frf.travel.push({ name, x: freqs, width, y: m.map((r) => r.travel) });
      const h = eventSimulate(corner, event, { historyPoints: 600 }).history;
      if (h) {
        bump.accel.push({ name, x: h.time, width, y: h.bodyAccel });
        bump.travel.push({
          name,
          x: h.time,
          width,
          y: Array.from(h.travel, (v) => quantityToDisplay(v, 'length', units)),
        });
        bump.tire.push({
          name,
          x: h.time,
          width,
          y: Array.from(h.tireLoad, (v) => quantityToDisplay(v, 'force', units)),
        });
      }
    }
    return { frf, bump };
  }, [loaded, position, scenario, units]);
  const len = quantityUnitLabel('length', units);
  const force = quantityUnitLabel('force', units);
  return (
    <>
      {plots && loaded.length >= 2 ? (
        <p className="muted" data-testid="curve-note">
          Each revision’s curve is drawn over the one before, narrower and with its own dash, so that curves
          that coincide both show.
          {sameAsBaseline.length > 0
            ? ` At ${position}, ${sameAsBaseline.map(labelOf).join(' and ')} give${sameAsBaseline.length === 1 ? 's' : ''} the baseline’s figures exactly: its curves lie inside the baseline’s.`
            : ''}
        </p>
      ) : null}
      {plots && loaded.length >= 2 ? (
        <div className="plots">
          <LinePlot
            id={`compare-frf-body-accel-${position}`}
            title={`${position}: body acceleration per road displacement`}
            xLabel="frequency (Hz)"
            yLabel={`m/s² per ${len}`}
            series={plots.frf.accel}
            xLog
            yLog
          />
          <LinePlot
            id={`compare-frf-tire-load-${position}`}
            title={`${position}: dynamic tyre load per road displacement`}
            xLabel="frequency (Hz)"
            yLabel={`${force} per ${len}`}
            series={plots.frf.tire}
            xLog
            yLog
          />
          <LinePlot
            id={`compare-frf-travel-${position}`}
            title={`${position}: suspension travel per road displacement`}
            xLabel="frequency (Hz)"
            yLabel={`${len} per ${len}`}
            series={plots.frf.travel}
            xLog
            yLog
          />
          <LinePlot
            id={`compare-bump-body-accel-${position}`}
            title={`${position}: body acceleration over the bump (nonlinear)`}
            xLabel="time (s)"
            yLabel="m/s²"
            series={plots.bump.accel}
          />
          <LinePlot
            id={`compare-bump-travel-${position}`}
            title={`${position}: suspension travel over the bump, compression + (nonlinear)`}
            xLabel="time (s)"
            yLabel={len}
            series={plots.bump.travel}
          />
          <LinePlot
            id={`compare-bump-tire-load-${position}`}
            title={`${position}: tyre load over the bump (nonlinear)`}
            xLabel="time (s)"
            yLabel={force}
            series={plots.bump.tire}
          />
        </div>
      ) : null}
    </>
  );
}
