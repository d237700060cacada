import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserSession, shot } from '../helpers/product';

const session = browserSession({ beforeAll, afterAll }, { width: 1400, height: 1000 });

describe('the estimators, as a person uses them in Chromium', () => {
  it('Layer Lab compares a plated and a solid demo coin and draws two different curves', async () => {
    await session.page.goto(`${session.url}/layer-lab`);
    await session.page.getByRole('heading', { name: 'Layer Lab' }).waitFor();
    await session.page.getByRole('group', { name: 'Estmark 1 mark' }).waitFor();
    await session.page.getByRole('group', { name: 'Estmark 5 marks' }).waitFor();
    await session.page.getByRole('button', { name: 'Compare the blanks' }).click();
    await session.page.getByText(/computed in \d+ ms/).waitFor({ timeout: 60_000 });
    const chart = session.page
      .getByRole('figure')
      .filter({ hasText: 'Apparent conductivity against frequency' });
    const paths = chart.locator('.recharts-line path.recharts-curve');
    await expect.poll(() => paths.count()).toBe(2);
    const [a, b] = await paths.evaluateAll((els) => els.map((e) => e.getAttribute('d') ?? ''));
    expect(a!.length).toBeGreaterThan(100);
    expect(a).not.toBe(b);
    await session.page.getByRole('row', { name: /Launch height/ }).waitFor();
    expect(new URL(session.page.url()).searchParams.get('s')).toBeTruthy();
    await session.page.screenshot({ path: shot('e2e-layer-lab'), fullPage: true });
  });

  it('Pulse Bench runs a launch, shows the result and a caution that comes back', async () => {
    await session.page.goto(`${session.url}/pulse-bench`);
    const caution = session.page.getByRole('note', { name: 'Caution' });
    await expect(caution.textContent()).resolves.toMatch(/capacitor bank can kill/);
    await session.page.getByRole('button', { name: 'Fire (simulated)' }).click();
    await session.page
      .getByRole('region', { name: 'Launch of Estmark 1 mark, first issue' })
      .waitFor({ timeout: 60_000 });
    await expect(session.page.getByText('Peak current').first().isVisible()).resolves.toBe(true);
    await session.page.getByRole('region', { name: 'Collection bins' }).waitFor();
    await session.page.screenshot({ path: shot('e2e-pulse-bench'), fullPage: true });
    await session.page.getByRole('button', { name: 'Fold away for this visit' }).click();
    await expect(caution.textContent()).resolves.toMatch(/can kill/);
    await session.page.reload();
    await session.page.getByRole('button', { name: 'Fold away for this visit' }).waitFor();
    // The caution names the bank's energy: ½ · 50 µF · (400 V)² = 4 J, and grows above 10 J.
    await expect(caution.textContent()).resolves.toMatch(/stores 4(\.00)? J/);
    await session.page.getByRole('textbox', { name: 'Charge voltage', exact: true }).fill('5000');
    await expect
      .poll(() => caution.textContent())
      .toMatch(/stores 625 J.*one touch can stop a heart/s);
    await session.page.screenshot({ path: shot('e2e-pulse-bench-5kV-caution') });
  });

  it('Pulse Bench at 5 kV answers with its warnings beside the figures', async () => {
    const page = session.page;
    await page.goto(`${session.url}/pulse-bench`);
    await page.getByRole('textbox', { name: 'Charge voltage', exact: true }).fill('5');
    await page.getByRole('combobox', { name: 'Charge voltage: unit' }).selectOption('kV');
    await page.getByRole('button', { name: 'Fire (simulated)' }).click();
    const result = page.getByRole('region', { name: 'Launch of Estmark 1 mark, first issue' });
    await result.waitFor({ timeout: 60_000 });
    const text = (await result.textContent()) ?? '';
    // The bench bank is rated 450 V; 625 J through fine wire chars the enamel; the blank flies.
    expect(text).toMatch(/above its rated 450 V/);
    expect(text).toMatch(/The winding heats by about/);
    expect(text).toMatch(/Shield the bench and wear eye protection/);
    await page.screenshot({ path: shot('e2e-pulse-bench-5kV-warnings'), fullPage: true });
  });

  it('Pulse Bench puts the air-core and the cored coil side by side', async () => {
    const page = session.page;
    await page.goto(`${session.url}/pulse-bench`);
    await page.getByRole('checkbox', { name: /An iron core in the bore/ }).check();
    await page.getByRole('textbox', { name: 'Relative permeability' }).fill('1000');
    await page.getByRole('button', { name: 'Fire (simulated)' }).click();
    const air = page.getByRole('region', {
      name: 'Launch of Estmark 1 mark, first issue, air-core coil',
    });
    const cored = page.getByRole('region', {
      name: 'Launch of Estmark 1 mark, first issue, cored coil',
    });
    await cored.waitFor({ timeout: 90_000 });
    await air.waitFor();
    await page
      .getByRole('region', { name: 'Launch of Estmark 1 mark, cored coil' })
      .waitFor({ timeout: 90_000 });
    await expect(page.getByText('Peak flux density in the core').count()).resolves.toBe(2);
    // The core concentrates the field: the same blank flies higher on the same energy (common
    // practice, no source; the figures are in tests/unit/physics/launch-cored.test.ts).
    const heightOf = async (region: typeof air) => {
      const t = (await region.getByText('Height').locator('..').textContent()) ?? '';
      const m = /([\d.]+)\s*(mm|m)\b/.exec(t.replace('Height', ''));
      return m ? Number(m[1]) * (m[2] === 'mm' ? 1e-3 : 1) : NaN;
    };
    expect(await heightOf(cored)).toBeGreaterThan(await heightOf(air));
    await page.screenshot({ path: shot('e2e-pulse-bench-cored'), fullPage: true });
  }, 120_000);

  it('the Alloy sheet gives skin depths at common test frequencies', async () => {
    await session.page.goto(`${session.url}/alloys/copper-c11000`);
    await session.page.getByRole('heading', { name: 'Skin depth' }).waitFor();
    // δ of 101 %IACS copper at 1 MHz: 1/√(π·1e6·µ0·58.58e6) = 65.8 µm (physics.md: 66.1 µm at 100 %IACS)
    await expect(session.page.getByRole('row', { name: /^1 MHz/ }).textContent()).resolves.toMatch(
      /65\.8 µm/,
    );
    await session.page.screenshot({ path: shot('e2e-alloy-sheet-skin-depth'), fullPage: true });
  });

  it('“How do we know?” leads from a calculator to the Checks, where every engine check passes', async () => {
    const page = session.page;
    await page.goto(`${session.url}/pulse-bench`);
    await page.getByRole('link', { name: 'How do we know?' }).click();
    await page.getByRole('heading', { name: 'Checks', level: 1 }).waitFor();
    const table = page.getByRole('table', {
      name: "The engine's answers against their references",
    });
    await table.waitFor({ timeout: 60_000 });
    const rows = table.locator('tbody tr');
    // TEAM 15-1 (4), skin depths (4), Maxwell (18), apparent conductivity (5), launch ledger (1), core (3).
    await expect(rows.count()).resolves.toBe(35);
    const results = await rows.evaluateAll((trs) =>
      trs.map((tr) => {
        const cells = [...tr.querySelectorAll('td')];
        return `${cells[0]?.textContent ?? ''}: ${cells[5]?.textContent?.trim() ?? ''}`;
      }),
    );
    expect(results.filter((r) => !r.endsWith('✓ Pass'))).toEqual([]);
    await expect(page.getByText('35 of 35 checks pass.').isVisible()).resolves.toBe(true);
    await expect(
      page.getByRole('heading', { name: "Where the table's values come from" }).isVisible(),
    ).resolves.toBe(true);
    await page.screenshot({ path: shot('e2e-checks'), fullPage: true });
  });

  it('raised no error in the page', () => {
    expect(session.pageErrors).toEqual([]);
  });
});
