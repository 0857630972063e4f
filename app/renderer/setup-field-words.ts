import { clickSettingsParse } from '../../core/damper/click-settings';
import { CORNER_POSITIONS, SETUP_FIELD_LABELS, type CornerPosition } from '../../core/setup/setup-sheet';
import { CORNER_FIELDS, TOP_FIELDS, setupFormCorner, setupFormToFile, type SetupForm } from './setup-form';

const CORNER_PATH = /^corners\.(FL|FR|RL|RR)\.(.+)$/;

/** "unsprungMass" → "unsprung mass": the last resort for a key no list names. */
const keyWords = (key: string) =>
  (key.split('.').at(-1) ?? key)
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .replace(/\[\d+\]/g, '')
    .toLowerCase();

/**
 * The words a person reads for a field of the setup file: the sheet's own label
 * ("Corner mass"), else the change list's ("bump damping"), else the key in words — never
 * the key itself. A corner field carries its corner: "FL corner mass" when `withCorner`.
 */
export function setupFieldLabel(path: string, withCorner = false): string {
  const m = CORNER_PATH.exec(path);
  const rest = m ? (m[2] as string) : path;
  const spec = (m ? CORNER_FIELDS : TOP_FIELDS).find((f) => f.key === rest);
  const label = spec?.label ?? SETUP_FIELD_LABELS[rest] ?? keyWords(rest);
  if (!m || !withCorner) return label;
  return `${m[1] as string} ${label.charAt(0).toLowerCase()}${label.slice(1)}`;
}

/**
 * A problem as the sheet shows it: a problem that continues its field's name ("is missing",
 * "must be less than the corner mass") gets the field's label in front, so no message reads
 * as a key ("cornerMass: is missing" becomes "Corner mass is missing").
 */
export function setupProblemText(path: string, problem: string, withCorner = false): string {
  const continues = /^(is|are|must|cannot|can't|should|has|needs)\b/.test(problem);
  if (!continues) return problem;
  const label = setupFieldLabel(path, withCorner);
  return `${label.charAt(0).toUpperCase()}${label.slice(1)} ${problem}`;
}

/** What the API needs to tell which damper curve a corner runs: its "corner" object, damper unit and clicks. */
export type SheetDamperRef = {
  position: CornerPosition;
  corner: unknown;
  damperUnit: string;
  clicks: Record<string, unknown>;
};

/** The corners of the form that read (their figures can be computed), as the API asks about dampers. */
export function setupFormDamperRefs(form: SetupForm): SheetDamperRef[] {
  const file = setupFormToFile(form) as { corners?: Record<string, Record<string, unknown>> };
  const out: SheetDamperRef[] = [];
  for (const p of CORNER_POSITIONS) {
    if ('error' in setupFormCorner(form, p)) continue;
    const c = file.corners?.[p] ?? {};
    const clicks = (c.clicks ?? {}) as Record<string, unknown>;
    try {
      clickSettingsParse(clicks, `corners.${p}.clicks`);
    } catch {
      continue;
    }
    const unit = typeof c.damperUnit === 'string' ? c.damperUnit : '';
    out.push({ position: p, corner: c.corner, damperUnit: unit, clicks });
  }
  return out;
}
