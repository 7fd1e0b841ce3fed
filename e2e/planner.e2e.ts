import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page as ApiPage, WaferDto } from '@rhotrace/api-types';
import { apiGet, apiToken, BASE_URL, openBrowser, screenshot, signIn } from './support/app';

describe('a planned sweep goes from the planner to the technician', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser(1280, 1000);
  });
  afterAll(async () => {
    await browser.close();
  });

  it('plans, exports the CSV, attaches the plan to an assignment and shows it', async () => {
    const { page } = browser;
    // Wafer 04 of the demo's boron lot (spec 8-12 ohm cm): its doping comes from ASTM F723.
    const token = await apiToken('manager');
    const wafers = await apiGet<ApiPage<WaferDto>>(token, '/api/wafers?q=04&pageSize=100');
    const wafer = wafers.items.find((w) => w.lotCode === 'LV-26-B014' && w.number.endsWith('04'))!;
    expect(wafer).toBeTruthy();

    await signIn(page, 'manager');
    await page.goto(`${BASE_URL}/wafers/${wafer.id}`);
    await page.getByText('Plan a sweep').click();
    const planForm = page.getByRole('form', { name: 'Plan a sweep' });
    await planForm.getByRole('combobox', { name: 'Station' }).click();
    await page.getByRole('option', { name: /Cryo bench North/ }).click();
    await planForm.getByLabel('Steps').fill('12');
    await planForm.getByRole('button', { name: 'Compute the plan' }).click();
    const steps = page.getByRole('table', { name: 'Planned steps' });
    await steps.waitFor();
    expect(await steps.getByRole('row').count()).toBe(13);
    await expect(
      page.getByRole('note', { name: 'Cautions for this plan' }).textContent(),
    ).resolves.toMatch(/Cryogens/);
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Export CSV for the station' }).click(),
    ]);
    const csv = readFileSync((await download.path())!, 'utf8')
      .trim()
      .split(/\r?\n/);
    expect(csv[0]).toBe(
      'step,temperature_K,current_A,expected_voltage_V,expected_power_W,' +
        'expected_resistivity_ohm_cm,expected_sheet_resistance_ohm_sq,regime,current_limited_by',
    );
    expect(csv).toHaveLength(13);
    await screenshot(page, 'planner-wafer');

    await page.getByRole('link', { name: /Worklist/ }).click();
    await page.getByRole('heading', { name: 'Worklist' }).waitFor();
    const waferField = page.getByRole('combobox', { name: 'Wafer' });
    await waferField.click();
    await waferField.fill('04');
    await page.getByRole('option', { name: /LV-26-B014 · .*04/ }).click();
    await page.getByRole('combobox', { name: 'Assignee' }).click();
    await page.getByRole('option', { name: /Tavi Moonbrook/ }).click();
    await page.getByLabel('Task').fill('Planned cryogenic sweep (planner browser test)');
    const due = new Date(Date.now() + 400 * 86_400_000).toISOString().slice(0, 10);
    await page.getByLabel('Due date').fill(due);
    await page.getByText('Attach a measurement plan').click();
    const attachForm = page.getByRole('form', { name: 'Plan a sweep' });
    await attachForm.getByRole('combobox', { name: 'Station' }).click();
    await page.getByRole('option', { name: /Cryo bench North/ }).click();
    await attachForm.getByLabel('Steps').fill('8');
    await attachForm.getByRole('button', { name: 'Compute the plan to attach' }).click();
    await page.getByText(/Plan ready: 8 steps/).waitFor();
    await page.getByRole('button', { name: 'Assign and e-mail' }).click();
    await page.getByText(/an e-mail is on its way/).waitFor({ timeout: 20_000 });

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.goto(`${BASE_URL}/sign-in`);
    await page.getByLabel('E-mail').fill('student@rhotrace.example');
    await page.getByLabel('Password').fill('rhotrace-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    const card = page
      .getByRole('list', { name: 'Assigned wafers' })
      .getByRole('listitem')
      .filter({ hasText: 'planner browser test' })
      .first();
    await card.getByText('Measurement plan: 8 steps').click();
    await card.getByText('Step table').click();
    await expect(
      card.getByRole('table', { name: 'Planned steps' }).getByRole('row').count(),
    ).resolves.toBe(9);
    await expect(
      card
        .getByText(/Probe current/)
        .first()
        .isVisible(),
    ).resolves.toBe(true);
    await screenshot(page, 'planner-technician');
  });
});
