import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demo } from '../helpers/access';
import { browserSession, shot } from '../helpers/product';

/**
 * Issue 9, items 2 and 3: every screen reads in the unit chosen in the switcher, names
 * resistivity as resistivity, writes numbers one way (× 10ⁿ, never "e+3") and shows no raw SI.
 */
const session = browserSession({ beforeAll, afterAll }, { width: 1280, height: 900 });

/** 28 %IACS and 8.53 g/cm³ (cartridge brass) in each unit; 100 %IACS = 58.0 MS/m (IEC 60028). */
const choices = [
  {
    conductivity: '%IACS',
    label: '%IACS',
    reading: '28',
    density: 'g/cm3',
    dLabel: 'g/cm³',
    dReading: '8.53',
  },
  {
    conductivity: 'MS/m',
    label: 'MS/m',
    reading: '16.24',
    density: 'kg/m3',
    dLabel: 'kg/m³',
    dReading: '8530',
  },
  // 1 lb/in³ = 27 679.9 kg/m³ (NIST SP 811, appendix B): 8530 kg/m³ = 0.30817 lb/in³
  {
    conductivity: 'S/m',
    label: 'S/m',
    reading: '16240000',
    density: 'lb/in3',
    dLabel: 'lb/in³',
    dReading: '0.30817',
  },
  // 1/(16.24e6 S/m) = 6.158e-8 Ω·m = 6.158 µΩ·cm = 61.58 nΩ·m
  {
    conductivity: 'uohm_cm',
    label: 'µΩ·cm',
    reading: '6.158',
    density: 'g/cm3',
    dLabel: 'g/cm³',
    dReading: '8.53',
  },
  {
    conductivity: 'nohm_m',
    label: 'nΩ·m',
    reading: '61.58',
    density: 'kg/m3',
    dLabel: 'kg/m³',
    dReading: '8530',
  },
] as const;
type Choice = (typeof choices)[number];

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
/** A figure followed by the unit: "16.2 MS/m", "1.62 × 10⁷ S/m". */
const figureIn = (label: string) => new RegExp(`\\d(?: × 10[⁻⁰-⁹]+)? ${escape(label)}`);
const resistivityUnit = /(µΩ·cm|nΩ·m|Ω·m)/;

/** The checks every screen passes, on the text a person reads in the main region. */
function expectReadable(text: string, choice: Choice, where: string, density = true) {
  const context = `${where} in ${choice.label}`;
  expect(text, context).toMatch(figureIn(choice.label));
  if (density) expect(text, context).toMatch(figureIn(choice.dLabel));
  // conductivity is never the name of a figure in a resistivity unit
  // (case-insensitive: labels may be upper-cased by CSS, and a figure may sit on the next line)
  expect(text, context).not.toMatch(
    new RegExp(`Conductivity[\\s:]{0,4}\\d[\\d.]*(?: × 10[⁻⁰-⁹]+)? ${resistivityUnit.source}`, 'i'),
  );
  expect(text, context).not.toMatch(/\d(?:\.\d+)?e[+-]\d/i); // no "2.26e+3"
  expect(text, context).not.toMatch(/\b\d{7,}\b/); // no raw SI such as 16240000
  expect(text, context).not.toContain('values.conductivity');
}

const mainText = (page: Page) => page.locator('main').innerText();

async function choose(page: Page, choice: Choice) {
  await page.getByLabel('Conductivity in').first().selectOption(choice.conductivity);
  await page.getByLabel('Density in').first().selectOption(choice.density);
}

const fileName = (choice: Choice) => choice.conductivity.replace(/[^a-z]/gi, '');

describe('units everywhere, as a person reads every screen in Chromium', () => {
  let revisionId = 0;

  it('a curator proposes a change (through the API, with the curator’s session)', async () => {
    const request = session.page.context().request;
    const origin = { Origin: session.url };
    const signIn = await request.post(`${session.url}/api/v1/auth/sign-in`, {
      data: { email: demo('curator').email, password: demo('curator').password },
      headers: origin,
    });
    expect(signIn.status()).toBe(200);
    const proposed = await request.post(`${session.url}/api/v1/revisions`, {
      data: {
        kind: 'edit',
        alloy: 'red-brass-c23000',
        // 36.5 %IACS in S/m (100 %IACS = 58.0 MS/m, IEC 60028); the range is left as it is
        set: { values: { conductivity: { nominal: 36.5 * 0.58e6 } } },
        source: { citation: 'Strip certificates, lot 12 (invented for the test)', kind: 'paper' },
        reason: 'Certificates read 36.5 %IACS',
      },
      headers: origin,
    });
    expect(proposed.status(), await proposed.text()).toBe(201);
    revisionId = ((await proposed.json()) as { id: number }).id;
    await request.post(`${session.url}/api/v1/auth/sign-out`, { headers: origin });
    // the second curator reviews it
    const second = await request.post(`${session.url}/api/v1/auth/sign-in`, {
      data: { email: 'curator2@carrowbay.example', password: 'curator2-demo-2026' },
      headers: origin,
    });
    expect(second.status()).toBe(200);
  });

  for (const choice of choices) {
    it(`reads the Alloy sheet, Match, Layer Lab and the Review Desk in ${choice.label}`, async () => {
      const page = session.page;
      await page.goto(`${session.url}/alloys/cartridge-brass-c26000`);
      await page.getByRole('heading', { name: 'Values and sources' }).waitFor();
      await choose(page, choice);
      const sheet = await mainText(page);
      expectReadable(sheet, choice, 'Alloy sheet');
      expect(sheet).toMatch(/σ\/ρ \(ρ = density\)/i); // the figure's label is upper-cased by CSS
      if (resistivityUnit.test(choice.label)) expect(sheet).toMatch(/Electrical resistivity/);
      await page.screenshot({
        path: shot(`e2e-units-alloy-sheet-${fileName(choice)}`),
        fullPage: true,
      });

      await page.goto(`${session.url}/match`);
      await page.getByLabel('Conductivity or resistivity', { exact: true }).fill(choice.reading);
      await page.getByLabel('Density (optional)', { exact: true }).fill(choice.dReading);
      await page.getByRole('button', { name: 'Find candidates' }).click();
      await page.getByRole('list', { name: 'Candidates, best first' }).waitFor();
      const candidates = page.getByRole('list', { name: 'Candidates, best first' });
      await expect(candidates.textContent()).resolves.toMatch(/Cartridge brass/);
      expectReadable(await mainText(page), choice, 'Match');
      await page.screenshot({ path: shot(`e2e-units-match-${fileName(choice)}`), fullPage: true });

      await page.goto(`${session.url}/layer-lab`);
      await page.getByRole('group', { name: 'Estmark 5 marks' }).waitFor();
      await page.getByRole('button', { name: 'Compare the blanks' }).click();
      await page.getByText(/computed in \d+ ms/).waitFor({ timeout: 60_000 });
      const chart = page.getByRole('img', {
        name: /^Chart of apparent (conductivity|resistivity)/,
      });
      await expect(chart.getAttribute('aria-label')).resolves.toContain(choice.label);
      // the chart's own axis says the unit, and recharts' SVG takes no keyboard focus
      await expect(page.locator('svg.recharts-surface[tabindex]').count()).resolves.toBe(0);
      expectReadable(await mainText(page), choice, 'Layer Lab');
      await page.screenshot({
        path: shot(`e2e-units-layer-lab-${fileName(choice)}`),
        fullPage: true,
      });

      await page.goto(`${session.url}/review`);
      const card = page.getByRole('listitem').filter({ hasText: `#${revisionId}` });
      await card.waitFor();
      const cardText = await card.innerText();
      expect(cardText).toContain('Red brass 85/15');
      expect(cardText).not.toContain('red-brass-c23000');
      expect(cardText).toMatch(/range unchanged/);
      expect(cardText).toMatch(resistivityUnit.test(choice.label) ? /Resistivity/ : /Conductivity/);
      expectReadable(cardText, choice, 'Review Desk', false);
      await page.screenshot({ path: shot(`e2e-units-review-${fileName(choice)}`), fullPage: true });
    }, 120_000);
  }

  it('the propose form reads in the chosen unit, converts on a unit change and sends SI', async () => {
    const page = session.page;
    await page.goto(`${session.url}/alloys/low-brass-c24000`);
    await page.getByRole('heading', { name: 'Values and sources' }).waitFor();
    await choose(page, choices[3]); // µΩ·cm, g/cm³
    await page.getByText('Propose a change (curators)').click();
    // 32 %IACS (the seed) = 18.56 MS/m = 5.388 µΩ·cm (100 %IACS = 58.0 MS/m, IEC 60028)
    const resistivity = page.getByLabel('Resistivity, nominal', { exact: true });
    await expect(resistivity.inputValue()).resolves.toBe('5.388');
    await page.getByLabel('Resistivity, nominal: unit').selectOption('MS/m');
    const conductivity = page.getByLabel('Conductivity, nominal', { exact: true });
    await expect(conductivity.inputValue()).resolves.toBe('18.56');
    await expect(page.getByLabel('Range from').inputValue()).resolves.toBe('17.98');
    await conductivity.fill('18.27');
    await page
      .getByLabel('Source: citation (required)')
      .fill('Mill certificate 7 (invented for the test)');
    await page.getByLabel('Reason (required)').fill('Certificate reads 18.27 MS/m');
    await page.screenshot({ path: shot('e2e-units-propose-form'), fullPage: true });
    await page.getByRole('button', { name: 'Propose for review' }).click();
    const done = page.getByText(/Proposed as revision \d+/);
    await done.waitFor();
    const id = Number(/revision (\d+)/.exec((await done.textContent()) ?? '')![1]);
    const revision = await page.context().request.get(`${session.url}/api/v1/revisions/${id}`);
    const set = (
      (await revision.json()) as {
        set: { values: Record<string, { nominal: number; min?: number; max?: number }> };
      }
    ).set;
    expect(set.values.conductivity!.nominal).toBeCloseTo(18.27e6, -2);
    expect(set.values.conductivity!.min).toBeCloseTo(31 * 0.58e6, -2);
    expect(set.values.conductivity!.max).toBeCloseTo(33 * 0.58e6, -2);
    // density untouched: the stored figure is sent as it was, 8.67 g/cm³ in the seed
    expect(set.values.density!.nominal).toBeCloseTo(8670, 3);
  }, 60_000);

  it('runs Pulse Bench with the wire given as a diameter, numbers in one style', async () => {
    const page = session.page;
    await page.goto(`${session.url}/pulse-bench`);
    await page.getByLabel('Wire (gauge or diameter): unit').selectOption('mm');
    // AWG 26 is 0.405 mm bare (ASTM B258)
    await page.getByLabel('Wire (gauge or diameter)', { exact: true }).fill('0.405');
    await page.getByRole('button', { name: 'Fire (simulated)' }).click();
    await page
      .getByRole('region', { name: 'Launch of Estmark 1 mark, first issue' })
      .waitFor({ timeout: 60_000 });
    const text = await mainText(page);
    expect(text).toMatch(/Peak current\s*\d[\d.]*(?: × 10[⁻⁰-⁹]+)? A at/i);
    expect(text).toMatch(/\d J stored/);
    expect(text).not.toMatch(/\d(?:\.\d+)?e[+-]\d/i);
    await expect(page.locator('svg.recharts-surface[tabindex]').count()).resolves.toBe(0);
    await page.screenshot({ path: shot('e2e-units-pulse-bench'), fullPage: true });
  }, 90_000);

  it('after approval, the Alloy sheet history reads in every unit, in words', async () => {
    const page = session.page;
    const approved = await page
      .context()
      .request.post(`${session.url}/api/v1/revisions/${revisionId}/review`, {
        data: { decision: 'approve', comment: 'checked against the certificates' },
        headers: { Origin: session.url },
      });
    expect(approved.status(), await approved.text()).toBe(200);
    for (const choice of choices) {
      await page.goto(`${session.url}/alloys/red-brass-c23000`);
      await choose(page, choice);
      const history = page.getByRole('region', { name: 'History' });
      const row = history.getByRole('row').filter({ hasText: 'curator2@carrowbay.example' });
      await row.first().waitFor();
      const text = await history.innerText();
      expect(text).not.toContain('(SI)');
      expect(text).toMatch(resistivityUnit.test(choice.label) ? /Resistivity/ : /Conductivity/);
      expect(text).toMatch(/range unchanged/);
      expectReadable(text, choice, 'history', false);
      expectReadable(await mainText(page), choice, 'Alloy sheet with history');
      await page.screenshot({
        path: shot(`e2e-units-history-${fileName(choice)}`),
        fullPage: true,
      });
    }
  }, 120_000);

  it('raised no error in the page', () => {
    expect(session.pageErrors).toEqual([]);
  });
});
