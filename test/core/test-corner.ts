import type { CornerInput } from '../../core/corner/corner';

/** An invented, sound corner for the tests (not from any source); it raises no warning. */
export function testCorner(over: Partial<CornerInput> = {}): CornerInput {
  return {
    cornerMass: 300,
    unsprungMass: 40,
    springRate: 60_000,
    springMotionRatio: 0.8,
    damperMotionRatio: 0.8,
    tireRate: 250_000,
    tireDamping: 0,
    damper: {
      bump: { kind: 'bilinear', lowSpeed: 3000, kneeSpeed: 0.1, highSpeed: 1000 },
      rebound: { kind: 'bilinear', lowSpeed: 5000, kneeSpeed: 0.1, highSpeed: 1800 },
    },
    ...over,
  };
}
