/**
 * The text of a point table of an invented bilinear damper (bump 3000/1000 N·s/m, rebound
 * 6000/2000 N·s/m, knee 0.06 m/s), compression positive, `n` rows from −0.5 to 0.5 m/s,
 * with `noise` newtons of a deterministic ripple, `offset` newtons added to every reading (a
 * gas force the readings include) and `extra` appended after the last row.
 */
export function benchPointTable(
  n: number,
  options: { extra?: string; noise?: number; offset?: number } = {},
): string {
  const lines = ['velocity,force'];
  for (let i = 0; i < n; i++) {
    const v = -0.5 + (i + 0.5) / n;
    const s = Math.abs(v);
    const f =
      v > 0
        ? 3000 * Math.min(s, 0.06) + 1000 * Math.max(s - 0.06, 0)
        : -(6000 * Math.min(s, 0.06) + 2000 * Math.max(s - 0.06, 0));
    const reading = f + (options.offset ?? 0) + (options.noise ?? 0) * Math.sin(i);
    lines.push(`${v.toFixed(7)},${reading.toFixed(3)}`);
  }
  return `${lines.join('\n')}\n${options.extra ?? ''}`;
}
