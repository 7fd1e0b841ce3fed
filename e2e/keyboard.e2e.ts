/**
 * A sweep brought in with the keyboard alone: skip links reach the upload and Store in a few
 * presses, one Enter does each thing (drop zone, Store, a confirmation), a plot's toolbar is one
 * Tab stop with arrow keys inside, and the focus ring contrasts at least 3:1 with the colours
 * beside it in both schemes (WCAG 2.2, 1.4.11 and 2.4.11/2.4.13).
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
import type { FileChooser, Page } from 'playwright-core';

/** What has the keyboard focus: tag, then label or text. */
const focused = (page: Page) =>
  page.evaluate(() => {
    const e = document.activeElement as HTMLElement;
    return `${e.tagName} ${(e.getAttribute('aria-label') ?? e.textContent ?? '').trim()}`;
  });

/** Presses Tab until the focus matches, and says how many presses it took (null: never). */
async function tabsUntil(page: Page, match: RegExp, limit = 60): Promise<number | null> {
  for (let presses = 1; presses <= limit; presses++) {
    await page.keyboard.press('Tab');
    if (match.test(await focused(page))) return presses;
  }
  return null;
}

/**
 * The focused element's ring against the colour behind it, from computed styles. Contrast ratio
 * and relative luminance as WCAG 2.2 defines them (W3C, "Web Content Accessibility Guidelines
 * 2.2", definitions of contrast ratio and relative luminance).
 */
const ringOfFocus = (page: Page) =>
  page.evaluate(() => {
    const rgb = (c: string) => (c.match(/[\d.]+/g) ?? []).map(Number);
    const lin = (v: number) => {
      const s = v / 255;
      return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
    };
    const luminance = ([r = 0, g = 0, b = 0]: number[]) =>
      0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(b);
    const e = document.activeElement as HTMLElement;
    const style = getComputedStyle(e);
    let behind = 'rgb(255, 255, 255)';
    // a ring drawn inside the element lies on the element's own background
    const inside = parseFloat(style.outlineOffset) < 0;
    for (let p = inside ? e : e.parentElement; p; p = p.parentElement) {
      const bg = rgb(getComputedStyle(p).backgroundColor);
      if (bg.length === 3 || (bg.length === 4 && bg[3]! >= 0.99)) {
        behind = getComputedStyle(p).backgroundColor;
        break;
      }
    }
    const [a, b] = [luminance(rgb(style.outlineColor)), luminance(rgb(behind))];
    return {
      style: style.outlineStyle,
      widthPx: parseFloat(style.outlineWidth),
      ratio: (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05),
      colours: `${style.outlineColor} on ${behind}`,
    };
  });

async function expectStrongRing(page: Page, what: string): Promise<void> {
  const ring = await ringOfFocus(page);
  expect(ring.style, what).toBe('solid');
  expect(ring.widthPx, what).toBeGreaterThanOrEqual(2);
  expect(ring.ratio, `${what}: ${ring.colours}`).toBeGreaterThanOrEqual(3);
}

describe('the upload with the keyboard alone', () => {
  let browser: Awaited<ReturnType<typeof openBrowser>>;
  beforeAll(async () => {
    browser = await openBrowser(1280, 900);
  });
  afterAll(async () => {
    await browser.close();
  });

  it('reaches the drop zone and Store in a few presses, one Enter each', async () => {
    const token = await apiToken('engineer');
    const lots = await apiGet<{ items: { id: number; code: string }[] }>(
      token,
      '/api/lots?q=LV-26-P021',
    );
    const lot = lots.items.find((l) => l.code === 'LV-26-P021')!;
    const wafers = await apiGet<{ items: { id: number; number: string }[] }>(
      token,
      `/api/lots/${lot.id}/wafers`,
    );
    const wafer = wafers.items.find((w) => w.number === 'W01')!;

    const { page } = browser;
    // listening from the start, so the browser hands every chooser to the test
    const choosers: FileChooser[] = [];
    page.on('filechooser', (chooser) => choosers.push(chooser));
    await signIn(page, 'engineer');
    await page.goto(`${BASE_URL}/wafers/${wafer.id}`);
    await page.getByRole('heading', { name: 'Bring in sweeps' }).waitFor();
    const toolbar = page.getByRole('toolbar').first();
    await toolbar
      .getByRole('button', { name: 'Save image' })
      .and(page.locator(':enabled'))
      .waitFor();

    // the plain walk, for the record
    const plainTabs = await tabsUntil(page, /^NGX-DROPZONE/);
    expect(plainTabs, 'the drop zone is in the Tab order').not.toBeNull();
    console.log(`[e2e] Tab presses from the top to the drop zone without skip links: ${plainTabs}`);

    // from the top: the skip link to the upload, Enter, and the drop zone is next
    await page.reload();
    await page.getByRole('heading', { name: 'Bring in sweeps' }).waitFor();
    const toSkip = await tabsUntil(page, /^A Skip to Bring in sweeps$/, 6);
    expect(toSkip, 'skip link to the upload').not.toBeNull();
    await page.keyboard.press('Enter');
    expect(await tabsUntil(page, /^NGX-DROPZONE/, 1), 'drop zone right after').toBe(1);
    console.log(`[e2e] Tab presses from the top to the drop zone: ${toSkip! + 1} and one Enter`);
    await expectStrongRing(page, 'drop zone, light');

    // one Enter opens the chooser
    const name = `keyboard-walk-${Date.now()}.csv`;
    await page.keyboard.press('Enter');
    await expect.poll(() => choosers.length, { timeout: 5_000 }).toBe(1);
    await choosers[0]!.setFiles({
      name,
      mimeType: 'text/csv',
      buffer: Buffer.from(
        [`Run: ${name}`, 'Station: Cryo bench North', 'T (K),R_A (ohm),R_B (ohm)']
          .concat(['290,12.1,11.9', '300,12.6,12.4', '310,13.1,12.9'])
          .join('\n'),
      ),
    });
    const file = page.getByRole('article', { name: `File ${name}` });
    await file.getByText('Ready to store').waitFor();

    // past the file's many checks to Store: one Tab to the skip link, Enter
    await page.locator('ngx-dropzone').focus();
    expect(await tabsUntil(page, /^A Skip the file checks to Store$/, 1)).toBe(1);
    await page.keyboard.press('Enter');
    expect(await focused(page)).toMatch(/^BUTTON Store 1 file$/);
    await expectStrongRing(page, 'Store, light');
    await screenshot(page, 'keyboard-store-focus');
    await page.keyboard.press('Enter');
    await file.getByText('Stored: 3 points').waitFor({ timeout: 20_000 });
    // Store, disabled now, kept the focus: the next key press is not lost on the page
    expect(await focused(page)).toMatch(/^BUTTON Store 0 files$/);

    // a plot's toolbar: one Tab stop, arrows inside, Tab leaves
    await toolbar
      .getByRole('button', { name: 'Save image' })
      .and(page.locator(':enabled'))
      .waitFor();
    const stops = await page.$$eval('[role=toolbar]', (bars) =>
      bars.map((bar) => bar.querySelectorAll('button:not([tabindex="-1"])').length),
    );
    expect(stops.length).toBeGreaterThan(0);
    expect(stops.every((n) => n === 1)).toBe(true);
    await toolbar.getByRole('button', { name: 'Save image' }).focus();
    await page.keyboard.press('ArrowRight');
    expect(await focused(page)).toMatch(/^BUTTON Reset axes/);
    await expectStrongRing(page, 'plot tool, light');
    await page.keyboard.press('Tab');
    expect(await toolbar.evaluate((bar) => bar.contains(document.activeElement))).toBe(false);
    await page.keyboard.press('Shift+Tab');
    expect(await focused(page)).toMatch(/^BUTTON Reset axes/);
    expect(await seriousViolations(page)).toEqual([]);

    // the dark scheme: the same ring still stands out
    await page.getByRole('button', { name: 'Use dark scheme' }).click();
    await page.locator('ngx-dropzone').focus();
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('Tab');
    await expectStrongRing(page, 'drop zone, dark');
    await toolbar.getByRole('button', { name: 'Reset axes' }).focus();
    await expectStrongRing(page, 'plot tool, dark');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link').first().focus();
    await expectStrongRing(page, 'navigation link, dark');
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole('button', { name: 'Use light scheme' }).click();

    // a confirmation with the keyboard: one Enter asks, Tab, one Enter confirms
    const row = page.getByRole('row').filter({ hasText: name });
    await row.getByRole('button', { name: 'Delete' }).focus();
    await page.keyboard.press('Enter');
    const dialog = page.getByRole('alertdialog');
    await dialog.waitFor();
    await expect.poll(() => focused(page)).toMatch(/^BUTTON Keep it/);
    await page.keyboard.press('Tab');
    await page.keyboard.press('Enter');
    await dialog.waitFor({ state: 'detached' });
    await row.waitFor({ state: 'detached' });
  });
});
