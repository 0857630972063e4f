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

/**
 * A legend entry for the saved image: its words, colour, and the swatch that tells it apart
 * without colour — a line with its dash, a marker of its shape, or a box with its hatching.
 */
export type LegendEntry = {
  text: string;
  colour: string;
  swatch: 'line' | 'marker' | 'box';
  dash?: string | undefined;
  marker?: string;
  /** 0 solid, 1 diagonal, 2 crossed, 3 dotted (as the bar plot fills them). */
  hatch?: number;
};

/** Draws one legend swatch, 16 × 10 px, centred on y. */
function swatchDraw(g: CanvasRenderingContext2D, e: LegendEntry, x: number, y: number): void {
  g.save();
  g.fillStyle = e.colour;
  g.strokeStyle = e.colour;
  if (e.swatch === 'line') {
    g.lineWidth = 2;
    g.setLineDash(e.dash ? e.dash.split(' ').map(Number) : []);
    g.beginPath();
    g.moveTo(x, y);
    g.lineTo(x + 16, y);
    g.stroke();
  } else if (e.swatch === 'marker') {
    const cx = x + 8;
    g.beginPath();
    if (e.marker === 'square') g.rect(cx - 4, y - 4, 8, 8);
    else if (e.marker === 'triangle') {
      g.moveTo(cx, y - 5);
      g.lineTo(cx + 5, y + 4);
      g.lineTo(cx - 5, y + 4);
    } else if (e.marker === 'diamond') {
      g.moveTo(cx, y - 5);
      g.lineTo(cx + 5, y);
      g.lineTo(cx, y + 5);
      g.lineTo(cx - 5, y);
    } else g.arc(cx, y, 4, 0, 2 * Math.PI);
    g.closePath();
    g.fill();
  } else {
    const hatch = e.hatch ?? 0;
    g.globalAlpha = hatch === 0 ? 1 : 0.35;
    g.fillRect(x, y - 5, 16, 10);
    g.globalAlpha = 1;
    g.lineWidth = 1.5;
    g.strokeRect(x, y - 5, 16, 10);
    g.beginPath();
    if (hatch === 1 || hatch === 2)
      for (let k = -10; k < 16; k += 5) {
        g.moveTo(x + Math.max(0, k), y + 5 - Math.max(0, -k));
        g.lineTo(x + Math.min(16, k + 10), y - 5 + Math.max(0, k + 10 - 16));
      }
    if (hatch === 2)
      for (let k = -10; k < 16; k += 5) {
        g.moveTo(x + Math.max(0, k), y - 5 + Math.max(0, -k));
        g.lineTo(x + Math.min(16, k + 10), y + 5 - Math.max(0, k + 10 - 16));
      }
    g.stroke();
    if (hatch === 3) for (let k = 3; k < 16; k += 5) g.fillRect(x + k, y - 1, 2, 2);
  }
  g.restore();
}

const PNG_FONT = '13px system-ui, sans-serif';

/** Splits `text` into lines no wider than `width` at spaces. */
function textWrap(g: CanvasRenderingContext2D, text: string, width: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(' ')) {
    const next = line ? `${line} ${word}` : word;
    if (line && g.measureText(next).width > width) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

/** Lays legend entries out in rows across `width` (CSS px): where each swatch and text goes. */
function legendLayout(
  g: CanvasRenderingContext2D,
  entries: readonly LegendEntry[],
  width: number,
): { x: number; row: number; entry: LegendEntry }[] {
  g.font = PNG_FONT;
  const out: { x: number; row: number; entry: LegendEntry }[] = [];
  let x = 8;
  let row = 0;
  for (const entry of entries) {
    const w = 22 + g.measureText(entry.text).width + 16;
    if (x + w > width - 8 && x > 8) {
      x = 8;
      row++;
    }
    out.push({ x, row, entry });
    x += w;
  }
  return out;
}

/**
 * Renders a chart to a PNG data URL at twice the screen resolution, on white, with the plot's
 * title and legend drawn above it: the page shows both as HTML, which an SVG alone would lose.
 */
export async function svgToPng(
  svg: SVGSVGElement,
  extras: { title?: string; legend?: readonly LegendEntry[] } = {},
): Promise<string> {
  const box = svg.getBoundingClientRect();
  const clone = svg.cloneNode(true) as SVGSVGElement;
  clone.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  clone.setAttribute('width', String(box.width));
  clone.setAttribute('height', String(box.height));
  // Alone, the SVG would lose the page's type: its text would fall back to a serif face.
  const style = getComputedStyle(svg);
  clone.setAttribute('font-family', style.fontFamily);
  clone.setAttribute('font-size', style.fontSize);
  const text = new XMLSerializer().serializeToString(clone);
  const img = new Image();
  img.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(text)}`;
  await img.decode();
  const canvas = document.createElement('canvas');
  const measure = canvas.getContext('2d');
  if (!measure) throw new Error('no canvas');
  const layout = legendLayout(measure, extras.legend ?? [], box.width);
  const rows = layout.length ? (layout[layout.length - 1]?.row ?? 0) + 1 : 0;
  measure.font = `bold ${PNG_FONT}`;
  const titleLines = extras.title ? textWrap(measure, extras.title, box.width - 16) : [];
  const titleHeight = titleLines.length * 18 + (titleLines.length ? 6 : 0);
  const top = titleHeight + rows * 20 + (rows || titleLines.length ? 8 : 0);
  canvas.width = Math.ceil(box.width * 2);
  canvas.height = Math.ceil((box.height + top) * 2);
  const g = canvas.getContext('2d');
  if (!g) throw new Error('no canvas');
  g.fillStyle = '#ffffff';
  g.fillRect(0, 0, canvas.width, canvas.height);
  g.scale(2, 2);
  g.textBaseline = 'middle';
  g.font = `bold ${PNG_FONT}`;
  g.fillStyle = '#111111';
  titleLines.forEach((line, i) => g.fillText(line, 8, 12 + i * 18));
  g.font = PNG_FONT;
  for (const { x, row, entry } of layout) {
    const y = titleHeight + row * 20 + 10;
    swatchDraw(g, entry, x, y);
    g.fillStyle = '#111111';
    g.fillText(entry.text, x + 22, y);
  }
  g.drawImage(img, 0, top);
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
  /** The legend as the saved image draws it (the page's legend is HTML, which the SVG lacks). */
  legend: readonly LegendEntry[];
  height?: number;
  children: ReactNode;
}) {
  const box = useRef<HTMLDivElement>(null);
  const savePng = async () => {
    // The chart's own surface: legend swatches are small SVGs of the same class.
    const svg = box.current?.querySelector('.recharts-wrapper > svg.recharts-surface');
    if (!svg) return;
    const png = await svgToPng(svg as SVGSVGElement, { title: props.title, legend: props.legend });
    await imageFileSave(`${props.id}.png`, png);
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
