import { expm, matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import type { QuarterCarLinear } from '../../../core/corner/corner';
import { quarterCarStateMatrix } from '../../../core/corner/modal';
import { STEP_HEIGHT, stepResponseHistory, stepResponseLinear } from '../../../core/corner/step-response';

/** An invented club-racer corner. */
const CORNER: QuarterCarLinear = {
  sprungMass: 257,
  unsprungMass: 38,
  wheelRate: 56_700,
  wheelDamping: 3564,
  tireRate: 240_000,
  tireDamping: 0,
};

/** Independent reference: march e^{A·dt} from mathjs expm on a fine 10 µs grid and read peak and settling off it. */
function bruteForceStep(q: QuarterCarLinear, duration: number) {
  const dt = 1e-5;
  const a = quarterCarStateMatrix(q).map((r) => r.map((x) => x * dt));
  const phi = expm(matrix(a)).toArray() as number[][];
  const h = STEP_HEIGHT;
  let e = [-h, -h, 0, (q.tireDamping * h) / q.unsprungMass];
  let peak = -Infinity;
  let lastOutside = 0;
  for (let i = 0; i * dt <= duration; i++) {
    const zs = h + (e[0] as number);
    peak = Math.max(peak, zs);
    if (Math.abs(zs / h - 1) > 0.02) lastOutside = i * dt;
    e = phi.map((row) => row.reduce((s, x, j) => s + x * (e[j] as number), 0));
  }
  return { overshoot: Math.max(0, peak / h - 1), settlingTime: lastOutside };
}

describe('stepResponseLinear', () => {
  it('agrees with a brute-force march of mathjs expm', () => {
    const ours = stepResponseLinear(CORNER);
    const ref = bruteForceStep(CORNER, 3);
    expect(ours.overshoot).toBeCloseTo(ref.overshoot, 6);
    expect(Math.abs(ours.settlingTime - ref.settlingTime)).toBeLessThan(2e-5);
    expect(ours.settled).toBe(true);
  });

  it('agrees with the brute force when the tyre has damping (the step is an impulse through it)', () => {
    const q = { ...CORNER, tireDamping: 400 };
    const ours = stepResponseLinear(q);
    const ref = bruteForceStep(q, 3);
    expect(ours.overshoot).toBeCloseTo(ref.overshoot, 6);
    expect(Math.abs(ours.settlingTime - ref.settlingTime)).toBeLessThan(2e-5);
  });

  it('overshoots less and settles sooner with more damping, up to a point', () => {
    const soft = stepResponseLinear({ ...CORNER, wheelDamping: 1500 });
    const firm = stepResponseLinear({ ...CORNER, wheelDamping: 4500 });
    expect(firm.overshoot).toBeLessThan(soft.overshoot);
    expect(firm.settlingTime).toBeLessThan(soft.settlingTime);
  });

  it('starts at rest: the history begins at zero with no body acceleration, ends on the step', () => {
    const h = stepResponseHistory(CORNER, 3, 3001);
    expect(h.bodyDisplacement[0]).toBe(0);
    expect(h.bodyAccel[0]).toBeCloseTo(0, 12); // zs″(0⁺) = 0 [calc; REFERENCES §4]
    expect(h.tireLoad[0]).toBeCloseTo(CORNER.tireRate * STEP_HEIGHT, 9); // zu″(0⁺) = kt·h/mu: the tyre takes the whole step first
    expect(h.bodyDisplacement[3000]).toBeCloseTo(STEP_HEIGHT, 6);
    expect(h.travel[3000]).toBeCloseTo(0, 6);
  });
});
