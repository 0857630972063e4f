import { InputError } from '../../core/input-error';

/** A revision as a command line names it: `VEHICLE@N`, or `VEHICLE` for the newest. */
export type RevisionRefText = { vehicle: string; revision?: number };

/**
 * Reads `Coupe@3`, `Coupe` (the newest revision) or, with a vehicle given separately, `3`.
 * "@" never appears in a vehicle name, so the last one separates the number.
 * @throws InputError naming `field`.
 */
export function revisionRefParse(text: string, field: string, vehicle?: string): RevisionRefText {
  const at = text.lastIndexOf('@');
  if (at < 0) {
    if (vehicle !== undefined && /^\d+$/.test(text.trim())) return { vehicle, revision: Number(text.trim()) };
    return { vehicle: text };
  }
  const name = text.slice(0, at).trim();
  const number = text.slice(at + 1).trim();
  if (name === '' && vehicle === undefined)
    throw new InputError(field, `"${text}" names no vehicle; write VEHICLE@N, e.g. "Coupe@3"`);
  if (number === 'latest' || number === '') return { vehicle: name || (vehicle as string) };
  if (!/^\d+$/.test(number) || Number(number) < 1)
    throw new InputError(field, `"${number}" after "@" is not a revision number (1, 2, …)`);
  return { vehicle: name || (vehicle as string), revision: Number(number) };
}
