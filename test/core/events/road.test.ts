import FFT from 'fft.js';
import { describe, expect, it } from 'vitest';
import {
  ISO8608_BAND,
  ISO8608_N0,
  iso8608ClassGd0,
  iso8608DisplacementPsd,
} from '../../../core/corner/random-road';
import {
  iso8608Harmonics,
  roadBump,
  roadCurb,
  roadHarmonicsAt,
  roadHeight,
  roadLevel,
  roadPieceAt,
  roadPothole,
  roadProfileIso8608,
  roadProfileMeasured,
  roadSlope,
  roadStep,
  type RoadProfile,
} from '../../../core/events/road';

/** Central difference of the height, to check the slope against [calc]. */
const slopeNumeric = (r: RoadProfile, s: number, ds = 1e-6) =>
  (roadHeight(r, s + ds) - roadHeight(r, s - ds)) / (2 * ds);

describe('deterministic roads', () => {
  it('builds the (1−cos) bump of DESIGN.md: h/2·(1 − cos 2πs/L) on [0, L], level elsewhere', () => {
    const r = roadBump(0.03, 0.5);
    expect(roadHeight(r, -0.1)).toBe(0);
    expect(roadHeight(r, 0)).toBe(0);
    expect(roadHeight(r, 0.125)).toBeCloseTo(0.015, 12);
    expect(roadHeight(r, 0.25)).toBeCloseTo(0.03, 12);
    expect(roadHeight(r, 0.5)).toBe(0);
    expect(roadHeight(r, 0.7)).toBe(0);
    for (const s of [0.05, 0.2, 0.31, 0.45]) expect(roadSlope(r, s)).toBeCloseTo(slopeNumeric(r, s), 7);
    expect(r.breaks).toEqual([0, 0.5]);
  });

  it('makes a pothole the same shape downwards, and refuses a depth that is not a depth', () => {
    const r = roadPothole(0.04, 0.8);
    expect(roadHeight(r, 0.4)).toBeCloseTo(-0.04, 12);
    expect(() => roadPothole(0, 0.8)).toThrow(/pothole\.depth/);
    expect(() => roadPothole(-0.02, 0.8)).toThrow(/pothole\.depth/);
    expect(() => roadPothole(0.02, NaN)).toThrow(/pothole\.length/);
  });

  it('rises a step over a finite length with a continuous slope, then stays level at its height', () => {
    const r = roadStep(0.02, 0.04);
    expect(roadHeight(r, 0.02)).toBeCloseTo(0.01, 12);
    expect(roadHeight(r, 0.04)).toBeCloseTo(0.02, 12);
    expect(roadHeight(r, 3)).toBe(0.02);
    // The half cosine starts and ends flat: the slope is continuous at both ends.
    expect(roadSlope(r, 1e-9)).toBeLessThan(1e-6);
    expect(roadSlope(r, 0.04 - 1e-9)).toBeLessThan(1e-6);
    expect(roadSlope(r, 0.02)).toBeCloseTo((0.02 * Math.PI) / (2 * 0.04), 10);
    // A step down is a step too.
    expect(roadHeight(roadStep(-0.015, 0.03), 1)).toBe(-0.015);
    expect(() => roadStep(0.02, 0)).toThrow(/step\.rise/);
  });

  it('strikes a curb: straight ramp, flat top, short drop, with its kinks as breaks', () => {
    const r = roadCurb({ height: 0.05, rise: 0.1, hold: 0.3, drop: 0.02 });
    [0, 0.1, 0.4, 0.42].forEach((b, i) => expect(r.breaks[i]).toBeCloseTo(b, 15));
    expect(r.breaks.length).toBe(4);
    expect(roadHeight(r, 0.05)).toBeCloseTo(0.025, 12);
    expect(roadSlope(r, 0.05)).toBeCloseTo(0.5, 12);
    expect(roadHeight(r, 0.25)).toBe(0.05);
    expect(roadSlope(r, 0.25)).toBe(0);
    expect(roadHeight(r, 0.41)).toBeCloseTo(0.025, 12);
    expect(roadSlope(r, 0.41)).toBeCloseTo(-2.5, 12);
    expect(roadHeight(r, 1)).toBe(0);
    // A curb with no flat top is a ridge.
    expect(roadCurb({ height: 0.05, rise: 0.1, hold: 0, drop: 0.05 }).breaks.length).toBe(3);
    expect(() => roadCurb({ height: 0.05, rise: 0.1, hold: -0.1, drop: 0.02 })).toThrow(/curb\.hold/);
    expect(() => roadCurb({ height: -0.05, rise: 0.1, hold: 0.1, drop: 0.02 })).toThrow(/curb\.height/);
  });

  it("evaluates a piece's own formula at its end, so a step that lands on a break never sees the next piece", () => {
    const r = roadCurb({ height: 0.05, rise: 0.1, hold: 0.3, drop: 0.02 });
    // At s = 0.1 the ramp (piece 1) and the top (piece 2) meet; each keeps its own slope there.
    expect(roadPieceAt(r, 0.1)).toBe(2);
    expect(r.slopeIn(1, 0.1)).toBeCloseTo(0.5, 12);
    expect(r.slopeIn(2, 0.1)).toBe(0);
    expect(r.heightIn(1, 0.1)).toBeCloseTo(r.heightIn(2, 0.1), 15);
    expect(roadHeight(roadLevel(), 12)).toBe(0);
  });
});

describe('ISO 8608 random road by harmonic superposition', () => {
  it('carries exactly the class variance Gd(n0)·n0²·(1/n1 − 1/n2): 15.23 mm RMS for class C', () => {
    const h = iso8608Harmonics('C', 1);
    let variance = 0;
    for (const a of h.amplitude) variance += (a * a) / 2;
    const band = iso8608ClassGd0('C') * ISO8608_N0 ** 2 * (1 / ISO8608_BAND.low - 1 / ISO8608_BAND.high);
    expect(variance / band).toBeCloseTo(1, 12);
    // The project's reference notes §5 [calc]: σ = 15.23 mm for class C over 0.011–2.83 cycles/m.
    expect(Math.sqrt(variance) * 1000).toBeCloseTo(15.23, 2);
    // Each class is 4× the variance of the one below [mem: ISO 8608 class means].
    const varianceOf = (c: 'B' | 'D') =>
      iso8608Harmonics(c, 1).amplitude.reduce((s, a) => s + (a * a) / 2, 0);
    expect(varianceOf('D') / variance).toBeCloseTo(4, 12);
    expect(variance / varianceOf('B')).toBeCloseTo(4, 12);
  });

  it('gives the same road for the same seed and another for another seed', () => {
    const a = roadProfileIso8608({ roadClass: 'C', seed: 42, length: 50 });
    const b = roadProfileIso8608({ roadClass: 'C', seed: 42, length: 50 });
    const c = roadProfileIso8608({ roadClass: 'C', seed: 43, length: 50 });
    const at = [0.3, 7.77, 21.5, 49.9];
    expect(at.map((s) => roadHeight(a, s))).toEqual(at.map((s) => roadHeight(b, s)));
    expect(at.map((s) => roadHeight(a, s))).not.toEqual(at.map((s) => roadHeight(c, s)));
    // A longer road from the same seed starts as the same road.
    const longer = roadProfileIso8608({ roadClass: 'C', seed: 42, length: 200 });
    for (const s of at) expect(roadHeight(longer, s)).toBeCloseTo(roadHeight(a, s), 9);
  });

  it('stores samples that follow the harmonic sum between them (cubic Hermite, 10 mm spacing)', () => {
    const seed = 9;
    const road = roadProfileIso8608({ roadClass: 'D', seed, length: 30 });
    const h = iso8608Harmonics('D', seed);
    const h0 = roadHarmonicsAt(h, 0).height;
    const rms = Math.sqrt(h.amplitude.reduce((s, a) => s + (a * a) / 2, 0));
    let worst = 0;
    let worstSlope = 0;
    for (let s = 0.0037; s < 30; s += 0.0731) {
      const exact = roadHarmonicsAt(h, s);
      worst = Math.max(worst, Math.abs(roadHeight(road, s) - (exact.height - h0)));
      worstSlope = Math.max(worstSlope, Math.abs(roadSlope(road, s) - exact.slope));
    }
    expect(worst / rms).toBeLessThan(1e-6);
    expect(worstSlope / rms).toBeLessThan(1e-3);
    expect(roadHeight(road, 0)).toBe(0);
  });

  it('has, over one whole period, the line spectrum of ISO 8608 (fft.js) and exactly its variance', () => {
    const h = iso8608Harmonics('C', 5, 100);
    const length = 200; // the period: harmonics sit on odd multiples of 1/200 cycles/m
    const n = 4096;
    const dx = length / n;
    const samples = Array.from({ length: n }, (_, j) => roadHarmonicsAt(h, j * dx).height);
    const mean = samples.reduce((s, v) => s + v, 0) / n;
    const variance = samples.reduce((s, v) => s + (v - mean) ** 2, 0) / n;
    const expected = iso8608ClassGd0('C') * ISO8608_N0 ** 2 * (1 / ISO8608_BAND.low - 1 / ISO8608_BAND.high);
    // [calc] over whole periods the variance is Σ aᵢ²/2 exactly, whatever the phases
    expect(variance / expected).toBeCloseTo(1, 9);
    const fft = new FFT(n);
    const out = fft.createComplexArray() as number[];
    fft.realTransform(out, samples);
    fft.completeSpectrum(out);
    // One-sided power in each FFT bin, summed over octave bands, against ∫ Gd over the band.
    const power = (j: number) =>
      (2 * ((out[2 * j] as number) ** 2 + (out[2 * j + 1] as number) ** 2)) / (n * n);
    for (const [lo, hi] of [
      [0.02, 0.04],
      [0.08, 0.16],
      [0.32, 0.64],
      [1.28, 2.56],
    ] as const) {
      let p = 0;
      for (let j = 1; j < n / 2; j++) if (j / length >= lo && j / length < hi) p += power(j);
      // ISO 8608 Gd(n) = Gd(n0)(n/n0)^−2 [mem], integrated: Gd0·n0²·(1/lo − 1/hi)
      const band = iso8608ClassGd0('C') * ISO8608_N0 ** 2 * (1 / lo - 1 / hi);
      expect(p / band).toBeCloseTo(1, 6);
    }
  });

  it('shows the class PSD and its n⁻² slope in a windowed periodogram of a stretch of road (statistical tolerance)', () => {
    // Welch estimate over 8 half-overlapping Hann segments of 51.2 m, from 4 seeds, on the
    // stored (sampled) road itself, which is not aligned with the harmonics' period.
    const seg = 1024;
    const dx = 0.05;
    const fft = new FFT(seg);
    const hann = Array.from({ length: seg }, (_, j) => 0.5 - 0.5 * Math.cos((2 * Math.PI * j) / seg));
    const u = hann.reduce((s, w) => s + w * w, 0) / seg;
    const psd = new Float64Array(seg / 2);
    let count = 0;
    for (const seed of [11, 12, 13, 14]) {
      const road = roadProfileIso8608({ roadClass: 'C', seed, length: 4.5 * seg * dx + 1 });
      for (let k = 0; k < 8; k++) {
        const start = (k * seg * dx) / 2;
        const x = hann.map((w, j) => w * roadHeight(road, start + j * dx));
        const out = fft.createComplexArray() as number[];
        fft.realTransform(out, x);
        for (let j = 1; j < seg / 2; j++) {
          // One-sided PSD (m³): 2·|X|²·dx / (N·U)
          psd[j] =
            (psd[j] as number) +
            (2 * ((out[2 * j] as number) ** 2 + (out[2 * j + 1] as number) ** 2) * dx) / (seg * u);
        }
        count++;
      }
    }
    const df = 1 / (seg * dx);
    const logs: [number, number][] = [];
    for (const centre of [0.1, 0.2, 0.4, 0.8, 1.6]) {
      let sum = 0;
      let bins = 0;
      for (let j = 1; j < seg / 2; j++) {
        const nj = j * df;
        if (nj >= centre / Math.SQRT2 && nj < centre * Math.SQRT2) {
          sum += (psd[j] as number) / count / iso8608DisplacementPsd(nj, 'C');
          bins++;
        }
      }
      const ratio = sum / bins;
      expect(ratio).toBeGreaterThan(0.75);
      expect(ratio).toBeLessThan(1.33);
      logs.push([Math.log(centre), Math.log(ratio * iso8608DisplacementPsd(centre, 'C'))]);
    }
    // Least-squares slope of log PSD on log n: the waviness w = 2 of ISO 8608.
    const mx = logs.reduce((s, p) => s + p[0], 0) / logs.length;
    const my = logs.reduce((s, p) => s + p[1], 0) / logs.length;
    const slope =
      logs.reduce((s, p) => s + (p[0] - mx) * (p[1] - my), 0) /
      logs.reduce((s, p) => s + (p[0] - mx) ** 2, 0);
    expect(slope).toBeGreaterThan(-2.15);
    expect(slope).toBeLessThan(-1.85);
  });

  it('refuses a road that cannot be built', () => {
    expect(() => roadProfileIso8608({ roadClass: 'C', seed: 1, length: 0 })).toThrow(/road\.length/);
    expect(() => roadProfileIso8608({ roadClass: 'C', seed: 1.5, length: 10 })).toThrow(/road\.seed/);
    expect(() => roadProfileIso8608({ roadClass: 'C', seed: 1, length: 1e9 })).toThrow(/too many samples/);
    expect(() => roadProfileIso8608({ roadClass: 'C', seed: 1, length: 10, spacing: -1 })).toThrow(
      /road\.spacing/,
    );
  });
});

describe('measured road', () => {
  it('passes through the points relative to the first, level outside them, with no overshoot', () => {
    const r = roadProfileMeasured([
      [2, 0.1],
      [3, 0.11],
      [4, 0.13],
      [5, 0.13],
      [6, 0.09],
    ]);
    expect(roadHeight(r, 0)).toBe(0);
    expect(roadHeight(r, 2)).toBeCloseTo(0, 15);
    expect(roadHeight(r, 4)).toBeCloseTo(0.03, 12);
    expect(roadHeight(r, 9)).toBeCloseTo(-0.01, 12);
    // Shape preserving: between 4 and 5 (equal heights) it stays flat; never above the data's top.
    for (let s = 2; s <= 6; s += 0.01) expect(roadHeight(r, s)).toBeLessThanOrEqual(0.03 + 1e-15);
    expect(roadHeight(r, 4.5)).toBeCloseTo(0.03, 12);
    expect(r.breaks).toEqual([2, 3, 4, 5, 6]);
  });

  it('names the point that is wrong', () => {
    expect(() => roadProfileMeasured([[0, 0]], 'track.csv')).toThrow(/track\.csv: has 1 points/);
    expect(() =>
      roadProfileMeasured(
        [
          [0, 0],
          [1, 0],
          [1, 0.01],
        ],
        'track.csv',
      ),
    ).toThrow(/track\.csv\[2\].*not above/);
    expect(() =>
      roadProfileMeasured(
        [
          [0, 0],
          [1, NaN],
        ],
        'track.csv',
      ),
    ).toThrow(/track\.csv\[1\].*finite/);
  });
});
