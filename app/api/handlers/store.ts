import { storeBackup } from '../../../db/backup';
import { storeCheck } from '../../../db/check';
import type { ApiContext } from '../context';
import type { HandlerOutput, HandlerParsedInput } from '../contract';

/** Handler `storeBackup`: a checked copy of the whole database through SQLite's online backup. */
export function storeBackupHandler(
  input: HandlerParsedInput<'storeBackup'>,
  { store }: ApiContext,
): Promise<HandlerOutput<'storeBackup'>> {
  return storeBackup(store, input.path, { overwrite: input.overwrite === true });
}

/** Handler `storeCheck`: SQLite's integrity and foreign-key checks and our own rules. */
export function storeCheckHandler(
  _input: HandlerParsedInput<'storeCheck'>,
  { store }: ApiContext,
): HandlerOutput<'storeCheck'> {
  return storeCheck(store);
}
