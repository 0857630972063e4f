/**
 * mathjs's Unit class alone, built from its factory the first time a unit is read, with plain
 * number arithmetic (the whole of mathjs costs a second at start-up); Fraction only where
 * temperature offsets need exact arithmetic.
 */
import {
  createComplexClass,
  createFractionClass,
  createUnitClass,
  type FactoryFunction,
  type Unit,
  type UnitCtor,
} from 'mathjs';

/** What of mathjs's Unit class is used here, as the class is (its declared type misses `parse`'s options and a valueless unit). */
type UnitClass = UnitCtor & {
  new (value: number | null, name: string): Unit;
  parse(text: string, options: { allowNoUnits: boolean }): Unit;
};

declare module 'mathjs' {
  // Factories mathjs exports (lib/esm/factoriesAny.js) without declaring them.
  export const createUnitClass: FactoryFunction<unknown>;
  export const createComplexClass: FactoryFunction<unknown>;
  export const createFractionClass: FactoryFunction<unknown>;
}

/** A number, or a TypeError naming the operation: the units here hold plain numbers only. */
function unitNumber(operation: string, x: unknown): number {
  if (typeof x !== 'number') throw new TypeError(`units: ${operation} takes numbers, got ${typeof x}`);
  return x;
}

/** Operations of Unit that reading and converting quantities never reach (formatting, splitting, equality of values). */
function unitUnused(operation: string): () => never {
  return () => {
    throw new Error(`units: ${operation} of a mathjs Unit is not part of this program's units`);
  };
}

type FractionValue = {
  isFraction: true;
  add(other: FractionValue): FractionValue;
  sub(other: FractionValue): FractionValue;
  mul(other: FractionValue): FractionValue;
  div(other: FractionValue): FractionValue;
  valueOf(): number;
};

/** mathjs's Fraction (fraction.js): the exact 5/9 of degF and degR. */
const Fraction = createFractionClass({}) as new (x: number) => FractionValue;

const isFraction = (x: unknown): x is FractionValue =>
  typeof x === 'object' && x !== null && 'isFraction' in x && x.isFraction === true;

/** A number as an exact Fraction, as mathjs converts one it must combine with a Fraction. */
function fractionOf(x: unknown, operation: string): FractionValue {
  if (isFraction(x)) return x;
  const n = unitNumber(operation, x);
  const f = new Fraction(n);
  if (f.valueOf() !== n) throw new TypeError(`units: ${operation}: ${n} is not exact as a Fraction`);
  return f;
}

/**
 * One of Unit's scalar operations as mathjs does it on numbers and Fractions: two numbers in
 * floating point; with a Fraction (degF, degR: the offsets of a temperature conversion) exactly,
 * the number made a Fraction first.
 */
function unitScalar(
  operation: string,
  onNumbers: (a: number, b: number) => number,
  onFractions: (a: FractionValue, b: FractionValue) => FractionValue,
): (a: unknown, b: unknown) => number | FractionValue {
  return (a, b) =>
    isFraction(a) || isFraction(b)
      ? onFractions(fractionOf(a, operation), fractionOf(b, operation))
      : onNumbers(unitNumber(operation, a), unitNumber(operation, b));
}

/**
 * mathjs's Unit class alone, built from its factory with the arithmetic it needs instead of the
 * whole of mathjs (whose typed functions for every numeric type take a tenth of a second to
 * create and half a megabyte to load). Its unit tables, parser and conversions are mathjs's
 * own; with the default `number: 'number'` configuration every value it meets is a number or
 * the Fraction 5/9 of degF and degR, and test/core/units-mathjs.test.ts checks that every
 * conversion gives the very number the whole of mathjs gives.
 */
function unitClassCreate(): UnitClass {
  return createUnitClass({
    config: Object.freeze({
      number: 'number',
      predictable: false,
      precision: 64,
      relTol: 1e-12,
      absTol: 1e-15,
    }),
    addScalar: unitScalar(
      'addScalar',
      (a, b) => a + b,
      (a, b) => a.add(b),
    ),
    subtractScalar: unitScalar(
      'subtractScalar',
      (a, b) => a - b,
      (a, b) => a.sub(b),
    ),
    multiplyScalar: unitScalar(
      'multiplyScalar',
      (a, b) => a * b,
      (a, b) => a.mul(b),
    ),
    divideScalar: unitScalar(
      'divideScalar',
      (a, b) => a / b,
      (a, b) => a.div(b),
    ),
    pow: (a: unknown, b: unknown) => {
      const x = unitNumber('pow', a);
      const y = unitNumber('pow', b);
      // mathjs answers a Complex here; no unit of ours has a negative scale.
      if (x < 0 && !Number.isInteger(y)) throw new TypeError('units: pow of a negative number to a fraction');
      return Math.pow(x, y);
    },
    abs: (a: unknown) => Math.abs(unitNumber('abs', a)),
    isNumeric: (x: unknown) =>
      typeof x === 'number' ||
      typeof x === 'bigint' ||
      typeof x === 'boolean' ||
      isFraction(x) ||
      (typeof x === 'object' && x !== null && 'isBigNumber' in x),
    number: (x: unknown) => (isFraction(x) ? x.valueOf() : unitNumber('number', x)),
    fix: unitUnused('fix'),
    round: unitUnused('round'),
    equal: unitUnused('equal'),
    format: unitUnused('format'),
    Complex: createComplexClass({}),
    Fraction,
    // Only reached under `number: 'BigNumber'`.
    BigNumber: unitUnused('BigNumber'),
  }) as UnitClass;
}

let unitClass: UnitClass | undefined;
/** The Unit class, made the first time a unit is read (its tables take milliseconds to build). */
const unitClassOf = (): UnitClass => (unitClass ??= unitClassCreate());

/** A quantity or a bare unit read from text, as mathjs's `unit(text)` reads it. */
export function unitRead(text: string): Unit {
  const UnitOfMathjs = unitClassOf();
  return UnitOfMathjs.isValuelessUnit(text)
    ? new UnitOfMathjs(null, text)
    : UnitOfMathjs.parse(text, { allowNoUnits: true });
}

/** `value` in the unit `text`, as mathjs's `unit(value, text)`. */
export function unitOf(value: number, text: string): Unit {
  return new (unitClassOf())(value, text);
}
