import type Database from 'better-sqlite3';

const cache = new WeakMap<Database.Database, Map<string, Database.Statement>>();

/** A prepared statement for `sql` on `db`, prepared once per connection. */
export function statement(db: Database.Database, sql: string): Database.Statement {
  let byText = cache.get(db);
  if (!byText) {
    byText = new Map();
    cache.set(db, byText);
  }
  let s = byText.get(sql);
  if (!s) {
    s = db.prepare(sql);
    byText.set(sql, s);
  }
  return s;
}
