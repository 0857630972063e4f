import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { csvHeaderRead, csvNumbersRead, csvRowsPreview } from '../../../core/damper/bench-csv';
import { InputError } from '../../../core/units/input-error';
import { inputErrorOf } from '../../input-error-fixture';

function read(text: string, wanted = [0, 1]) {
  return csvNumbersRead(text, csvHeaderRead(text), wanted);
}

const problem = (fn: () => unknown): string => inputErrorOf(fn).message;

describe('csvHeaderRead', () => {
  it('finds the delimiter from the header: tab, then semicolon, then comma', () => {
    expect(csvHeaderRead('a\tb;c\n').delimiter).toBe('\t');
    expect(csvHeaderRead('a;b,c\n').delimiter).toBe(';');
    expect(csvHeaderRead('a,b\n').delimiter).toBe(',');
  });

  it('skips a byte-order mark, blank lines and # comments before the header', () => {
    const h = csvHeaderRead('\uFEFF# bench export\n\n  \nvelocity,force\n1,2\n');
    expect(h.cells).toEqual(['velocity', 'force']);
    expect(h.line).toBe(4);
  });

  it('reads quoted header cells holding the delimiter', () => {
    expect(csvHeaderRead('"velocity, shaft","force ""load"""\n').cells).toEqual([
      'velocity, shaft',
      'force "load"',
    ]);
  });

  it('refuses an empty file, a comments-only file, one column and an unnamed column', () => {
    expect(problem(() => csvHeaderRead(''))).toMatch(/is empty/);
    expect(problem(() => csvHeaderRead('\n\n  \n'))).toMatch(/is empty/);
    expect(problem(() => csvHeaderRead('# only\n# comments\n'))).toMatch(/only comment lines/);
    expect(problem(() => csvHeaderRead('velocity\n1\n'))).toMatch(/has one column/);
    expect(problem(() => csvHeaderRead('velocity,,force\n'))).toMatch(/column 2 has no name/);
    expect(problem(() => csvHeaderRead('"velocity,force\n'))).toMatch(/never closed/);
  });
});

describe('csvNumbersRead', () => {
  it('reads a file whose lines end with CR alone, as old Mac programs write them', () => {
    const text = '# bench export\rvelocity,force\r0.1,300\r\r-0.2,-700.5\r';
    const header = csvHeaderRead(text);
    expect(header.cells).toEqual(['velocity', 'force']);
    expect(header.line).toBe(2);
    const r = csvNumbersRead(text, header, [0, 1]);
    expect(Array.from(r.columns.get(0) ?? [])).toEqual([0.1, -0.2]);
    expect(Array.from(r.columns.get(1) ?? [])).toEqual([300, -700.5]);
    expect(Array.from(r.lines)).toEqual([3, 5]);
    expect(csvRowsPreview(text, header, 5)).toEqual([
      ['0.1', '300'],
      ['-0.2', '-700.5'],
    ]);
  });

  it('never puts a whole file into a message', () => {
    // One long line: a file whose line ends this reader does not know would read as one header.
    const text = `velocity${'\u20280.1 300'.repeat(5000)}`;
    const message = problem(() => csvHeaderRead(text));
    expect(message).toMatch(/has one column/);
    expect(message.length).toBeLessThan(300);
  });

  it('reads rows with CRLF or LF endings, skipping blank and comment lines, and keeps their line numbers', () => {
    const r = read('velocity,force\r\n0.1,300\r\n\r\n# pause\r\n-0.2,-700.5\r\n');
    expect(Array.from(r.columns.get(0) ?? [])).toEqual([0.1, -0.2]);
    expect(Array.from(r.columns.get(1) ?? [])).toEqual([300, -700.5]);
    expect(Array.from(r.lines)).toEqual([2, 5]);
  });

  it('reads exponents, signs and leading dots', () => {
    const r = read('v,f\n+1e-3,-2.5E2\n.5,7.\n');
    expect(Array.from(r.columns.get(0) ?? [])).toEqual([0.001, 0.5]);
    expect(Array.from(r.columns.get(1) ?? [])).toEqual([-250, 7]);
  });

  it('reads decimal commas in a semicolon file, and one separator throughout', () => {
    const r = read('v;f\n0,25;120,5\n-0,5;-300\n');
    expect(r.decimal).toBe(',');
    expect(Array.from(r.columns.get(0) ?? [])).toEqual([0.25, -0.5]);
  });

  const corpus: [string, string, RegExp][] = [
    ['a non-numeric cell', 'v,f\n0.1,300\n0.2,abc\n', /line 3, column "f": "abc" is not a number/],
    ['NaN', 'v,f\n0.1,NaN\n', /line 2, column "f": "NaN" is not a finite number/],
    ['Infinity', 'v,f\n-Infinity,1\n', /line 2, column "v": "-Infinity" is not a finite number/],
    ['inf', 'v,f\n1,inf\n', /not a finite number/],
    ['an overflowing number', 'v,f\n1,1e999\n', /too large to be a finite number/],
    ['an empty cell', 'v,f\n1,\n', /line 2, column "f": is empty/],
    ['too few cells', 'v,f\n1\n', /line 2: has 1 cell; the header has 2/],
    ['too many cells', 'v,f\n1,2,3\n', /line 2: has 3 cells; the header has 2/],
    ['a decimal comma in a comma file', 'v,f\n0,25,120\n', /decimal comma in a comma-separated file/],
    [
      'mixed decimal separators',
      'v;f\n0,25;120\n0.5;130\n',
      /line 3, column "v": "0.5" uses "." as decimal separator, but line 2 uses ","/,
    ],
    ['a dot after commas in one cell', 'v;f\n1.234,5;1\n', /holds both "." and ","/],
    ['a thousands separator', 'v,f\n"1,234.5",1\n', /holds both/],
    ['a unit in a cell', 'v,f\n0.1 m/s,1\n', /"0.1 m\/s" is not a number/],
    ['a hex number', 'v,f\n0x10,1\n', /"0x10" is not a number/],
  ];
  for (const [what, text, message] of corpus) {
    it(`names the line and column of ${what}`, () => {
      expect(problem(() => read(text))).toMatch(message);
    });
  }

  it('allows empty cells only where asked, as NaN', () => {
    const text = 'v,f\n1,\n';
    const r = csvNumbersRead(text, csvHeaderRead(text), [0, 1], { allowEmpty: new Set([1]) });
    expect(Number.isNaN(r.columns.get(1)?.[0])).toBe(true);
  });

  it('checks only the columns asked for, but the cell count of every row', () => {
    const r = read('v,note,f\n1,first run,2\n', [0, 2]);
    expect(r.columns.get(2)?.[0]).toBe(2);
    expect(problem(() => read('v,note,f\n1,a,b,2\n', [0, 2]))).toMatch(/has 4 cells/);
  });

  it('reads back every finite double written as JavaScript writes it (property)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(
            fc.double({ noNaN: true, noDefaultInfinity: true }),
            fc.double({ noNaN: true, noDefaultInfinity: true }),
          ),
          { minLength: 1, maxLength: 50 },
        ),
        (rows) => {
          // String(-0) is "0": what is written is what must come back.
          const text = `v,f\n${rows.map(([a, b]) => `${a},${b}`).join('\n')}\n`;
          const r = read(text);
          rows.forEach(([a, b], i) => {
            expect(r.columns.get(0)?.[i]).toBe(Number(String(a)));
            expect(r.columns.get(1)?.[i]).toBe(Number(String(b)));
          });
        },
      ),
      { numRuns: 100 },
    );
  });

  it('rejects every cell that is not a plain decimal number (property)', () => {
    fc.assert(
      fc.property(
        fc
          .string({ minLength: 1, maxLength: 8 })
          .filter(
            (s) =>
              !/^\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*$/.test(s) &&
              !/[,"\n\r]/.test(s) &&
              s.trim() !== '' &&
              !s.trim().startsWith('#'),
          ),
        (cell) => {
          expect(() => read(`v,f\n1,${cell}\n`)).toThrow(InputError);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('csvRowsPreview', () => {
  it('gives the first rows below the header as written, skipping blank and comment lines', () => {
    const text = '# bench\nv;f\n\n0,1;20\n# note\n0,2;"3;0"\n0,3;40\n';
    const rows = csvRowsPreview(text, csvHeaderRead(text), 2);
    expect(rows).toEqual([
      ['0,1', '20'],
      ['0,2', '3;0'],
    ]);
  });

  it('gives what there is when the file is shorter, and nothing below a header alone', () => {
    const text = 'velocity,force\n0.1, 200 \n';
    expect(csvRowsPreview(text, csvHeaderRead(text), 10)).toEqual([['0.1', '200']]);
    const bare = 'velocity,force';
    expect(csvRowsPreview(bare, csvHeaderRead(bare), 10)).toEqual([]);
    expect(csvRowsPreview(text, csvHeaderRead(text), 0)).toEqual([]);
  });

  it('shows a ragged row as it is, and names the line of an unclosed quote', () => {
    const text = 'velocity,force\n0.1,200,9\n0.2,"300\n';
    expect(() => csvRowsPreview(text, csvHeaderRead(text), 5)).toThrow('line 3: has a quote');
    expect(csvRowsPreview(text, csvHeaderRead(text), 1)).toEqual([['0.1', '200', '9']]);
  });
});
