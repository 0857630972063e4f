import { clickSettingsText, type ClickSettings } from '../../core/damper/click-settings';
import {
  cornerSprungMass,
  cornerWheelRate,
  criticalDampingOf,
  dampingClassOf,
  type CornerInput,
  type DampingClass,
} from '../../core/corner/corner';
import { damperDirectionForce, damperForce, type DamperDirectionCurve } from '../../core/damper/damper-curve';
import { InputError } from '../../core/units/input-error';
import { numberParse, quantityParse, quantityUnitLabel, type UnitSystem } from '../../core/units/units';
import type { HandlerOutput } from '../api/contract';
import type { PlotSeries } from './components/plot-data';
import { quantityDisplayFactor, quantityFieldConvert, quantityFieldValue } from './quantity-field';

export type BenchRun = HandlerOutput<'benchList'>['runs'][number];
export type BenchFitStored = BenchRun['fit'];
type DirectionFitStored = BenchFitStored['bump'];

/** A run's name in legends and tables: its clicker setting, or its number when it has none. */
export function benchRunLabel(run: Pick<BenchRun, 'id' | 'clicks'>): string {
  const clicks = clickSettingsText(run.clicks as ClickSettings);
  return clicks ? `#${run.id} ${clicks}` : `#${run.id}`;
}

function directionCurve(fit: DirectionFitStored): DamperDirectionCurve | null {
  if (!fit) return null;
  const c = fit.curve;
  return { kind: 'bilinear', lowSpeed: c.lowSpeed, kneeSpeed: c.kneeSpeed, highSpeed: c.highSpeed };
}

/**
 * The stored fit drawn as a curve, compression positive (m/s, N): `samples` speeds a direction
 * from zero out to the fastest measured point of that direction, the force by core's
 * damperForce (or the one direction's force where the run has only that direction fitted).
 */
export function benchFitCurve(
  fit: BenchFitStored,
  reach: { bump: number; rebound: number },
  samples = 60,
): { velocity: number[]; force: number[] } {
  const bump = directionCurve(fit.bump);
  const rebound = directionCurve(fit.rebound);
  const force = (v: number) =>
    bump && rebound
      ? damperForce({ bump, rebound }, v)
      : v >= 0
        ? damperDirectionForce(bump as DamperDirectionCurve, v)
        : -damperDirectionForce(rebound as DamperDirectionCurve, -v);
  const velocity: number[] = [];
  if (rebound && reach.rebound > 0)
    for (let i = samples; i >= 1; i--) velocity.push((-reach.rebound * i) / samples);
  if (bump || rebound) velocity.push(0);
  if (bump && reach.bump > 0) for (let i = 1; i <= samples; i++) velocity.push((reach.bump * i) / samples);
  return { velocity, force: velocity.map(force) };
}

/** How far the measured points reach in each direction (m/s, magnitudes). */
export function benchPointsReach(points: readonly (readonly [number, number])[]): {
  bump: number;
  rebound: number;
} {
  let bump = 0;
  let rebound = 0;
  for (const [v] of points) {
    if (v > bump) bump = v;
    if (-v > rebound) rebound = -v;
  }
  return { bump, rebound };
}

/**
 * The force–velocity plot's series in `system`: per run, its measured points (markers) and its
 * fitted curve (a line) in the same colour, so measured and fitted differ by shape, not colour.
 */
export function benchPlotSeries(
  runs: readonly {
    run: Pick<BenchRun, 'id' | 'clicks' | 'fit'>;
    points: readonly (readonly [number, number])[];
  }[],
  system: UnitSystem,
): PlotSeries[] {
  const kv = quantityDisplayFactor('velocity', system);
  const kf = quantityDisplayFactor('force', system);
  return runs.flatMap(({ run, points }, i) => {
    const label = benchRunLabel(run);
    const curve = benchFitCurve(run.fit, benchPointsReach(points));
    return [
      {
        name: `${label} measured`,
        x: points.map((p) => p[0] * kv),
        y: points.map((p) => p[1] * kf),
        points: true,
        style: i,
      },
      {
        name: `${label} fitted`,
        x: curve.velocity.map((v) => v * kv),
        y: curve.force.map((f) => f * kf),
        style: i,
      },
    ];
  });
}

/** The axis labels of the force–velocity plot in `system`. */
export function benchPlotLabels(system: UnitSystem): { x: string; y: string } {
  return {
    x: `Shaft velocity, compression + (${quantityUnitLabel('velocity', system)})`,
    y: `Damper force, compression + (${quantityUnitLabel('force', system)})`,
  };
}

/** The parts of a corner that a damper's ζ depends on, SI. */
export type ZetaCorner = Pick<
  CornerInput,
  'cornerMass' | 'unsprungMass' | 'springRate' | 'springMotionRatio' | 'damperMotionRatio'
>;

/** ζ of one slope and, for the low-speed slopes, its damping class. */
export type ZetaFigure = { zeta: number; class?: DampingClass } | null;

export type RunDampingRatios = {
  bump: ZetaFigure;
  bumpHighSpeed: ZetaFigure;
  rebound: ZetaFigure;
  reboundHighSpeed: ZetaFigure;
};

/**
 * ζ of a run's fitted slopes at a corner (DESIGN.md, Conventions): c_wheel = c_damper ·
 * MRd², ζ = c_wheel / 2√(kw·ms), with kw = k_spring · MRs² and ms = M − mu; low and high
 * speed, bump and rebound. A direction the run has no fit for is null.
 */
export function benchRunDampingRatios(fit: BenchFitStored, corner: ZetaCorner): RunDampingRatios {
  const critical = criticalDampingOf(cornerWheelRate(corner), cornerSprungMass(corner));
  const mr2 = corner.damperMotionRatio * corner.damperMotionRatio;
  const ratio = (c: number, withClass: boolean): ZetaFigure => {
    const zeta = (c * mr2) / critical;
    return withClass ? { zeta, class: dampingClassOf(zeta) } : { zeta };
  };
  const dir = (f: DirectionFitStored, high: boolean) =>
    f ? ratio(high ? f.curve.highSpeed : f.curve.lowSpeed, !high) : null;
  return {
    bump: dir(fit.bump, false),
    bumpHighSpeed: dir(fit.bump, true),
    rebound: dir(fit.rebound, false),
    reboundHighSpeed: dir(fit.rebound, true),
  };
}

/** The corner a user enters for the ζ table, as typed (numbers in the unit system's units). */
export type ZetaCornerTexts = {
  cornerMass: string;
  unsprungMass: string;
  springRate: string;
  springMotionRatio: string;
  /** Empty: the spring's motion ratio. */
  damperMotionRatio: string;
};

export const ZETA_CORNER_FIELDS = [
  { key: 'cornerMass', label: 'Corner mass', kind: 'mass' },
  { key: 'unsprungMass', label: 'Unsprung mass', kind: 'mass' },
  { key: 'springRate', label: 'Spring rate', kind: 'stiffness' },
  { key: 'springMotionRatio', label: 'Spring motion ratio', kind: 'ratio' },
  { key: 'damperMotionRatio', label: 'Damper motion ratio', kind: 'ratio' },
] as const;

/** The entered corner's texts shown in another unit system, converted where they read. */
export function zetaCornerTextsConvert(
  t: ZetaCornerTexts,
  from: UnitSystem,
  to: UnitSystem,
): ZetaCornerTexts {
  return {
    ...t,
    cornerMass: quantityFieldConvert(t.cornerMass, 'mass', from, to),
    unsprungMass: quantityFieldConvert(t.unsprungMass, 'mass', from, to),
    springRate: quantityFieldConvert(t.springRate, 'stiffness', from, to),
  };
}

/**
 * Reads the entered corner with core's readers (a bare number is in the unit shown beside its
 * field); problems by field, each core's message. Masses and rates must be positive, the
 * unsprung mass below the corner mass (which includes it).
 */
export function zetaCornerRead(
  t: ZetaCornerTexts,
  system: UnitSystem,
): { corner: ZetaCorner } | { problems: Map<keyof ZetaCornerTexts, string> } {
  const problems = new Map<keyof ZetaCornerTexts, string>();
  const read = (key: keyof ZetaCornerTexts, parse: () => number): number => {
    try {
      const v = parse();
      if (!(v > 0)) throw new InputError(key, 'must be greater than zero');
      return v;
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      problems.set(key, e.problem);
      return NaN;
    }
  };
  const quantity = (key: 'cornerMass' | 'unsprungMass' | 'springRate', kind: 'mass' | 'stiffness') =>
    read(key, () => {
      const v = quantityFieldValue(t[key], kind, system);
      if (v === undefined) throw new InputError(key, 'is needed');
      return quantityParse(v, kind, key);
    });
  const cornerMass = quantity('cornerMass', 'mass');
  const unsprungMass = quantity('unsprungMass', 'mass');
  const springRate = quantity('springRate', 'stiffness');
  const springMotionRatio = read('springMotionRatio', () =>
    numberParse(t.springMotionRatio.trim(), 'springMotionRatio', 'a motion ratio such as 0.9'),
  );
  const damperMotionRatio =
    t.damperMotionRatio.trim() === ''
      ? springMotionRatio
      : read('damperMotionRatio', () =>
          numberParse(t.damperMotionRatio.trim(), 'damperMotionRatio', 'a motion ratio such as 0.9'),
        );
  if (!problems.has('unsprungMass') && !problems.has('cornerMass') && !(unsprungMass < cornerMass))
    problems.set('unsprungMass', 'must be less than the corner mass, which includes it');
  if (problems.size > 0) return { problems };
  return { corner: { cornerMass, unsprungMass, springRate, springMotionRatio, damperMotionRatio } };
}
