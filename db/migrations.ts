import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type Database from 'better-sqlite3';

/** One numbered SQL migration of db/migrations/ (`001-initial.sql`). */
export type Migration = { version: number; name: string; sql: string; sha256: string };

const MIGRATIONS_DIR = fileURLToPath(new URL('./migrations/', import.meta.url));
const FILE_NAME = /^(\d{3})-([a-z0-9-]+)\.sql$/;

let known: Migration[] | undefined;

/**
 * The migrations this program knows, numbered 1, 2, 3 … without gaps. The checksum is of
 * the text with line endings made LF, so a checkout that turns them into CRLF still matches.
 */
export function migrationsKnown(): Migration[] {
  if (known) return known;
  const files = readdirSync(MIGRATIONS_DIR)
    .filter((f) => f.endsWith('.sql'))
    .sort();
  const list = files.map((file, i) => {
    const m = FILE_NAME.exec(file);
    if (!m || Number(m[1]) !== i + 1)
      throw new Error(
        `db/migrations/${file}: migrations are named 001-name.sql, 002-…, numbered without gaps`,
      );
    const sql = readFileSync(`${MIGRATIONS_DIR}${file}`, 'utf8').replace(/\r\n/g, '\n');
    return {
      version: i + 1,
      name: m[2] as string,
      sql,
      sha256: createHash('sha256').update(sql).digest('hex'),
    };
  });
  known = list;
  return list;
}

/** The newest schema version this program knows. */
export function schemaVersionLatest(): number {
  return migrationsKnown().length;
}

/** A migration as the database records it. */
export type AppliedMigration = { version: number; name: string; sha256: string; applied_at: string };

const RECORD_TABLE = `CREATE TABLE IF NOT EXISTS schema_migration (
  version INTEGER PRIMARY KEY,
  name TEXT NOT NULL,
  sha256 TEXT NOT NULL,
  applied_at TEXT NOT NULL
) STRICT`;

/** The migrations recorded in the database, oldest first; none when it has no record table. */
export function migrationsApplied(db: Database.Database): AppliedMigration[] {
  const table = db
    .prepare("SELECT 1 FROM sqlite_master WHERE type = 'table' AND name = 'schema_migration'")
    .get();
  if (!table) return [];
  return db
    .prepare('SELECT version, name, sha256, applied_at FROM schema_migration ORDER BY version')
    .all() as AppliedMigration[];
}

/**
 * Applies the migrations not yet recorded, up to `upTo` (default: all), each in its own
 * immediate transaction with its record, so a crash leaves the schema at a whole step. A
 * migration recorded meanwhile by another process is skipped.
 * @returns the versions applied now.
 */
export function migrationsApply(
  db: Database.Database,
  upTo = schemaVersionLatest(),
  now = () => new Date(),
): number[] {
  db.exec(RECORD_TABLE);
  const applied: number[] = [];
  for (const m of migrationsKnown()) {
    if (m.version > upTo) break;
    const step = db.transaction(() => {
      if (db.prepare('SELECT 1 FROM schema_migration WHERE version = ?').get(m.version)) return false;
      db.exec(m.sql);
      db.prepare('INSERT INTO schema_migration (version, name, sha256, applied_at) VALUES (?, ?, ?, ?)').run(
        m.version,
        m.name,
        m.sha256,
        now().toISOString(),
      );
      db.pragma(`user_version = ${m.version}`);
      return true;
    });
    if (step.immediate()) applied.push(m.version);
  }
  return applied;
}
