const GOLDEN = 0.3819660112501051; // (3 − √5)/2

/**
 * The maximum of f on [a, b] near `guess` by Brent's method (golden section with parabolic
 * steps; Brent 1973, "Algorithms for Minimization without Derivatives", ch. 5), to `tol` in x.
 * It only ever moves to better points, so the value returned is at least f(guess).
 */
export function scalarMaximum(
  f: (x: number) => number,
  a: number,
  b: number,
  guess: number,
  tol: number,
): { x: number; value: number } {
  let x = Math.min(b, Math.max(a, guess));
  let w = x;
  let v = x;
  let fx = -f(x);
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  for (let iter = 0; iter < 100; iter++) {
    const m = 0.5 * (a + b);
    const tol1 = tol + 1e-15 * Math.abs(x);
    const tol2 = 2 * tol1;
    if (Math.abs(x - m) <= tol2 - 0.5 * (b - a)) break;
    let parabolic = false;
    if (Math.abs(e) > tol1) {
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = x < m ? tol1 : -tol1;
        parabolic = true;
      }
    }
    if (!parabolic) {
      e = x < m ? b - x : a - x;
      d = GOLDEN * e;
    }
    const u = Math.abs(d) >= tol1 ? x + d : x + (d > 0 ? tol1 : -tol1);
    const fu = -f(u);
    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return { x, value: -fx };
}
