import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/units/input-error';
import {
  QUANTITY_KINDS,
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
    expect(quantityFormat(0.3048, 'velocity', 'us')).toBe('12.00 in/s');
    expect(quantityFormat(22.352, 'speed', 'us')).toBe('50.0 mph');
    expect(quantityFormat(-0.00001, 'length', 'si')).toBe('0.0 mm');
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
