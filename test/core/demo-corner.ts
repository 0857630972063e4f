import type { CornerInput } from '../../core/corner/corner';

/**
 * The invented Millbrook club coupe #27, front left, as assets/demo/club-coupe-front-left.json
 * holds it, in SI: the corner the event tests start from.
 */
export const MILLBROOK_FRONT_LEFT: CornerInput = {
  cornerMass: 295,
  unsprungMass: 38,
  springRate: 70_000,
  springMotionRatio: 0.9,
  damperMotionRatio: 0.9,
  tireRate: 240_000,
  tireDamping: 0,
  damper: {
    bump: { kind: 'bilinear', lowSpeed: 3200, kneeSpeed: 0.08, highSpeed: 1100 },
    rebound: { kind: 'bilinear', lowSpeed: 5600, kneeSpeed: 0.08, highSpeed: 1900 },
  },
  bumpStop: { gap: 0.03, rate: 250_000 },
};
