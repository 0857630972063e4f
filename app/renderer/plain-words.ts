/**
 * The backend's messages are written for the command as well as for the app: they name
 * command-line options ("--damper LABEL") and the paths of fields in a file
 * ("corners.FL.corner.cornerMass"). On a screen both become the words the screen uses.
 */

/** Hints that name a command, and what the app says instead ('' drops a hint the app has no use for). */
const HINTS: readonly [RegExp, string][] = [
  [/ \(import it under another name with --as NAME\)/g, ''],
  [/\(bench import FILE --damper LABEL adds them\)/g, '(import a bench file for it on the Dampers screen)'],
  [/\(bench import FILE --damper LABEL\)/g, '(import a bench file on the Dampers screen)'],
  [/\(bench list --damper LABEL lists them\)/g, '(the Dampers screen lists them)'],
  [/ \(--damper LABEL\)/g, ': pick one under Damper'],
  [/ \(setup save FILE --vehicle "[^"]*"\)/g, ': save one on the Setup sheet'],
  [/: --vehicle NAME, or "vehicle" in the file/g, ''],
  [/ \(give --again to import it once more\)/g, ''],
  [/ \(or --force to replace it\)/g, ''],
  [/ \(--compression positive\|negative\)/g, ' (the compression sign)'],
  [/; name the columns, e\.g\. --velocity-column "[^"]*" --force-column "[^"]*"/g, '; pick the columns'],
];

/** Options that name a field, in the app's words. */
const OPTION_WORDS: Record<string, string> = {
  '--as': 'vehicle name',
  '--damper': 'damper',
  '--type': 'type',
  '--serial': 'serial number',
  '--bins': 'bins',
  '--smoothing': 'smoothing',
  '--vehicle': 'vehicle',
};

/** Parts of a field's path that only say where it sits in the file. */
const SKIPPED = new Set(['corners', 'corner', 'analysis', 'file']);

/** A field's path in words: `corners.FL.corner.cornerMass` → "FL corner mass". */
export function fieldWords(field: string): string {
  const option = OPTION_WORDS[field];
  if (option) return option;
  if (field.startsWith('--')) return field.slice(2).replace(/-/g, ' ');
  return field
    .split('.')
    .filter((p) => p !== '' && !SKIPPED.has(p))
    .map((p) => (/^[A-Z]{2}$/.test(p) ? p : p.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase()))
    .join(' ');
}

/**
 * A backend message as a screen shows it: command hints replaced by the app's words, and the
 * field it names (the part before ": ") in words rather than an option or a path.
 * @example messagePlain('--as: a vehicle named "X" is already in this database; nothing was imported (import it under another name with --as NAME)', '--as')
 * // 'vehicle name: a vehicle named "X" is already in this database; nothing was imported'
 */
export function messagePlain(message: string, field?: string): string {
  let out = message;
  for (const [pattern, words] of HINTS) out = out.replace(pattern, words);
  if (field && out.startsWith(`${field}: `)) {
    const words = fieldWords(field);
    out = words ? `${words.charAt(0).toUpperCase()}${words.slice(1)}: ${out.slice(field.length + 2)}` : out;
  }
  return out;
}
