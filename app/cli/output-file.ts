import { existsSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { InputError } from '../../core/units/input-error';
import { fileErrorText } from '../../db/text-file';

/**
 * Writes a file whole or not at all: to a temporary name beside it, then renamed. An
 * existing file is kept unless `overwrite` — an export or a setup file is never clobbered
 * by accident.
 * @throws InputError naming the file.
 */
export function outputFileWrite(path: string, text: string, overwrite = false): void {
  if (existsSync(path) && !overwrite)
    throw new InputError(path, 'already exists; give a new file name (or --force to replace it)');
  const partial = `${path}.partial-${process.pid}`;
  try {
    writeFileSync(partial, text);
    renameSync(partial, path);
  } catch (e) {
    rmSync(partial, { force: true });
    throw new InputError(path, `cannot write the file: ${fileErrorText(e)}`);
  }
}
