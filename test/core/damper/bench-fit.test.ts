import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { benchFit, benchPointsLessGas, benchZeroSpeedOffset } from '../../../core/damper/bench-fit';
import type { BenchPoints } from '../../../core/damper/bench-trace';

/**
 * An invented bilinear damper of our own (bump 3000/1000 N·s/m, rebound 6000/2000 N·s/m, knee
 * 0.06 m/s), compression positive, `n` speeds from −0.5 to 0.5 m/s, every reading carrying
 * `offset` newtons more (a gas force) and a ripple of `noise` newtons.
 */
function bilinearRun(n: number, offset = 0, noise = 0): BenchPoints {
  const velocity = new Float64Array(n);
  const force = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const v = -0.5 + (i + 0.5) / n;
    const s = Math.abs(v);
    const f =
      v > 0
        ? 3000 * Math.min(s, 0.06) + 1000 * Math.max(s - 0.06, 0)
        : -(6000 * Math.min(s, 0.06) + 2000 * Math.max(s - 0.06, 0));
    velocity[i] = v;
    force[i] = f + offset + noise * Math.sin(7 * i);
  }
  return { velocity, force };
}

describe('benchZeroSpeedOffset', () => {
  it('finds no offset in readings that pass through zero, digressive knee and all', () => {
    expect(benchZeroSpeedOffset(bilinearRun(81))).toBeNull();
    expect(benchZeroSpeedOffset(bilinearRun(81, 0, 5))).toBeNull();
  });

  it('finds the gas force a run’s readings carry, to a newton, noise and all', () => {
    // [calc] exact bilinear readings shifted by 150 N: the offset whose removal fits best is 150 N.
    expect(benchZeroSpeedOffset(bilinearRun(81, 150))).toBeCloseTo(150, 0);
    expect(benchZeroSpeedOffset(bilinearRun(81, -120))).toBeCloseTo(-120, 0);
    expect(Math.abs((benchZeroSpeedOffset(bilinearRun(81, 150, 5)) ?? 0) - 150)).toBeLessThan(5);
    // A dense run (a trace's many samples) is binned first and gives the same.
    expect(benchZeroSpeedOffset(bilinearRun(20_001, 150))).toBeCloseTo(150, 0);
  });

  it('reports nothing below 3 % of the largest force, or with too few points on a side', () => {
    // Largest reading 6000·0.06 + 2000·0.44 ≈ 1240 N: 3 % is about 37 N.
    expect(benchZeroSpeedOffset(bilinearRun(81, 20))).toBeNull();
    const bumpOnly = bilinearRun(81, 150);
    const half = { velocity: bumpOnly.velocity.slice(41), force: bumpOnly.force.slice(41) };
    expect(benchZeroSpeedOffset(half)).toBeNull();
  });

  it('recovers the bilinear curve once the gas force is taken off (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 50, max: 400 }), (gas) => {
        const fit = benchFit(benchPointsLessGas(bilinearRun(81, gas), gas));
        expect(fit.bump?.curve.lowSpeed).toBeCloseTo(3000, 0);
        expect(fit.rebound?.curve.lowSpeed).toBeCloseTo(6000, 0);
        expect(benchZeroSpeedOffset(benchPointsLessGas(bilinearRun(81, gas), gas))).toBeNull();
      }),
      { numRuns: 20 },
    );
  });
});
