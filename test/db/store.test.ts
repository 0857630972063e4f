import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { storeClose, storeOpen, storeTransaction } from '../../db/store';
import { freshStore, setupSaved, tempFolder, vehicleAdded } from './store-fixture';

describe('storeOpen', () => {
  it('opens a file in WAL mode with foreign keys on, a busy timeout and full sync', () => {
    const store = storeOpen(join(tempFolder(), 'a', 'b', 'shop.sqlite'));
    expect(store.created).toBe(true);
    expect(store.db.pragma('journal_mode', { simple: true })).toBe('wal');
    expect(store.db.pragma('foreign_keys', { simple: true })).toBe(1);
    expect(store.db.pragma('busy_timeout', { simple: true })).toBe(10_000);
    expect(store.db.pragma('synchronous', { simple: true })).toBe(2);
    storeClose(store);
  });

  it('refuses a folder as the database', () => {
    expect(() => storeOpen(tempFolder())).toThrow(/is a folder/);
  });

  it('lets a second connection read and write the same file while the first is open (desktop app and command)', () => {
    const path = join(tempFolder(), 'shared.sqlite');
    const app = storeOpen(path);
    const cli = storeOpen(path);
    vehicleAdded(app, 'Coupe');
    setupSaved(cli, vehicleAdded(cli, 'Seater'));
    expect(app.db.prepare('SELECT count(*) FROM setup_revision').pluck().get()).toBe(1);
    // A reader in a transaction does not block a writer in WAL mode.
    const read = app.db.transaction(() => {
      const before = app.db.prepare('SELECT count(*) FROM vehicle').pluck().get();
      vehicleAdded(cli, 'Third');
      return [before, app.db.prepare('SELECT count(*) FROM vehicle').pluck().get()];
    });
    expect(read()).toEqual([2, 2]); // a consistent snapshot inside the read
    expect(app.db.prepare('SELECT count(*) FROM vehicle').pluck().get()).toBe(3);
    storeClose(app);
    storeClose(cli);
  });

  it('makes a second writer wait for the lock and fail clearly only after the busy timeout', () => {
    const path = join(tempFolder(), 'locked.sqlite');
    const holder = storeOpen(path);
    const waiter = storeOpen(path, { busyTimeoutMs: 50 });
    holder.db.exec('BEGIN IMMEDIATE');
    const started = Date.now();
    expect(() => storeTransaction(waiter, () => vehicleAdded(waiter))).toThrow(
      expect.objectContaining({ code: 'SQLITE_BUSY' }),
    );
    expect(Date.now() - started).toBeGreaterThanOrEqual(40);
    holder.db.exec('ROLLBACK');
    expect(() => storeTransaction(waiter, () => vehicleAdded(waiter))).not.toThrow();
    storeClose(holder);
    storeClose(waiter);
  });
});

describe('the schema keeps revisions and bench runs as written', () => {
  it('refuses to change or delete a saved revision or its corners', () => {
    const store = freshStore();
    const saved = setupSaved(store, vehicleAdded(store));
    const id = saved.revision.id;
    expect(() => store.db.prepare("UPDATE setup_revision SET name = 'x' WHERE id = ?").run(id)).toThrow(
      /never changed/,
    );
    expect(() =>
      store.db.prepare('UPDATE setup_corner SET notes = ? WHERE revision_id = ?').run('x', id),
    ).toThrow(/never changed/);
    expect(() => store.db.prepare('DELETE FROM setup_corner WHERE revision_id = ?').run(id)).toThrow(
      /only with their vehicle/,
    );
    expect(() => store.db.prepare('DELETE FROM setup_revision WHERE id = ?').run(id)).toThrow(
      /only with their vehicle/,
    );
  });

  it('refuses a parent from another vehicle or a later revision', () => {
    const store = freshStore();
    const a = setupSaved(store, vehicleAdded(store, 'A'));
    const b = vehicleAdded(store, 'B');
    expect(() =>
      store.db
        .prepare(
          "INSERT INTO setup_revision (vehicle_id, number, parent_id, name, summary, saved_at) VALUES (?, 1, ?, 'x', '', 'now')",
        )
        .run(b.id, a.revision.id),
    ).toThrow(/parent must be an earlier revision of the same vehicle/);
  });

  it('refuses a corner that points to a missing damper unit (foreign keys on)', () => {
    const store = freshStore();
    const saved = setupSaved(store, vehicleAdded(store));
    expect(() =>
      store.db
        .prepare(
          "INSERT INTO bench_run (damper_unit_id, source_kind, source_sha256, point_count, points, points_sha256, fit_json, imported_at) VALUES (999, 'points', 'x', 0, x'', 'y', '{}', 'now')",
        )
        .run(),
    ).toThrow(/FOREIGN KEY/);
    expect(saved.revision.number).toBe(1);
  });

  it('refuses points whose length does not match their count', () => {
    const store = freshStore();
    store.db.prepare("INSERT INTO damper_unit (label, label_key, created_at) VALUES ('D', 'd', 'now')").run();
    expect(() =>
      store.db
        .prepare(
          "INSERT INTO bench_run (damper_unit_id, source_kind, source_sha256, point_count, points, points_sha256, fit_json, imported_at) VALUES (1, 'points', 'x', 2, zeroblob(16), 'y', '{}', 'now')",
        )
        .run(),
    ).toThrow(/CHECK constraint/);
  });
});
