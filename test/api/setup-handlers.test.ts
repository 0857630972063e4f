import { describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { CAUTION_TEXT } from '../../core/safety/caution';
import { damperUnitEnsure } from '../../db/damper-units';
import { setupFileFixture } from '../core/setup-fixture';
import { storeDigest } from '../db/store-fixture';
import { freshContext } from './api-fixture';

async function withCoupe() {
  const ctx = freshContext();
  await apiCall('vehicleAdd', { name: 'Test coupe', kind: 'club sprint coupe' }, ctx);
  // The fixture's damper units are in the library, as a shop's would be after its bench runs.
  for (const label of ['T-1', 'T-2'])
    damperUnitEnsure(ctx.store.db, label, undefined, '2025-01-01T00:00:00Z');
  return ctx;
}

describe('vehicles', () => {
  it('keeps unicode names and lists vehicles with their revision counts', async () => {
    const ctx = await withCoupe();
    await apiCall('vehicleAdd', { name: 'Équipe Ω «Ærø» №7 速い', notes: 'two\nlines' }, ctx);
    const list = await apiCall('vehicleList', {}, ctx);
    expect(list.vehicles.map((v) => [v.name, v.revisionCount])).toEqual([
      ['Test coupe', 0],
      ['Équipe Ω «Ærø» №7 速い', 0],
    ]);
    const shown = await apiCall('vehicleShow', { vehicle: 'équipe ω «ærø» №7 速い' }, ctx);
    expect(shown.vehicle.notes).toBe('two\nlines');
  });

  const duplicates: [string, string][] = [
    ['the same name', 'Test coupe'],
    ['another case', 'TEST COUPE'],
    ['other spacing', '  Test   coupe '],
  ];
  for (const [what, name] of duplicates) {
    it(`refuses a second vehicle of ${what}, storing nothing`, async () => {
      const ctx = await withCoupe();
      const before = storeDigest(ctx.store);
      await expect(apiCall('vehicleAdd', { name }, ctx)).rejects.toThrow(/^name: .*nothing was added/);
      expect(storeDigest(ctx.store)).toBe(before);
    });
  }

  it('treats the two unicode spellings of one name as one name', async () => {
    const ctx = freshContext();
    await apiCall('vehicleAdd', { name: 'Ærø Renée'.normalize('NFC') }, ctx);
    await expect(apiCall('vehicleAdd', { name: 'Ærø Renée'.normalize('NFD') }, ctx)).rejects.toThrow(
      /already exists/,
    );
  });

  const badNames: [string, unknown, RegExp][] = [
    ['empty', '  ', /^name: is empty/],
    ['missing', undefined, /^name: is missing/],
    ['a number', 42, /^name: got number; expected a text/],
    ['with @', 'Coupe@2', /separates a name from a revision number/],
    ['with a control character', 'Cou\u0000pe', /control character/],
    ['two lines', 'Cou\npe', /one line/],
    ['too long', 'x'.repeat(121), /at most 120/],
  ];
  for (const [what, name, message] of badNames) {
    it(`refuses a name ${what}`, async () => {
      await expect(apiCall('vehicleAdd', { name }, freshContext())).rejects.toThrow(message);
    });
  }
});

describe('setups through the API', () => {
  it('diffs a change of one spring rate as that field and the changed ride figures of that corner, nothing else', async () => {
    const ctx = await withCoupe();
    await apiCall('setupSave', { file: setupFileFixture() }, ctx);
    const stiffer = setupFileFixture();
    stiffer.corners.RL.corner.springRate = '66 N/mm';
    const saved = await apiCall('setupSave', { file: stiffer }, ctx);
    expect(saved.revision.summary).toBe('spring rate RL 60→66 N/mm');
    const d = await apiCall(
      'setupDiff',
      { a: { vehicle: 'Test coupe', revision: 1 }, b: { vehicle: 'Test coupe', revision: 2 } },
      ctx,
    );
    expect(d.fields).toEqual([
      {
        field: 'corners.RL.corner.springRate',
        label: 'spring rate',
        position: 'RL',
        before: '60',
        after: '66',
        unit: 'N/mm',
      },
    ]);
    expect(d.figures.every((f) => f.position === 'RL')).toBe(true);
    const ride = d.figures.find((f) => f.figure === 'rideFrequencyHz');
    // [calc] kw = k·MR² (Milliken ch. 16 [mem]), kr = kw·kt/(kw+kt) (Gillespie ch. 5 [mem]), f = √(kr/ms)/2π; ms = 265 − 40 kg.
    const f = (k: number) => {
      const kw = k * 0.85 ** 2;
      return Math.sqrt((kw * 240_000) / (kw + 240_000) / 225) / (2 * Math.PI);
    };
    expect(ride?.before).toBeCloseTo(f(60_000), 12);
    expect(ride?.after).toBeCloseTo(f(66_000), 12);
    expect(d.caution).toBe(CAUTION_TEXT);
  });

  it('writes the line saying what changed in the units the sheet was entered in', async () => {
    const ctx = await withCoupe();
    const file = setupFileFixture();
    file.corners.FL.corner.springRate = '400 lbf/in';
    await apiCall('setupSave', { file, units: 'us' }, ctx);
    file.corners.FL.corner.springRate = '500 lbf/in';
    const us = await apiCall('setupSave', { file, units: 'us' }, ctx);
    expect(us.revision.summary).toBe('spring rate FL 400→500 lbf/in');
    // The same change saved from SI: 500 → 450 lbf/in is 87.5634 → 78.8071 N/mm (1 lbf/in = 0.175127 N/mm) [calc].
    file.corners.FL.corner.springRate = '450 lbf/in';
    const si = await apiCall('setupSave', { file }, ctx);
    expect(si.revision.summary).toBe('spring rate FL 87.6→78.8 N/mm');
    // Stored SI either way: the diff of the two is the same in any units.
    const d = await apiCall(
      'setupDiff',
      { a: { vehicle: 'Test coupe', revision: 1 }, b: { vehicle: 'Test coupe', revision: 2 }, units: 'us' },
      ctx,
    );
    expect(d.fields.map((f) => [f.before, f.after, f.unit])).toEqual([['400', '500', 'lbf/in']]);
  });

  it('shows a revision as a setup file whose unchanged save is refused: the round trip is exact', async () => {
    const ctx = await withCoupe();
    await apiCall('setupSave', { file: setupFileFixture() }, ctx);
    await apiCall('setupSave', { file: { ...setupFileFixture(), name: 'Later' } }, ctx);
    const shown = await apiCall('setupShow', { vehicle: 'Test coupe', revision: 1, units: 'us' }, ctx);
    expect(shown.file.basedOnRevision).toBe(1);
    expect(shown.caution).toBe(CAUTION_TEXT);
    expect(shown.figures.FL.rideFrequencyHz).toBeGreaterThan(1.5);
    // Written in US units and read back, nothing differs from revision 1, so the save is refused.
    const before = storeDigest(ctx.store);
    await expect(apiCall('setupSave', { file: shown.file }, ctx)).rejects.toThrow(
      /^file: nothing differs from revision 1, so nothing was saved/,
    );
    expect(storeDigest(ctx.store)).toBe(before);
    const again = await apiCall('setupSave', { file: { ...shown.file, name: 'Again' } }, ctx);
    expect(again.revision).toMatchObject({ number: 3, parent: 1, summary: 'no setup changes' });
    expect(again.branched).toBe(true);
    const d = await apiCall(
      'setupDiff',
      { a: { vehicle: 'Test coupe', revision: 1 }, b: { vehicle: 'Test coupe' } },
      ctx,
    );
    expect(d.fields.map((f) => f.field)).toEqual(['name']);
    expect(d.figures).toEqual([]);
  });

  it('names the vehicle problem and saves nothing', async () => {
    const ctx = await withCoupe();
    const before = storeDigest(ctx.store);
    const noVehicle = setupFileFixture();
    delete noVehicle.vehicle;
    await expect(apiCall('setupSave', { file: noVehicle }, ctx)).rejects.toThrow(
      /^vehicle: say which vehicle/,
    );
    await expect(
      apiCall('setupSave', { file: { ...setupFileFixture(), vehicle: 'Nope' } }, ctx),
    ).rejects.toThrow(/no vehicle named "Nope"; vehicles: "Test coupe"/);
    await apiCall('vehicleAdd', { name: 'Other' }, ctx);
    const after = storeDigest(ctx.store);
    await expect(apiCall('setupSave', { file: setupFileFixture(), vehicle: 'Other' }, ctx)).rejects.toThrow(
      /the file is for "Test coupe" but the vehicle given is "Other"/,
    );
    await expect(
      apiCall('setupSave', { file: { ...setupFileFixture(), basedOnRevision: 4 } }, ctx),
    ).rejects.toThrow(/^basedOnRevision: "Test coupe" has no setup saved yet/);
    await expect(
      apiCall('setupSave', { file: { ...setupFileFixture(), fuelLoad: '20 kPa' } }, ctx),
    ).rejects.toThrow(/^fuelLoad: got "20 kPa" \(a pressure\)/);
    expect(storeDigest(ctx.store)).toBe(after);
    expect(after).not.toBe(before);
  });

  it('lists the history with parents and summaries, oldest first', async () => {
    const ctx = await withCoupe();
    await apiCall('setupSave', { file: setupFileFixture() }, ctx);
    const wet = setupFileFixture();
    wet.name = 'Wet';
    wet.event = 'Round 2';
    for (const p of ['FL', 'FR', 'RL', 'RR'] as const) wet.corners[p].tirePressureCold = '1.9 bar';
    await apiCall('setupSave', { file: wet }, ctx);
    const h = await apiCall('setupHistory', { vehicle: 'test coupe' }, ctx);
    expect(h.revisions.map((r) => [r.number, r.parent, r.event, r.name, r.summary])).toEqual([
      [1, null, 'Test day', 'Baseline', 'first setup'],
      [2, 1, 'Round 2', 'Wet', 'cold pressure all corners 170→190 kPa'],
    ]);
  });

  it('carries the model warnings for a corner out of the usual range', async () => {
    const ctx = await withCoupe();
    const soft = setupFileFixture();
    soft.corners.FL.corner.springRate = '2 N/mm'; // 0.4 Hz
    await apiCall('setupSave', { file: soft }, ctx);
    const shown = await apiCall('setupShow', { vehicle: 'Test coupe' }, ctx);
    expect(shown.warnings.map((w) => [w.position, w.code])).toContainEqual(['FL', 'ride-frequency-low']);
  });
});
