/**
 * The checks an imported bundle goes through before anything is stored: every record read by
 * the rules of `setup save` and `bench import` (text, clicks, dates, quantities), revision
 * numbers 1..N with earlier parents, no unknown keys, fits and summaries recomputed. `check`
 * runs the same rules over the stored records.
 */

import { timestampParse } from '../core/units/calendar-date';
import { cornerInputToFile, objectParse } from '../core/corner/corner-file';
import { InputError, inputFieldPath } from '../core/units/input-error';
import { setupDiff, setupDiffSummary } from '../core/setup/setup-diff';
import { SETUP_FILE_FORMAT, SETUP_FILE_VERSION, setupFileParse } from '../core/setup/setup-file';
import { CORNER_POSITIONS, type CornerPosition, type SetupSheet } from '../core/setup/setup-sheet';
import { nameFieldParse, nameKey, NOTES_MAX_LENGTH, textFieldParse } from '../core/units/text-field';
import { quantityText } from '../core/units/units';
import { cornerStoredCheck } from './corner-stored';
import { rideScenarioParse, type RideScenario } from '../core/valving/ride-scenario';
import { BUNDLE_FORMAT, BUNDLE_VERSION } from './bundle-format';
import { bundleDamperChecked, listParse, type CheckedDamper } from './bundle-check-bench';

const BUNDLE_KEYS = ['format', 'version', 'vehicle', 'revisions', 'dampers', 'scenario'] as const;
const VEHICLE_KEYS = ['name', 'kind', 'notes', 'createdAt'] as const;
const REVISION_KEYS = [
  'number',
  'parent',
  'name',
  'event',
  'track',
  'driver',
  'date',
  'fuelLoad',
  'antiRollBar',
  'notes',
  'summary',
  'savedAt',
  'corners',
] as const;
const CORNER_KEYS = [
  'analysis',
  'damperUnit',
  'clicks',
  'springLabel',
  'rideHeight',
  'tirePressureCold',
  'camber',
  'toe',
  'notes',
] as const;
/** The summary of a revision without a parent, as `setupSave` writes it. */
export const FIRST_SETUP_SUMMARY = 'first setup';

/** A revision of a bundle, checked as a setup file is: its sheet (SI), number, parent and time saved. */
export type CheckedRevision = {
  number: number;
  parent: number | null;
  sheet: SetupSheet;
  summary: string;
  savedAt: string;
};

export type CheckedBundle = {
  vehicle: { name: string; kind: string; notes: string; createdAt: string };
  revisions: CheckedRevision[];
  dampers: CheckedDamper[];
  /** The vehicle's scenario (SI), checked by the scenario's own rules, when the bundle has one. */
  scenario: RideScenario | undefined;
};

/**
 * The line of what changed from `parent` to `sheet`, recomputed as `setupSave` writes it:
 * in SI, or in US units when that is how the given line was written (the units it was
 * entered in); never the given text itself.
 */
export function setupRevisionSummary(parent: SetupSheet | undefined, sheet: SetupSheet, given = ''): string {
  if (!parent) return FIRST_SETUP_SUMMARY;
  const si = setupDiffSummary(setupDiff(parent, sheet, 'si'));
  if (given === si) return si;
  const us = setupDiffSummary(setupDiff(parent, sheet, 'us'));
  return given === us ? us : si;
}

/** A setup file's field path as a bundle revision's: the corner input is `analysis` there. */
function bundleFieldOfSetupField(field: string): string {
  return field.replace(/^corners\.(FL|FR|RL|RR)\.corner(?=\.|$)/, 'corners.$1.analysis');
}

/**
 * One revision of a bundle, read through `setupFileParse` — the validation `setup save`
 * runs — so that texts, lengths, clicks, dates and quantities meet the same rules; the
 * corner inputs and toe keep their SI numbers bit for bit.
 */
export function bundleRevisionChecked(raw: unknown, at: string, count: number): CheckedRevision {
  const r = objectParse(raw, at, REVISION_KEYS);
  const f = (k: string) => inputFieldPath(at, k);
  const number = r.number;
  if (typeof number !== 'number' || !Number.isInteger(number) || number < 1 || number > count)
    throw new InputError(
      f('number'),
      `got ${JSON.stringify(number)}; the bundle's ${count} revision${count === 1 ? ' is' : 's are'} numbered 1 to ${count}, as a vehicle's revisions are`,
    );
  const parent = r.parent ?? null;
  if (
    parent !== null &&
    !(typeof parent === 'number' && Number.isInteger(parent) && parent >= 1 && parent < number)
  )
    throw new InputError(
      f('parent'),
      `revision ${number}'s parent ${JSON.stringify(parent)} is not an earlier revision in the bundle`,
    );
  const savedAt = timestampParse(r.savedAt, f('savedAt'));
  if (typeof r.summary !== 'string') throw new InputError(f('summary'), 'expected a text');
  const corners = objectParse(r.corners, f('corners'), CORNER_POSITIONS);
  const analyses = {} as Record<CornerPosition, SetupSheet['corners'][CornerPosition]['analysis']>;
  const toes = {} as Record<CornerPosition, { kind: 'angle' | 'length'; value: number } | undefined>;
  const fileCorners: Record<string, unknown> = {};
  for (const p of CORNER_POSITIONS) {
    const cAt = f(`corners.${p}`);
    if (corners[p] === undefined)
      throw new InputError(cAt, 'is missing; a setup has all four corners (FL, FR, RL, RR)');
    const c = objectParse(corners[p], cAt, CORNER_KEYS);
    analyses[p] = cornerStoredCheck(c.analysis, inputFieldPath(cAt, 'analysis'));
    const fileCorner: Record<string, unknown> = {
      corner: cornerInputToFile(analyses[p], 'si'),
      clicks: c.clicks,
      springLabel: c.springLabel,
      notes: c.notes,
    };
    for (const key of ['damperUnit', 'rideHeight', 'tirePressureCold', 'camber'] as const)
      if (c[key] !== null && c[key] !== undefined) fileCorner[key] = c[key];
    if (c.toe !== null && c.toe !== undefined) {
      const toeAt = inputFieldPath(cAt, 'toe');
      const t = objectParse(c.toe, toeAt, ['kind', 'value']);
      if (t.kind !== 'angle' && t.kind !== 'length')
        throw new InputError(
          inputFieldPath(toeAt, 'kind'),
          `got ${JSON.stringify(t.kind)}; expected "angle" or "length"`,
        );
      if (typeof t.value !== 'number' || !Number.isFinite(t.value))
        throw new InputError(
          inputFieldPath(toeAt, 'value'),
          `got ${JSON.stringify(t.value)}; expected a number in SI`,
        );
      toes[p] = { kind: t.kind, value: t.value };
      // The file form writes toe with its unit; the range is checked there, the number kept exact.
      fileCorner.toe = quantityText(t.value, t.kind, 'si');
    }
    fileCorners[p] = fileCorner;
  }
  const file: Record<string, unknown> = {
    format: SETUP_FILE_FORMAT,
    version: SETUP_FILE_VERSION,
    name: r.name,
    event: r.event,
    track: r.track,
    driver: r.driver,
    antiRollBar: r.antiRollBar,
    notes: r.notes,
    corners: fileCorners,
  };
  if (r.date !== null && r.date !== undefined) file.date = r.date;
  if (r.fuelLoad !== null && r.fuelLoad !== undefined) file.fuelLoad = r.fuelLoad;
  let sheet: SetupSheet;
  try {
    sheet = setupFileParse(file).sheet;
  } catch (e) {
    if (e instanceof InputError) throw new InputError(f(bundleFieldOfSetupField(e.field)), e.problem);
    throw e;
  }
  for (const p of CORNER_POSITIONS) {
    sheet.corners[p].analysis = analyses[p];
    const toe = toes[p];
    if (toe) sheet.corners[p].toe = toe;
  }
  return { number, parent: parent as number | null, sheet, summary: r.summary, savedAt };
}

/** A bundle's vehicle record, checked as `vehicle add` checks one (and its time of creation). */
export function bundleVehicleChecked(raw: unknown, at: string): CheckedBundle['vehicle'] {
  const v = objectParse(raw, at, VEHICLE_KEYS);
  const f = (k: string) => inputFieldPath(at, k);
  return {
    name: nameFieldParse(v.name, f('name'), 'a vehicle name'),
    kind: textFieldParse(v.kind, f('kind')),
    notes: textFieldParse(v.notes, f('notes'), { maxLength: NOTES_MAX_LENGTH, multiline: true }),
    createdAt: timestampParse(v.createdAt, f('createdAt')),
  };
}

/**
 * A whole bundle checked record by record, by the rules of `setup save` (revisions) and
 * `bench import` (dampers and runs): strict keys everywhere, clean texts within their
 * lengths, clicks within the adjusters' range, real dates and times, revisions numbered
 * 1 to N once each with earlier parents, no run listed twice, fits recomputed from the
 * points and summaries from the sheets.
 * @throws InputError naming the record and field.
 */
/** A carried scenario, checked by the scenario's own rules (the road's class under `roadClass`, SI). */
function bundleScenarioChecked(raw: unknown): RideScenario {
  const o = objectParse(raw, 'scenario', ['road', 'bump', 'curb']);
  const road = objectParse(o.road, 'scenario.road', ['roadClass', 'speed']);
  return rideScenarioParse({
    road: { class: road.roadClass, speed: road.speed },
    bump: o.bump,
    curb: o.curb,
  });
}

export function bundleChecked(raw: unknown): CheckedBundle {
  const o = objectParse(raw, '', BUNDLE_KEYS);
  if (o.format !== BUNDLE_FORMAT)
    throw new InputError('format', `got ${JSON.stringify(o.format)}; expected "${BUNDLE_FORMAT}"`);
  if (o.version !== BUNDLE_VERSION)
    throw new InputError(
      'version',
      `got ${JSON.stringify(o.version)}; this program reads bundle version ${BUNDLE_VERSION}`,
    );
  const vehicle = bundleVehicleChecked(o.vehicle, 'vehicle');
  const rawRevisions = listParse(o.revisions, 'revisions');
  const byNumber = new Map<number, number>();
  const revisions = rawRevisions.map((r, i) => {
    const at = `revisions[${i}]`;
    const checked = bundleRevisionChecked(r, at, rawRevisions.length);
    if (byNumber.has(checked.number))
      throw new InputError(`${at}.number`, `revision ${checked.number} appears twice`);
    byNumber.set(checked.number, i);
    return checked;
  });
  const dampers = listParse(o.dampers, 'dampers').map((d, i) => bundleDamperChecked(d, `dampers[${i}]`));
  const labels = new Map<string, number>();
  dampers.forEach((d, i) => {
    const earlier = labels.get(nameKey(d.label));
    if (earlier !== undefined)
      throw new InputError(`dampers[${i}].label`, `"${d.label}" is also dampers[${earlier}]'s label`);
    labels.set(nameKey(d.label), i);
  });
  revisions.forEach((r, i) => {
    for (const p of CORNER_POSITIONS) {
      const label = r.sheet.corners[p].damperUnit;
      if (label !== '' && !labels.has(nameKey(label)))
        throw new InputError(
          `revisions[${i}].corners.${p}.damperUnit`,
          `"${label}" is not among the bundle's dampers`,
        );
    }
  });
  // Each summary is recomputed from the revision's parent, never taken from the file.
  revisions.sort((a, b) => a.number - b.number);
  for (const r of revisions) {
    const parent = r.parent === null ? undefined : (revisions[r.parent - 1] as CheckedRevision).sheet;
    r.summary = setupRevisionSummary(parent, r.sheet, r.summary);
  }
  const scenario = o.scenario === undefined ? undefined : bundleScenarioChecked(o.scenario);
  return { vehicle, revisions, dampers, scenario };
}
