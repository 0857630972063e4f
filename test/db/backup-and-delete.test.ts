import { existsSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { describe, expect, it } from 'vitest';
import { storeBackup } from '../../db/backup';
import { benchImport } from '../../db/bench-import';
import { storeCheck } from '../../db/check';
import { damperUnitList } from '../../db/queries/damper-unit';
import { storeEventList } from '../../db/queries/store-event';
import { vehicleList } from '../../db/queries/vehicle';
import { storeClose, storeOpen } from '../../db/store';
import { vehicleDeleteWithBackup } from '../../db/vehicle-delete';
import { freshStore, setupSaved, storeDigest, tempFolder, vehicleAdded } from './store-fixture';

describe('storeBackup', () => {
  it('writes a checked, complete copy while the database stays open, and records it', async () => {
    const dir = tempFolder();
    const store = storeOpen(join(dir, 'shop.sqlite'));
    setupSaved(store, vehicleAdded(store));
    const other = storeOpen(join(dir, 'shop.sqlite'));
    vehicleAdded(other, 'Written by the other program');
    const result = await storeBackup(store, join(dir, 'copies', 'monday.sqlite'));
    expect(result.counts).toEqual({ vehicles: 2, revisions: 1, dampers: 2, benchRuns: 0 });
    // One self-contained file: no partial file, no write-ahead log beside it.
    expect(readdirSync(join(dir, 'copies'))).toEqual(['monday.sqlite']);
    const copy = new Database(result.path, { readonly: true });
    expect(copy.pragma('journal_mode', { simple: true })).toBe('delete');
    expect(copy.pragma('integrity_check', { simple: true })).toBe('ok');
    expect(copy.prepare('SELECT count(*) FROM setup_corner').pluck().get()).toBe(4);
    copy.close();
    expect(storeEventList(store.db)[0]?.kind).toBe('backup');
    storeClose(other);
    storeClose(store);
  });

  it('keeps an existing file unless told to replace it, and never writes over the database itself', async () => {
    const dir = tempFolder();
    const store = storeOpen(join(dir, 'shop.sqlite'));
    const target = join(dir, 'keep.sqlite');
    writeFileSync(target, 'an older backup');
    await expect(storeBackup(store, target)).rejects.toThrow(/already exists/);
    await expect(storeBackup(store, join(dir, 'shop.sqlite'), { overwrite: true })).rejects.toThrow(
      /is the database itself/,
    );
    await expect(storeBackup(store, dir)).rejects.toThrow(/is a folder/);
    await storeBackup(store, target, { overwrite: true });
    expect(new Database(target, { readonly: true }).pragma('integrity_check', { simple: true })).toBe('ok');
    storeClose(store);
  });

  it('backs up an in-memory database too', async () => {
    const store = freshStore();
    vehicleAdded(store);
    const r = await storeBackup(store, join(tempFolder(), 'mem.sqlite'));
    expect(r.counts.vehicles).toBe(1);
  });
});

describe('vehicleDeleteWithBackup', () => {
  it('backs up first, then deletes the vehicle and its revisions only; the bench library stays', async () => {
    const dir = tempFolder();
    const store = storeOpen(join(dir, 'shop.sqlite'));
    const coupe = vehicleAdded(store, 'Coupe');
    setupSaved(store, coupe);
    setupSaved(store, coupe, (r) => (r.fuelLoad = '5 kg'));
    setupSaved(store, vehicleAdded(store, 'Seater'));
    benchImport(store, { damper: 'T-1', text: 'velocity,force\n0.1,1\n0.2,2\n0.3,3\n', sourceName: 'x.csv' });
    const result = await vehicleDeleteWithBackup(store, coupe);
    expect(result.revisionsDeleted).toBe(2);
    expect(vehicleList(store.db).map((v) => v.name)).toEqual(['Seater']);
    expect(damperUnitList(store.db).map((d) => [d.label, d.run_count])).toEqual([
      ['T-1', 1],
      ['T-2', 0],
    ]);
    expect(storeCheck(store).ok).toBe(true);
    expect(existsSync(result.backupPath)).toBe(true);
    expect(result.backupPath).toMatch(/backups[/\\]shop-\d{8}T\d{6}Z-before-deleting-coupe\.sqlite$/);
    const backup = new Database(result.backupPath, { readonly: true });
    expect(
      backup
        .prepare(
          "SELECT count(*) FROM setup_revision r JOIN vehicle v ON v.id = r.vehicle_id WHERE v.name = 'Coupe'",
        )
        .pluck()
        .get(),
    ).toBe(2);
    backup.close();
    expect(storeEventList(store.db)[0]?.detail).toContain(result.backupPath);
    storeClose(store);
  });

  it('deletes nothing when no backup can be made', async () => {
    const store = storeOpen(':memory:');
    const v = vehicleAdded(store);
    setupSaved(store, v);
    const before = storeDigest(store);
    await expect(vehicleDeleteWithBackup(store, v)).rejects.toThrow(/no backup folder/);
    expect(storeDigest(store)).toBe(before);
    storeClose(store);
  });
});

describe('storeCheck', () => {
  it('passes a sound database', () => {
    const store = freshStore();
    setupSaved(store, vehicleAdded(store));
    expect(storeCheck(store)).toMatchObject({
      ok: true,
      problems: [],
      counts: { vehicles: 1, revisions: 1, dampers: 2 },
    });
  });

  it('finds damaged points, a missing corner and a broken foreign key', () => {
    const store = freshStore();
    const saved = setupSaved(store, vehicleAdded(store));
    benchImport(store, { damper: 'T-1', text: 'velocity,force\n0.1,1\n0.2,2\n0.3,3\n', sourceName: 'x.csv' });
    // Damage the file the way a disk or another program might, past the schema's guards.
    store.db.exec(
      'DROP TRIGGER bench_run_immutable; DROP TRIGGER setup_corner_kept; DROP TRIGGER setup_corner_immutable; PRAGMA foreign_keys = OFF;',
    );
    store.db.prepare('UPDATE bench_run SET points = zeroblob(48)').run();
    store.db
      .prepare("DELETE FROM setup_corner WHERE position = 'RR' AND revision_id = ?")
      .run(saved.revision.id);
    store.db
      .prepare("INSERT INTO damper_unit (id, label, label_key, created_at) VALUES (50, 'X', 'x', 'now')")
      .run();
    store.db
      .prepare('UPDATE setup_corner SET damper_unit_id = 99 WHERE position = ? AND revision_id = ?')
      .run('FL', saved.revision.id);
    const report = storeCheck(store);
    expect(report.ok).toBe(false);
    expect(report.problems).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/bench run #1: the points do not match their checksum/),
        expect.stringMatching(/revision Test coupe@1 has 3 corners, not 4/),
        expect.stringMatching(/foreign key: setup_corner .* damper_unit/),
      ]),
    );
  });
});
