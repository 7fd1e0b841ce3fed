import AxeBuilder from '@axe-core/playwright';
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { type BrowserContext, type Locator, type Page, chromium } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';

const base = process.env['E2E_BASE_URL'];
if (!base) {
  // Fail loudly: a browser suite that silently skips proves nothing.
  throw new Error(
    'E2E_BASE_URL is not set: start Rhotrace and point E2E_BASE_URL at it (npm test does).',
  );
}
/** The app under test, without a trailing slash. */
export const BASE_URL = base.replace(/\/$/, '');
/** Where the SMTP stand-in keeps received messages. */
export const MAIL_DIR = process.env['E2E_MAIL_DIR'] ?? '';

export const E2E_DIR = join(dirname(fileURLToPath(import.meta.url)), '..');
export const REPO_DIR = join(E2E_DIR, '..');
export const SCREENSHOT_DIR = join(E2E_DIR, 'screenshots');
export const DEMO_PASSWORD = 'rhotrace-demo';
export const ROLES = ['admin', 'manager', 'engineer', 'physicist', 'technician'] as const;
export type DemoRole = (typeof ROLES)[number];

/** A fresh Chromium profile (Debian's browser; never a downloaded one). */
export async function openBrowser(
  width = 1280,
  height = 900,
): Promise<{ context: BrowserContext; page: Page; close: () => Promise<void> }> {
  const profile = mkdtempSync(join(tmpdir(), 'rt-e2e-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium',
    headless: true,
    viewport: { width, height },
    acceptDownloads: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * A browser for the tests of one `describe`: opened before them, closed after them. Call it in
 * the `describe` body; the function it returns gives the page inside a test.
 */
export function browserForTests(width = 1280, height = 900): () => Page {
  let browser: Awaited<ReturnType<typeof openBrowser>> | undefined;
  beforeAll(async () => {
    browser = await openBrowser(width, height);
  });
  afterAll(async () => {
    await browser?.close();
  });
  return () => {
    if (!browser) throw new Error('the browser is opened in beforeAll: use the page in a test');
    return browser.page;
  };
}

/** Signs in through the form as a demo account and waits for the bench. */
export async function signIn(page: Page, role: DemoRole): Promise<void> {
  await signInAs(page, `${role}@rhotrace.example`, DEMO_PASSWORD);
}

/** Saves a full-page screenshot under e2e/screenshots/ (git-ignored). */
export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  await page.screenshot({ path: join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
}

/** Serious and critical axe violations on the page, as readable lines. */
export async function seriousViolations(page: Page): Promise<string[]> {
  const result = await new AxeBuilder({ page })
    .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'])
    .analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map(
      (v) =>
        `${v.id} (${v.impact}): ${v.help} — ${v.nodes
          .map((n) => n.target.join(' '))
          .slice(0, 3)
          .join(', ')}`,
    );
}

/** A bearer token for API set-up steps, through the same sign-in the app uses. */
export async function apiToken(role: DemoRole): Promise<string> {
  const res = await fetch(`${BASE_URL}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: `${role}@rhotrace.example`, password: DEMO_PASSWORD }),
  });
  if (!res.ok) throw new Error(`sign-in as ${role} failed: ${res.status}`);
  return ((await res.json()) as { token: string }).token;
}

/** GET an API path as a role, parsed as JSON. */
export async function apiGet<T>(token: string, path: string): Promise<T> {
  const res = await fetch(`${BASE_URL}${path}`, { headers: { authorization: `Bearer ${token}` } });
  if (!res.ok) throw new Error(`GET ${path} answered ${res.status}`);
  return (await res.json()) as T;
}

/** The items of a list answer, whether it is a page (`{ items }`) or a bare array. */
export async function apiItems<T>(token: string, path: string): Promise<T[]> {
  const body = await apiGet<{ items: T[] } | T[]>(token, path);
  return Array.isArray(body) ? body : body.items;
}

/**
 * Uploads a sweep file to a wafer with the given form fields (method, thickness, ...) and answers
 * the new sweep; the same file stored before (a 409 naming its sweep) answers that sweep's id.
 */
export async function uploadSweep(
  token: string,
  waferId: number,
  fields: Record<string, string>,
  file: string,
): Promise<{ id: number; pointCount?: number }> {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) form.append(name, value);
  form.append('file', new Blob([readFileSync(file)], { type: 'text/csv' }), basename(file));
  const res = await fetch(`${BASE_URL}/api/wafers/${waferId}/sweeps`, {
    method: 'POST',
    headers: { authorization: `Bearer ${token}` },
    body: form,
  });
  const body = (await res.json()) as {
    id?: number;
    pointCount?: number;
    error?: { details?: { sweepId?: number } };
  };
  if (res.status === 201 && body.id) return { id: body.id, pointCount: body.pointCount };
  const stored = body.error?.details?.sweepId;
  if (res.status === 409 && stored) return { id: stored };
  throw new Error(
    `the upload of ${basename(file)} answered ${res.status}: ${JSON.stringify(body)}`,
  );
}

/** Signs in as `role` and opens the study page of a sweep; answers when it was asked for. */
export async function openStudy(page: Page, role: DemoRole, sweepId: number): Promise<number> {
  await signIn(page, role);
  const started = Date.now();
  await page.goto(`${BASE_URL}/sweeps/${sweepId}`);
  return started;
}

/** Fills and sends the sign-in form with any account (one a test made, too). */
export async function submitSignIn(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Signs in with any account and waits for the bench. */
export async function signInAs(page: Page, email: string, password: string): Promise<void> {
  await submitSignIn(page, email, password);
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
}

/** Signs out through the bar and waits for the sign-in form. */
export async function signOut(page: Page): Promise<void> {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.getByRole('button', { name: 'Sign in' }).waitFor();
}

/** Clicks what saves a file and answers the file's suggested name and bytes. */
export async function downloadFrom(
  page: Page,
  trigger: Locator,
): Promise<{ name: string; bytes: Buffer }> {
  const [file] = await Promise.all([page.waitForEvent('download'), trigger.click()]);
  return { name: file.suggestedFilename(), bytes: readFileSync(await file.path()) };
}
