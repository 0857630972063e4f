import { z } from 'zod';
import { NOTES_MAX_LENGTH } from '../../core/units/text-field';

/**
 * Sizes a corner or setup file may have, checked before core reads it: a file past them is
 * refused at once with the field named, so that no one call can hold the others up.
 */
/** Most points in one table (a damper direction, a bump-stop curve): a bench table has a few dozen. */
export const TABLE_POINTS_MAX = 1000;
/** Longest text anywhere in a file (UTF-16 units; the notes' own limit is checked by core). */
export const FILE_TEXT_MAX = 4 * NOTES_MAX_LENGTH;
/** Deepest nesting of lists and objects in a file (a setup file needs six levels). */
export const FILE_DEPTH_MAX = 16;
/** Most values (numbers, texts, lists, objects) in one file: four corners of full tables fit. */
export const FILE_VALUES_MAX = 50_000;
/** Most keys of one object in a file. */
export const FILE_KEYS_MAX = 200;

export type BoundsIssue = { path: (string | number)[]; message: string };

/**
 * The first place where a file's content passes one of the sizes above; undefined when none.
 * Walks the value without recursion and stops at the first issue, so its cost is bounded too.
 */
export function fileBoundsIssue(value: unknown): BoundsIssue | undefined {
  const stack: { value: unknown; path: (string | number)[] }[] = [{ value, path: [] }];
  let seen = 0;
  while (stack.length > 0) {
    const { value: v, path } = stack.pop() as { value: unknown; path: (string | number)[] };
    seen++;
    if (seen > FILE_VALUES_MAX)
      return { path: [], message: `holds more than ${FILE_VALUES_MAX} values; a file is far smaller` };
    if (typeof v === 'string') {
      if (v.length > FILE_TEXT_MAX)
        return { path, message: `is more than ${FILE_TEXT_MAX} characters long; no text in a file is` };
      continue;
    }
    if (typeof v !== 'object' || v === null) continue;
    if (path.length >= FILE_DEPTH_MAX)
      return { path, message: `is nested more than ${FILE_DEPTH_MAX} levels deep; a file is flatter` };
    if (Array.isArray(v)) {
      if (v.length > TABLE_POINTS_MAX)
        return {
          path,
          message: `has ${v.length} entries; at most ${TABLE_POINTS_MAX} points are read in one table`,
        };
      for (let i = v.length - 1; i >= 0; i--) stack.push({ value: v[i], path: [...path, i] });
      continue;
    }
    const keys = Object.keys(v);
    if (keys.length > FILE_KEYS_MAX)
      return { path, message: `has ${keys.length} keys; at most ${FILE_KEYS_MAX} are read` };
    for (let i = keys.length - 1; i >= 0; i--) {
      const key = keys[i] as string;
      stack.push({ value: (v as Record<string, unknown>)[key], path: [...path, key] });
    }
  }
  return undefined;
}

/** A file's content (read by core), refused with the field named when it passes the sizes above. */
export const boundedFileSchema = z.unknown().superRefine((value, ctx) => {
  const issue = fileBoundsIssue(value);
  if (issue) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
});
