import type { Complex } from '../numeric/complex';
import type { QuarterCarLinear } from './corner';
import { polynomialRoots } from '../numeric/polynomial';

/** An oscillating mode: a complex eigenvalue pair λ, λ̄. */
export type Mode = {
  /** Natural frequency |λ|/2π (Hz). */
  frequencyHz: number;
  /** Damped frequency Im λ/2π (Hz). */
  dampedFrequencyHz: number;
  /** ζ = −Re λ / |λ|. */
  dampingRatio: number;
  /** The eigenvalue with positive imaginary part (1/s). */
  eigenvalue: Complex;
};

/** A mode that does not oscillate: a real eigenvalue λ < 0. */
export type OverdampedMode = {
  /** Decay rate −λ (1/s). */
  decayRate: number;
  /** Time constant −1/λ (s). */
  timeConstant: number;
};

/** The linear quarter car's modes: body and wheel hop where they oscillate, real modes as they are. */
export type Modes = {
  body?: Mode;
  wheelHop?: Mode;
  overdamped: OverdampedMode[];
  /** All four eigenvalues of the state matrix. */
  eigenvalues: Complex[];
};

/**
 * The 4×4 state matrix A of the linear quarter car, states [zs, zu, vs, vu]
 * (body and wheel displacement and velocity), so that ẋ = A·x + road terms:
 *   ms·zs″ = −kw(zs − zu) − c(vs − vu)
 *   mu·zu″ =  kw(zs − zu) + c(vs − vu) − kt·zu − ct·vu   (+ kt·zr + ct·żr)
 */
export function quarterCarStateMatrix(q: QuarterCarLinear): number[][] {
  const {
    sprungMass: ms,
    unsprungMass: mu,
    wheelRate: k,
    wheelDamping: c,
    tireRate: kt,
    tireDamping: ct,
  } = q;
  return [
    [0, 0, 1, 0],
    [0, 0, 0, 1],
    [-k / ms, k / ms, -c / ms, c / ms],
    [k / mu, -(k + kt) / mu, c / mu, -(c + ct) / mu],
  ];
}

/**
 * Characteristic polynomial det(λ²M + λC + K) of the quarter car, ascending coefficients:
 * ms·mu λ⁴ + (ms(c+ct) + mu·c) λ³ + (ms(kw+kt) + mu·kw + c·ct) λ² + (c·kt + kw·ct) λ + kw·kt.
 * Its roots are the eigenvalues of `quarterCarStateMatrix`.
 */
export function quarterCarCharacteristicPolynomial(q: QuarterCarLinear): number[] {
  const {
    sprungMass: ms,
    unsprungMass: mu,
    wheelRate: k,
    wheelDamping: c,
    tireRate: kt,
    tireDamping: ct,
  } = q;
  return [k * kt, c * kt + k * ct, ms * (k + kt) + mu * k + c * ct, ms * (c + ct) + mu * c, ms * mu];
}

/**
 * Undamped natural frequencies (rad/s) of the quarter car, lower then upper:
 * ω² = ½[a ∓ √(a² − 4b)], a = kw/ms + (kw+kt)/mu, b = kw·kt/(ms·mu) (Gillespie, ch. 5).
 */
export function quarterCarUndampedFrequencies(q: QuarterCarLinear): [number, number] {
  const a = q.wheelRate / q.sprungMass + (q.wheelRate + q.tireRate) / q.unsprungMass;
  const b = (q.wheelRate * q.tireRate) / (q.sprungMass * q.unsprungMass);
  const root = Math.sqrt(Math.max(0, a * a - 4 * b));
  return [Math.sqrt((a - root) / 2), Math.sqrt((a + root) / 2)];
}

function modeOf(lambda: Complex): Mode {
  const mag = Math.hypot(lambda.re, lambda.im);
  return {
    frequencyHz: mag / (2 * Math.PI),
    dampedFrequencyHz: Math.abs(lambda.im) / (2 * Math.PI),
    dampingRatio: -lambda.re / mag,
    eigenvalue: { re: lambda.re, im: Math.abs(lambda.im) },
  };
}

/**
 * The modes of the linear quarter car from the eigenvalues of its state matrix.
 * A complex pair gives frequency |λ|/2π and ζ = −Re λ/|λ|. With two pairs the lower is the
 * body mode and the upper wheel hop. With one pair, it is named for the undamped frequency
 * (body or wheel hop) it lies nearer to on a log scale; real eigenvalues are reported as
 * overdamped modes and never forced into a pair.
 */
export function modesOf(q: QuarterCarLinear): Modes {
  const eigenvalues = polynomialRoots(quarterCarCharacteristicPolynomial(q));
  const pairs = eigenvalues
    .filter((l) => l.im > 0)
    .sort((a, b) => Math.hypot(a.re, a.im) - Math.hypot(b.re, b.im));
  const overdamped = eigenvalues
    .filter((l) => l.im === 0)
    .sort((a, b) => b.re - a.re)
    .map((l) => ({ decayRate: -l.re, timeConstant: -1 / l.re }));
  const modes: Modes = { overdamped, eigenvalues };
  const [first, second] = pairs;
  if (first && second) {
    modes.body = modeOf(first);
    modes.wheelHop = modeOf(second);
  } else if (first) {
    const [wBody, wHop] = quarterCarUndampedFrequencies(q);
    const w = Math.hypot(first.re, first.im);
    if (Math.abs(Math.log(w / wBody)) <= Math.abs(Math.log(w / wHop))) modes.body = modeOf(first);
    else modes.wheelHop = modeOf(first);
  }
  return modes;
}
