// Issue 9: the API reference carries our header with a way back, and axe finds nothing critical.
import { AxeBuilder } from '@axe-core/playwright';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchChromium, shot, startProduct, type RunningProduct } from '../helpers/product';

let product: RunningProduct;
let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
  product = await startProduct();
}, 180_000);
afterAll(async () => {
  await browser?.close();
  await product?.stop();
});

describe('the API reference', () => {
  it('has our header, leads back to the product, and has no critical axe violation', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await page.goto(`${product.url}/api/docs/`);
    await page.locator('.swagger-ui .info').waitFor();
    await page.getByRole('link', { name: '← Conductory' }).waitFor();
    await page.screenshot({ path: shot('e2e-api-reference') });
    const result = await new AxeBuilder({ page }).analyze();
    const critical = result.violations.filter((v) => v.impact === 'critical');
    expect(
      critical.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`),
    ).toEqual([]);
    await page.getByRole('link', { name: '← Conductory' }).click();
    await page.getByRole('heading', { name: 'Catalogue' }).waitFor();
    await context.close();
  });
});
