import fc from 'fast-check';
import { eigs } from 'mathjs';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import type { Complex } from '../../../core/numeric/complex';
import type { QuarterCarLinear } from '../../../core/corner/corner';
import { modesOf, quarterCarStateMatrix, quarterCarUndampedFrequencies } from '../../../core/corner/modal';
import { polynomialRoots } from '../../../core/numeric/polynomial';

/** IRI reference quarter car, ASTM E1926 / Sayers et al. 1986 (World Bank TP 46) [pub], per unit sprung mass. */
const GOLDEN_CAR: QuarterCarLinear = {
  sprungMass: 1,
  unsprungMass: 0.15,
  wheelRate: 63.3,
  wheelDamping: 6.0,
  tireRate: 653,
  tireDamping: 0,
};

/** Eigenvalues from ml-matrix's general (non-symmetric) eigen-decomposition: an independent solver. */
function mlMatrixEigenvalues(q: QuarterCarLinear): Complex[] {
  const e = new EigenvalueDecomposition(new Matrix(quarterCarStateMatrix(q)));
  return e.realEigenvalues.map((re, i) => ({ re, im: e.imaginaryEigenvalues[i] as number }));
}

const sortEig = (l: Complex[]) => [...l].sort((a, b) => a.re - b.re || a.im - b.im);

function expectSameEigenvalues(ours: Complex[], theirs: Complex[], relTol: number) {
  const a = sortEig(ours);
  const b = sortEig(theirs);
  expect(a).toHaveLength(4);
  const scale = Math.max(...b.map((z) => Math.hypot(z.re, z.im)));
  a.forEach((z, i) => {
    const w = b[i] as Complex;
    expect(
      Math.hypot(z.re - w.re, z.im - w.im) / Math.max(Math.hypot(w.re, w.im), 1e-3 * scale),
    ).toBeLessThan(relTol);
  });
}

describe('modesOf', () => {
  it('reproduces the golden-car eigenvalues', () => {
    // REFERENCES §4 [calc; agree with public code]: −2.59007 ± 7.32340i (1.23630 Hz, ζ 0.3334)
    // and −20.40993 ± 64.42263i (10.7554 Hz, ζ 0.3020).
    const m = modesOf(GOLDEN_CAR);
    expect(m.body?.eigenvalue.re).toBeCloseTo(-2.59007, 5);
    expect(m.body?.eigenvalue.im).toBeCloseTo(7.3234, 4);
    expect(m.body?.frequencyHz).toBeCloseTo(1.2363, 4);
    expect(m.body?.dampingRatio).toBeCloseTo(0.3334, 4);
    expect(m.wheelHop?.eigenvalue.re).toBeCloseTo(-20.40993, 5);
    expect(m.wheelHop?.eigenvalue.im).toBeCloseTo(64.42263, 5);
    expect(m.wheelHop?.frequencyHz).toBeCloseTo(10.7554, 4);
    expect(m.wheelHop?.dampingRatio).toBeCloseTo(0.302, 4);
    expect(m.overdamped).toEqual([]);
  });

  it('reproduces the golden car undamped frequencies', () => {
    // REFERENCES §4 [calc]: 1.20830 Hz and 11.00473 Hz (Gillespie ch. 5 formula [mem]).
    const [w1, w2] = quarterCarUndampedFrequencies(GOLDEN_CAR);
    expect(w1 / (2 * Math.PI)).toBeCloseTo(1.2083, 4);
    expect(w2 / (2 * Math.PI)).toBeCloseTo(11.00473, 4);
  });

  it('reproduces the bus quarter-car modes', () => {
    // Parameters: University of Michigan control tutorials [pub]; modes [calc; REFERENCES §4]:
    // 0.8358 Hz (ζ 0.0209) and 6.777 Hz (ζ 0.563).
    const m = modesOf({
      sprungMass: 2500,
      unsprungMass: 320,
      wheelRate: 80_000,
      wheelDamping: 350,
      tireRate: 500_000,
      tireDamping: 15_020,
    });
    expect(m.body?.frequencyHz).toBeCloseTo(0.8358, 4);
    expect(m.body?.dampingRatio).toBeCloseTo(0.0209, 4);
    expect(m.wheelHop?.frequencyHz).toBeCloseTo(6.777, 3);
    expect(m.wheelHop?.dampingRatio).toBeCloseTo(0.563, 3);
  });

  it('agrees with ml-matrix and mathjs eigs on the golden car to 1e-9', () => {
    const ours = modesOf(GOLDEN_CAR).eigenvalues;
    expectSameEigenvalues(ours, mlMatrixEigenvalues(GOLDEN_CAR), 1e-9);
    const mj = eigs(quarterCarStateMatrix(GOLDEN_CAR)).values as unknown as (
      number | { re: number; im: number }
    )[];
    const mjValues = mj.map((v) => (typeof v === 'number' ? { re: v, im: 0 } : { re: v.re, im: v.im }));
    expectSameEigenvalues(ours, mjValues, 1e-9);
  });

  it('agrees with ml-matrix on random corners, damped lightly to heavily (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 1500, noNaN: true }),
        fc.double({ min: 0.05, max: 0.35, noNaN: true }),
        fc.double({ min: 5e3, max: 3e5, noNaN: true }),
        fc.double({ min: 0.02, max: 3, noNaN: true }),
        fc.double({ min: 4, max: 20, noNaN: true }),
        fc.double({ min: 0, max: 0.05, noNaN: true }),
        (ms, muRatio, kw, zeta, ktRatio, ctRatio) => {
          const c = zeta * 2 * Math.sqrt(kw * ms);
          const q: QuarterCarLinear = {
            sprungMass: ms,
            unsprungMass: ms * muRatio,
            wheelRate: kw,
            wheelDamping: c,
            tireRate: kw * ktRatio,
            tireDamping: c * ctRatio,
          };
          expectSameEigenvalues(modesOf(q).eigenvalues, mlMatrixEigenvalues(q), 1e-6);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('reports real eigenvalues as overdamped modes, not as a pair', () => {
    // ζ ≈ 3 on the body: the body pair splits into two real roots.
    const q: QuarterCarLinear = {
      sprungMass: 250,
      unsprungMass: 35,
      wheelRate: 20_000,
      wheelDamping: 3 * 2 * Math.sqrt(20_000 * 250),
      tireRate: 200_000,
      tireDamping: 0,
    };
    const m = modesOf(q);
    const reals = mlMatrixEigenvalues(q).filter((l) => Math.abs(l.im) < 1e-9);
    expect(reals).toHaveLength(2);
    expect(m.overdamped).toHaveLength(2);
    expect(m.body).toBeUndefined();
    expect(m.wheelHop).toBeDefined();
    for (const od of m.overdamped) {
      expect(od.decayRate).toBeGreaterThan(0);
      expect(od.timeConstant).toBeCloseTo(1 / od.decayRate, 12);
      expect(reals.some((r) => Math.abs(-r.re - od.decayRate) < 1e-6 * od.decayRate)).toBe(true);
    }
  });

  it('names a lone pair by the undamped frequency it is nearer to', () => {
    // Heavy tyre damping kills the wheel-hop oscillation, the body still oscillates.
    const q: QuarterCarLinear = {
      sprungMass: 250,
      unsprungMass: 35,
      wheelRate: 20_000,
      wheelDamping: 1500,
      tireRate: 200_000,
      tireDamping: 30_000,
    };
    const m = modesOf(q);
    expect(m.overdamped.length).toBe(2);
    expect(m.body).toBeDefined();
    expect(m.wheelHop).toBeUndefined();
  });
});

describe('polynomialRoots', () => {
  it('finds the roots of (z−1)(z+2)(z²+2z+5)', () => {
    // (z−1)(z+2) = z² + z − 2; × (z² + 2z + 5) = z⁴ + 3z³ + 5z² + z − 10
    const r = sortEig(polynomialRoots([-10, 1, 5, 3, 1]));
    expect(r.map((z) => [z.re, z.im].map((x) => Number(x.toFixed(12))))).toEqual([
      [-2, 0],
      [-1, -2],
      [-1, 2],
      [1, 0],
    ]);
  });

  it('finds a repeated root to about √ε', () => {
    // (z + 3)² = z² + 6z + 9: the critically damped case.
    const r = polynomialRoots([9, 6, 1]);
    for (const z of r) expect(Math.hypot(z.re + 3, z.im)).toBeLessThan(1e-7);
  });

  it('handles roots at zero and a leading zero coefficient', () => {
    const r = sortEig(polynomialRoots([0, 0, -4, 1, 0]));
    expect(r.map((z) => Number(z.re.toFixed(12)))).toEqual([0, 0, 4]);
    expect(polynomialRoots([5])).toEqual([]);
  });
});
