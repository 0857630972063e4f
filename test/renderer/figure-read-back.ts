import {
  QUANTITY_KINDS,
  quantityFromDisplay,
  quantityUnitLabel,
  type UnitSystem,
} from '../../core/units/units';

/** One number of a shown figure, back in SI, with how far the display's rounding may have moved it (SI). */
export type FigureNumber = { si: number; halfStep: number };

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');

/**
 * Every number of a figure's text ("64.8 N/mm", "1.23 Hz, ζ 0.45", "0.12 / 0.30 m/s") read back to
 * SI with the unit written after it (a bare number stays as it is), and half its last decimal.
 */
export function figureNumbersRead(text: string, system: UnitSystem): FigureNumber[] {
  const labels = QUANTITY_KINDS.map((kind) => ({ kind, label: quantityUnitLabel(kind, system) })).sort(
    (a, b) => b.label.length - a.label.length,
  );
  const unitPattern = labels.map((l) => escape(l.label)).join('|');
  const token = new RegExp(`(-?\\d+(?:\\.(\\d+))?)(?:\\s*(${unitPattern})(?![\\w²]))?`, 'gu');
  const numbers: { value: number; decimals: number; unit: string | undefined }[] = [];
  for (const m of text.matchAll(token))
    numbers.push({ value: Number(m[1]), decimals: m[2]?.length ?? 0, unit: m[3] });
  // "0.12 / 0.30 m/s": a number without a unit of its own takes the next one's.
  const out: FigureNumber[] = [];
  for (let i = 0; i < numbers.length; i++) {
    const n = numbers[i] as (typeof numbers)[number];
    const unit =
      n.unit ?? (text.includes(' / ') ? numbers.slice(i + 1).find((x) => x.unit)?.unit : undefined);
    const kind = labels.find((l) => l.label === unit)?.kind;
    const half = 0.5 * 10 ** -n.decimals;
    out.push(
      kind
        ? {
            si: quantityFromDisplay(n.value, kind, system),
            halfStep: Math.abs(
              quantityFromDisplay(n.value + half, kind, system) - quantityFromDisplay(n.value, kind, system),
            ),
          }
        : { si: n.value, halfStep: half },
    );
  }
  return out;
}
