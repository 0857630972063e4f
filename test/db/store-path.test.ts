import { describe, expect, it } from 'vitest';
import { storeDefaultFolder, storePathResolve } from '../../db/store-path';

describe('storePathResolve', () => {
  const linux = { platform: 'linux', env: {}, home: '/home/ada' };

  it('takes --db first, then RIDELEDGER_DB, then the per-user folder', () => {
    expect(storePathResolve('shop.sqlite', { ...linux, env: { RIDELEDGER_DB: '/srv/x.sqlite' } })).toBe(
      'shop.sqlite',
    );
    expect(storePathResolve(undefined, { ...linux, env: { RIDELEDGER_DB: '/srv/x.sqlite' } })).toBe(
      '/srv/x.sqlite',
    );
    expect(storePathResolve(undefined, linux)).toBe('/home/ada/.local/share/RideLedger/rideledger.sqlite');
    expect(storePathResolve('', { ...linux, env: { RIDELEDGER_DB: '' } })).toBe(
      '/home/ada/.local/share/RideLedger/rideledger.sqlite',
    );
  });

  it('uses each platform’s application-data folder', () => {
    // XDG Base Directory Specification [pub]: $XDG_DATA_HOME, default ~/.local/share; a relative value is ignored.
    expect(storeDefaultFolder({ ...linux, env: { XDG_DATA_HOME: '/data/ada' } })).toBe(
      '/data/ada/RideLedger',
    );
    expect(storeDefaultFolder({ ...linux, env: { XDG_DATA_HOME: 'relative/path' } })).toBe(
      '/home/ada/.local/share/RideLedger',
    );
    expect(storeDefaultFolder({ platform: 'darwin', env: {}, home: '/Users/ada' })).toBe(
      '/Users/ada/Library/Application Support/RideLedger',
    );
    expect(
      storeDefaultFolder({
        platform: 'win32',
        env: { APPDATA: 'C:\\Users\\ada\\AppData\\Roaming' },
        home: 'C:\\Users\\ada',
      }),
    ).toBe('C:\\Users\\ada\\AppData\\Roaming\\RideLedger');
    expect(storePathResolve(undefined, { platform: 'win32', env: {}, home: 'C:\\Users\\ada' })).toBe(
      'C:\\Users\\ada\\AppData\\Roaming\\RideLedger\\rideledger.sqlite',
    );
  });
});
