import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import type { BackendReady } from '../../app/main/backend-process';
import { backendChildStart } from '../backend-start';

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
  const b = await backendChildStart();
  return { origin: b.origin, port: b.port, token: b.token, url: b.url, dbPath: b.dbPath, stop: b.stop };
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
