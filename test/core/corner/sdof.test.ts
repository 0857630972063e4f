import { expm, matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { polynomialRoots } from '../../../core/numeric/polynomial';
import {
  sdofBaseTransmissibility,
  sdofCase,
  sdofDampingRatio,
  sdofFreeResponse,
  sdofLogDecrement,
  sdofNaturalFrequency,
  sdofStepOvershoot,
  type Sdof,
} from '../../../core/corner/sdof';
import { matrixExponential, matrixVector } from '../../../core/numeric/small-matrix';
import { linearStepMetrics } from '../../../core/corner/step-response';

/** Free response by the matrix exponential of the state form [x, v]′ = [[0, 1], [−k/m, −c/m]]·[x, v]. */
function byMatrixExponential(s: Sdof, x0: number, v0: number, t: number): number {
  const a = [
    [0, t],
    [(-s.stiffness / s.mass) * t, (-s.damping / s.mass) * t],
  ];
  return matrixVector(matrixExponential(a), [x0, v0])[0] as number;
}

/** The same with mathjs's expm, an independent implementation. */
function byMathjsExpm(s: Sdof, x0: number, v0: number, t: number): number {
  const e = expm(
    matrix([
      [0, t],
      [(-s.stiffness / s.mass) * t, (-s.damping / s.mass) * t],
    ]),
  ).toArray() as number[][];
  return (e[0]?.[0] as number) * x0 + (e[0]?.[1] as number) * v0;
}

const m = 2;
const k = 800; // ωn = 20 rad/s
const cCrit = 2 * Math.sqrt(k * m);

describe('SDOF m·x″ + c·x′ + k·x = 0 by the characteristic equation', () => {
  // Rao, Mechanical Vibrations, ch. 2 [pub; REFERENCES §1]: the three cases of m·λ² + c·λ + k = 0.
  const cases: [string, number, Sdof['damping'], number][] = [
    ['distinct real roots (overdamped)', 2.5, 2.5 * cCrit, 2],
    ['a repeated root (critically damped)', 1, cCrit, 1],
    ['a complex pair (underdamped)', 0.2, 0.2 * cCrit, 0],
  ];
  it.each(cases)('%s', (_name, zeta, c, realRoots) => {
    const s: Sdof = { mass: m, damping: c, stiffness: k };
    expect(sdofDampingRatio(s)).toBeCloseTo(zeta, 12);
    const roots = polynomialRoots([k, c, m]);
    expect(roots.filter((r) => r.im === 0)).toHaveLength(realRoots === 1 ? 2 : realRoots);
    if (realRoots === 1)
      expect(Math.abs((roots[0]?.re ?? 0) - (roots[1]?.re ?? 1))).toBeLessThan(
        1e-6 * sdofNaturalFrequency(s),
      );
    expect(sdofCase(s)).toBe(zeta > 1 ? 'overdamped' : zeta === 1 ? 'critically damped' : 'underdamped');
    const x = sdofFreeResponse(s, 0.03, -0.4);
    expect(x(0)).toBeCloseTo(0.03, 14);
    const h = 1e-6;
    expect((x(h) - x(-h)) / (2 * h)).toBeCloseTo(-0.4, 6); // x′(0) = v0
    for (const t of [0.01, 0.05, 0.1, 0.3, 0.7, 1.5]) {
      expect(x(t)).toBeCloseTo(byMatrixExponential(s, 0.03, -0.4, t), 12);
      expect(x(t)).toBeCloseTo(byMathjsExpm(s, 0.03, -0.4, t), 12);
      // It satisfies the equation: m·x″ + c·x′ + k·x = 0 (central differences).
      const d = 1e-4;
      const x1 = (x(t + d) - x(t - d)) / (2 * d);
      const x2 = (x(t + d) - 2 * x(t) + x(t - d)) / (d * d);
      expect(Math.abs(m * x2 + c * x1 + k * x(t))).toBeLessThan(1e-4 * k * 0.03);
    }
  });

  it('is simple harmonic motion at c = 0 and never decays', () => {
    const s: Sdof = { mass: m, damping: 0, stiffness: k };
    expect(sdofCase(s)).toBe('undamped');
    const x = sdofFreeResponse(s, 0.02, 0.3);
    const wn = sdofNaturalFrequency(s);
    const amplitude = Math.hypot(0.02, 0.3 / wn);
    const energy = (t: number) => {
      const d = 1e-6;
      const v = (x(t + d) - x(t - d)) / (2 * d);
      return 0.5 * m * v * v + 0.5 * k * x(t) ** 2;
    };
    const e0 = energy(0);
    for (let period = 0; period < 200; period += 37) {
      const t = (period * 2 * Math.PI) / wn;
      expect(x(t)).toBeCloseTo(0.02, 9);
      expect(energy(t + 0.013) / e0).toBeCloseTo(1, 6);
    }
    let peak = 0;
    for (let t = 0; t < 50; t += 1e-3) peak = Math.max(peak, Math.abs(x(t)));
    expect(peak).toBeCloseTo(amplitude, 5);
    expect(x(50)).toBeCloseTo(byMatrixExponential(s, 0.02, 0.3, 50), 9);
  });

  it('returns to rest fastest without overshoot when critically damped', () => {
    // REFERENCES §1 [pub: standard; common practice]
    const timeToRest = (zeta: number) => {
      const x = sdofFreeResponse({ mass: m, damping: zeta * cCrit, stiffness: k }, 1, 0);
      let last = 0;
      for (let t = 0; t < 5; t += 1e-4) if (Math.abs(x(t)) > 0.02) last = t;
      return last;
    };
    const crossesZero = (zeta: number) => {
      const x = sdofFreeResponse({ mass: m, damping: zeta * cCrit, stiffness: k }, 1, 0);
      for (let t = 0; t < 5; t += 1e-4) if (x(t) < -1e-9) return true;
      return false;
    };
    expect(crossesZero(1)).toBe(false);
    expect(crossesZero(1.5)).toBe(false);
    expect(crossesZero(0.9)).toBe(true);
    expect(timeToRest(1)).toBeLessThan(timeToRest(1.2));
    expect(timeToRest(1)).toBeLessThan(timeToRest(2));
  });

  it('decays by the logarithmic decrement δ = 2πζ/√(1−ζ²) a cycle', () => {
    // REFERENCES §1 [pub: standard]. Successive peaks found in the matrix-exponential solution.
    for (const zeta of [0.05, 0.2, 0.4]) {
      const s: Sdof = { mass: m, damping: zeta * cCrit, stiffness: k };
      const peaks: number[] = [];
      let prev = byMatrixExponential(s, 1, 0, 0);
      let rising = false;
      const dt = 1e-4;
      for (let t = dt; peaks.length < 3 && t < 10; t += dt) {
        const xt = byMatrixExponential(s, 1, 0, t);
        if (xt > prev) rising = true;
        else if (rising) {
          peaks.push(prev);
          rising = false;
        }
        prev = xt;
      }
      expect(Math.log((peaks[0] as number) / (peaks[1] as number))).toBeCloseTo(sdofLogDecrement(zeta), 3);
    }
  });
});

describe('step response of the standard second-order system', () => {
  const system = (zeta: number) => {
    const wn = 20;
    return {
      a: [
        [0, 1],
        [-wn * wn, -2 * zeta * wn],
      ],
      e0: [-1, 0],
      final: 1,
      output: 0,
      dt: (2 * Math.PI) / (40 * wn),
      window: 30 / (zeta * wn),
    };
  };

  it.each([
    // Mp = exp(−ζπ/√(1−ζ²)) [calc; REFERENCES §1]
    [0.1, 0.7292],
    [0.2, 0.5266],
    [0.3, 0.3723],
    [0.5, 0.163],
    [0.7, 0.046],
  ])('overshoots by Mp at ζ = %s (%s)', (zeta, mp) => {
    const r = linearStepMetrics(system(zeta));
    expect(r.overshoot).toBeCloseTo(mp, 4);
    expect(r.overshoot).toBeCloseTo(sdofStepOvershoot(zeta), 9);
    // Peak at π/ωd; a flat maximum pins its time only to about √ε.
    expect(r.peakTime).toBeCloseTo(Math.PI / (20 * Math.sqrt(1 - zeta * zeta)), 7);
  });

  it.each([0.1, 0.3, 0.6])('finds the exact 2-percent settling time at ζ = %s', (zeta) => {
    // Brute force on the closed form y = 1 − e^{−ζωn t}(cos ωd t + ζ/√(1−ζ²)·sin ωd t), sampled every 1 µs.
    const wn = 20;
    const wd = wn * Math.sqrt(1 - zeta * zeta);
    const y = (t: number) =>
      1 -
      Math.exp(-zeta * wn * t) * (Math.cos(wd * t) + (zeta / Math.sqrt(1 - zeta * zeta)) * Math.sin(wd * t));
    let last = 0;
    for (let t = 0; t < 3; t += 1e-6) if (Math.abs(y(t) - 1) > 0.02) last = t;
    const r = linearStepMetrics(system(zeta));
    expect(r.settled).toBe(true);
    expect(Math.abs(r.settlingTime - last)).toBeLessThan(2e-6);
    // The textbook rule ts ≈ 4/(ζωn) is an approximation [pub: control texts]: within 30 % here.
    expect(r.settlingTime / (4 / (zeta * wn))).toBeGreaterThan(0.7);
    expect(r.settlingTime / (4 / (zeta * wn))).toBeLessThan(1.3);
  });

  it('reports no overshoot when overdamped', () => {
    const r = linearStepMetrics(system(1.5));
    expect(r.overshoot).toBe(0);
    expect(r.settled).toBe(true);
  });
});

describe('sdofBaseTransmissibility', () => {
  it('is 1 at r = 0 and at r = √2, and falls above √2', () => {
    // REFERENCES §1 [calc]
    expect(sdofBaseTransmissibility(0, 0.3)).toBe(1);
    expect(sdofBaseTransmissibility(Math.SQRT2, 0.3)).toBeCloseTo(1, 12);
    expect(sdofBaseTransmissibility(3, 0.3)).toBeLessThan(1);
  });
});
