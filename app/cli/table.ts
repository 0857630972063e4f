import { textControlsEscaped } from '../../core/units/text-field';

/** Plain-text tables for the command's human output. */
export type TableRow = readonly string[];

const NUMBER_WITH_UNIT = /^([-+]?\d[\d.]*)(?: (.+))?$/;

const width = (s: string) => [...s].length;

/**
 * Lays rows out in columns. A cell that is a number, optionally followed by a space and a
 * unit ("56.7 N/mm"), is aligned on its number: numbers right-aligned, units after them.
 * A control character in a cell (a stored name's terminal escape) is shown as a `\u` escape.
 */
export function tableFormat(
  given: readonly TableRow[],
  options: { indent?: number; gap?: number } = {},
): string {
  const rows = given.map((r) => r.map(textControlsEscaped));
  const indent = ' '.repeat(options.indent ?? 2);
  const gap = ' '.repeat(options.gap ?? 3);
  const columns = Math.max(0, ...rows.map((r) => r.length));
  const numberWidth = new Array<number>(columns).fill(0);
  const unitWidth = new Array<number>(columns).fill(0);
  const textWidth = new Array<number>(columns).fill(0);
  for (const row of rows) {
    row.forEach((cell, i) => {
      const m = i > 0 ? NUMBER_WITH_UNIT.exec(cell) : null;
      if (m) {
        numberWidth[i] = Math.max(numberWidth[i] as number, width(m[1] as string));
        unitWidth[i] = Math.max(unitWidth[i] as number, m[2] ? width(m[2]) + 1 : 0);
      } else textWidth[i] = Math.max(textWidth[i] as number, width(cell));
    });
  }
  return rows
    .map((row) => {
      const cells = row.map((cell, i) => {
        const numeric = (numberWidth[i] as number) + (unitWidth[i] as number);
        const total = Math.max(numeric, textWidth[i] as number);
        const m = i > 0 ? NUMBER_WITH_UNIT.exec(cell) : null;
        let text = cell;
        if (m) {
          // Numbers end where the column's numbers end, even under a wider heading.
          const num = (m[1] as string).padStart(total - (unitWidth[i] as number));
          text = m[2] ? `${num} ${m[2]}` : num;
        }
        return text + ' '.repeat(Math.max(0, total - width(text)));
      });
      return (indent + cells.join(gap)).trimEnd();
    })
    .join('\n');
}

/** Wraps prose to `columns` for the terminal. */
export function textWrap(text: string, columns = 96, indent = ''): string {
  const words = text.split(/\s+/).filter(Boolean);
  const lines: string[] = [];
  let line = '';
  for (const word of words) {
    if (line && line.length + 1 + word.length > columns - indent.length) {
      lines.push(indent + line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) lines.push(indent + line);
  return lines.join('\n');
}
