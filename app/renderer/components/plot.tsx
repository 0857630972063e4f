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
import { PlotFrame, axisLabelX, axisLabelY, seriesStyle, tickText } from './plot-frame';
import { niceLinearTicks, niceLogTicks, plotCsv, plotPointsThin, type PlotSeries } from './plot-data';

/** Points of a curve drawn at most (the CSV keeps them all): min and max of 120 runs. */
const CURVE_POINTS_DRAWN = 242;

export { SERIES_STYLES, svgToPng } from './plot-frame';
export { plotCsv } from './plot-data';

export type { PlotSeries } from './plot-data';

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
    return {
      name: s.name,
      // A chart a few hundred pixels wide shows no more than this many points a curve.
      points: s.points === true ? points : plotPointsThin(points, CURVE_POINTS_DRAWN),
      asPoints: s.points === true,
      style: seriesStyle(s.style ?? i),
      width: s.width ?? 2,
    };
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
  const yRange: [number, number] | undefined = ys.length ? [Math.min(...ys), Math.max(...ys)] : undefined;
  const yTicks = yRange
    ? props.yLog
      ? niceLogTicks(yRange[0], yRange[1])
      : niceLinearTicks(yRange[0], yRange[1], 5)
    : undefined;
  const yDomain: [number, number] | undefined =
    yRange && yTicks
      ? props.yLog
        ? yRange
        : [
            Math.min(yRange[0], yTicks[0] ?? yRange[0]),
            Math.max(yRange[1], yTicks[yTicks.length - 1] ?? yRange[1]),
          ]
      : undefined;
  return (
    <PlotFrame
      id={props.id}
      title={props.title}
      height={props.height ?? 280}
      csv={() => plotCsv(props.xLabel, props.yLabel, props.series)}
      legend={data.map((d) => ({
        text: d.name,
        colour: d.style.colour,
        ...(d.asPoints
          ? { swatch: 'marker' as const, marker: d.style.marker }
          : { swatch: 'line' as const, dash: d.style.dash }),
      }))}
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
            label={axisLabelX(props.xLabel)}
            stroke="#222"
          />
          <YAxis
            type="number"
            scale={props.yLog ? 'log' : 'linear'}
            domain={yDomain ?? ['auto', 'auto']}
            allowDataOverflow
            ticks={yTicks}
            tickFormatter={tickText}
            width={72}
            label={axisLabelY(props.yLabel)}
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
                strokeWidth={d.width}
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
