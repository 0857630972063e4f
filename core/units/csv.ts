/**
 * Characters with which a spreadsheet starts a formula when a cell's text begins with them
 * (OWASP, "CSV Injection"): `=`, `+`, `-`, `@`, and tab and carriage return, which some
 * spreadsheets skip before looking for one.
 */
const FORMULA_START = /^[=+\-@\t\r]/;

/** A number written as text ("-0.25", "+3", "1e-3"): a spreadsheet reads it as the number it is. */
const PLAIN_NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * One CSV cell as written: a number in full precision (empty when not finite), or a text
 * that a spreadsheet will show as text. A text beginning with `=`, `+`, `-`, `@`, tab or
 * carriage return gets a leading `'` so that no spreadsheet runs it as a formula (the
 * usual defence, OWASP "CSV Injection"); a number — given as a number, or a text that is a
 * plain number such as "-0.25" — is left as it is, so negative values stay numbers. A cell
 * holding a comma, a quote or a line break is quoted as RFC 4180 says.
 * @example csvCellText('=HYPERLINK("x")') // `"'=HYPERLINK(""x"")"`
 * @example csvCellText(-0.25) // '-0.25'
 */
export function csvCellText(value: string | number): string {
  let text: string;
  if (typeof value === 'number') text = Number.isFinite(value) ? String(value) : '';
  else text = FORMULA_START.test(value) && !PLAIN_NUMBER.test(value) ? `'${value}` : value;
  return /[",\n\r]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/**
 * CSV text from rows, each cell written by `csvCellText` (spreadsheet-safe, RFC 4180
 * quoting), each row ended by `lineEnd` (RFC 4180's CRLF unless told).
 */
export function csvFormat(rows: readonly (readonly (string | number)[])[], lineEnd = '\r\n'): string {
  return rows.map((r) => r.map(csvCellText).join(',') + lineEnd).join('');
}
