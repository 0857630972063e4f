import type { CornerInput } from '../core/corner/corner';
import { cornerInputParse, cornerInputToFile } from '../core/corner/corner-file';
import { InputError, inputFieldPath } from '../core/units/input-error';

/** Two stored numbers this close (relative) are one: the file form keeps 12 significant digits. */
const STORED_RELATIVE_TOLERANCE = 1e-9;

/**
 * Checks that `raw` holds nothing the corner input read back from it (`parsed`) lacks: no
 * unknown key at any depth, SI numbers where numbers belong, the same texts and list lengths.
 */
function storedShapeCheck(raw: unknown, parsed: unknown, field: string): void {
  if (typeof parsed === 'number') {
    if (typeof raw !== 'number' || !Number.isFinite(raw))
      throw new InputError(field, `got ${JSON.stringify(raw)}; expected a number in SI`);
    if (Math.abs(raw - parsed) > STORED_RELATIVE_TOLERANCE * Math.max(Math.abs(raw), Math.abs(parsed)))
      throw new InputError(field, `${raw} does not read back as itself`);
    return;
  }
  if (Array.isArray(parsed)) {
    if (!Array.isArray(raw) || raw.length !== parsed.length)
      throw new InputError(field, `expected a list of ${parsed.length}`);
    parsed.forEach((p, i) => storedShapeCheck(raw[i], p, inputFieldPath(field, i)));
    return;
  }
  if (parsed !== null && typeof parsed === 'object') {
    if (raw === null || typeof raw !== 'object' || Array.isArray(raw))
      throw new InputError(field, 'expected an object');
    const p = parsed as Record<string, unknown>;
    for (const [key, value] of Object.entries(raw as Record<string, unknown>)) {
      if (!Object.hasOwn(p, key))
        throw new InputError(inputFieldPath(field, key), 'is not a known field here');
      storedShapeCheck(value, p[key], inputFieldPath(field, key));
    }
    return;
  }
  if (raw !== parsed)
    throw new InputError(field, `got ${JSON.stringify(raw)}; expected ${JSON.stringify(parsed)}`);
}

/**
 * Checks a corner input held as SI JSON (a bundle's or the database's) the way a corner
 * file is checked — by writing it in file form and reading it back — and that it holds
 * nothing more than what was read back (no unknown key, every number an SI number), then
 * returns it as given, so that its numbers stay bit for bit.
 * @throws InputError naming the field (under `field`) that is not part of a valid corner input.
 */
export function cornerStoredCheck(raw: unknown, field: string): CornerInput {
  let parsed: CornerInput;
  try {
    parsed = cornerInputParse(cornerInputToFile(raw as CornerInput), field);
  } catch (e) {
    if (e instanceof InputError) throw e;
    throw new InputError(field, 'is not a corner input (expected cornerMass, springRate, damper, … in SI)');
  }
  storedShapeCheck(raw, parsed, field);
  return raw as CornerInput;
}
