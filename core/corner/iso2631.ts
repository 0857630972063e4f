import { complexAbs, complexDiv, complexMul, type Complex } from '../numeric/complex';

/** Parameters of the Wk frequency weighting, ISO 2631-1:1997 Annex A (Table A.2). */
export const WK_PARAMETERS = {
  f1: 0.4,
  f2: 100,
  q1: Math.SQRT1_2,
  f3: 12.5,
  f4: 12.5,
  q4: 0.63,
  f5: 2.37,
  q5: 0.91,
  f6: 3.35,
  q6: 0.91,
} as const;

/** s² + s·ωn/q + ωn² at s = iω: one second-order factor. */
function quadratic(w: number, wn: number, q: number): Complex {
  return { re: wn * wn - w * w, im: (w * wn) / q };
}

/**
 * Complex gain of the ISO 2631-1 Wk weighting (vertical whole-body vibration) at `frequencyHz`:
 * the band limit Hh·Hl (0.4–100 Hz, Butterworth Q = 1/√2), the acceleration–velocity
 * transition Ht and the upward step Hs, as in ISO 2631-1:1997 Annex A. Hs carries (f5/f6)²
 * so that it tends to 1 at high frequency.
 */
export function wkWeightingGain(frequencyHz: number): Complex {
  const p = WK_PARAMETERS;
  const w = 2 * Math.PI * frequencyHz;
  const w1 = 2 * Math.PI * p.f1;
  const w2 = 2 * Math.PI * p.f2;
  const w3 = 2 * Math.PI * p.f3;
  const w4 = 2 * Math.PI * p.f4;
  const w5 = 2 * Math.PI * p.f5;
  const w6 = 2 * Math.PI * p.f6;
  // Hh = s²/(s² + s·ω1/Q1 + ω1²); Hl = ω2²/(s² + s·ω2/Q1 + ω2²)
  const hh = complexDiv({ re: -w * w, im: 0 }, quadratic(w, w1, p.q1));
  const hl = complexDiv({ re: w2 * w2, im: 0 }, quadratic(w, w2, p.q1));
  // Ht = (1 + s/ω3) / (1 + s/(Q4·ω4) + s²/ω4²)
  const ht = complexDiv({ re: 1, im: w / w3 }, { re: 1 - (w * w) / (w4 * w4), im: w / (p.q4 * w4) });
  // Hs = (s² + s·ω5/Q5 + ω5²) / (s² + s·ω6/Q6 + ω6²)
  const hs = complexDiv(quadratic(w, w5, p.q5), quadratic(w, w6, p.q6));
  return complexMul(complexMul(hh, hl), complexMul(ht, hs));
}

/**
 * |Wk| at `frequencyHz`, the factor applied to vertical acceleration before its RMS is taken
 * for comfort (ISO 2631-1:1997).
 * @example wkWeighting(8) // ≈ 1.036 (ISO 2631-1 Table 3)
 */
export function wkWeighting(frequencyHz: number): number {
  return complexAbs(wkWeightingGain(frequencyHz));
}
