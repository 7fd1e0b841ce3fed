import {
  BOLTZMANN_EV_PER_K,
  seededNormal,
  seededRandom,
  thermocoupleEmfMv,
} from '@rhotrace/physics';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, apiGet, apiToken, openBrowser, screenshot, signIn } from './support/app';

interface Listed {
  id: number;
  originalName?: string;
}
interface Page<T> {
  items: T[];
}

/**
 * An invented sweep read by a type K thermocouple in mV against a 23.4 °C cold junction, with
 * resistivity activated by 0.3 eV and reading 15 spiked by 30 %. The EMFs are the ITS-90
 * reference function's, E(T) - E(23.4 °C), so the import must give back 300 K to 590 K.
 */
function spikeFile(run: string): Buffer {
  const normal = seededNormal(seededRandom(12));
  const coldMv = thermocoupleEmfMv('K', 273.15 + 23.4);
  const rows = Array.from({ length: 30 }, (_, i) => {
    const t = 300 + 10 * i;
    const activated = Math.exp(0.3 / (BOLTZMANN_EV_PER_K * t) - 0.3 / (BOLTZMANN_EV_PER_K * 300));
    const v = 10 * activated * (i === 14 ? 1.3 : 1) * (1 + 0.002 * normal());
    return `${(thermocoupleEmfMv('K', t) - coldMv).toFixed(4)},1,${v.toPrecision(6)}`;
  });
  const head = [`# run ${run}`, '# thermocouple: K', '# cold junction: 23.4 °C'];
  return Buffer.from([...head, 'TC (mV),I (mA),V (mV)', ...rows, ''].join('\n'));
}

describe('a thermocouple sweep with a spike', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  let waferId: number;
  const name = `tc-spike-${Date.now()}.csv`;
  beforeAll(async () => {
    const token = await apiToken('engineer');
    // A demo wafer no other browser test writes to: the last wafer listed moves as other tests
    // add lots of their own (a wafer without a thickness then blocks the preview).
    const lots = await apiGet<Page<Listed & { code: string }>>(token, '/api/lots?q=LV-26-P021');
    const lot = lots.items.find((l) => l.code === 'LV-26-P021');
    if (!lot) throw new Error('the demo lot LV-26-P021 is missing');
    const wafers = await apiGet<Page<Listed & { number: string }>>(
      token,
      `/api/lots/${lot.id}/wafers`,
    );
    const wafer = wafers.items.find((w) => w.number === 'W03');
    if (!wafer) throw new Error('the demo wafer LV-26-P021 W03 is missing');
    waferId = wafer.id;
    browser = await openBrowser(1280, 1000);
  });
  afterAll(async () => {
    await browser.close();
  });

  it('names the conversion in the preview, lists the spike and fits without it', async () => {
    const { page } = browser;
    await signIn(page, 'engineer');
    await page.goto(`${BASE_URL}/wafers/${waferId}`);
    await page.locator('input[type=file]').setInputFiles({
      name,
      mimeType: 'text/csv',
      buffer: spikeFile(name),
    });
    const file = page.getByRole('article', { name: new RegExp(name.replace('.', '\\.')) });
    await file.getByText(/Ready to store|Needs attention/).waitFor({ timeout: 30_000 });
    await file.getByRole('combobox', { name: 'Probe station' }).click();
    await page.getByRole('option', { name: 'Hot chuck South' }).click();
    await file.getByText('Checking…').waitFor({ state: 'detached' });
    await expect(file.getByText(/^\s*Temperatures:/).textContent()).resolves.toMatch(
      /type K thermocouple \(file\).*cold junction at 23\.40 °C \(file metadata\)/,
    );
    await page.getByRole('button', { name: /^Store 1 file/ }).click();
    await file.getByText(/Stored: 30 points/).waitFor({ timeout: 30_000 });

    const token = await apiToken('engineer');
    const listed = await apiGet<Page<Listed> | Listed[]>(token, `/api/wafers/${waferId}/sweeps`);
    const sweep = (Array.isArray(listed) ? listed : listed.items).find(
      (s) => s.originalName === name,
    );
    await page.goto(`${BASE_URL}/sweeps/${sweep!.id}`);
    const doubtful = page.getByRole('region', { name: 'Doubtful points' });
    await doubtful.waitFor({ timeout: 30_000 });
    await expect(doubtful.textContent()).resolves.toMatch(/Point 15 \(row \d+\), Outlier:/);

    const window = page.getByRole('form', { name: 'Window by temperature' });
    await window.getByRole('spinbutton', { name: 'From', exact: true }).fill('295');
    await window.getByRole('spinbutton', { name: 'To', exact: true }).fill('595');
    await window.getByRole('button', { name: 'Preview this window' }).click();
    const excluded = page.getByTestId('excluded').first();
    await excluded.waitFor({ timeout: 30_000 });
    await expect(excluded.textContent()).resolves.toMatch(
      /1 flagged point left out \(readings? 15\)/,
    );
    await page.getByText('flagged (left out of fits)').first().waitFor();
    await screenshot(page, 'thermocouple-spike');
  });
});
