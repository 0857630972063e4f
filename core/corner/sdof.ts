/**
 * The single-degree-of-freedom oscillator m·x″ + c·x′ + k·x = 0 by its characteristic
 * equation m·λ² + c·λ + k = 0 (any vibrations text, e.g. Rao, Mechanical Vibrations, ch. 2):
 * distinct real roots (overdamped), a repeated root (critically damped), a complex pair
 * (underdamped), or c = 0 (simple harmonic motion, which never decays).
 */
export type SdofCase = 'overdamped' | 'critically damped' | 'underdamped' | 'undamped';

export type Sdof = { mass: number; damping: number; stiffness: number };

/** Discriminants within this fraction of c² + 4mk are taken as the repeated root. */
const REPEATED_ROOT_TOLERANCE = 1e-12;

/** ωn = √(k/m) (rad/s). */
export function sdofNaturalFrequency(s: Sdof): number {
  return Math.sqrt(s.stiffness / s.mass);
}

/** ζ = c / 2√(km). */
export function sdofDampingRatio(s: Sdof): number {
  return s.damping / (2 * Math.sqrt(s.stiffness * s.mass));
}

/** Which of the characteristic equation's cases the oscillator falls in. */
export function sdofCase(s: Sdof): SdofCase {
  if (s.damping === 0) return 'undamped';
  const disc = s.damping * s.damping - 4 * s.mass * s.stiffness;
  const scale = s.damping * s.damping + 4 * s.mass * s.stiffness;
  if (Math.abs(disc) <= REPEATED_ROOT_TOLERANCE * scale) return 'critically damped';
  return disc > 0 ? 'overdamped' : 'underdamped';
}

/**
 * Free response x(t) from x(0) = x0, x′(0) = v0, by the case of the characteristic roots:
 * - distinct real λ1, λ2: x = C1·e^{λ1 t} + C2·e^{λ2 t}
 * - repeated λ: x = (A + B·t)·e^{λ t}
 * - complex −σ ± iωd: x = e^{−σt}(x0·cos ωd t + (v0 + σ·x0)/ωd · sin ωd t)
 * with the constants fixed by the two initial conditions.
 */
export function sdofFreeResponse(s: Sdof, x0: number, v0: number): (t: number) => number {
  const { mass: m, damping: c, stiffness: k } = s;
  switch (sdofCase(s)) {
    case 'overdamped': {
      const root = Math.sqrt(c * c - 4 * m * k);
      const l1 = (-c + root) / (2 * m);
      const l2 = (-c - root) / (2 * m);
      const c1 = (v0 - l2 * x0) / (l1 - l2);
      const c2 = x0 - c1;
      return (t) => c1 * Math.exp(l1 * t) + c2 * Math.exp(l2 * t);
    }
    case 'critically damped': {
      const l = -c / (2 * m);
      const b = v0 - l * x0;
      return (t) => (x0 + b * t) * Math.exp(l * t);
    }
    case 'underdamped':
    case 'undamped': {
      const sigma = c / (2 * m);
      const wd = Math.sqrt(4 * m * k - c * c) / (2 * m);
      const b = (v0 + sigma * x0) / wd;
      return (t) => Math.exp(-sigma * t) * (x0 * Math.cos(wd * t) + b * Math.sin(wd * t));
    }
  }
}

/** Peak overshoot of the standard second-order step response, Mp = exp(−ζπ/√(1−ζ²)), for ζ < 1. */
export function sdofStepOvershoot(zeta: number): number {
  return zeta >= 1 ? 0 : Math.exp((-zeta * Math.PI) / Math.sqrt(1 - zeta * zeta));
}

/** Logarithmic decrement δ = ln(x_n / x_{n+1}) = 2πζ/√(1−ζ²) of an underdamped oscillator. */
export function sdofLogDecrement(zeta: number): number {
  return (2 * Math.PI * zeta) / Math.sqrt(1 - zeta * zeta);
}

/**
 * Base-excitation displacement transmissibility X/Y = √[(1 + (2ζr)²) / ((1 − r²)² + (2ζr)²)]
 * at frequency ratio r = ω/ωn: a mass on a spring and damper over a moving base.
 */
export function sdofBaseTransmissibility(r: number, zeta: number): number {
  const a = (2 * zeta * r) ** 2;
  return Math.sqrt((1 + a) / ((1 - r * r) ** 2 + a));
}
