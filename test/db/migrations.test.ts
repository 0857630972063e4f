import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../core/units/input-error';
import { migrationsApplied, migrationsKnown, schemaVersionLatest } from '../../db/migrations';
import { storeClose, storeOpen } from '../../db/store';
import { freshStore, tempFolder } from './store-fixture';

const fileHash = (path: string) => createHash('sha256').update(readFileSync(path)).digest('hex');

describe('migrations', () => {
  it('numbers the migrations 1, 2, … and records each one applied, with its checksum', () => {
    const known = migrationsKnown();
    expect(known.map((m) => m.version)).toEqual(known.map((_, i) => i + 1));
    expect(schemaVersionLatest()).toBeGreaterThanOrEqual(2);
    const store = freshStore();
    const applied = migrationsApplied(store.db);
    expect(applied.map((a) => [a.version, a.sha256])).toEqual(known.map((m) => [m.version, m.sha256]));
    expect(store.db.pragma('user_version', { simple: true })).toBe(schemaVersionLatest());
  });

  it('gives the same checksum to a migration checked out with CRLF line endings', () => {
    const m = migrationsKnown()[0];
    const crlf = m?.sql.replace(/\n/g, '\r\n') ?? '';
    expect(createHash('sha256').update(crlf.replace(/\r\n/g, '\n')).digest('hex')).toBe(m?.sha256);
  });

  it('upgrades a database made by migration 1 to the current schema with its data intact, keeping a copy first', () => {
    const dir = tempFolder();
    const path = join(dir, 'old.sqlite');
    // The fixture is made by the code at step 1: the program's own migration 1, nothing later.
    const old = storeOpen(path, { migrateTo: 1 });
    expect(migrationsApplied(old.db).map((a) => a.version)).toEqual([1]);
    const analysis = JSON.stringify({ cornerMass: 295, springRate: 70000 });
    old.db.exec(`
      INSERT INTO vehicle (id, name, name_key, kind, notes, created_at) VALUES (1, 'Coupe', 'coupe', 'sprint', '', '2025-01-01');
      INSERT INTO damper_unit (id, label, label_key, created_at) VALUES (1, 'D-1', 'd-1', '2025-01-01');
      INSERT INTO setup_revision (id, vehicle_id, number, name, summary, saved_at) VALUES (1, 1, 1, 'Base', 'first setup', '2025-01-02');
      INSERT INTO bench_run (damper_unit_id, source_kind, source_sha256, point_count, points, points_sha256, fit_json, imported_at)
        VALUES (1, 'points', 'x', 1, zeroblob(16), 'y', '{}', '2025-01-03');`);
    for (const p of ['FL', 'FR', 'RL', 'RR'])
      old.db
        .prepare(
          'INSERT INTO setup_corner (revision_id, position, analysis_json, damper_unit_id) VALUES (1, ?, ?, 1)',
        )
        .run(p, analysis);
    // Schema 1 keeps revisions with no way to delete them.
    expect(() => old.db.prepare('DELETE FROM setup_revision').run()).toThrow(/never deleted/);
    storeClose(old);

    const store = storeOpen(path);
    expect(migrationsApplied(store.db).map((a) => a.version)).toEqual(
      migrationsKnown().map((m) => m.version),
    );
    const v = store.db.prepare('SELECT name, kind, deleting FROM vehicle').get();
    expect(v).toEqual({ name: 'Coupe', kind: 'sprint', deleting: 0 });
    expect(store.db.prepare('SELECT count(*) FROM setup_corner').pluck().get()).toBe(4);
    expect(store.db.prepare('SELECT spring_rate FROM setup_corner LIMIT 1').pluck().get()).toBe(70000);
    expect(store.db.prepare('SELECT length(points) FROM bench_run').pluck().get()).toBe(16);
    expect(store.db.prepare('SELECT count(*) FROM store_event').pluck().get()).toBe(0);
    storeClose(store);
    const copies = readdirSync(join(dir, 'backups'));
    expect(copies).toHaveLength(1);
    expect(copies[0]).toMatch(/^old-\d{8}T\d{6}Z-before-schema-\d+\.sqlite$/);
    const copy = new Database(join(dir, 'backups', copies[0] as string), { readonly: true });
    expect(copy.prepare('SELECT max(version) FROM schema_migration').pluck().get()).toBe(1);
    copy.close();
  });

  it('refuses a database of a newer schema and leaves the file as it was', () => {
    const dir = tempFolder();
    const path = join(dir, 'newer.sqlite');
    const made = storeOpen(path);
    made.db
      .prepare(
        "INSERT INTO schema_migration (version, name, sha256, applied_at) VALUES (?, 'from-the-future', 'x', '2030-01-01')",
      )
      .run(schemaVersionLatest() + 1);
    storeClose(made);
    const before = fileHash(path);
    let error: unknown;
    try {
      storeOpen(path);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(InputError);
    expect((error as Error).message).toMatch(
      new RegExp(
        `newer RideLedger \\(schema version ${schemaVersionLatest() + 1}; this program knows up to ${schemaVersionLatest()}\\).*nothing was changed`,
      ),
    );
    expect(fileHash(path)).toBe(before);
    expect(readdirSync(dir)).toEqual(['newer.sqlite']);
  });

  it('refuses a database whose recorded step differs from the program’s', () => {
    const dir = tempFolder();
    const path = join(dir, 'other-build.sqlite');
    const made = storeOpen(path);
    made.db.prepare("UPDATE schema_migration SET sha256 = 'changed' WHERE version = 1").run();
    storeClose(made);
    expect(() => storeOpen(path)).toThrow(/records schema step 1 .* differently/);
  });

  it('refuses a file that is not SQLite, and an SQLite file of another program, touching neither', () => {
    const dir = tempFolder();
    const text = join(dir, 'notes.sqlite');
    writeFileSync(text, 'velocity,force\n'.repeat(400));
    const textHash = fileHash(text);
    expect(() => storeOpen(text)).toThrow(/is not an SQLite database.*nothing was changed/);
    expect(fileHash(text)).toBe(textHash);
    const foreign = join(dir, 'foreign.sqlite');
    const db = new Database(foreign);
    db.exec('CREATE TABLE customers (id INTEGER PRIMARY KEY, name TEXT)');
    db.close();
    const foreignHash = fileHash(foreign);
    expect(() => storeOpen(foreign)).toThrow(/another program.*no RideLedger schema record/);
    expect(fileHash(foreign)).toBe(foreignHash);
  });

  it('applies nothing twice when two programs open a new file one after the other', () => {
    const path = join(tempFolder(), 'shared.sqlite');
    const a = storeOpen(path);
    const b = storeOpen(path);
    expect(migrationsApplied(b.db)).toHaveLength(schemaVersionLatest());
    storeClose(a);
    storeClose(b);
  });
});
