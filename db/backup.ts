import { existsSync, mkdirSync, realpathSync, renameSync, rmSync, statSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import Database from 'better-sqlite3';
import { InputError } from '../core/units/input-error';
import { storeEventInsert } from './queries/store-event';
import type { Store } from './store';

export type BackupResult = {
  path: string;
  bytes: number;
  /** What the copy holds, counted in the copy itself after it was checked. */
  counts: { vehicles: number; revisions: number; dampers: number; benchRuns: number };
};

function sameFile(a: string, b: string): boolean {
  try {
    return realpathSync(a) === realpathSync(b);
  } catch {
    return resolve(a) === resolve(b);
  }
}

/**
 * Copies the whole database to `target` with SQLite's online backup (a consistent copy
 * while the desktop app or the command keeps using the file), written under a temporary
 * name, checked (integrity_check, then counted), and only then given its name — so a file
 * at `target` is always a whole, checked backup. An existing file is kept unless
 * `overwrite`.
 * @throws InputError when the target exists, is the database itself, or cannot be written.
 */
export async function storeBackup(
  store: Store,
  target: string,
  options: { overwrite?: boolean; now?: Date } = {},
): Promise<BackupResult> {
  if (store.path !== ':memory:' && sameFile(target, store.path))
    throw new InputError(target, 'is the database itself; back up to another file');
  if (existsSync(target)) {
    if (statSync(target).isDirectory())
      throw new InputError(target, 'is a folder; give a file name for the backup');
    if (!options.overwrite)
      throw new InputError(target, 'already exists; give a new file name (or --force to replace it)');
  }
  try {
    mkdirSync(dirname(resolve(target)), { recursive: true });
  } catch (e) {
    throw new InputError(target, `cannot make its folder: ${(e as Error).message}`);
  }
  const partial = `${target}.partial-${process.pid}`;
  try {
    await store.db.backup(partial);
    const copy = new Database(partial);
    try {
      // A backup is one file to carry away: no write-ahead log beside it.
      copy.pragma('journal_mode = DELETE');
      const integrity = copy.pragma('integrity_check', { simple: true });
      if (integrity !== 'ok')
        throw new Error(`the backup copy failed its integrity check: ${String(integrity)}`);
      const count = (table: string) => copy.prepare(`SELECT count(*) FROM ${table}`).pluck().get() as number;
      const counts = {
        vehicles: count('vehicle'),
        revisions: count('setup_revision'),
        dampers: count('damper_unit'),
        benchRuns: count('bench_run'),
      };
      copy.close();
      renameSync(partial, target);
      const bytes = statSync(target).size;
      storeEventInsert(store.db, {
        at: (options.now ?? new Date()).toISOString(),
        kind: 'backup',
        detail: `backup to ${target} (${counts.vehicles} vehicles, ${counts.revisions} revisions, ${counts.benchRuns} bench runs)`,
      });
      return { path: target, bytes, counts };
    } finally {
      if (copy.open) copy.close();
    }
  } catch (e) {
    rmSync(partial, { force: true });
    if (e instanceof InputError) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'EACCES' || code === 'EPERM' || code === 'ENOENT' || code === 'SQLITE_CANTOPEN')
      throw new InputError(target, `cannot write the backup there (${(e as Error).message})`);
    throw e;
  }
}
