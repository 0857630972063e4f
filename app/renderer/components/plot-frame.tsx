import { useRef, type ReactNode } from 'react';
import { imageFileSave, textFileSave } from '../native';

/**
 * Series styles: the Okabe–Ito colour-blind-safe palette (Okabe & Ito 2008), each with its own
 * dash pattern and marker shape so that series differ without colour too.
 */
export const SERIES_STYLES = [
  { colour: '#0072B2', dash: undefined, marker: 'circle' },
  { colour: '#D55E00', dash: '8 4', marker: 'square' },
  { colour: '#009E73', dash: '2 3', marker: 'triangle' },
  { colour: '#CC79A7', dash: '10 3 2 3', marker: 'diamond' },
  { colour: '#E69F00', dash: '4 2', marker: 'cross' },
  { colour: '#000000', dash: '1 2', marker: 'star' },
] as const;

export type SeriesStyle = (typeof SERIES_STYLES)[number];

/** The style of the `i`-th series, repeating after the last. */
export function seriesStyle(i: number): SeriesStyle {
  return SERIES_STYLES[i % SERIES_STYLES.length] as SeriesStyle;
}

/** Axis tick text: three significant digits, exponent form only for very large or small values. */
export const tickText = (v: number) => {
  const a = Math.abs(v);
  if (a !== 0 && (a >= 1e5 || a < 1e-3)) return v.toExponential(0);
  return String(Number(v.toPrecision(3)));
};

/** The label under a horizontal axis, its words and unit in dark ink. */
export const axisLabelX = (value: string) => ({
  value,
  position: 'insideBottom' as const,
  offset: -16,
  fill: '#111',
});

/** The label beside a vertical axis, turned to read upwards. */
export const axisLabelY = (value: string) => ({
  value,
  angle: -90,
  position: 'insideLeft' as const,
  offset: 0,
  fill: '#111',
  style: { textAnchor: 'middle' as const },
});

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

/**
 * The frame every plot sits in: a text title (the plot's accessible name), the chart, and the
 * buttons that save it as PNG and its data as CSV. `csv` is asked for only when saving.
 */
export function PlotFrame(props: {
  id: string;
  title: string;
  csv: () => string;
  height?: number;
  children: ReactNode;
}) {
  const box = useRef<HTMLDivElement>(null);
  const savePng = async () => {
    const svg = box.current?.querySelector('svg.recharts-surface');
    if (svg) await imageFileSave(`${props.id}.png`, await svgToPng(svg as SVGSVGElement));
  };
  const saveCsv = () => textFileSave(`${props.id}.csv`, props.csv(), { name: 'CSV', extensions: ['csv'] });
  const titleId = `plot-title-${props.id}`;
  return (
    <figure className="plot" data-plot={props.id} aria-labelledby={titleId}>
      <figcaption>
        <span className="plot-title" id={titleId}>
          {props.title}
        </span>
        <span className="plot-actions">
          <button type="button" onClick={() => void savePng()} aria-label={`Save PNG: ${props.title}`}>
            Save PNG
          </button>
          <button type="button" onClick={() => void saveCsv()} aria-label={`Save data (CSV): ${props.title}`}>
            Save data (CSV)
          </button>
        </span>
      </figcaption>
      <div ref={box} style={{ width: '100%', height: props.height ?? 280 }}>
        {props.children}
      </div>
    </figure>
  );
}
