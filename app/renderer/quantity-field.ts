import {
  numberShopFormat,
  quantityParse,
  quantityToDisplay,
  quantityUnitText,
  type QuantityKind,
  type UnitSystem,
} from '../../core/units/units';

const NUMBER_ONLY = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * The exact SI value behind each text a conversion wrote ("49.7" mph written from 80 km/h),
 * so that the rounded text a user sees stands for the value it was written from: switching
 * units and back never moves a value. Kept for the latest conversions only; a text the user
 * types again is read as typed.
 */
const EXACT_BEHIND = new Map<string, number>();
/** How each exact value was written in each system: a typed text comes back as typed. */
const WRITTEN_AS = new Map<string, string>();
const EXACT_KEPT = 500;
function remember<T>(map: Map<string, T>, key: string, value: T): void {
  map.delete(key);
  map.set(key, value);
  if (map.size > EXACT_KEPT) map.delete(map.keys().next().value as string);
}
const exactKey = (text: string, kind: QuantityKind, system: UnitSystem) => `${kind}|${system}|${text}`;

/**
 * What a quantity field's text stands for, as a file or the API holds it: a bare number is in
 * the unit shown beside the field ("80" in N/mm becomes "80 N/mm"), or — for a text a unit
 * switch wrote — the exact SI value it was converted from, as a bare SI number; a unit the user typed ("400 lbf/in")
 * is kept as typed. Empty text is undefined.
 */
export function quantityFieldValue(text: string, kind: QuantityKind, system: UnitSystem): string | undefined {
  const t = text.trim();
  if (t === '') return undefined;
  if (!NUMBER_ONLY.test(t)) return t;
  const exact = EXACT_BEHIND.get(exactKey(t, kind, system));
  // A bare number is SI to core's reader: the exact value, to the last bit.
  return exact === undefined ? `${t} ${quantityUnitText(kind, system)}` : String(exact);
}

/**
 * A quantity field's text shown in another unit system: a value that reads is converted and
 * written as a shop writes it (numberShopFormat: 650 lb, 24.7 psi), its exact value kept
 * behind the text (quantityFieldValue reads it back); text that does not read is kept exactly
 * as typed.
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
    // Back in the system a value was typed in, it reads as typed.
    remember(WRITTEN_AS, `${kind}|${from}|${si}`, text.trim());
    const shown = WRITTEN_AS.get(`${kind}|${to}|${si}`) ?? numberShopFormat(quantityToDisplay(si, kind, to));
    remember(EXACT_BEHIND, exactKey(shown, kind, to), si);
    return shown;
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
