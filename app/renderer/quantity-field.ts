import {
  quantityParse,
  quantityToDisplay,
  quantityUnitText,
  type QuantityKind,
  type UnitSystem,
} from '../../core/units/units';

const NUMBER_ONLY = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * What a quantity field's text stands for, as a file or the API holds it: a bare number is in
 * the unit shown beside the field ("80" in N/mm becomes "80 N/mm"); a unit the user typed
 * ("400 lbf/in") is kept as typed. Empty text is undefined.
 */
export function quantityFieldValue(text: string, kind: QuantityKind, system: UnitSystem): string | undefined {
  const t = text.trim();
  if (t === '') return undefined;
  return NUMBER_ONLY.test(t) ? `${t} ${quantityUnitText(kind, system)}` : t;
}

/**
 * A quantity field's text shown in another unit system: a value that reads is converted and
 * written to 6 significant digits; text that does not read is kept exactly as typed.
 */
export function quantityFieldConvert(
  text: string,
  kind: QuantityKind,
  from: UnitSystem,
  to: UnitSystem,
): string {
  if (from === to) return text;
  const value = quantityFieldValue(text, kind, from);
  if (value === undefined) return text;
  try {
    const si = quantityParse(value, kind, 'field');
    return String(Number(quantityToDisplay(si, kind, to).toPrecision(6)));
  } catch {
    return text;
  }
}

/**
 * How many display units one SI unit of `kind` is (1 m → 1000 mm): the factor plots scale by.
 * Not for temperature, whose scales are offset as well as scaled.
 */
export function quantityDisplayFactor(kind: QuantityKind, system: UnitSystem): number {
  return quantityToDisplay(1, kind, system);
}
