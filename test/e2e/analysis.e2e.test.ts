import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appServe, browserOpen, e2eChromium, type ServedApp } from './browser';
import { SCREENSHOT_DIR, demoShopOpen, screenshotSave, tabOrder, unlabelledControls } from './demo-shop';

const chromium = e2eChromium();

/** The text of a figure's cell in the ride-figures table. */
const cell = (page: Page, figure: string, corner: string) =>
  page.locator(`table.analysis-figures tr[data-figure="${figure}"] td[data-corner="${corner}"]`);

const legend = (page: Page, plot: string) =>
  page.locator(`figure[data-plot="${plot}"] .recharts-legend-item-text`).allInnerTexts();

/** A number at the start of a cell's text ("3.27 m/s²" → 3.27). */
const leadingNumber = async (page: Page, figure: string, corner: string) =>
  Number.parseFloat((await cell(page, figure, corner).innerText()).replace(/^⚠\s*/, ''));

describe.skipIf(!chromium)('Ride figures, in Chromium against the served app', () => {
  let app: ServedApp;
  let browser: Awaited<ReturnType<typeof browserOpen>>;
  let page: Page;

  beforeAll(async () => {
    app = await appServe();
    browser = await browserOpen(chromium as string);
    page = browser.page;
    await demoShopOpen(page, app.url);
  });

  afterAll(async () => {
    await browser?.close();
    await app?.stop();
  });

  it('opens a revision from its history and shows the figures per corner with units', async () => {
    await page.getByRole('button', { name: /Millbrook coupe #27/ }).click();
    await page
      .locator('.timeline li[data-revision="2"]')
      .getByRole('button', { name: 'Ride figures' })
      .click();
    await expect
      .poll(() => page.getByRole('heading', { level: 2 }).first().innerText())
      .toMatch(/Ride figures — Millbrook coupe #27, #2/);
    await cell(page, 'wheelRate', 'FL').waitFor();
    // Revision 2 fits 80 N/mm front springs at motion ratio 0.9: 80 × 0.81 = 64.8 N/mm [calc].
    expect(await cell(page, 'wheelRate', 'FL').innerText()).toBe('64.8 N/mm');
    expect(await cell(page, 'rideFrequency', 'RR').innerText()).toMatch(/^(⚠ )?\d\.\d\d Hz$/);
    expect(await cell(page, 'zetaRebound', 'FL').innerText()).toMatch(
      /\((underdamped|overdamped|critically damped)\)$/,
    );
    expect(await cell(page, 'bumpMaxCompression', 'FL').innerText()).toMatch(/ mm$/);
    expect(await cell(page, 'roadBodyAccelWeighted', 'FL').innerText()).toMatch(/ m\/s²$/);
    await expect
      .poll(() => page.getByRole('note', { name: 'Caution' }).innerText())
      .toMatch(/simplified model/);
    // Each corner's model warnings beside the figures: a list, or a plain "none".
    for (const p of ['FL', 'FR', 'RL', 'RR']) {
      const box = page.locator(`.corner-warning-box[data-corner="${p}"]`);
      const listed = await box.locator('li[data-warning]').count();
      expect(listed > 0 || (await box.innerText()).includes('None for this corner')).toBe(true);
    }
    // The demo coupe lifts a front tyre over the default bump: the warning sits on that figure too.
    expect(
      await page.locator('.corner-warning-box[data-corner="FL"] li[data-warning="tire-lift-off"]').count(),
    ).toBe(1);
    expect(await cell(page, 'bumpAirborne', 'FL').getAttribute('class')).toBe('has-warning');
    expect(await cell(page, 'bumpAirborne', 'FL').locator('.warn-mark').getAttribute('aria-label')).toMatch(
      /^warning: The tyre leaves the road/,
    );
    await screenshotSave(page, 'ride-figures-si');
  });

  it('draws the step, bump, frequency-response and random-road plots with a legend per corner', async () => {
    for (const id of ['step-body-accel', 'bump-travel', 'bump-tire-load', 'frf-body-accel', 'frf-travel'])
      expect(await legend(page, id)).toEqual(['FL', 'FR', 'RL', 'RR']);
    expect(await legend(page, 'road-body-accel')).toEqual([
      'Body acceleration RMS',
      'Wk-weighted (ISO 2631-1)',
    ]);
    expect(await page.locator('figure[data-plot="step-body-accel"] .plot-title').innerText()).toMatch(
      /linear model/,
    );
    expect(await page.locator('figure[data-plot="bump-body-accel"] .plot-title').innerText()).toMatch(
      /nonlinear model/,
    );
    expect(await page.locator('figure[data-plot="frf-body-accel"]').innerText()).toContain('Frequency (Hz)');
    // Four corners, each with a bar labelled by its value.
    await expect
      .poll(() => page.locator('figure[data-plot="road-travel"] .recharts-bar-rectangle').count())
      .toBe(4);
  });

  it('works the figures out again for another road class, and the RMS scales as ISO 8608 says', async () => {
    const before = await leadingNumber(page, 'roadBodyAccel', 'FL');
    await page.getByLabel('Road class (ISO 8608)').selectOption('E');
    await expect
      .poll(() => page.locator('table.analysis-figures').innerText())
      .toContain('class E at 80.0 km/h');
    // ISO 8608 [mem]: Gd(n0) rises 4× a class, so two classes is 16× the PSD and 4× the RMS (linear model).
    const after = await leadingNumber(page, 'roadBodyAccel', 'FL');
    expect(after / before).toBeGreaterThan(3.95);
    expect(after / before).toBeLessThan(4.05);
  });

  it('marks a wrong bump field beside it and keeps the last figures', async () => {
    const height = page.getByLabel('Bump height');
    await height.fill('abc');
    await expect
      .poll(() => page.locator('#analysis-bumpHeight-error').innerText())
      .toMatch(/could not read "abc"/);
    expect(await height.getAttribute('aria-invalid')).toBe('true');
    await expect.poll(() => page.getByText('The figures are for the last values that read').count()).toBe(1);
    expect(await cell(page, 'wheelRate', 'FL').innerText()).toBe('64.8 N/mm');
    await height.fill('40');
    await expect
      .poll(() => page.locator('table.analysis-figures').innerText())
      .toContain('Bump: 40.0 mm high');
  });

  it('switches to US units in place: figures, fields and axis labels', { timeout: 90_000 }, async () => {
    await page.getByLabel('Road speed').fill('100');
    await expect.poll(() => page.locator('table.analysis-figures').innerText()).toContain('at 100.0 km/h');
    await page.getByLabel('US', { exact: true }).check();
    // 64.8 N/mm = 370 lbf/in (1 lbf/in = 175.1268 N/m, NIST SP 811 [pub]).
    await expect.poll(() => cell(page, 'wheelRate', 'FL').innerText()).toBe('370 lbf/in');
    // The vehicle's scenario converted, to 4 significant figures: 100 km/h = 62.14 mph.
    expect(await page.getByLabel('Road speed').inputValue()).toBe('62.14');
    expect(await cell(page, 'bumpMaxCompression', 'FL').innerText()).toMatch(/ in$/);
    // Plots are redrawn one a task after the figures: the axis label follows a moment later.
    await expect
      .poll(() => page.locator('figure[data-plot="bump-travel"]').innerText(), { timeout: 30_000 })
      .toContain('Travel (in)');
    await screenshotSave(page, 'ride-figures-us');
  });

  it('saves a plot’s data as CSV with its units in the header', async () => {
    const download = page.waitForEvent('download');
    await page
      .locator('figure[data-plot="frf-body-accel"]')
      .getByRole('button', { name: /Save data \(CSV\)/ })
      .click();
    const file = await download;
    expect(file.suggestedFilename()).toBe('frf-body-accel.csv');
    const text = readFileSync((await file.path()) as string, 'utf8');
    const [header, first] = text.split('\r\n');
    expect(header).toBe(
      'FL: Frequency (Hz),FL: m/s² per in of road,FR: Frequency (Hz),FR: m/s² per in of road,' +
        'RL: Frequency (Hz),RL: m/s² per in of road,RR: Frequency (Hz),RR: m/s² per in of road',
    );
    expect(Number(first?.split(',')[0])).toBeCloseTo(0.3, 9);
  });

  it('saves a plot as a PNG image', async () => {
    const download = page.waitForEvent('download');
    await page
      .locator('figure[data-plot="road-body-accel"]')
      .getByRole('button', { name: /Save PNG/ })
      .click();
    const file = await download;
    expect(file.suggestedFilename()).toBe('road-body-accel.png');
    const bytes = readFileSync((await file.path()) as string);
    // The PNG signature (ISO/IEC 15948 [pub]): 89 50 4E 47 0D 0A 1A 0A; drawn at twice the screen size.
    expect([...bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    const width = bytes.readUInt32BE(16);
    const chart = page.locator(
      'figure[data-plot="road-body-accel"] .recharts-wrapper > svg.recharts-surface',
    );
    const shown = await chart.boundingBox();
    // The chart itself at twice its size, not a legend swatch (recharts draws those as small SVGs
    // too), and taller than the chart by the title and legend drawn above it.
    expect(width).toBe(Math.ceil((shown?.width ?? 0) * 2));
    expect(width).toBeGreaterThan(600);
    expect(bytes.readUInt32BE(20)).toBeGreaterThan(Math.ceil((shown?.height ?? 0) * 2) + 40);
    writeFileSync(join(SCREENSHOT_DIR, 'ride-figures-saved-plot.png'), bytes);
  });

  it('labels every control and reaches the road and bump fields by keyboard', async () => {
    expect(await unlabelledControls(page)).toEqual([]);
    const order = await tabOrder(page, 20);
    expect(order.slice(0, 6).every((o) => o.startsWith('button:'))).toBe(true); // the screens first
    expect(order).toContain('select:Road class (ISO 8608)');
    expect(order).toContain('input:Bump height');
    expect(order.some((o) => o.startsWith('select:Revision'))).toBe(true);
    expect(await page.locator('table.analysis-figures th[scope="row"]').count()).toBeGreaterThan(20);
  });
});
