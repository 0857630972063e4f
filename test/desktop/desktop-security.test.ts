import { describe, expect, it, vi } from 'vitest';
import { electronConfig } from '../../electron.config';
import { MENU_CHANNEL, nativeChannel } from '../../app/api/native-bridge';
import { nativeContract } from '../../app/api/native-contract';
import { backendReadyParse, READY_PREFIX } from '../../app/main/backend-process';
import {
  menuTemplate,
  nativeIpcRegister,
  originAllowed,
  sessionLockDown,
  windowLockDown,
  windowOptions,
} from '../../app/main/desktop';

describe('the Electron settings object', () => {
  it('isolates the page: context isolation, sandbox, no Node integration, web security on', () => {
    const w = electronConfig.webPreferences;
    expect(w.contextIsolation).toBe(true);
    expect(w.sandbox).toBe(true);
    expect(w.nodeIntegration).toBe(false);
    expect(w.nodeIntegrationInWorker).toBe(false);
    expect(w.webSecurity).toBe(true);
    expect(w.allowRunningInsecureContent).toBe(false);
  });

  it('has a strict CSP: own scripts only, no eval, no plugins, no framing', () => {
    const csp = electronConfig.contentSecurityPolicy;
    const directives = new Map(
      csp.split(';').map((d) => {
        const [name, ...values] = d.trim().split(/\s+/);
        return [name as string, values];
      }),
    );
    expect(directives.get('default-src')).toEqual(["'self'"]);
    expect(directives.get('script-src')).toEqual(["'self'"]);
    expect(directives.get('object-src')).toEqual(["'none'"]);
    expect(directives.get('frame-ancestors')).toEqual(["'none'"]);
    expect(csp).not.toContain('unsafe-eval');
    expect(directives.get('script-src')).not.toContain("'unsafe-inline'");
  });

  it('gives every window those settings and the preload', () => {
    const o = windowOptions('/app/preload.cjs');
    expect(o.webPreferences).toEqual({ ...electronConfig.webPreferences, preload: '/app/preload.cjs' });
    expect(o.show).toBe(false);
  });
});

type Listener = (event: { preventDefault: () => void }, url: string) => void;

function fakeWindow() {
  const listeners = new Map<string, Listener>();
  let openHandler: (() => { action: string }) | undefined;
  const win = {
    webContents: {
      on: (name: string, l: Listener) => listeners.set(name, l),
      setWindowOpenHandler: (h: () => { action: string }) => (openHandler = h),
    },
  };
  const navigate = (name: string, url: string) => {
    const prevent = vi.fn();
    listeners.get(name)?.({ preventDefault: prevent }, url);
    return prevent.mock.calls.length > 0;
  };
  return { win, navigate, open: () => openHandler?.() };
}

describe('window lock-down', () => {
  const origin = 'http://127.0.0.1:43210';

  it('blocks navigation and redirects away from the backend origin', () => {
    const { win, navigate } = fakeWindow();
    windowLockDown(win as never, origin);
    expect(navigate('will-navigate', 'http://127.0.0.1:43210/compare')).toBe(false);
    expect(navigate('will-navigate', 'https://example.com/')).toBe(true);
    expect(navigate('will-navigate', 'http://127.0.0.1:43211/')).toBe(true);
    expect(navigate('will-navigate', 'http://127.0.0.1:43210.evil.example/')).toBe(true);
    expect(navigate('will-navigate', 'file:///etc/passwd')).toBe(true);
    expect(navigate('will-redirect', 'https://example.com/')).toBe(true);
  });

  it('denies every new window', () => {
    const { win, open } = fakeWindow();
    windowLockDown(win as never, origin);
    expect(open()).toEqual({ action: 'deny' });
  });

  it('compares origins by parsing, not by substring', () => {
    expect(originAllowed('http://127.0.0.1:43210/x?y#z', origin)).toBe(true);
    expect(originAllowed(`https://evil.example/?${origin}`, origin)).toBe(false);
    expect(originAllowed('not a url', origin)).toBe(false);
  });

  it('refuses every permission and adds the CSP to every response', () => {
    let permission: ((wc: unknown, p: string, cb: (ok: boolean) => void) => void) | undefined;
    let headers:
      ((d: { responseHeaders: Record<string, string[]> }, cb: (r: unknown) => void) => void) | undefined;
    sessionLockDown({
      setPermissionRequestHandler: (h: never) => (permission = h),
      webRequest: { onHeadersReceived: (h: never) => (headers = h) },
    } as never);
    const granted = vi.fn();
    permission?.({}, 'media', granted);
    expect(granted).toHaveBeenCalledWith(false);
    const done = vi.fn();
    headers?.({ responseHeaders: {} }, done);
    expect(done).toHaveBeenCalledWith({
      responseHeaders: { 'Content-Security-Policy': [electronConfig.contentSecurityPolicy] },
    });
  });
});

describe('native IPC', () => {
  const origin = 'http://127.0.0.1:43210';
  function register() {
    const handlers = new Map<string, (event: unknown, raw: unknown) => Promise<unknown>>();
    const helper = vi.fn(async () => ({ saved: true }));
    nativeIpcRegister(
      { handle: (channel: string, h: never) => handlers.set(channel, h) } as never,
      origin,
      () => ({
        openTextFile: vi.fn(async () => null),
        saveTextFile: helper,
        saveImageFile: helper,
        printToPdf: helper,
      }),
    );
    return { handlers, helper };
  }
  const from = (url: string) => ({ senderFrame: { url } });

  it('registers exactly one handler per entry of the native contract', () => {
    const { handlers } = register();
    expect([...handlers.keys()].sort()).toEqual(
      Object.keys(nativeContract)
        .map((n) => nativeChannel(n as never))
        .sort(),
    );
  });

  it('validates every input with the contract before the helper runs', async () => {
    const { handlers, helper } = register();
    const save = handlers.get(nativeChannel('saveTextFile'));
    await expect(
      save?.(from(`${origin}/`), { title: 't', defaultName: 'a.csv', content: 1, filters: [] }),
    ).rejects.toThrow(/saveTextFile/);
    await expect(
      save?.(from(`${origin}/`), { title: 't', defaultName: 'a.csv', content: 'x', filters: [], extra: 1 }),
    ).rejects.toThrow();
    await expect(
      save?.(from(`${origin}/`), {
        title: 't',
        defaultName: 'a.csv',
        content: 'x',
        filters: [{ name: 'CSV', extensions: ['../x'] }],
      }),
    ).rejects.toThrow();
    expect(helper).not.toHaveBeenCalled();
    await expect(
      save?.(from(`${origin}/`), { title: 't', defaultName: 'a.csv', content: 'x', filters: [] }),
    ).resolves.toEqual({ saved: true });
    expect(helper).toHaveBeenCalledOnce();
  });

  it('refuses a request from a page on any other origin', async () => {
    const { handlers, helper } = register();
    const save = handlers.get(nativeChannel('printToPdf'));
    await expect(save?.(from('https://evil.example/'), { title: 't', defaultName: 'a.pdf' })).rejects.toThrow(
      /refused/,
    );
    expect(helper).not.toHaveBeenCalled();
  });
});

describe('menu', () => {
  it('has keyboard shortcuts for save, new setup, compare, undo and redo, each sent to the page', () => {
    const sent: string[] = [];
    const items = menuTemplate((c) => sent.push(c), false).flatMap((m) =>
      Array.isArray(m.submenu) ? m.submenu : [],
    );
    const accel = (label: string) => items.find((i) => i.label === label)?.accelerator;
    expect(accel('Save setup')).toBe('CmdOrCtrl+S');
    expect(accel('New setup')).toBe('CmdOrCtrl+N');
    expect(accel('Compare setups')).toBe('CmdOrCtrl+K');
    expect(accel('Undo')).toBe('CmdOrCtrl+Z');
    expect(accel('Redo')).toBe('Shift+CmdOrCtrl+Z');
    for (const i of items) if (typeof i.click === 'function') (i.click as () => void)();
    expect(sent.sort()).toEqual(['compare', 'new-setup', 'print', 'redo', 'save', 'undo']);
    expect(MENU_CHANNEL).toBe('rideledger-menu');
  });
});

describe('backend ready line', () => {
  it('accepts only a loopback origin on the stated port', () => {
    const ok = {
      origin: 'http://127.0.0.1:5123',
      port: 5123,
      token: 't',
      url: 'http://127.0.0.1:5123/#token=t',
    };
    expect(backendReadyParse(READY_PREFIX + JSON.stringify(ok))).toEqual(ok);
    expect(
      backendReadyParse(READY_PREFIX + JSON.stringify({ ...ok, origin: 'http://evil.example:5123' })),
    ).toBeUndefined();
    expect(backendReadyParse(READY_PREFIX + JSON.stringify({ ...ok, port: 9 }))).toBeUndefined();
    expect(backendReadyParse('listening on 5123')).toBeUndefined();
    expect(backendReadyParse(`${READY_PREFIX}{nope`)).toBeUndefined();
  });
});
