import { mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PROJECT_ROOT, appServe, browserOpen, e2eChromium, type ServedApp } from './browser';

const chromium = e2eChromium();
const SHOTS = join(PROJECT_ROOT, 'test-results');

/**
 * A shop's day in the browser, against `npm run serve`'s backend on a temp database: the
 * caution notice, the demo, a new vehicle entered in US units with its live figures, two
 * saves, and the diff of the two revisions.
 */
describe.skipIf(!chromium)('the shop workflow in a real Chromium', () => {
  let app: ServedApp;
  let browser: Awaited<ReturnType<typeof browserOpen>>;
  let page: Page;
  const pageErrors: string[] = [];

  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    app = await appServe();
    browser = await browserOpen(chromium as string);
    page = browser.page;
    page.setDefaultTimeout(20_000); // generous: the suite shares two cores with the unit tests
    page.on('pageerror', (e) => pageErrors.push(e.message));
  });
  afterAll(async () => {
    await browser?.close();
    await app?.stop();
  });

  const shot = (name: string) => page.screenshot({ path: join(SHOTS, `${name}.png`), fullPage: true });

  it('shows the caution notice first and offers the demo, then loads it', async () => {
    await page.goto(app.url);
    const notice = page.getByRole('dialog', { name: 'Before you use RideLedger' });
    await notice.getByText(/qualified vehicle or suspension engineer/).waitFor();
    await shot('01-caution-notice');
    await notice.getByRole('button', { name: 'I understand' }).click();
    const offer = page.getByRole('dialog', { name: 'Start with the demo shop?' });
    await offer.getByRole('button', { name: 'Load the demo shop' }).click();
    await page.getByRole('button', { name: /Millbrook coupe #27/ }).waitFor();
    await page.getByRole('button', { name: /Millbrook single-seater #9/ }).waitFor();
    await page.getByRole('button', { name: /Millbrook coupe #27/ }).click();
    await page.getByRole('list', { name: 'Revisions, oldest first' }).waitFor();
    await expect.poll(() => page.locator('.timeline li').count()).toBe(6);
    await shot('02-vehicles-and-history');
  });

  it('does not show the notice again once acknowledged', async () => {
    await page.reload();
    await page.getByRole('navigation', { name: 'Screens' }).waitFor();
    await page.getByRole('button', { name: /Millbrook coupe #27/ }).waitFor();
    expect(await page.getByRole('dialog').count()).toBe(0);
  });

  it('creates a vehicle and enters its first setup in US units with live figures', async () => {
    await page.getByRole('radio', { name: 'US' }).check();
    await page.getByLabel('Name', { exact: true }).fill('Test hatch #5');
    await page.getByLabel('Class or type').fill('club hatch');
    await page.getByRole('button', { name: 'Add vehicle' }).click();
    await page.getByRole('heading', { name: 'Test hatch #5' }).waitFor();
    await page.getByRole('button', { name: 'Enter the first setup' }).click();
    await page.getByRole('heading', { name: /Setup sheet — Test hatch #5/ }).waitFor();
    await page.getByLabel('Setup name *').fill('Baseline');
    // Corner values as a US shop writes them: lb, lbf/in, lbf·s/in.
    const corner = {
      cornerMass: '650',
      unsprungMass: '84',
      springRate: '400',
      springMotionRatio: '0.9',
      tireRate: '1370',
      bumpLow: '15',
      reboundLow: '26',
    };
    for (const p of ['FL', 'FR', 'RL', 'RR']) {
      const card = page.getByRole('group', { name: new RegExp(`\\(${p}\\)$`) });
      await card.getByLabel('Corner mass *').fill(corner.cornerMass);
      await card.getByLabel('Unsprung mass *').fill(corner.unsprungMass);
      await card.getByLabel('Spring rate *').fill(p.startsWith('R') ? '450' : corner.springRate);
      await card.getByLabel('Spring motion ratio *').fill(corner.springMotionRatio);
      await card.getByLabel('Tyre rate *').fill(corner.tireRate);
      await card.getByLabel('Bump, low speed *').fill(corner.bumpLow);
      await card.getByLabel('Rebound, low speed *').fill(corner.reboundLow);
    }
    expect(await page.getByText('lbf/in').count()).toBeGreaterThan(4);
    // Hand check: kw = 400 lbf/in × 0.9² = 324 lbf/in = 56 741 N/m; ms = (650 − 84) lb = 256.7 kg; kt = 1370 lbf/in;
    // ride rate kw·kt/(kw+kt) → ride frequency √(kr/ms)/2π = 2.13 Hz (DESIGN.md conventions) [calc].
    const live = page.getByTestId('live-FL');
    await expect(live.locator('[data-figure="rideFrequencyHz"]').textContent()).resolves.toBe('2.13 Hz');
    await live.getByText('324 lbf/in').waitFor();
    // Rear 450 lbf/in: √ of the ride-rate ratio → rear ÷ front = 1.048 [calc].
    await expect(page.getByTestId('balance').textContent()).resolves.toMatch(/rear ÷ front 1\.05/);
    await shot('03-setup-sheet-us-units');
  });

  it('marks a bad field beside it and refuses to save it', async () => {
    const card = page.getByRole('group', { name: /\(FL\)$/ });
    await card.getByLabel('Spring rate *').fill('400 kg');
    await expect(card.getByRole('alert').first().textContent()).resolves.toMatch(/got "400 kg" \(a mass\)/);
    await page.getByRole('button', { name: 'Save as new revision' }).click();
    await expect(page.getByRole('status').first().textContent()).resolves.toMatch(
      /Not saved: 1 field needs attention/,
    );
    await card.getByLabel('Spring rate *').fill('400');
  });

  it('saves, changes a spring rate, saves again, and diffs the two revisions', async () => {
    await page.getByRole('button', { name: 'Save as new revision' }).click();
    await page.getByText(/Saved as revision #1/).waitFor();
    const card = page.getByRole('group', { name: /\(FL\)$/ });
    await card.getByLabel('Spring rate *').fill('500');
    const fr = page.getByRole('group', { name: /\(FR\)$/ });
    await fr.getByLabel('Spring rate *').fill('500');
    await page.getByRole('button', { name: 'Save as new revision' }).click();
    // The line saying what changed speaks the units the sheet was entered in.
    await page.getByText('Saved as revision #2: spring rate front 400→500 lbf/in').waitFor();
    // Saving again untouched adds nothing.
    await page.getByRole('button', { name: 'Save as new revision' }).click();
    await page.getByText('Nothing to save: the sheet is as revision #2 has it.').waitFor();
    await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Vehicles' }).click();
    await page.getByRole('button', { name: /Test hatch #5/ }).click();
    await page.getByLabel('pick #1').check();
    await page.getByLabel('pick #2').check();
    await page.getByRole('button', { name: 'Diff the two picked' }).click();
    const diff = page.getByTestId('diff');
    await diff.getByRole('table', { name: 'Changed fields' }).waitFor();
    const rows = diff.getByRole('table', { name: 'Changed fields' }).locator('tbody tr');
    expect(await rows.count()).toBe(2);
    await expect(rows.first().textContent()).resolves.toMatch(/spring rate.*FL.*400.*500.*lbf\/in/);
    const figures = diff.getByRole('table', { name: 'Changed figures' }).locator('tbody tr');
    expect(await figures.allTextContents()).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/^FL.*ride frequency/),
        expect.stringMatching(/^FR.*ride frequency/),
      ]),
    );
    await diff.getByRole('note', { name: 'Caution' }).waitFor();
    await shot('04-diff');
  });

  it('prints the setup sheet: every corner field and the headline figures, no inputs', async () => {
    await page.getByRole('button', { name: /New revision from #2/ }).click();
    await page.getByRole('group', { name: /\(RR\)$/ }).waitFor();
    // The browser's print dialog is replaced by a note that it was asked for.
    await page.evaluate(() => {
      (window as unknown as { printed: number }).printed = 0;
      window.print = () => void ((window as unknown as { printed: number }).printed += 1);
    });
    await page.getByRole('button', { name: 'Print sheet / PDF' }).click();
    const sheet = page.getByRole('region', { name: 'Setup sheet for printing' });
    await sheet.waitFor();
    await expect(sheet.locator('input').count()).resolves.toBe(0);
    await sheet.getByText(/qualified vehicle or suspension engineer/).waitFor();
    await expect(sheet.getByRole('row', { name: /Spring rate \(lbf\/in\)/ }).textContent()).resolves.toMatch(
      /500.*500.*450.*450/,
    );
    await shot('05-print-sheet');
    await page.getByRole('group', { name: /\(RR\)$/ }).waitFor();
    expect(await page.evaluate(() => (window as unknown as { printed: number }).printed)).toBe(1);
    await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Vehicles' }).click();
    await page.getByRole('button', { name: /Test hatch #5/ }).click();
  });

  it('keeps unsaved changes through a reload and offers them back', async () => {
    await page.getByRole('button', { name: /New revision from #2/ }).click();
    const card = page.getByRole('group', { name: /\(RR\)$/ });
    await card.getByLabel('Ride height').fill('4.25');
    await page.getByRole('heading', { name: /• unsaved/ }).waitFor();
    await page.waitForTimeout(1200); // the draft is written a moment after the last change
    await page.reload();
    await page.getByRole('button', { name: /Test hatch #5/ }).click();
    await page.getByRole('button', { name: /New revision from #2/ }).click();
    await page.getByRole('button', { name: 'Restore them' }).click();
    await expect(
      page
        .getByRole('group', { name: /\(RR\)$/ })
        .getByLabel('Ride height')
        .inputValue(),
    ).resolves.toBe('4.25');
    await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Vehicles' }).click();
    await page.getByRole('button', { name: /Test hatch #5/ }).click();
  });

  it('compares the two revisions with overlaid plots and a delta table', async () => {
    // Picks belong to the page: the reload above cleared them.
    await page.getByLabel('pick #1').check();
    await page.getByLabel('pick #2').check();
    await page.getByRole('button', { name: /Compare picked \(2\)/ }).click();
    const table = page.getByTestId('compare-table');
    await table.waitFor();
    // Front springs 400 → 500 lbf/in: the FL ride frequency 2.128 → 2.324 Hz by √(kr/ms)/2π [calc, python].
    const ride = table.locator('tbody tr').filter({ hasText: /^ride frequency/ });
    await expect(ride.textContent()).resolves.toMatch(/2\.13 Hz.*2\.32 Hz/);
    expect(
      await table
        .locator('td[data-verdict="better"], td[data-verdict="worse"], td[data-verdict="same"]')
        .count(),
    ).toBeGreaterThan(5);
    const plot = page.locator('[data-plot="compare-frf-body-accel-FL"]');
    await plot.waitFor();
    const legend = await plot.locator('.recharts-legend-item-text').allTextContents();
    expect(legend).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/Test hatch #5 #1/),
        expect.stringMatching(/Test hatch #5 #2/),
      ]),
    );
    await page.getByRole('note', { name: 'Caution' }).first().waitFor();
    await shot('05-compare');
  });

  it('exports a plot’s data as CSV', async () => {
    const plot = page.locator('[data-plot="compare-frf-body-accel-FL"]');
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      plot.getByRole('button', { name: 'Save data (CSV)' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('compare-frf-body-accel-FL.csv');
    const path = await download.path();
    const text = readFileSync(path, 'utf8');
    const [header, first] = text.split(/\r?\n/);
    expect(header).toMatch(/Test hatch #5 #1/);
    expect(header).toMatch(/frequency/);
    expect(first?.split(',').length).toBeGreaterThanOrEqual(4);
  });

  it('ranks the demo damper’s clicks with the caution beside the recommendation', async () => {
    await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: 'Valving' }).click();
    await page.getByLabel('Vehicle').selectOption('Millbrook coupe #27');
    // The map shown before the choice stays until the new vehicle's map replaces it.
    const heatMap = page.locator('[data-testid="heat-map"][data-vehicle="Millbrook coupe #27"]');
    await heatMap.waitFor();
    await expect.poll(() => heatMap.locator('tbody tr').count()).toBe(5);
    // The knee and the modes over the same grid, and every figure of every click in one table.
    await page.getByLabel('Figure', { exact: true }).selectOption({ label: 'knee speed, bump' });
    await expect.poll(() => heatMap.locator('tbody td').first().textContent()).toMatch(/^\d+\.\d+ in\/s/);
    await page.getByLabel('Figure', { exact: true }).selectOption({ label: 'body mode, frequency' });
    await expect.poll(() => heatMap.locator('tbody td').first().textContent()).toMatch(/^\d\.\d\d Hz/);
    await page.getByText(/^Every figure at each click \(25 rows\)/).click();
    const everything = page.getByRole('table', { name: 'Every figure over the clicks at FL' });
    await expect.poll(() => everything.locator('tbody tr').count()).toBe(25);
    await page.getByLabel('Figure', { exact: true }).selectOption({ label: 'ζ low speed, mean' });
    for (const p of ['FR', 'RL', 'RR']) await page.getByRole('checkbox', { name: p, exact: true }).uncheck();
    await page.getByRole('button', { name: 'Find the best clicks' }).click();
    const rec = page.getByTestId('recommendation');
    await rec.waitFor({ timeout: 30_000 });
    await expect(
      rec.getByRole('note', { name: 'Caution beside the recommendation' }).textContent(),
    ).resolves.toMatch(/qualified vehicle or suspension engineer.*make one change at a time/);
    await expect(rec.locator('summary').first().textContent()).resolves.toMatch(
      /^#1: bump \d+, rebound \d+ — meets \d+ of \d+ checks/,
    );
    await shot('06-valving');
    // Another car starts on the damper unit its own corners record.
    await page.getByLabel('Vehicle').selectOption('Millbrook single-seater #9');
    await page.locator('[data-testid="heat-map"][data-vehicle="Millbrook single-seater #9"]').waitFor();
    await expect(page.getByLabel('Damper').inputValue()).resolves.toBe('MB-SA-1');
  });

  it('raised no error in the page', () => {
    expect(pageErrors).toEqual([]);
  });
});
