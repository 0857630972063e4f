import type Database from 'better-sqlite3';
import { InputError } from '../core/units/input-error';
import { nameKey } from '../core/units/text-field';
import { damperUnitByKey, damperUnitById, damperUnitInsert, damperUnitList } from './queries/damper-unit';
import type { DamperUnitRow } from './rows';

/** A damper unit's own fields: type, serial number, notes. */
export type DamperUnitFields = { kind?: string; serial?: string; notes?: string };

/**
 * The damper unit with this label (compared as `nameKey` does), added to the library when
 * new. Fields given for a unit already there must agree with it: a second unit of the
 * same label but another serial is a mistake to report, not to merge.
 * @throws InputError naming the field that disagrees.
 */
export function damperUnitEnsure(
  db: Database.Database,
  label: string,
  fields: DamperUnitFields | undefined,
  at: string,
): { row: DamperUnitRow; created: boolean } {
  const key = nameKey(label);
  const existing = damperUnitByKey(db, key);
  if (existing) {
    for (const [field, flag] of [
      ['kind', '--type'],
      ['serial', '--serial'],
    ] as const) {
      const given = fields?.[field];
      if (given !== undefined && given !== '' && given !== existing[field])
        throw new InputError(
          flag,
          `damper "${existing.label}" is already in the library with ${field === 'kind' ? 'type' : field} "${existing[field]}", not "${given}"`,
        );
    }
    return { row: existing, created: false };
  }
  const id = damperUnitInsert(db, {
    label,
    label_key: key,
    kind: fields?.kind ?? '',
    serial: fields?.serial ?? '',
    notes: fields?.notes ?? '',
    created_at: at,
  });
  return { row: damperUnitById(db, id) as DamperUnitRow, created: true };
}

/**
 * The damper unit with this label (compared as `nameKey` does).
 * @throws InputError naming `field`, with the units there are.
 */
export function damperUnitResolve(db: Database.Database, label: string, field = 'damper'): DamperUnitRow {
  const found = damperUnitByKey(db, nameKey(label));
  if (found) return found;
  const all = damperUnitList(db);
  throw new InputError(
    field,
    `no damper unit labelled "${label}"; ${all.length ? `units: ${all.map((d) => `"${d.label}"`).join(', ')}` : 'the library is empty (bench import FILE --damper LABEL)'}`,
  );
}
