import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, apiGet, apiToken, openBrowser, screenshot, signIn } from './support/app';

/** Internal names that must never reach a person's screen (field keys, ids, raw versions). */
const RAW_NAMES: ReadonlyArray<[string, RegExp]> = [
  ['a field key in cm', /\b(thickness|spacing|diameter)Cm\b/],
  ['a model parameter key', /\b(mobilityScale|acceptorDensity|donorDensity|debyeK|alphaPerK)\b/],
  ['an id in brackets', /\((stationId|waferId|lotId|sweepId)\)/],
  ['a raw column meaning', /\b(resistance|voltage|current)-[ab] column\b/],
  ['a raw model version', /physics@\d/],
  ['the "Sure" column', /\bSure\b/],
  ['a stray space before a comma', /\w ,/],
];

interface Listed {
  id: number;
}
interface Page<T> {
  items: T[];
}

function rawNamesIn(text: string): string[] {
  return RAW_NAMES.filter(([, re]) => re.test(text)).map(
    ([what, re]) => `${what}: "${re.exec(text)?.[0] ?? ''}"`,
  );
}

describe('words on screen and the study page', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let pages: string[] = [];
  let sweepPath = '';
  beforeAll(async () => {
    const token = await apiToken('admin');
    const lots = await apiGet<Page<Listed>>(token, '/api/lots?pageSize=1');
    const wafers = await apiGet<Page<Listed>>(token, '/api/wafers?pageSize=1&material=Si');
    const wafer = wafers.items[0];
    if (!wafer) throw new Error('the demo data holds no silicon wafer');
    const sweeps = await apiGet<Page<Listed> | Listed[]>(token, `/api/wafers/${wafer.id}/sweeps`);
    const sweep = (Array.isArray(sweeps) ? sweeps : sweeps.items)[0];
    if (!sweep) throw new Error('the demo silicon wafer has no sweep');
    sweepPath = `/sweeps/${sweep.id}`;
    pages = [
      '/',
      '/lots',
      `/lots/${lots.items[0]?.id ?? 1}`,
      `/wafers/${wafer.id}`,
      sweepPath,
      `/overlay?sweeps=${sweep.id}`,
      '/worklist',
      '/stations',
      '/people',
      '/trail',
    ];
    browser = await openBrowser(1280, 1000);
    await signIn(browser.page, 'admin');
  });
  afterAll(async () => {
    await browser.close();
  });

  it('shows no internal name on any page', async () => {
    const { page } = browser;
    const found: string[] = [];
    for (const path of pages) {
      await page.goto(`${BASE_URL}${path}`);
      await page.waitForLoadState('networkidle');
      const text = await page.evaluate(() => document.body.innerText);
      for (const problem of rawNamesIn(text)) found.push(`${path}: ${problem}`);
    }
    expect(found).toEqual([]);
  });

  it('draws a previewed window fit as its own trace, in the unit chosen, light and dark', async () => {
    const { page } = browser;
    await page.goto(`${BASE_URL}${sweepPath}`);
    await page
      .getByRole('group', { name: 'Suggested windows' })
      .getByRole('button')
      .first()
      .click();
    const legend = page
      .getByRole('figure', { name: /with the model curve/ })
      .locator('.legendtext');
    await expect
      .poll(async () => (await legend.allTextContents()).join(' | '), { timeout: 30_000 })
      .toMatch(/Arrhenius fit, \d+\.\d–\d+\.\d K \(preview\)/);

    await page.getByLabel('Temperature unit').getByText('°C').click();
    // The page redraws after the click's change detection: read the header once it has.
    await expect.poll(() => page.locator('h1 + p').innerText()).toMatch(/-?\d+\.\d–-?\d+\.\d °C/);
    await expect
      .poll(async () => (await legend.allTextContents()).join(' | '))
      .toMatch(/Arrhenius fit, -?\d+\.\d–-?\d+\.\d °C \(preview\)/);
    const suffixes = await page
      .locator('form[aria-label="Window by temperature"] .mat-mdc-form-field-text-suffix')
      .allInnerTexts();
    expect(suffixes.slice(0, 2)).toEqual(['°C', '°C']);

    // study-light.png and study-dark.png are kept in the repository (see .gitignore).
    await page.evaluate(() => window.scrollTo(0, 0));
    await screenshot(page, 'study-light');
    await page.getByRole('button', { name: 'Use dark scheme' }).click();
    await page.waitForTimeout(500); // the plots redraw in the dark scheme's colours
    await screenshot(page, 'study-dark');
    await page.getByRole('button', { name: 'Use light scheme' }).click();
    // Back to kelvin for whoever signs in next on this profile.
    await page.getByLabel('Temperature unit').getByText('K', { exact: true }).click();
  });
});
