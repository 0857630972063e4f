import { describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { freshContext } from './api-fixture';

describe('settings and drafts', () => {
  it('stores any JSON value, reads it back, lists by prefix and removes on null', async () => {
    const ctx = freshContext();
    expect((await apiCall('settingGet', { key: 'caution-acknowledged' }, ctx)).value).toBeNull();
    await apiCall('settingSet', { key: 'caution-acknowledged', value: { at: '2026-12-01' } }, ctx);
    await apiCall(
      'settingSet',
      { key: 'draft:Millbrook coupe #27', value: { name: 'wet', corners: [1, 2] } },
      ctx,
    );
    await apiCall('settingSet', { key: 'draft:Other', value: 'x' }, ctx);
    expect((await apiCall('settingGet', { key: 'caution-acknowledged' }, ctx)).value).toEqual({
      at: '2026-12-01',
    });
    expect((await apiCall('settingList', { prefix: 'draft:' }, ctx)).keys).toEqual([
      'draft:Millbrook coupe #27',
      'draft:Other',
    ]);
    await apiCall('settingSet', { key: 'draft:Other', value: null }, ctx);
    expect((await apiCall('settingList', { prefix: 'draft:' }, ctx)).keys).toEqual([
      'draft:Millbrook coupe #27',
    ]);
  });

  it('does not treat LIKE wildcards in a prefix as wildcards', async () => {
    const ctx = freshContext();
    await apiCall('settingSet', { key: 'draft:a_b', value: 1 }, ctx);
    await apiCall('settingSet', { key: 'draft:axb', value: 1 }, ctx);
    expect((await apiCall('settingList', { prefix: 'draft:a_' }, ctx)).keys).toEqual(['draft:a_b']);
  });

  it('rejects a bad key, naming the field', async () => {
    await expect(apiCall('settingSet', { key: 'Bad Key', value: 1 }, freshContext())).rejects.toThrow(
      /^key: /,
    );
    await expect(apiCall('settingGet', { key: '' }, freshContext())).rejects.toThrow(/^key: /);
  });
});
