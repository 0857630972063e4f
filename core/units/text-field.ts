import { InputError } from './input-error';

/** Longest name a vehicle, damper unit or revision may have (characters). */
export const NAME_MAX_LENGTH = 120;
/** Longest free-text note (characters): a page of a setup sheet. */
export const NOTES_MAX_LENGTH = 4000;
/** Longest short text field (event, track, driver, spring label, bar setting). */
export const SHORT_TEXT_MAX_LENGTH = 200;

/** Control characters other than tab and newline: they do not show, and break tables and files. */
function hasControlCharacter(text: string): boolean {
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if ((c < 0x20 && c !== 0x09 && c !== 0x0a) || (c >= 0x7f && c <= 0x9f)) return true;
  }
  return false;
}

/**
 * Characters (Unicode code points) of a text, counted without copying it; counting stops once
 * past `stopAbove`, so a text of any size costs at most that many steps.
 */
export function textLength(text: string, stopAbove = Infinity): number {
  let n = 0;
  for (let i = 0; i < text.length && n <= stopAbove; i++) {
    const c = text.charCodeAt(i);
    // A surrogate pair is one character.
    if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length) {
      const d = text.charCodeAt(i + 1);
      if (d >= 0xdc00 && d <= 0xdfff) i++;
    }
    n++;
  }
  return n;
}

/**
 * A text as a message or a listing may show it to a terminal: each control character other
 * than newline (a terminal escape among them) written as a `\u` escape, so that no stored or
 * given text can move the cursor, clear the screen or retitle the window of whoever reads it.
 */
export function textControlsEscaped(text: string): string {
  let out = '';
  for (const ch of text) {
    const c = ch.charCodeAt(0);
    out +=
      (c < 0x20 && c !== 0x0a) || (c >= 0x7f && c <= 0x9f) ? `\\u${c.toString(16).padStart(4, '0')}` : ch;
  }
  return out;
}

function describe(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'a list';
  return typeof value === 'string' ? `"${value}"` : typeof value;
}

/**
 * Reads a free-text field: a string, NFC-normalised (so that "é" typed two ways is one
 * text), trimmed, at most `maxLength` characters; newlines only when `multiline`.
 * `undefined` gives the empty text.
 * @throws InputError naming `field`.
 */
export function textFieldParse(
  raw: unknown,
  field: string,
  options: { maxLength?: number; multiline?: boolean } = {},
): string {
  if (raw === undefined) return '';
  if (typeof raw !== 'string') throw new InputError(field, `got ${describe(raw)}; expected a text`);
  const max = options.maxLength ?? SHORT_TEXT_MAX_LENGTH;
  // A text far over the limit is refused before it is normalised or copied: the limit plus room
  // for the spaces trimmed and the accents composed by normalising.
  const sentMax = 4 * max + 64;
  if (textLength(raw, sentMax) > sentMax)
    throw new InputError(field, `is more than ${sentMax} characters long; at most ${max} are kept`);
  const text = raw.normalize('NFC').replace(/\r\n?/g, '\n').trim();
  const length = textLength(text);
  if (length > max) throw new InputError(field, `is ${length} characters long; at most ${max} are kept`);
  if (hasControlCharacter(text)) throw new InputError(field, 'contains a control character');
  if (!options.multiline && /[\n\t]/.test(text))
    throw new InputError(field, 'must be one line (no newline or tab)');
  return text;
}

/**
 * Reads a name (vehicle, damper unit, setup revision): one line, not empty, at most
 * NAME_MAX_LENGTH characters, without "@" (it separates a vehicle from a revision number
 * in references such as "Coupe@3").
 * @throws InputError naming `field`.
 */
export function nameFieldParse(raw: unknown, field: string, what = 'a name'): string {
  if (raw === undefined) throw new InputError(field, `is missing; expected ${what}`);
  const name = textFieldParse(raw, field, { maxLength: NAME_MAX_LENGTH });
  if (name === '') throw new InputError(field, `is empty; expected ${what}`);
  if (name.includes('@'))
    throw new InputError(field, `"${name}" contains "@", which separates a name from a revision number`);
  return name;
}

/**
 * The key two names are compared by: NFC, case-folded, inner spaces collapsed — so
 * "Club Coupe" and "club  coupe" are one vehicle, and a second one of that name is refused.
 */
export function nameKey(name: string): string {
  return name.normalize('NFC').trim().replace(/\s+/g, ' ').toLowerCase();
}
