import { CORNER_POSITIONS, type CornerPosition } from '../../core/setup/setup-sheet';
import type { Modes } from '../../core/corner/modal';
import { numberFormat, quantityFormat, type QuantityKind, type UnitSystem } from '../../core/units/units';
import type { ModelWarning } from '../../core/corner/warnings';
import { figureLabel, figureText, type FigureKey } from '../../core/units/figure-labels';
import { bumpText, roadText, stepText } from './analysis-options';
import type { AnalysisResult, CornerResult } from './analysis-result';

/** One figure of the table: its text per corner (unit included) and the warnings that concern it. */
export type FigureRow = {
  key: string;
  label: string;
  cells: Record<CornerPosition, string>;
  warnings: Record<CornerPosition, ModelWarning[]>;
};
export type FigureGroup = { key: string; title: string; rows: FigureRow[] };

type RowSpec = {
  key: string;
  label: string;
  text: (c: CornerResult, system: UnitSystem) => string;
  /** Warning codes (or code prefixes ending in "-") shown beside this figure. */
  codes?: readonly string[];
};

/** A row showing one quantity of the corner's result, in the unit system's unit. */
const quantityRow = (
  key: string,
  label: string,
  kind: QuantityKind,
  value: (c: CornerResult) => number,
  codes?: readonly string[],
  decimals?: number,
): RowSpec => ({
  key,
  label,
  text: (c, u) => quantityFormat(value(c), kind, u, decimals === undefined ? {} : { decimals }),
  ...(codes ? { codes } : {}),
});

const zeta = (z: number) => numberFormat(z, 2);
const percent = (x: number) => `${numberFormat(x * 100, 1)} %`;
const modeText = (m: Modes['body']) =>
  m ? `${numberFormat(m.frequencyHz, 2)} Hz, ζ ${zeta(m.dampingRatio)}` : 'does not oscillate (overdamped)';

const LINEAR_ROWS: readonly RowSpec[] = [
  quantityRow('wheelRate', 'Wheel rate', 'stiffness', (c) => c.figures.wheelRate),
  quantityRow('rideRate', 'Ride rate', 'stiffness', (c) => c.figures.rideRate),
  quantityRow('rideFrequency', 'Ride frequency', 'frequency', (c) => c.figures.rideFrequencyHz, [
    'ride-frequency-low',
    'ride-frequency-high',
  ]),
  quantityRow(
    'wheelHopFrequency',
    'Wheel-hop frequency',
    'frequency',
    (c) => c.figures.wheelHopFrequencyHz,
    ['wheel-hop-low', 'wheel-hop-high', 'unsprung-ratio'],
    1,
  ),
  {
    key: 'zetaBump',
    label: 'ζ bump, low speed (class)',
    text: (c) => `${zeta(c.figures.dampingRatio.bump)} (${c.figures.dampingClass.bump})`,
    codes: ['damping-low-bump', 'damping-high-bump'],
  },
  {
    key: 'zetaBumpHigh',
    label: 'ζ bump, high speed',
    text: (c) => zeta(c.figures.dampingRatio.bumpHighSpeed),
  },
  {
    key: 'zetaRebound',
    label: 'ζ rebound, low speed (class)',
    text: (c) => `${zeta(c.figures.dampingRatio.rebound)} (${c.figures.dampingClass.rebound})`,
    codes: ['damping-low-rebound', 'damping-high-rebound', 'rebound-softer-than-bump'],
  },
  {
    key: 'zetaReboundHigh',
    label: 'ζ rebound, high speed',
    text: (c) => zeta(c.figures.dampingRatio.reboundHighSpeed),
    codes: ['rebound-softer-than-bump-high-speed'],
  },
  {
    key: 'bodyMode',
    label: 'Body mode',
    text: (c) => modeText(c.modes.body),
    codes: ['suspension-locked', 'body-mode-overdamped'],
  },
  { key: 'wheelHopMode', label: 'Wheel-hop mode', text: (c) => modeText(c.modes.wheelHop) },
  {
    key: 'overdampedModes',
    label: 'Modes that do not oscillate',
    text: (c, u) =>
      c.modes.overdamped.length === 0
        ? 'none'
        : c.modes.overdamped
            .map((m) => `time constant ${quantityFormat(m.timeConstant, 'time', u)}`)
            .join('; '),
  },
];

const STEP_ROWS: readonly RowSpec[] = [
  { key: 'stepOvershoot', label: 'Overshoot', text: (c) => percent(c.step.overshoot) },
  {
    key: 'stepSettling',
    label: 'Settling time (2 %)',
    text: (c, u) =>
      c.step.settled
        ? quantityFormat(c.step.settlingTime, 'time', u, { decimals: 2 })
        : `not settled within ${quantityFormat(c.step.settlingTime, 'time', u, { decimals: 0 })}`,
    codes: ['step-not-settled'],
  },
];

/** A row of a figure from core's one table of names and units (figure-labels.ts). */
const figureRow = (
  key: string,
  figure: FigureKey,
  value: (c: CornerResult) => number,
  codes?: readonly string[],
): RowSpec => ({
  key,
  label: figureLabel(figure, true),
  text: (c, u) => figureText(figure, value(c), u),
  ...(codes ? { codes } : {}),
});

const ROAD_ROWS: readonly RowSpec[] = [
  figureRow('roadBodyAccel', 'roadBodyAccel', (c) => c.randomRoad.bodyAccelRms),
  figureRow('roadBodyAccelWeighted', 'roadBodyAccelWeighted', (c) => c.randomRoad.bodyAccelWeightedRms),
  figureRow('roadTireLoad', 'roadTireLoad', (c) => c.randomRoad.tireLoadRmsRatio, ['tyre-load-rms-high']),
  figureRow('roadTravel', 'roadTravel', (c) => c.randomRoad.travelRms),
];

const BUMP_ROWS: readonly RowSpec[] = [
  figureRow('bumpPeakAccel', 'peakBodyAccel', (c) => c.bump.peakBodyAccel),
  figureRow('bumpPeakBody', 'peakBodyDisplacement', (c) => c.bump.peakBodyDisplacement),
  figureRow('bumpMaxCompression', 'maxCompression', (c) => c.bump.maxCompression, ['travel-beyond-limit']),
  figureRow('bumpMaxExtension', 'maxExtension', (c) => c.bump.maxExtension, [
    'rebound-limit-reached',
    'spring-unloaded',
  ]),
  figureRow('bumpMinTireLoad', 'minTireLoad', (c) => c.bump.minTireLoad),
  figureRow('bumpMaxTireLoad', 'maxTireLoad', (c) => c.bump.maxTireLoad),
  figureRow('bumpAirborne', 'airborneTime', (c) => c.bump.airborneTime, ['tire-lift-off']),
  figureRow('bumpStopTime', 'bumpStopTime', (c) => c.bump.bumpStopContactTime, ['bump-stop-engaged']),
  {
    key: 'bumpShaftSpeed',
    label: 'Peak shaft speed, bump / rebound',
    text: (c, u) =>
      `${quantityFormat(c.bump.peakDamperVelocityBump, 'velocity', u)} / ${quantityFormat(c.bump.peakDamperVelocityRebound, 'velocity', u)}`,
    codes: ['damper-speed-beyond-data-'],
  },
];

const codeMatches = (codes: readonly string[] | undefined, code: string) =>
  (codes ?? []).some((c) => (c.endsWith('-') ? code.startsWith(c) : code === c));

/**
 * The figures table of a result in `system`, in groups (linear figures and modes, the 10 mm
 * step, the random road, the bump), each value with its unit, each row with the warnings that
 * concern it.
 */
export function analysisFigureGroups(result: AnalysisResult, system: UnitSystem): FigureGroup[] {
  const groups: { key: string; title: string; specs: readonly RowSpec[] }[] = [
    { key: 'linear', title: 'Rates, frequencies, damping and modes (linear model)', specs: LINEAR_ROWS },
    { key: 'step', title: `Road step of ${stepText(system)} (linear model)`, specs: STEP_ROWS },
    {
      key: 'road',
      title: `Random road: ${roadText(result.options.road, system)} (linear model)`,
      specs: ROAD_ROWS,
    },
    {
      key: 'bump',
      title: `Bump: ${bumpText(result.options.bump, system)} (nonlinear model)`,
      specs: BUMP_ROWS,
    },
  ];
  return groups.map((g) => ({
    key: g.key,
    title: g.title,
    rows: g.specs.map((spec) => {
      const cells = {} as Record<CornerPosition, string>;
      const warnings = {} as Record<CornerPosition, ModelWarning[]>;
      for (const p of CORNER_POSITIONS) {
        const c = result.corners[p];
        cells[p] = spec.text(c, system);
        warnings[p] = c.warnings[system].filter((w) => codeMatches(spec.codes, w.code));
      }
      return { key: spec.key, label: spec.label, cells, warnings };
    }),
  }));
}
