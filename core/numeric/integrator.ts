import { scalarMaximum } from './scalar-maximum';

/**
 * A system of ordinary differential equations y′ = f(t, y) that may switch between smooth
 * modes (a tyre in contact or in the air, a bump stop touching or not, a damper below or above
 * its knee). Within a mode f must be smooth — evaluated by that mode's formula even slightly
 * past the mode's boundary — so that each step sees a smooth right-hand side and the error
 * control means what it says; the integrator finds where the mode ends and switches there.
 *
 * - `switches` writes one value per mode boundary, each positive while the mode holds; when
 *   one turns negative within a step, the crossing is located on the step's dense output and
 *   `switchCross` is told, at the first state past it.
 * - `switchRates` writes their time derivatives, given y′: with them a value that dips below
 *   zero and comes back within one step is caught too (a cubic Hermite of the value over the
 *   step predicts the dip; the dense output confirms it), so that a brief lift-off is found
 *   whatever the step size.
 * - `nextStop` gives the next time at which the mode changes by time alone (a road kink at a
 *   known distance): steps land on it exactly and `stopReach` is told.
 */
export type OdeSystem = {
  readonly dimension: number;
  readonly switchCount: number;
  derivative(t: number, y: Float64Array, dydt: Float64Array): void;
  switches(t: number, y: Float64Array, g: Float64Array): void;
  switchRates(t: number, y: Float64Array, dydt: Float64Array, rates: Float64Array): void;
  switchCross(index: number, t: number, y: Float64Array): void;
  /** The next stop after `t` (> t), or Infinity. */
  nextStop(t: number): number;
  stopReach(t: number, y: Float64Array): void;
};

/** A smooth system, y′ = f(t, y), with no modes. */
export function odeSystemSmooth(
  dimension: number,
  derivative: (t: number, y: Float64Array, dydt: Float64Array) => void,
): OdeSystem {
  return {
    dimension,
    switchCount: 0,
    derivative,
    switches: () => {},
    switchRates: () => {},
    switchCross: () => {},
    nextStop: () => Infinity,
    stopReach: () => {},
  };
}

export type OdeOptions = {
  /** Relative tolerance of each step's local error (default 1e-6). */
  relTol?: number;
  /** Absolute tolerance, one for all components or one each (default: relTol). */
  absTol?: number | ArrayLike<number>;
  /** First step (s); estimated from the derivatives when not given. */
  initialStep?: number;
  /** Largest step (s); the whole interval when not given. */
  maxStep?: number;
  /** Accepted plus rejected steps before giving up (default 200 000). */
  maxSteps?: number;
  /**
   * Dead band of each switch value (default 0): a crossing counts only once the value passes
   * −deadBand, though it is still located where the value is zero. Set it from the absolute
   * tolerances, so that motion below them — integration noise — cannot make a mode chatter.
   */
  switchDeadBand?: number | ArrayLike<number>;
};

/** What an integration did. */
export type OdeStats = {
  /** Accepted steps (a step cut short at a mode switch counts as one). */
  steps: number;
  rejected: number;
  /** Evaluations of the derivative. */
  evaluations: number;
  /** Mode switches located. */
  switches: number;
};

export type OdeResult = OdeStats & { t: number; y: Float64Array };

// Dormand & Prince (1980), "A family of embedded Runge–Kutta formulae", J. Comp. Appl. Math. 6;
// coefficients and dense output as in Hairer, Nørsett & Wanner, Solving ODEs I, §II.5–6 (DOPRI5).
const C2 = 1 / 5;
const C3 = 3 / 10;
const C4 = 4 / 5;
const C5 = 8 / 9;
const A21 = 1 / 5;
const A31 = 3 / 40;
const A32 = 9 / 40;
const A41 = 44 / 45;
const A42 = -56 / 15;
const A43 = 32 / 9;
const A51 = 19372 / 6561;
const A52 = -25360 / 2187;
const A53 = 64448 / 6561;
const A54 = -212 / 729;
const A61 = 9017 / 3168;
const A62 = -355 / 33;
const A63 = 46732 / 5247;
const A64 = 49 / 176;
const A65 = -5103 / 18656;
const A71 = 35 / 384;
const A73 = 500 / 1113;
const A74 = 125 / 192;
const A75 = -2187 / 6784;
const A76 = 11 / 84;
const E1 = 71 / 57600;
const E3 = -71 / 16695;
const E4 = 71 / 1920;
const E5 = -17253 / 339200;
const E6 = 22 / 525;
const E7 = -1 / 40;
const D1 = -12715105075 / 11282082432;
const D3 = 87487479700 / 32700410799;
const D4 = -10690763975 / 1880347072;
const D5 = 701980252875 / 199316789632;
const D6 = -1453857185 / 822651844;
const D7 = 69997945 / 29380423;

/**
 * One accepted step [t0, t1] and its continuous extension: the fourth-order dense output of
 * Dormand–Prince, y(t0 + θh) = r1 + θ(r2 + (1−θ)(r3 + θ(r4 + (1−θ)·r5))). It is valid on
 * [t0, t1]; when a step is cut short at a mode switch, t1 is the switch and h the full step.
 */
export class DenseStep {
  t0 = 0;
  t1 = 0;
  h = 0;
  readonly r1: Float64Array;
  readonly r2: Float64Array;
  readonly r3: Float64Array;
  readonly r4: Float64Array;
  readonly r5: Float64Array;

  constructor(dimension: number) {
    this.r1 = new Float64Array(dimension);
    this.r2 = new Float64Array(dimension);
    this.r3 = new Float64Array(dimension);
    this.r4 = new Float64Array(dimension);
    this.r5 = new Float64Array(dimension);
  }

  /** The state at time t (t0 ≤ t ≤ t1) into `out`. */
  at(t: number, out: Float64Array): void {
    const theta = (t - this.t0) / this.h;
    const theta1 = 1 - theta;
    const n = out.length;
    for (let i = 0; i < n; i++) {
      out[i] =
        (this.r1[i] as number) +
        theta *
          ((this.r2[i] as number) +
            theta1 *
              ((this.r3[i] as number) + theta * ((this.r4[i] as number) + theta1 * (this.r5[i] as number))));
    }
  }

  /** Copies another step (to keep the previous step while the next is taken). */
  copyFrom(other: DenseStep): void {
    this.t0 = other.t0;
    this.t1 = other.t1;
    this.h = other.h;
    this.r1.set(other.r1);
    this.r2.set(other.r2);
    this.r3.set(other.r3);
    this.r4.set(other.r4);
    this.r5.set(other.r5);
  }
}

/** Called after each accepted step with its dense output, before the mode changes. */
export type OdeObserver = (step: DenseStep) => void;

// Step-size control of DOPRI5 (Hairer et al.): safety 0.9, growth within [0.2, 10] per step,
// and a PI controller (β = 0.04) that keeps the step steady where stability, not accuracy,
// limits it — the long settle after an event.
const SAFETY = 0.9;
const FAC_MIN = 0.2;
const FAC_MAX = 10;
const BETA = 0.04;
const EXPO = 0.2 - BETA * 0.75;

/**
 * Integrates `system` from (t0, y0) to tEnd by the adaptive Dormand–Prince 5(4) pair with
 * local extrapolation, error control per component (|err_i| ≤ atol_i + rtol·|y_i|, RMS norm),
 * FSAL, dense output, exact landing on time stops and location of mode switches on the dense
 * output (regula falsi, Illinois variant, to 1e-9 of the step). `observer` sees every
 * accepted step. Nothing is allocated per step.
 * @throws Error when the step count passes `maxSteps` or the step size underflows.
 */
export function odeIntegrate(
  system: OdeSystem,
  t0: number,
  y0: ArrayLike<number>,
  tEnd: number,
  options: OdeOptions = {},
  observer?: OdeObserver,
): OdeResult {
  const n = system.dimension;
  const m = system.switchCount;
  const relTol = options.relTol ?? 1e-6;
  const absTol = new Float64Array(n);
  const at = options.absTol ?? relTol;
  for (let i = 0; i < n; i++) absTol[i] = typeof at === 'number' ? at : (at[i] as number);
  const maxSteps = options.maxSteps ?? 200_000;
  const deadBand = new Float64Array(system.switchCount);
  const db = options.switchDeadBand ?? 0;
  for (let j = 0; j < deadBand.length; j++) deadBand[j] = typeof db === 'number' ? db : (db[j] as number);
  const hMax = Math.min(options.maxStep ?? Infinity, tEnd - t0);

  const y = Float64Array.from(y0);
  const y1 = new Float64Array(n);
  const ys = new Float64Array(n);
  const k1 = new Float64Array(n);
  const k2 = new Float64Array(n);
  const k3 = new Float64Array(n);
  const k4 = new Float64Array(n);
  const k5 = new Float64Array(n);
  const k6 = new Float64Array(n);
  const k7 = new Float64Array(n);
  const g0 = new Float64Array(m);
  const g1 = new Float64Array(m);
  const gt = new Float64Array(m);
  const r0 = new Float64Array(m);
  const r1 = new Float64Array(m);
  const yt = new Float64Array(n);
  const dense = new DenseStep(n);
  const stats: OdeStats = { steps: 0, rejected: 0, evaluations: 0, switches: 0 };

  let t = t0;
  system.derivative(t, y, k1);
  stats.evaluations++;
  if (m > 0) {
    system.switches(t, y, g0);
    system.switchRates(t, y, k1, r0);
  }
  let h = options.initialStep ?? initialStepOf(system, t, y, k1, hMax, absTol, relTol, ys, k2, stats);
  h = Math.min(h, hMax);
  let stop = Math.min(system.nextStop(t), tEnd);
  let facOld = 1e-4;
  let lastRejected = false;
  // Switches that land at the very start of a step, one after another: a mode that cannot hold.
  let switchesInPlace = 0;

  while (t < tEnd) {
    if (stats.steps + stats.rejected >= maxSteps) {
      throw new Error(`odeIntegrate: more than ${maxSteps} steps before t = ${tEnd} (at t = ${t})`);
    }
    let landing = false;
    // Stretch a step that would leave a sliver before the stop, rather than take a tiny one.
    if (t + 1.01 * h >= stop) {
      h = stop - t;
      landing = true;
    }
    if (!(h > Math.abs(t) * 1e-15)) throw new Error(`odeIntegrate: step size underflow at t = ${t}`);

    for (let i = 0; i < n; i++) ys[i] = (y[i] as number) + h * A21 * (k1[i] as number);
    system.derivative(t + C2 * h, ys, k2);
    for (let i = 0; i < n; i++) {
      ys[i] = (y[i] as number) + h * (A31 * (k1[i] as number) + A32 * (k2[i] as number));
    }
    system.derivative(t + C3 * h, ys, k3);
    for (let i = 0; i < n; i++) {
      ys[i] =
        (y[i] as number) + h * (A41 * (k1[i] as number) + A42 * (k2[i] as number) + A43 * (k3[i] as number));
    }
    system.derivative(t + C4 * h, ys, k4);
    for (let i = 0; i < n; i++) {
      ys[i] =
        (y[i] as number) +
        h *
          (A51 * (k1[i] as number) +
            A52 * (k2[i] as number) +
            A53 * (k3[i] as number) +
            A54 * (k4[i] as number));
    }
    system.derivative(t + C5 * h, ys, k5);
    for (let i = 0; i < n; i++) {
      ys[i] =
        (y[i] as number) +
        h *
          (A61 * (k1[i] as number) +
            A62 * (k2[i] as number) +
            A63 * (k3[i] as number) +
            A64 * (k4[i] as number) +
            A65 * (k5[i] as number));
    }
    const tNew = landing ? stop : t + h;
    system.derivative(tNew, ys, k6);
    for (let i = 0; i < n; i++) {
      y1[i] =
        (y[i] as number) +
        h *
          (A71 * (k1[i] as number) +
            A73 * (k3[i] as number) +
            A74 * (k4[i] as number) +
            A75 * (k5[i] as number) +
            A76 * (k6[i] as number));
    }
    system.derivative(tNew, y1, k7);
    stats.evaluations += 6;

    let err = 0;
    for (let i = 0; i < n; i++) {
      const yi = Math.abs(y[i] as number);
      const y1i = Math.abs(y1[i] as number);
      const sk = (absTol[i] as number) + relTol * (yi > y1i ? yi : y1i);
      const e =
        (h *
          (E1 * (k1[i] as number) +
            E3 * (k3[i] as number) +
            E4 * (k4[i] as number) +
            E5 * (k5[i] as number) +
            E6 * (k6[i] as number) +
            E7 * (k7[i] as number))) /
        sk;
      err += e * e;
    }
    err = Math.sqrt(err / n);

    const fac11 = Math.pow(err, EXPO);
    if (!(err <= 1)) {
      // Rejected (NaN included): shrink and retry from the same point.
      stats.rejected++;
      h /= Math.min(1 / FAC_MIN, fac11 / SAFETY);
      lastRejected = true;
      continue;
    }
    let fac = fac11 / Math.pow(facOld, BETA);
    fac = Math.max(1 / FAC_MAX, Math.min(1 / FAC_MIN, fac / SAFETY));
    let hNew = h / fac;
    facOld = Math.max(err, 1e-4);
    if (lastRejected) hNew = Math.min(hNew, h);
    lastRejected = false;
    stats.steps++;

    dense.t0 = t;
    dense.t1 = tNew;
    dense.h = h;
    for (let i = 0; i < n; i++) {
      const ydiff = (y1[i] as number) - (y[i] as number);
      const bspl = h * (k1[i] as number) - ydiff;
      dense.r1[i] = y[i] as number;
      dense.r2[i] = ydiff;
      dense.r3[i] = bspl;
      dense.r4[i] = ydiff - h * (k7[i] as number) - bspl;
      dense.r5[i] =
        h *
        (D1 * (k1[i] as number) +
          D3 * (k3[i] as number) +
          D4 * (k4[i] as number) +
          D5 * (k5[i] as number) +
          D6 * (k6[i] as number) +
          D7 * (k7[i] as number));
    }

    let crossing = -1;
    let tCross = tNew;
    if (m > 0) {
      system.switches(tNew, y1, g1);
      system.switchRates(tNew, y1, k7, r1);
      for (let j = 0; j < m; j++) {
        const ga = g0[j] as number;
        const band = deadBand[j] as number;
        let b = tNew;
        let gb = g1[j] as number;
        if (!(gb < -band)) {
          // Not past the band at the end: a dip in between only if it falls and then rises.
          if (!(ga > 0 && gb > 0 && (r0[j] as number) < 0 && (r1[j] as number) > 0)) continue;
          b = switchDip(system, dense, j, t, ga, r0[j] as number, tNew, gb, r1[j] as number, band, yt, gt);
          if (b < 0) continue;
          gb = gt[j] as number;
        }
        const tj = switchLocate(system, dense, j, t, ga, b, gb, yt, gt);
        if (tj < tCross || crossing < 0) {
          tCross = tj;
          crossing = j;
        }
      }
    }

    if (crossing >= 0) {
      dense.t1 = tCross;
      dense.at(tCross, y);
      if (tCross > t) {
        switchesInPlace = 0;
        if (observer) observer(dense);
      } else if (++switchesInPlace > 8) {
        throw new Error(`odeIntegrate: the mode keeps switching in place at t = ${t} (switch ${crossing})`);
      }
      t = tCross;
      system.switchCross(crossing, t, y);
      stats.switches++;
      system.derivative(t, y, k1);
      stats.evaluations++;
      system.switches(t, y, g0);
      system.switchRates(t, y, k1, r0);
      stop = Math.min(system.nextStop(t), tEnd);
      h = Math.min(hNew, hMax);
      continue;
    }

    switchesInPlace = 0;
    if (observer) observer(dense);
    t = tNew;
    y.set(y1);
    if (landing && t < tEnd) {
      system.stopReach(t, y);
      system.derivative(t, y, k1);
      stats.evaluations++;
      if (m > 0) {
        system.switches(t, y, g0);
        system.switchRates(t, y, k1, r0);
      }
      stop = Math.min(system.nextStop(t), tEnd);
      if (!(stop > t)) throw new Error(`odeIntegrate: the next stop (${stop}) is not after t = ${t}`);
    } else {
      k1.set(k7);
      if (m > 0) {
        g0.set(g1);
        r0.set(r1);
      }
    }
    h = Math.min(hNew, hMax);
  }
  return { ...stats, t, y };
}

/**
 * Where switch j crosses zero between (a, ga ≥ 0) and (b, gb < 0), on the dense output: regula
 * falsi with the Illinois halving, to 1e-9 of the step. Returns the first time past the
 * crossing (g < 0 there), so the new mode starts strictly inside its own region.
 */
function switchLocate(
  system: OdeSystem,
  dense: DenseStep,
  j: number,
  a: number,
  ga: number,
  b: number,
  gb: number,
  yt: Float64Array,
  gt: Float64Array,
): number {
  // At a restart the switch values are positive by construction; a value at or below zero
  // means the mode was left at once: switch at the start.
  if (!(ga > 0)) return a;
  const tol = Math.max(1e-9 * (b - a), 4e-16 * Math.abs(b));
  let side = 0;
  for (let iter = 0; iter < 100 && b - a > tol; iter++) {
    let c = b - (gb * (b - a)) / (gb - ga);
    // Keep the trial strictly inside, and bisect when falsi stalls at an end.
    if (!(c > a && c < b)) c = 0.5 * (a + b);
    dense.at(c, yt);
    system.switches(c, yt, gt);
    const gc = gt[j] as number;
    if (gc < 0) {
      b = c;
      gb = gc;
      if (side === -1) ga *= 0.5;
      side = -1;
    } else {
      a = c;
      ga = gc;
      if (side === 1) gb *= 0.5;
      side = 1;
    }
  }
  return b;
}

/**
 * A switch value positive at both ends of a step, falling at the start and rising at the end:
 * the cubic Hermite through its values and rates predicts its minimum; when that is near or
 * below zero, the dense output is consulted there, then searched (Brent) for a value past
 * −band. Returns a time in (a, b] where it is (value left in gt), or −1 when there is none.
 */
function switchDip(
  system: OdeSystem,
  dense: DenseStep,
  j: number,
  a: number,
  ga: number,
  ra: number,
  b: number,
  gb: number,
  rb: number,
  band: number,
  yt: Float64Array,
  gt: Float64Array,
): number {
  const h = b - a;
  const d0 = h * ra;
  const d1 = h * rb;
  // p(θ) = ga + d0·θ + c2·θ² + c3·θ³; p′ rises through zero once in (0, 1).
  const c2 = 3 * (gb - ga) - 2 * d0 - d1;
  const c3 = 2 * (ga - gb) + d0 + d1;
  const qa = 3 * c3;
  const qb = 2 * c2;
  let theta: number;
  if (Math.abs(qa) < 1e-12 * (Math.abs(qb) + Math.abs(d0))) theta = -d0 / qb;
  else theta = (-qb + Math.sqrt(Math.max(0, qb * qb - 4 * qa * d0))) / (2 * qa);
  if (!(theta > 0 && theta < 1)) theta = 0.5;
  const predicted = ga + theta * (d0 + theta * (c2 + theta * c3));
  if (!(predicted < 0.05 * Math.min(ga, gb))) return -1;
  const valueAt = (t: number) => {
    dense.at(t, yt);
    system.switches(t, yt, gt);
    return gt[j] as number;
  };
  let tm = a + theta * h;
  if (!(valueAt(tm) < -band)) {
    tm = scalarMaximum((t) => -valueAt(t), a, b, tm, 1e-6 * h).x;
    if (!(valueAt(tm) < -band)) return -1;
  }
  return tm;
}

/** Hairer's starting step: from the sizes of y and f, refined by one Euler step's change in f. */
function initialStepOf(
  system: OdeSystem,
  t: number,
  y: Float64Array,
  f0: Float64Array,
  hMax: number,
  absTol: Float64Array,
  relTol: number,
  ytmp: Float64Array,
  f1: Float64Array,
  stats: OdeStats,
): number {
  const n = y.length;
  let dnf = 0;
  let dny = 0;
  for (let i = 0; i < n; i++) {
    const sk = (absTol[i] as number) + relTol * Math.abs(y[i] as number);
    dnf += ((f0[i] as number) / sk) ** 2;
    dny += ((y[i] as number) / sk) ** 2;
  }
  let h = dnf <= 1e-10 || dny <= 1e-10 ? 1e-6 : Math.sqrt(dny / dnf) * 0.01;
  h = Math.min(h, hMax);
  for (let i = 0; i < n; i++) ytmp[i] = (y[i] as number) + h * (f0[i] as number);
  system.derivative(t + h, ytmp, f1);
  stats.evaluations++;
  let der2 = 0;
  for (let i = 0; i < n; i++) {
    const sk = (absTol[i] as number) + relTol * Math.abs(y[i] as number);
    der2 += (((f1[i] as number) - (f0[i] as number)) / sk) ** 2;
  }
  der2 = Math.sqrt(der2) / h;
  const der12 = Math.max(der2, Math.sqrt(dnf));
  const h1 = der12 <= 1e-15 ? Math.max(1e-6, h * 1e-3) : Math.pow(0.01 / der12, 1 / 5);
  return Math.min(100 * h, h1, hMax);
}

/**
 * The classical fourth-order Runge–Kutta method with `steps` equal steps — a second, simpler
 * method for checking the adaptive one. Modes switch and stops are passed at step ends only
 * (no location), so it is meant for smooth systems.
 */
export function odeIntegrateRk4(
  system: OdeSystem,
  t0: number,
  y0: ArrayLike<number>,
  tEnd: number,
  steps: number,
): { t: number; y: Float64Array } {
  const n = system.dimension;
  const m = system.switchCount;
  const y = Float64Array.from(y0);
  const ys = new Float64Array(n);
  const k1 = new Float64Array(n);
  const k2 = new Float64Array(n);
  const k3 = new Float64Array(n);
  const k4 = new Float64Array(n);
  const g = new Float64Array(m);
  const h = (tEnd - t0) / steps;
  for (let s = 0; s < steps; s++) {
    const t = t0 + s * h;
    system.derivative(t, y, k1);
    for (let i = 0; i < n; i++) ys[i] = (y[i] as number) + 0.5 * h * (k1[i] as number);
    system.derivative(t + 0.5 * h, ys, k2);
    for (let i = 0; i < n; i++) ys[i] = (y[i] as number) + 0.5 * h * (k2[i] as number);
    system.derivative(t + 0.5 * h, ys, k3);
    for (let i = 0; i < n; i++) ys[i] = (y[i] as number) + h * (k3[i] as number);
    system.derivative(t + h, ys, k4);
    for (let i = 0; i < n; i++) {
      y[i] =
        (y[i] as number) +
        (h / 6) * ((k1[i] as number) + 2 * (k2[i] as number) + 2 * (k3[i] as number) + (k4[i] as number));
    }
    if (m > 0) {
      system.switches(t + h, y, g);
      for (let j = 0; j < m; j++) if ((g[j] as number) < 0) system.switchCross(j, t + h, y);
    }
    while (system.nextStop(t) <= t + h) system.stopReach(t + h, y);
  }
  return { t: tEnd, y };
}
