import { complexAbs, complexMul } from '../numeric/complex';
import { STANDARD_GRAVITY, type QuarterCarLinear } from './corner';
import { frequencyResponseAt } from './frequency-response';
import { wkWeightingGain } from './iso2631';
import { modesOf } from './modal';
import { integrateAdaptive } from '../numeric/quadrature';

/** ISO 8608 road classes, smoothest first. */
export const ISO8608_CLASSES = ['A', 'B', 'C', 'D', 'E', 'F', 'G', 'H'] as const;
export type Iso8608Class = (typeof ISO8608_CLASSES)[number];

/** Reference spatial frequency n0 of ISO 8608 (cycles/m). */
export const ISO8608_N0 = 0.1;

/** Spatial-frequency band over which random-road figures are integrated (cycles/m), ISO 8608. */
export const ISO8608_BAND = { low: 0.011, high: 2.83 } as const;

/**
 * Geometric-mean Gd(n0) of an ISO 8608 class (m³): A 16·10⁻⁶, ×4 a class up to H 262144·10⁻⁶.
 * This is the spatial-frequency form (n0 = 0.1 cycles/m), not the angular one, which is 16× smaller.
 */
export function iso8608ClassGd0(roadClass: Iso8608Class): number {
  return 16e-6 * Math.pow(4, ISO8608_CLASSES.indexOf(roadClass));
}

/** Road displacement PSD Gd(n) = Gd(n0)·(n/n0)⁻² (m³, one-sided; ISO 8608 with waviness w = 2). */
export function iso8608DisplacementPsd(n: number, roadClass: Iso8608Class): number {
  const r = n / ISO8608_N0;
  return iso8608ClassGd0(roadClass) / (r * r);
}

/** RMS responses of the linear quarter car on a random road. */
export type RandomRoadResponse = {
  /** RMS body acceleration (m/s²). */
  bodyAccelRms: number;
  /** RMS body acceleration weighted by ISO 2631-1 Wk (m/s²). */
  bodyAccelWeightedRms: number;
  /** RMS dynamic tyre load (N). */
  tireLoadRms: number;
  /** RMS dynamic tyre load ÷ static tyre load (M·g). */
  tireLoadRmsRatio: number;
  /** RMS suspension travel (m). */
  travelRms: number;
  /** RMS road height over the band (m). */
  roadRms: number;
};

export type RandomRoadOptions = {
  /** Spatial band (cycles/m); ISO8608_BAND unless given. */
  band?: { low: number; high: number };
  /** Relative accuracy of each integral. */
  relTol?: number;
};

/**
 * RMS responses of the linear quarter car driven at `speed` (m/s) over an ISO 8608 class, by
 * spectral integration: RMS = √∫|H(f)|²·G(f) df, with the temporal PSD G(f) = Gd(f/V)/V over
 * the band n·V. Each integral is adaptive Gauss–Kronrod in ln f, broken at the modes, to 1e-8.
 */
export function randomRoadResponse(
  q: QuarterCarLinear,
  road: { roadClass: Iso8608Class; speed: number },
  options: RandomRoadOptions = {},
): RandomRoadResponse {
  const band = options.band ?? ISO8608_BAND;
  const relTol = options.relTol ?? 1e-8;
  const v = road.speed;
  const gd0 = iso8608ClassGd0(road.roadClass);
  const lo = Math.log(band.low * v);
  const hi = Math.log(band.high * v);
  const modes = modesOf(q);
  const breakpoints = [modes.body, modes.wheelHop]
    .filter((m) => m !== undefined)
    .map((m) => Math.log(m.dampedFrequencyHz))
    .concat([Math.log((1 / (2 * Math.PI)) * Math.sqrt(q.tireRate / q.unsprungMass))]);
  // G(f)·df in u = ln f: Gd0·n0²·V/f² · f du = Gd0·n0²·V/f du
  const psdDu = (f: number) => (gd0 * ISO8608_N0 * ISO8608_N0 * v) / f;
  const integral = (gain2: (f: number) => number) =>
    integrateAdaptive(
      (u) => {
        const f = Math.exp(u);
        return gain2(f) * psdDu(f);
      },
      lo,
      hi,
      { relTol, breakpoints },
    ).value;
  const accel2 = integral((f) => complexAbs(frequencyResponseAt(q, f).bodyAccel) ** 2);
  const weighted2 = integral(
    (f) => complexAbs(complexMul(frequencyResponseAt(q, f).bodyAccel, wkWeightingGain(f))) ** 2,
  );
  const tire2 = integral((f) => complexAbs(frequencyResponseAt(q, f).tireLoad) ** 2);
  const travel2 = integral((f) => complexAbs(frequencyResponseAt(q, f).travel) ** 2);
  const road2 = gd0 * ISO8608_N0 * ISO8608_N0 * (1 / band.low - 1 / band.high);
  const staticTireLoad = (q.sprungMass + q.unsprungMass) * STANDARD_GRAVITY;
  const tireLoadRms = Math.sqrt(tire2);
  return {
    bodyAccelRms: Math.sqrt(accel2),
    bodyAccelWeightedRms: Math.sqrt(weighted2),
    tireLoadRms,
    tireLoadRmsRatio: tireLoadRms / staticTireLoad,
    travelRms: Math.sqrt(travel2),
    roadRms: Math.sqrt(road2),
  };
}
