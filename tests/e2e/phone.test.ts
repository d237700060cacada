import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../seeds/demo/accounts';
import { launchChromium, shot, startProduct, type RunningProduct } from '../helpers/product';

/**
 * Every screen on a 390 × 844 phone (a common phone's CSS viewport; common practice, no source):
 * nothing wider than the screen, a header of one row, tables as cards that keep their figures.
 * Screenshots go to test-results/phone-*.png.
 */

const PHONE = { width: 390, height: 844 };
type Who = 'visitor' | 'reader' | 'curator' | 'admin';

let product: RunningProduct;
let browser: Browser;
const pages = {} as Record<Who, Page>;
const pageErrors: string[] = [];

beforeAll(async () => {
  browser = await launchChromium();
  product = await startProduct();
  for (const who of ['visitor', 'reader', 'curator', 'admin'] as const) {
    const context = await browser.newContext({ viewport: PHONE, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    page.on('pageerror', (e) => pageErrors.push(`${who}: ${e.message}`));
    pages[who] = page;
    if (who === 'visitor') continue;
    const { email, password } = demoAccounts.find((a) => a.role === who)!;
    await page.goto(`${product.url}/sign-in`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Access', level: 1 }).waitFor();
  }
}, 240_000);

afterAll(async () => {
  await browser?.close();
  await product?.stop();
});

/** The page's width and the header's rows, after the screen has settled. */
async function measure(page: Page) {
  await page.waitForLoadState('networkidle');
  return page.evaluate(() => {
    const header = document.querySelector('header')!.getBoundingClientRect();
    const brand = document.querySelector('header a')!.getBoundingClientRect();
    const menu = [...document.querySelectorAll('header button')].find(
      (b) => b.textContent?.trim() === 'Menu',
    );
    const menuBox = menu?.getBoundingClientRect();
    return {
      scrollWidth: document.documentElement.scrollWidth,
      headerHeight: header.height,
      // Same row: the menu button's vertical middle lies within the brand's height.
      sameRow: menuBox
        ? Math.abs(menuBox.top + menuBox.height / 2 - (brand.top + brand.height / 2)) <
          brand.height / 2
        : false,
    };
  });
}

const routes: Array<{
  name: string;
  who: Who;
  path: string;
  ready: (p: Page) => Promise<unknown>;
}> = [
  {
    name: 'catalogue',
    who: 'visitor',
    path: '/',
    ready: (p) => p.locator('tbody tr').first().waitFor(),
  },
  {
    name: 'alloy-sheet',
    who: 'visitor',
    path: '/alloys/cartridge-brass-c26000',
    ready: (p) => p.getByRole('heading', { name: /Cartridge brass/, level: 1 }).waitFor(),
  },
  {
    name: 'match',
    who: 'visitor',
    path: '/match',
    ready: (p) => p.getByRole('heading', { name: 'Match', level: 1 }).waitFor(),
  },
  {
    name: 'match-batch',
    who: 'curator',
    path: '/match',
    ready: async (p) => {
      // Many readings: the demo recycler's invented readings, one of them a bad row.
      const csv =
        'id,conductivity (%IACS),temperature (C),density (g/cm3)\r\nR-102 brass fitting,25.6,27,8.49\r\nR-1xx smudged,abc,27,8.49\r\n';
      await p
        .getByLabel('CSV file of readings')
        .setInputFiles({ name: 'line.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
      await p.getByRole('button', { name: 'Match the file' }).click();
      await p.getByRole('list', { name: 'Bad rows' }).waitFor({ timeout: 30_000 });
    },
  },
  {
    name: 'layer-lab',
    who: 'visitor',
    path: '/layer-lab',
    ready: (p) => p.getByRole('group', { name: 'Estmark 5 marks' }).waitFor(),
  },
  {
    name: 'sort-planner',
    who: 'visitor',
    path: '/sort-planner',
    ready: (p) => p.getByRole('heading', { name: 'Sort Planner', level: 1 }).waitFor(),
  },
  {
    name: 'sort-planner-result',
    who: 'visitor',
    path: '/sort-planner',
    ready: async (p) => {
      await p.getByRole('button', { name: 'Evaluate the plan' }).click();
      await p.getByTestId('recommended-frequency').waitFor({ timeout: 60_000 });
    },
  },
  {
    name: 'pulse-bench',
    who: 'visitor',
    path: '/pulse-bench',
    ready: (p) => p.getByRole('heading', { name: 'Pulse Bench', level: 1 }).waitFor(),
  },
  {
    name: 'checks',
    who: 'visitor',
    path: '/checks',
    ready: (p) => p.getByRole('heading', { name: 'The engine against its references' }).waitFor(),
  },
  {
    name: 'sign-in',
    who: 'visitor',
    path: '/sign-in',
    ready: (p) => p.getByRole('heading', { name: 'Sign in', level: 1 }).waitFor(),
  },
  {
    name: 'sign-up',
    who: 'visitor',
    path: '/sign-up',
    ready: (p) => p.getByRole('heading', { name: 'Create an account', level: 1 }).waitFor(),
  },
  {
    name: 'access-visitor',
    who: 'visitor',
    path: '/access',
    ready: (p) => p.getByRole('heading', { name: /Sign in to open/, level: 1 }).waitFor(),
  },
  {
    name: 'review-visitor',
    who: 'visitor',
    path: '/review',
    ready: (p) => p.getByRole('heading', { name: /Sign in to open/, level: 1 }).waitFor(),
  },
  {
    name: 'admin-visitor',
    who: 'visitor',
    path: '/admin',
    ready: (p) => p.getByRole('heading', { name: /Sign in to open/, level: 1 }).waitFor(),
  },
  {
    name: 'not-found',
    who: 'visitor',
    path: '/no-such-screen',
    ready: (p) => p.getByRole('heading', { name: 'Nothing at this address', level: 1 }).waitFor(),
  },
  {
    name: 'access',
    who: 'reader',
    path: '/access',
    ready: (p) => p.getByRole('heading', { name: 'Access', level: 1 }).waitFor(),
  },
  {
    name: 'review',
    who: 'curator',
    path: '/review',
    ready: (p) => p.getByRole('heading', { name: 'Review Desk', level: 1 }).waitFor(),
  },
  {
    name: 'admin',
    who: 'admin',
    path: '/admin',
    ready: (p) => p.locator('tbody tr').first().waitFor(),
  },
  {
    name: 'admin-users',
    who: 'admin',
    path: '/admin/users',
    ready: (p) => p.locator('tbody tr').first().waitFor(),
  },
  {
    name: 'admin-keys',
    who: 'admin',
    path: '/admin/keys',
    ready: (p) => p.getByRole('heading', { name: 'Administration', level: 1 }).waitFor(),
  },
  {
    name: 'admin-audit',
    who: 'admin',
    path: '/admin/audit',
    ready: (p) => p.locator('tbody tr').first().waitFor(),
  },
  {
    name: 'admin-outbox',
    who: 'admin',
    path: '/admin/outbox',
    ready: (p) => p.getByRole('heading', { name: 'Administration', level: 1 }).waitFor(),
  },
];

describe('on a 390 px phone', () => {
  it.each(routes)(
    '$name ($who) fits the screen, under a one-row header',
    async (route) => {
      const page = pages[route.who];
      await page.goto(`${product.url}${route.path}`);
      await route.ready(page);
      const m = await measure(page);
      await page.screenshot({ path: shot(`phone-${route.name}`), fullPage: true });
      expect(m.scrollWidth, `${route.path} is ${m.scrollWidth} px wide`).toBeLessThanOrEqual(
        PHONE.width,
      );
      expect(m.sameRow, 'the menu button sits beside the name').toBe(true);
      // One row: the 28 px mark or a 36 px button, with 10 px above and below (layout.tsx).
      expect(m.headerHeight).toBeLessThanOrEqual(64);
    },
    60_000,
  );

  it('the menu opens the navigation, and Escape closes it back onto its button', async () => {
    const page = pages.reader;
    await page.goto(`${product.url}/`);
    const menu = page.getByRole('button', { name: 'Menu' });
    const nav = page.getByRole('navigation', { name: 'Main' });
    expect(await nav.isVisible()).toBe(false);
    expect(await menu.getAttribute('aria-expanded')).toBe('false');
    await menu.click();
    expect(await menu.getAttribute('aria-expanded')).toBe('true');
    await nav.getByRole('link', { name: 'Layer Lab' }).waitFor();
    await page.screenshot({ path: shot('phone-menu-open') });
    await nav.getByRole('link', { name: 'Match' }).focus();
    await page.keyboard.press('Escape');
    await nav.waitFor({ state: 'hidden' });
    expect(await menu.evaluate((el) => el === document.activeElement)).toBe(true);
    await menu.click();
    await nav.getByRole('link', { name: 'Match' }).click();
    await page.getByRole('heading', { name: 'Match', level: 1 }).waitFor();
    expect(await nav.isVisible()).toBe(false);
  });

  it('a Catalogue search lists cards that keep conductivity and density', async () => {
    const page = pages.visitor;
    await page.goto(`${product.url}/?q=brass`);
    const card = page.locator('tbody tr').filter({ hasText: 'Cartridge brass' }).first();
    await card.waitFor();
    const cell = card.locator('td[data-label]');
    for (const label of [/^(Conductivity|Resistivity)/, /^Density/]) {
      const labels = await cell.evaluateAll((tds) =>
        tds.map((td) => td.getAttribute('data-label') ?? ''),
      );
      const index = labels.findIndex((l) => label.test(l));
      expect(index, `a cell labelled ${label}`).toBeGreaterThanOrEqual(0);
      const box = (await cell.nth(index).boundingBox())!;
      expect(box.x + box.width).toBeLessThanOrEqual(PHONE.width);
      expect(await cell.nth(index).isVisible()).toBe(true);
    }
    const m = await measure(page);
    expect(m.scrollWidth).toBeLessThanOrEqual(PHONE.width);
    await page.screenshot({ path: shot('phone-catalogue-search'), fullPage: true });
  });

  it('Layer Lab shows both blanks and its comparison within the screen', async () => {
    const page = pages.visitor;
    await page.goto(`${product.url}/layer-lab`);
    for (const name of ['Estmark 1 mark', 'Estmark 5 marks']) {
      const box = (await page.getByRole('group', { name }).boundingBox())!;
      expect(box.x).toBeGreaterThanOrEqual(0);
      expect(box.x + box.width, `${name} ends at ${box.x + box.width}`).toBeLessThanOrEqual(
        PHONE.width,
      );
    }
    await page.getByRole('button', { name: 'Compare the blanks' }).click();
    await page.getByText(/computed in \d+ ms/).waitFor({ timeout: 60_000 });
    const m = await measure(page);
    await page.screenshot({ path: shot('phone-layer-lab-comparison'), fullPage: true });
    expect(m.scrollWidth).toBeLessThanOrEqual(PHONE.width);
  }, 90_000);

  it('Match and Pulse Bench results fit the screen', async () => {
    const page = pages.visitor;
    await page.goto(`${product.url}/match`);
    await page.getByLabel('Conductivity or resistivity', { exact: true }).fill('28');
    await page.getByLabel('Density (optional)', { exact: true }).fill('8.53');
    await page.getByRole('button', { name: 'Find candidates' }).click();
    await page.getByRole('list', { name: 'Candidates, best first' }).waitFor();
    expect((await measure(page)).scrollWidth).toBeLessThanOrEqual(PHONE.width);
    await page.screenshot({ path: shot('phone-match-result'), fullPage: true });

    await page.goto(`${product.url}/pulse-bench`);
    await page.getByRole('button', { name: 'Fire (simulated)' }).click();
    await page
      .getByRole('region', { name: 'Launch of Estmark 1 mark, first issue' })
      .waitFor({ timeout: 60_000 });
    expect((await measure(page)).scrollWidth).toBeLessThanOrEqual(PHONE.width);
    await page.screenshot({ path: shot('phone-pulse-bench-run'), fullPage: true });
  }, 120_000);

  it('the admin’s list of people keeps role and state on each card', async () => {
    const page = pages.admin;
    await page.goto(`${product.url}/admin/users`);
    const card = page.locator('tbody tr').filter({ hasText: 'reader@carrowbay.example' });
    await card.waitFor();
    await expect(card.locator('td[data-label="State"]').textContent()).resolves.toBe('active');
    const role = card.getByRole('combobox', { name: 'Role of reader@carrowbay.example' });
    const box = (await role.boundingBox())!;
    expect(box.x + box.width).toBeLessThanOrEqual(PHONE.width);
  });

  it('raised no error in the pages', () => {
    expect(pageErrors).toEqual([]);
  });
});
