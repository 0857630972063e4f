/** What the Dampers screen's parts share: the API's shapes and the plot's limits. */
import { benchOffsetText } from '../../../core/damper/bench-fit';
import type { UnitSystem } from '../../../core/units/units';
import type { HandlerOutput } from '../../api/contract';

export type Damper = HandlerOutput<'benchList'>['dampers'][number];
export type ImportResult = HandlerOutput<'benchImport'>;
export type Points = [number, number][];

/** The plot tells runs apart by colour, dash and marker; past six they would repeat. */
export const MAX_SHOWN = 6;
export const DEFAULT_SHOWN = 4;

export const orDash = (v: number | null, f: (v: number) => string) => (v === null ? '—' : f(v));

/** The first run's zero-speed offset in words, as the import would report it; "" without one. */
export function offsetNote(
  runs: readonly { label: string; offset: number | null }[],
  units: UnitSystem,
): string {
  const r = runs.find((x) => x.offset !== null);
  return r
    ? ` ${r.label}: ${benchOffsetText(r.offset as number, undefined, units)} (enter it under Gas force).`
    : '';
}
