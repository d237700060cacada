import fs from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BATCH_CSV_COLUMNS, BATCH_PLAN_CSV_COLUMNS } from '../../shared/match/batch-results';
import { demo } from '../helpers/access';
import { launchChromium, shot, startProduct, type RunningProduct } from '../helpers/product';

let product: RunningProduct;
let browser: Browser;
let page: Page;
const pageErrors: string[] = [];

beforeAll(async () => {
  browser = await launchChromium();
  product = await startProduct();
  page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
  page.on('pageerror', (e) => pageErrors.push(e.message));
  const { email, password } = demo('integrator');
  await page.goto(`${product.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Access', level: 1 }).waitFor();
}, 180_000);

afterAll(async () => {
  await browser?.close();
  await product?.stop();
});

/** The demo recycler's invented readings, with one bad row (row 3: no number). */
const FILE = [
  'id,conductivity (%IACS),temperature (C),density (g/cm3),frequency (kHz)',
  'R-102 brass fitting,25.6,27,8.49,60',
  'R-1xx smudged,abc,27,8.49,60',
  'R-103 copper nugget,97.8,27,8.90,60',
  '',
].join('\r\n');

describe('Match: many readings, as an integrator uses it in Chromium', () => {
  it('uploads a file with a bad row, shows the row by number, and downloads the results', async () => {
    await page.goto(`${product.url}/match`);
    const panel = page.getByRole('region', { name: 'Many readings' });
    await panel.getByRole('link', { name: 'template (CSV)' }).waitFor();
    await panel
      .getByLabel('CSV file of readings')
      .setInputFiles({ name: 'line-7.csv', mimeType: 'text/csv', buffer: Buffer.from(FILE) });
    // By keyboard: from the file field to the button, and Enter.
    await panel.getByLabel('CSV file of readings').focus();
    await page.keyboard.press('Tab');
    expect(
      await panel
        .getByRole('button', { name: 'Match the file' })
        .evaluate((b) => b === document.activeElement),
    ).toBe(true);
    await page.keyboard.press('Enter');

    const summary = panel.getByRole('status').filter({ hasText: 'readings from line-7.csv' });
    await summary.waitFor({ timeout: 60_000 });
    await expect(summary.textContent()).resolves.toMatch(
      /3 readings from line-7\.csv: 2 with candidates, 0 with none, 1 bad row/,
    );
    await expect(panel.getByRole('list', { name: 'Bad rows' }).textContent()).resolves.toMatch(
      /Row 3 \(R-1xx smudged\): conductivity 'abc' is not a number/,
    );
    const table = panel.getByRole('table', { name: /Batch results/ });
    await expect(table.getByRole('row').nth(2).textContent()).resolves.toMatch(
      /^3R-1xx smudgedBad row: conductivity 'abc' is not a number$/,
    );
    await page.screenshot({ path: shot('e2e-match-batch'), fullPage: true });

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      panel.getByRole('button', { name: 'Download the results (CSV)' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('line-7-matched.csv');
    const csv = fs.readFileSync((await download.path())!, 'utf8').split('\r\n');
    expect(csv[0]).toBe(BATCH_CSV_COLUMNS.join(','));
    expect(csv[1]).toMatch(/^2,R-102 brass fitting,matched,,/);
    expect(csv[2]).toMatch(/^3,R-1xx smudged,error,conductivity 'abc' is not a number,/);
    expect(csv[3]).toMatch(/^4,R-103 copper nugget,matched,,/);
    expect(pageErrors).toEqual([]);
  }, 120_000);

  it('sorts a file by a saved plan: product, none, the frequency used, and the CSV in that shape', async () => {
    await page.goto(`${product.url}/match`);
    // A plan of two well-separated products, saved as the Sort Planner saves it (same origin).
    const saved = await page.evaluate(async () => {
      const mm = (value: number) => ({ value, unit: 'mm' });
      const res = await fetch('/api/v1/sort-plans', {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({
          name: 'Copper or stainless',
          plan: {
            products: [
              { name: 'copper', alloy: 'copper-c11000' },
              { name: 'stainless', alloy: 'stainless-304' },
            ],
            coil: { innerRadius: mm(1.5), outerRadius: mm(3), length: mm(2), turns: 100 },
            frequencies: [{ value: 10, unit: 'kHz' }],
            liftOff: { min: mm(0.5), max: mm(0.5) },
            temperature: { min: { value: 15, unit: '°C' }, max: { value: 35, unit: '°C' } },
            method: { kind: 'interval' },
          },
        }),
      });
      return (await res.json()) as { id: number };
    });
    expect(saved.id).toBeGreaterThan(0);
    await page.reload();
    const panel = page.getByRole('region', { name: 'Many readings' });
    await panel
      .getByLabel('Sort by a saved plan (optional)')
      .selectOption({ value: String(saved.id) });
    await panel.getByLabel('CSV file of readings').setInputFiles({
      name: 'line-8.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from(
        [
          'id,conductivity (%IACS),temperature (C),frequency (kHz)',
          'cu,100,20,10',
          'gap,30,20,10',
          'bad,x,20,10',
          '',
        ].join('\r\n'),
      ),
    });
    await panel.getByRole('button', { name: 'Sort the file' }).click();
    const summary = panel.getByRole('status').filter({ hasText: 'readings from line-8.csv' });
    await summary.waitFor({ timeout: 60_000 });
    await expect(summary.textContent()).resolves.toMatch(
      /3 readings from line-8\.csv sorted by the plan Copper or stainless \(table [^)]+\): 1 to a product, 1 to none, 0 ambiguous, 1 bad row/,
    );
    const table = panel.getByRole('table', { name: /Batch results/ });
    await expect(table.getByRole('row').nth(1).textContent()).resolves.toMatch(
      /^2cu.*10 kHz.*nearest the reading.*copper—$/,
    );
    await expect(table.getByRole('row').nth(2).textContent()).resolves.toMatch(
      /^3gap.*none: no window holds it/,
    );
    await page.screenshot({ path: shot('e2e-match-batch-plan'), fullPage: true });
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      panel.getByRole('button', { name: 'Download the results (CSV)' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('line-8-sorted.csv');
    const csv = fs.readFileSync((await download.path())!, 'utf8').split('\r\n');
    expect(csv[0]).toBe(BATCH_PLAN_CSV_COLUMNS.join(','));
    expect(csv[1]).toMatch(/^2,cu,product,,.*,10000,reading,copper,copper,$/);
    expect(csv[2]).toMatch(/^3,gap,none,,/);
    expect(csv[3]).toMatch(/^4,bad,error,conductivity 'x' is not a number,/);
    expect(pageErrors).toEqual([]);
  }, 120_000);

  it('a file the service refuses says why', async () => {
    await page.goto(`${product.url}/match`);
    const panel = page.getByRole('region', { name: 'Many readings' });
    await panel.getByLabel('CSV file of readings').setInputFiles({
      name: 'wrong.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from('id,colour\r\nx,red\r\n'),
    });
    await panel.getByRole('button', { name: 'Match the file' }).click();
    await expect(panel.getByRole('alert').textContent({ timeout: 30_000 })).resolves.toMatch(
      /Unknown column\(s\): "colour"/,
    );
  }, 60_000);
});
