import { InputError } from '../units/input-error';
import { numbersRoundedApart } from '../units/number-text';

/** Signed bench points, compression positive (m/s, N), as parallel arrays. */
export type BenchPoints = { velocity: Float64Array; force: Float64Array };

/** Default half-width of the velocity window (samples each side): 7 samples in all. */
export const TRACE_HALF_WINDOW = 3;
/** Default number of speed bins per direction when a trace is reduced to points. */
export const TRACE_BINS = 24;
/** A bin with fewer samples than this is dropped: its mean is noise. */
export const TRACE_BIN_MIN_SAMPLES = 3;

/**
 * Shaft velocity from a sampled displacement by a smoothed central difference: at each
 * sample, the derivative at that sample of the least-squares quadratic through the 2h+1
 * samples around it (Savitzky–Golay smoothing differentiator; on uniform samples it is the
 * centred least-squares slope). The quadratic makes it hold for uneven sampling and at the
 * ends, where the window keeps its width and shifts inwards. Units: displacement/time.
 * @throws InputError naming the row when time does not increase.
 */
export function traceVelocity(
  time: Float64Array,
  displacement: Float64Array,
  halfWindow = TRACE_HALF_WINDOW,
  lines?: Uint32Array,
): Float64Array {
  const n = time.length;
  const width = 2 * halfWindow + 1;
  if (n < Math.max(3, width))
    throw new InputError('file', `a trace needs at least ${Math.max(3, width)} rows (got ${n})`);
  for (let i = 1; i < n; i++) {
    if (!((time[i] as number) > (time[i - 1] as number))) {
      const where = lines ? `line ${lines[i]}` : `row ${i + 1}`;
      const [now, before] = numbersRoundedApart(time[i] as number, time[i - 1] as number);
      throw new InputError(
        `${where}, column "time"`,
        `time ${now} s is not after the previous row's ${before} s; a trace's time must increase row by row`,
      );
    }
  }
  const v = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const lo = Math.max(0, Math.min(i - halfWindow, n - width));
    const hi = lo + width - 1;
    // Centre on the window's own means: times far from zero lose no digits.
    let tm = 0;
    let xm = 0;
    for (let k = lo; k <= hi; k++) {
      tm += time[k] as number;
      xm += displacement[k] as number;
    }
    tm /= width;
    xm /= width;
    let s2 = 0;
    let s3 = 0;
    let s4 = 0;
    let y1 = 0;
    let y2 = 0;
    for (let k = lo; k <= hi; k++) {
      const u = (time[k] as number) - tm;
      const y = (displacement[k] as number) - xm;
      const u2 = u * u;
      s2 += u2;
      s3 += u2 * u;
      s4 += u2 * u2;
      y1 += u * y;
      y2 += u2 * y;
    }
    // Normal equations of y = a + b·u + c·u² with Σu = Σy = 0:
    //   [m 0 s2; 0 s2 s3; s2 s3 s4]·[a b c] = [0 y1 y2]
    const m = width;
    const det = m * (s2 * s4 - s3 * s3) - s2 * s2 * s2;
    const ui = (time[i] as number) - tm;
    if (Math.abs(det) <= 1e-12 * m * s2 * s4) {
      v[i] = y1 / s2;
      continue;
    }
    // Cramer's rule for b and c.
    const b = (m * (y1 * s4 - s3 * y2) - s2 * s2 * y1) / det;
    const c = (m * (s2 * y2 - s3 * y1)) / det;
    v[i] = b + 2 * c * ui;
  }
  return v;
}

/**
 * Reduces signed points to binned averages per direction: speeds from zero to the
 * direction's largest are cut into `bins` equal bins, and each bin with at least
 * `minSamples` samples gives one point, the mean velocity and mean force of its samples
 * (this averages the opening and closing halves of a force–velocity loop).
 */
export function benchPointsBinned(
  points: BenchPoints,
  bins = TRACE_BINS,
  minSamples = TRACE_BIN_MIN_SAMPLES,
): BenchPoints {
  const { velocity, force } = points;
  let maxBump = 0;
  let maxRebound = 0;
  for (let i = 0; i < velocity.length; i++) {
    const v = velocity[i] as number;
    if (v > maxBump) maxBump = v;
    if (-v > maxRebound) maxRebound = -v;
  }
  const sums = (n: number) => ({ v: new Float64Array(n), f: new Float64Array(n), c: new Uint32Array(n) });
  const bump = sums(bins);
  const rebound = sums(bins);
  for (let i = 0; i < velocity.length; i++) {
    const v = velocity[i] as number;
    if (v === 0) continue;
    const s = v > 0 ? bump : rebound;
    const max = v > 0 ? maxBump : maxRebound;
    const k = Math.min(bins - 1, Math.floor((Math.abs(v) / max) * bins));
    s.v[k] = (s.v[k] as number) + v;
    s.f[k] = (s.f[k] as number) + (force[i] as number);
    s.c[k] = (s.c[k] as number) + 1;
  }
  const outV: number[] = [];
  const outF: number[] = [];
  // Rebound from its fastest bin to the slowest, then bump from slow to fast: ordered by signed velocity.
  for (let k = bins - 1; k >= 0; k--) {
    const c = rebound.c[k] as number;
    if (c >= minSamples) {
      outV.push((rebound.v[k] as number) / c);
      outF.push((rebound.f[k] as number) / c);
    }
  }
  for (let k = 0; k < bins; k++) {
    const c = bump.c[k] as number;
    if (c >= minSamples) {
      outV.push((bump.v[k] as number) / c);
      outF.push((bump.f[k] as number) / c);
    }
  }
  return { velocity: Float64Array.from(outV), force: Float64Array.from(outF) };
}
