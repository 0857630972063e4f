import { quantityToDisplay, quantityUnitLabel, type QuantityKind, type UnitSystem } from './units';

/** Significant figures a message writes a number with: as people write it, not as a float prints. */
export const MESSAGE_SIGNIFICANT_FIGURES = 4;

/**
 * A number for a message: at most `significant` significant figures, without the float noise
 * of binary fractions and without trailing zeros ("0.009", not "0.009000000000000001").
 * Very large or small magnitudes keep JavaScript's exponent form ("1e+300").
 * @example numberRounded(0.009000000000000001) // "0.009"
 * @example numberRounded(-1234.5678) // "-1235"
 */
export function numberRounded(value: number, significant = MESSAGE_SIGNIFICANT_FIGURES): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const rounded = Number(value.toPrecision(significant));
  // Next to the largest double, rounding up overflows: keep the exponent form then.
  return Number.isFinite(rounded) ? String(rounded) : value.toPrecision(significant);
}

/**
 * Two numbers for one message, rounded as `numberRounded` does but with as many more figures
 * as it takes to tell them apart when they differ ("1.2344 s is not after 1.2345 s").
 */
export function numbersRoundedApart(a: number, b: number): [string, string] {
  let significant = MESSAGE_SIGNIFICANT_FIGURES;
  while (a !== b && significant < 17 && numberRounded(a, significant) === numberRounded(b, significant))
    significant++;
  return [numberRounded(a, significant), numberRounded(b, significant)];
}

/**
 * An SI value for a message, in the display unit of `system` with its label, rounded by
 * `numberRounded` ("0.009 s", "1e+300 kg", "372.6 lbf/in").
 */
export function quantityRounded(
  valueSI: number,
  kind: QuantityKind,
  system: UnitSystem = 'si',
  significant = MESSAGE_SIGNIFICANT_FIGURES,
): string {
  const shown = Number.isFinite(valueSI) ? quantityToDisplay(valueSI, kind, system) : valueSI;
  return `${numberRounded(shown, significant)} ${quantityUnitLabel(kind, system)}`;
}
