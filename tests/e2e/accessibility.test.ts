import AxeBuilder from '@axe-core/playwright';
import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../seeds/demo/accounts';
import {
  launchChromium,
  screenshotDir,
  shot,
  startProduct,
  type RunningProduct,
} from '../helpers/product';

/**
 * axe-core (through @axe-core/playwright) on every route and the main result states, as the role
 * that may open each, at 1280 px and on a 390 px phone. Serious and critical violations fail the
 * test (WCAG 2.1 AA and axe's best practices, axe's own impact levels); every violation found is
 * written to test-results/axe-summary.json.
 */

type Who = 'visitor' | 'reader' | 'curator' | 'curator2' | 'admin';
const account = (who: Exclude<Who, 'visitor'>) =>
  demoAccounts.find((a) =>
    who === 'curator2' ? a.email.startsWith('curator2@') : a.role === who && !/\d@/.test(a.email),
  )!;

let product: RunningProduct;
let browser: Browser;
const pages = {} as Record<Who, Page>;
const pageErrors: string[] = [];

async function signIn(page: Page, who: Exclude<Who, 'visitor'>) {
  const { email, password } = account(who);
  await page.goto(`${product.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Access', level: 1 }).waitFor();
}

/** A same-origin call from the page itself, so the session cookie and Origin go with it. */
function callApi(page: Page, method: string, url: string, body?: unknown) {
  return page.evaluate(
    async ([m, u, b]) => {
      const res = await fetch(u as string, {
        method: m as string,
        headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
        body: b === undefined ? undefined : JSON.stringify(b),
      });
      return { status: res.status, body: (await res.text()) || null };
    },
    [method, url, body] as const,
  );
}

beforeAll(async () => {
  browser = await launchChromium();
  product = await startProduct();
  for (const who of ['visitor', 'reader', 'curator', 'curator2', 'admin'] as const) {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    pages[who] = await context.newPage();
    pages[who].on('pageerror', (e) => pageErrors.push(`${who}: ${e.message}`));
    if (who !== 'visitor') await signIn(pages[who], who);
  }
  // A proposal by one curator for the other to review (two-person rule).
  const proposed = await callApi(pages.curator, 'POST', '/api/v1/revisions', {
    kind: 'edit',
    alloy: 'cartridge-brass-c26000',
    set: { values: { conductivity: { nominal: 16.0e6, min: 15.66e6, max: 16.82e6 } } },
    source: {
      citation: 'Mill test certificate, strip lot 4471 (invented for the test)',
      kind: 'measurement_set',
      locator: 'sheet 2',
    },
    reason: 'Lot measurements read 27.6 %IACS on average',
  });
  expect(proposed.status, proposed.body ?? '').toBe(201);
  // A key of the admin's own, so the keys page has a row to revoke.
  const key = await callApi(pages.admin, 'POST', '/api/v1/keys', {
    name: 'axe check key',
    role: 'reader',
  });
  expect(key.status, key.body ?? '').toBe(201);
}, 240_000);

afterAll(async () => {
  await browser?.close();
  await product?.stop();
});

interface State {
  name: string;
  who: Who;
  path: string;
  /** What the page shows once it is ready (and what a person does to reach the state). */
  ready: (page: Page) => Promise<unknown>;
}

const heading = (name: string | RegExp) => (page: Page) =>
  page.getByRole('heading', { name, level: 1 }).waitFor();

const states: State[] = [
  { name: 'catalogue', who: 'visitor', path: '/', ready: heading('Catalogue') },
  {
    name: 'catalogue-search',
    who: 'visitor',
    path: '/?q=brass',
    ready: (page) => page.locator('tbody tr').nth(2).waitFor(),
  },
  {
    name: 'alloy-sheet',
    who: 'visitor',
    path: '/alloys/cartridge-brass-c26000',
    ready: heading(/Cartridge brass/),
  },
  { name: 'match', who: 'visitor', path: '/match', ready: heading('Match') },
  {
    name: 'match-result',
    who: 'visitor',
    path: '/match',
    ready: async (page) => {
      await page.getByLabel('Conductivity or resistivity', { exact: true }).fill('28');
      await page.getByLabel('Density (optional)', { exact: true }).fill('8.53');
      await page.getByRole('button', { name: 'Find candidates' }).click();
      await page.getByRole('list', { name: 'Candidates, best first' }).waitFor();
    },
  },
  {
    name: 'match-batch-result',
    who: 'curator',
    path: '/match',
    ready: async (page) => {
      // Many readings: the demo recycler's invented readings, one of them a bad row.
      const csv =
        'id,conductivity (%IACS),temperature (C),density (g/cm3)\r\nR-102 brass fitting,25.6,27,8.49\r\nR-1xx smudged,abc,27,8.49\r\n';
      await page
        .getByLabel('CSV file of readings')
        .setInputFiles({ name: 'line.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
      await page.getByRole('button', { name: 'Match the file' }).click();
      await page.getByRole('list', { name: 'Bad rows' }).waitFor({ timeout: 30_000 });
    },
  },
  {
    name: 'match-batch-refused',
    who: 'curator',
    path: '/match',
    ready: async (page) => {
      await page.getByLabel('CSV file of readings').setInputFiles({
        name: 'wrong.csv',
        mimeType: 'text/csv',
        buffer: Buffer.from('id,colour\r\nx,red\r\n'),
      });
      await page.getByRole('button', { name: 'Match the file' }).click();
      await page.getByRole('alert').filter({ hasText: 'Unknown column' }).waitFor();
    },
  },
  {
    name: 'match-batch-reader',
    who: 'reader',
    path: '/match',
    ready: (page) => page.getByText(/your role is reader/).waitFor(),
  },
  {
    name: 'layer-lab',
    who: 'visitor',
    path: '/layer-lab',
    ready: (page) => page.getByRole('group', { name: 'Estmark 5 marks' }).waitFor(),
  },
  {
    name: 'layer-lab-comparison',
    who: 'visitor',
    path: '/layer-lab',
    ready: async (page) => {
      await page.getByRole('group', { name: 'Estmark 5 marks' }).waitFor();
      await page.getByRole('button', { name: 'Compare the blanks' }).click();
      await page.getByText(/computed in \d+ ms/).waitFor({ timeout: 60_000 });
    },
  },
  { name: 'sort-planner', who: 'visitor', path: '/sort-planner', ready: heading('Sort Planner') },
  {
    name: 'sort-planner-result',
    who: 'curator',
    path: '/sort-planner',
    ready: async (page) => {
      await page.getByRole('button', { name: 'The five Estmark coins' }).click();
      await page.getByRole('button', { name: 'Evaluate the plan' }).click();
      await page.getByTestId('recommended-frequency').waitFor({ timeout: 60_000 });
      await page.getByRole('button', { name: 'Save this plan' }).click();
      await page.getByRole('link', { name: 'C header' }).waitFor();
    },
  },
  { name: 'pulse-bench', who: 'visitor', path: '/pulse-bench', ready: heading('Pulse Bench') },
  {
    name: 'pulse-bench-run',
    who: 'visitor',
    path: '/pulse-bench',
    ready: async (page) => {
      await page.getByRole('button', { name: 'Fire (simulated)' }).click();
      await page
        .getByRole('region', { name: 'Launch of Estmark 1 mark, first issue' })
        .waitFor({ timeout: 60_000 });
    },
  },
  {
    name: 'checks',
    who: 'visitor',
    path: '/checks',
    ready: (page) =>
      page.getByRole('heading', { name: 'The engine against its references' }).waitFor(),
  },
  { name: 'sign-in', who: 'visitor', path: '/sign-in', ready: heading('Sign in') },
  {
    name: 'sign-in-refused',
    who: 'visitor',
    path: '/sign-in',
    ready: async (page) => {
      await page.getByLabel('E-mail').fill('nobody@carrowbay.example');
      await page.getByLabel('Password').fill('not-the-password-1');
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('alert').filter({ hasText: 'Not signed in' }).waitFor();
    },
  },
  { name: 'sign-up', who: 'visitor', path: '/sign-up', ready: heading('Create an account') },
  {
    name: 'sign-up-checked',
    who: 'visitor',
    path: '/sign-up',
    ready: async (page) => {
      await page.getByRole('button', { name: 'Create the account' }).click();
      await page.getByText('enter your name').waitFor();
    },
  },
  { name: 'access-visitor', who: 'visitor', path: '/access', ready: heading(/Sign in to open/) },
  { name: 'review-visitor', who: 'visitor', path: '/review', ready: heading(/Sign in to open/) },
  { name: 'admin-visitor', who: 'visitor', path: '/admin', ready: heading(/Sign in to open/) },
  { name: 'not-found', who: 'visitor', path: '/no-such-screen', ready: heading(/Nothing/) },
  { name: 'access-reader', who: 'reader', path: '/access', ready: heading('Access') },
  { name: 'review-reader', who: 'reader', path: '/review', ready: heading(/not open/) },
  { name: 'admin-reader', who: 'reader', path: '/admin/users', ready: heading(/not open/) },
  {
    name: 'review-desk-pending',
    who: 'curator2',
    path: '/review',
    ready: (page) =>
      page
        .getByRole('list', { name: 'Proposals waiting for review' })
        .getByRole('listitem')
        .first()
        .waitFor(),
  },
  {
    name: 'admin-users',
    who: 'admin',
    path: '/admin/users',
    ready: (page) => page.locator('tbody tr').first().waitFor(),
  },
  {
    name: 'admin-keys',
    who: 'admin',
    path: '/admin/keys',
    ready: (page) => page.locator('tbody tr').first().waitFor(),
  },
  {
    name: 'admin-keys-confirm',
    who: 'admin',
    path: '/admin/keys',
    ready: async (page) => {
      await page.getByRole('button', { name: 'Revoke axe check key' }).click();
      await page.getByRole('dialog', { name: /Revoke the key/ }).waitFor();
    },
  },
  {
    name: 'admin-audit',
    who: 'admin',
    path: '/admin/audit',
    ready: (page) => page.locator('tbody tr').first().waitFor(),
  },
  {
    name: 'admin-outbox',
    who: 'admin',
    path: '/admin/outbox',
    ready: heading('Administration'),
  },
];

interface Found {
  id: string;
  impact: string;
  help: string;
  nodes: Array<{ target: string; summary: string }>;
}
const summary: Record<string, { serious: number; critical: number; found: Found[] }> = {};

afterAll(() => {
  fs.writeFileSync(
    path.join(screenshotDir, 'axe-summary.json'),
    `${JSON.stringify(summary, null, 2)}\n`,
  );
});

for (const viewport of [
  { width: 1280, height: 900 },
  { width: 390, height: 844 },
]) {
  describe(`axe at ${viewport.width} px`, () => {
    beforeAll(async () => {
      for (const page of Object.values(pages)) await page.setViewportSize(viewport);
    });

    it.each(states)(
      '$name ($who): no serious or critical violation',
      async (state) => {
        const page = pages[state.who];
        await page.goto(`${product.url}${state.path}`);
        await state.ready(page).catch(async (error: unknown) => {
          await page.screenshot({ path: shot(`axe-${state.name}-${viewport.width}-not-ready`) });
          throw error;
        });
        await page.waitForLoadState('networkidle');
        const results = await new AxeBuilder({ page }).analyze();
        const found: Found[] = results.violations.map((v) => ({
          id: v.id,
          impact: v.impact ?? 'unknown',
          help: v.help,
          nodes: v.nodes.map((n) => ({
            target: n.target.join(' '),
            summary: (n.failureSummary ?? '').replace(/\s+/g, ' '),
          })),
        }));
        const count = (impact: string) =>
          found.filter((f) => f.impact === impact).reduce((s, f) => s + f.nodes.length, 0);
        const key = `${state.name} ${viewport.width}`;
        summary[key] = { serious: count('serious'), critical: count('critical'), found };
        await page.screenshot({
          path: shot(`axe-${state.name}-${viewport.width}`),
          fullPage: true,
        });
        const grave = found.filter((f) => f.impact === 'serious' || f.impact === 'critical');
        const report = grave
          .flatMap((f) =>
            f.nodes.map((n) => `${f.impact} ${f.id} at ${n.target}: ${f.help}. ${n.summary}`),
          )
          .join('\n');
        expect(grave.length, `${key}\n${report}`).toBe(0);
      },
      90_000,
    );
  });
}

describe('keyboard and flows (1280 px)', () => {
  beforeAll(async () => {
    for (const page of Object.values(pages))
      await page.setViewportSize({ width: 1280, height: 900 });
  });

  it('a confirmation dialog takes the focus, Escape cancels, and the confirm button acts', async () => {
    const page = pages.admin;
    await page.goto(`${product.url}/admin/keys`);
    const revoke = page.getByRole('button', { name: 'Revoke axe check key' });
    await revoke.click();
    const dialog = page.getByRole('dialog', { name: /Revoke the key “axe check key”/ });
    await dialog.waitFor();
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Cancel');
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'hidden' });
    expect(await revoke.evaluate((el) => el === document.activeElement)).toBe(true);
    // Nothing was revoked; now confirm for real.
    const row = page.getByRole('row').filter({ hasText: 'axe check key' });
    await row.getByRole('button', { name: /Revoke/ }).waitFor();
    await revoke.click();
    await dialog.getByRole('button', { name: 'Revoke the key' }).click();
    await row.getByRole('button', { name: /Revoke/ }).waitFor({ state: 'detached' });
  });

  it('sign-in from a refused page comes back to it; a foreign `next` is ignored', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await page.goto(`${product.url}/review`);
    await page.getByRole('heading', { name: 'Sign in to open the Review Desk' }).waitFor();
    await expect(
      page.getByText('The Review Desk is for curators and admins.').count(),
    ).resolves.toBe(1);
    await page.getByRole('main').getByRole('link', { name: 'Sign in', exact: true }).click();
    await page.getByRole('heading', { name: 'Sign in', exact: true, level: 1 }).waitFor();
    expect(new URL(page.url()).searchParams.get('next')).toBe('/review');
    await page.getByLabel('E-mail').fill(account('curator').email);
    await page.getByLabel('Password').fill(account('curator').password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Review Desk', level: 1 }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/review');

    await page.goto(`${product.url}/sign-in?next=${encodeURIComponent('//evil.example/x')}`);
    await page.getByLabel('E-mail').fill(account('curator').email);
    await page.getByLabel('Password').fill(account('curator').password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Access', level: 1 }).waitFor();
    expect(new URL(page.url()).origin).toBe(product.url);
    await context.close();
  });

  it('the header’s Sign in link keeps the page the person is on', async () => {
    const page = pages.visitor;
    await page.goto(`${product.url}/match`);
    await page.getByRole('link', { name: 'Sign in', exact: true }).click();
    await page.getByRole('heading', { name: 'Sign in', exact: true, level: 1 }).waitFor();
    expect(new URL(page.url()).searchParams.get('next')).toBe('/match');
  });

  it('an unknown address says so in words, with a way on', async () => {
    const page = pages.visitor;
    await page.goto(`${product.url}/alloys/no-such-alloy`);
    await page.getByRole('heading', { name: 'No such alloy in the table' }).waitFor();
    await page.getByRole('link', { name: 'Search the Catalogue for “no such alloy”' }).waitFor();
    await page.goto(`${product.url}/nowhere/at-all`);
    await page.getByRole('heading', { name: 'Nothing at this address' }).waitFor();
    expect(await page.getByRole('main').textContent()).not.toMatch(/null|Something went wrong/);
  });

  it('raised no error in the pages', () => {
    expect(pageErrors).toEqual([]);
  });
});
