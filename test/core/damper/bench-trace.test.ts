import FFT from 'fft.js';
import { describe, expect, it } from 'vitest';
import { benchFit } from '../../../core/damper/bench-fit';
import { benchPointsBinned, traceVelocity } from '../../../core/damper/bench-trace';
import { InputError } from '../../../core/units/input-error';

function sineTrace(stroke: number, frequency: number, rate: number, seconds: number) {
  const n = Math.round(rate * seconds);
  const time = new Float64Array(n);
  const displacement = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    time[i] = i / rate;
    displacement[i] = (stroke / 2) * Math.sin(2 * Math.PI * frequency * time[i]!);
  }
  return { time, displacement };
}

describe('traceVelocity', () => {
  it('is exact for a displacement ramp and a parabola, window ends included', () => {
    const time = Float64Array.from({ length: 50 }, (_, i) => 0.001 * i);
    const x = time.map((t) => 0.2 * t - 0.003);
    for (const v of traceVelocity(time, x)) expect(v).toBeCloseTo(0.2, 12);
    // x = 3t² has x' = 6t: a local quadratic is exact for it, at the ends too.
    const parabola = time.map((t) => 3 * t * t);
    traceVelocity(time, parabola).forEach((v, i) => expect(v).toBeCloseTo(6 * time[i]!, 10));
  });

  it('follows the analytic derivative of a sine and peaks at π·f·stroke', () => {
    const { time, displacement } = sineTrace(0.05, 1, 1000, 2);
    const v = traceVelocity(time, displacement);
    const omega = 2 * Math.PI;
    // A least-squares slope over ±3 samples flattens a sine by about (ωΔt)²·Σk⁴/(6Σk²) ≈ 5e-5 here.
    const peak = 0.025 * omega;
    for (let i = 10; i < v.length - 10; i += 97)
      expect(Math.abs((v[i] as number) - peak * Math.cos(omega * time[i]!))).toBeLessThan(1e-4 * peak);
    // Reference notes §6 [calc]: peak velocity = π·f·S; 50 mm stroke at 1 Hz → 0.157 m/s.
    expect(Math.max(...v)).toBeCloseTo(0.157, 3);
  });

  it('agrees with the spectral derivative of fft.js on a periodic signal of three harmonics', () => {
    // fft.js (an independent FFT library) [calc]: the derivative of a periodic signal is the inverse
    // transform of iω·X. One period, 1024 samples, harmonics 1–3 of 1.5 Hz.
    const n = 1024;
    const period = 1 / 1.5;
    const time = Float64Array.from({ length: n }, (_, i) => (i * period) / n);
    const x = time.map(
      (t) =>
        0.02 * Math.sin((2 * Math.PI * t) / period) +
        0.006 * Math.cos((4 * Math.PI * t) / period + 0.3) +
        0.002 * Math.sin((6 * Math.PI * t) / period - 1),
    );
    const fft = new FFT(n);
    const spectrum = fft.createComplexArray() as number[];
    fft.realTransform(spectrum, Array.from(x));
    fft.completeSpectrum(spectrum);
    const derivative = fft.createComplexArray() as number[];
    for (let k = 0; k < n; k++) {
      const m = k <= n / 2 ? k : k - n;
      const w = (2 * Math.PI * m) / period;
      derivative[2 * k] = -w * (spectrum[2 * k + 1] as number);
      derivative[2 * k + 1] = w * (spectrum[2 * k] as number);
    }
    const back = fft.createComplexArray() as number[];
    fft.inverseTransform(back, derivative);
    const v = traceVelocity(time, x);
    const peak = Math.max(...v.map(Math.abs));
    for (let i = 5; i < n - 5; i++)
      expect(Math.abs((v[i] as number) - (back[2 * i] as number))).toBeLessThan(2e-3 * peak);
  });

  it('handles uneven sampling', () => {
    const time = Float64Array.from({ length: 400 }, (_, i) => i * 0.001 + 0.0003 * Math.sin(i));
    const x = time.map((t) => 0.01 * Math.sin(2 * Math.PI * 2 * t));
    const v = traceVelocity(time, x);
    // A local straight line would be off by x''·(tᵢ − t̄) ≈ 5e-3 of the peak with this jitter; the quadratic is not.
    const peak = 0.01 * 4 * Math.PI;
    for (let i = 10; i < 390; i += 37)
      expect(Math.abs((v[i] as number) - peak * Math.cos(4 * Math.PI * time[i]!))).toBeLessThan(3e-4 * peak);
  });

  it('names the row where time does not increase, and refuses a trace too short for its window', () => {
    const time = Float64Array.from([0, 0.001, 0.002, 0.002, 0.004, 0.005, 0.006, 0.007]);
    const lines = Uint32Array.from([2, 3, 4, 5, 6, 7, 8, 9]);
    expect(() => traceVelocity(time, new Float64Array(8), 3, lines)).toThrow(
      /line 5, column "time": time 0.002 s is not after/,
    );
    expect(() => traceVelocity(Float64Array.from([0, 1]), new Float64Array(2))).toThrow(InputError);
    expect(() => traceVelocity(new Float64Array(0), new Float64Array(0))).toThrow(/at least 7 rows/);
  });
});

describe('trace to points to fit', () => {
  it('recovers a linear damper: the binned points fit c, and ∮F·v dt is π·c·ω·A² per cycle', () => {
    const c = 2500;
    const f = 2;
    const { time, displacement } = sineTrace(0.05, f, 2000, 1);
    const velocity = traceVelocity(time, displacement);
    const force = velocity.map((v) => c * v);
    // Reference notes §6 [pub: standard]: a linear damper dissipates π·c·ω·A² per cycle; 2 cycles here.
    // Whole periods, uniform samples: the rectangle rule is exact up to the velocity's own error.
    let work = 0;
    for (let i = 0; i < time.length; i++) work += ((force[i] as number) * (velocity[i] as number)) / 2000;
    const omega = 2 * Math.PI * f;
    const expected = Math.PI * c * omega * 0.025 ** 2;
    expect(Math.abs(work / 2 - expected) / expected).toBeLessThan(2e-3);
    const points = benchPointsBinned({ velocity, force });
    const fit = benchFit(points);
    expect(fit.bump?.curve.lowSpeed).toBeCloseTo(c, 6);
    expect(fit.rebound?.curve.highSpeed).toBeCloseTo(c, 6);
  });

  it('averages per direction, in order of signed velocity, dropping sparse bins', () => {
    const velocity = Float64Array.from([-0.3, -0.29, -0.31, 0.1, 0.1, 0.1, 0.2, 0]);
    const force = Float64Array.from([-900, -870, -930, 300, 310, 290, 600, 0]);
    const p = benchPointsBinned({ velocity, force }, 4, 3);
    expect(p.velocity.length).toBe(2);
    expect(p.velocity[0]).toBeCloseTo(-0.3, 12);
    expect(p.velocity[1]).toBeCloseTo(0.1, 12);
    expect(Array.from(p.force)).toEqual([-900, 300]);
  });
});

describe('benchFit', () => {
  const bilinear = (v: number, low: number, knee: number, high: number) =>
    Math.sign(v) * (Math.abs(v) <= knee ? low * Math.abs(v) : low * knee + high * (Math.abs(v) - knee));

  it('recovers both directions of a bilinear curve from exact points', () => {
    const v = Float64Array.from({ length: 41 }, (_, i) => (i - 20) * 0.02);
    const force = v.map((x) => (x > 0 ? bilinear(x, 3000, 0.08, 1000) : bilinear(x, 5000, 0.06, 1800)));
    const fit = benchFit({ velocity: v, force });
    expect(fit.basis).toBe('points');
    expect(fit.bump?.curve.lowSpeed).toBeCloseTo(3000, 3);
    expect(fit.bump?.curve.kneeSpeed).toBeCloseTo(0.08, 6);
    expect(fit.rebound?.curve.highSpeed).toBeCloseTo(1800, 3);
    expect(fit.rebound?.curve.kneeSpeed).toBeCloseTo(0.06, 6);
  });

  it('fits a dense run on binned averages and still recovers the curve', () => {
    const n = 20_000;
    const v = Float64Array.from({ length: n }, (_, i) => -0.5 + i / n);
    const force = v.map((x) => bilinear(x, 4000, 0.05, 1200));
    const fit = benchFit({ velocity: v, force });
    expect(fit.basis).toBe('binned');
    expect(fit.bump?.curve.lowSpeed).toBeCloseTo(4000, -1);
    expect(fit.rebound?.curve.highSpeed).toBeCloseTo(1200, -1);
  });

  it('leaves out a direction with too few points and refuses a run with none', () => {
    const bumpOnly = benchFit({
      velocity: Float64Array.from([0.1, 0.2, 0.3]),
      force: Float64Array.from([300, 600, 900]),
    });
    expect(bumpOnly.rebound).toBeNull();
    expect(bumpOnly.bump?.curve.lowSpeed).toBeCloseTo(3000, 6);
    expect(() =>
      benchFit({ velocity: Float64Array.from([0.1, -0.1]), force: Float64Array.from([1, -1]) }),
    ).toThrow(/at least 3 points/);
    expect(() => benchFit({ velocity: new Float64Array(0), force: new Float64Array(0) })).toThrow(InputError);
  });
});
