import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../seeds/demo/accounts';
import { browserSession, shot } from '../helpers/product';

const session = browserSession({ beforeAll, afterAll }, { width: 1400, height: 1000 });

describe('the Sort Planner, as an integrator uses it in Chromium', () => {
  it('builds a plan from the demo coins, sees the recommended frequency and exports the header', async () => {
    const { page, url } = session;
    const { email, password } = demoAccounts.find((a) => a.role === 'integrator')!;
    await page.goto(`${url}/sign-in`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Access', level: 1 }).waitFor();

    await page.getByRole('link', { name: 'Sort Planner' }).click();
    await page.getByRole('heading', { name: 'Sort Planner', level: 1 }).waitFor();
    await page.getByRole('button', { name: 'The five Estmark coins' }).click();
    const products = page.getByRole('list', { name: 'Products in the plan' }).getByRole('listitem');
    await expect.poll(() => products.count()).toBe(5);
    await page.getByRole('button', { name: 'Evaluate the plan' }).click();
    const recommended = page.getByTestId('recommended-frequency');
    await recommended.waitFor({ timeout: 60_000 });
    // A frequency of the 1 kHz–1 MHz sweep, in the unit format.ts writes.
    await expect(recommended.textContent()).resolves.toMatch(/^\d+(\.\d+)? (Hz|kHz|MHz)$/);
    const chart = page.getByRole('figure').filter({ hasText: "Window of each product's reading" });
    await expect.poll(() => chart.locator('.recharts-area').count()).toBe(5);
    await page.screenshot({ path: shot('e2e-sort-planner'), fullPage: true });

    await page.getByLabel('Plan name').fill('Estmark coins, line 2');
    await page.getByRole('button', { name: 'Save this plan' }).click();
    const link = page.getByRole('link', { name: 'C header' });
    await link.waitFor();
    const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
    expect(download.suggestedFilename()).toMatch(/^conductory-plan-\d+-unreleased\.h$/);
    const header = fs.readFileSync((await download.path())!, 'utf8');
    expect(header).toContain('#ifndef CONDUCTORY_PLAN_H');
    expect(header).toContain('#define CONDUCTORY_PLAN_NAME "Estmark coins, line 2"');
    expect(header).toContain('static inline int conductory_plan_classify');
    await page.getByRole('table', { name: 'Your saved plans' }).waitFor();
    expect(session.pageErrors).toEqual([]);
  });
});
