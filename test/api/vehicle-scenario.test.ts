import { describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { RIDE_SCENARIO_DEFAULT } from '../../core/valving/ride-scenario';
import { storeDigest } from '../db/store-fixture';
import { freshContext } from './api-fixture';

const COUPE = 'Millbrook coupe #27';

describe("a vehicle's scenario", () => {
  it('starts as the one starting scenario, stores what is set in SI, and keeps what was not given', async () => {
    const ctx = freshContext();
    await apiCall('vehicleAdd', { name: 'Coupe' }, ctx);
    const first = await apiCall('vehicleScenario', { vehicle: 'Coupe' }, ctx);
    expect(first.stored).toBe(false);
    expect(first.scenario).toEqual(RIDE_SCENARIO_DEFAULT);
    const set = await apiCall(
      'vehicleScenarioSet',
      { vehicle: 'coupe', scenario: { road: { class: 'b', speed: '30 mph' }, bump: { height: '1 in' } } },
      ctx,
    );
    expect(set.stored).toBe(true);
    expect(set.scenario.road.roadClass).toBe('B');
    // 1 mi = 1609.344 m and 1 in = 25.4 mm exactly (NIST SP 811, appendix B) [pub]
    expect(set.scenario.road.speed).toBeCloseTo((30 * 1609.344) / 3600, 12);
    expect(set.scenario.bump.height).toBeCloseTo(0.0254, 15);
    expect(set.scenario.bump.length).toBe(RIDE_SCENARIO_DEFAULT.bump.length);
    expect(set.scenario.curb).toEqual(RIDE_SCENARIO_DEFAULT.curb);
    const again = await apiCall('vehicleScenario', { vehicle: 'Coupe' }, ctx);
    expect(again.scenario).toEqual(set.scenario);
    expect(again.note).toMatch(/set for "Coupe"/);
    const reset = await apiCall('vehicleScenarioSet', { vehicle: 'Coupe', scenario: null }, ctx);
    expect(reset.stored).toBe(false);
    expect(reset.scenario).toEqual(RIDE_SCENARIO_DEFAULT);
  });

  it('refuses a bad field with its name and stores nothing', async () => {
    const ctx = freshContext();
    await apiCall('vehicleAdd', { name: 'Coupe' }, ctx);
    await apiCall('vehicleScenarioSet', { vehicle: 'Coupe', scenario: { road: { class: 'A' } } }, ctx);
    const before = storeDigest(ctx.store);
    await expect(
      apiCall('vehicleScenarioSet', { vehicle: 'Coupe', scenario: { bump: { height: '25 kg' } } }, ctx),
    ).rejects.toThrow(/^scenario\.bump\.height: got "25 kg"/);
    await expect(
      apiCall('vehicleScenarioSet', { vehicle: 'Coupe', scenario: { road: { class: 'Q' } } }, ctx),
    ).rejects.toThrow(/^scenario\.road\.class/);
    await expect(
      apiCall('vehicleScenarioSet', { vehicle: 'Coupe', scenario: { curb: { speed: '-5 km/h' } } }, ctx),
    ).rejects.toThrow(/^scenario\.curb\.speed: must be greater than zero/);
    await expect(
      apiCall('vehicleScenarioSet', { vehicle: 'Nobody', scenario: { road: { class: 'A' } } }, ctx),
    ).rejects.toThrow(/^vehicle: no vehicle named "Nobody"/);
    expect(storeDigest(ctx.store)).toBe(before);
  });

  it('is what Compare and choose judge on when the request gives no scenario', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    const pair = { a: { vehicle: COUPE, revision: 1 }, b: { vehicle: COUPE }, preset: 'track-day' };
    const before = await apiCall('setupCompare', pair, ctx);
    expect(before.scenario).toEqual(RIDE_SCENARIO_DEFAULT);
    expect(before.scenarioSource.tag).toBe('ours');
    await apiCall(
      'vehicleScenarioSet',
      { vehicle: COUPE, scenario: { road: { class: 'D', speed: '70 km/h' }, bump: { height: '40 mm' } } },
      ctx,
    );
    const after = await apiCall('setupCompare', pair, ctx);
    expect(after.scenario.road).toEqual({ roadClass: 'D', speed: 70 / 3.6 });
    expect(after.scenario.bump.height).toBeCloseTo(0.04, 15);
    expect(after.scenarioSource).toEqual({ tag: 'user', text: `the scenario set for "${COUPE}"` });
    // A rougher road and a taller bump move the figures: the stored scenario is the one used.
    const fl = (o: typeof after) => o.corners[0]?.b.headline.roadWeightedAccel ?? 0;
    expect(fl(after)).toBeGreaterThan(fl(before));
    // The request's own edits still apply on top of the vehicle's scenario.
    const edited = await apiCall('setupCompare', { ...pair, scenario: { road: { speed: '50 km/h' } } }, ctx);
    expect(edited.scenario.road).toEqual({ roadClass: 'D', speed: 50 / 3.6 });
    expect(edited.scenario.bump.height).toBeCloseTo(0.04, 15);
    const chosen = await apiCall(
      'valvingChoose',
      { vehicle: COUPE, corners: ['FL'], preset: 'track-day', best: 1, threads: 0 },
      ctx,
    );
    expect(chosen.scenario).toEqual(after.scenario);
  });
});
