import { InputError } from '../units/input-error';

/** Cell separators a bench file may use; a comma decimal separator is possible only without the comma. */
export type CsvDelimiter = ',' | ';' | '\t';

/** The header of a CSV text and where its data starts. */
export type CsvHeader = {
  cells: string[];
  delimiter: CsvDelimiter;
  /** 1-based line number of the header. */
  line: number;
  /** Offset in the text where the first data line starts. */
  dataStart: number;
};

/** The numeric columns read from a CSV text, one value per data row. */
export type CsvNumbers = {
  /** By column index, for the columns asked for; NaN marks an empty cell where empties are allowed. */
  columns: Map<number, Float64Array>;
  rowCount: number;
  /** 1-based file line of each data row, for messages about a row found wrong later. */
  lines: Uint32Array;
  decimal: '.' | ',';
};

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const NON_FINITE = /^[+-]?(nan|inf|infinity)$/i;

/** A piece of a file for a message: at most `max` characters, so that no message holds a whole file. */
export function csvTextClipped(text: string, max = 80): string {
  const flat = text.replace(/[\r\n\t]+/g, ' ');
  return flat.length <= max ? flat : `${flat.slice(0, max - 1)}…`;
}

/**
 * The character that ends a line of `text`: LF (a CRLF's CR is then stripped from each line),
 * or CR alone in a file that has no LF, as old Mac programs and some bench software write.
 */
function lineBreakOf(text: string): '\n' | '\r' {
  return text.includes('\n') || !text.includes('\r') ? '\n' : '\r';
}

function lineEnd(text: string, from: number, lineBreak: '\n' | '\r'): number {
  const i = text.indexOf(lineBreak, from);
  return i < 0 ? text.length : i;
}

function lineAt(text: string, from: number, to: number): string {
  return text.charCodeAt(to - 1) === 13 ? text.slice(from, to - 1) : text.slice(from, to);
}

/** Splits one line into cells; double-quoted cells may hold the delimiter and "" for a quote. */
function cellsOf(line: string, delimiter: string, lineNo: number): string[] {
  if (!line.includes('"')) return line.split(delimiter);
  const cells: string[] = [];
  let cell = '';
  let i = 0;
  let quoted = false;
  while (i < line.length) {
    const ch = line[i] as string;
    if (quoted) {
      if (ch === '"' && line[i + 1] === '"') {
        cell += '"';
        i += 2;
        continue;
      }
      if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"' && cell.trim() === '') {
      quoted = true;
      cell = '';
    } else if (ch === delimiter) {
      cells.push(cell);
      cell = '';
    } else cell += ch;
    i++;
  }
  if (quoted) throw new InputError(`line ${lineNo}`, 'has a quote (") that is never closed');
  cells.push(cell);
  return cells;
}

/**
 * Finds the header of a CSV text: the first line that is neither blank nor a `#` comment. Lines
 * end with LF, CRLF or, in a file without LF, CR alone.
 * The delimiter is the header's tab, else semicolon, else comma. A byte-order mark is skipped.
 * @throws InputError when the text has no header or the header has fewer than two columns.
 */
export function csvHeaderRead(text: string): CsvHeader {
  let pos = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let line = 0;
  const lineBreak = lineBreakOf(text);
  while (pos < text.length) {
    const end = lineEnd(text, pos, lineBreak);
    const content = lineAt(text, pos, end);
    line++;
    pos = end + 1;
    const trimmed = content.trim();
    if (trimmed === '' || trimmed.startsWith('#')) continue;
    const delimiter: CsvDelimiter = content.includes('\t') ? '\t' : content.includes(';') ? ';' : ',';
    const cells = cellsOf(content, delimiter, line).map((c) => c.trim());
    if (cells.length < 2)
      throw new InputError(
        `line ${line}`,
        `the header "${csvTextClipped(trimmed)}" has one column; expected at least two (e.g. "velocity,force") separated by commas, semicolons or tabs`,
      );
    cells.forEach((c, i) => {
      if (c === '') throw new InputError(`line ${line}`, `header column ${i + 1} has no name`);
    });
    return { cells, delimiter, line, dataStart: Math.min(pos, text.length) };
  }
  throw new InputError(
    'file',
    text.trim() === ''
      ? 'is empty; expected a header line and rows of numbers'
      : 'has only comment lines; expected a header line',
  );
}

/**
 * Reads the numeric columns `wanted` of a CSV text below its header, strictly: every row has
 * as many cells as the header, each wanted cell is a finite decimal number, and one decimal
 * separator is used throughout (a comma only in files not separated by commas). Blank lines
 * and `#` comment lines are skipped.
 * @throws InputError naming the line, the column and what is wrong — the first problem found.
 */
export function csvNumbersRead(
  text: string,
  header: CsvHeader,
  wanted: readonly number[],
  options: { allowEmpty?: ReadonlySet<number> } = {},
): CsvNumbers {
  const n = header.cells.length;
  let capacity = 1024;
  let data = wanted.map(() => new Float64Array(capacity));
  let lines = new Uint32Array(capacity);
  let rows = 0;
  let decimal: '.' | ',' | undefined = header.delimiter === ',' ? '.' : undefined;
  let decimalLine = 0;
  let pos = header.dataStart;
  let lineNo = header.line;
  const allowEmpty = options.allowEmpty ?? new Set<number>();
  const where = (line: number, col: number) => `line ${line}, column "${header.cells[col]}"`;
  const lineBreak = lineBreakOf(text);
  while (pos < text.length) {
    const end = lineEnd(text, pos, lineBreak);
    const content = lineAt(text, pos, end);
    pos = end + 1;
    lineNo++;
    if (content.trim() === '' || content.trimStart().startsWith('#')) continue;
    const cells = cellsOf(content, header.delimiter, lineNo);
    if (cells.length !== n)
      throw new InputError(
        `line ${lineNo}`,
        `has ${cells.length} cell${cells.length === 1 ? '' : 's'}; the header has ${n} (${header.cells.join(', ')})${
          cells.length > n && header.delimiter === ',' && /\d,\d/.test(content)
            ? '; a decimal comma in a comma-separated file splits numbers: write 0.25, or separate cells with semicolons'
            : ''
        }`,
      );
    if (rows === capacity) {
      capacity *= 2;
      data = data.map((d) => {
        const grown = new Float64Array(capacity);
        grown.set(d);
        return grown;
      });
      const grownLines = new Uint32Array(capacity);
      grownLines.set(lines);
      lines = grownLines;
    }
    for (let w = 0; w < wanted.length; w++) {
      const col = wanted[w] as number;
      let cell = (cells[col] as string).trim();
      if (cell === '') {
        if (allowEmpty.has(col)) {
          (data[w] as Float64Array)[rows] = NaN;
          continue;
        }
        throw new InputError(where(lineNo, col), 'is empty; expected a number');
      }
      if (cell.includes(',') || cell.includes('.')) {
        const sep = cell.includes(',') ? ',' : '.';
        if (cell.includes(',') && cell.includes('.'))
          throw new InputError(
            where(lineNo, col),
            `"${cell}" holds both "." and ","; write numbers without thousands separators`,
          );
        if (decimal === undefined) {
          decimal = sep;
          decimalLine = lineNo;
        } else if (sep !== decimal)
          throw new InputError(
            where(lineNo, col),
            `"${cell}" uses "${sep}" as decimal separator, but ${decimalLine ? `line ${decimalLine}` : 'a comma-separated file'} uses "${decimal}"; use one decimal separator throughout`,
          );
        if (sep === ',') cell = cell.replace(',', '.');
      }
      if (!NUMBER.test(cell)) {
        if (NON_FINITE.test(cell))
          throw new InputError(where(lineNo, col), `"${cell}" is not a finite number`);
        throw new InputError(where(lineNo, col), `"${cells[col]?.trim()}" is not a number`);
      }
      const v = Number(cell);
      if (!Number.isFinite(v))
        throw new InputError(where(lineNo, col), `"${cell}" is too large to be a finite number`);
      (data[w] as Float64Array)[rows] = v;
    }
    lines[rows] = lineNo;
    rows++;
  }
  const columns = new Map<number, Float64Array>();
  wanted.forEach((col, w) => columns.set(col, (data[w] as Float64Array).subarray(0, rows)));
  return { columns, rowCount: rows, lines: lines.subarray(0, rows), decimal: decimal ?? '.' };
}

/**
 * The first `count` data rows below the header as the file writes them (cells trimmed, not yet
 * read as numbers), for a preview before the columns are chosen. Blank and `#` comment lines
 * are skipped; a row may have more or fewer cells than the header.
 * @throws InputError for a row whose quote is never closed.
 */
export function csvRowsPreview(text: string, header: CsvHeader, count: number): string[][] {
  const rows: string[][] = [];
  let pos = header.dataStart;
  let lineNo = header.line;
  const lineBreak = lineBreakOf(text);
  while (pos < text.length && rows.length < count) {
    const end = lineEnd(text, pos, lineBreak);
    const content = lineAt(text, pos, end);
    pos = end + 1;
    lineNo++;
    if (content.trim() === '' || content.trimStart().startsWith('#')) continue;
    rows.push(cellsOf(content, header.delimiter, lineNo).map((c) => c.trim()));
  }
  return rows;
}
