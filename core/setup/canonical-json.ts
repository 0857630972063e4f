/**
 * JSON with object keys in sorted order at every level, so that equal values give equal
 * text: stored corner inputs can be compared, hashed and diffed by their text. Numbers keep
 * JavaScript's shortest round-trip form, so parsing the text gives back the same doubles.
 */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) => {
    if (v === null || typeof v !== 'object' || Array.isArray(v)) return v;
    const o = v as Record<string, unknown>;
    const sorted: Record<string, unknown> = {};
    for (const k of Object.keys(o).sort()) sorted[k] = o[k];
    return sorted;
  });
}
