import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { backendReadyParse, type BackendReady } from '../../app/main/backend-process';

export const PROJECT_ROOT = fileURLToPath(new URL('../..', import.meta.url));

/** A Chromium to drive: CHROMIUM_PATH, else the system's; undefined when there is none. */
export function chromiumFind(): string | undefined {
  const candidates = [
    process.env.CHROMIUM_PATH,
    '/usr/bin/chromium',
    '/usr/bin/chromium-browser',
    '/usr/bin/google-chrome',
  ];
  return candidates.find((p): p is string => typeof p === 'string' && p !== '' && existsSync(p));
}

export type ServedApp = BackendReady & { dbPath: string; stop: () => Promise<void> };

/** Starts the backend (as `npm run serve` does, on the built renderer) on a fresh temp database. */
export async function appServe(): Promise<ServedApp> {
  const dir = mkdtempSync(join(tmpdir(), 'rideledger-e2e-'));
  const dbPath = join(dir, 'shop.sqlite');
  const child: ChildProcess = spawn(
    process.execPath,
    ['--import', 'tsx', 'app/server/main.ts', '--ready-line', '--db', dbPath],
    {
      cwd: PROJECT_ROOT,
      stdio: ['ignore', 'pipe', 'pipe'],
      env: { ...process.env, RIDELEDGER_DB: '' },
    },
  );
  let log = '';
  child.stderr?.on('data', (d: Buffer) => (log += d.toString()));
  const ready = await new Promise<BackendReady>((done, fail) => {
    const timer = setTimeout(() => fail(new Error(`the server did not start: ${log}`)), 30_000);
    const lines = createInterface({ input: child.stdout as NodeJS.ReadableStream });
    lines.on('line', (line) => {
      const r = backendReadyParse(line);
      if (r) {
        clearTimeout(timer);
        done(r);
      }
    });
    child.once('exit', (code) => fail(new Error(`the server exited (${code}): ${log}`)));
  });
  return {
    ...ready,
    dbPath,
    stop: async () => {
      child.kill('SIGTERM');
      await new Promise((r) => child.once('exit', r));
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Debian's Chromium, headless, on a fresh profile, with the flags this closed network needs. */
export async function browserOpen(
  executablePath: string,
): Promise<{ context: BrowserContext; page: Page; close: () => Promise<void> }> {
  const profile = mkdtempSync(join(tmpdir(), 'rideledger-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath,
    headless: true,
    viewport: { width: 1500, height: 1000 },
    acceptDownloads: true,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * The Chromium for the end-to-end suite. Where there is none, the suite says so loudly, with
 * how to install one, and is skipped — unless RIDELEDGER_REQUIRE_E2E=1 (CI sets it), where a
 * missing browser fails the run.
 */
export function e2eChromium(): string | undefined {
  const path = chromiumFind();
  if (path) return path;
  const message =
    '\n*** The end-to-end tests need Chromium and found none (CHROMIUM_PATH, /usr/bin/chromium).\n' +
    '*** Install it: sudo apt-get install chromium   (or set CHROMIUM_PATH to a Chromium or Chrome binary)\n' +
    '*** The end-to-end suite is SKIPPED.\n';
  if (process.env.RIDELEDGER_REQUIRE_E2E === '1') {
    throw new Error(`${message}*** RIDELEDGER_REQUIRE_E2E=1: a missing browser fails the run.`);
  }
  console.warn(message);
  return undefined;
}
