import {
  CartesianGrid,
  ComposedChart,
  Legend,
  Line,
  ResponsiveContainer,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { csvFormat } from '../csv';
import { PlotFrame, seriesStyle, tickText } from './plot-frame';

export { SERIES_STYLES, svgToPng } from './plot-frame';

/**
 * One series of a plot: a curve, or measured points drawn as markers (`points`). `style`
 * picks the colour, dash and marker (by default the series' place in the list), so that a
 * run's points and its fitted curve can share a colour and differ by line against marker.
 */
export type PlotSeries = {
  name: string;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  points?: boolean;
  style?: number;
};

function niceLogTicks(lo: number, hi: number): number[] {
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

/**
 * A line plot with labelled axes (units in the labels), optional log axes, a legend, and
 * buttons to save it as PNG and its data as CSV. Series marked `points` are drawn as markers.
 */
export function LinePlot(props: {
  id: string;
  title: string;
  xLabel: string;
  yLabel: string;
  series: readonly PlotSeries[];
  xLog?: boolean;
  yLog?: boolean;
  height?: number;
}) {
  const data = props.series.map((s, i) => {
    const points: { x: number; y: number }[] = [];
    for (let k = 0; k < s.x.length; k++) {
      const x = s.x[k] as number;
      const y = s.y[k] as number;
      if (Number.isFinite(x) && Number.isFinite(y) && (!props.xLog || x > 0) && (!props.yLog || y > 0))
        points.push({ x, y });
    }
    return { name: s.name, points, asPoints: s.points === true, style: seriesStyle(s.style ?? i) };
  });
  const xs = data.flatMap((d) => d.points.map((p) => p.x));
  const ys = data.flatMap((d) => d.points.map((p) => p.y));
  const xRange: [number, number] = xs.length ? [Math.min(...xs), Math.max(...xs)] : [0, 1];
  const xTicks = props.xLog ? niceLogTicks(xRange[0], xRange[1]) : niceLinearTicks(xRange[0], xRange[1]);
  // A log axis spans the data; a linear one the round ticks around it.
  const xDomain: [number, number] = props.xLog
    ? xRange
    : [
        Math.min(xRange[0], xTicks[0] ?? xRange[0]),
        Math.max(xRange[1], xTicks[xTicks.length - 1] ?? xRange[1]),
      ];
  const yDomain: [number, number] | undefined =
    props.yLog && ys.length ? [Math.min(...ys), Math.max(...ys)] : undefined;
  return (
    <PlotFrame
      id={props.id}
      title={props.title}
      height={props.height ?? 280}
      csv={() => plotCsv(props.xLabel, props.yLabel, props.series)}
    >
      <ResponsiveContainer width="100%" height="100%">
        <ComposedChart margin={{ top: 8, right: 24, bottom: 28, left: 16 }}>
          <CartesianGrid stroke="#d0d0d0" strokeDasharray="2 4" />
          <XAxis
            dataKey="x"
            type="number"
            scale={props.xLog ? 'log' : 'linear'}
            domain={xDomain}
            allowDataOverflow
            ticks={xTicks}
            tickFormatter={tickText}
            label={{ value: props.xLabel, position: 'insideBottom', offset: -16, fill: '#111' }}
            stroke="#222"
          />
          <YAxis
            type="number"
            scale={props.yLog ? 'log' : 'linear'}
            domain={yDomain ?? ['auto', 'auto']}
            allowDataOverflow={props.yLog}
            ticks={props.yLog && yDomain ? niceLogTicks(yDomain[0], yDomain[1]) : undefined}
            tickFormatter={tickText}
            width={72}
            label={{
              value: props.yLabel,
              angle: -90,
              position: 'insideLeft',
              offset: 0,
              fill: '#111',
              style: { textAnchor: 'middle' },
            }}
            stroke="#222"
          />
          <Tooltip
            formatter={(v) => tickText(Number(v))}
            labelFormatter={(v) => `${props.xLabel}: ${tickText(Number(v))}`}
          />
          <Legend verticalAlign="top" />
          {data.map((d) =>
            d.asPoints ? (
              <Scatter
                key={d.name}
                name={d.name}
                data={d.points}
                dataKey="y"
                fill={d.style.colour}
                shape={d.style.marker}
                legendType={d.style.marker}
                isAnimationActive={false}
              />
            ) : (
              <Line
                key={d.name}
                name={d.name}
                data={d.points}
                dataKey="y"
                stroke={d.style.colour}
                strokeDasharray={d.style.dash}
                strokeWidth={2}
                dot={false}
                isAnimationActive={false}
              />
            ),
          )}
        </ComposedChart>
      </ResponsiveContainer>
    </PlotFrame>
  );
}
