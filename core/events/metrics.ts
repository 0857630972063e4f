import { DenseStep } from '../numeric/integrator';
import { scalarMaximum } from '../numeric/scalar-maximum';
import { OUTPUT, OUTPUT_COUNT, type QuarterCarEventModel } from './quarter-car-model';

/** What an event did to the corner, SI, over the event window. */
export type EventMetrics = {
  /** max |z̈s| (m/s²). */
  peakBodyAccel: number;
  /** When it happened (s). */
  peakBodyAccelTime: number;
  /** max zs (m). */
  peakBodyDisplacement: number;
  /** max x at the wheel (m), x = zu − zs. */
  maxCompression: number;
  /** −min x at the wheel (m). */
  maxExtension: number;
  /** Least and most total tyre load (N). */
  minTireLoad: number;
  maxTireLoad: number;
  /** Total time with zero tyre force (s). */
  airborneTime: number;
  /** Total time the bump stop touches (s), and its largest force at the damper (N). */
  bumpStopContactTime: number;
  bumpStopPeakForce: number;
  /** Total time past the rebound limit (s). */
  reboundLimitContactTime: number;
  /**
   * Last time the body is outside the settling band around where it comes to rest (s), from the
   * event's start; null for a road with no end. `settled` is false when it is still outside at
   * the end of the window (settlingTime is then the window).
   */
  settlingTime: number | null;
  settled: boolean | null;
  /** Highest shaft speeds reached in bump and in rebound (m/s, magnitudes). */
  peakDamperVelocityBump: number;
  peakDamperVelocityRebound: number;
  /** The window (s). */
  duration: number;
};

/** A time history for plots: evenly spaced samples, SI, one typed array per signal. */
export type SimulationHistory = {
  time: Float64Array;
  bodyDisplacement: Float64Array;
  /** Body acceleration z̈s (m/s²). */
  bodyAccel: Float64Array;
  wheelDisplacement: Float64Array;
  /** Suspension travel x = zu − zs at the wheel, compression positive (m). */
  travel: Float64Array;
  /** Shaft velocity at the damper, compression positive (m/s). */
  damperVelocity: Float64Array;
  /** Total tyre load (N). */
  tireLoad: Float64Array;
  /** Bump-stop force at the damper (N). */
  bumpStopForce: Float64Array;
  roadHeight: Float64Array;
  bodyVelocity: Float64Array;
  wheelVelocity: Float64Array;
};

const HISTORY_SIGNALS = [
  ['bodyAccel', OUTPUT.bodyAccel],
  ['bodyDisplacement', OUTPUT.bodyDisplacement],
  ['wheelDisplacement', OUTPUT.wheelDisplacement],
  ['travel', OUTPUT.travel],
  ['damperVelocity', OUTPUT.damperVelocity],
  ['tireLoad', OUTPUT.tireLoad],
  ['bumpStopForce', OUTPUT.bumpStopForce],
  ['roadHeight', OUTPUT.roadHeight],
  ['bodyVelocity', OUTPUT.bodyVelocity],
  ['wheelVelocity', OUTPUT.wheelVelocity],
] as const;

/** The extremes the metrics need: each an output and a sign, the maximum of sign·output. */
const TRACKED: readonly (readonly [number, 1 | -1])[] = [
  [OUTPUT.bodyAccel, 1],
  [OUTPUT.bodyAccel, -1],
  [OUTPUT.bodyDisplacement, 1],
  [OUTPUT.travel, 1],
  [OUTPUT.travel, -1],
  [OUTPUT.tireLoad, 1],
  [OUTPUT.tireLoad, -1],
  [OUTPUT.damperVelocity, 1],
  [OUTPUT.damperVelocity, -1],
  [OUTPUT.bumpStopForce, 1],
];

/**
 * Samples of each accepted step on its dense output, its end included: a peak or trough that
 * rises and falls again inside one step shows among them, and every local extremum of the
 * samples is then refined on the dense output.
 */
export const STEP_SAMPLES = 4;

/**
 * Watches an event's integration step by step (odeIntegrate's observer) and keeps the metrics:
 * exact mode times (airborne, bump stop, top-out) from the located switches; extremes from
 * STEP_SAMPLES samples of every step on its dense output, each local maximum of the samples
 * (of sign·output: troughs too) refined on the dense output by Brent's method between its
 * neighbouring samples, whatever its value, so that no peak is understated however the steps
 * fall; the settling time located by bisection; and the history sampled evenly on the dense
 * output. Allocates nothing per step.
 */
export class EventRecorder {
  private readonly model: QuarterCarEventModel;
  private readonly duration: number;
  private readonly settle: { target: number; band: number } | undefined;
  private readonly best = new Float64Array(TRACKED.length);
  private readonly bestTime = new Float64Array(TRACKED.length);
  private readonly prev = new Float64Array(TRACKED.length);
  private readonly prev2 = new Float64Array(TRACKED.length);
  /** Times of the last two samples (shared by every tracked output). */
  private prevTime = 0;
  private prev2Time = 0;
  private readonly out = new Float64Array(OUTPUT_COUNT);
  private readonly end = new Float64Array(OUTPUT_COUNT);
  private readonly state = new Float64Array(4);
  private readonly previousStep = new DenseStep(4);
  private previousPiece = 0;
  private hasPrevious = false;
  private airborne = 0;
  private stopContact = 0;
  private topContact = 0;
  private outside = false;
  private lastOutside = 0;
  private readonly samples: SimulationHistory | null;
  private nextSample = 1;

  constructor(
    model: QuarterCarEventModel,
    y0: ArrayLike<number>,
    duration: number,
    settle: { target: number; band: number } | undefined,
    historyPoints: number,
  ) {
    this.model = model;
    this.duration = duration;
    this.settle = settle;
    model.outputs(0, y0, model.piece, this.out);
    TRACKED.forEach(([o, sign], i) => {
      const v = sign * (this.out[o] as number);
      this.best[i] = v;
      this.prev[i] = v;
      // No sample before the start: the start is never taken for an interior peak.
      this.prev2[i] = Infinity;
    });
    if (settle) {
      this.outside = Math.abs((this.out[OUTPUT.bodyDisplacement] as number) - settle.target) > settle.band;
    }
    if (historyPoints >= 2) {
      const n = Math.floor(historyPoints);
      const make = () => new Float64Array(n);
      this.samples = {
        time: make(),
        bodyDisplacement: make(),
        bodyAccel: make(),
        wheelDisplacement: make(),
        travel: make(),
        damperVelocity: make(),
        tireLoad: make(),
        bumpStopForce: make(),
        roadHeight: make(),
        bodyVelocity: make(),
        wheelVelocity: make(),
      };
      for (let k = 0; k < n; k++) this.samples.time[k] = (duration * k) / (n - 1);
      this.sampleStore(0);
    } else {
      this.samples = null;
    }
  }

  private sampleStore(k: number): void {
    const s = this.samples as SimulationHistory;
    for (const [name, o] of HISTORY_SIGNALS) s[name][k] = this.out[o] as number;
  }

  /** Output `o` at time t, on the previous step's dense output up to its end, else on `step`'s. */
  private outputAt(step: DenseStep, o: number, t: number): number {
    if (this.hasPrevious && t <= this.previousStep.t1) {
      this.previousStep.at(t, this.state);
      this.model.outputs(t, this.state, this.previousPiece, this.out);
    } else {
      step.at(t, this.state);
      this.model.outputs(t, this.state, this.model.piece, this.out);
    }
    return this.out[o] as number;
  }

  /** Takes one accepted step (odeIntegrate's observer), before the model's mode changes. */
  step(step: DenseStep): void {
    const m = this.model;
    const t0 = step.t0;
    const t1 = step.t1;
    const dt = t1 - t0;
    if (!m.contact) this.airborne += dt;
    if (m.stopOn) this.stopContact += dt;
    if (m.topOn) this.topContact += dt;

    if (this.samples) {
      const s = this.samples;
      while (this.nextSample < s.time.length && (s.time[this.nextSample] as number) <= t1 + 1e-12) {
        const tk = Math.min(t1, s.time[this.nextSample] as number);
        step.at(tk, this.state);
        m.outputs(tk, this.state, m.piece, this.out);
        this.sampleStore(this.nextSample++);
      }
    }

    for (let k = 1; k <= STEP_SAMPLES; k++) {
      const tk = k === STEP_SAMPLES ? t1 : t0 + (dt * k) / STEP_SAMPLES;
      step.at(tk, this.state);
      m.outputs(tk, this.state, m.piece, this.end);
      this.extremesTake(step, tk);
    }
    // The end's outputs stay in this.end for the settling check below.

    const settle = this.settle;
    if (settle) {
      const outsideNow =
        Math.abs((this.end[OUTPUT.bodyDisplacement] as number) - settle.target) > settle.band;
      if (outsideNow) this.lastOutside = t1;
      else if (this.outside) {
        // Outside at the start, inside at the end: the last exit from the band is in between.
        let a = t0;
        let b = t1;
        for (let k = 0; k < 50 && b - a > 1e-12; k++) {
          const c = 0.5 * (a + b);
          step.at(c, this.state);
          if (Math.abs((this.state[0] as number) - settle.target) > settle.band) a = c;
          else b = c;
        }
        this.lastOutside = 0.5 * (a + b);
      }
      this.outside = outsideNow;
    }

    this.previousStep.copyFrom(step);
    this.previousPiece = m.piece;
    this.hasPrevious = true;
  }

  /**
   * Takes the sample at `tk` (outputs in this.end): a sample between two lower neighbours is a
   * local maximum of sign·output, refined on the dense output between those neighbours (they
   * lie in this step or the previous one); then the sample itself counts.
   */
  private extremesTake(step: DenseStep, tk: number): void {
    const from = this.prev2Time;
    const at = this.prevTime;
    for (let i = 0; i < TRACKED.length; i++) {
      const [o, sign] = TRACKED[i] as readonly [number, 1 | -1];
      const v = sign * (this.end[o] as number);
      const p = this.prev[i] as number;
      const p2 = this.prev2[i] as number;
      // A strict local maximum of the samples (a flat run, such as no bump-stop force, is none).
      if (p >= p2 && p >= v && (p > p2 || p > v)) {
        // 1e-4 of the interval in time: the value's error goes as its square.
        const peak = scalarMaximum((t) => sign * this.outputAt(step, o, t), from, tk, at, 1e-4 * (tk - from));
        if (peak.value > (this.best[i] as number)) {
          this.best[i] = peak.value;
          this.bestTime[i] = peak.x;
        }
      }
      if (v > (this.best[i] as number)) {
        this.best[i] = v;
        this.bestTime[i] = tk;
      }
      this.prev2[i] = p;
      this.prev[i] = v;
    }
    this.prev2Time = at;
    this.prevTime = tk;
  }

  metrics(): EventMetrics {
    const b = this.best;
    const up = b[0] as number;
    const down = b[1] as number;
    return {
      peakBodyAccel: Math.max(up, down),
      peakBodyAccelTime: (up >= down ? this.bestTime[0] : this.bestTime[1]) as number,
      peakBodyDisplacement: b[2] as number,
      maxCompression: b[3] as number,
      maxExtension: b[4] as number,
      maxTireLoad: b[5] as number,
      minTireLoad: -(b[6] as number),
      peakDamperVelocityBump: Math.max(0, b[7] as number),
      peakDamperVelocityRebound: Math.max(0, b[8] as number),
      bumpStopPeakForce: b[9] as number,
      airborneTime: this.airborne,
      bumpStopContactTime: this.stopContact,
      reboundLimitContactTime: this.topContact,
      settlingTime: this.settle ? (this.outside ? this.duration : this.lastOutside) : null,
      settled: this.settle ? !this.outside : null,
      duration: this.duration,
    };
  }

  /** The sampled history, when one was asked for. */
  history(): SimulationHistory | undefined {
    return this.samples ?? undefined;
  }
}

/** A recorder for one event: `historyPoints` ≥ 2 samples a history, fewer records none. */
export function eventRecorderOf(
  model: QuarterCarEventModel,
  y0: ArrayLike<number>,
  duration: number,
  settle: { target: number; band: number } | undefined,
  historyPoints: number,
): EventRecorder {
  return new EventRecorder(model, y0, duration, settle, historyPoints);
}
