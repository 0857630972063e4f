import { cliMain } from '../../app/cli/main';
import { storeClose, storeOpen } from '../../db/store';
import { storeDigest } from '../db/store-fixture';

export type CliResult = { code: number; stdout: string; stderr: string };

/** Runs the command in-process, as `rideledger ARGS`, capturing what it writes. */
export async function cli(...args: string[]): Promise<CliResult> {
  let stdout = '';
  let stderr = '';
  const code = await cliMain(args, { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t) });
  return { code, stdout, stderr };
}

/** The digest of a database file's rows (opening it changes no row). */
export function fileDigest(path: string): string {
  const store = storeOpen(path);
  try {
    return storeDigest(store);
  } finally {
    storeClose(store);
  }
}
