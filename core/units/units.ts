import type { Unit } from 'mathjs';
import { InputError } from './input-error';
import { unitOf, unitRead } from './unit-class';

/**
 * The kinds of quantity the program reads and shows. Everything inside is SI;
 * this module is the only place where units are parsed or formatted.
 */
export type QuantityKind =
  | 'mass'
  | 'length'
  | 'stiffness'
  | 'damping'
  | 'velocity'
  | 'speed'
  | 'force'
  | 'acceleration'
  | 'time'
  | 'frequency'
  | 'pressure'
  | 'angle'
  | 'temperature';

export type UnitSystem = 'si' | 'us';

type DisplayUnit = { unit: string; label: string; decimals: number };

type KindSpec = {
  /** SI unit the value is converted to (mathjs spelling). */
  si: string;
  /** What the kind is, in words, for messages. */
  noun: string;
  /** Inputs a user may type, for messages. */
  examples: string;
  display: Record<UnitSystem, DisplayUnit>;
};

const KINDS: Record<QuantityKind, KindSpec> = {
  mass: {
    si: 'kg',
    noun: 'a mass',
    examples: '"305 kg" or "672 lb"',
    display: { si: { unit: 'kg', label: 'kg', decimals: 1 }, us: { unit: 'lb', label: 'lb', decimals: 1 } },
  },
  length: {
    si: 'm',
    noun: 'a length',
    examples: '"35 mm" or "1.4 in"',
    display: { si: { unit: 'mm', label: 'mm', decimals: 1 }, us: { unit: 'in', label: 'in', decimals: 2 } },
  },
  stiffness: {
    si: 'N/m',
    noun: 'a rate (force per length)',
    examples: '"65 N/mm" or "370 lbf/in"',
    display: {
      si: { unit: 'N/mm', label: 'N/mm', decimals: 1 },
      us: { unit: 'lbf/in', label: 'lbf/in', decimals: 0 },
    },
  },
  damping: {
    si: 'N s/m',
    noun: 'a damping coefficient (force per velocity)',
    examples: '"2500 N*s/m" or "14 lbf*s/in"',
    display: {
      si: { unit: 'N s/m', label: 'N·s/m', decimals: 0 },
      us: { unit: 'lbf s/in', label: 'lbf·s/in', decimals: 2 },
    },
  },
  velocity: {
    si: 'm/s',
    noun: 'a velocity',
    examples: '"0.1 m/s" or "4 in/s"',
    display: {
      si: { unit: 'm/s', label: 'm/s', decimals: 3 },
      us: { unit: 'in/s', label: 'in/s', decimals: 2 },
    },
  },
  speed: {
    si: 'm/s',
    noun: 'a speed',
    examples: '"80 km/h" or "50 mi/h"',
    display: {
      si: { unit: 'km/h', label: 'km/h', decimals: 1 },
      us: { unit: 'mi/h', label: 'mph', decimals: 1 },
    },
  },
  force: {
    si: 'N',
    noun: 'a force',
    examples: '"2900 N" or "650 lbf"',
    display: { si: { unit: 'N', label: 'N', decimals: 0 }, us: { unit: 'lbf', label: 'lbf', decimals: 0 } },
  },
  acceleration: {
    si: 'm/s^2',
    noun: 'an acceleration',
    examples: '"9.8 m/s^2"',
    // ISO 2631-1 states comfort in m/s²; the trade reads it that way in both systems.
    display: {
      si: { unit: 'm/s^2', label: 'm/s²', decimals: 2 },
      us: { unit: 'm/s^2', label: 'm/s²', decimals: 2 },
    },
  },
  time: {
    si: 's',
    noun: 'a time',
    examples: '"1.5 s" or "250 ms"',
    display: { si: { unit: 's', label: 's', decimals: 3 }, us: { unit: 's', label: 's', decimals: 3 } },
  },
  frequency: {
    si: 'Hz',
    noun: 'a frequency',
    examples: '"1 Hz"',
    display: { si: { unit: 'Hz', label: 'Hz', decimals: 2 }, us: { unit: 'Hz', label: 'Hz', decimals: 2 } },
  },
  pressure: {
    si: 'Pa',
    noun: 'a pressure',
    examples: '"180 kPa" or "26 psi"',
    display: {
      si: { unit: 'kPa', label: 'kPa', decimals: 0 },
      us: { unit: 'psi', label: 'psi', decimals: 1 },
    },
  },
  angle: {
    si: 'rad',
    noun: 'an angle',
    examples: '"-2.5 deg"',
    display: { si: { unit: 'deg', label: '°', decimals: 2 }, us: { unit: 'deg', label: '°', decimals: 2 } },
  },
  temperature: {
    si: 'K',
    noun: 'a temperature',
    examples: '"40 degC" or "104 degF"',
    display: {
      si: { unit: 'degC', label: '°C', decimals: 1 },
      us: { unit: 'degF', label: '°F', decimals: 1 },
    },
  },
};

/** All quantity kinds, for forms and tests. */
export const QUANTITY_KINDS = Object.keys(KINDS) as QuantityKind[];

const SI_REFERENCE = new Map<QuantityKind, Unit>();
function siReference(kind: QuantityKind): Unit {
  let u = SI_REFERENCE.get(kind);
  if (!u) {
    u = unitRead(KINDS[kind].si);
    SI_REFERENCE.set(kind, u);
  }
  return u;
}

const NUMBER_ONLY = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** Typographic characters people paste from data sheets, mapped to what mathjs reads. */
function unitTextNormalise(text: string): string {
  return (
    text
      .trim()
      .replace(/[·⋅•×]/g, '*')
      .replace(/\u2212/g, '-')
      .replace(/²/g, '^2')
      .replace(/°C/g, 'degC')
      .replace(/°F/g, 'degF')
      .replace(/°/g, 'deg')
      // Speeds as people write them; mathjs spells them mi/h and km/h.
      .replace(/\bmph\b/g, 'mi/h')
      .replace(/\bkph\b/g, 'km/h')
  );
}

function kindOfUnit(u: Unit): QuantityKind | undefined {
  // 'velocity' before 'speed': same dimension, and the first name is the one messages use.
  return QUANTITY_KINDS.find((k) => u.equalBase(siReference(k)));
}

function describeUnitKind(u: Unit): string {
  const k = kindOfUnit(u);
  if (k) return KINDS[k].noun;
  const dims = u.dimensions;
  return dims.every((d) => d === 0)
    ? 'a plain number'
    : `a quantity in ${u.formatUnits() || 'unknown units'}`;
}

/**
 * Reads one quantity from a corner or setup file: a number is taken as SI; a string
 * is read by mathjs with its unit ("70 N/mm", "450 lbf/in", "12 lbf*s/in") and
 * converted to SI. The unit's dimension must match `kind`.
 *
 * @throws InputError naming `field`, what it got and what it expects.
 * @example quantityParse('450 lbf/in', 'stiffness', 'corner.springRate') // 78807.07…
 */
export function quantityParse(value: unknown, kind: QuantityKind, field: string): number {
  const spec = KINDS[kind];
  const expected = `expected ${spec.noun}, e.g. ${spec.examples}`;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new InputError(field, `got ${String(value)}; ${expected}`);
    return value;
  }
  if (typeof value !== 'string') {
    const got = value === null ? 'null' : Array.isArray(value) ? 'a list' : typeof value;
    throw new InputError(field, `got ${got}; ${expected}`);
  }
  const text = unitTextNormalise(value);
  if (text === '') throw new InputError(field, `is empty; ${expected}`);
  if (NUMBER_ONLY.test(text)) {
    const n = Number(text);
    if (!Number.isFinite(n)) throw new InputError(field, `got "${value}"; ${expected}`);
    return n;
  }
  let u: Unit;
  try {
    u = unitRead(text);
  } catch {
    throw new InputError(field, `could not read "${value}" as a quantity; ${expected}`);
  }
  if (u.value === null || u.value === undefined) {
    throw new InputError(field, `"${value}" has a unit but no number; ${expected}`);
  }
  if (!u.equalBase(siReference(kind))) {
    throw new InputError(field, `got "${value}" (${describeUnitKind(u)}); ${expected}`);
  }
  const si = u.toNumber(spec.si);
  if (!Number.isFinite(si))
    throw new InputError(field, `got "${value}", which is not a finite number; ${expected}`);
  return si;
}

/**
 * Reads a plain number (a ratio such as a motion ratio). Numeric strings are accepted.
 * @throws InputError naming `field`.
 */
export function numberParse(value: unknown, field: string, what = 'a number'): number {
  if (typeof value === 'number' && Number.isFinite(value)) return value;
  if (typeof value === 'string' && NUMBER_ONLY.test(value.trim())) return Number(value.trim());
  const got = typeof value === 'string' ? `"${value}"` : value === null ? 'null' : String(value);
  throw new InputError(field, `got ${got}; expected ${what}`);
}

/** Converts an SI value of `kind` to the display unit of `system`. */
export function quantityToDisplay(valueSI: number, kind: QuantityKind, system: UnitSystem): number {
  const spec = KINDS[kind];
  const target = spec.display[system].unit;
  if (target === spec.si) return valueSI;
  return unitOf(valueSI, spec.si).toNumber(target);
}

/** Converts a number shown in the display unit of `system` back to SI. */
export function quantityFromDisplay(shown: number, kind: QuantityKind, system: UnitSystem): number {
  const spec = KINDS[kind];
  const source = spec.display[system].unit;
  if (source === spec.si) return shown;
  return unitOf(shown, source).toNumber(spec.si);
}

/** The label of the unit `kind` is shown in (`N/mm`, `lbf/in`, `mph`). */
export function quantityUnitLabel(kind: QuantityKind, system: UnitSystem): string {
  return KINDS[kind].display[system].label;
}

/** The unit text, as a file would hold it, for `kind` in `system` (`N/mm`, `lbf/in`). */
export function quantityUnitText(kind: QuantityKind, system: UnitSystem): string {
  return KINDS[kind].display[system].unit;
}

/**
 * Formats an SI value for people: converted to the system's display unit, rounded to
 * that unit's usual decimals — or, where the system shows the kind in another unit than SI
 * does, as a shop writes it (numberShopFormat) — unit label appended. `decimals` overrides both.
 * @example quantityFormat(65000, 'stiffness', 'us') // "371 lbf/in"
 */
export function quantityFormat(
  valueSI: number,
  kind: QuantityKind,
  system: UnitSystem,
  options: { decimals?: number; withUnit?: boolean } = {},
): string {
  const d = KINDS[kind].display[system];
  const shown = quantityToDisplay(valueSI, kind, system);
  const text =
    options.decimals === undefined && quantityConvertedIn(kind, system)
      ? numberShopFormat(shown)
      : numberFormat(shown, options.decimals ?? d.decimals);
  return options.withUnit === false ? text : `${text} ${d.label}`;
}

/**
 * Whether `kind` is shown in `system` in another unit than in SI (lb, lbf/in, psi…): a value
 * converted to it is written as a shop writes it (numberShopFormat), not to the SI unit's decimals.
 */
export function quantityConvertedIn(kind: QuantityKind, system: UnitSystem): boolean {
  return KINDS[kind].display[system].unit !== KINDS[kind].display.si.unit;
}

/**
 * A converted number as a shop writes it: three significant figures, whole units always kept
 * (so three or four figures below 10 000: 1373 lbf/in, not 1370), no trailing zeros — 650 lb,
 * 514 lbf/in, 20.8 lbf·s/in, 24.7 psi, not 650.364 lb. For display only: a value converted in
 * place keeps its exact value behind the text (setup-form.ts, quantity-field.ts).
 * @example numberShopFormat(650.364) // "650"
 */
export function numberShopFormat(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const wholeDigits = Math.floor(Math.log10(Math.abs(value))) + 1;
  const decimals = Math.min(20, Math.max(0, 3 - wholeDigits));
  const text = numberFormat(value, decimals);
  return decimals > 0 ? text.replace(/\.?0+$/, '') : text;
}

/**
 * A value as a file would hold it: a string with the unit of `system`, precise enough
 * to read back to the same SI value within 1e-9 relative.
 */
export function quantityText(valueSI: number, kind: QuantityKind, system: UnitSystem = 'si'): string {
  const d = KINDS[kind].display[system];
  const shown = quantityToDisplay(valueSI, kind, system);
  return `${Number(shown.toPrecision(12))} ${d.unit}`;
}

/** Fixed decimals without "-0", for tables. */
export function numberFormat(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return String(value);
  const text = value.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}
