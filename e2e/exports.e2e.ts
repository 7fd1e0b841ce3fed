import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, apiGet, apiToken, openBrowser, screenshot, signIn } from './support/app';

interface Page<T> {
  items: T[];
}
interface LotRow {
  id: number;
  code: string;
}

/** A demo sweep with at least one saved fit (the seed saves three). */
async function sweepWithFits(): Promise<{ sweepId: number; lotId: number }> {
  const token = await apiToken('physicist');
  const fits = await apiGet<{ items: Array<{ sweepId: number; lotId: number }> }>(
    token,
    '/api/fits/recent?limit=1',
  );
  const first = fits.items[0];
  if (!first) throw new Error('the demo data holds no saved fit');
  return { sweepId: first.sweepId, lotId: first.lotId };
}

describe('exports download real files', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let target: { sweepId: number; lotId: number };
  beforeAll(async () => {
    target = await sweepWithFits();
    browser = await openBrowser(1280, 1000);
    await signIn(browser.page, 'physicist');
  });
  afterAll(async () => {
    await browser.close();
  });

  it('the study page saves the PDF report and the fits as CSV', async () => {
    const { page } = browser;
    await page.goto(`${BASE_URL}/sweeps/${target.sweepId}`);
    await page.getByRole('table', { name: 'Saved fits' }).waitFor();

    const [pdf] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Printable report (PDF)' }).click(),
    ]);
    expect(pdf.suggestedFilename()).toBe(`sweep-${target.sweepId}-report.pdf`);
    const pdfBytes = readFileSync(await pdf.path());
    expect(pdfBytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdfBytes.length).toBeGreaterThan(1000);

    const [csv] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Export fits (CSV)' }).click(),
    ]);
    expect(csv.suggestedFilename()).toBe(`sweep-${target.sweepId}-fits.csv`);
    const lines = readFileSync(await csv.path(), 'utf8')
      .trim()
      .split(/\r?\n/);
    const token = await apiToken('physicist');
    const fits = await apiGet<Array<{ id: number }> | Page<{ id: number }>>(
      token,
      `/api/sweeps/${target.sweepId}/fits`,
    );
    const count = (Array.isArray(fits) ? fits : fits.items).length;
    expect(count).toBeGreaterThan(0);
    // A header line, then one line per saved fit at least (the same file the API serves).
    const direct = await fetch(`${BASE_URL}/api/sweeps/${target.sweepId}/fits.csv`, {
      headers: { authorization: `Bearer ${token}` },
    });
    expect((await direct.text()).trim().split(/\r?\n/)).toEqual(lines);
    expect(lines.length).toBeGreaterThan(count);
  });

  it('lot detail saves the lot summary as CSV', async () => {
    const { page } = browser;
    const token = await apiToken('physicist');
    const lot = await apiGet<LotRow>(token, `/api/lots/${target.lotId}`);
    await page.goto(`${BASE_URL}/lots/${lot.id}`);
    const button = page.getByRole('button', { name: 'Export summary (CSV)' });
    await button.waitFor();
    const [csv] = await Promise.all([page.waitForEvent('download'), button.click()]);
    expect(csv.suggestedFilename()).toBe(`lot-${lot.code}-summary.csv`);
    const text = readFileSync(await csv.path(), 'utf8');
    const direct = await fetch(`${BASE_URL}/api/lots/${lot.id}/summary.csv`, {
      headers: { authorization: `Bearer ${token}` },
    });
    expect(text).toBe(await direct.text());
    expect(text).toContain(lot.code);
    await screenshot(page, 'lot-detail-export');
  });
});
