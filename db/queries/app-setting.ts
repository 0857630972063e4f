import type Database from 'better-sqlite3';
import type { AppSettingRow } from '../rows';
import { statement } from '../statement';

export function appSettingGet(db: Database.Database, key: string): AppSettingRow | undefined {
  return statement(db, 'SELECT * FROM app_setting WHERE key = ?').get(key) as AppSettingRow | undefined;
}

export function appSettingPut(db: Database.Database, row: AppSettingRow): void {
  statement(
    db,
    `INSERT INTO app_setting (key, value, updated_at) VALUES (@key, @value, @updated_at)
     ON CONFLICT (key) DO UPDATE SET value = excluded.value, updated_at = excluded.updated_at`,
  ).run(row);
}

export function appSettingDelete(db: Database.Database, key: string): boolean {
  return statement(db, 'DELETE FROM app_setting WHERE key = ?').run(key).changes > 0;
}

export function appSettingKeys(db: Database.Database, prefix: string): string[] {
  return statement(db, "SELECT key FROM app_setting WHERE key LIKE ? ESCAPE '\\' ORDER BY key")
    .pluck()
    .all(`${prefix.replace(/[\\%_]/g, (c) => `\\${c}`)}%`) as string[];
}
