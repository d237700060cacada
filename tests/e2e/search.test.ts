import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { browserSession, screenshotDir, shot } from '../helpers/product';

const session = browserSession({ beforeAll, afterAll });

/** The requests made while typing, per phrase and viewport, left beside the screenshots. */
const counts: Record<string, string[]> = {};
afterAll(() =>
  fs.writeFileSync(
    `${screenshotDir}/e2e-search-requests.json`,
    `${JSON.stringify(counts, null, 2)}\n`,
  ),
);

/** Requests to the alloy list and the statuses they got, recorded while a person types. */
function watchAlloyRequests(page: Page) {
  const requests: string[] = [];
  const refused: string[] = [];
  const isList = (url: string) => new URL(url).pathname === '/api/v1/alloys';
  const onRequest = (r: { url(): string }) => {
    if (isList(r.url())) requests.push(r.url());
  };
  const onResponse = (r: { url(): string; status(): number }) => {
    if (isList(r.url()) && r.status() >= 400) refused.push(`${r.status()} ${r.url()}`);
  };
  page.on('request', onRequest);
  page.on('response', onResponse);
  return {
    requests,
    refused,
    stop() {
      page.off('request', onRequest);
      page.off('response', onResponse);
    },
  };
}

/** The name of the first alloy listed, as the person reads it. */
const firstRow = (page: Page) =>
  page
    .getByRole('region', { name: 'Catalogue' })
    .locator('a[href^="/alloys/"]')
    .first()
    .textContent();

/**
 * Types into the Catalogue search with real keystrokes (80 ms apart, a brisk typist) and returns
 * the list requests made from the first keystroke until the table has settled on the answer.
 */
async function typeSearch(page: Page, text: string, expectedFirst: string) {
  const box = page.getByRole('searchbox', { name: 'Search the table' });
  await box.fill('');
  // Let the cleared box's own (debounced) request come and go before counting.
  await page.waitForTimeout(600);
  await box.click();
  const watch = watchAlloyRequests(page);
  await page.keyboard.type(text, { delay: 80 });
  await expect.poll(() => firstRow(page), { timeout: 10_000 }).toBe(expectedFirst);
  await expect
    .poll(() => page.getByText(/of \d+ alloys? \(updating…\)/).count(), { timeout: 10_000 })
    .toBe(0);
  await page.waitForTimeout(400);
  watch.stop();
  expect(new URL(page.url()).searchParams.get('q')).toBe(text);
  return watch;
}

describe.each([
  ['desktop', 1280, 900],
  ['phone', 390, 844],
])('Catalogue search on a %s (%i px), typed as a person types', (label, width, height) => {
  beforeAll(async () => {
    await session.page.setViewportSize({ width, height });
    await session.page.goto(`${session.url}/`);
    await session.page.getByRole('heading', { name: 'Catalogue' }).waitFor();
  });

  it.each([
    // First results: names from seeds/reference/alloys.ts; the query words are the issue's.
    ['cartridge brass', 'Cartridge brass 70/30'],
    ['Nickel Silver', 'Nickel silver 65-18'],
  ])('"%s" → %s first, with few requests and none refused', async (text, first) => {
    const watch = await typeSearch(session.page, text, first);
    counts[`${text} @ ${width} px`] = watch.requests.map((url) => new URL(url).search);
    // Debounced: a 15-character phrase typed without pause makes one request, at most a few
    // (the issue counted 15, one per keystroke, against a visitor limit of 120 a minute).
    expect(watch.requests.length).toBeGreaterThanOrEqual(1);
    expect(watch.requests.length).toBeLessThanOrEqual(3);
    expect(watch.refused).toEqual([]);
    // The page sends the space as URLSearchParams does ("+"), which the API now accepts.
    expect(watch.requests.at(-1)).toContain(`q=${text.replace(' ', '+')}`);
    await session.page.screenshot({
      path: shot(`e2e-search-${text.replace(/\s+/g, '-').toLowerCase()}-${label}`),
      fullPage: true,
    });
  });

  it('the search survives a reload from the URL', async () => {
    await session.page.reload();
    await expect
      .poll(() => firstRow(session.page), { timeout: 10_000 })
      .toBe('Nickel silver 65-18');
    await expect(
      session.page.getByRole('searchbox', { name: 'Search the table' }).inputValue(),
    ).resolves.toBe('Nickel Silver');
  });
});

describe('no page errors', () => {
  it('raised none while searching', () => {
    expect(session.pageErrors).toEqual([]);
  });
});
