import fc from 'fast-check';
import { expm, matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { quarterCarStateMatrix } from '../../../core/corner/modal';
import {
  matrixExponential,
  matrixMultiply,
  matrixSolve,
  type Matrix,
} from '../../../core/numeric/small-matrix';

const GOLDEN_CAR = {
  sprungMass: 1,
  unsprungMass: 0.15,
  wheelRate: 63.3,
  wheelDamping: 6,
  tireRate: 653,
  tireDamping: 0,
};

describe('matrixExponential', () => {
  it('reproduces the ASTM E1926 golden-car state transition over 0.25 m at 80 km/h', () => {
    // ASTM E1926 table, as reproduced in several public codes [pub; calc via expm; REFERENCES §4].
    // Its states are (zs, żs, zu, żu); ours are (zs, zu, vs, vu).
    const astm = [
      [0.9966071, 0.01091514, -0.002083274, 0.0003190145],
      [-0.5563044, 0.9438768, -0.8324718, 0.05064701],
      [0.02153176, 0.002126763, 0.7508714, 0.008221888],
      [3.335013, 0.3376467, -39.12762, 0.4347564],
    ];
    const dt = 0.25 / (80 / 3.6);
    const e = matrixExponential(quarterCarStateMatrix(GOLDEN_CAR).map((row) => row.map((x) => x * dt)));
    const ours = [0, 2, 1, 3]; // ASTM index → our index
    for (let i = 0; i < 4; i++) {
      for (let j = 0; j < 4; j++) {
        const want = (astm[i] as number[])[j] as number;
        const got = (e[ours[i] as number] as number[])[ours[j] as number] as number;
        expect(Math.abs(got - want)).toBeLessThan(5e-7 * Math.max(1, Math.abs(want)));
      }
    }
  });

  it('agrees with mathjs expm on random matrices to 1e-12 (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -30, max: 30, noNaN: true }), { minLength: 16, maxLength: 16 }),
        fc.double({ min: 1e-3, max: 1, noNaN: true }),
        (values, scale) => {
          const a: Matrix = [0, 1, 2, 3].map((i) => values.slice(4 * i, 4 * i + 4).map((v) => v * scale));
          const ours = matrixExponential(a);
          const theirs = (expm(matrix(a)).toArray() as number[][]).map((r) => r.map(Number));
          const norm = Math.max(...theirs.flat().map(Math.abs), 1);
          for (let i = 0; i < 4; i++) {
            for (let j = 0; j < 4; j++) {
              expect(
                Math.abs(((ours[i] as number[])[j] as number) - ((theirs[i] as number[])[j] as number)),
              ).toBeLessThan(1e-11 * norm);
            }
          }
        },
      ),
      { numRuns: 100 },
    );
  });

  it('is the identity at zero and composes: e^{A}·e^{A} = e^{2A}', () => {
    const a = quarterCarStateMatrix(GOLDEN_CAR).map((r) => r.map((x) => x * 0.01));
    expect(matrixExponential(a.map((r) => r.map(() => 0)))).toEqual([
      [1, 0, 0, 0],
      [0, 1, 0, 0],
      [0, 0, 1, 0],
      [0, 0, 0, 1],
    ]);
    const e1 = matrixExponential(a);
    const e2 = matrixExponential(a.map((r) => r.map((x) => 2 * x)));
    const sq = matrixMultiply(e1, e1);
    sq.forEach((row, i) =>
      row.forEach((x, j) => expect(x).toBeCloseTo((e2[i] as number[])[j] as number, 12)),
    );
  });
});

describe('matrixSolve', () => {
  it('solves with pivoting and refuses a singular matrix', () => {
    const x = matrixSolve(
      [
        [0, 2],
        [3, 1],
      ],
      [[4], [5]],
    );
    expect(x[0]?.[0]).toBeCloseTo(1, 14);
    expect(x[1]?.[0]).toBeCloseTo(2, 14);
    expect(() =>
      matrixSolve(
        [
          [1, 2],
          [2, 4],
        ],
        [[1], [1]],
      ),
    ).toThrowError(/singular/);
  });
});
