import { InputError, inputFieldPath } from '../units/input-error';

/** The clicker adjusters a damper may have: low-speed (or only) bump and rebound, and high-speed ones. */
export const CLICK_ADJUSTERS = ['bump', 'rebound', 'bumpHighSpeed', 'reboundHighSpeed'] as const;
export type ClickAdjuster = (typeof CLICK_ADJUSTERS)[number];

/**
 * Clicker positions, whole clicks counted the way the damper's maker counts them (usually
 * from full stiff). Only the adjusters the damper has are present.
 */
export type ClickSettings = Partial<Record<ClickAdjuster, number>>;

/** Most clicks an adjuster is taken to have; beyond it the number is a typing slip. */
export const CLICKS_MAX = 200;

/** The words of the text form ("bump 3 rebound 6 bump-high 2"), by adjuster. */
const ADJUSTER_WORDS: Record<ClickAdjuster, string> = {
  bump: 'bump',
  rebound: 'rebound',
  bumpHighSpeed: 'bump-high',
  reboundHighSpeed: 'rebound-high',
};

function clickCountParse(raw: unknown, field: string): number {
  const n = typeof raw === 'string' && /^\s*\d+\s*$/.test(raw) ? Number(raw) : raw;
  if (typeof n !== 'number' || !Number.isInteger(n) || n < 0 || n > CLICKS_MAX) {
    const got = typeof raw === 'string' ? `"${raw}"` : String(raw);
    throw new InputError(field, `got ${got}; expected a whole number of clicks from 0 to ${CLICKS_MAX}`);
  }
  return n;
}

/**
 * Reads clicker positions from a file's object form `{"bump": 6, "rebound": 9}`.
 * @throws InputError naming the field.
 */
export function clickSettingsParse(raw: unknown, field: string): ClickSettings {
  if (raw === undefined) return {};
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw))
    throw new InputError(field, `expected an object such as {"bump": 6, "rebound": 9}`);
  const out: ClickSettings = {};
  for (const [key, value] of Object.entries(raw as Record<string, unknown>)) {
    if (!(CLICK_ADJUSTERS as readonly string[]).includes(key))
      throw new InputError(
        inputFieldPath(field, key),
        `is not a clicker adjuster (known: ${CLICK_ADJUSTERS.join(', ')})`,
      );
    out[key as ClickAdjuster] = clickCountParse(value, inputFieldPath(field, key));
  }
  return out;
}

/**
 * Reads clicker positions from the text form used on command lines and in bench-file
 * headers: word–number pairs, "bump 3 rebound 6", "rebound-high 2" (commas optional).
 * @throws InputError naming `field`.
 */
export function clickSettingsFromText(text: string, field: string): ClickSettings {
  const tokens = text
    .trim()
    .split(/[\s,;]+/)
    .filter((t) => t !== '');
  const out: ClickSettings = {};
  const byWord = new Map(Object.entries(ADJUSTER_WORDS).map(([k, w]) => [w, k as ClickAdjuster]));
  const words = Object.values(ADJUSTER_WORDS).join(', ');
  if (tokens.length === 0 || tokens.length % 2 !== 0)
    throw new InputError(
      field,
      `got "${text}"; expected adjuster–click pairs such as "bump 3 rebound 6" (${words})`,
    );
  for (let i = 0; i < tokens.length; i += 2) {
    const word = (tokens[i] as string).toLowerCase();
    const adjuster = byWord.get(word);
    if (!adjuster) throw new InputError(field, `"${tokens[i]}" is not a clicker adjuster (${words})`);
    if (out[adjuster] !== undefined) throw new InputError(field, `"${word}" is given twice in "${text}"`);
    out[adjuster] = clickCountParse(tokens[i + 1], field);
  }
  return out;
}

/** The text form of clicker positions, "bump 3 rebound 6"; "" when none are recorded. */
export function clickSettingsText(clicks: ClickSettings): string {
  return CLICK_ADJUSTERS.filter((a) => clicks[a] !== undefined)
    .map((a) => `${ADJUSTER_WORDS[a]} ${clicks[a]}`)
    .join(' ');
}
