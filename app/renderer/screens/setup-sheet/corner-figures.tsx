import { cornerQuarterCar, cornerRideFigures, type CornerFigures } from '../../../../core/corner/corner';
import { damperCurveParse } from '../../../../core/damper/damper-curve';
import { modesOf, type Modes } from '../../../../core/corner/modal';
import type { CornerPosition } from '../../../../core/setup/setup-sheet';
import { numberFormat, quantityFormat } from '../../../../core/units/units';
import { cornerWarnings, type ModelWarning } from '../../../../core/corner/warnings';
import { useApp } from '../../app-context';
import { WarningList } from '../../components/caution';
import type { CornerDamper } from '../../revision-dampers';
import { setupProblemText } from '../../setup-field-words';
import { setupFormCorner, type SetupForm } from '../../setup-form';
import type { SheetCornerDamper } from './use-corner-dampers';

/** Where the corner's damper curve comes from, as the sheet says it. */
export type CurveSource = { kind: CornerDamper['source']['kind'] | 'asking'; text: string };

/** A corner's live figures, warnings and curve source; or, while it does not read, what is missing. */
export type CornerLive =
  { figures: CornerFigures; modes: Modes; warnings: ModelWarning[]; source: CurveSource } | { error: string };

/**
 * A corner's live figures with the damper curve it runs: the bench's at its clicks when the
 * API's answer is for the unit and clicks on the sheet, else the entered curve (and the
 * source says the library is being asked). Warnings are written in the form's unit system.
 */
export function cornerLiveOf(
  form: SetupForm,
  p: CornerPosition,
  damper: SheetCornerDamper | undefined,
): CornerLive {
  const r = setupFormCorner(form, p);
  if ('error' in r) return { error: setupProblemText(r.error.field, r.error.problem) };
  let corner = r.corner;
  let source: CurveSource = { kind: 'asking', text: 'asking the bench library…' };
  const own: ModelWarning[] = [];
  if (damper?.current) {
    const d = damper.damper;
    source = d.source;
    if (d.source.kind !== 'entered') {
      const bench = damperCurveParse(d.curve, 'curve');
      corner = { ...corner, damper: { ...corner.damper, bump: bench.bump, rebound: bench.rebound } };
    }
    if (d.warning) own.push(d.warning);
  }
  const figures = cornerRideFigures(corner);
  const modes = modesOf(cornerQuarterCar(corner));
  return {
    figures,
    modes,
    warnings: [...own, ...cornerWarnings(figures, modes, undefined, form.system)],
    source,
  };
}

/** Average ride frequency of an axle, when both its corners read. */
export function axleFrequency(
  live: Record<CornerPosition, CornerLive>,
  a: CornerPosition,
  b: CornerPosition,
): number | null {
  const x = live[a];
  const y = live[b];
  if ('error' in x || 'error' in y) return null;
  return (x.figures.rideFrequencyHz + y.figures.rideFrequencyHz) / 2;
}

/** One line saying where a corner's damper curve comes from. */
export function CurveSourceLine(props: { source: CurveSource; position: CornerPosition }) {
  return (
    <p
      className="curve-source"
      data-testid={`curve-source-${props.position}`}
      data-source={props.source.kind}
    >
      <strong>Damper curve:</strong> {props.source.text}
    </p>
  );
}

/** A corner's headline figures as the sheet is edited, with the curve's source and the warnings. */
export function CornerLivePanel(props: { live: CornerLive; position: CornerPosition }) {
  const { units } = useApp();
  const l = props.live;
  if ('error' in l) {
    return (
      <div className="live" aria-label={`${props.position} live figures`}>
        <p className="muted">Figures appear when the corner reads: {l.error}</p>
      </div>
    );
  }
  const f = l.figures;
  return (
    <div
      className="live"
      aria-label={`${props.position} live figures`}
      data-testid={`live-${props.position}`}
    >
      <CurveSourceLine source={l.source} position={props.position} />
      <dl>
        <dt>Wheel rate</dt>
        <dd>{quantityFormat(f.wheelRate, 'stiffness', units)}</dd>
        <dt>Ride frequency</dt>
        <dd data-figure="rideFrequencyHz">{numberFormat(f.rideFrequencyHz, 2)} Hz</dd>
        <dt>Wheel hop</dt>
        <dd data-figure="wheelHopFrequencyHz">{numberFormat(f.wheelHopFrequencyHz, 1)} Hz</dd>
        <dt>ζ bump / rebound</dt>
        <dd data-figure="dampingRatio">
          {numberFormat(f.dampingRatio.bump, 2)} / {numberFormat(f.dampingRatio.rebound, 2)}
        </dd>
        <dt>ζ high speed b / r</dt>
        <dd>
          {numberFormat(f.dampingRatio.bumpHighSpeed, 2)} / {numberFormat(f.dampingRatio.reboundHighSpeed, 2)}
        </dd>
        <dt>Class (bump, rebound)</dt>
        <dd>
          {f.dampingClass.bump}, {f.dampingClass.rebound}
        </dd>
        <dt>Body mode</dt>
        <dd>
          {l.modes.body
            ? `${numberFormat(l.modes.body.frequencyHz, 2)} Hz, ζ ${numberFormat(l.modes.body.dampingRatio, 2)}`
            : 'overdamped'}
        </dd>
      </dl>
      <WarningList warnings={l.warnings} label={`${props.position} warnings`} />
    </div>
  );
}
