import type { CornerInput } from '../core/corner/corner';
import { cornerInputParse, cornerInputToFile } from '../core/corner/corner-file';
import { InputError } from '../core/units/input-error';

/**
 * Checks a corner input held as SI JSON (a bundle's or the database's) the way a corner
 * file is checked — by writing it in file form and reading it back — and returns it as
 * given, so that its numbers stay bit for bit.
 * @throws InputError naming `field` when it is not a valid corner input.
 */
export function cornerStoredCheck(raw: unknown, field: string): CornerInput {
  try {
    cornerInputParse(cornerInputToFile(raw as CornerInput), field);
  } catch (e) {
    if (e instanceof InputError) throw e;
    throw new InputError(field, 'is not a corner input (expected cornerMass, springRate, damper, … in SI)');
  }
  return raw as CornerInput;
}
