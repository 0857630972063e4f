import type { z } from 'zod';
import { InputError } from '../../core/units/input-error';

/**
 * Turns a zod failure into the program's one input error, naming the first bad field the
 * way the rest of the program does (`frequencies[2]: …`).
 */
export function inputErrorFromZod(error: z.ZodError, root = ''): InputError {
  const issue = error.issues[0];
  if (!issue) return new InputError(root, 'is not valid');
  let field = root;
  for (const key of issue.path) {
    field = typeof key === 'number' ? `${field}[${key}]` : field ? `${field}.${String(key)}` : String(key);
  }
  return new InputError(field, issue.message);
}
