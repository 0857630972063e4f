import { complexAbs, complexDiv, complexMul, complexSub, type Complex } from '../numeric/complex';
import type { QuarterCarLinear } from './corner';

/** Complex gains of the linear quarter car per metre of road displacement at one frequency. */
export type FrequencyResponse = {
  frequencyHz: number;
  /** Body displacement zs/zr. */
  body: Complex;
  /** Wheel displacement zu/zr. */
  wheel: Complex;
  /** Body acceleration (m/s² per m). */
  bodyAccel: Complex;
  /** Dynamic tyre force kt(zr − zu) + ct(żr − żu), compression positive (N per m). */
  tireLoad: Complex;
  /** Suspension travel zu − zs, compression positive (m per m). */
  travel: Complex;
};

/** Magnitudes of the gains, as the JSON contract reports them. */
export type FrequencyResponseMagnitude = {
  frequencyHz: number;
  bodyAccel: number;
  tireLoad: number;
  travel: number;
};

/**
 * The steady-state response of the linear quarter car to a road zr = e^{iωt}: the 2×2
 * complex system [−ω²M + iωC + K]·[Zs, Zu] = [0, kt + iω·ct] solved by Cramer's rule.
 * Magnitudes are per metre of road displacement.
 */
export function frequencyResponseAt(q: QuarterCarLinear, frequencyHz: number): FrequencyResponse {
  const w = 2 * Math.PI * frequencyHz;
  const {
    sprungMass: ms,
    unsprungMass: mu,
    wheelRate: k,
    wheelDamping: c,
    tireRate: kt,
    tireDamping: ct,
  } = q;
  const d11: Complex = { re: k - ms * w * w, im: c * w };
  const d12: Complex = { re: -k, im: -c * w };
  const d22: Complex = { re: k + kt - mu * w * w, im: (c + ct) * w };
  const tire: Complex = { re: kt, im: ct * w };
  const det = complexSub(complexMul(d11, d22), complexMul(d12, d12));
  const body = complexDiv(complexMul({ re: -d12.re, im: -d12.im }, tire), det);
  const wheel = complexDiv(complexMul(d11, tire), det);
  return {
    frequencyHz,
    body,
    wheel,
    bodyAccel: { re: -w * w * body.re, im: -w * w * body.im },
    tireLoad: complexMul(tire, { re: 1 - wheel.re, im: -wheel.im }),
    travel: complexSub(wheel, body),
  };
}

/** |gains| at one frequency: body acceleration (m/s² per m), tyre load (N per m), travel (m per m). */
export function frequencyResponseMagnitudeAt(
  q: QuarterCarLinear,
  frequencyHz: number,
): FrequencyResponseMagnitude {
  const r = frequencyResponseAt(q, frequencyHz);
  return {
    frequencyHz,
    bodyAccel: complexAbs(r.bodyAccel),
    tireLoad: complexAbs(r.tireLoad),
    travel: complexAbs(r.travel),
  };
}

/** Default frequencies of the command's `frf[]` (Hz). */
export const DEFAULT_RESPONSE_FREQUENCIES_HZ: readonly number[] = [0.5, 1, 2, 5, 10, 15, 25];

/** Log-spaced frequencies from `lowHz` to `highHz`, `perDecade` points a decade, for plots. */
export function frequencyResponseGrid(lowHz: number, highHz: number, perDecade = 40): number[] {
  const decades = Math.log10(highHz / lowHz);
  const n = Math.max(2, Math.ceil(decades * perDecade) + 1);
  return Array.from({ length: n }, (_, i) => lowHz * Math.pow(highHz / lowHz, i / (n - 1)));
}
