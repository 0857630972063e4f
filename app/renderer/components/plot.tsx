import { useRef } from 'react';
import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { imageFileSave, textFileSave } from '../native';
import { csvFormat } from '../csv';

/** One curve of a plot. */
export type PlotSeries = { name: string; x: ArrayLike<number>; y: ArrayLike<number> };

/**
 * Series styles: the Okabe–Ito colour-blind-safe palette (Okabe & Ito 2008), each with its own
 * dash pattern so that curves differ without colour too.
 */
export const SERIES_STYLES = [
  { colour: '#0072B2', dash: undefined },
  { colour: '#D55E00', dash: '8 4' },
  { colour: '#009E73', dash: '2 3' },
  { colour: '#CC79A7', dash: '10 3 2 3' },
  { colour: '#E69F00', dash: '4 2' },
  { colour: '#000000', dash: '1 2' },
] as const;

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

const tickText = (v: number) => {
  const a = Math.abs(v);
  if (a !== 0 && (a >= 1e5 || a < 1e-3)) return v.toExponential(0);
  return String(Number(v.toPrecision(3)));
};

/** Renders an SVG chart to a PNG data URL on a white background, at twice the screen resolution. */
export async function svgToPng(svg: SVGSVGElement): Promise<string> {
  const box = svg.getBoundingClientRect();
  const clone = svg.cloneNode(true) as SVGSVGElement;
  clone.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  clone.setAttribute('width', String(box.width));
  clone.setAttribute('height', String(box.height));
  const text = new XMLSerializer().serializeToString(clone);
  const img = new Image();
  img.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(text)}`;
  await img.decode();
  const canvas = document.createElement('canvas');
  canvas.width = Math.ceil(box.width * 2);
  canvas.height = Math.ceil(box.height * 2);
  const g = canvas.getContext('2d');
  if (!g) throw new Error('no canvas');
  g.fillStyle = '#ffffff';
  g.fillRect(0, 0, canvas.width, canvas.height);
  g.scale(2, 2);
  g.drawImage(img, 0, 0);
  return canvas.toDataURL('image/png');
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
 * buttons to save it as PNG and its data as CSV.
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
  const box = useRef<HTMLDivElement>(null);
  const data = props.series.map((s) => {
    const points: { x: number; y: number }[] = [];
    for (let i = 0; i < s.x.length; i++) {
      const x = s.x[i] as number;
      const y = s.y[i] as number;
      if (Number.isFinite(x) && Number.isFinite(y) && (!props.xLog || x > 0) && (!props.yLog || y > 0))
        points.push({ x, y });
    }
    return { name: s.name, points };
  });
  const xs = data.flatMap((d) => d.points.map((p) => p.x));
  const ys = data.flatMap((d) => d.points.map((p) => p.y));
  const xDomain: [number, number] = xs.length ? [Math.min(...xs), Math.max(...xs)] : [0, 1];
  const yDomain: [number, number] | undefined =
    props.yLog && ys.length ? [Math.min(...ys), Math.max(...ys)] : undefined;
  const savePng = async () => {
    const svg = box.current?.querySelector('svg.recharts-surface');
    if (svg) await imageFileSave(`${props.id}.png`, await svgToPng(svg as SVGSVGElement));
  };
  const saveCsv = () =>
    textFileSave(`${props.id}.csv`, plotCsv(props.xLabel, props.yLabel, props.series), {
      name: 'CSV',
      extensions: ['csv'],
    });
  return (
    <figure className="plot" data-plot={props.id}>
      <figcaption>
        <span className="plot-title">{props.title}</span>
        <span className="plot-actions">
          <button type="button" onClick={() => void savePng()}>
            Save PNG
          </button>
          <button type="button" onClick={() => void saveCsv()}>
            Save data (CSV)
          </button>
        </span>
      </figcaption>
      <div ref={box} style={{ width: '100%', height: props.height ?? 280 }}>
        <ResponsiveContainer width="100%" height="100%">
          <LineChart margin={{ top: 8, right: 24, bottom: 28, left: 16 }}>
            <CartesianGrid stroke="#d0d0d0" strokeDasharray="2 4" />
            <XAxis
              dataKey="x"
              type="number"
              scale={props.xLog ? 'log' : 'linear'}
              domain={xDomain}
              allowDataOverflow
              ticks={props.xLog ? niceLogTicks(xDomain[0], xDomain[1]) : undefined}
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
            <Legend verticalAlign="top" wrapperStyle={{ paddingBottom: 10, lineHeight: '18px' }} />
            {data.map((d, i) => {
              const style = SERIES_STYLES[i % SERIES_STYLES.length] as (typeof SERIES_STYLES)[number];
              return (
                <Line
                  key={d.name}
                  name={d.name}
                  data={d.points}
                  dataKey="y"
                  stroke={style.colour}
                  strokeDasharray={style.dash}
                  strokeWidth={2}
                  dot={false}
                  isAnimationActive={false}
                />
              );
            })}
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
