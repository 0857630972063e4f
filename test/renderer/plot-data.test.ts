import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  barCsv,
  niceCeiling,
  niceLinearTicks,
  niceLogTicks,
  plotCsv,
  plotPointsThin,
} from '../../app/renderer/components/plot-data';
import {
  quantityDisplayFactor,
  quantityFieldConvert,
  quantityFieldValue,
} from '../../app/renderer/quantity-field';

describe('plot ticks', () => {
  it('puts round linear ticks around the data', () => {
    expect(niceLinearTicks(0, 1.5)).toEqual([0, 0.25, 0.5, 0.75, 1, 1.25, 1.5]);
    expect(niceLinearTicks(-0.501, 0.5)).toEqual([-0.6, -0.4, -0.2, 0, 0.2, 0.4, 0.6]);
    expect(niceLinearTicks(3, 3)).toEqual([3]);
    expect(niceLinearTicks(NaN, 1)).toEqual([NaN]);
  });

  it('always covers the range with about six steps of 1, 2, 2.5 or 5 × 10ⁿ', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        fc.double({ min: 1e-6, max: 1e6, noNaN: true }),
        (lo, span) => {
          const hi = lo + span;
          // Plotted data span more than a millionth of their offset; the plot's domain takes the
          // data's own ends beside the ticks in any case.
          fc.pre(hi > lo && span > 1e-6 * Math.abs(lo));
          const t = niceLinearTicks(lo, hi);
          // Covered to within a millionth of the span (the ticks are rounded to 12 digits).
          expect(t[0]).toBeLessThanOrEqual(lo + 1e-6 * span);
          expect(t[t.length - 1]).toBeGreaterThanOrEqual(hi - 1e-6 * span);
          expect(t.length).toBeGreaterThanOrEqual(2);
          expect(t.length).toBeLessThanOrEqual(14);
        },
      ),
    );
  });

  it('puts log ticks at 1, 2 and 5 per decade', () => {
    expect(niceLogTicks(0.3, 40)).toEqual([0.5, 1, 2, 5, 10, 20]);
  });

  it('leaves headroom above the tallest bar at a round value', () => {
    expect(niceCeiling(3.48 * 1.2)).toBe(5);
    expect(niceCeiling(0.31)).toBe(0.5);
    expect(niceCeiling(0)).toBe(1);
    expect(niceCeiling(Number.POSITIVE_INFINITY)).toBe(1);
  });
});

describe('plot data as CSV', () => {
  it('writes one x and one y column a series, padding shorter series', () => {
    const csv = plotCsv('Time (s)', 'Travel (mm)', [
      { name: 'FL', x: [0, 1], y: [2, 3] },
      { name: 'FR', x: [0], y: [4] },
    ]);
    expect(csv).toBe('FL: Time (s),FL: Travel (mm),FR: Time (s),FR: Travel (mm)\r\n0,2,0,4\r\n1,3,,\r\n');
  });

  it('writes the bars a row per category, empty where there is no value', () => {
    const csv = barCsv(
      'Corner',
      'RMS (m/s²)',
      ['FL', 'FR'],
      [
        { name: 'plain', values: [1.5, NaN] },
        { name: 'Wk, weighted', values: [1.2, 0.9] },
      ],
    );
    expect(csv).toBe('Corner,plain (RMS (m/s²)),"Wk, weighted (RMS (m/s²))"\r\nFL,1.5,1.2\r\nFR,,0.9\r\n');
  });
});

describe('quantity fields', () => {
  it('gives a bare number the unit shown beside it and keeps a typed unit', () => {
    expect(quantityFieldValue(' 80 ', 'speed', 'si')).toBe('80 km/h');
    expect(quantityFieldValue('50', 'speed', 'us')).toBe('50 mi/h');
    expect(quantityFieldValue('1 in', 'length', 'si')).toBe('1 in');
    expect(quantityFieldValue('', 'length', 'si')).toBeUndefined();
    expect(quantityFieldValue('-2e-3', 'length', 'si')).toBe('-2e-3 mm');
  });

  it('converts between systems as a shop writes figures, and keeps text that does not read', () => {
    // NIST SP 811 [pub]: 1 in = 25.4 mm; 100 °F = 37.7778 °C, written to three figures.
    expect(quantityFieldConvert('25.4', 'length', 'si', 'us')).toBe('1');
    expect(quantityFieldConvert('100', 'temperature', 'us', 'si')).toBe('37.8');
    // The exact value stays behind the rounded text: back in °F it reads as typed.
    expect(quantityFieldConvert('37.8', 'temperature', 'si', 'us')).toBe('100');
    expect(quantityFieldConvert('abc', 'length', 'si', 'us')).toBe('abc');
    expect(quantityFieldConvert('', 'length', 'si', 'us')).toBe('');
    expect(quantityFieldConvert('12', 'length', 'si', 'si')).toBe('12');
  });

  it('scales SI to display units by the factor of the unit', () => {
    expect(quantityDisplayFactor('length', 'si')).toBeCloseTo(1000, 9);
    expect(quantityDisplayFactor('force', 'us')).toBeCloseTo(1 / 4.4482216152605, 12);
    expect(quantityDisplayFactor('acceleration', 'us')).toBe(1);
  });
});

describe('a curve thinned for drawing', () => {
  it('keeps the ends, every run’s peak and trough, and the order, within the budget (property)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 0, maxLength: 2000 }),
        fc.integer({ min: 4, max: 400 }),
        (ys, max) => {
          const points = ys.map((y, x) => ({ x, y }));
          const thin = plotPointsThin(points, max);
          if (points.length <= max) return thin.length === points.length;
          const ySorted = [...ys].sort((a, b) => a - b);
          return (
            thin.length <= max &&
            thin[0] === points[0] &&
            thin[thin.length - 1] === points[points.length - 1] &&
            thin.every((p, i) => i === 0 || p.x > (thin[i - 1] as { x: number }).x) &&
            thin.some((p) => p.y === ySorted[0]) &&
            thin.some((p) => p.y === ySorted[ySorted.length - 1])
          );
        },
      ),
    );
  });

  it('draws a 400-point history as 242 points with its peak where it was', () => {
    // A decaying 14 Hz oscillation over 1.5 s, the shape of a wheel-hop history [calc].
    const points = Array.from({ length: 400 }, (_, k) => {
      const t = (1.5 * k) / 399;
      return { x: t, y: Math.exp(-3 * t) * Math.sin(2 * Math.PI * 14 * t) };
    });
    const thin = plotPointsThin(points, 242);
    expect(thin.length).toBeLessThanOrEqual(242);
    const peak = (ps: { x: number; y: number }[]) => ps.reduce((a, b) => (b.y > a.y ? b : a));
    expect(peak(thin)).toBe(peak(points));
  });
});
