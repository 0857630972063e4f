import { posix, win32 } from 'node:path';

/** The database file's name inside the application-data folder. */
export const STORE_FILE_NAME = 'rideledger.sqlite';
/** The application-data folder's name. */
export const STORE_FOLDER_NAME = 'RideLedger';

/** What the default location depends on, passed in so that every platform can be tested anywhere. */
export type StorePlace = {
  platform: string;
  env: Readonly<Record<string, string | undefined>>;
  home: string;
};

/**
 * The platform's per-user application-data folder for RideLedger: %APPDATA% on Windows,
 * ~/Library/Application Support on macOS, $XDG_DATA_HOME (when absolute) or ~/.local/share
 * elsewhere (XDG Base Directory Specification).
 */
export function storeDefaultFolder(place: StorePlace): string {
  if (place.platform === 'win32') {
    const base = place.env.APPDATA ?? win32.join(place.home, 'AppData', 'Roaming');
    return win32.join(base, STORE_FOLDER_NAME);
  }
  if (place.platform === 'darwin')
    return posix.join(place.home, 'Library', 'Application Support', STORE_FOLDER_NAME);
  const xdg = place.env.XDG_DATA_HOME;
  // The specification says a relative XDG_DATA_HOME is invalid and is to be ignored.
  const base = xdg && posix.isAbsolute(xdg) ? xdg : posix.join(place.home, '.local', 'share');
  return posix.join(base, STORE_FOLDER_NAME);
}

/** The database to open: `--db FILE`, else $RIDELEDGER_DB, else the default folder's file. */
export function storePathResolve(flag: string | undefined, place: StorePlace): string {
  if (flag !== undefined && flag !== '') return flag;
  const fromEnv = place.env.RIDELEDGER_DB;
  if (fromEnv !== undefined && fromEnv !== '') return fromEnv;
  const folder = storeDefaultFolder(place);
  return place.platform === 'win32'
    ? win32.join(folder, STORE_FILE_NAME)
    : posix.join(folder, STORE_FILE_NAME);
}
