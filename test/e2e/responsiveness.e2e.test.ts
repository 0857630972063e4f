import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appServe, browserOpen, e2eChromium, type ServedApp } from './browser';
import { demoShopOpen } from './demo-shop';
import { editTimingInstall, rideFiguresEditTimings, rideFiguresOpen } from './edit-timing';

const chromium = e2eChromium();

describe.skipIf(!chromium)('responsiveness of an edit, timed in Chromium', () => {
  let app: ServedApp;
  let browser: Awaited<ReturnType<typeof browserOpen>>;
  let page: Page;

  beforeAll(async () => {
    app = await appServe();
    browser = await browserOpen(chromium as string);
    page = browser.page;
    page.setDefaultTimeout(30_000);
    await editTimingInstall(page);
    await demoShopOpen(page, app.url);
  });

  afterAll(async () => {
    await browser?.close();
    await app?.stop();
  });

  it('shows the figures of an edit on Ride figures, and prints how soon', async () => {
    await rideFiguresOpen(page);
    const timings = await rideFiguresEditTimings(page, (line) => console.log(line));
    // Generous bounds only: each edit's figures do arrive, well within what a user would wait.
    for (const t of Object.values(timings))
      for (const ms of Object.values(t.shown)) {
        expect(ms).not.toBeNull();
        expect(ms as number).toBeLessThan(10_000);
      }
  }, 180_000);
});
