import type { CornerInput } from '../../core/corner/corner';
import type { CornerPosition } from '../../core/setup/setup-sheet';

/**
 * The worked random-road case of REFERENCES §5 as a corner: ms 250 kg, mu 35 kg, ks 16 kN/m,
 * cs 1000 N·s/m (bump and rebound alike, so the linear model's mean is the same), kt 160 kN/m.
 */
export const WORKED_CORNER: CornerInput = {
  cornerMass: 285,
  unsprungMass: 35,
  springRate: 16_000,
  springMotionRatio: 1,
  damperMotionRatio: 1,
  tireRate: 160_000,
  tireDamping: 0,
  damper: { bump: { kind: 'linear', coefficient: 1000 }, rebound: { kind: 'linear', coefficient: 1000 } },
};

/** The same corner at all four positions. */
export const fourOf = (c: CornerInput): Record<CornerPosition, CornerInput> => ({
  FL: c,
  FR: c,
  RL: c,
  RR: c,
});
