import { InputError, inputFieldPath } from '../units/input-error';
import { numberRounded } from '../units/number-text';
import { cubicHermiteCellAt, cubicHermiteMonotone, type CubicHermite } from '../numeric/cubic-hermite';
import { ISO8608_BAND, ISO8608_N0, iso8608ClassGd0, type Iso8608Class } from '../corner/random-road';
import { seededRandom } from '../numeric/seeded-random';

/**
 * A road as a function of distance s (m) along it, height in metres, made of smooth pieces.
 * Piece p covers [breaks[p−1], breaks[p]) (piece 0 starts at −∞, the last runs to +∞); at the
 * breaks the road may have a kink (slope jump) or a curvature jump, which the simulation steps
 * onto exactly. `heightIn(p, s)` and `slopeIn(p, s)` evaluate piece p's own formula, extended
 * smoothly past its ends, so that an integrator step that ends on a break never sees the next
 * piece. A vehicle at speed V meets zr(t) = h(V·t), żr = V·h′(V·t).
 */
export type RoadProfile = {
  readonly breaks: readonly number[];
  heightIn(piece: number, s: number): number;
  slopeIn(piece: number, s: number): number;
  /** d²h/ds² by piece p's formula (1/m). */
  curvatureIn(piece: number, s: number): number;
};

/** The piece of `road` that holds distance `s`. */
export function roadPieceAt(road: RoadProfile, s: number): number {
  const b = road.breaks;
  let lo = 0;
  let hi = b.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((b[mid] as number) <= s) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Road height (m) at distance `s` (m). */
export function roadHeight(road: RoadProfile, s: number): number {
  return road.heightIn(roadPieceAt(road, s), s);
}

/** Road slope dh/ds at distance `s` (the slope of the piece that starts there, at a break). */
export function roadSlope(road: RoadProfile, s: number): number {
  return road.slopeIn(roadPieceAt(road, s), s);
}

function finiteCheck(value: number, field: string, what: string, positive: boolean): void {
  if (!Number.isFinite(value))
    throw new InputError(field, `${what} must be a finite number (got ${numberRounded(value)})`);
  if (positive && !(value > 0))
    throw new InputError(field, `${what} must be greater than zero (got ${numberRounded(value)})`);
}

/** A level road: zero height everywhere. */
export function roadLevel(): RoadProfile {
  return { breaks: [], heightIn: () => 0, slopeIn: () => 0, curvatureIn: () => 0 };
}

/**
 * A (1−cos) bump of height h (m; negative for a dip) and length L (m) starting at s = 0:
 * h/2·(1 − cos 2πs/L) for 0 ≤ s ≤ L, level elsewhere (DESIGN.md, Nonlinear events).
 * @throws InputError when L is not positive or h is not finite.
 */
export function roadBump(height: number, length: number, field = 'bump'): RoadProfile {
  finiteCheck(height, inputFieldPath(field, 'height'), 'bump height', false);
  finiteCheck(length, inputFieldPath(field, 'length'), 'bump length', true);
  const k = (2 * Math.PI) / length;
  return {
    breaks: [0, length],
    heightIn: (p, s) => (p === 1 ? 0.5 * height * (1 - Math.cos(k * s)) : 0),
    slopeIn: (p, s) => (p === 1 ? 0.5 * height * k * Math.sin(k * s) : 0),
    curvatureIn: (p, s) => (p === 1 ? 0.5 * height * k * k * Math.cos(k * s) : 0),
  };
}

/**
 * A pothole: a (1−cos) dip of `depth` (m, > 0) over `length` (m). The road is followed by a
 * point contact, so a short, deep hole is followed all the way down, which a real tyre bridges
 * (it envelops the edges): take a pothole's figures as an upper bound of its severity.
 */
export function roadPothole(depth: number, length: number, field = 'pothole'): RoadProfile {
  finiteCheck(depth, inputFieldPath(field, 'depth'), 'pothole depth', true);
  return roadBump(-depth, length, field);
}

/**
 * A road step of height h (m; negative steps down) that rises over a finite length `rise` (m)
 * as a half cosine, h/2·(1 − cos πs/rise), so that the road keeps a continuous slope as a
 * real edge rolled over by a tyre does; level at h after it.
 */
export function roadStep(height: number, rise: number, field = 'step'): RoadProfile {
  finiteCheck(height, inputFieldPath(field, 'height'), 'step height', false);
  finiteCheck(rise, inputFieldPath(field, 'rise'), 'step rise length', true);
  const k = Math.PI / rise;
  return {
    breaks: [0, rise],
    heightIn: (p, s) => (p === 0 ? 0 : p === 1 ? 0.5 * height * (1 - Math.cos(k * s)) : height),
    slopeIn: (p, s) => (p === 1 ? 0.5 * height * k * Math.sin(k * s) : 0),
    curvatureIn: (p, s) => (p === 1 ? 0.5 * height * k * k * Math.cos(k * s) : 0),
  };
}

/**
 * A road of straight segments through (distance, height) vertices, rising distances, level
 * before the first and after the last vertex: the kinks are its breaks.
 */
export function roadPolyline(vertices: readonly (readonly [number, number])[]): RoadProfile {
  const xs = vertices.map((v) => v[0]);
  const ys = vertices.map((v) => v[1]);
  const n = xs.length;
  if (n < 2 || xs.some((x, i) => !Number.isFinite(x) || (i > 0 && !(x > (xs[i - 1] as number))))) {
    throw new Error('roadPolyline: needs two or more vertices with rising, finite distances');
  }
  const slopes = xs
    .slice(1)
    .map((x, i) => ((ys[i + 1] as number) - (ys[i] as number)) / (x - (xs[i] as number)));
  return {
    breaks: xs,
    heightIn: (p, s) => {
      if (p === 0) return ys[0] as number;
      if (p >= n) return ys[n - 1] as number;
      return (ys[p - 1] as number) + (slopes[p - 1] as number) * (s - (xs[p - 1] as number));
    },
    slopeIn: (p) => (p === 0 || p >= n ? 0 : (slopes[p - 1] as number)),
    curvatureIn: () => 0,
  };
}

/** A curb as it is struck: a ramp up over `rise`, a flat top over `hold`, a drop over `drop` (m). */
export type CurbSpec = { height: number; rise: number; hold: number; drop: number };

/**
 * A curb strike: straight ramp up to `height` over `rise`, flat for `hold`, straight back down
 * over `drop` (a short drop is the back edge falling away), all lengths in metres.
 */
export function roadCurb(spec: CurbSpec, field = 'curb'): RoadProfile {
  finiteCheck(spec.height, inputFieldPath(field, 'height'), 'curb height', true);
  finiteCheck(spec.rise, inputFieldPath(field, 'rise'), 'curb ramp length', true);
  finiteCheck(spec.drop, inputFieldPath(field, 'drop'), 'curb drop length', true);
  if (!Number.isFinite(spec.hold) || spec.hold < 0) {
    throw new InputError(
      inputFieldPath(field, 'hold'),
      `curb top length must be zero or more (got ${numberRounded(spec.hold)})`,
    );
  }
  const top = spec.rise + spec.hold;
  const vertices: [number, number][] = [
    [0, 0],
    [spec.rise, spec.height],
  ];
  if (spec.hold > 0) vertices.push([top, spec.height]);
  vertices.push([top + spec.drop, 0]);
  return roadPolyline(vertices);
}

/** Harmonics of a generated ISO 8608 road: h(s) = Σ aᵢ·cos(2π·nᵢ·s + φᵢ). */
export type RoadHarmonics = {
  /** Spatial frequencies nᵢ (cycles/m). */
  frequency: Float64Array;
  /** Amplitudes aᵢ (m). */
  amplitude: Float64Array;
  /** Phases φᵢ (rad). */
  phase: Float64Array;
};

/** Options of a generated ISO 8608 road. */
export type Iso8608ProfileSpec = {
  roadClass: Iso8608Class;
  /** Seed of the phases: the same seed gives the same road. */
  seed: number;
  /** Length of road to build (m); level at its end height past it. */
  length: number;
  /**
   * The harmonics lie on a grid of 1/period (cycles/m), so the road repeats every 2·period:
   * 100 m by default, which resolves the band's lowest frequency 0.011 cycles/m.
   */
  period?: number;
  /** Spacing of the stored samples (m); the road between them is a cubic Hermite. */
  spacing?: number;
};

/**
 * The harmonics of an ISO 8608 class road by harmonic superposition (Shinozuka & Jan 1972,
 * J. Sound Vib. 25(1)): the band 0.011–2.83 cycles/m is cut into cells of width 1/period; each
 * cell becomes one cosine at its centre with amplitude √(2·∫cell Gd(n) dn) and a phase uniform
 * in [0, 2π) from the seed. Integrating Gd over the cell, rather than sampling it, makes the
 * variance Σ aᵢ²/2 equal the class's band variance Gd(n0)·n0²·(1/n1 − 1/n2) exactly.
 */
export function iso8608Harmonics(roadClass: Iso8608Class, seed: number, period = 100): RoadHarmonics {
  const gd0 = iso8608ClassGd0(roadClass);
  const { low, high } = ISO8608_BAND;
  const first = Math.floor(low * period);
  const last = Math.ceil(high * period) - 1;
  const count = last - first + 1;
  const frequency = new Float64Array(count);
  const amplitude = new Float64Array(count);
  const phase = new Float64Array(count);
  const next = seededRandom(seed);
  for (let i = 0; i < count; i++) {
    const k = first + i;
    const a = Math.max(low, k / period);
    const b = Math.min(high, (k + 1) / period);
    // ∫ Gd0·(n/n0)⁻² dn over [a, b] = Gd0·n0²·(1/a − 1/b)
    const variance = gd0 * ISO8608_N0 * ISO8608_N0 * (1 / a - 1 / b);
    frequency[i] = (k + 0.5) / period;
    amplitude[i] = Math.sqrt(2 * variance);
    phase[i] = 2 * Math.PI * next();
  }
  return { frequency, amplitude, phase };
}

/** h(s) and h′(s) of a harmonic set, summed directly (the reference the sampled road is built from). */
export function roadHarmonicsAt(h: RoadHarmonics, s: number): { height: number; slope: number } {
  let height = 0;
  let slope = 0;
  for (let i = 0; i < h.frequency.length; i++) {
    const w = 2 * Math.PI * (h.frequency[i] as number);
    const a = h.amplitude[i] as number;
    const theta = w * s + (h.phase[i] as number);
    height += a * Math.cos(theta);
    slope -= a * w * Math.sin(theta);
  }
  return { height, slope };
}

/** Samples of a harmonic set at s = j·dx, j = 0…count−1, by rotating each harmonic's phasor. */
function harmonicsSampled(
  h: RoadHarmonics,
  dx: number,
  count: number,
): { y: Float64Array; slope: Float64Array } {
  const y = new Float64Array(count);
  const slope = new Float64Array(count);
  // Re-anchor each phasor with exact cos/sin now and then, so rounding cannot drift.
  const anchorEvery = 256;
  for (let i = 0; i < h.frequency.length; i++) {
    const w = 2 * Math.PI * (h.frequency[i] as number);
    const a = h.amplitude[i] as number;
    const phase = h.phase[i] as number;
    const cd = Math.cos(w * dx);
    const sd = Math.sin(w * dx);
    let c = 0;
    let sn = 0;
    for (let j = 0; j < count; j++) {
      if (j % anchorEvery === 0) {
        c = Math.cos(w * j * dx + phase);
        sn = Math.sin(w * j * dx + phase);
      }
      y[j] = (y[j] as number) + a * c;
      slope[j] = (slope[j] as number) - a * w * sn;
      const c2 = c * cd - sn * sd;
      sn = sn * cd + c * sd;
      c = c2;
    }
  }
  return { y, slope };
}

/** A road of cubic Hermite cells through samples with given slopes, level outside [x0, x_end]. */
function roadSampled(c: CubicHermite): RoadProfile {
  const x = c.x;
  const first = x[0] as number;
  const lastIndex = x.length - 1;
  const end = x[lastIndex] as number;
  const dx = (end - first) / lastIndex;
  // Uniform samples: the cell is found by division, not search.
  const cellOf = (s: number) => Math.min(lastIndex - 1, Math.max(0, Math.floor((s - first) / dx)));
  return {
    breaks: [first, end],
    heightIn: (p, s) =>
      p === 0
        ? (c.y[0] as number)
        : p === 2
          ? (c.y[lastIndex] as number)
          : cubicHermiteCellAt(c, cellOf(s), s),
    slopeIn: (p, s) => (p === 1 ? cubicHermiteCellAt(c, cellOf(s), s, 1) : 0),
    curvatureIn: (p, s) => (p === 1 ? cubicHermiteCellAt(c, cellOf(s), s, 2) : 0),
  };
}

/**
 * A random road of an ISO 8608 class (ISO 8608:2016, Gd(n) = Gd(n0)·(n/n0)⁻², n0 = 0.1
 * cycles/m) built from `iso8608Harmonics` and sampled every `spacing` (default 10 mm, about 35
 * samples in the band's shortest wavelength) with exact heights and slopes, joined by cubic
 * Hermite cells. Heights are relative to the road at s = 0, so an event starts level with it.
 * @throws InputError when the length or spacing is not positive.
 */
export function roadProfileIso8608(spec: Iso8608ProfileSpec, field = 'road'): RoadProfile {
  finiteCheck(spec.length, inputFieldPath(field, 'length'), 'road length', true);
  const spacing = spec.spacing ?? 0.01;
  finiteCheck(spacing, inputFieldPath(field, 'spacing'), 'sample spacing', true);
  if (!Number.isInteger(spec.seed)) {
    throw new InputError(inputFieldPath(field, 'seed'), `seed must be a whole number (got ${spec.seed})`);
  }
  const count = Math.max(2, Math.ceil(spec.length / spacing) + 1);
  if (count > 20_000_000) {
    throw new InputError(
      inputFieldPath(field, 'length'),
      `${spec.length} m at ${spacing} m spacing is too many samples`,
    );
  }
  const dx = spec.length / (count - 1);
  const harmonics = iso8608Harmonics(spec.roadClass, spec.seed, spec.period);
  const { y, slope } = harmonicsSampled(harmonics, dx, count);
  const y0 = y[0] as number;
  for (let j = 0; j < count; j++) y[j] = (y[j] as number) - y0;
  const x = new Float64Array(count);
  for (let j = 0; j < count; j++) x[j] = j * dx;
  return roadSampled({ x, y, slope });
}

/**
 * A measured road from (distance, elevation) points (m), distances rising: a shape-preserving
 * monotone cubic between points (no overshoot, so no invented bumps), heights relative to the
 * first point, level before the first point and after the last. Every point is a break, so an
 * integration steps onto each one and cannot stride over a short feature in a long flat run.
 * @throws InputError naming the offending point (`field[i]`).
 */
export function roadProfileMeasured(
  points: readonly (readonly [number, number])[],
  field = 'profile',
): RoadProfile {
  if (points.length < 2) throw new InputError(field, `has ${points.length} points; needs at least 2`);
  points.forEach(([x, y], i) => {
    const at = inputFieldPath(field, i);
    if (!Number.isFinite(x) || !Number.isFinite(y))
      throw new InputError(at, 'distance and elevation must be finite numbers');
    const prev = points[i - 1];
    if (prev && !(x > prev[0])) {
      throw new InputError(
        at,
        `distance ${x} m is not above the previous point's ${prev[0]} m: list the points by rising distance`,
      );
    }
  });
  const first = (points[0] as readonly [number, number])[1];
  const c = cubicHermiteMonotone(
    points.map((p) => p[0]),
    points.map((p) => p[1] - first),
  );
  const n = points.length;
  // Piece 0 is before the first point, piece i the cell from point i − 1 to i, piece n after the last.
  const inside = (p: number) => p > 0 && p < n;
  return {
    breaks: Array.from(c.x),
    heightIn: (p, s) => (p === 0 ? 0 : p >= n ? (c.y[n - 1] as number) : cubicHermiteCellAt(c, p - 1, s)),
    slopeIn: (p, s) => (inside(p) ? cubicHermiteCellAt(c, p - 1, s, 1) : 0),
    curvatureIn: (p, s) => (inside(p) ? cubicHermiteCellAt(c, p - 1, s, 2) : 0),
  };
}
