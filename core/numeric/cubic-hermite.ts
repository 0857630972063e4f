/**
 * A piecewise cubic Hermite curve through knots (x_i, y_i), x strictly increasing, with a
 * given slope at each knot: on each cell the one cubic that matches both ends' values and
 * slopes, so the curve and its slope are continuous.
 */
export type CubicHermite = {
  readonly x: Float64Array;
  readonly y: Float64Array;
  /** Slope at each knot. */
  readonly slope: Float64Array;
};

/**
 * The monotone interpolant through the knots: slopes chosen so that the curve never overshoots
 * the data, monotone wherever the data are and flat at a local extremum (Fritsch & Carlson
 * 1980, "Monotone piecewise cubic interpolation", SIAM J. Numer. Anal. 17; interior slopes by
 * the weighted harmonic mean of Fritsch & Butland 1984, as the PCHIP routines use). The end
 * slopes are PCHIP's three-point formula (Moler, Numerical Computing with MATLAB, §3.4,
 * `pchipend`; see pchipEndSlope): the slope at the end of the parabola through the three
 * end knots, set to zero when its sign differs from the end secant's and limited to three
 * times that secant when the data turn there. With two knots both slopes are the secant. The
 * linear continuation past either end (cubicHermiteAt) carries the end slope, so it joins
 * with a continuous slope. Knots must be finite with x strictly increasing: callers validate
 * their own data and name the bad point; this only guards against misuse.
 * @example cubicHermiteMonotone([0, 0.05, 0.2], [0, 400, 900])
 */
export function cubicHermiteMonotone(xs: ArrayLike<number>, ys: ArrayLike<number>): CubicHermite {
  const n = xs.length;
  if (n < 2 || ys.length !== n)
    throw new Error('cubicHermiteMonotone: needs two or more knots, x and y alike');
  const x = Float64Array.from(xs);
  const y = Float64Array.from(ys);
  const slope = new Float64Array(n);
  const h = new Float64Array(n - 1);
  const delta = new Float64Array(n - 1);
  for (let i = 0; i < n - 1; i++) {
    const hi = (x[i + 1] as number) - (x[i] as number);
    if (!(hi > 0)) throw new Error('cubicHermiteMonotone: x must be strictly increasing');
    h[i] = hi;
    delta[i] = ((y[i + 1] as number) - (y[i] as number)) / hi;
  }
  if (n === 2) {
    slope[0] = delta[0] as number;
    slope[1] = delta[0] as number;
  } else {
    slope[0] = pchipEndSlope(h[0] as number, h[1] as number, delta[0] as number, delta[1] as number);
    slope[n - 1] = pchipEndSlope(
      h[n - 2] as number,
      h[n - 3] as number,
      delta[n - 2] as number,
      delta[n - 3] as number,
    );
  }
  for (let i = 1; i < n - 1; i++) {
    const d0 = delta[i - 1] as number;
    const d1 = delta[i] as number;
    if (d0 * d1 <= 0) {
      // A local extremum or a flat run: a zero slope is the only one that cannot overshoot.
      slope[i] = 0;
    } else {
      const h0 = h[i - 1] as number;
      const h1 = h[i] as number;
      const w1 = 2 * h1 + h0;
      const w2 = h1 + 2 * h0;
      slope[i] = (w1 + w2) / (w1 / d0 + w2 / d1);
    }
  }
  return { x, y, slope };
}

/**
 * PCHIP's slope at an end knot from the end cell (width h1, secant d1) and the next one
 * (h2, d2): the three-point formula ((2·h1 + h2)·d1 − h1·d2)/(h1 + h2), the derivative at the
 * end of the parabola through the three end knots; zero when its sign is not the end secant's,
 * and 3·d1 when the secants change sign and it is steeper than that (Moler, Numerical
 * Computing with MATLAB, §3.4, `pchipend`), so that the end cell keeps monotone.
 */
export function pchipEndSlope(h1: number, h2: number, d1: number, d2: number): number {
  const d = ((2 * h1 + h2) * d1 - h1 * d2) / (h1 + h2);
  if (Math.sign(d) !== Math.sign(d1)) return 0;
  if (Math.sign(d1) !== Math.sign(d2) && Math.abs(d) > Math.abs(3 * d1)) return 3 * d1;
  return d;
}

const THROUGH_ORIGIN = new WeakMap<object, CubicHermite>();

/**
 * The monotone interpolant through (0, 0) and a curve's points (a damper table, a bump-stop
 * curve), built once per points array: treat the array as immutable.
 */
export function cubicHermiteThroughOrigin<P>(
  points: readonly P[],
  xOf: (p: P) => number,
  yOf: (p: P) => number,
): CubicHermite {
  let c = THROUGH_ORIGIN.get(points);
  if (!c) {
    c = cubicHermiteMonotone([0, ...points.map(xOf)], [0, ...points.map(yOf)]);
    THROUGH_ORIGIN.set(points, c);
  }
  return c;
}

/**
 * Index of the cell [x_i, x_{i+1}) that holds `at`: 0 below the first knot, n − 2 at or past
 * the last (those cells' cubics are not used outside the knots; see cubicHermiteAt).
 */
export function cubicHermiteCell(c: CubicHermite, at: number): number {
  const x = c.x;
  let lo = 0;
  let hi = x.length - 2;
  if (at >= (x[hi] as number)) return hi;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if ((x[mid] as number) <= at) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/**
 * The curve at `at` (order 0) or its slope (order 1); outside the knots it continues as a
 * straight line with the end slope (linear extrapolation).
 */
export function cubicHermiteAt(c: CubicHermite, at: number, order: 0 | 1 = 0): number {
  const x = c.x;
  const last = x.length - 1;
  const end = at <= (x[0] as number) ? 0 : at >= (x[last] as number) ? last : -1;
  if (end >= 0) {
    const slope = c.slope[end] as number;
    return order === 1 ? slope : (c.y[end] as number) + slope * (at - (x[end] as number));
  }
  return cubicHermiteCellAt(c, cubicHermiteCell(c, at), at, order);
}

/**
 * Cell `i`'s cubic at `at` — its value (order 0), slope (1) or second derivative (2) — for any
 * `at`: outside the cell it is the cell's cubic extended, smooth.
 */
export function cubicHermiteCellAt(c: CubicHermite, i: number, at: number, order: 0 | 1 | 2 = 0): number {
  const x0 = c.x[i] as number;
  const h = (c.x[i + 1] as number) - x0;
  const t = (at - x0) / h;
  const y0 = c.y[i] as number;
  const m0 = (c.slope[i] as number) * h;
  const dy = (c.y[i + 1] as number) - y0;
  const m1 = (c.slope[i + 1] as number) * h;
  // The Hermite cubic in powers of t: y0 + m0·t + c2·t² + c3·t³.
  const c2 = 3 * dy - 2 * m0 - m1;
  const c3 = m0 + m1 - 2 * dy;
  if (order === 0) return y0 + t * (m0 + t * (c2 + t * c3));
  if (order === 1) return (m0 + t * (2 * c2 + 3 * t * c3)) / h;
  return (2 * c2 + 6 * t * c3) / (h * h);
}
