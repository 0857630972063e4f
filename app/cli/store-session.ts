import { existsSync, rmSync } from 'node:fs';
import { homedir } from 'node:os';
import { InputError } from '../../core/units/input-error';
import { storeClose, storeOpen } from '../../db/store';
import { storePathResolve } from '../../db/store-path';
import type { ApiContext } from '../api/context';
import type { CliIo } from './cli-io';

/** The database a command line names: `--db FILE`, else $RIDELEDGER_DB, else the per-user default. */
export function cliStorePath(dbFlag: string | undefined, env: NodeJS.ProcessEnv = process.env): string {
  return storePathResolve(dbFlag, { platform: process.platform, env, home: homedir() });
}

/**
 * Runs `fn` against the command's database and closes it. A command that only reads, run
 * before any database exists, sees an empty one and leaves no file behind; one that needs
 * the file itself (`existing`: backup, check) says there is none. A command that
 * writes makes the file; if it fails on its first use, the new empty file is removed again,
 * so bad input leaves the disk as it was.
 */
export async function withStore<T>(
  dbFlag: string | undefined,
  io: CliIo,
  mode: 'read' | 'write' | 'existing',
  fn: (context: ApiContext) => Promise<T>,
): Promise<T> {
  const path = cliStorePath(dbFlag);
  const missing = path !== ':memory:' && !existsSync(path);
  if (missing && mode === 'existing')
    throw new InputError(
      path,
      'there is no database here yet (vehicle add, setup save, bench import or demo make one)',
    );
  const store = storeOpen(mode === 'read' && missing ? ':memory:' : path);
  let ok = false;
  try {
    const result = await fn({ store });
    ok = true;
    return result;
  } finally {
    const empty =
      store.created &&
      !ok &&
      (store.db
        .prepare('SELECT (SELECT count(*) FROM vehicle) + (SELECT count(*) FROM damper_unit)')
        .pluck()
        .get() as number) === 0;
    storeClose(store);
    if (empty) for (const suffix of ['', '-wal', '-shm']) rmSync(`${path}${suffix}`, { force: true });
    else if (store.created && ok) io.stderr(`rideledger: made a new database at ${path}\n`);
  }
}
