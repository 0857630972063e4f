import type { CornerInput } from '../../core/corner/corner';
import { cornerInputParse } from '../../core/corner/corner-file';
import { InputError } from '../../core/units/input-error';
import { SETUP_FILE_FORMAT, SETUP_FILE_VERSION, setupFileParse } from '../../core/setup/setup-file';
import { CORNER_POSITIONS, type CornerPosition } from '../../core/setup/setup-sheet';
import {
  quantityParse,
  numberShopFormat,
  quantityToDisplay,
  quantityUnitLabel,
  quantityUnitText,
  type QuantityKind,
  type UnitSystem,
} from '../../core/units/units';

/**
 * The setup editor's model: the setup file's tree (our format) with every editable leaf held
 * as the text the user sees — a number in the unit system's display unit, or a number with a
 * unit they typed themselves ("400 lbf/in"). Fields the editor does not show (a tabulated
 * damper curve, travel limits) ride along untouched.
 */
export type SetupForm = {
  /** The file as loaded, for everything the editor has no field for. */
  base: Record<string, unknown>;
  /** Text of each shown field, by its path in the file (`corners.FL.corner.springRate`). */
  values: Record<string, string>;
  /**
   * The exact SI value behind a text the program wrote (a loaded or converted quantity shown
   * to 6 digits): while the text is unchanged, the exact value is what is saved, so switching
   * units back and forth never drifts a value.
   */
  exact: Record<string, { text: string; si: number }>;
  system: UnitSystem;
};

/** What a field holds: a quantity kind, a plain ratio, clicks, free text, a date, or toe (angle or length). */
export type FieldKind = QuantityKind | 'ratio' | 'clicks' | 'text' | 'notes' | 'date' | 'toe';

export type FieldSpec = { key: string; label: string; kind: FieldKind; required?: boolean };

/** Vehicle-level fields, in the order the sheet shows them. */
export const TOP_FIELDS: readonly FieldSpec[] = [
  { key: 'name', label: 'Setup name', kind: 'text', required: true },
  { key: 'event', label: 'Event', kind: 'text' },
  { key: 'track', label: 'Track', kind: 'text' },
  { key: 'driver', label: 'Driver', kind: 'text' },
  { key: 'date', label: 'Date', kind: 'date' },
  { key: 'fuelLoad', label: 'Fuel load', kind: 'mass' },
  { key: 'antiRollBar.front', label: 'Front anti-roll bar', kind: 'text' },
  { key: 'antiRollBar.rear', label: 'Rear anti-roll bar', kind: 'text' },
  { key: 'notes', label: 'Notes', kind: 'notes' },
];

/** Fields of one corner, relative to `corners.<P>.`. Damper slopes appear only for non-tabulated directions. */
export const CORNER_FIELDS: readonly FieldSpec[] = [
  { key: 'corner.cornerMass', label: 'Corner mass', kind: 'mass', required: true },
  { key: 'corner.unsprungMass', label: 'Unsprung mass', kind: 'mass', required: true },
  { key: 'corner.springRate', label: 'Spring rate', kind: 'stiffness', required: true },
  { key: 'corner.springMotionRatio', label: 'Spring motion ratio', kind: 'ratio', required: true },
  { key: 'corner.damperMotionRatio', label: 'Damper motion ratio', kind: 'ratio' },
  { key: 'corner.tireRate', label: 'Tyre rate', kind: 'stiffness', required: true },
  { key: 'corner.tireDamping', label: 'Tyre damping', kind: 'damping' },
  { key: 'corner.damper.bump.lowSpeed', label: 'Bump, low speed', kind: 'damping', required: true },
  { key: 'corner.damper.bump.kneeSpeed', label: 'Bump knee', kind: 'velocity' },
  { key: 'corner.damper.bump.highSpeed', label: 'Bump, high speed', kind: 'damping' },
  { key: 'corner.damper.rebound.lowSpeed', label: 'Rebound, low speed', kind: 'damping', required: true },
  { key: 'corner.damper.rebound.kneeSpeed', label: 'Rebound knee', kind: 'velocity' },
  { key: 'corner.damper.rebound.highSpeed', label: 'Rebound, high speed', kind: 'damping' },
  { key: 'corner.bumpStop.gap', label: 'Bump-stop gap', kind: 'length' },
  { key: 'corner.bumpStop.rate', label: 'Bump-stop rate', kind: 'stiffness' },
  { key: 'damperUnit', label: 'Damper unit', kind: 'text' },
  { key: 'clicks.bump', label: 'Bump clicks', kind: 'clicks' },
  { key: 'clicks.rebound', label: 'Rebound clicks', kind: 'clicks' },
  { key: 'springLabel', label: 'Spring', kind: 'text' },
  { key: 'rideHeight', label: 'Ride height', kind: 'length' },
  { key: 'tirePressureCold', label: 'Cold pressure', kind: 'pressure' },
  { key: 'camber', label: 'Camber', kind: 'angle' },
  { key: 'toe', label: 'Toe, toe-in positive', kind: 'toe' },
  { key: 'notes', label: 'Notes', kind: 'notes' },
];

const QUANTITY_KINDS: ReadonlySet<string> = new Set<QuantityKind>([
  'mass',
  'length',
  'stiffness',
  'damping',
  'velocity',
  'speed',
  'force',
  'pressure',
  'angle',
  'time',
]);

const isQuantity = (k: FieldKind): k is QuantityKind => QUANTITY_KINDS.has(k);

/** The unit shown beside a field, in `system`. */
export function fieldUnitLabel(kind: FieldKind, system: UnitSystem): string {
  if (isQuantity(kind)) return quantityUnitLabel(kind, system);
  if (kind === 'toe') return system === 'si' ? 'mm or °' : 'in or °';
  if (kind === 'clicks') return 'clicks';
  return '';
}

function getPath(o: unknown, path: string): unknown {
  let cur = o;
  for (const k of path.split('.')) {
    if (cur === null || typeof cur !== 'object') return undefined;
    cur = (cur as Record<string, unknown>)[k];
  }
  return cur;
}

function setPath(o: Record<string, unknown>, path: string, value: unknown): void {
  const keys = path.split('.');
  let cur = o;
  for (const k of keys.slice(0, -1)) {
    const next = cur[k];
    if (next === null || typeof next !== 'object' || Array.isArray(next)) cur[k] = {};
    cur = cur[k] as Record<string, unknown>;
  }
  const last = keys[keys.length - 1] as string;
  if (value === undefined) delete cur[last];
  else cur[last] = value;
}

/** True when a damper direction of the loaded file is a bench table: its slopes are not editable here. */
export function damperDirectionTabulated(
  form: SetupForm,
  p: CornerPosition,
  dir: 'bump' | 'rebound',
): boolean {
  return getPath(form.base, `corners.${p}.corner.damper.${dir}.points`) !== undefined;
}

/** Every shown field with its full path and spec. */
export function formFields(form: SetupForm): { path: string; spec: FieldSpec; position?: CornerPosition }[] {
  const out: { path: string; spec: FieldSpec; position?: CornerPosition }[] = TOP_FIELDS.map((spec) => ({
    path: spec.key,
    spec,
  }));
  for (const p of CORNER_POSITIONS) {
    for (const spec of CORNER_FIELDS) {
      const dir = /^corner\.damper\.(bump|rebound)\./.exec(spec.key)?.[1] as 'bump' | 'rebound' | undefined;
      if (dir && damperDirectionTabulated(form, p, dir)) continue;
      out.push({ path: `corners.${p}.${spec.key}`, spec, position: p });
    }
  }
  return out;
}

const NUMBER_ONLY = /^\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*$/;

/** Text shown for a file value: a quantity in the system's display unit (number only), anything else as it is. */
function displayText(
  raw: unknown,
  kind: FieldKind,
  system: UnitSystem,
  field: string,
): { text: string; si?: number } {
  if (raw === undefined || raw === null) return { text: '' };
  if (isQuantity(kind)) {
    try {
      const si = quantityParse(raw, kind, field);
      const shown = quantityToDisplay(si, kind, system);
      // A value entered in the unit shown reads as entered; one converted (a number from the
      // file, SI, shown in US units, or a quantity entered in another unit) reads as a shop
      // writes it, with its exact value kept behind the text.
      const entered = typeof raw === 'string' ? Number.parseFloat(raw) : system === 'si' ? shown : Number.NaN;
      const text = String(Number(shown.toPrecision(6)));
      return { text: Number(text) === Number(entered.toPrecision(6)) ? text : numberShopFormat(shown), si };
    } catch {
      return { text: String(raw) };
    }
  }
  return { text: String(raw) };
}

/** The value a field's text stands for in the file: "80" in N/mm becomes "80 N/mm"; typed units are kept. */
function fileValue(form: SetupForm, path: string, kind: FieldKind): unknown {
  const text = form.values[path] ?? '';
  const exact = form.exact[path];
  if (exact && exact.text === text) return exact.si;
  const system = form.system;
  const t = text.trim();
  if (t === '') return undefined;
  if (isQuantity(kind)) return NUMBER_ONLY.test(t) ? `${t} ${quantityUnitText(kind, system)}` : t;
  if (kind === 'ratio') return NUMBER_ONLY.test(t) ? Number(t) : t;
  if (kind === 'clicks') return NUMBER_ONLY.test(t) ? Number(t) : t;
  if (kind === 'toe' && NUMBER_ONLY.test(t)) return `${t} ${system === 'si' ? 'mm' : 'in'}`;
  return text;
}

/** A form from a setup file's content (our format), shown in `system`. */
export function setupFormFromFile(file: Record<string, unknown>, system: UnitSystem): SetupForm {
  const form: SetupForm = { base: structuredClone(file), values: {}, exact: {}, system };
  for (const { path, spec } of formFields(form)) {
    const shown = displayText(getPath(file, path), spec.kind, system, path);
    form.values[path] = shown.text;
    if (shown.si !== undefined) form.exact[path] = { text: shown.text, si: shown.si };
  }
  return form;
}

/** An empty sheet for a new setup: four corners to fill in. */
export function setupFormBlank(system: UnitSystem, name = ''): SetupForm {
  const corners: Record<string, unknown> = {};
  for (const p of CORNER_POSITIONS) corners[p] = { corner: { damper: { bump: {}, rebound: {} } } };
  return setupFormFromFile({ format: SETUP_FILE_FORMAT, version: SETUP_FILE_VERSION, name, corners }, system);
}

/** The setup file the form stands for (our format); empty fields are left out. */
export function setupFormToFile(form: SetupForm): Record<string, unknown> {
  const out = structuredClone(form.base);
  for (const { path, spec } of formFields(form)) setPath(out, path, fileValue(form, path, spec.kind));
  // A bump stop or a bilinear knee left wholly empty is absent, not half-filled.
  for (const p of CORNER_POSITIONS) {
    const bs = getPath(out, `corners.${p}.corner.bumpStop`) as Record<string, unknown> | undefined;
    if (bs && Object.keys(bs).length === 0) setPath(out, `corners.${p}.corner.bumpStop`, undefined);
    const clicks = getPath(out, `corners.${p}.clicks`) as Record<string, unknown> | undefined;
    if (clicks && Object.keys(clicks).length === 0) setPath(out, `corners.${p}.clicks`, undefined);
  }
  const bar = getPath(out, 'antiRollBar') as Record<string, unknown> | undefined;
  if (bar && Object.keys(bar).length === 0) setPath(out, 'antiRollBar', undefined);
  return out;
}

/** The form shown in another unit system: every valid quantity converted in place, other text kept. */
export function setupFormConvert(form: SetupForm, system: UnitSystem): SetupForm {
  if (system === form.system) return form;
  const file = setupFormToFile(form);
  const next = setupFormFromFile(file, system);
  // A field that does not read keeps exactly what was typed, so nothing typed is lost.
  for (const { path, spec } of formFields(form)) {
    const text = form.values[path] ?? '';
    if (isQuantity(spec.kind) && text.trim() !== '') {
      try {
        quantityParse(fileValue(form, path, spec.kind), spec.kind, path);
      } catch {
        next.values[path] = text;
        delete next.exact[path];
      }
    }
  }
  return next;
}

/** The form with one field changed. */
export function setupFormSet(form: SetupForm, path: string, text: string): SetupForm {
  return { ...form, values: { ...form.values, [path]: text } };
}

/**
 * The problems of the form, by field path: each field on its own (wrong unit, not a number,
 * a required field left empty), then the whole file as the store reads it (cross-field rules
 * such as unsprung mass below corner mass). Empty when the form can be saved.
 */
export function setupFormProblems(form: SetupForm): Map<string, string> {
  const problems = new Map<string, string>();
  for (const { path, spec } of formFields(form)) {
    const text = (form.values[path] ?? '').trim();
    if (text === '') {
      if (spec.required) problems.set(path, `${spec.label} is needed`);
      continue;
    }
    if (isQuantity(spec.kind)) {
      try {
        quantityParse(fileValue(form, path, spec.kind), spec.kind, path);
      } catch (e) {
        problems.set(path, (e as InputError).problem ?? (e as Error).message);
      }
    } else if ((spec.kind === 'ratio' || spec.kind === 'clicks') && !NUMBER_ONLY.test(text)) {
      problems.set(
        path,
        spec.kind === 'ratio' ? 'expected a number such as 0.9' : 'expected a whole number of clicks',
      );
    }
  }
  if (problems.size === 0) {
    try {
      setupFileParse(setupFormToFile(form));
    } catch (e) {
      if (e instanceof InputError) problems.set(e.field, e.problem);
      else throw e;
    }
  }
  return problems;
}

/** One corner's analysis input read from the form, or the first problem with it. */
export function setupFormCorner(
  form: SetupForm,
  p: CornerPosition,
): { corner: CornerInput } | { error: InputError } {
  const file = setupFormToFile(form);
  try {
    return { corner: cornerInputParse(getPath(file, `corners.${p}.corner`), `corners.${p}.corner`) };
  } catch (e) {
    if (e instanceof InputError) return { error: e };
    throw e;
  }
}
