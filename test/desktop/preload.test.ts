import { describe, expect, it, vi } from 'vitest';
import { nativeContract } from '../../app/api/native-contract';

const exposed: Record<string, unknown> = {};
const invoke = vi.fn(async (..._args: unknown[]) => ({ saved: true }));
vi.mock('electron', () => ({
  contextBridge: { exposeInMainWorld: (key: string, value: unknown) => (exposed[key] = value) },
  ipcRenderer: { invoke, on: vi.fn(), removeListener: vi.fn() },
}));

describe('the preload', () => {
  it('exposes exactly the native contract and the menu listener, nothing of Node or Electron', async () => {
    await import('../../app/preload/preload');
    const bridge = exposed.rideledgerNative as Record<string, unknown>;
    expect(Object.keys(exposed)).toEqual(['rideledgerNative']);
    expect(Object.keys(bridge).sort()).toEqual([...Object.keys(nativeContract), 'onMenuCommand'].sort());
    for (const value of Object.values(bridge)) expect(typeof value).toBe('function');
    await (bridge.printToPdf as (i: unknown) => Promise<unknown>)({ title: 't', defaultName: 'x.pdf' });
    expect(invoke).toHaveBeenCalledWith('rideledger-native:printToPdf', { title: 't', defaultName: 'x.pdf' });
  });
});
