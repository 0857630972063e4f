/**
 * Desktop window, security and packaging settings, read by Electron main (app/main/desktop.ts)
 * and by the packager on a machine that can download Electron.
 */
export const electronConfig = {
  appId: 'app.rideledger.desktop',
  productName: 'RideLedger',
  window: {
    width: 1440,
    height: 900,
    minWidth: 1024,
    minHeight: 700,
    backgroundColor: '#ffffff',
    title: 'RideLedger',
  },
  /** webPreferences every window gets: the renderer is an untrusted web page. */
  webPreferences: {
    contextIsolation: true,
    sandbox: true,
    nodeIntegration: false,
    nodeIntegrationInWorker: false,
    webSecurity: true,
    allowRunningInsecureContent: false,
    spellcheck: false,
  },
  /** Content-Security-Policy of every page: own scripts only, API on the loopback origin. */
  contentSecurityPolicy: [
    "default-src 'self'",
    "script-src 'self'",
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'none'",
    "frame-ancestors 'none'",
    "form-action 'none'",
  ].join('; '),
  /**
   * Packaging for distribution, done on a connected machine: the packager rebuilds the native
   * SQLite module for Electron's Node and runs the backend as an Electron utility process. The
   * backend finds its migrations and the demo shop beside its sources, so they ship as files.
   */
  packaging: {
    main: 'dist/desktop/main.cjs',
    files: ['dist/**', 'app/**', 'core/**', 'db/**', 'electron.config.ts', 'package.json'],
    extraFiles: ['db/migrations/**', 'assets/demo/**'],
    nativeModules: ['better-sqlite3'],
    /** Native modules stay outside the archive, where the utility process can load them. */
    asarUnpack: ['node_modules/better-sqlite3/**'],
    targets: { linux: ['AppImage', 'deb'], mac: ['dmg'], win: ['nsis'] },
  },
} as const;

export type ElectronConfig = typeof electronConfig;
