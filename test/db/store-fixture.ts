import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { onTestFinished } from 'vitest';
import { setupFileParse } from '../../core/setup/setup-file';
import { vehicleInsert } from '../../db/queries/vehicle';
import type { VehicleRow } from '../../db/rows';
import { setupSave } from '../../db/setup-store';
import { storeClose, storeOpen, type Store } from '../../db/store';
import { vehicleResolve } from '../../db/vehicle-ref';
import { setupFileFixture } from '../core/setup-fixture';

/** A fresh in-memory database with every migration applied, closed when the test ends. */
export function freshStore(): Store {
  const store = storeOpen(':memory:');
  onTestFinished(() => storeClose(store));
  return store;
}

/** A temporary folder removed when the test ends. */
export function tempFolder(): string {
  const dir = mkdtempSync(join(tmpdir(), 'rideledger-test-'));
  onTestFinished(() => rmSync(dir, { recursive: true, force: true }));
  return dir;
}

/** A digest of every row of every table: equal digests mean the stored data did not change. */
export function storeDigest(store: Store): string {
  const hash = createHash('sha256');
  const tables = store.db
    .prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name")
    .pluck()
    .all() as string[];
  for (const t of tables) {
    hash.update(`#${t}\n`);
    for (const row of store.db.prepare(`SELECT * FROM "${t}" ORDER BY rowid`).raw().iterate())
      hash.update(JSON.stringify(row, (_k, v: unknown) => (Buffer.isBuffer(v) ? v.toString('base64') : v)));
  }
  return hash.digest('hex');
}

/** Adds a vehicle by name. */
export function vehicleAdded(store: Store, name = 'Test coupe'): VehicleRow {
  vehicleInsert(store.db, {
    name,
    name_key: name.toLowerCase(),
    kind: 'club coupe',
    notes: '',
    created_at: '2025-01-01T00:00:00.000Z',
  });
  return vehicleResolve(store.db, name);
}

/** Saves the fixture setup, changed by `change`, as the next revision; its damper labels are declared new. */
export function setupSaved(
  store: Store,
  vehicle: VehicleRow,
  change: (raw: ReturnType<typeof setupFileFixture>) => void = () => {},
) {
  const raw = setupFileFixture();
  change(raw);
  const sheet = setupFileParse(raw).sheet;
  const labels = Object.values(sheet.corners)
    .map((c) => c.damperUnit)
    .filter((l) => l !== '');
  return setupSave(store, vehicle, sheet, { newDamperUnits: labels });
}
