/**
 * On a 400 px wide screen every list page keeps its rows' actions on screen: the rows become
 * cards (shared/row-cards.ts), nothing scrolls sideways, and each page's row action is pressed
 * and does its job. The pages stay free of serious axe findings at that width.
 */
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
import type { Locator, Page } from 'playwright-core';

const WIDTH_PX = 400;

/** The control lies inside the screen's width, scrolled into view vertically only. */
async function expectOnScreen(page: Page, control: Locator, what: string): Promise<void> {
  await control.scrollIntoViewIfNeeded();
  const box = await control.boundingBox();
  expect(box, what).not.toBeNull();
  expect(box!.x, `${what}: left edge`).toBeGreaterThanOrEqual(0);
  expect(box!.x + box!.width, `${what}: right edge`).toBeLessThanOrEqual(WIDTH_PX);
  // no sideways scroll: not the page, not the frame of the control's table
  const overflow = await control.evaluate((control) =>
    [document.scrollingElement!, control.closest('.rt-table-wrap')]
      .filter((e): e is Element => e !== null && e.scrollWidth > e.clientWidth + 1)
      .map((e) => `${e.tagName}.${e.className}: ${e.scrollWidth} > ${e.clientWidth}`),
  );
  expect(overflow, `${what}: nothing scrolls sideways`).toEqual([]);
}

describe('list pages on a 400 px screen', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser(WIDTH_PX, 800);
  });
  afterAll(async () => {
    await browser.close();
  });

  it('keeps every row action reachable and working', async () => {
    const token = await apiToken('admin');
    const stations = await apiGet<{ items: { id: number; name: string }[] }>(
      token,
      '/api/stations?pageSize=100',
    );
    const station = stations.items[0]!;
    const label = `narrow-${Date.now()}`;
    const made = await fetch(`${BASE_URL}/api/stations/${station.id}/tokens`, {
      method: 'POST',
      headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
      body: JSON.stringify({ label }),
    });
    expect(made.status).toBe(201);

    const { page } = browser;
    await signIn(page, 'admin');

    // lots: the lot's link opens it
    await page.goto(`${BASE_URL}/lots`);
    const lotLink = page.getByRole('table', { name: 'Lots' }).getByRole('link', {
      name: 'LV-26-B014',
    });
    await expectOnScreen(page, lotLink, 'lot link');
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'narrow-lots');
    await lotLink.click();

    // wafers of a lot: the budget button opens the wafer's budget
    const wafers = page.getByRole('table', { name: 'Wafers of this lot' });
    const budget = wafers.getByRole('button', { name: 'Budget' }).first();
    await expectOnScreen(page, budget, 'wafer budget');
    await budget.click();
    await page.getByRole('heading', { name: /at 23 °C$/ }).waitFor();
    await wafers.getByRole('link', { name: 'W01' }).click();

    // sweeps of a wafer: the points CSV downloads
    const sweeps = page.getByRole('table', { name: 'Sweeps of this wafer' });
    const csv = sweeps.getByRole('button', { name: 'Points CSV' }).first();
    await expectOnScreen(page, csv, 'sweep points CSV');
    const download = page.waitForEvent('download');
    await csv.click();
    expect((await download).suggestedFilename()).toMatch(/\.csv$/);
    const study = sweeps.getByRole('link', { name: 'Study' }).first();
    await expectOnScreen(page, study, 'study');
    await screenshot(page, 'narrow-sweeps');

    // saved fits of the sweep (the demo keeps an Arrhenius fit): a fit is picked for comparing
    await study.click();
    const fits = page.getByRole('table', { name: 'Saved fits' });
    const compare = fits.getByRole('checkbox', { name: /^Compare fit / }).first();
    await expectOnScreen(page, compare, 'compare a saved fit');
    await expectOnScreen(
      page,
      fits.getByRole('button', { name: /^Delete fit / }).first(),
      'delete',
    );
    await compare.check();
    await expect.poll(() => compare.isChecked()).toBe(true);
    await screenshot(page, 'narrow-saved-fits');

    // worklist: a task's state is changed from its card
    await page.goto(`${BASE_URL}/worklist`);
    const state = page
      .getByRole('table', { name: 'Assignments' })
      .getByRole('combobox', { name: 'State' })
      .first();
    await expectOnScreen(page, state, 'assignment state');
    await state.click();
    await page.getByRole('listbox').waitFor();
    await page.keyboard.press('Escape');
    expect(await seriousViolations(page)).toEqual([]);

    // probe stations: Edit is on screen; Delete asks first, and the station is kept
    await page.goto(`${BASE_URL}/stations`);
    const edit = page.getByRole('button', { name: `Edit ${station.name}`, exact: true });
    await expectOnScreen(page, edit, 'station edit');
    const remove = page.getByRole('button', { name: `Delete ${station.name}`, exact: true });
    await expectOnScreen(page, remove, 'station delete');
    await remove.click();
    await page.getByRole('alertdialog').getByRole('button', { name: 'Keep it' }).click();
    await page.getByRole('alertdialog').waitFor({ state: 'detached' });

    // station tokens: Revoke asks first; keep the token
    await page.getByRole('combobox', { name: 'Station' }).click();
    await page.getByRole('option', { name: station.name, exact: true }).click();
    const revoke = page.getByRole('button', { name: `Revoke the token ${label}` });
    await expectOnScreen(page, revoke, 'token revoke');
    await revoke.click();
    await page.getByRole('alertdialog').getByRole('button', { name: 'Keep it' }).click();
    await screenshot(page, 'narrow-stations');

    // people: the active switch asks before deactivating; keep the account
    await page.goto(`${BASE_URL}/people`);
    const users = await apiGet<{ items: { email: string; name: string }[] }>(token, '/api/users');
    const person = users.items.find((u) => u.email === 'physicist@rhotrace.example')!;
    const active = page.getByRole('switch', { name: `Account of ${person.name} active` });
    await expectOnScreen(page, active, 'account switch');
    await expectOnScreen(
      page,
      page
        .getByRole('row')
        .filter({ hasText: person.email })
        .getByRole('combobox', { name: 'Role' }),
      'account role',
    );
    await active.click();
    await page.getByRole('button', { name: 'Keep the account' }).click();
    await expect.poll(() => active.isChecked()).toBe(true);
    expect(await seriousViolations(page)).toEqual([]);
  });
});
