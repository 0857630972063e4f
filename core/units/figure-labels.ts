import { numberFormat, quantityFormat, type QuantityKind, type UnitSystem } from './units';

/**
 * How a figure is written: a quantity in the unit system's unit, a short time in milliseconds
 * (the times a tyre or a stop spends in a mode over one event), a share in per cent, or a
 * plain number.
 */
export type FigureUnit =
  | { kind: QuantityKind; decimals?: number }
  | { kind: 'ms' }
  | { kind: 'percent' }
  | { kind: 'number'; decimals: number };

/** One figure's name (lower case, as it reads inside a sentence) and how its value is written. */
export type FigureSpec = { label: string; unit: FigureUnit };

/**
 * The one table of figure names and units: every screen and the command's readable output
 * take a figure's words and unit from here, so that one figure reads the same everywhere.
 */
export const FIGURES = {
  wheelRate: { label: 'wheel rate', unit: { kind: 'stiffness' } },
  rideRate: { label: 'ride rate', unit: { kind: 'stiffness' } },
  rideFrequency: { label: 'ride frequency', unit: { kind: 'frequency' } },
  wheelHopFrequency: { label: 'wheel-hop frequency', unit: { kind: 'frequency', decimals: 1 } },
  bodyMode: { label: 'body mode', unit: { kind: 'frequency' } },
  bodyModeDamping: { label: 'body mode ζ', unit: { kind: 'number', decimals: 2 } },
  roadBodyAccel: { label: 'body acceleration RMS', unit: { kind: 'acceleration' } },
  roadBodyAccelWeighted: {
    label: 'body acceleration RMS, Wk-weighted (ISO 2631-1)',
    unit: { kind: 'acceleration' },
  },
  roadTireLoad: { label: 'dynamic tyre load RMS ÷ static', unit: { kind: 'percent' } },
  roadTravel: { label: 'suspension travel RMS', unit: { kind: 'length' } },
  peakBodyAccel: { label: 'peak body acceleration', unit: { kind: 'acceleration' } },
  peakBodyDisplacement: { label: 'peak body displacement', unit: { kind: 'length' } },
  maxCompression: { label: 'most compression (at the wheel)', unit: { kind: 'length' } },
  maxExtension: { label: 'most extension (at the wheel)', unit: { kind: 'length' } },
  minTireLoad: { label: 'least tyre load', unit: { kind: 'force' } },
  maxTireLoad: { label: 'most tyre load', unit: { kind: 'force' } },
  airborneTime: { label: 'time in the air', unit: { kind: 'ms' } },
  bumpStopTime: { label: 'time on the bump stop', unit: { kind: 'ms' } },
  bumpStopPeakForce: { label: 'bump-stop peak force (at the damper)', unit: { kind: 'force' } },
  reboundLimitTime: { label: 'time topped out', unit: { kind: 'ms' } },
  peakShaftSpeedBump: { label: 'peak shaft speed, bump', unit: { kind: 'velocity' } },
  peakShaftSpeedRebound: { label: 'peak shaft speed, rebound', unit: { kind: 'velocity' } },
} as const satisfies Record<string, FigureSpec>;

export type FigureKey = keyof typeof FIGURES;

/** A figure's name, its first letter capitalised for a table's row head. */
export function figureLabel(key: FigureKey, capital = false): string {
  const l = FIGURES[key].label;
  return capital ? `${l.charAt(0).toUpperCase()}${l.slice(1)}` : l;
}

/**
 * A figure's SI value written with its unit in `system`: times of an event in ms (1 decimal),
 * shares in % (1 decimal), quantities as quantityFormat writes them.
 * @example figureText('airborneTime', 0.0262, 'us') // "26.2 ms"
 */
export function figureText(key: FigureKey, valueSI: number, system: UnitSystem): string {
  const unit: FigureUnit = FIGURES[key].unit;
  switch (unit.kind) {
    case 'ms':
      return `${numberFormat(valueSI * 1000, 1)} ms`;
    case 'percent':
      return `${numberFormat(valueSI * 100, 1)} %`;
    case 'number':
      return numberFormat(valueSI, unit.decimals);
    default:
      return quantityFormat(
        valueSI,
        unit.kind,
        system,
        'decimals' in unit ? { decimals: unit.decimals } : {},
      );
  }
}
