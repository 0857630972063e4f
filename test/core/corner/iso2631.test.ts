import { describe, expect, it } from 'vitest';
import { wkWeighting } from '../../../core/corner/iso2631';

describe('wkWeighting', () => {
  // ISO 2631-1:1997 Table 3, Wk at the nominal one-third-octave frequencies [mem; the Annex A filter reproduces them].
  const table: [number, number][] = [
    [0.5, 0.418],
    [1, 0.482],
    [2, 0.531],
    [4, 0.967],
    [5, 1.039],
    [6.3, 1.054],
    [8, 1.036],
    [10, 0.988],
    [12.5, 0.902],
    [16, 0.768],
    [20, 0.636],
    [31.5, 0.405],
    [63, 0.186],
  ];
  it.each(table)('Wk(%s Hz) = %s', (f, w) => {
    // Table 3 rounds to three places; the filter at the nominal frequency is within 0.001.
    expect(Math.abs(wkWeighting(f) - w)).toBeLessThanOrEqual(0.001);
  });

  it('lines up with the table, not with a copy shifted by three bands', () => {
    // A published copy of the table is shifted by three one-third-octave bands (a factor of 2 in frequency):
    // the weight at 4 Hz must be the table's 4 Hz value, not the 2 Hz or 8 Hz one.
    expect(wkWeighting(4)).toBeCloseTo(0.967, 2);
    expect(Math.abs(wkWeighting(4) - 0.531)).toBeGreaterThan(0.3);
    expect(Math.abs(wkWeighting(8) - 0.967)).toBeGreaterThan(0.05);
  });

  it('peaks between 5 and 8 Hz, where people are most sensitive to vertical vibration', () => {
    let best = 0;
    let bestF = 0;
    for (let f = 0.5; f < 80; f *= 1.001) {
      const w = wkWeighting(f);
      if (w > best) {
        best = w;
        bestF = f;
      }
    }
    expect(bestF).toBeGreaterThan(5);
    expect(bestF).toBeLessThan(8);
    expect(best).toBeGreaterThan(1.05);
    expect(best).toBeLessThan(1.07);
  });

  it('rolls off outside the 0.4–100 Hz band', () => {
    expect(wkWeighting(0.05)).toBeLessThan(0.01);
    expect(wkWeighting(1000)).toBeLessThan(0.01);
  });
});
