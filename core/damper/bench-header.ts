/** A bench file's column header read: the quantity's name, its unit and the clicker setting, in the common styles. */
import { clickSettingsText, type ClickAdjuster, type ClickSettings } from './click-settings';
import { quantityParse } from '../units/units';

/** A header cell split into its name, its unit and its clicker setting. */
export type BenchHeaderCell = { text: string; name: string; unit?: string; setting?: string };

/**
 * Adjuster words and the short forms bench software and shops write in column names
 * ("B3 R6", "C3 R6", "LSC 4 HSC 2"), by adjuster.
 */
const HEADER_CLICK_WORDS: Readonly<Record<string, ClickAdjuster>> = {
  bump: 'bump',
  b: 'bump',
  c: 'bump',
  comp: 'bump',
  compression: 'bump',
  lsb: 'bump',
  lsc: 'bump',
  rebound: 'rebound',
  r: 'rebound',
  reb: 'rebound',
  lsr: 'rebound',
  'bump-high': 'bumpHighSpeed',
  hsb: 'bumpHighSpeed',
  hsc: 'bumpHighSpeed',
  'rebound-high': 'reboundHighSpeed',
  hsr: 'reboundHighSpeed',
};

/** Clicker positions from header words ("bump 3 rebound 6", "B0 R0", "c3,r6"), or null when they are not that. */
function headerClicksRead(tokens: readonly string[]): ClickSettings | null {
  const flat: string[] = [];
  for (const t of tokens) {
    const joined = /^([a-z-]+)(\d+)$/i.exec(t);
    if (joined) flat.push(joined[1] as string, joined[2] as string);
    else flat.push(t);
  }
  if (flat.length === 0 || flat.length % 2 !== 0) return null;
  const out: ClickSettings = {};
  for (let i = 0; i < flat.length; i += 2) {
    const adjuster = HEADER_CLICK_WORDS[(flat[i] as string).toLowerCase()];
    const n = flat[i + 1] as string;
    if (!adjuster || !/^\d+$/.test(n) || out[adjuster] !== undefined) return null;
    out[adjuster] = Number(n);
  }
  return out;
}

/** Whether `text` is a unit of a bench column: a speed, force, time or length ("in/s", "lbf", "ms"). */
function headerUnitIs(text: string): boolean {
  if (!/^[a-zA-Zµ/^*.\d ]+$/.test(text) || !/[a-zA-Zµ]/.test(text)) return false;
  return (['velocity', 'force', 'time', 'length'] as const).some((kind) => {
    try {
      quantityParse(`1 ${text}`, kind, '');
      return true;
    } catch {
      return false;
    }
  });
}

/**
 * Reads a header cell into its name, unit and clicker setting, in the forms bench files use:
 * `velocity [in/s] (bump 3 rebound 6)`, `Velocity (in/s)`, `Force (lbf)`, `Velocity [in/s] B0 R0`,
 * `Velocity (in/s) bump 3 rebound 6`, `velocity_in_s`, `Force_lbf`. Brackets always hold a unit;
 * parentheses hold a unit or clicks, whichever they read as; words after the name are clicks
 * ("B0 R0") or, joined by "/", a unit (`velocity_in_s` → in/s).
 */
export function benchHeaderCellParse(text: string): BenchHeaderCell {
  let unit = /\[([^\]]*)\]/.exec(text)?.[1]?.trim();
  let setting: string | undefined;
  for (const m of text.matchAll(/\(([^)]*)\)/g)) {
    const inner = (m[1] as string).trim();
    const clicks = headerClicksRead(inner.split(/[\s,;]+/).filter(Boolean));
    if (clicks) setting = clickSettingsText(clicks);
    else if (unit === undefined && headerUnitIs(inner)) unit = inner;
    // Neither: kept as written, so that reading the clicks says what is wrong with them.
    else setting ??= inner;
  }
  const rest = text
    .replace(/\[[^\]]*\]/g, ' ')
    .replace(/\([^)]*\)/g, ' ')
    .split(/[\s_]+/)
    .filter(Boolean);
  let nameEnd = rest.length;
  for (let k = 1; k < rest.length; k++) {
    const clicks = headerClicksRead(rest.slice(k));
    if (clicks) {
      if (setting === undefined) setting = clickSettingsText(clicks);
      nameEnd = k;
      break;
    }
  }
  // `velocity_in_s`, `force N`: the words after the first, joined by "/", may be its unit.
  if (unit === undefined && nameEnd > 1) {
    const candidate = rest.slice(1, nameEnd).join('/');
    if (headerUnitIs(candidate)) {
      unit = candidate;
      nameEnd = 1;
    }
  }
  const cell: BenchHeaderCell = { text, name: rest.slice(0, nameEnd).join(' ').toLowerCase() };
  if (unit !== undefined) cell.unit = unit;
  if (setting !== undefined) cell.setting = setting;
  return cell;
}
