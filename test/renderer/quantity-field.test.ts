import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { quantityParse, type QuantityKind } from '../../core/units/units';
import { quantityFieldConvert, quantityFieldValue } from '../../app/renderer/quantity-field';

const valueOf = (text: string, kind: QuantityKind, system: 'si' | 'us') =>
  quantityParse(quantityFieldValue(text, kind, system), kind, 'f');
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe('a quantity field converted in place', () => {
  it('shows a converted value as a shop writes it', () => {
    // NIST SP 811 [pub]: 295 kg = 650.364 lb, 90 N/mm = 513.92 lbf/in, 170 kPa = 24.656 psi [calc].
    expect(quantityFieldConvert('295', 'mass', 'si', 'us')).toBe('650');
    expect(quantityFieldConvert('90', 'stiffness', 'si', 'us')).toBe('514');
    expect(quantityFieldConvert('3643', 'damping', 'si', 'us')).toBe('20.8');
    expect(quantityFieldConvert('170', 'pressure', 'si', 'us')).toBe('24.7');
    expect(quantityFieldConvert('not a number', 'mass', 'si', 'us')).toBe('not a number');
  });

  it('never changes the value behind it, nor what was typed, however often the units switch (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom<QuantityKind>('mass', 'length', 'stiffness', 'damping', 'speed', 'force', 'pressure'),
        fc.integer({ min: 1, max: 9_999_999 }),
        fc.integer({ min: 0, max: 4 }),
        fc.constantFrom('si' as const, 'us' as const),
        fc.integer({ min: 1, max: 3 }),
        (kind, digits, point, start, switches) => {
          const typed = String(digits / 10 ** point);
          const other = start === 'si' ? 'us' : 'si';
          const want = valueOf(typed, kind, start);
          let text = typed;
          for (let i = 0; i < switches; i++) {
            const there = quantityFieldConvert(text, kind, start, other);
            if (rel(valueOf(there, kind, other), want) > 1e-12) return false;
            text = quantityFieldConvert(there, kind, other, start);
            if (text !== typed) return false;
          }
          return rel(valueOf(text, kind, start), want) <= 1e-12;
        },
      ),
    );
  });
});
