import { readFileSync, statSync } from 'node:fs';
import { InputError } from '../core/units/input-error';

/** The largest text file read whole: well inside what one JavaScript string can hold. */
export const TEXT_FILE_MAX_BYTES = 256 * 2 ** 20;

/** Why a file could not be read, in words. */
export function fileErrorText(e: unknown): string {
  const code = (e as NodeJS.ErrnoException).code;
  if (code === 'ENOENT') return 'no such file';
  if (code === 'EISDIR') return 'is a folder, not a file';
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
  return (e as Error).message;
}

/**
 * Reads a text file: UTF-8, or UTF-16 when it starts with that byte-order mark (some bench
 * software writes it). A missing or unreadable file is an InputError naming it.
 */
export function textFileRead(path: string): string {
  let bytes: Buffer;
  try {
    const size = statSync(path).size;
    if (size > TEXT_FILE_MAX_BYTES)
      throw new InputError(
        path,
        `is ${(size / 2 ** 20).toFixed(0)} MiB; files up to ${TEXT_FILE_MAX_BYTES / 2 ** 20} MiB (about 10 million bench rows) are read — split it`,
      );
    bytes = readFileSync(path);
  } catch (e) {
    if (e instanceof InputError) throw e;
    throw new InputError(path, `cannot read the file: ${fileErrorText(e)}`);
  }
  if (bytes[0] === 0xff && bytes[1] === 0xfe) return bytes.subarray(2).toString('utf16le');
  if (bytes[0] === 0xfe && bytes[1] === 0xff) {
    const swapped = Buffer.from(bytes.subarray(2));
    swapped.swap16();
    return swapped.toString('utf16le');
  }
  return bytes.toString('utf8');
}
