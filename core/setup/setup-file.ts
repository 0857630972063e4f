import { calendarDateParse } from '../units/calendar-date';
import { CLICK_ADJUSTERS, clickSettingsParse, type ClickSettings } from '../damper/click-settings';
import { cornerInputParse, cornerInputToFile, objectParse } from '../corner/corner-file';
import { InputError, inputFieldPath } from '../units/input-error';
import { CORNER_POSITIONS, type SetupCorner, type SetupSheet, type Toe } from './setup-sheet';
import { nameFieldParse, NOTES_MAX_LENGTH, textFieldParse } from '../units/text-field';
import { PLAUSIBLE_RANGES, plausibleCheck } from '../corner/plausible-range';
import { quantityParse, quantityText, type UnitSystem } from '../units/units';

/** The `format` tag of our setup file. */
export const SETUP_FILE_FORMAT = 'rideledger-setup';
/** The setup file version this program writes and the newest it reads. */
export const SETUP_FILE_VERSION = 1;

/**
 * A setup file: one sheet, and where it belongs — the vehicle, and the revision it was
 * shown from (a save of the edited file becomes that revision's child).
 */
export type SetupFile = { vehicle?: string; basedOnRevision?: number; sheet: SetupSheet };

const TOP_KEYS = [
  'format',
  'version',
  'vehicle',
  'basedOnRevision',
  'name',
  'event',
  'track',
  'driver',
  'date',
  'fuelLoad',
  'antiRollBar',
  'notes',
  'corners',
] as const;

const CORNER_SHEET_KEYS = [
  'corner',
  'damperUnit',
  'clicks',
  'springLabel',
  'rideHeight',
  'tirePressureCold',
  'camber',
  'toe',
  'notes',
] as const;

type SheetQuantity = 'rideHeight' | 'tirePressureCold' | 'camber' | 'fuelLoad';

/**
 * A sheet quantity inside its plausible range (PLAUSIBLE_RANGES): wide, so that its job is to
 * catch a value typed without its unit (a bare number is SI: "95" ride height is 95 m, "1.6"
 * pressure is 1.6 Pa, "-2.5" camber is −2.5 rad).
 */
function plausibleQuantity(raw: unknown, key: SheetQuantity, field: string): number {
  return plausibleCheck(quantityParse(raw, PLAUSIBLE_RANGES[key].kind, field), key, field);
}

const TOE_EXPECTED = 'expected a toe with its unit: an angle ("0.1 deg") or a length at the rim ("1 mm")';

function toeParse(raw: unknown, field: string): Toe {
  // A bare number would be radians or metres — neither is how toe is written, so the unit is required.
  if (typeof raw !== 'string' || /^\s*[+-]?[\d.]+([eE][+-]?\d+)?\s*$/.test(raw))
    throw new InputError(field, `got ${JSON.stringify(raw)}; ${TOE_EXPECTED}`);
  for (const kind of ['angle', 'length'] as const) {
    let value: number;
    try {
      value = quantityParse(raw, kind, field);
    } catch {
      continue;
    }
    return { kind, value: plausibleCheck(value, kind === 'angle' ? 'toeAngle' : 'toeLength', field) };
  }
  throw new InputError(field, `could not read "${raw}"; ${TOE_EXPECTED}`);
}

function setupCornerParse(raw: unknown, field: string): SetupCorner {
  const o = objectParse(raw, field, CORNER_SHEET_KEYS);
  const at = (k: string) => inputFieldPath(field, k);
  if (o.corner === undefined) throw new InputError(at('corner'), 'is missing (the corner file fields)');
  const corner: SetupCorner = {
    analysis: cornerInputParse(o.corner, at('corner')),
    damperUnit:
      o.damperUnit === undefined ? '' : nameFieldParse(o.damperUnit, at('damperUnit'), 'a damper label'),
    clicks: clickSettingsParse(o.clicks, at('clicks')),
    springLabel: textFieldParse(o.springLabel, at('springLabel')),
    notes: textFieldParse(o.notes, at('notes'), { maxLength: NOTES_MAX_LENGTH, multiline: true }),
  };
  if (o.rideHeight !== undefined)
    corner.rideHeight = plausibleQuantity(o.rideHeight, 'rideHeight', at('rideHeight'));
  if (o.tirePressureCold !== undefined)
    corner.tirePressureCold = plausibleQuantity(
      o.tirePressureCold,
      'tirePressureCold',
      at('tirePressureCold'),
    );
  if (o.camber !== undefined) corner.camber = plausibleQuantity(o.camber, 'camber', at('camber'));
  if (o.toe !== undefined) corner.toe = toeParse(o.toe, at('toe'));
  return corner;
}

/**
 * Reads a setup file (our format "rideledger-setup", version 1): the vehicle-level fields
 * and all four corners, each a corner file's "corner" object plus the sheet fields.
 * Quantities are SI numbers or strings with units, as in the corner file.
 * @throws InputError naming the field.
 */
export function setupFileParse(raw: unknown): SetupFile {
  const o = objectParse(raw, '', TOP_KEYS);
  if (o.format !== SETUP_FILE_FORMAT)
    throw new InputError(
      'format',
      o.format === undefined
        ? `is missing; a setup file starts {"format": "${SETUP_FILE_FORMAT}", "version": ${SETUP_FILE_VERSION}, …}`
        : `got ${JSON.stringify(o.format)}; expected "${SETUP_FILE_FORMAT}"`,
    );
  if (typeof o.version !== 'number' || !Number.isInteger(o.version) || o.version < 1)
    throw new InputError('version', `got ${JSON.stringify(o.version)}; expected ${SETUP_FILE_VERSION}`);
  if (o.version > SETUP_FILE_VERSION)
    throw new InputError(
      'version',
      `this is setup file version ${o.version}; this program reads version ${SETUP_FILE_VERSION} — update RideLedger`,
    );
  const bar = objectParse(o.antiRollBar ?? {}, 'antiRollBar', ['front', 'rear']);
  const corners = objectParse(o.corners, 'corners', CORNER_POSITIONS);
  const sheet: SetupSheet = {
    name: nameFieldParse(o.name, 'name', 'a name for this setup, e.g. "Baseline"'),
    event: textFieldParse(o.event, 'event'),
    track: textFieldParse(o.track, 'track'),
    driver: textFieldParse(o.driver, 'driver'),
    antiRollBar: {
      front: textFieldParse(bar.front, 'antiRollBar.front'),
      rear: textFieldParse(bar.rear, 'antiRollBar.rear'),
    },
    notes: textFieldParse(o.notes, 'notes', { maxLength: NOTES_MAX_LENGTH, multiline: true }),
    corners: {} as SetupSheet['corners'],
  };
  if (o.date !== undefined) sheet.date = calendarDateParse(o.date, 'date');
  if (o.fuelLoad !== undefined) sheet.fuelLoad = plausibleQuantity(o.fuelLoad, 'fuelLoad', 'fuelLoad');
  for (const p of CORNER_POSITIONS) {
    if (corners[p] === undefined)
      throw new InputError(`corners.${p}`, 'is missing; a setup has all four corners (FL, FR, RL, RR)');
    sheet.corners[p] = setupCornerParse(corners[p], `corners.${p}`);
  }
  const file: SetupFile = { sheet };
  if (o.vehicle !== undefined) file.vehicle = nameFieldParse(o.vehicle, 'vehicle', 'a vehicle name');
  if (o.basedOnRevision !== undefined) {
    const n = o.basedOnRevision;
    if (typeof n !== 'number' || !Number.isInteger(n) || n < 1)
      throw new InputError(
        'basedOnRevision',
        `got ${JSON.stringify(n)}; expected a revision number (1, 2, …)`,
      );
    file.basedOnRevision = n;
  }
  return file;
}

function clicksToFile(clicks: ClickSettings): Record<string, number> {
  const out: Record<string, number> = {};
  for (const a of CLICK_ADJUSTERS) if (clicks[a] !== undefined) out[a] = clicks[a];
  return out;
}

/** The sheet fields of one corner in file form (everything but the analysis input), in `system`. */
export function setupCornerSheetToFile(c: SetupCorner, system: UnitSystem = 'si'): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  if (c.damperUnit !== '') out.damperUnit = c.damperUnit;
  if (Object.keys(c.clicks).length > 0) out.clicks = clicksToFile(c.clicks);
  if (c.springLabel !== '') out.springLabel = c.springLabel;
  if (c.rideHeight !== undefined) out.rideHeight = quantityText(c.rideHeight, 'length', system);
  if (c.tirePressureCold !== undefined)
    out.tirePressureCold = quantityText(c.tirePressureCold, 'pressure', system);
  if (c.camber !== undefined) out.camber = quantityText(c.camber, 'angle', system);
  if (c.toe !== undefined) out.toe = quantityText(c.toe.value, c.toe.kind, system);
  if (c.notes !== '') out.notes = c.notes;
  return out;
}

/** The file form of one corner of a sheet: `corner` as in a corner file, then the sheet fields. */
export function setupCornerToFile(c: SetupCorner, system: UnitSystem = 'si'): Record<string, unknown> {
  return { corner: cornerInputToFile(c.analysis, system), ...setupCornerSheetToFile(c, system) };
}

/** The vehicle-level fields of a sheet in file form (no format tag, no corners), in `system`. */
export function setupSheetTopToFile(s: SetupSheet, system: UnitSystem = 'si'): Record<string, unknown> {
  const out: Record<string, unknown> = { name: s.name };
  for (const key of ['event', 'track', 'driver'] as const) if (s[key] !== '') out[key] = s[key];
  if (s.date !== undefined) out.date = s.date;
  if (s.fuelLoad !== undefined) out.fuelLoad = quantityText(s.fuelLoad, 'mass', system);
  const bar: Record<string, string> = {};
  if (s.antiRollBar.front !== '') bar.front = s.antiRollBar.front;
  if (s.antiRollBar.rear !== '') bar.rear = s.antiRollBar.rear;
  if (Object.keys(bar).length > 0) out.antiRollBar = bar;
  if (s.notes !== '') out.notes = s.notes;
  return out;
}

/**
 * The file form of a setup (readable by `setupFileParse`): quantities as unit strings in
 * `system`, empty texts left out.
 */
export function setupFileWrite(file: SetupFile, system: UnitSystem = 'si'): Record<string, unknown> {
  const out: Record<string, unknown> = { format: SETUP_FILE_FORMAT, version: SETUP_FILE_VERSION };
  if (file.vehicle !== undefined) out.vehicle = file.vehicle;
  if (file.basedOnRevision !== undefined) out.basedOnRevision = file.basedOnRevision;
  Object.assign(out, setupSheetTopToFile(file.sheet, system));
  const corners: Record<string, unknown> = {};
  for (const p of CORNER_POSITIONS) corners[p] = setupCornerToFile(file.sheet.corners[p], system);
  out.corners = corners;
  return out;
}
