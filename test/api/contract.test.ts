import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { contract } from '../../app/api/contract';
import { handlers } from '../../app/api/handlers/index';
import { InputError } from '../../core/units/input-error';
import { freshContext } from './api-fixture';

describe('apiCall', () => {
  it('has a handler for every entry of the contract and no other', () => {
    expect(Object.keys(handlers).sort()).toEqual(Object.keys(contract).sort());
  });

  it('still runs analyzeCorner, which ignores the context', async () => {
    const file = JSON.parse(
      readFileSync(new URL('../../assets/demo/club-coupe-front-left.json', import.meta.url), 'utf8'),
    );
    const report = await apiCall('analyzeCorner', { file, frequencies: [1, 2] }, freshContext());
    expect(report.frf.map((r) => r.frequencyHz)).toEqual([1, 2]);
    expect(report.rideFrequencyHz).toBeGreaterThan(1);
  });

  it('turns a schema failure into one InputError naming the field', async () => {
    const ctx = freshContext();
    await expect(
      apiCall('setupDiff', { a: { vehicle: 'x' }, b: { vehicle: 'x', revision: 0 } }, ctx),
    ).rejects.toThrow(InputError);
    await expect(
      apiCall('setupDiff', { a: { vehicle: 'x' }, b: { vehicle: 'x', revision: 0 } }, ctx),
    ).rejects.toThrow(/^b\.revision: /);
    await expect(apiCall('vehicleList', { extra: 1 }, ctx)).rejects.toThrow(/extra|Unrecognized/);
    await expect(apiCall('vehicleDelete', { vehicle: 'x' }, ctx)).rejects.toThrow(
      /^confirm: deleting a vehicle needs confirm: true/,
    );
    await expect(apiCall('storeImport', { bundle: { format: 'other' } }, ctx)).rejects.toThrow(
      /^bundle\.format: expected "rideledger-bundle"/,
    );
  });

  it('returns only JSON: every output survives JSON.stringify and parse unchanged', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    for (const out of [
      await apiCall('vehicleList', {}, ctx),
      await apiCall('setupShow', { vehicle: 'Millbrook coupe #27' }, ctx),
      await apiCall('benchShow', { run: 1, points: true }, ctx),
      await apiCall('storeCheck', {}, ctx),
    ])
      expect(JSON.parse(JSON.stringify(out))).toEqual(out);
  });
});

describe('apiCall on analyzeCorner', () => {
  const demo = JSON.parse(
    readFileSync(new URL('../../assets/demo/club-coupe-front-left.json', import.meta.url), 'utf8'),
  ) as Record<string, unknown>;

  async function fieldOf(f: () => Promise<unknown>): Promise<string> {
    try {
      await f();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      return (e as InputError).field;
    }
    throw new Error('expected an InputError');
  }

  it('returns a report its output schema accepts', async () => {
    const report = await apiCall('analyzeCorner', { file: demo, frequencies: [1, 2] }, freshContext());
    expect(contract.analyzeCorner.output.safeParse(report).success).toBe(true);
  });

  it('rejects invalid input before the handler runs, naming the field', async () => {
    const ctx = freshContext();
    expect(await fieldOf(() => apiCall('analyzeCorner', { file: demo, frequencies: [1, -2] }, ctx))).toBe(
      'frequencies[1]',
    );
    expect(await fieldOf(() => apiCall('analyzeCorner', { file: demo, frequencies: [] }, ctx))).toBe(
      'frequencies',
    );
    expect(await fieldOf(() => apiCall('analyzeCorner', null, ctx))).toBe('');
  });

  it('passes core’s field path through for a bad corner', async () => {
    const bad = { ...demo, corner: { ...(demo.corner as object), springRate: '70 kg' } };
    expect(await fieldOf(() => apiCall('analyzeCorner', { file: bad }, freshContext()))).toBe(
      'corner.springRate',
    );
  });
});
