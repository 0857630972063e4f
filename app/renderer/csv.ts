/** CSV text from rows: spreadsheet-safe cells, RFC 4180 quoting, numbers in full precision (core/csv.ts). */
export { csvFormat } from '../../core/units/csv';
