import type { QuantityKind } from '../units/units';

/**
 * The range a quantity of a real vehicle can take (SI), and inside it the usual range of the
 * cars and trucks the program is for. Outside `low`–`high` the value is refused (a typo, a
 * missing unit, a mass in grams); between those and `usualLow`–`usualHigh` it is read with a
 * warning. `kind` 'ratio' is a plain number. The reason says where the limits come from.
 */
export type PlausibleRange = {
  kind: QuantityKind | 'ratio';
  /** What it is, in words: "corner mass". */
  what: string;
  low: number;
  high: number;
  usualLow: number;
  usualHigh: number;
  reason: string;
  /** How to write it with its unit, for values that look like a unit was left out. */
  hint?: string;
};

const DEG = Math.PI / 180;
const KMH = 1 / 3.6;

/**
 * Every quantity of the corner file, the setup file and the road events, with its plausible
 * and usual range and the reason for them (common practice of the trade, wide on purpose:
 * a value inside `low`–`high` is never refused). README.md states the same table.
 */
export const PLAUSIBLE_RANGES = {
  cornerMass: {
    kind: 'mass',
    what: 'corner mass',
    low: 5,
    high: 5000,
    usualLow: 30,
    usualHigh: 1500,
    reason: "from a kart's corner to a heavy truck's",
    hint: '"295 kg"',
  },
  unsprungMass: {
    kind: 'mass',
    what: 'unsprung mass',
    low: 1,
    high: 1000,
    usualLow: 5,
    usualHigh: 150,
    reason: "from a kart's wheel to a truck's axle end",
    hint: '"38 kg"',
  },
  sprungMass: {
    kind: 'mass',
    what: 'sprung mass (corner mass less unsprung mass)',
    low: 2,
    high: 5000,
    usualLow: 20,
    usualHigh: 1400,
    reason: 'the body a corner carries is at least a few kilograms',
  },
  springRate: {
    kind: 'stiffness',
    what: 'spring rate',
    low: 1e3,
    high: 5e6,
    usualLow: 5e3,
    usualHigh: 1e6,
    reason: "from a soft road car's coil to the stiffest race spring or torsion bar",
    hint: '"70 N/mm" or "400 lbf/in"',
  },
  motionRatio: {
    kind: 'ratio',
    what: 'motion ratio',
    low: 0.2,
    high: 2,
    usualLow: 0.4,
    usualHigh: 1.2,
    reason:
      'spring or damper travel ÷ wheel travel: no linkage moves its spring less than a fifth or more than twice the wheel',
  },
  tireRate: {
    kind: 'stiffness',
    what: 'tyre rate',
    low: 2e4,
    high: 5e6,
    usualLow: 8e4,
    usualHigh: 1e6,
    reason: "from a soft off-road tyre to a truck's",
    hint: '"240 N/mm" or "1370 lbf/in"',
  },
  tireDamping: {
    kind: 'damping',
    what: 'tyre damping',
    low: 0,
    high: 2e4,
    usualLow: 0,
    usualHigh: 2000,
    reason: "a tyre's own damping is tens to hundreds of N·s/m",
  },
  damping: {
    kind: 'damping',
    what: 'damping coefficient',
    low: 10,
    high: 2e5,
    usualLow: 200,
    usualHigh: 40000,
    reason: "from a bicycle shock to a heavy truck's damper, at the shaft",
    hint: '"3200 N*s/m" or "18 lbf*s/in"',
  },
  kneeSpeed: {
    kind: 'velocity',
    what: 'knee speed',
    low: 0.002,
    high: 2,
    usualLow: 0.01,
    usualHigh: 0.5,
    reason: "a damper's low-speed circuit hands over between a few mm/s and a few m/s of shaft speed",
    hint: '"0.08 m/s"',
  },
  gasForce: {
    kind: 'force',
    what: 'gas force',
    low: 0,
    high: 10000,
    usualLow: 0,
    usualHigh: 2000,
    reason: 'a gas-charged damper pushes its shaft out with tens to a few thousand newtons',
  },
  bumpStopGap: {
    kind: 'length',
    what: 'bump-stop gap',
    low: 0,
    high: 0.3,
    usualLow: 0,
    usualHigh: 0.15,
    reason: 'room before the stop touches, at the damper: no damper has more than 300 mm of it',
    hint: '"30 mm"',
  },
  bumpStopRate: {
    kind: 'stiffness',
    what: 'bump-stop rate',
    low: 1e3,
    high: 5e7,
    usualLow: 1e4,
    usualHigh: 5e6,
    reason: 'from a soft foam stop to a solid rubber block',
    hint: '"250 N/mm"',
  },
  travel: {
    kind: 'length',
    what: 'travel',
    low: 0.001,
    high: 0.5,
    usualLow: 0.005,
    usualHigh: 0.3,
    reason: 'damper travel from static, from a millimetre to half a metre',
    hint: '"60 mm"',
  },
  topOutRate: {
    kind: 'stiffness',
    what: 'top-out rate',
    low: 1e3,
    high: 1e9,
    usualLow: 1e4,
    usualHigh: 1e8,
    reason: 'from a soft rebound spring to a hard elastomer',
  },
  rideHeight: {
    kind: 'length',
    what: 'ride height',
    low: 0,
    high: 1,
    usualLow: 0.01,
    usualHigh: 0.4,
    reason: "at the shop's own measuring point, from the ground up to a metre",
    hint: '"95 mm"',
  },
  tirePressureCold: {
    kind: 'pressure',
    what: 'cold tyre pressure',
    low: 20e3,
    high: 1e6,
    usualLow: 60e3,
    usualHigh: 400e3,
    reason: 'gauge pressure, from a low off-road tyre to a truck tyre',
    hint: '"1.6 bar" or "24 psi"',
  },
  camber: {
    kind: 'angle',
    what: 'camber',
    low: -15 * DEG,
    high: 15 * DEG,
    usualLow: -6 * DEG,
    usualHigh: 3 * DEG,
    reason: 'no wheel runs leaning more than 15° either way',
    hint: '"-2.5 deg"',
  },
  toeAngle: {
    kind: 'angle',
    what: 'toe',
    low: -5 * DEG,
    high: 5 * DEG,
    usualLow: -1 * DEG,
    usualHigh: 1 * DEG,
    reason: 'toe is set in tenths of a degree; 5° is a bent arm',
    hint: '"0.1 deg"',
  },
  toeLength: {
    kind: 'length',
    what: 'toe',
    low: -0.025,
    high: 0.025,
    usualLow: -0.006,
    usualHigh: 0.006,
    reason: 'toe at the rim is set in millimetres; 25 mm is a bent arm',
    hint: '"1.5 mm"',
  },
  fuelLoad: {
    kind: 'mass',
    what: 'fuel load',
    low: 0,
    high: 500,
    usualLow: 0,
    usualHigh: 150,
    reason: "from an empty tank to a long-distance racer's",
    hint: '"25 kg"',
  },
  eventSpeed: {
    kind: 'speed',
    what: 'speed',
    low: 0.5,
    high: 120,
    usualLow: 5 * KMH,
    usualHigh: 320 * KMH,
    reason: 'from walking pace to a top-speed run',
    hint: '"50 km/h"',
  },
  bumpHeight: {
    kind: 'length',
    what: 'height',
    low: 0.0005,
    high: 0.5,
    usualLow: 0.002,
    usualHigh: 0.15,
    reason: 'from a seam in the road to half a metre; higher is a wall, not a bump',
    hint: '"25 mm"',
  },
  bumpLength: {
    kind: 'length',
    what: 'length',
    low: 0.05,
    high: 100,
    usualLow: 0.15,
    usualHigh: 30,
    reason:
      "a tyre's contact patch is about 0.1 m long and bridges anything much shorter, which a point-contact model cannot follow; longer than 100 m it is a hill",
    hint: '"0.6 m"',
  },
} as const satisfies Record<string, PlausibleRange>;

export type PlausibleKey = keyof typeof PLAUSIBLE_RANGES;
