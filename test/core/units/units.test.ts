import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/units/input-error';
import {
  QUANTITY_KINDS,
  numberShopFormat,
  quantityFormat,
  quantityFromDisplay,
  quantityParse,
  quantityText,
  quantityToDisplay,
  numberParse,
} from '../../../core/units/units';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('quantityParse', () => {
  // Conversion factors: NIST SP 811 (2008) Appendix B [pub]: 1 in = 0.0254 m exactly,
  // 1 lb = 0.45359237 kg exactly, 1 lbf = 4.4482216152605 N exactly.
  const LBF = 4.4482216152605;
  const IN = 0.0254;
  const LB = 0.45359237;
  const cases: [string, Parameters<typeof quantityParse>[1], number][] = [
    ['70 N/mm', 'stiffness', 70_000],
    ['450 lbf/in', 'stiffness', (450 * LBF) / IN],
    ['780 lb', 'mass', 780 * LB],
    ['12 lbf*s/in', 'damping', (12 * LBF) / IN],
    ['3 in/s', 'velocity', 3 * IN],
    ['80 km/h', 'speed', 80 / 3.6],
    ['40 mm', 'length', 0.04],
    ['2500 N*s/m', 'damping', 2500],
    ['2500 N·s/m', 'damping', 2500],
    ['1.5 in', 'length', 1.5 * IN],
    ['-2.5 deg', 'angle', (-2.5 * Math.PI) / 180],
    ['250 ms', 'time', 0.25],
    ['30 mph', 'speed', (30 * 1609.344) / 3600],
    ['50 kph', 'speed', 50 / 3.6],
  ];
  for (const [text, kind, si] of cases) {
    it(`reads "${text}" as ${si} SI`, () => {
      expect(rel(quantityParse(text, kind, 'f'), si)).toBeLessThan(1e-12);
    });
  }

  it('reads "26 psi" to the precision mathjs defines psi with', () => {
    // mathjs defines psi as 6894.75729 Pa, rounded from lbf/in² = 6894.757293168 Pa (NIST SP 811).
    expect(rel(quantityParse('26 psi', 'pressure', 'f'), 26 * (LBF / (IN * IN)))).toBeLessThan(1e-9);
  });

  it('matches the checked conversion 400 lbf/in = 70.0507 N/mm', () => {
    // STACK.md notes (mathjs 15.2.0) [calc]: 400 lbf/in → 70.0507 N/mm
    expect(quantityParse('400 lbf/in', 'stiffness', 'f') / 1000).toBeCloseTo(70.0507, 4);
  });

  it('takes plain numbers and numeric strings as SI', () => {
    expect(quantityParse(65000, 'stiffness', 'f')).toBe(65000);
    expect(quantityParse('305', 'mass', 'f')).toBe(305);
  });

  it('rejects a wrong dimension, naming the field, what it got and what it expects', () => {
    expect(() => quantityParse('70 kg', 'stiffness', 'corner.springRate')).toThrowError(
      /^corner\.springRate: got "70 kg" \(a mass\); expected a rate \(force per length\)/,
    );
    expect(() => quantityParse('3 in/s', 'damping', 'x')).toThrowError(/got "3 in\/s" \(a velocity\)/);
    expect(() => quantityParse('12 lbf*s/in', 'stiffness', 'x')).toThrowError(/damping coefficient/);
  });

  it.each([
    ['garbage', 'abc'],
    ['empty', ''],
    ['spaces', '   '],
    ['unit only', 'N/mm'],
    ['lowercase newton', '70 n/mm'],
    ['percent', '5 %'],
  ])('rejects %s with an InputError', (_what, text) => {
    expect(() => quantityParse(text, 'stiffness', 'corner.springRate')).toThrowError(InputError);
    try {
      quantityParse(text, 'stiffness', 'corner.springRate');
    } catch (e) {
      expect((e as InputError).field).toBe('corner.springRate');
    }
  });

  it.each([NaN, Infinity, -Infinity])('rejects the number %s', (n) => {
    expect(() => quantityParse(n, 'mass', 'corner.cornerMass')).toThrowError(/corner\.cornerMass: got/);
  });

  it.each([[null], [true], [[1, 2]], [{ value: 1 }]])(
    'rejects a %j that is not a number or a string',
    (v) => {
      expect(() => quantityParse(v, 'mass', 'm')).toThrowError(InputError);
    },
  );

  it('rejects an infinite value written with a unit', () => {
    expect(() => quantityParse('1e400 N', 'force', 'f')).toThrowError(/not a finite number/);
  });

  it('never throws anything but an InputError, whatever string it gets (property)', () => {
    fc.assert(
      fc.property(fc.string(), (s) => {
        try {
          const v = quantityParse(s, 'stiffness', 'f');
          return Number.isFinite(v);
        } catch (e) {
          return e instanceof InputError;
        }
      }),
      { numRuns: 500 },
    );
  });
});

describe('numberParse', () => {
  it('reads numbers and numeric strings, and names the field otherwise', () => {
    expect(numberParse(0.88, 'mr')).toBe(0.88);
    expect(numberParse(' 0.9 ', 'mr')).toBe(0.9);
    expect(() => numberParse('0.9 mm', 'corner.springMotionRatio', 'a motion ratio')).toThrowError(
      /^corner\.springMotionRatio: got "0\.9 mm"; expected a motion ratio/,
    );
    expect(() => numberParse(NaN, 'mr')).toThrowError(InputError);
  });
});

describe('display and file forms', () => {
  it('formats in SI and US customary', () => {
    expect(quantityFormat(65_000, 'stiffness', 'si')).toBe('65.0 N/mm');
    // 65 N/mm = 371.16 lbf/in (NIST factors above) [calc]
    expect(quantityFormat(65_000, 'stiffness', 'us')).toBe('371 lbf/in');
    expect(quantityFormat(0.3048, 'velocity', 'us')).toBe('12 in/s');
    expect(quantityFormat(22.352, 'speed', 'us')).toBe('50 mph');
    expect(quantityFormat(-0.00001, 'length', 'si')).toBe('0.0 mm');
  });

  it('writes converted US figures as a shop does: three significant figures, whole units kept', () => {
    // Factors: 1 lb = 0.45359237 kg, 1 lbf = 4.4482216152605 N, 1 in = 0.0254 m, 1 psi =
    // 6894.757 Pa (NIST SP 811 [pub]); the values below from them [calc].
    expect(quantityFormat(295, 'mass', 'us')).toBe('650 lb'); // 650.364 lb
    expect(quantityFormat(90_000, 'stiffness', 'us')).toBe('514 lbf/in'); // 513.92 lbf/in
    expect(quantityFormat(3643, 'damping', 'us')).toBe('20.8 lbf·s/in'); // 20.802 lbf·s/in
    expect(quantityFormat(170_000, 'pressure', 'us')).toBe('24.7 psi'); // 24.656 psi
    expect(quantityFormat(240_000, 'stiffness', 'us')).toBe('1370 lbf/in'); // 1370.43: four figures
    expect(quantityFormat(0.001, 'length', 'us')).toBe('0.0394 in'); // 0.03937 in
    expect(quantityFormat(0.0254, 'length', 'us')).toBe('1 in');
    // Kinds shown in the same unit in both systems keep their decimals, so they read alike.
    expect(quantityFormat(8.78, 'acceleration', 'us')).toBe('8.78 m/s²');
    expect(quantityFormat(1.5, 'time', 'us')).toBe(quantityFormat(1.5, 'time', 'si'));
    // An explicit number of decimals still wins.
    expect(quantityFormat(0.0254, 'length', 'us', { decimals: 3 })).toBe('1.000 in');
  });

  it('rounds to three figures by one rule, at every size and sign', () => {
    expect(numberShopFormat(650.364)).toBe('650');
    expect(numberShopFormat(20.802)).toBe('20.8');
    expect(numberShopFormat(9.996)).toBe('10');
    expect(numberShopFormat(999.6)).toBe('1000');
    expect(numberShopFormat(12_345.6)).toBe('12346');
    expect(numberShopFormat(-2.504)).toBe('-2.5');
    expect(numberShopFormat(0.000123456)).toBe('0.000123');
    expect(numberShopFormat(0)).toBe('0');
    expect(numberShopFormat(-0.0000001)).toBe('-0.0000001');
    expect(numberShopFormat(Number.NaN)).toBe('NaN');
    fc.assert(
      fc.property(
        fc.double({ min: -1e7, max: 1e7, noNaN: true }).filter((x) => x === 0 || Math.abs(x) > 1e-9),
        (v) => {
          const text = numberShopFormat(v);
          // Never further off than half a unit of the third significant figure (or of the units).
          const step = Math.max(
            10 ** (Math.floor(Math.log10(Math.abs(v) || 1)) - 2),
            Math.abs(v) >= 100 ? 1 : 0,
          );
          return Math.abs(Number(text) - v) <= step / 2 + 1e-9 * Math.abs(v) && !/\.\d*0$/.test(text);
        },
      ),
    );
  });

  it('converts to a display unit and back without loss (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...QUANTITY_KINDS.filter((k) => k !== 'temperature')),
        fc.constantFrom('si' as const, 'us' as const),
        fc.double({ min: 1e-6, max: 1e7, noNaN: true }),
        (kind, system, v) =>
          rel(quantityFromDisplay(quantityToDisplay(v, kind, system), kind, system), v) < 1e-12,
      ),
    );
  });

  it('writes values that read back to the same SI value (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...QUANTITY_KINDS.filter((k) => k !== 'temperature')),
        fc.constantFrom('si' as const, 'us' as const),
        fc.double({ min: 1e-6, max: 1e7, noNaN: true }),
        (kind, system, v) => rel(quantityParse(quantityText(v, kind, system), kind, 'f'), v) < 1e-9,
      ),
    );
  });
});
