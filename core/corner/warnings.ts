import type { CornerFigures } from './corner';
import type { RoadSpec } from './corner-file';
import type { Modes } from './modal';
import type { RandomRoadResponse } from './random-road';
import { STEP_HEIGHT, type StepResponse } from './step-response';
import { quantityFormat, type UnitSystem } from '../units/units';

/**
 * A warning from the figures: a stable code for screens and tests, the field it concerns,
 * and a sentence saying what was seen and why it matters.
 */
export type ModelWarning = { code: string; field: string; message: string };

/**
 * The usual bands of the trade the warnings use (common practice, no single source;
 * see the project's reference notes): wide on purpose, so a warning means "look again",
 * not "wrong" — a high-downforce car can sit near 5 Hz.
 */
export const WARNING_BANDS = {
  rideFrequencyHz: { low: 0.5, high: 5 },
  wheelHopFrequencyHz: { low: 8, high: 20 },
  lowSpeedDampingRatio: { low: 0.15, high: 1.2 },
  unsprungRatio: { low: 0.05, high: 0.3 },
  /**
   * Dynamic tyre load RMS ÷ static load on a random road: above a half, the load falls to
   * zero often (for a Gaussian load, below −2σ about one time in 44), so the tyre is barely in
   * contact (common practice).
   */
  tireLoadRmsRatio: { high: 0.5 },
} as const;

const f2 = (x: number) => x.toFixed(2);

/** Warnings from a corner's linear figures, modes and step response; quantities written in `units`. */
export function cornerWarnings(
  figures: CornerFigures,
  modes?: Modes,
  step?: StepResponse,
  units: UnitSystem = 'si',
): ModelWarning[] {
  const damping = (c: number) => quantityFormat(c, 'damping', units);
  const out: ModelWarning[] = [];
  const b = WARNING_BANDS;
  const ride = figures.rideFrequencyHz;
  if (ride < b.rideFrequencyHz.low) {
    out.push({
      code: 'ride-frequency-low',
      field: 'springRate',
      message: `Ride frequency ${f2(ride)} Hz is below ${b.rideFrequencyHz.low} Hz, softer than even a soft road car: expect large body motion and running out of travel; check the spring rate, motion ratio and corner mass.`,
    });
  } else if (ride > b.rideFrequencyHz.high) {
    out.push({
      code: 'ride-frequency-high',
      field: 'springRate',
      message: `Ride frequency ${f2(ride)} Hz is above ${b.rideFrequencyHz.high} Hz, stiffer than most high-downforce cars: the tyre does most of the suspending and grip over bumps suffers; check the spring rate, motion ratio and corner mass.`,
    });
  }
  const hop = figures.wheelHopFrequencyHz;
  if (hop < b.wheelHopFrequencyHz.low || hop > b.wheelHopFrequencyHz.high) {
    out.push({
      code: hop < b.wheelHopFrequencyHz.low ? 'wheel-hop-low' : 'wheel-hop-high',
      field: 'unsprungMass',
      message: `Wheel-hop frequency ${f2(hop)} Hz is outside the usual ${b.wheelHopFrequencyHz.low}–${b.wheelHopFrequencyHz.high} Hz: check the unsprung mass and tyre rate; a wheel-hop mode near the body's or the road's dominant frequencies costs grip.`,
    });
  }
  for (const dir of ['bump', 'rebound'] as const) {
    const z = figures.dampingRatio[dir];
    if (z < b.lowSpeedDampingRatio.low) {
      out.push({
        code: `damping-low-${dir}`,
        field: `damper.${dir}.lowSpeed`,
        message: `Low-speed ${dir} damping ratio ζ = ${f2(z)} is below ${b.lowSpeedDampingRatio.low}: the body will float and keep oscillating after each input.`,
      });
    } else if (z > b.lowSpeedDampingRatio.high) {
      out.push({
        code: `damping-high-${dir}`,
        field: `damper.${dir}.lowSpeed`,
        message: `Low-speed ${dir} damping ratio ζ = ${f2(z)} is above ${b.lowSpeedDampingRatio.high}: the corner is strongly overdamped, so it is slow to follow the road and the tyre load varies more over bumps.`,
      });
    }
  }
  const w = figures.wheelDamping;
  if (w.rebound < w.bump) {
    out.push({
      code: 'rebound-softer-than-bump',
      field: 'damper.rebound.lowSpeed',
      message: `Low-speed rebound damping (${damping(w.rebound)} at the wheel) is softer than bump (${damping(w.bump)}): most setups run rebound stiffer, because bump damping passes road inputs into the body while rebound controls the body's return.`,
    });
  }
  if (w.reboundHighSpeed < w.bumpHighSpeed) {
    out.push({
      code: 'rebound-softer-than-bump-high-speed',
      field: 'damper.rebound.highSpeed',
      message: `High-speed rebound damping (${damping(w.reboundHighSpeed)} at the wheel) is softer than bump (${damping(w.bumpHighSpeed)}): check the valving and that bump and rebound are not swapped.`,
    });
  }
  const r = figures.unsprungRatio;
  if (r < b.unsprungRatio.low || r > b.unsprungRatio.high) {
    out.push({
      code: 'unsprung-ratio',
      field: 'unsprungMass',
      message: `Unsprung ÷ sprung mass is ${f2(r)}, outside the usual ${b.unsprungRatio.low}–${b.unsprungRatio.high}: check that the corner mass includes the unsprung mass and that the unsprung mass is per corner.`,
    });
  }
  if (modes && modes.body && !modes.wheelHop && modes.overdamped.length > 0) {
    // With very stiff damping the suspension barely moves: the two masses ride the tyre as one.
    out.push({
      code: 'suspension-locked',
      field: 'damper',
      message: `Damping this stiff barely lets the suspension move: body and wheel bounce together on the tyre at ${f2(modes.body.frequencyHz)} Hz (ζ ${f2(modes.body.dampingRatio)}) and the body's own mode does not oscillate; bumps go through the tyre alone.`,
    });
  }
  if (modes && !modes.body) {
    out.push({
      code: 'body-mode-overdamped',
      field: 'damper',
      message:
        'The body mode does not oscillate (overdamped): the body creeps back after an input instead of settling with a small overshoot, and the damping transmits more of the road into the body.',
    });
  }
  if (step && !step.settled) {
    out.push({
      code: 'step-not-settled',
      field: 'damper',
      message: `After a ${quantityFormat(STEP_HEIGHT, 'length', units)} road step the body has not settled within ${step.settlingTime.toFixed(0)} s: the damping is close to none.`,
    });
  }
  return out;
}

/**
 * Warnings from a corner's random-road figures on `road`: dynamic tyre load RMS above
 * WARNING_BANDS.tireLoadRmsRatio of the static load. Quantities written in `units`.
 */
export function randomRoadWarnings(
  response: RandomRoadResponse,
  road: RoadSpec,
  units: UnitSystem = 'si',
): ModelWarning[] {
  const share = response.tireLoadRmsRatio;
  const limit = WARNING_BANDS.tireLoadRmsRatio.high;
  if (!(share > limit)) return [];
  return [
    {
      code: 'tyre-load-rms-high',
      field: 'road',
      message: `On the class ${road.roadClass} road at ${quantityFormat(road.speed, 'speed', units)} the dynamic tyre load RMS is ${(100 * share).toFixed(0)} % of the static load, above ${(100 * limit).toFixed(0)} %: the tyre is barely in contact over much of the road and grip suffers; check the damping against the spring and tyre, and the road and speed chosen.`,
    },
  ];
}
