import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAIL_DIR, openBrowser, screenshot, seriousViolations, signIn } from './support/app';

const emlFiles = (): string[] =>
  existsSync(MAIL_DIR) ? readdirSync(MAIL_DIR).filter((f) => f.endsWith('.eml')) : [];

describe('a manager assigns a wafer', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    if (!MAIL_DIR) throw new Error('E2E_MAIL_DIR is not set: the captured-mail folder is needed');
    browser = await openBrowser(1280, 1000);
  });
  afterAll(async () => {
    await browser.close();
  });

  it('assigns with a due date and the assignee is e-mailed', async () => {
    const { page } = browser;
    const before = new Set(emlFiles());
    await signIn(page, 'manager');
    await page.getByRole('link', { name: /Worklist/ }).click();
    await page.getByRole('heading', { name: 'Worklist' }).waitFor();
    await expect(page.getByRole('note', { name: 'Safety caution' }).isVisible()).resolves.toBe(
      true,
    );

    const wafer = page.getByRole('combobox', { name: 'Wafer' });
    await wafer.click();
    await wafer.fill('0');
    await page.getByRole('option').first().click();
    await page.getByRole('combobox', { name: 'Assignee' }).click();
    await page
      .getByRole('option', { name: /\(technician\)/ })
      .first()
      .click();
    await page.getByLabel('Task').fill('Temperature sweep, 77 K to 400 K (browser test)');
    const due = new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);
    await page.getByLabel('Due date').fill(due);
    await page.getByRole('button', { name: 'Assign and e-mail' }).click();
    await page.getByText(/an e-mail is on its way/).waitFor({ timeout: 20_000 });
    await page
      .getByRole('table', { name: 'Assignments' })
      .getByText('(browser test)')
      .first()
      .waitFor();

    let message = '';
    for (let i = 0; i < 60 && !message; i++) {
      for (const f of emlFiles()) {
        if (before.has(f)) continue;
        const text = readFileSync(join(MAIL_DIR, f), 'utf8');
        if (text.includes('browser test')) message = text;
      }
      if (!message) await new Promise((r) => setTimeout(r, 500));
    }
    expect(message).toMatch(/technician@rhotrace\.example/i);
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'worklist');

    await page.getByRole('link', { name: 'Change trail' }).click();
    await page.getByRole('table', { name: 'Change events' }).waitFor();
    await page.waitForLoadState('networkidle');
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'change-trail');
  });
});
