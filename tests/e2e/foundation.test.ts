import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserSession, shot } from '../helpers/product';

const session = browserSession({ beforeAll, afterAll });

describe('the foundation, as a person uses it in Chromium', () => {
  it('searches "brass" in the Catalogue and puts the search in the URL', async () => {
    await session.page.goto(`${session.url}/`);
    await session.page.getByRole('heading', { name: 'Catalogue' }).waitFor();
    await session.page.getByRole('searchbox', { name: 'Search the table' }).fill('brass');
    await session.page.getByRole('link', { name: 'Cartridge brass 70/30' }).waitFor();
    expect(new URL(session.page.url()).searchParams.get('q')).toBe('brass');
    const rows = await session.page.getByRole('row').count();
    expect(rows).toBeGreaterThan(3);
    await session.page.screenshot({ path: shot('e2e-catalogue-brass'), fullPage: true });
  });

  it('sorts by conductivity from the column header', async () => {
    await session.page.getByRole('button', { name: /Conductivity/ }).click();
    await expect
      .poll(() => new URL(session.page.url()).searchParams.get('sort'))
      .toMatch(/^-?conductivity$/);
    const descending = new URL(session.page.url()).searchParams.get('sort')!.startsWith('-');
    const header = session.page.getByRole('columnheader', { name: /Conductivity/ });
    await expect
      .poll(() => header.getAttribute('aria-sort'))
      .toBe(descending ? 'descending' : 'ascending');
    const values = await session.page.locator('tbody tr td:nth-child(4)').allTextContents();
    const numbers = values.map(Number);
    expect(numbers).toEqual([...numbers].sort((a, b) => (descending ? b - a : a - b)));
  });

  it('shows a clear empty state', async () => {
    await session.page.goto(`${session.url}/?q=zzqqxx-nothing`);
    await session.page.getByText('No alloy matches this search.').waitFor();
  });

  it('remembers the unit switcher across a reload', async () => {
    await session.page.goto(`${session.url}/?q=brass`);
    await session.page.getByLabel('Conductivity in').selectOption('MS/m');
    await session.page.getByRole('columnheader', { name: /Conductivity \(MS\/m\)/ }).waitFor();
    await session.page.reload();
    await session.page.getByRole('columnheader', { name: /Conductivity \(MS\/m\)/ }).waitFor();
    await session.page.getByLabel('Conductivity in').selectOption('%IACS');
  });

  it('opens an Alloy sheet with every value, its source, its address and what the source prints', async () => {
    await session.page.getByRole('link', { name: 'Cartridge brass 70/30' }).click();
    await session.page.getByRole('heading', { name: 'Cartridge brass 70/30' }).waitFor();
    await session.page.getByRole('heading', { name: 'Values and sources' }).waitFor();
    await expect(
      session.page.getByText(/Copper Development Association/).count(),
    ).resolves.toBeGreaterThan(0);
    // A located source's citation links to its public address (sources-base.ts, source 2).
    await expect(
      session.page
        .getByRole('link', { name: /Copper Development Association/ })
        .first()
        .getAttribute('href'),
    ).resolves.toMatch(/^https:\/\/copper\.org\//);
    // Every value of C26000 now cites a located document and quotes what it prints (issue 11).
    await expect(session.page.getByText(/The source prints/).count()).resolves.toBeGreaterThan(0);
    await expect(session.page.getByText('from memory', { exact: true }).count()).resolves.toBe(0);
    await session.page.screenshot({ path: shot('e2e-alloy-sheet'), fullPage: true });
    // A value no located document backs yet still wears the flag (npm run table:report lists them).
    await session.page.goto(`${session.url}/alloys/nickel-silver-c75200`);
    await session.page.getByRole('heading', { name: 'Values and sources' }).waitFor();
    await expect(
      session.page.getByText('from memory', { exact: true }).count(),
    ).resolves.toBeGreaterThan(0);
    await session.page.goto(`${session.url}/alloys/cartridge-brass-c26000`);
    await session.page.getByRole('heading', { name: 'Values and sources' }).waitFor();
    await expect(
      session.page.getByRole('rowheader', { name: /Electrical conductivity/ }).count(),
    ).resolves.toBe(1);
    await session.page.screenshot({ path: shot('e2e-alloy-sheet'), fullPage: true });
  });

  it('runs a Match for a cartridge-brass reading and sees C26000 among the first three', async () => {
    await session.page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Match' })
      .click();
    await session.page.getByLabel('Conductivity or resistivity', { exact: true }).fill('28');
    await session.page.getByLabel('Density (optional)', { exact: true }).fill('8.53');
    await session.page.getByRole('button', { name: 'Find candidates' }).click();
    const list = session.page.getByRole('list', { name: 'Candidates, best first' });
    await list.waitFor();
    const firstThree = await list
      .locator(':scope > li')
      .evaluateAll((items) => items.slice(0, 3).map((li) => li.textContent ?? ''));
    expect(firstThree.some((text) => text.includes('C26000'))).toBe(true);
    await session.page.screenshot({ path: shot('e2e-match'), fullPage: true });
  });

  it('keeps what was typed and names the problem when the reading is bad', async () => {
    await session.page.getByLabel('Conductivity or resistivity', { exact: true }).fill('-4');
    await session.page.getByRole('button', { name: 'Find candidates' }).click();
    await session.page.getByText('conductivity must be greater than zero').waitFor();
    expect(
      await session.page.getByLabel('Conductivity or resistivity', { exact: true }).inputValue(),
    ).toBe('-4');
  });

  it('serves the API reference at /api/docs/', async () => {
    await session.page.goto(`${session.url}/api/docs/`);
    await session.page.getByText('Conductory API').first().waitFor();
    await session.page.screenshot({ path: shot('e2e-api-reference') });
  });

  it('raised no error in the page', () => {
    expect(session.pageErrors).toEqual([]);
  });
});
