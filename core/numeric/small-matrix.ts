/** Small dense matrices (a 4×4 state matrix and its like) as arrays of rows. */
export type Matrix = number[][];

function at(m: Matrix, i: number, j: number): number {
  return (m[i] as number[])[j] as number;
}

export function matrixIdentity(n: number): Matrix {
  return Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
}

export function matrixMultiply(a: Matrix, b: Matrix): Matrix {
  const n = a.length;
  const m = (b[0] as number[]).length;
  const inner = b.length;
  const out: Matrix = [];
  for (let i = 0; i < n; i++) {
    const row = new Array<number>(m).fill(0);
    for (let k = 0; k < inner; k++) {
      const aik = at(a, i, k);
      if (aik === 0) continue;
      const bk = b[k] as number[];
      for (let j = 0; j < m; j++) row[j] = (row[j] as number) + aik * (bk[j] as number);
    }
    out.push(row);
  }
  return out;
}

export function matrixScale(a: Matrix, s: number): Matrix {
  return a.map((row) => row.map((x) => x * s));
}

export function matrixAdd(a: Matrix, b: Matrix): Matrix {
  return a.map((row, i) => row.map((x, j) => x + at(b, i, j)));
}

export function matrixVector(a: Matrix, x: readonly number[]): number[] {
  return a.map((row) => row.reduce((s, aij, j) => s + aij * (x[j] as number), 0));
}

/** The 1-norm: largest column sum of |a_ij|. */
export function matrixNorm1(a: Matrix): number {
  let best = 0;
  for (let j = 0; j < a.length; j++) {
    let s = 0;
    for (let i = 0; i < a.length; i++) s += Math.abs(at(a, i, j));
    best = Math.max(best, s);
  }
  return best;
}

/** Solves A·X = B by LU with partial pivoting; throws on a singular A. */
export function matrixSolve(a: Matrix, b: Matrix): Matrix {
  const n = a.length;
  const lu = a.map((row) => row.slice());
  const x = b.map((row) => row.slice());
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(at(lu, i, k)) > Math.abs(at(lu, p, k))) p = i;
    if (at(lu, p, k) === 0) throw new Error('matrixSolve: singular matrix');
    [lu[k], lu[p]] = [lu[p] as number[], lu[k] as number[]];
    [x[k], x[p]] = [x[p] as number[], x[k] as number[]];
    const rowK = lu[k] as number[];
    const xK = x[k] as number[];
    for (let i = k + 1; i < n; i++) {
      const rowI = lu[i] as number[];
      const xI = x[i] as number[];
      const factor = (rowI[k] as number) / (rowK[k] as number);
      if (factor === 0) continue;
      for (let j = k; j < n; j++) rowI[j] = (rowI[j] as number) - factor * (rowK[j] as number);
      for (let j = 0; j < xI.length; j++) xI[j] = (xI[j] as number) - factor * (xK[j] as number);
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    const rowK = lu[k] as number[];
    const xK = x[k] as number[];
    for (let i = k + 1; i < n; i++) {
      const xi = x[i] as number[];
      const f = rowK[i] as number;
      for (let j = 0; j < xK.length; j++) xK[j] = (xK[j] as number) - f * (xi[j] as number);
    }
    for (let j = 0; j < xK.length; j++) xK[j] = (xK[j] as number) / (rowK[k] as number);
  }
  return x;
}

const PADE_ORDER = 6;
const PADE_COEFFS = (() => {
  const fact = (k: number): number => (k <= 1 ? 1 : k * fact(k - 1));
  const q = PADE_ORDER;
  return Array.from(
    { length: q + 1 },
    (_, k) => (fact(2 * q - k) * fact(q)) / (fact(2 * q) * fact(k) * fact(q - k)),
  );
})();

/**
 * The matrix exponential e^A by scaling and squaring with a [6/6] Padé approximant
 * (Moler & Van Loan, "Nineteen dubious ways…", method 3): A is scaled to ‖A‖₁ ≤ 1/2,
 * where the approximant's error is below 4·10⁻¹⁶, then squared back.
 */
export function matrixExponential(a: Matrix): Matrix {
  const n = a.length;
  const norm = matrixNorm1(a);
  const squarings = norm > 0.5 ? Math.ceil(Math.log2(norm / 0.5)) : 0;
  const x = matrixScale(a, Math.pow(2, -squarings));
  let power = matrixIdentity(n);
  let num = matrixScale(power, PADE_COEFFS[0] as number);
  let den = matrixScale(power, PADE_COEFFS[0] as number);
  for (let k = 1; k <= PADE_ORDER; k++) {
    power = matrixMultiply(power, x);
    const term = matrixScale(power, PADE_COEFFS[k] as number);
    num = matrixAdd(num, term);
    den = k % 2 === 0 ? matrixAdd(den, term) : matrixAdd(den, matrixScale(term, -1));
  }
  let e = matrixSolve(den, num);
  for (let s = 0; s < squarings; s++) e = matrixMultiply(e, e);
  return e;
}
