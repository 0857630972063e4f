import type { QuarterCarLinear } from './corner';
import { modesOf, quarterCarStateMatrix } from './modal';
import { matrixExponential, matrixScale, matrixVector, type Matrix } from '../numeric/small-matrix';

/** Height of the standard road step (m), DESIGN.md. */
export const STEP_HEIGHT = 0.01;

/** Settling band: the body is settled once zs/h stays within 1 ± this. */
export const SETTLING_BAND = 0.02;

export type StepResponse = {
  /** max(zs)/h − 1, or 0 when the body never passes the step height. */
  overshoot: number;
  /** Time of the highest output (s); the end of the window when it only rises. */
  peakTime: number;
  /** Last time zs/h is outside 1 ± SETTLING_BAND (s). */
  settlingTime: number;
  /** False only when the output has not settled by the end of the window (nearly no damping). */
  settled: boolean;
};

/**
 * A linear system's response to a step, as deviation from its final state: ė = A·e from e(0⁺),
 * output = final + e[output]. `dt` is the sampling step and `window` the time to look over.
 */
export type LinearStepSystem = {
  a: Matrix;
  e0: number[];
  final: number;
  output: number;
  dt: number;
  window: number;
};

/**
 * The sampling a quarter car's step needs, from its eigenvalues: 40 samples in the fastest
 * period, and a window of 15 time constants of the slowest decay (e^−15 ≈ 3·10⁻⁷ of its
 * amplitude left), capped at 120 s.
 */
function quarterCarStep(q: QuarterCarLinear, height: number): LinearStepSystem {
  let fastest = 0;
  let slowestDecay = Infinity;
  for (const l of modesOf(q).eigenvalues) {
    fastest = Math.max(fastest, Math.hypot(l.re, l.im));
    slowestDecay = Math.min(slowestDecay, -l.re);
  }
  return {
    a: quarterCarStateMatrix(q),
    // An ideal step through the tyre's damping is an impulse: the wheel starts at ct·h/mu.
    e0: [-height, -height, 0, (q.tireDamping * height) / q.unsprungMass],
    final: height,
    output: 0,
    dt: (2 * Math.PI) / (40 * fastest),
    window: Math.min(120, slowestDecay > 0 ? 15 / slowestDecay : 120),
  };
}

/**
 * Overshoot and settling of a linear system's step response, exactly: e(t) = e^{At}·e(0⁺),
 * marched with e^{A·dt} and refined between samples by golden-section search (peak) and
 * bisection (settling). Overshoot is max(y)/y∞ − 1 (0 if none); settling time is the last
 * time y/y∞ is outside 1 ± `band`.
 */
export function linearStepMetrics(sys: LinearStepSystem, band = SETTLING_BAND): StepResponse {
  const steps = Math.min(400_000, Math.ceil(sys.window / sys.dt));
  const dt = sys.dt;
  const outputAt = (from: number[], tau: number) =>
    sys.final + (matrixVector(matrixExponential(matrixScale(sys.a, tau)), from)[sys.output] as number);
  const phi = matrixExponential(matrixScale(sys.a, dt));
  let e = sys.e0.slice();
  let prev = e;
  let peak = -Infinity;
  let peakIndex = 0;
  let peakFrom = e;
  let lastOutside = 0;
  let lastOutsideFrom = e;
  for (let k = 0; k <= steps; k++) {
    const y = sys.final + (e[sys.output] as number);
    if (y > peak) {
      peak = y;
      peakIndex = k;
      peakFrom = k > 0 ? prev : e;
    }
    if (Math.abs(y / sys.final - 1) > band) {
      lastOutside = k;
      lastOutsideFrom = e;
    }
    prev = e;
    e = matrixVector(phi, e);
  }
  let peakTime = peakIndex * dt;
  if (peakIndex > 0 && peakIndex < steps) {
    // Golden-section search over the two sample intervals around the best sample.
    const g = (Math.sqrt(5) - 1) / 2;
    let lo = 0;
    let hi = 2 * dt;
    let x1 = hi - g * (hi - lo);
    let x2 = lo + g * (hi - lo);
    let f1 = outputAt(peakFrom, x1);
    let f2 = outputAt(peakFrom, x2);
    for (let i = 0; i < 80 && hi - lo > 1e-12 * dt; i++) {
      if (f1 < f2) {
        lo = x1;
        x1 = x2;
        f1 = f2;
        x2 = lo + g * (hi - lo);
        f2 = outputAt(peakFrom, x2);
      } else {
        hi = x2;
        x2 = x1;
        f2 = f1;
        x1 = hi - g * (hi - lo);
        f1 = outputAt(peakFrom, x1);
      }
    }
    const tau = (lo + hi) / 2;
    const refined = outputAt(peakFrom, tau);
    if (refined > peak) {
      peak = refined;
      peakTime = (peakIndex - 1) * dt + tau;
    }
  }
  const settled = lastOutside < steps;
  let settlingTime = lastOutside * dt;
  if (settled) {
    // The band crossing lies inside the interval after the last sample outside it.
    const outside = (tau: number) => Math.abs(outputAt(lastOutsideFrom, tau) / sys.final - 1) > band;
    let lo = 0;
    let hi = dt;
    for (let i = 0; i < 60; i++) {
      const mid = (lo + hi) / 2;
      if (outside(mid)) lo = mid;
      else hi = mid;
    }
    settlingTime += (lo + hi) / 2;
  }
  return { overshoot: Math.max(0, peak / sys.final - 1), peakTime, settlingTime, settled };
}

/**
 * Response of the linear quarter car to a road step of `height` (m) from rest (DESIGN.md):
 * overshoot max(zs)/h − 1 (0 if none) and the 2 % settling time, the last time zs/h is
 * outside 1 ± 0.02.
 */
export function stepResponseLinear(q: QuarterCarLinear, height = STEP_HEIGHT): StepResponse {
  return linearStepMetrics(quarterCarStep(q, height));
}

/** Sampled step response for plots, SI: displacements from the start, tyre load is the dynamic part. */
export type StepHistory = {
  time: Float64Array;
  bodyDisplacement: Float64Array;
  wheelDisplacement: Float64Array;
  bodyAccel: Float64Array;
  travel: Float64Array;
  tireLoad: Float64Array;
};

/** The linear step response sampled at `samples` points over `duration` seconds. */
export function stepResponseHistory(
  q: QuarterCarLinear,
  duration: number,
  samples: number,
  height = STEP_HEIGHT,
): StepHistory {
  const s = quarterCarStep(q, height);
  const dt = duration / (samples - 1);
  const phi = matrixExponential(matrixScale(s.a, dt));
  const out: StepHistory = {
    time: new Float64Array(samples),
    bodyDisplacement: new Float64Array(samples),
    wheelDisplacement: new Float64Array(samples),
    bodyAccel: new Float64Array(samples),
    travel: new Float64Array(samples),
    tireLoad: new Float64Array(samples),
  };
  const accelRow = s.a[2] as number[];
  let e = s.e0.slice();
  for (let k = 0; k < samples; k++) {
    const zs = height + (e[0] as number);
    const zu = height + (e[1] as number);
    out.time[k] = k * dt;
    out.bodyDisplacement[k] = zs;
    out.wheelDisplacement[k] = zu;
    // Body acceleration from the deviation: the road term enters only the wheel's row.
    out.bodyAccel[k] = accelRow.reduce((sum, aij, j) => sum + aij * (e[j] as number), 0);
    out.travel[k] = zu - zs;
    out.tireLoad[k] = q.tireRate * (height - zu) - q.tireDamping * (e[3] as number);
    e = matrixVector(phi, e);
  }
  return out;
}
