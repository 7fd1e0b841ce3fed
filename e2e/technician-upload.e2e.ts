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
        await file.getByText('Ready to store').waitFor();
        await expect(
          file.getByRole('table', { name: /Detected columns/ }).isVisible(),
        ).resolves.toBe(true);
        expect(await seriousViolations(page)).toEqual([]);
        await screenshot(page, `upload-preview-${width}`);

        const methodSelect = page.getByRole('combobox', { name: 'Method' });
        if ((await methodSelect.textContent())?.trim() === '') {
          await methodSelect.click();
          await page.getByRole('option', { name: /Four-point probe/ }).click();
        }
        // The demo file was measured on a station: its probe spacing completes the geometry.
        await page.getByRole('combobox', { name: 'Probe station' }).click();
        await page.getByRole('option').nth(1).click();
        await page.getByRole('button', { name: /^Store 1 file/ }).click();
        const outcome = file.getByText(/Stored: \d+ points|Refused/);
        await outcome.waitFor({ timeout: 60_000 });
        const text = (await outcome.textContent()) ?? '';
        if (text.includes('Refused')) {
          // A rerun on the same data: the duplicate must be recognised, not stored twice.
          await expect(file.getByRole('alert').first().textContent()).resolves.toMatch(
            /already|earlier|duplicate/i,
          );
        } else {
          expect(Number(/Stored: (\d+)/.exec(text)?.[1])).toBeGreaterThan(0);
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
