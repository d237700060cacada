import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchChromium, shot, startProduct, type RunningProduct } from '../helpers/product';

let product: RunningProduct;
let browser: Browser;
let page: Page;
const pageErrors: string[] = [];

beforeAll(async () => {
  browser = await launchChromium();
  product = await startProduct();
  page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  page.on('pageerror', (e) => pageErrors.push(e.message));
}, 180_000);

afterAll(async () => {
  await browser?.close();
  await product?.stop();
});

describe('the foundation, as a person uses it in Chromium', () => {
  it('searches "brass" in the Catalogue and puts the search in the URL', async () => {
    await page.goto(`${product.url}/`);
    await page.getByRole('heading', { name: 'Catalogue' }).waitFor();
    await page.getByRole('searchbox', { name: 'Search the table' }).fill('brass');
    await page.getByRole('link', { name: 'Cartridge brass 70/30' }).waitFor();
    expect(new URL(page.url()).searchParams.get('q')).toBe('brass');
    const rows = await page.getByRole('row').count();
    expect(rows).toBeGreaterThan(3);
    await page.screenshot({ path: shot('e2e-catalogue-brass'), fullPage: true });
  });

  it('sorts by conductivity from the column header', async () => {
    await page.getByRole('button', { name: /Conductivity/ }).click();
    await expect
      .poll(() => new URL(page.url()).searchParams.get('sort'))
      .toMatch(/^-?conductivity$/);
    const descending = new URL(page.url()).searchParams.get('sort')!.startsWith('-');
    const header = page.getByRole('columnheader', { name: /Conductivity/ });
    await expect
      .poll(() => header.getAttribute('aria-sort'))
      .toBe(descending ? 'descending' : 'ascending');
    const values = await page.locator('tbody tr td:nth-child(4)').allTextContents();
    const numbers = values.map(Number);
    expect(numbers).toEqual([...numbers].sort((a, b) => (descending ? b - a : a - b)));
  });

  it('shows a clear empty state', async () => {
    await page.goto(`${product.url}/?q=zzqqxx-nothing`);
    await page.getByText('No alloy matches this search.').waitFor();
  });

  it('remembers the unit switcher across a reload', async () => {
    await page.goto(`${product.url}/?q=brass`);
    await page.getByLabel('Conductivity in').selectOption('MS/m');
    await page.getByRole('columnheader', { name: /Conductivity \(MS\/m\)/ }).waitFor();
    await page.reload();
    await page.getByRole('columnheader', { name: /Conductivity \(MS\/m\)/ }).waitFor();
    await page.getByLabel('Conductivity in').selectOption('%IACS');
  });

  it('opens an Alloy sheet with every value, its source and the from-memory flag', async () => {
    await page.getByRole('link', { name: 'Cartridge brass 70/30' }).click();
    await page.getByRole('heading', { name: 'Cartridge brass 70/30' }).waitFor();
    await page.getByRole('heading', { name: 'Values and sources' }).waitFor();
    await expect(page.getByText(/Copper Development Association/).count()).resolves.toBeGreaterThan(
      0,
    );
    await expect(page.getByText('from memory', { exact: true }).count()).resolves.toBeGreaterThan(
      0,
    );
    await expect(
      page.getByRole('rowheader', { name: /Electrical conductivity/ }).count(),
    ).resolves.toBe(1);
    await page.screenshot({ path: shot('e2e-alloy-sheet'), fullPage: true });
  });

  it('runs a Match for a cartridge-brass reading and sees C26000 among the first three', async () => {
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Match' })
      .click();
    await page.getByLabel('Conductivity or resistivity', { exact: true }).fill('28');
    await page.getByLabel('Density (optional)', { exact: true }).fill('8.53');
    await page.getByRole('button', { name: 'Find candidates' }).click();
    const list = page.getByRole('list', { name: 'Candidates, best first' });
    await list.waitFor();
    const firstThree = await list
      .locator(':scope > li')
      .evaluateAll((items) => items.slice(0, 3).map((li) => li.textContent ?? ''));
    expect(firstThree.some((text) => text.includes('C26000'))).toBe(true);
    await page.screenshot({ path: shot('e2e-match'), fullPage: true });
  });

  it('keeps what was typed and names the problem when the reading is bad', async () => {
    await page.getByLabel('Conductivity or resistivity', { exact: true }).fill('-4');
    await page.getByRole('button', { name: 'Find candidates' }).click();
    await page.getByText('conductivity must be greater than zero').waitFor();
    expect(await page.getByLabel('Conductivity or resistivity', { exact: true }).inputValue()).toBe(
      '-4',
    );
  });

  it('serves the API reference at /api/docs/', async () => {
    await page.goto(`${product.url}/api/docs/`);
    await page.getByText('Conductory API').first().waitFor();
    await page.screenshot({ path: shot('e2e-api-reference') });
  });

  it('raised no error in the page', () => {
    expect(pageErrors).toEqual([]);
  });
});
