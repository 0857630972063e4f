import type Database from 'better-sqlite3';
import type { StoreEventRow } from '../rows';
import { statement } from '../statement';

export function storeEventInsert(db: Database.Database, e: Omit<StoreEventRow, 'id'>): void {
  statement(db, 'INSERT INTO store_event (at, kind, detail) VALUES (@at, @kind, @detail)').run(e);
}

export function storeEventList(db: Database.Database, limit = 100): StoreEventRow[] {
  return statement(db, 'SELECT * FROM store_event ORDER BY id DESC LIMIT ?').all(limit) as StoreEventRow[];
}
