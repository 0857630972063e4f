import { readFile } from 'node:fs/promises';
import { InputError } from '../../core/units/input-error';

/** Reads a JSON file; a missing, unreadable, empty or malformed file is an InputError naming it. */
export async function readJsonFile(path: string): Promise<unknown> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why =
      code === 'ENOENT'
        ? 'no such file'
        : code === 'EISDIR'
          ? 'is a folder, not a file'
          : code === 'EACCES'
            ? 'permission denied'
            : (e as Error).message;
    throw new InputError(path, `cannot read the file: ${why}`);
  }
  if (text.trim() === '') throw new InputError(path, 'the file is empty; expected a JSON object');
  try {
    return JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (e) {
    throw new InputError(path, `is not valid JSON (${(e as Error).message})`);
  }
}
