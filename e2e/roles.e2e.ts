import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  BASE_URL,
  type DemoRole,
  openBrowser,
  screenshot,
  seriousViolations,
  signIn,
} from './support/app';

/** The navigation each role should see, in order (each role sees only what it may use). */
const EXPECTED_NAV: Record<DemoRole, string[]> = {
  admin: [
    'Bench',
    'Lots & wafers',
    'Overlay',
    'Worklist',
    'Probe stations',
    'People',
    'Change trail',
  ],
  manager: ['Bench', 'Lots & wafers', 'Overlay', 'Worklist', 'Probe stations', 'Change trail'],
  engineer: ['Bench', 'Lots & wafers', 'Overlay', 'Probe stations'],
  physicist: ['Bench', 'Lots & wafers', 'Overlay', 'Probe stations'],
  technician: ['Bench'],
};

/** A screen each role must not reach, and must be sent home from. */
const FORBIDDEN: Record<DemoRole, string | null> = {
  admin: null,
  manager: '/people',
  engineer: '/worklist',
  physicist: '/trail',
  technician: '/lots',
};

describe('each role sees only what it may use', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser.close();
  });

  it('measures the initial JavaScript of the sign-in page', async () => {
    const { page } = browser;
    await page.goto(`${BASE_URL}/sign-in`);
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    const js = await page.evaluate(() =>
      performance
        .getEntriesByType('resource')
        .map((e) => e as PerformanceResourceTiming)
        .filter((e) => e.name.endsWith('.js'))
        .reduce(
          (sum, e) => ({
            transfer: sum.transfer + e.transferSize,
            decoded: sum.decoded + e.decodedBodySize,
          }),
          { transfer: 0, decoded: 0 },
        ),
    );
    console.log(
      `[e2e] initial JS on sign-in: ${(js.transfer / 1024).toFixed(1)} kB transferred, ${(js.decoded / 1024).toFixed(1)} kB decoded`,
    );
    expect(js.decoded).toBeGreaterThan(0);
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'sign-in');
  });

  for (const role of Object.keys(EXPECTED_NAV) as DemoRole[]) {
    it(`${role}: navigation, bench and a refused screen`, async () => {
      const { page, context } = browser;
      await context.clearCookies();
      await page.goto(`${BASE_URL}/sign-in`);
      await page.evaluate(() => sessionStorage.clear());
      await signIn(page, role);
      const nav = page.getByRole('navigation', { name: 'Main' });
      const labels = await nav.locator('[matListItemTitle]').allTextContents();
      expect(labels.map((l) => l.trim())).toEqual(EXPECTED_NAV[role]);
      await page.getByRole('heading', { level: 1 }).waitFor();
      await page.waitForLoadState('networkidle');
      expect(await seriousViolations(page)).toEqual([]);
      await screenshot(page, `bench-${role}`);

      const forbidden = FORBIDDEN[role];
      if (forbidden) {
        // A page the role may not use says so plainly, with a way back (not a silent bench).
        await page.goto(`${BASE_URL}${forbidden}`);
        await page.waitForURL((url) => url.pathname === '/not-available');
        await page.getByRole('heading', { name: 'Not available to you' }).waitFor();
      }
    });
  }

  it('a page opened without a session returns there after sign-in', async () => {
    const { page } = browser;
    await page.goto(`${BASE_URL}/sign-in`);
    await page.evaluate(() => sessionStorage.clear());
    await page.goto(`${BASE_URL}/stations`);
    await page.waitForURL(/\/sign-in\?next=/);
    await page.getByLabel('E-mail').fill('engineer@rhotrace.example');
    await page.getByLabel('Password').fill('rhotrace-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/stations');
    await page.getByRole('heading', { name: 'Probe stations' }).waitFor();
    await page.waitForLoadState('networkidle');
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'stations');
  });
});
