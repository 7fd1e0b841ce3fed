/**
 * A lab's first week, end to end as the roles would walk it: the admin opens an account for a
 * new technician; the manager registers a lot and its wafers, brings in a batch of mixed files
 * (each its own method and settings, one blocked until its station is given) and hands out two
 * measurements and chooses the sweep that counts; the technician measures one (the task and the
 * wafer follow the upload) and finds another wafer's address not available to them; the admin
 * deactivates the technician and hands the open task over in the same dialog; the manager
 * prints the lot report, which names every wafer with the value the lot page shows.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { LotDto, LotSummaryResponse, Page as ApiPage } from '@rhotrace/api-types';
import {
  BASE_URL,
  apiGet,
  apiToken,
  downloadFrom,
  openBrowser,
  signIn,
  signInAs,
  signOut,
  submitSignIn,
} from './support/app';
import { pdfTextLines } from './support/pdf-text';

/** A file for the chooser; the run line keeps reruns from being refused as duplicates. */
const csv = (name: string, lines: string[]) => ({
  name,
  mimeType: 'text/csv',
  buffer: Buffer.from(lines.join('\n')),
});

describe('the first week of a lab', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser(1280, 1000);
  });
  afterAll(async () => {
    await browser.close();
  });

  it('registers, uploads a batch, assigns, measures, hands over and prints the lot', async () => {
    const { page } = browser;
    const run = Date.now().toString(36).slice(-6).toUpperCase();
    const lotCode = `FW-${run}`;
    const newcomer = {
      name: `Rook Fairweather ${run}`,
      email: `rook-${run.toLowerCase()}@rhotrace.example`,
      password: `first-week-${run}`,
    };

    // Monday, the admin: an account for the new technician.
    await signIn(page, 'admin');
    await page.getByRole('link', { name: /People/ }).click();
    await page.getByRole('button', { name: 'Add a person' }).click();
    const account = page.getByRole('form', { name: 'New account' });
    await account.getByLabel('Name').fill(newcomer.name);
    await account.getByLabel('E-mail').fill(newcomer.email);
    await account.getByLabel('First password').fill(newcomer.password);
    await account.getByRole('button', { name: 'Create the account' }).click();
    await page.getByRole('table', { name: 'Accounts' }).getByText(newcomer.email).waitFor();
    await signOut(page);

    // The manager registers the lot (thickness left for the files' headers to give) and wafers.
    await signIn(page, 'manager');
    await page.getByRole('link', { name: /Lots & wafers/ }).click();
    await page.getByRole('link', { name: 'Register a lot' }).click();
    await page.getByLabel('Lot code').fill(lotCode);
    await page.getByRole('combobox', { name: 'Material' }).click();
    await page.getByRole('option', { name: 'Si', exact: true }).click();
    await page.getByLabel('Dopant (element)').fill('B');
    await page.getByLabel('Spec low at 23 °C').fill('8');
    await page.getByLabel('Spec high at 23 °C').fill('12');
    await page.getByRole('button', { name: 'Register' }).click();
    await page.getByRole('heading', { name: `Lot ${lotCode}` }).waitFor();
    const wafers = page.getByRole('table', { name: 'Wafers of this lot' });
    for (const number of ['W01', 'W02', 'W03']) {
      await page.getByRole('button', { name: 'Add a wafer' }).click();
      await page.getByLabel('Wafer number').fill(number);
      await page.getByRole('button', { name: 'Add', exact: true }).click();
      await wafers.getByRole('link', { name: number, exact: true }).waitFor();
    }

    // A batch of mixed files to W01: each its own method, one blocked until given its station.
    await wafers.getByRole('link', { name: 'W01', exact: true }).click();
    await page.getByRole('heading', { name: 'Bring in sweeps' }).waitFor();
    const w01Path = new URL(page.url()).pathname;
    const chooser = page.waitForEvent('filechooser');
    await page.getByText('Drop probe-station exports here, or click to choose').click();
    await (
      await chooser
    ).setFiles([
      csv('chuck-ramp.csv', [
        `Run: ${run}-a`,
        'Station: Hot chuck South',
        'Thickness: 525 um',
        'temperature_K,current_A,voltage_V',
        '290,1.0e-3,4.10e-2',
        '300,1.0e-3,4.25e-2',
        '310,1.0e-3,4.40e-2',
      ]),
      csv('square-sample.csv', [
        `Run: ${run}-b`,
        'Thickness: 525 um',
        'T (K),R_A (ohm),R_B (ohm)',
        '290,41.5,41.3',
        '300,43.0,42.8',
      ]),
      csv('bench-repeat.csv', [
        `Run: ${run}-c`,
        'Thickness: 525 um',
        'temperature_K,current_A,voltage_V',
        '292,1.0e-3,4.13e-2',
        '298,1.0e-3,4.22e-2',
      ]),
    ]);
    const chuck = page.getByRole('article', { name: 'File chuck-ramp.csv' });
    const square = page.getByRole('article', { name: 'File square-sample.csv' });
    const repeat = page.getByRole('article', { name: 'File bench-repeat.csv' });
    await chuck.getByText('Ready to store').waitFor();
    await square.getByText('Ready to store').waitFor();
    await repeat.getByText('Needs attention').waitFor();
    await repeat
      .getByRole('alert')
      .filter({ hasText: /no probe spacing/ })
      .waitFor();
    await expect(chuck.getByRole('combobox', { name: 'Method' }).textContent()).resolves.toMatch(
      /Four-point probe/,
    );
    await expect(square.getByRole('combobox', { name: 'Method' }).textContent()).resolves.toMatch(
      /Van der Pauw/,
    );
    // The blocked file does not count; given its station it is checked again and counts.
    await page.getByRole('button', { name: 'Store 2 files' }).waitFor();
    await repeat.getByRole('combobox', { name: 'Probe station' }).click();
    await page.getByRole('option', { name: 'Hot chuck South' }).click();
    await repeat.getByText('Ready to store').waitFor();
    await page.getByRole('button', { name: 'Store 3 files' }).click();
    await chuck.getByText('Stored: 3 points').waitFor({ timeout: 20_000 });
    await square.getByText('Stored: 2 points').waitFor({ timeout: 20_000 });
    await repeat.getByText('Stored: 2 points').waitFor({ timeout: 20_000 });
    // The newest counts for the 23 °C value until the manager chooses another (the batch's
    // files are stored side by side, so which one is newest is whichever committed last).
    const sweeps = page.getByRole('table', { name: 'Sweeps of this wafer' });
    // both stored files listed first: with one listed, "newest" would still move
    for (const stored of ['chuck-ramp.csv', 'bench-repeat.csv'])
      await sweeps.getByRole('row').filter({ hasText: stored }).waitFor();
    const newest = sweeps.getByRole('row').filter({ hasText: 'Counts (newest)' });
    await newest.waitFor();
    const chosenName = (await newest.textContent())!.includes('chuck-ramp.csv')
      ? 'bench-repeat.csv'
      : 'chuck-ramp.csv';
    await page.getByRole('button', { name: `Let ${chosenName} give the 23 °C value` }).click();
    await sweeps
      .getByRole('row')
      .filter({ hasText: chosenName })
      .filter({ hasText: 'Counts (chosen)' })
      .waitFor();

    // Two measurements for the newcomer: W02 this week, W03 next week.
    await page.getByRole('link', { name: /Worklist/ }).click();
    await page.getByRole('heading', { name: 'Worklist' }).waitFor();
    for (const [number, days] of [
      ['W02', 2],
      ['W03', 9],
    ] as const) {
      const wafer = page.getByRole('combobox', { name: 'Wafer' });
      await wafer.click();
      await wafer.fill(lotCode);
      await page.getByRole('option', { name: new RegExp(`${lotCode} · wafer ${number}`) }).click();
      await page.getByRole('combobox', { name: 'Assignee' }).click();
      await page.getByRole('option', { name: new RegExp(newcomer.name) }).click();
      await page.getByLabel('Task').fill(`Room-temperature sweep of ${number} (first week ${run})`);
      const due = new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
      await page.getByLabel('Due date').fill(due);
      await page.getByRole('button', { name: 'Assign and e-mail' }).click();
      // the answer first (a failure here means the request was refused), then the list
      await page.getByText(`Assigned to ${newcomer.name}`).first().waitFor({ timeout: 30_000 });
      await page
        .getByRole('table', { name: 'Assignments' })
        .getByText(`Room-temperature sweep of ${number} (first week ${run})`)
        .waitFor({ timeout: 30_000 });
    }
    await signOut(page);

    // The technician measures W02: the task moves on and the wafer becomes measured.
    await signInAs(page, newcomer.email, newcomer.password);
    const card = page
      .getByRole('list', { name: 'Assigned wafers' })
      .getByRole('listitem')
      .filter({ hasText: `Lot ${lotCode} · Wafer W02` });
    await card.getByRole('link', { name: 'Open and upload' }).click();
    await page.getByRole('heading', { name: 'Bring in sweeps' }).waitFor();
    await page
      .locator('input[type=file]')
      .setInputFiles(
        csv('w02-room.csv', [
          `Run: ${run}-d`,
          'Station: Hot chuck South',
          'Thickness: 525 um',
          'temperature_K,current_A,voltage_V',
          '291,1.0e-3,4.60e-2',
          '296,1.0e-3,4.70e-2',
          '301,1.0e-3,4.80e-2',
        ]),
      );
    const mine = page.getByRole('article', { name: 'File w02-room.csv' });
    await mine.getByText('Ready to store').waitFor();
    await page.getByRole('button', { name: 'Store 1 file' }).click();
    await mine.getByText('Stored: 3 points').waitFor({ timeout: 20_000 });
    const facts = page.locator('.rt-facts');
    await facts.filter({ hasText: /State\s*measured/ }).waitFor();
    const task = page
      .getByRole('listitem')
      .filter({ hasText: `Room-temperature sweep of W02 (first week ${run})` });
    await task.filter({ hasText: 'in progress' }).waitFor();
    await task.getByRole('button', { name: 'Mark done' }).click();
    await task.filter({ hasText: /\bdone\b/ }).waitFor();
    // a wafer not assigned to them, opened by its address: one plain page with a way back
    await page.goto(`${BASE_URL}${w01Path}`);
    await page.getByRole('heading', { name: 'Not available to you' }).waitFor();
    await signOut(page);

    // The newcomer leaves: the admin is asked, sees the open task and hands it over at once.
    await signIn(page, 'admin');
    await page.getByRole('link', { name: /People/ }).click();
    await page.getByRole('switch', { name: `Account of ${newcomer.name} active` }).click();
    const question = page.getByRole('dialog');
    await question.getByText('They have 1 open task:').waitFor();
    await expect(question.textContent()).resolves.toContain(
      `Wafer W03 of lot ${lotCode}: Room-temperature sweep of W03 (first week ${run})`,
    );
    await question.getByRole('combobox', { name: 'Hand the open tasks to' }).click();
    await page.getByRole('option', { name: /Tavi Moonbrook/ }).click();
    await question.getByRole('button', { name: `Deactivate ${newcomer.name}` }).click();
    await page
      .getByText(`${newcomer.name} is deactivated. 1 open task now with Tavi Moonbrook.`)
      .waitFor();
    await signOut(page);
    await submitSignIn(page, newcomer.email, newcomer.password);
    await page.getByRole('alert').filter({ hasText: 'This account is deactivated' }).waitFor();

    // Friday, the manager prints the lot: every wafer with the value the lot page shows.
    await signIn(page, 'manager');
    const token = await apiToken('manager');
    const lot = (await apiGet<ApiPage<LotDto>>(token, `/api/lots?q=${lotCode}`)).items[0]!;
    const summary = await apiGet<LotSummaryResponse>(token, `/api/lots/${lot.id}/summary`);
    await page.goto(`${BASE_URL}/lots/${lot.id}`);
    await wafers
      .getByRole('row')
      .filter({ hasText: /W02\s*measured/ })
      .waitFor();
    const report = await downloadFrom(page, page.getByRole('button', { name: 'Lot report (PDF)' }));
    expect(report.name).toBe(`lot-${lotCode}-report.pdf`);
    expect(report.bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const printed = pdfTextLines(report.bytes).join('\n');
    expect(printed).toContain(`Lot ${lotCode}`);
    const measured = summary.wafers.filter((w) => w.resistivityAt23COhmCm !== null);
    const w01Sweeps = await apiGet<Array<{ id: number; originalName: string }>>(
      token,
      `/api/wafers/${measured[0]!.waferId}/sweeps`,
    );
    const chosen = w01Sweeps.find((sw) => sw.originalName === chosenName)!;
    expect(measured[0]!.sweepId).toBe(chosen.id);
    expect(printed).toContain(`sweep ${chosen.id})`);
    expect(measured.map((w) => w.number)).toEqual(['W01', 'W02']);
    for (const w of measured)
      expect(printed).toContain(`${w.number}: ${w.resistivityAt23COhmCm!.toPrecision(4)} `);
    expect(printed).toMatch(/W03: no value at 23 °C/);
  });
});
