import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../core/units/input-error';
import { RIDE_SCENARIO_DEFAULT } from '../../core/valving/ride-scenario';
import { bundleExport, bundleImport } from '../../db/bundle';
import { appSettingPut } from '../../db/queries/app-setting';
import { migrationsApplied, migrationsKnown } from '../../db/migrations';
import { storeClose, storeOpen, type Store } from '../../db/store';
import { vehicleScenarioRead, vehicleScenarioWrite } from '../../db/vehicle-scenario';
import { freshStore, setupSaved, storeDigest, tempFolder, vehicleAdded } from './store-fixture';

/** Every row of every table, by table: what a migration must keep. */
function rowsOf(store: Store): Record<string, unknown[]> {
  const out: Record<string, unknown[]> = {};
  const tables = store.db
    .prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name")
    .pluck()
    .all() as string[];
  for (const t of tables) out[t] = store.db.prepare(`SELECT * FROM "${t}" ORDER BY rowid`).all();
  return out;
}

describe('schema 4: the vehicle scenario', () => {
  it('upgrades a store of schema 3 losing nothing: every row kept, each vehicle without a scenario', () => {
    const path = join(tempFolder(), 'three.sqlite');
    const old = storeOpen(path, { migrateTo: 3 });
    expect(migrationsApplied(old.db).map((a) => a.version)).toEqual([1, 2, 3]);
    const v = vehicleAdded(old, 'Coupe');
    setupSaved(old, v);
    setupSaved(old, v, (raw) => {
      raw.name = 'softer';
    });
    vehicleAdded(old, 'Roadster');
    appSettingPut(old.db, { key: 'units', value: '"us"', updated_at: '2026-01-01T00:00:00.000Z' });
    const before = rowsOf(old);
    storeClose(old);

    const store = storeOpen(path);
    expect(migrationsApplied(store.db).map((a) => a.version)).toEqual(
      migrationsKnown().map((m) => m.version),
    );
    const after = rowsOf(store);
    expect(Object.keys(after).sort()).toEqual(Object.keys(before).sort());
    for (const t of Object.keys(before)) {
      if (t === 'schema_migration') {
        expect(after[t]?.slice(0, 3)).toEqual(before[t]);
        continue;
      }
      const kept = (after[t] ?? []).map((row) => {
        if (t !== 'vehicle') return row;
        const { scenario_json, scenario_updated_at, ...rest } = row as Record<string, unknown>;
        expect(scenario_json).toBeNull();
        expect(scenario_updated_at).toBeNull();
        return rest;
      });
      expect(kept).toEqual(before[t]);
    }
    const coupe = store.db.prepare("SELECT id FROM vehicle WHERE name = 'Coupe'").pluck().get() as number;
    expect(vehicleScenarioRead(store.db, coupe)).toEqual({
      scenario: RIDE_SCENARIO_DEFAULT,
      stored: false,
      updatedAt: null,
    });
    storeClose(store);
  });

  it('stores a scenario SI, reads it back exactly, and refuses a bad one leaving the store as it was', () => {
    const store = freshStore();
    const v = vehicleAdded(store);
    const set = vehicleScenarioWrite(
      store.db,
      v.id,
      { road: { class: 'D', speed: '45 mph' }, curb: { height: '2 in' } },
      new Date('2026-12-02T10:00:00Z'),
    );
    expect(set.stored).toBe(true);
    expect(set.updatedAt).toBe('2026-12-02T10:00:00.000Z');
    // 1 mi = 1609.344 m, 1 in = 0.0254 m exactly (NIST SP 811, appendix B) [pub]
    expect(set.scenario.road.speed).toBeCloseTo((45 * 1609.344) / 3600, 12);
    expect(set.scenario.curb.height).toBeCloseTo(0.0508, 15);
    expect(vehicleScenarioRead(store.db, v.id).scenario).toEqual(set.scenario);
    const before = storeDigest(store);
    expect(() => vehicleScenarioWrite(store.db, v.id, { bump: { length: '0 m' } })).toThrow(InputError);
    expect(() => vehicleScenarioWrite(store.db, v.id, 'class C')).toThrow(/^scenario: expected an object/);
    expect(storeDigest(store)).toBe(before);
    expect(() =>
      store.db.prepare("UPDATE vehicle SET scenario_json = 'not json' WHERE id = ?").run(v.id),
    ).toThrow(/CHECK constraint/);
  });

  it('reads a stored scenario with a part it cannot use as the starting scenario’s part', () => {
    const store = freshStore();
    const v = vehicleAdded(store);
    store.db.prepare('UPDATE vehicle SET scenario_json = ? WHERE id = ?').run(
      JSON.stringify({
        road: { roadClass: 'Z', speed: 20 },
        bump: { height: 0.03, length: 0.5, speed: 10 },
      }),
      v.id,
    );
    const read = vehicleScenarioRead(store.db, v.id);
    expect(read.stored).toBe(true);
    expect(read.scenario.road).toEqual(RIDE_SCENARIO_DEFAULT.road);
    expect(read.scenario.bump).toEqual({ height: 0.03, length: 0.5, speed: 10 });
    expect(read.scenario.curb).toEqual(RIDE_SCENARIO_DEFAULT.curb);
  });
});

describe('a bundle carries the vehicle scenario', () => {
  it('exports a stored scenario and imports it with the vehicle; a bundle without one imports with none', () => {
    const from = freshStore();
    const v = vehicleAdded(from, 'Coupe');
    setupSaved(from, v);
    const none = bundleExport(from, 'Coupe');
    expect(none.scenario).toBeUndefined();
    vehicleScenarioWrite(from.db, v.id, {
      road: { class: 'E', speed: '35 km/h' },
      bump: { height: '60 mm' },
    });
    const bundle = bundleExport(from, 'Coupe');
    expect(bundle.scenario?.road).toEqual({ roadClass: 'E', speed: 35 / 3.6 });
    const to = freshStore();
    bundleImport(to, bundle);
    const id = to.db.prepare("SELECT id FROM vehicle WHERE name = 'Coupe'").pluck().get() as number;
    expect(vehicleScenarioRead(to.db, id)).toMatchObject({ scenario: bundle.scenario, stored: true });
    bundleImport(to, none, { asName: 'Coupe 2' });
    const id2 = to.db.prepare("SELECT id FROM vehicle WHERE name = 'Coupe 2'").pluck().get() as number;
    expect(vehicleScenarioRead(to.db, id2).stored).toBe(false);
  });

  it('refuses a bundle whose scenario does not read, naming the field, and stores nothing', () => {
    const from = freshStore();
    const v = vehicleAdded(from, 'Coupe');
    setupSaved(from, v);
    vehicleScenarioWrite(from.db, v.id, { bump: { height: '30 mm' } });
    const bundle = bundleExport(from, 'Coupe');
    const bad = {
      ...bundle,
      scenario: { ...bundle.scenario!, bump: { ...bundle.scenario!.bump, height: -0.01 } },
    };
    const to = freshStore();
    const before = storeDigest(to);
    expect(() => bundleImport(to, bad)).toThrow(/^scenario\.bump\.height: must be greater than zero/);
    expect(storeDigest(to)).toBe(before);
  });
});
