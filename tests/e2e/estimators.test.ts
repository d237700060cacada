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
  page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
  page.on('pageerror', (e) => pageErrors.push(e.message));
}, 180_000);

afterAll(async () => {
  await browser?.close();
  await product?.stop();
});

describe('the estimators, as a person uses them in Chromium', () => {
  it('Layer Lab compares a plated and a solid demo coin and draws two different curves', async () => {
    await page.goto(`${product.url}/layer-lab`);
    await page.getByRole('heading', { name: 'Layer Lab' }).waitFor();
    await page.getByRole('group', { name: 'Estmark 1 mark' }).waitFor();
    await page.getByRole('group', { name: 'Estmark 5 marks' }).waitFor();
    await page.getByRole('button', { name: 'Compare the blanks' }).click();
    await page.getByText(/computed in \d+ ms/).waitFor({ timeout: 60_000 });
    const chart = page
      .getByRole('figure')
      .filter({ hasText: 'Apparent conductivity against frequency' });
    const paths = chart.locator('.recharts-line path.recharts-curve');
    await expect.poll(() => paths.count()).toBe(2);
    const [a, b] = await paths.evaluateAll((els) => els.map((e) => e.getAttribute('d') ?? ''));
    expect(a!.length).toBeGreaterThan(100);
    expect(a).not.toBe(b);
    await page.getByRole('row', { name: /Launch height/ }).waitFor();
    expect(new URL(page.url()).searchParams.get('s')).toBeTruthy();
    await page.screenshot({ path: shot('e2e-layer-lab'), fullPage: true });
  });

  it('Pulse Bench runs a launch, shows the result and a caution that comes back', async () => {
    await page.goto(`${product.url}/pulse-bench`);
    const caution = page.getByRole('note', { name: 'Caution' });
    await expect(caution.textContent()).resolves.toMatch(/capacitor bank can kill/);
    await page.getByRole('button', { name: 'Fire (simulated)' }).click();
    await page
      .getByRole('region', { name: 'Launch of Estmark 5 marks' })
      .waitFor({ timeout: 60_000 });
    await expect(page.getByText('Peak current').first().isVisible()).resolves.toBe(true);
    await page.getByRole('region', { name: 'Collection bins' }).waitFor();
    await page.screenshot({ path: shot('e2e-pulse-bench'), fullPage: true });
    await page.getByRole('button', { name: 'Fold away for this visit' }).click();
    await expect(caution.textContent()).resolves.toMatch(/can kill/);
    await page.reload();
    await page.getByRole('button', { name: 'Fold away for this visit' }).waitFor();
  });

  it('the Alloy sheet gives skin depths at common test frequencies', async () => {
    await page.goto(`${product.url}/alloys/copper-c11000`);
    await page.getByRole('heading', { name: 'Skin depth' }).waitFor();
    // δ of 101 %IACS copper at 1 MHz: 1/√(π·1e6·µ0·58.58e6) = 65.8 µm (physics.md: 66.1 µm at 100 %IACS)
    await expect(page.getByRole('row', { name: /^1 MHz/ }).textContent()).resolves.toMatch(
      /65\.8 µm/,
    );
    await page.screenshot({ path: shot('e2e-alloy-sheet-skin-depth'), fullPage: true });
  });

  it('raised no error in the page', () => {
    expect(pageErrors).toEqual([]);
  });
});
