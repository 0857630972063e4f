import type {
  App,
  BrowserWindow as BrowserWindowType,
  BrowserWindowConstructorOptions,
  Dialog,
  IpcMain,
  IpcMainInvokeEvent,
  Menu as MenuType,
  MenuItemConstructorOptions,
  Session,
} from 'electron';
import { basename } from 'node:path';
import { electronConfig } from '../../electron.config';
import { MENU_CHANNEL, nativeChannel, type MenuCommand } from '../api/native-bridge';
import { nativeContract, type NativeInput, type NativeName, type NativeOutput } from '../api/native-contract';

/** The parts of Electron the shell uses, passed in so that tests can give fakes. */
export type ElectronParts = {
  app: Pick<App, 'whenReady' | 'on' | 'quit' | 'getName'>;
  BrowserWindow: new (options: BrowserWindowConstructorOptions) => BrowserWindowType;
  Menu: {
    buildFromTemplate: (t: MenuItemConstructorOptions[]) => MenuType;
    setApplicationMenu: (m: MenuType | null) => void;
  };
  dialog: Pick<Dialog, 'showOpenDialog' | 'showSaveDialog' | 'showErrorBox'>;
  ipcMain: Pick<IpcMain, 'handle'>;
  session: { defaultSession: Pick<Session, 'setPermissionRequestHandler' | 'webRequest'> };
};

export type FileSystemParts = {
  readFile: (path: string) => Promise<string>;
  writeFile: (path: string, data: string | Uint8Array) => Promise<void>;
};

/** The largest file a dialog will read into the page (bench traces can be large). */
const MAX_OPEN_BYTES = 512 * 1024 * 1024;

/** BrowserWindow options: the window settings and the security settings of electron.config.ts. */
export function windowOptions(preloadPath: string): BrowserWindowConstructorOptions {
  return {
    ...electronConfig.window,
    show: false,
    webPreferences: { ...electronConfig.webPreferences, preload: preloadPath },
  };
}

/** True when `url` is on the backend's origin: parsed and compared, never pattern-matched. */
export function originAllowed(url: string, origin: string): boolean {
  try {
    return new URL(url).origin === new URL(origin).origin;
  } catch {
    return false;
  }
}

/**
 * Locks a window to the backend's origin: no navigation elsewhere, no new windows, no
 * webviews. The page is treated as untrusted content.
 */
export function windowLockDown(win: BrowserWindowType, origin: string): void {
  win.webContents.on('will-navigate', (event, url) => {
    if (!originAllowed(url, origin)) event.preventDefault();
  });
  win.webContents.on('will-redirect', (event, url) => {
    if (!originAllowed(url, origin)) event.preventDefault();
  });
  win.webContents.on('will-attach-webview', (event) => event.preventDefault());
  win.webContents.setWindowOpenHandler(() => ({ action: 'deny' }));
}

/** Session-wide: no permission is ever granted (camera, notifications…), and every response carries the CSP. */
export function sessionLockDown(session: ElectronParts['session']['defaultSession']): void {
  session.setPermissionRequestHandler((_wc, _permission, callback) => callback(false));
  session.webRequest.onHeadersReceived((details, callback) => {
    callback({
      responseHeaders: {
        ...details.responseHeaders,
        'Content-Security-Policy': [electronConfig.contentSecurityPolicy],
      },
    });
  });
}

/** The application menu, with the keyboard shortcuts; each item sends its command to the page. */
export function menuTemplate(
  send: (command: MenuCommand) => void,
  isMac: boolean,
): MenuItemConstructorOptions[] {
  const item = (label: string, accelerator: string, command: MenuCommand): MenuItemConstructorOptions => ({
    label,
    accelerator,
    click: () => send(command),
  });
  return [
    ...(isMac ? [{ role: 'appMenu' as const }] : []),
    {
      label: 'File',
      submenu: [
        item('New setup', 'CmdOrCtrl+N', 'new-setup'),
        item('Save setup', 'CmdOrCtrl+S', 'save'),
        { type: 'separator' },
        item('Print or save as PDF…', 'CmdOrCtrl+P', 'print'),
        { type: 'separator' },
        isMac ? { role: 'close' } : { role: 'quit' },
      ],
    },
    {
      label: 'Edit',
      submenu: [
        item('Undo', 'CmdOrCtrl+Z', 'undo'),
        item('Redo', 'Shift+CmdOrCtrl+Z', 'redo'),
        { type: 'separator' },
        { role: 'cut' },
        { role: 'copy' },
        { role: 'paste' },
        { role: 'selectAll' },
      ],
    },
    {
      label: 'View',
      submenu: [
        item('Compare setups', 'CmdOrCtrl+K', 'compare'),
        { type: 'separator' },
        { role: 'resetZoom' },
        { role: 'zoomIn' },
        { role: 'zoomOut' },
        { role: 'togglefullscreen' },
      ],
    },
  ];
}

type NativeImpl = { [N in NativeName]: (input: NativeInput<N>) => Promise<NativeOutput<N>> };

/** The native helpers, for one window. */
export function nativeHelpers(
  electron: ElectronParts,
  fs: FileSystemParts,
  win: BrowserWindowType,
): NativeImpl {
  const { dialog } = electron;
  return {
    openTextFile: async ({ title, filters }) => {
      const r = await dialog.showOpenDialog(win, { title, filters, properties: ['openFile'] });
      const path = r.filePaths[0];
      if (r.canceled || !path) return null;
      const content = await fs.readFile(path);
      if (content.length > MAX_OPEN_BYTES)
        throw new Error(`${basename(path)} is larger than ${MAX_OPEN_BYTES} bytes`);
      return { name: basename(path), content };
    },
    saveTextFile: async ({ title, defaultName, content, filters }) => {
      const r = await dialog.showSaveDialog(win, { title, defaultPath: defaultName, filters });
      if (r.canceled || !r.filePath) return { saved: false };
      await fs.writeFile(r.filePath, content);
      return { saved: true };
    },
    saveImageFile: async ({ title, defaultName, pngBase64 }) => {
      const r = await dialog.showSaveDialog(win, {
        title,
        defaultPath: defaultName,
        filters: [{ name: 'PNG image', extensions: ['png'] }],
      });
      if (r.canceled || !r.filePath) return { saved: false };
      await fs.writeFile(r.filePath, Buffer.from(pngBase64, 'base64'));
      return { saved: true };
    },
    printToPdf: async ({ title, defaultName }) => {
      const r = await dialog.showSaveDialog(win, {
        title,
        defaultPath: defaultName,
        filters: [{ name: 'PDF', extensions: ['pdf'] }],
      });
      if (r.canceled || !r.filePath) return { saved: false };
      const pdf = await win.webContents.printToPDF({ printBackground: true, pageSize: 'A4' });
      await fs.writeFile(r.filePath, pdf);
      return { saved: true };
    },
  };
}

/**
 * One IPC handler per entry of the native contract: the sender must be a page on the backend's
 * origin, and the input must pass the entry's zod schema, before the helper runs.
 */
export function nativeIpcRegister(
  ipcMain: ElectronParts['ipcMain'],
  origin: string,
  helpers: () => NativeImpl | undefined,
): void {
  for (const name of Object.keys(nativeContract) as NativeName[]) {
    ipcMain.handle(nativeChannel(name), async (event: IpcMainInvokeEvent, raw: unknown) => {
      const frameUrl = event.senderFrame?.url ?? '';
      if (!originAllowed(frameUrl, origin))
        throw new Error('refused: the request did not come from the RideLedger page');
      const parsed = nativeContract[name].input.safeParse(raw);
      if (!parsed.success) throw new Error(`${name}: ${parsed.error.issues[0]?.message ?? 'invalid input'}`);
      const impl = helpers();
      if (!impl) throw new Error('no window');
      const helper = impl[name] as (input: unknown) => Promise<unknown>;
      return nativeContract[name].output.parse(await helper(parsed.data));
    });
  }
}

/**
 * The desktop shell: waits for Electron, starts the backend, opens one locked-down window on
 * it, installs the menu and the native helpers. Quitting stops the backend.
 */
export async function desktopStart(options: {
  electron: ElectronParts;
  fs: FileSystemParts;
  preloadPath: string;
  platform: NodeJS.Platform;
  backendStart: () => Promise<{ origin: string; url: string; stop: () => void }>;
}): Promise<BrowserWindowType> {
  const { electron } = options;
  await electron.app.whenReady();
  let backend: { origin: string; url: string; stop: () => void };
  try {
    backend = await options.backendStart();
  } catch (e) {
    electron.dialog.showErrorBox('RideLedger could not start', (e as Error).message);
    electron.app.quit();
    throw e;
  }
  electron.app.on('will-quit', () => backend.stop());
  electron.app.on('window-all-closed', () => electron.app.quit());
  sessionLockDown(electron.session.defaultSession);
  const win = new electron.BrowserWindow(windowOptions(options.preloadPath));
  windowLockDown(win, backend.origin);
  nativeIpcRegister(electron.ipcMain, backend.origin, () => nativeHelpers(electron, options.fs, win));
  const send = (command: MenuCommand) => win.webContents.send(MENU_CHANNEL, command);
  electron.Menu.setApplicationMenu(
    electron.Menu.buildFromTemplate(menuTemplate(send, options.platform === 'darwin')),
  );
  win.once('ready-to-show', () => win.show());
  await win.loadURL(backend.url);
  return win;
}
