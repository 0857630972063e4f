import { csvFormat } from '../csv';

/**
 * One series of a plot: a curve, or measured points drawn as markers (`points`). `style`
 * picks the colour, dash and marker (by default the series' place in the list), so that a
 * run's points and its fitted curve can share a colour and differ by line against marker.
 * `width` draws a curve wider, so that one drawn over it in the same place still shows.
 */
export type PlotSeries = {
  name: string;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  points?: boolean;
  style?: number;
  /** Line width (px), 2 unless given: curves that may coincide are drawn widest first. */
  width?: number;
};

/** Ticks at 1, 2 and 5 × 10ⁿ within [lo, hi], for a log axis. */
export function niceLogTicks(lo: number, hi: number): number[] {
  const ticks: number[] = [];
  for (let e = Math.floor(Math.log10(lo)); e <= Math.ceil(Math.log10(hi)); e++) {
    for (const m of [1, 2, 5]) {
      const t = m * 10 ** e;
      if (t >= lo * 0.999 && t <= hi * 1.001) ticks.push(t);
    }
  }
  return ticks;
}

/**
 * Round ticks for a linear axis over [lo, hi]: about `target` steps of 1, 2, 2.5 or 5 × 10ⁿ,
 * from a multiple of the step at or below `lo` to one at or above `hi`.
 */
export function niceLinearTicks(lo: number, hi: number, target = 6): number[] {
  if (!(hi > lo) || !Number.isFinite(lo) || !Number.isFinite(hi)) return [lo];
  const raw = (hi - lo) / target;
  const e = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * e >= raw) ?? 10) * e;
  const first = Math.floor(lo / step + 1e-9);
  const last = Math.ceil(hi / step - 1e-9);
  // Multiples of the step, computed from integers so that 0.1 + 0.2 does not creep in.
  return Array.from({ length: last - first + 1 }, (_, i) => Number(((first + i) * step).toPrecision(12)));
}

/** The series as CSV: one x column and one y column a series, rows padded where lengths differ. */
export function plotCsv(xLabel: string, yLabel: string, series: readonly PlotSeries[]): string {
  const header = series.flatMap((s) => [`${s.name}: ${xLabel}`, `${s.name}: ${yLabel}`]);
  const n = Math.max(0, ...series.map((s) => s.x.length));
  const rows: (string | number)[][] = [header];
  for (let i = 0; i < n; i++) {
    rows.push(
      series.flatMap((s): (string | number)[] =>
        i < s.x.length ? [s.x[i] as number, s.y[i] as number] : ['', ''],
      ),
    );
  }
  return csvFormat(rows);
}

/** The smallest 1, 2 or 5 × 10ⁿ at or above `v` (1 for nothing to show). */
export function niceCeiling(v: number): number {
  if (!(v > 0) || !Number.isFinite(v)) return 1;
  const e = 10 ** Math.floor(Math.log10(v));
  return ([1, 2, 5, 10].find((m) => m * e >= v) ?? 10) * e;
}

/** One group of bars: a value per category (NaN where there is none). */
export type BarSeries = { name: string; values: readonly number[] };

/** The bars as CSV: a category column, then one column a series. */
export function barCsv(
  categoryLabel: string,
  yLabel: string,
  categories: readonly string[],
  series: readonly BarSeries[],
): string {
  const rows: (string | number)[][] = [[categoryLabel, ...series.map((s) => `${s.name} (${yLabel})`)]];
  categories.forEach((c, i) => rows.push([c, ...series.map((s) => s.values[i] ?? NaN)]));
  return csvFormat(rows);
}

/**
 * A curve's points thinned for drawing to at most about `max`: the first and last kept, and in
 * each of max/2 runs of neighbouring points its lowest and its highest, in order — so every
 * peak and trough a plot a few hundred pixels wide can show stays, at a fraction of the work
 * of drawing them all. Markers (measured points) are never thinned; a plot's CSV keeps every
 * point.
 */
export function plotPointsThin<P extends { x: number; y: number }>(points: readonly P[], max: number): P[] {
  if (points.length <= max || max < 4) return [...points];
  const buckets = Math.floor((max - 2) / 2);
  const inner = points.length - 2;
  const out: P[] = [points[0] as P];
  for (let b = 0; b < buckets; b++) {
    const from = 1 + Math.floor((b * inner) / buckets);
    const to = 1 + Math.floor(((b + 1) * inner) / buckets);
    let lo = from;
    let hi = from;
    for (let k = from; k < to; k++) {
      if ((points[k] as P).y < (points[lo] as P).y) lo = k;
      if ((points[k] as P).y > (points[hi] as P).y) hi = k;
    }
    if (to <= from) continue;
    for (const k of lo === hi ? [lo] : [Math.min(lo, hi), Math.max(lo, hi)]) out.push(points[k] as P);
  }
  out.push(points[points.length - 1] as P);
  return out;
}
