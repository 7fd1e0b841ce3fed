import type { LotDto, Page as ApiPage, WaferDto } from '@rhotrace/api-types';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page as BrowserPage } from 'playwright-core';
import { BASE_URL, apiGet, apiToken, openBrowser, signIn } from './support/app';

describe('lengths in the units a lab writes', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser(1280, 1000);
  });
  afterAll(async () => {
    await browser.close();
  });

  it('registers a lot in mm and µm, adds a wafer in µm and shows both back as typed', async () => {
    const { page } = browser;
    const code = `UNITS-${Date.now().toString(36).toUpperCase()}`;
    await signIn(page, 'engineer');
    await page.goto(`${BASE_URL}/lots/new`);
    await page.getByLabel('Lot code').fill(code);
    await page.getByLabel('Diameter').fill('150');
    await page.getByLabel('Nominal thickness').fill('525');
    await page.getByLabel('Received on').fill('2001-02-03');
    await page.getByRole('button', { name: 'Register' }).click();
    await page.getByRole('heading', { name: new RegExp(code) }).waitFor();
    await expectText(page, '150 mm');
    await expectText(page, '525 µm');
    await expectText(page, '2001-02-03');

    await page.getByRole('button', { name: 'Add a wafer' }).click();
    await page.getByLabel('Wafer number').fill('U1');
    await page.getByLabel('Measured thickness').fill('512');
    await page.getByRole('button', { name: 'Add', exact: true }).click();
    const row = page.getByRole('table', { name: 'Wafers of this lot' }).getByRole('row', {
      name: /U1/,
    });
    await row.getByText('512 µm').waitFor();

    // Stored as before, in cm: 150 mm = 15 cm, 525 µm = 0.0525 cm, 512 µm = 0.0512 cm (SI).
    const token = await apiToken('engineer');
    const lots = await apiGet<ApiPage<LotDto>>(token, `/api/lots?q=${code}`);
    const lot = lots.items.find((l) => l.code === code)!;
    expect([lot.diameterCm, lot.thicknessCm, lot.receivedOn?.slice(0, 10)]).toEqual([
      15,
      0.0525,
      '2001-02-03',
    ]);
    const wafers = await apiGet<ApiPage<WaferDto>>(token, `/api/lots/${lot.id}/wafers`);
    expect(wafers.items.map((w) => w.thicknessCm)).toEqual([0.0512]);

    // Remeasured: the wafer's own page edits the thickness in µm, shown back the same way.
    await row.getByRole('link', { name: 'U1' }).click();
    await page.getByRole('button', { name: 'Edit wafer' }).click();
    const dialog = page.getByRole('dialog', { name: /Edit wafer U1/ });
    await expect(dialog.getByLabel('Measured thickness').inputValue()).resolves.toBe('512');
    await dialog.getByLabel('Measured thickness').fill('498.5');
    await dialog.getByRole('button', { name: 'Save' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await expectText(page, '498.5 µm');
    const edited = await apiGet<WaferDto>(token, `/api/wafers/${wafers.items[0]!.id}`);
    expect(edited.thicknessCm).toBeCloseTo(0.04985, 12);

    // Put away what the test made, so other tests see the demo lab as seeded.
    for (const path of [`/api/wafers/${wafers.items[0]!.id}`, `/api/lots/${lot.id}`]) {
      const res = await fetch(`${BASE_URL}${path}`, {
        method: 'DELETE',
        headers: { authorization: `Bearer ${token}` },
      });
      expect(res.status, path).toBe(204);
    }
  });
});

async function expectText(page: BrowserPage, text: string): Promise<void> {
  await page.getByText(text, { exact: false }).first().waitFor();
}
