import { complexAbs, complexDiv, complexMul, complexSub, type Complex } from './complex';

/** Value and derivative of a polynomial with real coefficients (ascending: a0 + a1·z + …) at z (Horner). */
function polynomialWithDerivativeAt(coeffs: readonly number[], z: Complex): { p: Complex; dp: Complex } {
  const n = coeffs.length - 1;
  let pr = coeffs[n] ?? 0;
  let pi = 0;
  let dr = 0;
  let di = 0;
  for (let k = n - 1; k >= 0; k--) {
    const ndr = dr * z.re - di * z.im + pr;
    const ndi = dr * z.im + di * z.re + pi;
    dr = ndr;
    di = ndi;
    const npr = pr * z.re - pi * z.im + (coeffs[k] ?? 0);
    const npi = pr * z.im + pi * z.re;
    pr = npr;
    pi = npi;
  }
  return { p: { re: pr, im: pi }, dp: { re: dr, im: di } };
}

/** Imaginary parts at or below this fraction of |z| are taken as round-off on a real root. */
export const REAL_ROOT_TOLERANCE = 1e-7;

/**
 * All roots of a polynomial with real coefficients (ascending order, leading one non-zero),
 * by the Aberth–Ehrlich simultaneous iteration (Aberth 1973), with conjugate pairs made
 * exactly symmetric and near-real roots made real. Accurate to round-off for simple roots;
 * a repeated root (critical damping) is found to about √ε relative.
 */
export function polynomialRoots(coeffs: readonly number[]): Complex[] {
  let n = coeffs.length - 1;
  while (n > 0 && coeffs[n] === 0) n--;
  if (n < 1) return [];
  const a = coeffs.slice(0, n + 1);
  // Roots at zero first: they would stall the iteration's starting circle.
  let zeros = 0;
  while (zeros < n && a[zeros] === 0) zeros++;
  const b = a.slice(zeros);
  const m = b.length - 1;
  const roots: Complex[] = [];
  for (let k = 0; k < zeros; k++) roots.push({ re: 0, im: 0 });
  if (m === 0) return roots;
  const lead = b[m] as number;
  const radius = Math.pow(Math.abs((b[0] as number) / lead), 1 / m);
  const z: Complex[] = [];
  for (let k = 0; k < m; k++) {
    const angle = (2 * Math.PI * k) / m + 0.4;
    z.push({ re: radius * Math.cos(angle), im: radius * Math.sin(angle) });
  }
  for (let iter = 0; iter < 500; iter++) {
    let worst = 0;
    for (let k = 0; k < m; k++) {
      const zk = z[k] as Complex;
      const { p, dp } = polynomialWithDerivativeAt(b, zk);
      if (p.re === 0 && p.im === 0) continue;
      const ratio = complexDiv(p, dp);
      let sr = 0;
      let si = 0;
      for (let j = 0; j < m; j++) {
        if (j === k) continue;
        const inv = complexDiv({ re: 1, im: 0 }, complexSub(zk, z[j] as Complex));
        sr += inv.re;
        si += inv.im;
      }
      const denom = complexSub({ re: 1, im: 0 }, complexMul(ratio, { re: sr, im: si }));
      const w = complexDiv(ratio, denom);
      z[k] = complexSub(zk, w);
      worst = Math.max(worst, complexAbs(w) / Math.max(complexAbs(z[k] as Complex), Number.MIN_VALUE));
    }
    if (worst < 4 * Number.EPSILON) break;
  }
  const used = new Array<boolean>(m).fill(false);
  for (let k = 0; k < m; k++) {
    if (used[k]) continue;
    used[k] = true;
    const zk = z[k] as Complex;
    const mag = complexAbs(zk);
    if (Math.abs(zk.im) <= REAL_ROOT_TOLERANCE * mag) {
      roots.push({ re: zk.re, im: 0 });
      continue;
    }
    // Pair with the nearest unused root to its conjugate and average the two.
    let best = -1;
    let bestDistance = Infinity;
    for (let j = 0; j < m; j++) {
      if (used[j]) continue;
      const zj = z[j] as Complex;
      const d = Math.hypot(zj.re - zk.re, zj.im + zk.im);
      if (d < bestDistance) {
        bestDistance = d;
        best = j;
      }
    }
    if (best < 0) {
      roots.push(zk);
      continue;
    }
    used[best] = true;
    const zj = z[best] as Complex;
    const re = (zk.re + zj.re) / 2;
    const im = Math.abs(zk.im - zj.im) / 2;
    roots.push({ re, im }, { re, im: -im });
  }
  return roots;
}
