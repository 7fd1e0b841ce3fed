import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, seriousViolations, signIn } from './support/app';

describe('an engineer removes records registered by mistake', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser(1280, 1000);
  });
  afterAll(async () => {
    await browser.close();
  });

  it('deletes a probe station after confirming', async () => {
    const { page } = browser;
    const name = `Mistaken bench ${Date.now()}`;
    await signIn(page, 'engineer');
    await page.getByRole('link', { name: /Probe stations/ }).click();
    await page.getByRole('button', { name: 'Register a station' }).click();
    await page.getByLabel('Name').fill(name);
    await page.getByRole('button', { name: 'Save' }).click();
    const table = page.getByRole('table', { name: 'Probe stations' });
    await table.getByText(name).waitFor();

    // declining the question keeps it
    const question = page.getByRole('alertdialog');
    await page.getByRole('button', { name: `Delete ${name}` }).click();
    await question.getByRole('button', { name: 'Keep it' }).click();
    await question.waitFor({ state: 'detached' });
    await expect(table.getByText(name).isVisible()).resolves.toBe(true);

    await page.getByRole('button', { name: `Delete ${name}` }).click();
    await expect(question.textContent()).resolves.toMatch(/Delete station .*change trail/);
    await question.getByRole('button', { name: 'Delete the station' }).click();
    await table.getByText(name).waitFor({ state: 'detached' });
    expect(await seriousViolations(page)).toEqual([]);
  });

  it('deletes a wafer that was never measured, and is not offered it for a measured one', async () => {
    const { page } = browser;
    await page.getByRole('link', { name: /Lots & wafers/ }).click();
    await page.getByRole('table').getByRole('link').first().click();
    await page.getByRole('button', { name: 'Add a wafer' }).click();
    const number = `X${Date.now() % 100000}`;
    await page.getByLabel('Wafer number').fill(number);
    await page.getByRole('button', { name: 'Add', exact: true }).click();
    const wafers = page.getByRole('table', { name: 'Wafers of this lot' });
    await wafers.getByRole('link', { name: number }).click();
    await page.getByRole('heading', { name: new RegExp(`Wafer ${number}`) }).waitFor();
    await page.getByRole('button', { name: 'Delete wafer' }).click();
    await page.getByRole('alertdialog').getByRole('button', { name: 'Delete the wafer' }).click();
    await page.waitForURL(/\/lots\/\d+$/);
    await wafers.waitFor();
    await expect(wafers.getByRole('link', { name: number }).count()).resolves.toBe(0);

    // a demo wafer with sweeps: no delete button (the API would refuse it with 409)
    await page.getByRole('link', { name: /Lots & wafers/ }).click();
    await page.getByRole('link', { name: 'LV-26-B014' }).click();
    await wafers.getByRole('link', { name: 'W01' }).click();
    await page.getByRole('table', { name: 'Sweeps of this wafer' }).waitFor();
    await expect(page.getByRole('button', { name: 'Delete wafer' }).count()).resolves.toBe(0);
  });
});
