import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demo } from '../helpers/access';
import { launchChromium, shot, startProduct, type RunningProduct } from '../helpers/product';

let product: RunningProduct;
let browser: Browser;
let author: Page;
let reviewer: Page;

async function signIn(page: Page, email: string, password: string) {
  await page.goto(`${product.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Access' }).waitFor();
}

beforeAll(async () => {
  browser = await launchChromium();
  product = await startProduct();
  author = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
  reviewer = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
  await signIn(author, demo('curator').email, demo('curator').password);
  await signIn(reviewer, 'curator2@carrowbay.example', 'curator2-demo-2026');
}, 180_000);

afterAll(async () => {
  await browser?.close();
  await product?.stop();
});

describe('curation, as two curators use it in Chromium', () => {
  it('one curator proposes a change with a source', async () => {
    await author.goto(`${product.url}/alloys/red-brass-c23000`);
    await author.getByText('Propose a change (curators)').click();
    await author.getByLabel('Conductivity, nominal', { exact: true }).fill('36.5');
    await author
      .getByLabel('Source: citation (required)')
      .fill('Strip certificates, lot 12 (invented for the test)');
    await author.getByLabel('Reason (required)').fill('Certificates read 36.5 %IACS');
    await author.getByRole('button', { name: 'Propose for review' }).click();
    await author.getByText(/Proposed as revision \d+/).waitFor();
    await author.screenshot({ path: shot('e2e-propose'), fullPage: true });
  });

  it('another approves it on the Review Desk', async () => {
    await reviewer.goto(`${product.url}/review`);
    const card = reviewer.getByRole('listitem').filter({ hasText: 'Red brass 85/15' });
    await card.waitFor();
    await expect(card.textContent()).resolves.toMatch(/Strip certificates, lot 12/);
    await reviewer.screenshot({ path: shot('e2e-review-desk'), fullPage: true });
    await card.getByLabel('Comment').fill('checked against the certificates');
    await card.getByRole('button', { name: 'Approve' }).click();
    await reviewer.getByText('Nothing waits for review.').waitFor();
  });

  it('the change shows in the Alloy sheet’s history with both names', async () => {
    await author.goto(`${product.url}/alloys/red-brass-c23000`);
    const row = author.getByRole('row').filter({ hasText: /Conductivity.*36\.5 %IACS/ });
    await row.waitFor();
    const text = (await row.textContent()) ?? '';
    expect(text).toContain('curator@carrowbay.example');
    expect(text).toContain('curator2@carrowbay.example');
    await author.screenshot({ path: shot('e2e-history'), fullPage: true });
  });

  it('an import with one bad row is refused, naming the row', async () => {
    await reviewer.goto(`${product.url}/review`);
    const csv =
      'slug,conductivity_ms_m,frequency_khz,temperature_c,uncertainty_percent,sample,instrument\nlead,4.8,60,20,2,sheet,probe\ntin,-3,60,20,2,ingot,probe\n';
    await reviewer
      .getByLabel('CSV or JSON file')
      .setInputFiles({ name: 'set.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await reviewer.getByRole('button', { name: 'Check the file' }).click();
    const alert = reviewer.getByRole('alert').filter({ hasText: 'nothing was imported' });
    await alert.waitFor();
    await expect(alert.textContent()).resolves.toMatch(/row 3, conductivity_ms_m/);
    await reviewer.screenshot({ path: shot('e2e-import-bad-row'), fullPage: true });
  });
});
