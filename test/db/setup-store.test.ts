import { describe, expect, it } from 'vitest';
import { setupFileParse } from '../../core/setup/setup-file';
import { damperUnitList } from '../../db/queries/damper-unit';
import { setupRevisionList } from '../../db/queries/setup-revision';
import { setupRevisionResolve, setupSave, setupSheetRead } from '../../db/setup-store';
import { setupFileFixture } from '../core/setup-fixture';
import { freshStore, setupSaved, storeDigest, vehicleAdded } from './store-fixture';

describe('setupSave', () => {
  it('makes a new numbered revision each time, linked to the newest, and never changes an old one', () => {
    const store = freshStore();
    const v = vehicleAdded(store);
    const first = setupSaved(store, v);
    const firstSheet = setupSheetRead(store.db, first.revision);
    const second = setupSaved(store, v, (r) => (r.corners.FL.corner.springRate = '80 N/mm'));
    const third = setupSaved(store, v, (r) => (r.name = 'Same again'));
    expect([first.revision.number, second.revision.number, third.revision.number]).toEqual([1, 2, 3]);
    expect([first.parentNumber, second.parentNumber, third.parentNumber]).toEqual([null, 1, 2]);
    expect(first.revision.summary).toBe('first setup');
    expect(second.revision.summary).toBe('spring rate FL 70→80 N/mm');
    expect(third.revision.summary).toBe('spring rate FL 80→70 N/mm');
    expect(setupSheetRead(store.db, setupRevisionResolve(store.db, v, 1))).toEqual(firstSheet);
    expect(setupRevisionList(store.db, v.id)).toHaveLength(3);
  });

  it('reads back exactly the sheet it saved, numbers bit for bit', () => {
    const store = freshStore();
    const sheet = setupFileParse(setupFileFixture()).sheet;
    (sheet.corners.RR.analysis as { springRate: number }).springRate = (450 * 4.4482216152605) / 0.0254; // 450 lbf/in, not a short decimal
    const saved = setupSave(store, vehicleAdded(store), sheet, { newDamperUnits: ['T-1', 'T-2'] });
    expect(setupSheetRead(store.db, saved.revision)).toEqual(sheet);
  });

  it('branches from an older revision when asked, and says so', () => {
    const store = freshStore();
    const v = vehicleAdded(store);
    setupSaved(store, v);
    setupSaved(store, v, (r) => (r.fuelLoad = '10 kg'));
    const raw = setupFileFixture();
    raw.fuelLoad = '40 kg';
    const branch = setupSave(store, v, setupFileParse(raw).sheet, { parentNumber: 1 });
    expect(branch.revision.number).toBe(3);
    expect(branch.parentNumber).toBe(1);
    expect(branch.branched).toBe(true);
    expect(branch.revision.summary).toBe('fuel load 25→40 kg');
  });

  it('refuses a sheet that is its parent’s exactly, and stores nothing', () => {
    const store = freshStore();
    const v = vehicleAdded(store);
    setupSaved(store, v);
    setupSaved(store, v, (r) => (r.fuelLoad = '10 kg'));
    const before = storeDigest(store);
    const same = setupFileParse(setupFileFixture()).sheet;
    expect(() => setupSave(store, v, same, { parentNumber: 1 })).toThrow(
      /^file: nothing differs from revision 1, so nothing was saved/,
    );
    expect(storeDigest(store)).toBe(before);
    // The same sheet for another event is a record of its own.
    const raw = setupFileFixture();
    raw.event = 'Round 2';
    expect(setupSave(store, v, setupFileParse(raw).sheet, { parentNumber: 1 }).revision.summary).toBe(
      'no setup changes',
    );
  });

  it('refuses a parent that does not exist and stores nothing', () => {
    const store = freshStore();
    const v = vehicleAdded(store);
    setupSaved(store, v);
    const before = storeDigest(store);
    expect(() => setupSave(store, v, setupFileParse(setupFileFixture()).sheet, { parentNumber: 7 })).toThrow(
      /basedOnRevision: "Test coupe" has no revision 7; its revisions are 1 to 1/,
    );
    expect(storeDigest(store)).toBe(before);
  });

  it('adds new damper labels to the library once, matching labels regardless of case', () => {
    const store = freshStore();
    const v = vehicleAdded(store);
    const saved = setupSaved(store, v, (r) => {
      r.corners.FR.damperUnit = 't-1';
      r.corners.RR.damperUnit = 'Ünit Ω';
    });
    expect(saved.dampersCreated).toEqual(['T-1', 'T-2', 'Ünit Ω']);
    expect(damperUnitList(store.db).map((d) => d.label)).toEqual(['T-1', 'T-2', 'Ünit Ω']);
    expect(setupSaved(store, v).dampersCreated).toEqual([]);
  });

  it('refuses a damper label the library lacks, listing the known ones, and stores nothing', () => {
    const store = freshStore();
    const v = vehicleAdded(store);
    setupSaved(store, v);
    const before = storeDigest(store);
    const raw = setupFileFixture();
    raw.corners.RL.damperUnit = 'T-22';
    const sheet = setupFileParse(raw).sheet;
    expect(() => setupSave(store, v, sheet)).toThrow(
      /^corners\.RL\.damperUnit: damper unit "T-22" is not in the library \(the library has "T-1", "T-2"\); check the spelling, or name it as a new damper unit/,
    );
    expect(storeDigest(store)).toBe(before);
    expect(damperUnitList(store.db).map((d) => d.label)).toEqual(['T-1', 'T-2']);
  });

  it('refuses a damper label on an empty library unless it is declared new', () => {
    const store = freshStore();
    const v = vehicleAdded(store);
    const sheet = setupFileParse(setupFileFixture()).sheet;
    expect(() => setupSave(store, v, sheet)).toThrow(/"T-1" is not in the library \(the library is empty\)/);
    expect(damperUnitList(store.db)).toEqual([]);
    const saved = setupSave(store, v, sheet, { newDamperUnits: ['t-1', 'T-2'] });
    expect(saved.dampersCreated).toEqual(['T-1', 'T-2']);
  });

  it('refuses a label declared new that no corner names, so a typo in the option is caught too', () => {
    const store = freshStore();
    const v = vehicleAdded(store);
    const sheet = setupFileParse(setupFileFixture()).sheet;
    expect(() => setupSave(store, v, sheet, { newDamperUnits: ['T-1', 'T-2', 'T-3'] })).toThrow(
      /^newDamperUnits: "T-3" is named as a new damper unit but no corner of the sheet uses it/,
    );
    expect(damperUnitList(store.db)).toEqual([]);
  });
});
