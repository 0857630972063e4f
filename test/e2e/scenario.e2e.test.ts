import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { UnitSystem } from '../../core/units/units';
import { figureNumbersRead } from '../renderer/figure-read-back';
import { appServe, browserOpen, e2eChromium, type ServedApp } from './browser';
import { demoShopOpen, screenOpen, screenshotSave } from './demo-shop';

const chromium = e2eChromium();
const COUPE = 'Millbrook coupe #27';

/** Every row of the ride-figures table (group titles included), by its figure key or title. */
async function figureRows(page: Page): Promise<Map<string, string>> {
  const rows = await page
    .locator('table.analysis-figures tr')
    .evaluateAll((trs) =>
      trs.map((tr, i) => [tr.getAttribute('data-figure') ?? `row ${i}`, (tr as HTMLElement).innerText]),
    );
  return new Map(rows as [string, string][]);
}

/** Waits until no figures are being worked out, twice in a row a moment apart. */
async function figuresSettled(page: Page): Promise<void> {
  let quiet = 0;
  for (let i = 0; i < 120 && quiet < 3; i++) {
    await page.waitForTimeout(400);
    const busy =
      (await page.locator('.progress').count()) > 0 ||
      (await page.getByText('Working out the figures').count()) > 0;
    quiet = busy ? 0 : quiet + 1;
  }
}

/** Each row's numbers read back to SI from the text shown in `system`. */
const rowsInSi = (rows: Map<string, string>, system: UnitSystem) =>
  new Map([...rows].map(([k, text]) => [k, figureNumbersRead(text.replace(/⚠/g, ''), system)]));

const unitsPick = (page: Page, system: 'SI' | 'US') =>
  page.getByRole('radio', { name: system, exact: true }).check();

describe.skipIf(!chromium)('one scenario per vehicle, in either unit system (Chromium)', () => {
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

  it('switching to US units converts the scenario and leaves every figure where it was', async () => {
    await page.getByRole('button', { name: new RegExp(COUPE) }).click();
    await page
      .locator('.timeline li[data-revision="2"]')
      .getByRole('button', { name: 'Ride figures' })
      .click();
    await page.locator('table.analysis-figures tr[data-figure="bumpPeakAccel"]').waitFor();
    await figuresSettled(page);
    const panel = page.getByTestId('scenario-panel');
    await expect.poll(() => panel.getByLabel('Bump height').inputValue()).toBe('25');
    expect(await panel.getByLabel('Road speed').inputValue()).toBe('80');
    expect(await panel.innerText()).toMatch(/starting scenario/);
    await screenshotSave(page, 'scenario-ride-figures-si');
    const si = await figureRows(page);
    expect(si.size).toBeGreaterThan(30);

    await unitsPick(page, 'US');
    // The fields show the same bump and road, converted: 25 mm = 0.9843 in, 80 km/h = 49.71 mph
    // (1 in = 25.4 mm, 1 mi = 1.609344 km exactly, NIST SP 811 [pub]) — not a new 1 in bump at 30 mph.
    await expect.poll(() => panel.getByLabel('Bump height').inputValue()).toBe('0.9843');
    expect(await panel.getByLabel('Road speed').inputValue()).toBe('49.71');
    expect(await panel.getByLabel('Bump speed').inputValue()).toBe('31.07');
    await page.waitForTimeout(1000);
    await figuresSettled(page);
    const us = await figureRows(page);
    expect([...us.keys()]).toEqual([...si.keys()]);
    expect(us.get('wheelRate')).toMatch(/lbf\/in/);
    // Read back to SI, every number of every row agrees within the rounding of the two texts.
    const a = rowsInSi(si, 'si');
    const b = rowsInSi(us, 'us');
    for (const [key, numbers] of a) {
      const other = b.get(key) ?? [];
      expect(other.length, `${key}: ${si.get(key)} | ${us.get(key)}`).toBe(numbers.length);
      numbers.forEach((n, i) => {
        const m = other[i] as (typeof other)[number];
        expect(
          Math.abs(n.si - m.si),
          `${key}: "${si.get(key)}" in SI against "${us.get(key)}" in US`,
        ).toBeLessThanOrEqual(n.halfStep + m.halfStep + 1e-12);
      });
    }
    await screenshotSave(page, 'scenario-ride-figures-us');

    // And back: the very same texts as before the switch.
    await unitsPick(page, 'SI');
    await page.waitForTimeout(1000);
    await figuresSettled(page);
    expect(await figureRows(page)).toEqual(si);
    expect(await panel.getByLabel('Bump height').inputValue()).toBe('25');
  }, 120_000);

  it('stores an edit for the vehicle: Compare and Valving judge on it, and a reload keeps it', async () => {
    await unitsPick(page, 'US');
    const panel = page.getByTestId('scenario-panel');
    await panel.getByLabel('Bump height').fill('1.5');
    await panel.getByLabel('Road class (ISO 8608)').selectOption('D');
    await expect
      .poll(() => page.locator('table.analysis-figures').innerText(), { timeout: 30_000 })
      .toMatch(/Bump: 1\.5 in high/);
    await expect.poll(() => panel.innerText()).toMatch(/The scenario stored for Millbrook coupe #27/);

    await page.reload();
    await page.getByRole('button', { name: new RegExp(COUPE) }).waitFor();
    await page.getByRole('button', { name: new RegExp(COUPE) }).click();
    await page.getByLabel('pick #1').check();
    await page.getByLabel('pick #2').check();
    await page.getByRole('button', { name: /Compare picked \(2\)/ }).click();
    const compare = page.getByTestId('scenario-panel');
    // 1.5 in = 38.1 mm exactly (NIST SP 811 [pub]); the page opens in the units last chosen.
    await expect.poll(() => compare.getByLabel('Bump height').inputValue()).toBe('1.5');
    expect(await compare.getByLabel('Road class (ISO 8608)').inputValue()).toBe('D');
    await page.getByTestId('compare-table').waitFor();
    await screenshotSave(page, 'scenario-compare-us');
    await unitsPick(page, 'SI');
    await expect.poll(() => compare.getByLabel('Bump height').inputValue()).toBe('38.1');
    await page.getByTestId('compare-table').waitFor();
    await screenshotSave(page, 'scenario-compare-si');

    await screenOpen(page, 'Valving');
    await page.getByLabel('Vehicle').selectOption(COUPE);
    const valving = page.getByTestId('scenario-panel');
    await expect.poll(() => valving.getByLabel('Bump height').inputValue()).toBe('38.1');
    expect(await valving.getByLabel('Curb height').inputValue()).toBe('40');
    await screenshotSave(page, 'scenario-valving-si');
  }, 120_000);
});
