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

/** A small four-point export, unique per run (T in K, V in mV at 1 mA; invented values). */
function exportFile(): string {
  const lines = [`# browser test ${Date.now()}`, 'T (K),V (mV),I (mA)'];
  for (let i = 0; i < 30; i++) {
    const kelvin = 100 + 10 * i;
    lines.push(`${kelvin},${(2 * (kelvin / 300) ** 1.5).toFixed(5)},1.000`);
  }
  return `${lines.join('\n')}\n`;
}

describe('a probe station posts its own sweep', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser(1280, 1000);
  });
  afterAll(async () => {
    await browser.close();
  });

  it('the API reference page renders under the app CSP', async () => {
    const { page } = browser;
    const refused: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error') refused.push(m.text());
    });
    await page.goto(`${BASE_URL}/api/docs`);
    await page.getByText('/station/sweeps').first().waitFor({ timeout: 30_000 });
    expect(page.url()).toBe(`${BASE_URL}/api/docs/`);
    expect(refused.filter((t) => /Content Security Policy|Refused/i.test(t))).toEqual([]);
    await screenshot(page, 'api-docs');
  });

  it('a manager makes a token, the station posts with it, the worklist shows the post', async () => {
    const { page } = browser;
    page.removeAllListeners('console');
    const manager = await apiToken('manager');
    const stations = await apiGet<{ items: Array<{ id: number; name: string }> }>(
      manager,
      '/api/stations?sort=name',
    );
    const station = stations.items[0]!;

    await signIn(page, 'manager');
    await page.goto(`${BASE_URL}/stations`);
    await page.getByRole('heading', { name: 'Station tokens' }).waitFor();
    await page.getByRole('combobox', { name: 'Station' }).click();
    await page.getByRole('option', { name: station.name, exact: true }).click();
    await page.getByLabel('Where it is used').fill('bench computer (browser test)');
    await page.getByRole('button', { name: 'New token' }).click();
    const token = (await page.getByTestId('new-token').textContent())!.trim();
    expect(token).toMatch(/^rts_/);
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'station-tokens');
    await page.getByRole('button', { name: 'I have stored it' }).click();
    // Shown once: gone from the page as soon as it is put away.
    await page.getByText(token).waitFor({ state: 'detached' });

    // the manager assigns a wafer with this station, then the station computer posts
    const wafers = await apiGet<{ items: Array<{ id: number }> }>(
      manager,
      '/api/wafers?pageSize=50',
    );
    const assignees = await apiGet<{ items: Array<{ id: number; role: string }> }>(
      manager,
      '/api/users/assignees',
    );
    const wafer = wafers.items[wafers.items.length - 1]!;
    const assigned = await fetch(`${BASE_URL}/api/assignments`, {
      method: 'POST',
      headers: { authorization: `Bearer ${manager}`, 'content-type': 'application/json' },
      body: JSON.stringify({
        waferId: wafer.id,
        assigneeId: assignees.items.find((a) => a.role === 'technician')!.id,
        task: 'Temperature sweep (station browser test)',
        // due today: early in the worklist, which lists by due date
        dueDate: new Date().toISOString().slice(0, 10),
        stationId: station.id,
      }),
    });
    expect(assigned.status).toBe(201);
    const form = new FormData();
    form.set('waferId', String(wafer.id));
    form.set('method', 'four-point');
    form.set('spacingCm', '0.1');
    form.set('thicknessCm', '0.05');
    form.set('file', new Blob([exportFile()], { type: 'text/csv' }), 'bench.csv');
    const posted = await fetch(`${BASE_URL}/api/station/sweeps`, {
      method: 'POST',
      headers: { authorization: `Bearer ${token}`, 'idempotency-key': `e2e-${Date.now()}` },
      body: form,
    });
    expect(posted.status, await posted.clone().text()).toBe(201);

    await page.goto(`${BASE_URL}/worklist`);
    await page.getByRole('heading', { name: 'Worklist' }).waitFor();
    await page.getByText(`Posted by ${station.name}`).first().waitFor({ timeout: 20_000 });
    await screenshot(page, 'worklist-station-post');
  });
});
