import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  BASE_URL,
  apiGet,
  apiToken,
  openBrowser,
  screenshot,
  seriousViolations,
  signIn,
} from './support/app';

interface Page<T> {
  items: T[];
}
interface Wafer {
  id: number;
  lotId: number;
  number: string;
}
interface SweepSummary {
  id: number;
  map?: unknown;
}
interface MapSite {
  label: string | null;
  resistivityOhmCm: number;
}
interface SweepMap {
  temperaturesK: number[];
  maps: Array<{ temperatureK: number; sites: MapSite[]; statistics: object | null }>;
}

/** The demo's map sweep and its wafer. */
async function findMapSweep(): Promise<{ wafer: Wafer; sweepId: number; map: SweepMap }> {
  const token = await apiToken('engineer');
  const wafers = await apiGet<Page<Wafer>>(token, '/api/wafers?pageSize=200');
  for (const wafer of wafers.items) {
    const body = await apiGet<Page<SweepSummary> | SweepSummary[]>(
      token,
      `/api/wafers/${wafer.id}/sweeps`,
    );
    const found = (Array.isArray(body) ? body : body.items).find((s) => s.map);
    if (found) {
      return { wafer, sweepId: found.id, map: await apiGet(token, `/api/sweeps/${found.id}/map`) };
    }
  }
  throw new Error('the demo data holds no map sweep');
}

/** The ohm cm value a readout states ("…: 12.34 Ω·cm…"). */
function readoutValue(text: string): number {
  const m = /\):\s*([\d.]+)\s*Ω·cm/.exec(text);
  if (!m) throw new Error(`no value in the readout "${text}"`);
  return Number(m[1]);
}

describe('the wafer map view', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let target: Awaited<ReturnType<typeof findMapSweep>>;
  beforeAll(async () => {
    target = await findMapSweep();
    browser = await openBrowser(1280, 1000);
  });
  afterAll(async () => {
    await browser.close();
  });

  it('reads site values by keyboard, steps through temperatures, shows the table and saves a PNG', async () => {
    const { page } = browser;
    await signIn(page, 'engineer');
    await page.goto(`${BASE_URL}/wafers/${target.wafer.id}`);
    const figure = page.getByRole('group', { name: /^Sweep \d+ · [\d.]+ K$/ });
    await figure.waitFor({ timeout: 30_000 });
    // The view opens at the step nearest 23 °C.
    const start = target.map.maps.reduce(
      (best, m, i, all) =>
        Math.abs(m.temperatureK - 296.15) < Math.abs(all[best]!.temperatureK - 296.15) ? i : best,
      0,
    );
    const at = target.map.maps[start]!;

    // Keyboard: the map is one tab stop; arrow keys walk the sites and the readout says each.
    const sites = figure.locator('circle.site');
    await page.getByRole('heading', { name: 'Wafer map' }).scrollIntoViewIfNeeded();
    await sites.first().focus();
    const readout = page.locator('figcaption.readout');
    await readout.filter({ hasText: /^Site 1 / }).waitFor();
    await page.keyboard.press('ArrowRight');
    await readout.filter({ hasText: /^Site 2 / }).waitFor();
    await page.keyboard.press('ArrowRight');
    await readout.filter({ hasText: /^Site 3 / }).waitFor();
    const text = (await readout.textContent()) ?? '';
    expect(text).toMatch(/^Site 3 \(x [-\d.]+ mm, y [-\d.]+ mm\): /);
    const site3 = at.sites.find((s) => s.label === '3')!;
    expect(Math.abs(readoutValue(text) / site3.resistivityOhmCm - 1)).toBeLessThan(1e-3);
    await expect(
      page.evaluate(() => document.activeElement?.getAttribute('aria-label')),
    ).resolves.toBe(text);
    await page.keyboard.press('End');
    await readout.filter({ hasText: /^Site 25 / }).waitFor();

    // The slider moves to the next temperature step.
    const slider = page.getByRole('slider', { name: 'Temperature step of the map' });
    await slider.focus();
    await page.keyboard.press('ArrowRight');
    const next = target.map.maps[start + 1]!;
    await page
      .getByRole('group', { name: new RegExp(`· ${next.temperatureK.toFixed(1)} K$`) })
      .waitFor({ timeout: 10_000 });

    // The table view lists every site.
    await page.getByRole('button', { name: 'Show the site table' }).click();
    const rows = page
      .getByRole('table', { name: 'Sites of the map at this temperature' })
      .locator('tbody tr');
    await rows.first().waitFor();
    await expect(rows.count()).resolves.toBe(next.sites.length);

    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Save PNG' }).click();
    expect((await download).suggestedFilename()).toMatch(/^sweep-\d+-map-\d+K\.png$/);

    // The sites and each step's uniformity download as CSV: one row per site and step.
    const csvDownload = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Sites and uniformity (CSV)' }).click();
    const csv = await csvDownload;
    expect(csv.suggestedFilename()).toMatch(/^sweep-\d+-map\.csv$/);
    const lines = readFileSync((await csv.path())!, 'utf8')
      .trim()
      .split('\r\n');
    const siteCount = target.map.maps.reduce((n, m) => n + m.sites.length, 0);
    expect(lines.filter((l) => l.split(',')[9] === '')).toHaveLength(siteCount);
    expect(lines.filter((l) => l.includes(',mean,'))).toHaveLength(
      target.map.maps.filter((m) => m.statistics).length,
    );

    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'wafer-map');

    // The lot shows its map wafers side by side on one scale.
    await page.goto(`${BASE_URL}/lots/${target.wafer.lotId}`);
    await page.getByRole('heading', { name: 'Wafer maps' }).waitFor({ timeout: 30_000 });
    await expect(
      page.getByRole('group', { name: new RegExp(`^${target.wafer.number} · `) }).count(),
    ).resolves.toBe(1);
    await screenshot(page, 'lot-maps');
  });
});
