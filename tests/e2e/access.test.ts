import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demo } from '../helpers/access';
import { launchChromium, shot, startProduct, type RunningProduct } from '../helpers/product';

let product: RunningProduct;
let browser: Browser;
let newcomer: BrowserContext;
let operator: BrowserContext;
let page: Page;
let adminPage: Page;
const person = {
  name: 'Test Sorter',
  email: `sorter-${Date.now()}@ridgeline.example`,
  password: 'eddy-current-line-7',
};
let key = '';

beforeAll(async () => {
  browser = await launchChromium();
  product = await startProduct();
  newcomer = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  operator = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  page = await newcomer.newPage();
  adminPage = await operator.newPage();
}, 180_000);

afterAll(async () => {
  await browser?.close();
  await product?.stop();
});

describe('a newcomer signs up, verifies by the mailed link, signs in and uses a key', () => {
  it('signs up', async () => {
    await page.goto(`${product.url}/sign-up`);
    await page.getByLabel('Name').fill(person.name);
    await page.getByLabel('E-mail').fill(person.email);
    await page.getByLabel(/^Password/).fill(person.password);
    await page.getByRole('button', { name: 'Create the account' }).click();
    await page.getByRole('heading', { name: 'Check your mail' }).waitFor();
    await page.screenshot({ path: shot('e2e-sign-up') });
  });

  let link = '';
  it('the Outbox shows the admin the mail with its token masked', async () => {
    await adminPage.goto(`${product.url}/sign-in`);
    await adminPage.getByLabel('E-mail').fill(demo('admin').email);
    await adminPage.getByLabel('Password').fill(demo('admin').password);
    await adminPage.getByRole('button', { name: 'Sign in' }).click();
    await adminPage.getByRole('heading', { name: 'Access' }).waitFor();
    await adminPage.goto(`${product.url}/admin/outbox`);
    const message = adminPage
      .getByRole('listitem')
      .filter({ hasText: `to ${person.email}` })
      .first();
    await message.waitFor({ timeout: 20_000 });
    const shown = (await message.textContent()) ?? '';
    expect(shown).toContain(`${product.url}/verify?token=••••••••`);
    await adminPage.screenshot({ path: shot('e2e-outbox'), fullPage: true });
  });

  it('the developer who runs the product reads the real link on its console', async () => {
    const prefix = `Mail to ${person.email}: `;
    // The line follows the outbox copy by a moment and comes through a pipe.
    for (let waited = 0; !product.output.includes(prefix) && waited < 10_000; waited += 100)
      await new Promise((r) => setTimeout(r, 100));
    const line = product.output.split('\n').find((l) => l.startsWith(prefix));
    link = line?.slice(prefix.length).trim() ?? '';
    expect(link.startsWith(`${product.url}/verify?token=`)).toBe(true);
    const token = link.split('token=')[1]!;
    expect(token).toMatch(/^[\w-]{43}$/); // 32 random bytes, base64url
    const outbox = adminPage.getByRole('list', { name: 'Messages, newest first' });
    expect(await outbox.textContent()).not.toContain(token);
  });

  it('the link verifies the address', async () => {
    await page.goto(link);
    await page.getByText('Your address is confirmed.').waitFor();
  });

  it('signs in and creates a key, shown once', async () => {
    await page.goto(`${product.url}/sign-in`);
    await page.getByLabel('E-mail').fill(person.email);
    await page.getByLabel('Password').fill(person.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Access' }).waitFor();
    await page.getByLabel('Name', { exact: true }).fill('line 3 tooling');
    await page.getByRole('button', { name: 'Create the key' }).click();
    key = (await page.getByLabel('The new API key').textContent()) ?? '';
    expect(key).toMatch(/^cdy_/);
    await page.screenshot({ path: shot('e2e-access-new-key'), fullPage: true });
    await page.getByRole('button', { name: 'I have stored it' }).click();
    await page.getByRole('cell', { name: 'line 3 tooling', exact: true }).waitFor();
  });

  it('the key calls the API, and the usage shows up', async () => {
    const res = await fetch(`${product.url}/api/v1/alloys?q=brass`, {
      headers: { Authorization: `Bearer ${key}` },
    });
    expect(res.status).toBe(200);
    expect(((await res.json()) as { total: number }).total).toBeGreaterThan(0);
    const me = await fetch(`${product.url}/api/v1/me`, {
      headers: { Authorization: `Bearer ${key}` },
    });
    expect(((await me.json()) as { email: string }).email).toBe(person.email);
    await page.reload();
    await page.getByText(/Requests with your keys, last 30 days \([1-9]\d* in all\)/).waitFor();
    await page.screenshot({ path: shot('e2e-access-usage'), fullPage: true });
  });
});
