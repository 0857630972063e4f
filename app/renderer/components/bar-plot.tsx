import {
  Bar,
  BarChart,
  CartesianGrid,
  LabelList,
  Legend,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { barCsv, niceCeiling, type BarSeries } from './plot-data';
import { PlotFrame, axisLabelX, axisLabelY, seriesStyle, tickText } from './plot-frame';

/**
 * Hatchings told apart without colour: the first series is solid, the others carry diagonal,
 * crossed or dotted fills over their colour.
 */
function fillPattern(id: string, i: number, colour: string) {
  const kind = i % 4;
  if (kind === 0) return null;
  return (
    <pattern key={i} id={`${id}-fill-${i}`} patternUnits="userSpaceOnUse" width={8} height={8}>
      <rect width={8} height={8} fill={colour} opacity={0.35} />
      {kind === 1 ? <path d="M0,8 L8,0" stroke={colour} strokeWidth={2.5} /> : null}
      {kind === 2 ? <path d="M0,0 L8,8 M0,8 L8,0" stroke={colour} strokeWidth={1.8} /> : null}
      {kind === 3 ? <circle cx={4} cy={4} r={2} fill={colour} /> : null}
    </pattern>
  );
}

/**
 * A bar chart of a few figures per category (a corner) with a labelled value axis, each bar
 * labelled with its value, series told apart by fill pattern as well as colour, and the same
 * Save PNG / Save data (CSV) buttons as the line plots.
 */
export function BarPlot(props: {
  id: string;
  title: string;
  categoryLabel: string;
  yLabel: string;
  categories: readonly string[];
  series: readonly BarSeries[];
  /** Text of a bar's value label. */
  valueText?: (v: number) => string;
  height?: number;
}) {
  const data = props.categories.map((category, i) => {
    const row: Record<string, string | number | null> = { category };
    props.series.forEach((s, k) => {
      const v = s.values[i];
      row[`s${k}`] = v !== undefined && Number.isFinite(v) ? v : null;
    });
    return row;
  });
  const valueText = props.valueText ?? tickText;
  return (
    <PlotFrame
      id={props.id}
      title={props.title}
      height={props.height ?? 260}
      csv={() => barCsv(props.categoryLabel, props.yLabel, props.categories, props.series)}
      legend={props.series.map((x, k) => ({
        text: x.name,
        colour: seriesStyle(k).colour,
        swatch: 'box' as const,
        hatch: k % 4,
      }))}
    >
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={data} margin={{ top: 18, right: 24, bottom: 28, left: 16 }}>
          <defs>{props.series.map((_, k) => fillPattern(props.id, k, seriesStyle(k).colour))}</defs>
          <CartesianGrid stroke="#d0d0d0" strokeDasharray="2 4" vertical={false} />
          <XAxis dataKey="category" type="category" label={axisLabelX(props.categoryLabel)} stroke="#222" />
          <YAxis
            type="number"
            // Headroom above the tallest bar for its value label.
            domain={[0, (max: number) => niceCeiling(max * 1.2)]}
            tickFormatter={tickText}
            width={72}
            label={axisLabelY(props.yLabel)}
            stroke="#222"
          />
          <Tooltip formatter={(v) => valueText(Number(v))} />
          <Legend verticalAlign="bottom" wrapperStyle={{ paddingTop: 18 }} />
          {props.series.map((s, k) => {
            const style = seriesStyle(k);
            return (
              <Bar
                key={s.name}
                name={s.name}
                dataKey={`s${k}`}
                fill={k % 4 === 0 ? style.colour : `url(#${props.id}-fill-${k})`}
                stroke={style.colour}
                strokeWidth={1.5}
                isAnimationActive={false}
              >
                <LabelList
                  dataKey={`s${k}`}
                  position="top"
                  fill="#111"
                  fontSize={12}
                  formatter={(v) => (typeof v === 'number' ? valueText(v) : '')}
                />
              </Bar>
            );
          })}
        </BarChart>
      </ResponsiveContainer>
    </PlotFrame>
  );
}
