import { canonicalJson } from './canonical-json';
import { cornerRideFigures } from '../corner/corner';
import { cornerInputToFile } from '../corner/corner-file';
import { setupCornerSheetToFile, setupSheetTopToFile } from './setup-file';
import { CORNER_POSITIONS, SETUP_FIELD_LABELS, type CornerPosition, type SetupSheet } from './setup-sheet';
import type { UnitSystem } from '../units/units';

/** One field that differs between two setups, with its values as shown in the unit system asked for. */
export type SetupFieldChange = {
  /** The field's path in the setup file, e.g. `corners.FL.corner.springRate`. */
  field: string;
  /** Words for people, e.g. "spring rate". */
  label: string;
  position?: CornerPosition;
  /** The value before and after (number or text without its unit); null where the field is absent. */
  before: string | null;
  after: string | null;
  /** The unit both values are in ("" for ratios and texts). */
  unit: string;
};

/** The headline ride figures the diff reports per corner. */
export const SETUP_FIGURES = [
  'rideFrequencyHz',
  'dampingRatioBump',
  'dampingRatioRebound',
  'wheelHopFrequencyHz',
] as const;
export type SetupFigure = (typeof SETUP_FIGURES)[number];

/** Words and unit of each headline figure. */
export const SETUP_FIGURE_LABELS: Record<SetupFigure, { label: string; unit: string }> = {
  rideFrequencyHz: { label: 'ride frequency', unit: 'Hz' },
  dampingRatioBump: { label: 'ζ bump', unit: '' },
  dampingRatioRebound: { label: 'ζ rebound', unit: '' },
  wheelHopFrequencyHz: { label: 'wheel hop', unit: 'Hz' },
};

/** One headline figure of one corner that differs, SI. */
export type SetupFigureChange = {
  position: CornerPosition;
  figure: SetupFigure;
  before: number;
  after: number;
};

export type SetupDiff = { fields: SetupFieldChange[]; figures: SetupFigureChange[] };

/** Paths whose values are texts, never "number unit". */
const TEXT_PATHS = new Set([
  'name',
  'event',
  'track',
  'driver',
  'date',
  'antiRollBar.front',
  'antiRollBar.rear',
  'notes',
  'damperUnit',
  'springLabel',
]);

/**
 * Two numbers this close (relative) are one value: a file written with units and read back
 * keeps 12 significant digits (quantityText), so a sheet shown in lbf/in and saved again
 * differs from the stored one by about 1e-12 — that is not a change the shop made.
 */
export const SETUP_DIFF_RELATIVE_TOLERANCE = 1e-9;

function sameNumber(a: number, b: number): boolean {
  return Math.abs(a - b) <= SETUP_DIFF_RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));
}

const QUANTITY_TEXT = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?) (.+)$/;

/** Every leaf of a file-form object by its dotted path, in file order. */
function leavesOf(value: unknown, prefix: string, out: Map<string, unknown>): Map<string, unknown> {
  if (Array.isArray(value)) value.forEach((v, i) => leavesOf(v, `${prefix}[${i}]`, out));
  else if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value as Record<string, unknown>))
      leavesOf(v, prefix ? `${prefix}.${k}` : k, out);
  } else out.set(prefix, value);
  return out;
}

type Shown = { number?: number; text: string; unit: string };

function shownOf(path: string, value: unknown): Shown {
  if (typeof value === 'number')
    return { number: value, text: String(value), unit: path.startsWith('clicks.') ? 'clicks' : '' };
  const text = String(value);
  if (TEXT_PATHS.has(path)) return { text, unit: '' };
  const m = QUANTITY_TEXT.exec(text);
  // Files spell a product of units with a space (mathjs: "N s/m"); people read "N·s/m".
  return m
    ? { number: Number(m[1]), text: m[1] as string, unit: (m[2] as string).replace(/ (?=\w)/g, '·') }
    : { text, unit: '' };
}

/** Numbers at the fewest significant digits (at least 6) that still tell the two apart. */
function numbersShown(a: number, b: number): [string, string] {
  for (let p = 6; p < 17; p++) {
    const ta = String(Number(a.toPrecision(p)));
    const tb = String(Number(b.toPrecision(p)));
    if (ta !== tb || a === b) return [ta, tb];
  }
  return [String(a), String(b)];
}

function fieldChanges(
  before: Map<string, unknown>,
  after: Map<string, unknown>,
  prefix: string,
  position: CornerPosition | undefined,
  out: SetupFieldChange[],
): void {
  const paths = [...before.keys(), ...[...after.keys()].filter((k) => !before.has(k))];
  for (const path of paths) {
    const va = before.get(path);
    const vb = after.get(path);
    if (va === vb) continue;
    const label = SETUP_FIELD_LABELS[path] ?? path;
    const change: SetupFieldChange = {
      field: `${prefix}${path}`,
      label,
      before: null,
      after: null,
      unit: '',
    };
    if (position) change.position = position;
    const sa = va === undefined ? undefined : shownOf(path, va);
    const sb = vb === undefined ? undefined : shownOf(path, vb);
    if (
      sa?.number !== undefined &&
      sb?.number !== undefined &&
      sa.unit === sb.unit &&
      sameNumber(sa.number, sb.number)
    )
      continue;
    if (sa && sb && sa.unit !== sb.unit) {
      // The form changed (toe in degrees became toe in mm): each value keeps its own unit.
      change.before = sa.unit ? `${sa.text} ${sa.unit}` : sa.text;
      change.after = sb.unit ? `${sb.text} ${sb.unit}` : sb.text;
    } else {
      change.unit = (sa ?? sb)?.unit ?? '';
      if (sa?.number !== undefined && sb?.number !== undefined) {
        [change.before, change.after] = numbersShown(sa.number, sb.number);
      } else {
        change.before = sa ? sa.text : null;
        change.after = sb ? sb.text : null;
      }
    }
    out.push(change);
  }
}

function figuresOf(sheet: SetupSheet, p: CornerPosition): Record<SetupFigure, number> {
  const f = cornerRideFigures(sheet.corners[p].analysis);
  return {
    rideFrequencyHz: f.rideFrequencyHz,
    dampingRatioBump: f.dampingRatio.bump,
    dampingRatioRebound: f.dampingRatio.rebound,
    wheelHopFrequencyHz: f.wheelHopFrequencyHz,
  };
}

/**
 * Every field that differs between two setups, walked generically over their file forms
 * (so a corner input field added later is compared without code here), and the change of
 * the headline ride figures — ride frequency, ζ bump and rebound at low speed, wheel hop —
 * of each corner whose analysis input differs, by `cornerRideFigures`.
 */
export function setupDiff(a: SetupSheet, b: SetupSheet, system: UnitSystem = 'si'): SetupDiff {
  const fields: SetupFieldChange[] = [];
  const figures: SetupFigureChange[] = [];
  const leaves = (o: Record<string, unknown>) => leavesOf(o, '', new Map());
  fieldChanges(
    leaves(setupSheetTopToFile(a, system)),
    leaves(setupSheetTopToFile(b, system)),
    '',
    undefined,
    fields,
  );
  for (const p of CORNER_POSITIONS) {
    const ca = a.corners[p];
    const cb = b.corners[p];
    // Unit conversion is the costly part: the analysis input is written out only when it differs.
    const analysisDiffers = canonicalJson(ca.analysis) !== canonicalJson(cb.analysis);
    const prefix = `corners.${p}.`;
    if (analysisDiffers) {
      const corner = (c: typeof ca) => leaves({ corner: cornerInputToFile(c.analysis, system) });
      fieldChanges(corner(ca), corner(cb), prefix, p, fields);
    }
    fieldChanges(
      leaves(setupCornerSheetToFile(ca, system)),
      leaves(setupCornerSheetToFile(cb, system)),
      prefix,
      p,
      fields,
    );
    if (!analysisDiffers) continue;
    const fa = figuresOf(a, p);
    const fb = figuresOf(b, p);
    for (const figure of SETUP_FIGURES) {
      if (!sameNumber(fa[figure], fb[figure]))
        figures.push({ position: p, figure, before: fa[figure], after: fb[figure] });
    }
  }
  return { fields, figures };
}

function positionsText(positions: CornerPosition[]): string {
  const set = positions.join(' ');
  if (set === 'FL FR RL RR') return 'all corners';
  if (set === 'FL FR') return 'front';
  if (set === 'RL RR') return 'rear';
  return set;
}

function shortText(text: string | null, max = 24): string {
  if (text === null) return '—';
  return [...text].length > max ? `${[...text].slice(0, max - 1).join('')}…` : text;
}

/** A change's path within its corner (`springLabel`), or the vehicle-level path. */
const relativePath = (c: SetupFieldChange) => c.field.replace(/^corners\.(FL|FR|RL|RR)\./, '');

/**
 * A change's before and after as people read them: texts as they are; numbers as short as
 * they can be and still differ — 3 significant figures, more only where 3 would show them
 * equal (400 → 500 lbf/in stored as 70.0507 → 87.5634 N/mm reads "70.1→87.6").
 */
export function setupChangeText(c: SetupFieldChange): [string | null, string | null] {
  const { before, after } = c;
  if (TEXT_PATHS.has(relativePath(c))) return [before, after];
  const number = (t: string | null) => (t === null || t.trim() === '' ? null : Number(t));
  const a = number(before);
  const b = number(after);
  const ok = (v: number | null) => v === null || Number.isFinite(v);
  if (!ok(a) || !ok(b) || (a === null && b === null)) return [before, after];
  const short = (v: number | null, digits: number, text: string | null) =>
    v === null ? text : String(Number(v.toPrecision(digits)));
  for (let digits = 3; digits < 12; digits++) {
    const sa = short(a, digits, before);
    const sb = short(b, digits, after);
    if (sa !== sb || a === b) return [sa, sb];
  }
  return [before, after];
}

/**
 * A one-line account of a diff for the revision history: like changes grouped across
 * corners ("spring rate rear 70→80 N/mm; rebound clicks FL 6→8"), cut at `maxLength`.
 */
export function setupDiffSummary(diff: SetupDiff, maxLength = 160): string {
  const groups = new Map<string, { text: (where: string) => string; positions: CornerPosition[] }>();
  for (const c of diff.fields) {
    const relative = relativePath(c);
    // Name, event and date are columns of their own in the history; notes are named, not quoted.
    if (relative === 'name' || relative === 'event' || relative === 'date') continue;
    const isNotes = relative === 'notes';
    const key = `${c.position ? 'corners.' : ''}${relative}\u0000${isNotes ? '' : `${c.before}\u0000${c.after}`}`;
    const values = isNotes
      ? ''
      : TEXT_PATHS.has(relative)
        ? ` "${shortText(c.after)}"`
        : ` ${setupChangeText(c)
            .map((t) => shortText(t))
            .join('→')}${c.unit && c.unit !== 'clicks' ? ` ${c.unit}` : ''}`;
    const g = groups.get(key) ?? { text: (where: string) => `${c.label}${where}${values}`, positions: [] };
    if (c.position) g.positions.push(c.position);
    groups.set(key, g);
  }
  if (groups.size === 0) return diff.fields.length === 0 ? 'no changes' : 'no setup changes';
  // What was done to the car first, then the vehicle-level fields, then who, where and notes.
  const rank = (key: string) =>
    key.startsWith('corners.') ? 0 : /^(fuelLoad|antiRollBar)/.test(key) ? 1 : 2;
  const parts = [...groups.entries()]
    .sort(([a], [b]) => rank(a) - rank(b))
    .map(([, g]) => g.text(g.positions.length ? ` ${positionsText(g.positions)}` : ''));
  let line = '';
  for (let i = 0; i < parts.length; i++) {
    const next = line ? `${line}; ${parts[i]}` : (parts[i] as string);
    const rest = parts.length - i - 1;
    if (next.length > maxLength && line) return `${line}; … ${parts.length - i} more`;
    line = next;
    if (line.length > maxLength && rest > 0) return `${line}; … ${rest} more`;
  }
  return line;
}
