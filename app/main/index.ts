// Electron main, the real entry (bundled to dist/desktop/main.cjs by `npm run build:desktop`).
// Thin: everything it does is in desktop.ts, where tests reach it with a fake Electron.
import { app, BrowserWindow, dialog, ipcMain, Menu, session } from 'electron';
import { readFile, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { backendSpawn } from './backend-process';
import { desktopStart } from './desktop';

// The bundle sits in dist/desktop/; the project (built backend and renderer) two folders up.
const root = resolve(__dirname, '..', '..');

void desktopStart({
  electron: { app, BrowserWindow, Menu, dialog, ipcMain, session },
  fs: { readFile: (p) => readFile(p, 'utf8'), writeFile: (p, d) => writeFile(p, d) },
  preloadPath: join(__dirname, 'preload.cjs'),
  platform: process.platform,
  backendStart: () =>
    backendSpawn({
      // The Node that installed the project built better-sqlite3 for its own ABI: run the backend there.
      nodePath: process.env.RIDELEDGER_NODE ?? 'node',
      // The built backend (`npm run build` makes it with the window's bundle), not the sources.
      args: [join(root, 'dist', 'node', 'server.js'), '--ready-line'],
      cwd: root,
      onLog: (line) => console.log(`[backend] ${line}`),
    }),
}).catch((e: unknown) => {
  console.error(e);
  process.exitCode = 1;
});
