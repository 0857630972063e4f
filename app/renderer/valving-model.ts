import type { ClickSettings } from '../../core/damper/click-settings';
import {
  numberFormat,
  quantityFormat,
  quantityFromDisplay,
  quantityToDisplay,
  quantityUnitLabel,
  type QuantityKind,
  type UnitSystem,
} from '../../core/units/units';
import type { ValvingTargetKey } from '../../core/valving/valving-targets';
import type { HandlerOutput } from '../api/contract';
import { ApiCallError } from './api-client';

export type ValvingPresets = HandlerOutput<'valvingPresets'>;
export type ValvingPreset = ValvingPresets['presets'][number];
export type ValvingMap = HandlerOutput<'valvingMap'>;
export type ValvingChoice = HandlerOutput<'valvingChoose'>;
export type ValvingPick = ValvingChoice['corners'][number]['best'][number];
export type MapCell = ValvingMap['cells'][number];

/** A target as the table shows it; `band` and `weight` say what the user changed (only that is sent). */
export type TargetEdit = {
  low: string;
  high: string;
  weight: string;
  off: boolean;
  band: boolean;
  weighted: boolean;
};

/** A target the preset leaves out: off until the user sets it. */
export const TARGET_EDIT_OFF: TargetEdit = {
  low: '',
  high: '',
  weight: '1',
  off: true,
  band: false,
  weighted: false,
};

/** Each target's kind of quantity (null for a plain number such as ζ). */
export type TargetKinds = ReadonlyMap<ValvingTargetKey, QuantityKind | null>;

export const ADJUSTER_WORDS: Record<string, string> = {
  bump: 'bump',
  rebound: 'rebound',
  bumpHighSpeed: 'bump high',
  reboundHighSpeed: 'rebound high',
};

/** Click settings in words: "bump 6, rebound 12". */
export const clicksText = (c: ClickSettings) =>
  Object.entries(c)
    .map(([k, v]) => `${ADJUSTER_WORDS[k] ?? k} ${v}`)
    .join(', ') || 'no clicks';

/** One figure a heat map can show: its value in a cell (SI) and its text in a unit system. */
export type MapFigure = {
  key: string;
  label: string;
  value: (c: MapCell) => number | null;
  text: (v: number, units: UnitSystem) => string;
  target?: ValvingTargetKey;
};

/**
 * The map's figures a heat map can show, SI: ζ (with the target whose band marks them), the
 * damper's knee speeds and the linearised modes. null where a cell has none (a mode that does
 * not oscillate).
 */
export const MAP_FIGURES: readonly MapFigure[] = [
  ...(
    [
      ['lowSpeedMean', 'ζ low speed, mean', 'lowSpeedMean'],
      ['bump', 'ζ bump, low speed', 'bumpLowSpeed'],
      ['rebound', 'ζ rebound, low speed', 'reboundLowSpeed'],
      ['bumpHighSpeed', 'ζ bump, high speed', 'highSpeed'],
      ['reboundHighSpeed', 'ζ rebound, high speed', 'highSpeed'],
    ] as const
  ).map(([key, label, target]) => ({
    key,
    label,
    target,
    value: (c: MapCell) => c.figures.dampingRatio[key],
    text: (v: number) => numberFormat(v, 2),
  })),
  ...(['bump', 'rebound'] as const).map((dir) => ({
    key: `knee-${dir}`,
    label: `knee speed, ${dir}`,
    value: (c: MapCell) => c.figures.kneeSpeed[dir],
    text: (v: number, units: UnitSystem) => quantityFormat(v, 'velocity', units),
  })),
  ...(
    [
      ['body', 'body mode'],
      ['wheelHop', 'wheel-hop mode'],
    ] as const
  ).flatMap(([mode, words]) => [
    {
      key: `${mode}-frequency`,
      label: `${words}, frequency`,
      value: (c: MapCell) => c.figures.modes[mode]?.frequencyHz ?? null,
      text: (v: number) => `${numberFormat(v, 2)} Hz`,
    },
    {
      key: `${mode}-damping`,
      label: `${words}, ζ`,
      value: (c: MapCell) => c.figures.modes[mode]?.dampingRatio ?? null,
      text: (v: number) => numberFormat(v, 2),
    },
  ]),
];

/** The figure of that key, or the first (ζ low speed, mean). */
export const mapFigureOf = (key: string): MapFigure =>
  MAP_FIGURES.find((f) => f.key === key) ?? (MAP_FIGURES[0] as MapFigure);

/** Whether `v` lies inside a target's band; null when there is no band to say. */
export function bandOf(
  t: { low: number | null; high: number | null } | undefined,
  v: number,
): boolean | null {
  if (!t || (t.low === null && t.high === null)) return null;
  return (t.low === null || v >= t.low) && (t.high === null || v <= t.high);
}

/** A target value in the unit system's display unit, or the plain number. */
export const targetValueText = (v: number | null, kind: string | null, units: UnitSystem) =>
  v === null
    ? ''
    : String(Number((kind ? quantityToDisplay(v, kind as QuantityKind, units) : v).toPrecision(4)));

/** A check's value in the unit system, with its unit where it has one. */
export function checkNumber(
  v: number,
  kind: QuantityKind | null | undefined,
  units: UnitSystem,
  unit = true,
): string {
  if (!kind) return numberFormat(v, 3);
  const text = numberFormat(quantityToDisplay(v, kind, units), 3);
  return unit ? `${text} ${quantityUnitLabel(kind, units)}` : text;
}

/** The table's rows of a preset: its targets shown in the unit system, the rest off. */
export function targetEditsOf(
  presets: ValvingPresets,
  preset: ValvingPreset,
  units: UnitSystem,
): Record<string, TargetEdit> {
  const next: Record<string, TargetEdit> = {};
  for (const t of presets.targets) {
    const b = preset.targets[t.key];
    next[t.key] = b
      ? {
          low: targetValueText(b.low, t.kind, units),
          high: targetValueText(b.high, t.kind, units),
          weight: String(b.weight),
          off: false,
          band: false,
          weighted: false,
        }
      : { ...TARGET_EDIT_OFF };
  }
  return next;
}

/**
 * What the user changed of the preset's targets, as the valving call takes it: a target turned
 * off, or a band or weight edited (SI). An unchanged target is left out and keeps the preset's
 * band, scale and source.
 * @throws ApiCallError naming the target when a bound is not a number.
 */
export function targetsChanged(
  presets: ValvingPresets | null,
  preset: ValvingPreset | undefined,
  edits: Record<string, TargetEdit>,
  units: UnitSystem,
): Record<string, unknown> {
  const targets: Record<string, unknown> = {};
  for (const t of presets?.targets ?? []) {
    const e = edits[t.key];
    if (!e) continue;
    const inPreset = preset?.targets[t.key] !== undefined;
    if (e.off) {
      if (inPreset) targets[t.key] = 'off';
      continue;
    }
    if (inPreset && !e.band && !e.weighted) continue;
    const num = (s: string) => {
      if (s.trim() === '') return null;
      const v = Number(s);
      if (!Number.isFinite(v))
        throw new ApiCallError(400, `${t.label}: "${s}" is not a number`, `targets.${t.key}`);
      return t.kind ? quantityFromDisplay(v, t.kind as QuantityKind, units) : v;
    };
    targets[t.key] = {
      ...(e.band || !inPreset ? { low: num(e.low), high: num(e.high) } : {}),
      weight: Number(e.weight),
    };
  }
  return targets;
}

type MapAxis = ValvingMap['axes'][number];

/** A heat map's grid: each cell where its clicks put it, null where the map has none. */
export type HeatMapGrid = {
  rows: MapAxis;
  cols: MapAxis | null;
  /** The settings of any further adjusters the grid is drawn at (one slice of the map). */
  at: Record<string, number>;
  cells: (MapCell | null)[][];
};

/**
 * The map's cells laid on a grid, rows the first adjuster's clicks and columns the second's:
 * each cell in the row and column of its own clicks, so that a map measured at only some
 * combinations (bump 6 / rebound 6 and 12 / 12) leaves the others empty rather than shifting
 * cells along. A map with more adjusters is drawn at one setting of the rest: `at`'s, or the
 * first cell's.
 */
export function heatMapGrid(
  map: Pick<ValvingMap, 'axes' | 'cells'>,
  at: Record<string, number> = {},
): HeatMapGrid | null {
  const [rows, cols, ...rest] = map.axes;
  if (!rows) return null;
  const first = map.cells[0]?.clicks;
  const slice: Record<string, number> = {};
  for (const axis of rest) {
    const v = at[axis.adjuster] ?? first?.[axis.adjuster] ?? axis.clicks[0];
    if (v !== undefined) slice[axis.adjuster] = v;
  }
  const inSlice = (c: MapCell) => rest.every((axis) => c.clicks[axis.adjuster] === slice[axis.adjuster]);
  const cells = rows.clicks.map((r) =>
    (cols?.clicks ?? [null]).map(
      (k) =>
        map.cells.find(
          (c) =>
            c.clicks[rows.adjuster] === r &&
            (cols === undefined || c.clicks[cols.adjuster] === k) &&
            inSlice(c),
        ) ?? null,
    ),
  );
  return { rows, cols: cols ?? null, at: slice, cells };
}
