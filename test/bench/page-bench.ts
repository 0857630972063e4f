/**
 * `npm run bench:page`: how soon an edit's figures are on screen in a real Chromium, against
 * the served app on a fresh demo shop — a new road speed (the linear model's figures), a new
 * bump (the nonlinear event's), and a road speed typed key by key — with the page's long tasks
 * (> 50 ms, PerformanceObserver 'longtask') from each edit to its figures. A benchmark, not a
 * test: it prints what it measures (goals: under 150 ms for the linear figures, under 1 s for
 * the events, no long task while typing) and exits 1 only when an edit's figures never come.
 * Needs Chromium (CHROMIUM_PATH or /usr/bin/chromium); builds the renderer first.
 */
import { fileURLToPath } from 'node:url';
import { build } from 'vite';
import { appServe, browserOpen, chromiumFind } from '../e2e/browser';
import { demoShopOpen } from '../e2e/demo-shop';
import {
  editTimingInstall,
  editTimingText,
  rideFiguresEditTimings,
  rideFiguresOpen,
} from '../e2e/edit-timing';

const chromium = chromiumFind();
if (!chromium) {
  console.log('bench:page: no Chromium found (set CHROMIUM_PATH); nothing measured.');
} else {
  await build({
    configFile: fileURLToPath(new URL('../../app/renderer/vite.config.ts', import.meta.url)),
    logLevel: 'warn',
  });
  const app = await appServe();
  const browser = await browserOpen(chromium);
  try {
    const { page } = browser;
    page.setDefaultTimeout(60_000);
    await editTimingInstall(page);
    await demoShopOpen(page, app.url);
    await rideFiguresOpen(page);
    const timings = await rideFiguresEditTimings(page);
    for (const [what, t] of Object.entries(timings)) console.log(editTimingText(`Ride figures, ${what}`, t));
    if (Object.values(timings).some((t) => Object.values(t.shown).some((ms) => ms === null)))
      process.exitCode = 1;
  } finally {
    await browser.close();
    await app.stop();
  }
}
