import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REPO_DIR, openBrowser, screenshot, seriousViolations, signIn } from './support/app';

const DEMO_FILE = join(REPO_DIR, 'seed-data/sweeps/comma-kelvin-four-point.csv');

describe('a technician uploads a sweep to an assigned wafer', () => {
  for (const width of [390, 1280]) {
    describe(`at ${width} px`, () => {
      let browser: Awaited<ReturnType<typeof openBrowser>>;
      beforeAll(async () => {
        browser = await openBrowser(width, 900);
      });
      afterAll(async () => {
        await browser.close();
      });

      it('sees the queue, uploads the demo file and sees its points', async () => {
        const { page } = browser;
        await signIn(page, 'technician');
        const queue = page.getByRole('list', { name: 'Assigned wafers' });
        await queue.getByRole('listitem').first().waitFor();
        await screenshot(page, `technician-queue-${width}`);
        // The 390 px run uses the second assignment so each run stores to its own wafer.
        const cards = queue.getByRole('listitem');
        const card = width === 390 && (await cards.count()) > 1 ? cards.nth(1) : cards.first();
        await card.getByRole('link', { name: 'Open and upload' }).click();
        await page.getByRole('heading', { name: 'Bring in sweeps' }).waitFor();
        await expect(
          page.getByRole('note', { name: 'Safety caution' }).first().isVisible(),
        ).resolves.toBe(true);

        await page.locator('input[type=file]').setInputFiles(DEMO_FILE);
        const file = page.getByRole('article', { name: /comma-kelvin-four-point\.csv/ });
        await file.getByText(/Ready to store|Needs attention/).waitFor();
        await expect(file.getByRole('list', { name: /Columns of/ }).isVisible()).resolves.toBe(
          true,
        );
        expect(await seriousViolations(page)).toEqual([]);
        await screenshot(page, `upload-preview-${width}`);

        const methodSelect = file.getByRole('combobox', { name: 'Method' });
        if ((await methodSelect.textContent())?.trim() === '') {
          await methodSelect.click();
          await page.getByRole('option', { name: /Four-point probe/ }).click();
        }
        // The demo file was measured on a station: its probe spacing completes the geometry.
        await file.getByRole('combobox', { name: 'Probe station' }).click();
        await page.getByRole('option').nth(1).click();
        const verdict = file.getByText(/^\s*(Ready to store|Needs attention)\s*$/);
        await file.getByText('Checking…').waitFor({ state: 'detached' });
        if ((await verdict.textContent())?.includes('Needs attention')) {
          // A rerun on the same data: the preview already names the earlier upload.
          await expect(file.getByRole('alert').first().textContent()).resolves.toMatch(
            /already uploaded/i,
          );
        } else {
          await page.getByRole('button', { name: /^Store 1 file/ }).click();
          const outcome = file.getByText(/Stored: \d+ points/);
          await outcome.waitFor({ timeout: 60_000 });
          expect(
            Number(/Stored: (\d+)/.exec((await outcome.textContent()) ?? '')?.[1]),
          ).toBeGreaterThan(0);
        }
        const points = page.getByRole('heading', {
          name: /Points of comma-kelvin-four-point\.csv \(\d+\)/,
        });
        await points.waitFor({ timeout: 30_000 });
        await page.locator('.js-plotly-plot').first().waitFor({ timeout: 30_000 });
        await screenshot(page, `wafer-after-upload-${width}`);
      });
    });
  }
});
