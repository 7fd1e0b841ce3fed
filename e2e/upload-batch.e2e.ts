/**
 * An engineer brings in a batch of mixed files: the drop zone opens the chooser on a click, each
 * file gets its own method (preset from its columns), the preview blocks a file the store would
 * refuse, warns about readings outside the station's range, shows the header's disagreement with
 * the records for a choice, and the two good files are stored together.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, apiGet, apiToken, openBrowser, screenshot, signIn } from './support/app';

interface Listed {
  id: number;
  code?: string;
  number?: string;
}

/** A file the chooser takes; `run` keeps reruns from being recognised as duplicates. */
const csv = (name: string, run: string, lines: string[]) => ({
  name,
  mimeType: 'text/csv',
  buffer: Buffer.from([`Run: ${run}`, ...lines].join('\n')),
});

describe('an engineer uploads a batch of mixed files', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser(1280, 1000);
  });
  afterAll(async () => {
    await browser.close();
  });

  it('checks each file as the store would and stores the good ones together', async () => {
    const token = await apiToken('engineer');
    const lots = await apiGet<{ items: Listed[] }>(token, '/api/lots?q=LV-26-B014');
    const lot = lots.items.find((l) => l.code === 'LV-26-B014')!;
    const wafers = await apiGet<{ items: Listed[] } | Listed[]>(
      token,
      `/api/lots/${lot.id}/wafers`,
    );
    const list = Array.isArray(wafers) ? wafers : wafers.items;
    // W04, not W03: W03 holds the demo's map, which the map test opens afterwards.
    const wafer = list.find((w) => w.number === 'W04')!;

    const { page } = browser;
    await signIn(page, 'engineer');
    await page.goto(`${BASE_URL}/wafers/${wafer.id}`);
    await page.getByRole('heading', { name: 'Bring in sweeps' }).waitFor();

    const run = String(Date.now());
    const chooser = page.waitForEvent('filechooser');
    await page.getByText('Drop probe-station exports here, or click to choose').click();
    await (
      await chooser
    ).setFiles([
      csv('hot-chuck.csv', run, [
        'Station: Hot chuck South',
        'Sample: LV-26-B014-W04',
        'Thickness: 380 um',
        'temperature_K,current_A,voltage_V',
        '80,1.0e-3,1.84e-3',
        '300,1.0e-3,3.10e-2',
        '400,1.0e-3,4.40e-2',
      ]),
      csv('square.csv', run, ['T (K),R_A (ohm),R_B (ohm)', '300,12.1,11.9', '320,12.9,12.7']),
      csv('broken.csv', run, ['T (K),V (mV),I (mA)', '-5,1.2,1', '300,abc,1']),
    ]);

    const hot = page.getByRole('article', { name: 'File hot-chuck.csv' });
    const square = page.getByRole('article', { name: 'File square.csv' });
    const broken = page.getByRole('article', { name: 'File broken.csv' });
    await broken.getByText('Needs attention').waitFor();
    await expect(broken.getByRole('alert').textContent()).resolves.toMatch(/no probe spacing/);
    // given its station, the rows themselves are checked: two rows the store would refuse
    await broken.getByRole('combobox', { name: 'Probe station' }).click();
    await page.getByRole('option', { name: 'Hot chuck South' }).click();
    await broken.getByText('Checking…').waitFor({ state: 'detached' });
    await expect(broken.getByRole('alert').textContent()).resolves.toMatch(
      /Line 3, T \(K\):\s*the temperature is at or below 0 K \(-5 K\)[\s\S]*Line 4, V \(mV\):\s*"abc" is not a number/,
    );

    // each file its own method, preset from its columns; the station named in the header
    await hot.getByText('Ready to store').waitFor();
    await square.getByText('Ready to store').waitFor();
    await expect(hot.getByRole('combobox', { name: 'Method' }).textContent()).resolves.toMatch(
      /Four-point probe/,
    );
    await expect(square.getByRole('combobox', { name: 'Method' }).textContent()).resolves.toMatch(
      /Van der Pauw/,
    );
    await expect(
      hot.getByRole('combobox', { name: 'Probe station' }).textContent(),
    ).resolves.toContain('Hot chuck South');
    // the mapping and layout in Rhotrace's words
    await expect(hot.getByText(/values are separated by commas/).isVisible()).resolves.toBe(true);
    await expect(
      hot.getByRole('combobox', { name: 'Column temperature_K', exact: true }).textContent(),
    ).resolves.toContain('holds temperature');
    // the station range, before storing
    await expect(hot.getByRole('list', { name: /Before storing/ }).textContent()).resolves.toMatch(
      /1 point\(s\) at 80 K lie outside the 290 K to 720 K that station "Hot chuck South" spans/,
    );
    // the header's thickness against the lot's: the user chooses the file's
    await hot.getByText("Use the file's 380 µm").click();
    await hot.getByText('Checking…').waitFor({ state: 'detached' });
    await hot.getByText('Ready to store').waitFor();
    await screenshot(page, 'upload-batch-preview');

    await page.getByText('1 file needs attention before storing.').waitFor();
    await page.getByRole('button', { name: 'Store 2 files' }).click();
    await hot.getByText('Stored: 3 points').waitFor({ timeout: 20_000 });
    await square.getByText('Stored: 2 points').waitFor({ timeout: 20_000 });
    await expect(hot.getByRole('list', { name: 'Warnings' }).textContent()).resolves.toMatch(
      /thickness 380 µm, the record 525 µm on the lot; the file's value was used/,
    );
  });
});
