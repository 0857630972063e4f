import type { BumpStop, ReboundLimit } from '../damper/bump-stop';
import { damperDirectionSlopes, type DamperCurve } from '../damper/damper-curve';
import { InputError, inputFieldPath } from '../units/input-error';
import { numberRounded } from '../units/number-text';

export type { BumpStop, ReboundLimit } from '../damper/bump-stop';

/** Standard gravity (m/s²), as DESIGN.md fixes it for static loads. */
export const STANDARD_GRAVITY = 9.80665;

/**
 * One corner as the shop enters it, SI throughout. Rates and damping are at the
 * spring and damper; motion ratio = spring (or damper) travel ÷ wheel travel.
 */
export type CornerInput = {
  /** Static mass on the wheel, sprung plus unsprung (kg). */
  cornerMass: number;
  unsprungMass: number;
  /** Spring rate at the spring (N/m). */
  springRate: number;
  springMotionRatio: number;
  damperMotionRatio: number;
  /** Vertical tyre rate (N/m). */
  tireRate: number;
  /** Tyre damping (N·s/m); 0 when not known. */
  tireDamping: number;
  damper: DamperCurve;
  bumpStop?: BumpStop;
  /** Droop limit at the damper: extension travel from static and top-out rate. */
  reboundLimit?: ReboundLimit;
  /**
   * Compression travel available at the damper from static ride height to full bump (m), as
   * a shaft marker measures it; only for the "travel beyond the entered limit" warning.
   */
  travelLimit?: number;
};

/** The linearised quarter car at the wheel (DESIGN.md, Conventions). */
export type QuarterCarLinear = {
  sprungMass: number;
  unsprungMass: number;
  /** Wheel rate kw (N/m). */
  wheelRate: number;
  /** Wheel damping c = (c_bump,ls + c_rebound,ls)/2 · MRd² (N·s/m). */
  wheelDamping: number;
  tireRate: number;
  tireDamping: number;
};

export type DampingClass = 'underdamped' | 'critically damped' | 'overdamped';

/**
 * A corner's ζ within this of 1 is called critically damped. Inputs are rarely known
 * better than 1 %, so a finer split would only report noise.
 */
export const CRITICAL_DAMPING_TOLERANCE = 0.01;

/** Four slopes of the damper at the wheel: low- and high-speed, bump and rebound. */
export type DampingSet = { bump: number; rebound: number; bumpHighSpeed: number; reboundHighSpeed: number };

/** The corner's ride figures (DESIGN.md, Conventions), SI. */
export type CornerFigures = {
  sprungMass: number;
  wheelRate: number;
  rideRate: number;
  rideFrequencyHz: number;
  wheelHopFrequencyHz: number;
  /** c_crit = 2√(kw·ms) (N·s/m). */
  criticalDamping: number;
  /** Damping coefficients at the wheel (N·s/m). */
  wheelDamping: DampingSet;
  dampingRatio: DampingSet;
  dampingClass: { bump: DampingClass; rebound: DampingClass };
  /** Unsprung ÷ sprung mass. */
  unsprungRatio: number;
  /** Static tyre load M·g (N). */
  staticTireLoad: number;
  /** Static tyre deflection M·g/kt (m). */
  staticTireDeflection: number;
};

function requirePositive(value: number, field: string, what: string): void {
  if (!Number.isFinite(value))
    throw new InputError(field, `${what} must be a finite number (got ${numberRounded(value)})`);
  if (!(value > 0))
    throw new InputError(field, `${what} must be greater than zero (got ${numberRounded(value)})`);
}

/**
 * Rejects corners no real car has: non-positive masses, rates or motion ratios,
 * unsprung mass not below the corner mass, NaN anywhere.
 * @throws InputError naming the first field that is wrong.
 */
export function cornerValidate(c: CornerInput, field = 'corner'): void {
  const at = (k: string) => inputFieldPath(field, k);
  requirePositive(c.cornerMass, at('cornerMass'), 'corner mass');
  requirePositive(c.unsprungMass, at('unsprungMass'), 'unsprung mass');
  if (!(c.unsprungMass < c.cornerMass)) {
    throw new InputError(
      at('unsprungMass'),
      `unsprung mass (${numberRounded(c.unsprungMass)} kg) must be less than the corner mass (${numberRounded(c.cornerMass)} kg), which includes it`,
    );
  }
  requirePositive(c.springRate, at('springRate'), 'spring rate');
  requirePositive(c.springMotionRatio, at('springMotionRatio'), 'spring motion ratio');
  requirePositive(c.damperMotionRatio, at('damperMotionRatio'), 'damper motion ratio');
  requirePositive(c.tireRate, at('tireRate'), 'tyre rate');
  if (!Number.isFinite(c.tireDamping) || c.tireDamping < 0) {
    throw new InputError(
      at('tireDamping'),
      `tyre damping must be zero or more (got ${numberRounded(c.tireDamping)})`,
    );
  }
  for (const dir of ['bump', 'rebound'] as const) {
    const d = c.damper[dir];
    const s = damperDirectionSlopes(d);
    if (d.kind === 'table') {
      // The table's own checks (pointTableParse) name the point; this catches an empty one.
      requirePositive(s.lowSpeed, inputFieldPath(at('damper'), `${dir}.points`), `${dir} low-speed damping`);
      continue;
    }
    requirePositive(s.lowSpeed, inputFieldPath(at('damper'), `${dir}.lowSpeed`), `${dir} low-speed damping`);
    requirePositive(
      s.highSpeed,
      inputFieldPath(at('damper'), `${dir}.highSpeed`),
      `${dir} high-speed damping`,
    );
  }
  if (c.damper.gasForce !== undefined && !(c.damper.gasForce >= 0)) {
    throw new InputError(
      at('damper.gasForce'),
      `gas force must be zero or more (got ${numberRounded(c.damper.gasForce)})`,
    );
  }
  if (c.bumpStop) {
    const b = c.bumpStop;
    if (!Number.isFinite(b.gap) || b.gap < 0) {
      throw new InputError(
        at('bumpStop.gap'),
        `bump-stop gap must be zero or more (got ${numberRounded(b.gap)})`,
      );
    }
    if ('rate' in b) requirePositive(b.rate, at('bumpStop.rate'), 'bump-stop rate');
    else if (b.curve.length === 0) throw new InputError(at('bumpStop.curve'), 'needs at least one point');
  }
  if (c.reboundLimit) {
    requirePositive(c.reboundLimit.travel, at('reboundLimit.travel'), 'rebound travel');
    requirePositive(c.reboundLimit.rate, at('reboundLimit.rate'), 'top-out rate');
  }
  if (c.travelLimit !== undefined) requirePositive(c.travelLimit, at('travelLimit'), 'travel limit');
}

/** Sprung mass ms = M − mu (kg). */
export function cornerSprungMass(c: Pick<CornerInput, 'cornerMass' | 'unsprungMass'>): number {
  return c.cornerMass - c.unsprungMass;
}

/**
 * Wheel rate kw = k_spring · MRs² (N/m), motion ratio = spring travel ÷ wheel travel
 * (virtual work; Milliken & Milliken, Race Car Vehicle Dynamics, ch. 16).
 * @example cornerWheelRate({ springRate: 65000, springMotionRatio: 0.88, … }) // 50336
 */
export function cornerWheelRate(c: Pick<CornerInput, 'springRate' | 'springMotionRatio'>): number {
  return c.springRate * c.springMotionRatio * c.springMotionRatio;
}

/** Ride rate kr = kw·kt/(kw + kt): wheel rate and tyre in series (N/m; Gillespie, ch. 5). */
export function cornerRideRate(wheelRate: number, tireRate: number): number {
  return (wheelRate * tireRate) / (wheelRate + tireRate);
}

/** Critical damping 2√(k·m) (N·s/m) of a single-degree-of-freedom oscillator. */
export function criticalDampingOf(stiffness: number, mass: number): number {
  return 2 * Math.sqrt(stiffness * mass);
}

/** Damping class of a ratio ζ, with ζ within ±CRITICAL_DAMPING_TOLERANCE of 1 called critical. */
export function dampingClassOf(zeta: number): DampingClass {
  if (Math.abs(zeta - 1) <= CRITICAL_DAMPING_TOLERANCE) return 'critically damped';
  return zeta < 1 ? 'underdamped' : 'overdamped';
}

/** Damper slopes carried to the wheel: c_wheel = c_damper · MRd² (N·s/m). */
export function cornerWheelDamping(c: CornerInput): DampingSet {
  const mr2 = c.damperMotionRatio * c.damperMotionRatio;
  const bump = damperDirectionSlopes(c.damper.bump);
  const rebound = damperDirectionSlopes(c.damper.rebound);
  return {
    bump: bump.lowSpeed * mr2,
    rebound: rebound.lowSpeed * mr2,
    bumpHighSpeed: bump.highSpeed * mr2,
    reboundHighSpeed: rebound.highSpeed * mr2,
  };
}

/**
 * All the corner's ride figures by DESIGN.md's conventions: ride frequency √(kr/ms)/2π,
 * wheel hop √((kw+kt)/mu)/2π, ζ = c_wheel / 2√(kw·ms) for each damper slope.
 */
export function cornerRideFigures(c: CornerInput): CornerFigures {
  const sprungMass = cornerSprungMass(c);
  const wheelRate = cornerWheelRate(c);
  const rideRate = cornerRideRate(wheelRate, c.tireRate);
  const criticalDamping = criticalDampingOf(wheelRate, sprungMass);
  const wheelDamping = cornerWheelDamping(c);
  const dampingRatio: DampingSet = {
    bump: wheelDamping.bump / criticalDamping,
    rebound: wheelDamping.rebound / criticalDamping,
    bumpHighSpeed: wheelDamping.bumpHighSpeed / criticalDamping,
    reboundHighSpeed: wheelDamping.reboundHighSpeed / criticalDamping,
  };
  const staticTireLoad = c.cornerMass * STANDARD_GRAVITY;
  return {
    sprungMass,
    wheelRate,
    rideRate,
    rideFrequencyHz: Math.sqrt(rideRate / sprungMass) / (2 * Math.PI),
    wheelHopFrequencyHz: Math.sqrt((wheelRate + c.tireRate) / c.unsprungMass) / (2 * Math.PI),
    criticalDamping,
    wheelDamping,
    dampingRatio,
    dampingClass: { bump: dampingClassOf(dampingRatio.bump), rebound: dampingClassOf(dampingRatio.rebound) },
    unsprungRatio: c.unsprungMass / sprungMass,
    staticTireLoad,
    staticTireDeflection: staticTireLoad / c.tireRate,
  };
}

/**
 * The linearised quarter car: wheel rate, and the mean of bump and rebound low-speed
 * damping at the wheel (DESIGN.md: modes, frequency response, random road and step use it).
 */
export function cornerQuarterCar(c: CornerInput): QuarterCarLinear {
  const d = cornerWheelDamping(c);
  return {
    sprungMass: cornerSprungMass(c),
    unsprungMass: c.unsprungMass,
    wheelRate: cornerWheelRate(c),
    wheelDamping: (d.bump + d.rebound) / 2,
    tireRate: c.tireRate,
    tireDamping: c.tireDamping,
  };
}
