import { existsSync, mkdirSync, statSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import Database from 'better-sqlite3';
import { InputError } from '../core/units/input-error';
import { migrationsApplied, migrationsApply, migrationsKnown, schemaVersionLatest } from './migrations';

/** An open RideLedger database. */
export type Store = {
  db: Database.Database;
  /** The file, or ":memory:". */
  path: string;
  /** Where automatic backups (before a deletion or an upgrade) go; null when none can be made. */
  backupDir: string | null;
  /** The file did not exist and was made by this open. */
  created: boolean;
};

export type StoreOpenOptions = {
  /** Apply migrations only up to this version (tests build old databases with it). */
  migrateTo?: number;
  /** Folder for automatic backups; default `backups/` beside the database file. */
  backupDir?: string;
  /** How long to wait for another program's write lock (ms). */
  busyTimeoutMs?: number;
};

/**
 * Waits this long for a lock held by the other program on the same file (the desktop app
 * and the command): long enough for any single save or import to finish.
 */
export const STORE_BUSY_TIMEOUT_MS = 10_000;

function timestampForFile(d: Date): string {
  return d
    .toISOString()
    .replace(/[-:]/g, '')
    .replace(/\.\d+Z$/, 'Z');
}

/** A file name for an automatic backup: `rideledger-20250412T101500Z-before-….sqlite`, unused. */
export function storeBackupFileName(store: Store, reason: string, now = new Date()): string {
  if (!store.backupDir)
    throw new InputError('backup', 'an in-memory database has no backup folder; give one');
  const slug = reason
    .normalize('NFKD')
    .replace(/[^\w-]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .toLowerCase();
  const stem = `${basename(store.path).replace(/\.[^.]*$/, '')}-${timestampForFile(now)}-${slug}`;
  let name = join(store.backupDir, `${stem}.sqlite`);
  for (let i = 2; existsSync(name); i++) name = join(store.backupDir, `${stem}-${i}.sqlite`);
  return name;
}

function refuse(db: Database.Database, path: string, problem: string): never {
  db.close();
  throw new InputError(path, `${problem}; nothing was changed`);
}

/**
 * Checks, before anything is written, that the file is a RideLedger database this program
 * can use: an SQLite file, with our schema record (or empty), not newer than the program,
 * and with the same migrations as the program's.
 */
function storeCompatibilityCheck(db: Database.Database, path: string): number {
  let tables: { name: string }[];
  try {
    tables = db.prepare("SELECT name FROM sqlite_master WHERE type = 'table'").all() as { name: string }[];
  } catch (e) {
    const code = (e as { code?: string }).code;
    if (code === 'SQLITE_NOTADB')
      refuse(db, path, 'is not an SQLite database (expected a RideLedger database file)');
    throw e;
  }
  const applied = migrationsApplied(db);
  if (applied.length === 0 && tables.some((t) => !t.name.startsWith('sqlite_')))
    refuse(
      db,
      path,
      'is an SQLite database of another program (it has tables but no RideLedger schema record)',
    );
  const latest = schemaVersionLatest();
  const newest = applied.reduce((m, a) => Math.max(m, a.version), 0);
  if (newest > latest)
    refuse(
      db,
      path,
      `was written by a newer RideLedger (schema version ${newest}; this program knows up to ${latest}) — update RideLedger to open it`,
    );
  const known = migrationsKnown();
  for (const a of applied) {
    const m = known[a.version - 1];
    if (!m || m.sha256 !== a.sha256)
      refuse(
        db,
        path,
        `records schema step ${a.version} ("${a.name}") differently from this program's — it was made by another build of RideLedger`,
      );
  }
  return newest;
}

/**
 * Opens (or creates) a RideLedger database: WAL journal so that the desktop app and the
 * command can use one file at once, foreign keys on, a busy timeout, full sync on commit (a
 * committed save survives a power cut), then the pending migrations. Before migrating a
 * database that already holds data, a copy is kept in the backup folder. A file this
 * program cannot use is refused before anything is written.
 * @throws InputError naming the file when it is not a usable RideLedger database.
 */
export function storeOpen(path: string, options: StoreOpenOptions = {}): Store {
  const memory = path === ':memory:' || path === '';
  let created = false;
  if (!memory) {
    if (existsSync(path) && statSync(path).isDirectory())
      throw new InputError(path, 'is a folder; expected a database file');
    created = !existsSync(path);
    if (created) mkdirSync(dirname(path), { recursive: true });
  }
  const db = new Database(memory ? ':memory:' : path, {
    timeout: options.busyTimeoutMs ?? STORE_BUSY_TIMEOUT_MS,
  });
  db.pragma(`busy_timeout = ${options.busyTimeoutMs ?? STORE_BUSY_TIMEOUT_MS}`);
  db.pragma('foreign_keys = ON');
  const version = storeCompatibilityCheck(db, path);
  db.pragma('journal_mode = WAL');
  db.pragma('synchronous = FULL');
  const store: Store = {
    db,
    path: memory ? ':memory:' : path,
    backupDir: options.backupDir ?? (memory ? null : join(dirname(path), 'backups')),
    created,
  };
  const target = options.migrateTo ?? schemaVersionLatest();
  if (version > 0 && version < target && !memory && store.backupDir) {
    mkdirSync(store.backupDir, { recursive: true });
    // VACUUM INTO writes a consistent copy in one statement, before the schema is touched.
    db.prepare('VACUUM INTO ?').run(storeBackupFileName(store, `before-schema-${target}`));
  }
  try {
    migrationsApply(db, target);
  } catch (e) {
    db.close();
    throw e;
  }
  return store;
}

/** Closes the database; WAL content is checkpointed into the file. */
export function storeClose(store: Store): void {
  if (store.db.open) store.db.close();
}

/**
 * Runs `fn` in one IMMEDIATE transaction: the write lock is taken at the start, so two
 * programs saving at once queue instead of failing half-way; any throw rolls everything back.
 */
export function storeTransaction<T>(store: Store, fn: () => T): T {
  return store.db.transaction(fn).immediate();
}
