import fc from 'fast-check';
import { unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/units/input-error';
import {
  QUANTITY_KINDS,
  quantityFromDisplay,
  quantityParse,
  quantityToDisplay,
  quantityUnitText,
  type QuantityKind,
} from '../../../core/units/units';

// core/units.ts builds mathjs's Unit class alone, with plain-number arithmetic; these compare it
// with the whole of mathjs 15.2.0 (its `unit`, every numeric type) on the same inputs [calc].
const SI: Record<QuantityKind, string> = {
  mass: 'kg',
  length: 'm',
  stiffness: 'N/m',
  damping: 'N s/m',
  velocity: 'm/s',
  speed: 'm/s',
  force: 'N',
  acceleration: 'm/s^2',
  time: 's',
  frequency: 'Hz',
  pressure: 'Pa',
  angle: 'rad',
  temperature: 'K',
};

const TEXTS: [string, QuantityKind][] = [
  ['400 lbf/in', 'stiffness'],
  ['65 N/mm', 'stiffness'],
  ['12 lbf*s/in', 'damping'],
  ['2500 N s/m', 'damping'],
  ['672 lb', 'mass'],
  ['0.305 t', 'mass'],
  ['1.4 in', 'length'],
  ['35 mm', 'length'],
  ['4 in/s', 'velocity'],
  ['50 mi/h', 'speed'],
  ['80 km/h', 'speed'],
  ['650 lbf', 'force'],
  ['2.9 kN', 'force'],
  ['9.8 m/s^2', 'acceleration'],
  ['250 ms', 'time'],
  ['1 Hz', 'frequency'],
  ['26 psi', 'pressure'],
  ['180 kPa', 'pressure'],
  ['1.2 bar', 'pressure'],
  ['-2.5 deg', 'angle'],
  ['40 degC', 'temperature'],
  ['104 degF', 'temperature'],
  ['500 degR', 'temperature'],
  ['-1e3 N', 'force'],
];

describe('units from the Unit factory alone', () => {
  it('reads every quantity to the same SI number as the whole of mathjs', () => {
    for (const [text, kind] of TEXTS) {
      // The same tables and the same arithmetic: the same double, not merely a close one.
      expect(quantityParse(text, kind, 'x'), text).toBe(unit(text).toNumber(SI[kind]));
    }
    // STACK.md: 400 lbf/in → 70.0507 N/mm in mathjs 15.2.0 [calc].
    expect(quantityParse('400 lbf/in', 'stiffness', 'x') / 1000).toBeCloseTo(70.0507, 4);
  });

  it('converts to and from every display unit as the whole of mathjs does', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...QUANTITY_KINDS),
        fc.constantFrom('si' as const, 'us' as const),
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        (kind, system, x) => {
          const shown = quantityUnitText(kind, system);
          expect(quantityToDisplay(x, kind, system)).toBe(
            shown === SI[kind] ? x : unit(x, SI[kind]).toNumber(shown),
          );
          expect(quantityFromDisplay(x, kind, system)).toBe(
            shown === SI[kind] ? x : unit(x, shown).toNumber(SI[kind]),
          );
        },
      ),
    );
  });

  it('refuses what the whole of mathjs cannot read, naming the field', () => {
    for (const text of ['5 furlongs', '3 N/', 'lbf/in', '12 N*']) {
      let mathjsRead: boolean;
      try {
        const u = unit(text);
        mathjsRead = u.value !== null;
      } catch {
        mathjsRead = false;
      }
      expect(mathjsRead, text).toBe(false);
      expect(() => quantityParse(text, 'stiffness', 'corner.springRate'), text).toThrow(InputError);
    }
  });
});
