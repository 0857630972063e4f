/** CSV text from rows (RFC 4180 quoting), numbers written in full precision. */
export function csvFormat(rows: readonly (readonly (string | number)[])[]): string {
  const cell = (v: string | number) => {
    const s = typeof v === 'number' ? (Number.isFinite(v) ? String(v) : '') : v;
    return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
  };
  return rows.map((r) => r.map(cell).join(',')).join('\r\n') + '\r\n';
}
