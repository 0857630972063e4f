import { ApiCallError } from '../../api-client';
import type { setupFormToFile } from '../../setup-form';

/**
 * Saves, and where the store refuses a damper unit the library lacks (a typo must not become a
 * new unit), asks whether it is a new unit and saves again naming it; null when the user says no.
 */
export async function sheetSaveConfirmingNewDampers<T>(
  file: ReturnType<typeof setupFormToFile>,
  saveWith: (newDamperUnits: string[]) => Promise<T>,
): Promise<T | null> {
  const declared: string[] = [];
  for (;;) {
    try {
      return await saveWith(declared);
    } catch (e) {
      const m = e instanceof ApiCallError ? /corners\.(FL|FR|RL|RR)\.damperUnit$/.exec(e.field ?? '') : null;
      const label = m
        ? (file.corners as Record<string, { damperUnit?: unknown }>)[m[1] as string]?.damperUnit
        : undefined;
      if (typeof label !== 'string' || declared.includes(label) || declared.length >= 4) throw e;
      const ok = window.confirm(
        `The damper unit "${label}" is not in the library. Save it as a new damper unit? (Cancel to check its spelling.)`,
      );
      if (!ok) return null;
      declared.push(label);
    }
  }
}
