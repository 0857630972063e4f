import { InputError } from '../../core/units/input-error';
import { apiCall } from '../api/call';
import type { ApiContext } from '../api/context';
import { UsageError } from './cli-io';

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

/**
 * The two revisions a diff or a comparison names on the command line: both given, or one,
 * which is then compared with its parent.
 * @throws UsageError when the one revision given is the first.
 */
export async function revisionPairOf(
  texts: readonly string[],
  vehicle: string | undefined,
  context: ApiContext,
): Promise<{ a: RevisionRefText; b: RevisionRefText }> {
  const a = revisionRefParse(texts[0] as string, 'a', vehicle);
  if (texts[1] !== undefined) return { a, b: revisionRefParse(texts[1], 'b', vehicle) };
  const shown = await apiCall('setupShow', { ...a }, context);
  if (shown.revision.parent === null)
    throw new UsageError(
      `${shown.vehicle.name}@${shown.revision.number} is the first revision; give a second one to compare with`,
    );
  return {
    a: { vehicle: a.vehicle, revision: shown.revision.parent },
    b: { vehicle: a.vehicle, revision: shown.revision.number },
  };
}
