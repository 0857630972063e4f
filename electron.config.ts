/**
 * Desktop window, security and packaging settings, read by Electron main and the packager.
 * Until the desktop shell lands, this holds the window and security defaults it must use.
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
} as const;

export type ElectronConfig = typeof electronConfig;
