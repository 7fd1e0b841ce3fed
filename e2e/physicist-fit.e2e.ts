import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  BASE_URL,
  REPO_DIR,
  apiGet,
  apiItems,
  apiToken,
  browserForTests,
  openStudy,
  screenshot,
  seriousViolations,
  uploadSweep,
} from './support/app';

interface Sweep {
  id: number;
  pointCount?: number;
}

/** A sweep to study: the largest stored silicon one, or the demo file uploaded to the first silicon wafer. */
async function findOrMakeSweep(): Promise<Sweep> {
  const token = await apiToken('physicist');
  // Silicon only: a metal-film sweep has no Arrhenius plot to drag on.
  const wafers = await apiGet<{ items: Array<{ id: number }> }>(
    token,
    '/api/wafers?pageSize=200&material=Si',
  );
  let best: Sweep | null = null;
  for (const wafer of wafers.items) {
    for (const s of await apiItems<Sweep>(token, `/api/wafers/${wafer.id}/sweeps`))
      if (!best || (s.pointCount ?? 0) > (best.pointCount ?? 0)) best = s;
  }
  if (best) return best;
  const target = wafers.items[0];
  if (!target) throw new Error('the demo data holds no wafer');
  const file = join(REPO_DIR, 'seed-data/sweeps/comma-kelvin-four-point.csv');
  return uploadSweep(token, target.id, { method: 'four-point' }, file);
}

describe('a physicist studies a sweep', () => {
  const browserPage = browserForTests(1280, 1000);
  let sweep: Sweep;
  beforeAll(async () => {
    sweep = await findOrMakeSweep();
  });

  it('drags an Arrhenius window, previews the fit and keeps it', async () => {
    const page = browserPage();
    const started = await openStudy(page, 'physicist', sweep.id);
    const arrhenius = page.getByRole('figure', { name: /Arrhenius plot/ });
    await arrhenius.locator('.nsewdrag').first().waitFor({ timeout: 60_000 });
    await page
      .getByRole('figure', { name: /with the model curve/ })
      .locator('.nsewdrag')
      .first()
      .waitFor({ timeout: 60_000 });
    console.log(
      `[e2e] sweep study of ${sweep.pointCount} points interactive after ${Date.now() - started} ms`,
    );

    const layer = arrhenius.locator('.nsewdrag').first();
    await layer.scrollIntoViewIfNeeded();
    const box = await layer.boundingBox();
    if (!box) throw new Error('the Arrhenius plot has no drag layer');
    const y = box.y + box.height / 2;
    await page.mouse.move(box.x + box.width * 0.25, y);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.5, y, { steps: 8 });
    await page.mouse.move(box.x + box.width * 0.75, y, { steps: 8 });
    await page.mouse.up();

    // A drag previews the fit; nothing is saved until Keep.
    const preview = page.getByRole('article', { name: /Arrhenius window .* \(preview\)/ });
    await preview.waitFor({ timeout: 30_000 });
    await expect(preview.getByText('Activation energy (eV)').isVisible()).resolves.toBe(true);
    await screenshot(page, 'sweep-study-preview');
    const token = await apiToken('physicist');
    const listFits = () =>
      apiItems<{ id: number; kind: string }>(token, `/api/sweeps/${sweep.id}/fits`);
    const before = (await listFits()).length;

    await page.getByRole('button', { name: 'Keep this fit' }).click();
    const card = page.getByRole('article', { name: /Arrhenius window .* \(fit \d+\)/ }).first();
    await card.waitFor({ timeout: 30_000 });
    const title = (await card.getAttribute('aria-label')) ?? '';
    const fitId = Number(/fit (\d+)/.exec(title)?.[1]);
    const saved = page.getByRole('table', { name: 'Saved fits' });
    await saved.getByText(`#${fitId}`).waitFor();

    const list = await listFits();
    expect(list).toHaveLength(before + 1); // Keep saved exactly one fit
    expect(list.find((f) => f.id === fitId)?.kind).toBe('arrhenius');

    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'sweep-study');
  });

  it('lot detail and overlay draw their plots', async () => {
    const page = browserPage();
    await page.goto(`${BASE_URL}/lots`);
    await page.getByRole('table', { name: 'Lots' }).locator('a').first().click();
    await page.getByRole('heading', { name: /^Lot / }).waitFor();
    await page.waitForLoadState('networkidle');
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'lot-detail');
    await page.goto(`${BASE_URL}/lots`);
    await page.waitForLoadState('networkidle');
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'lots');
    await page.goto(`${BASE_URL}/overlay`);
    await page.getByRole('heading', { name: 'Overlay' }).waitFor();
    await page.waitForLoadState('networkidle');
    await screenshot(page, 'overlay');
  });
});
