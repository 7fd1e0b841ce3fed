import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  REPO_DIR,
  apiGet,
  apiItems,
  apiToken,
  browserForTests,
  openStudy,
  screenshot,
  seriousViolations,
  uploadSweep,
} from './support/app';

const HALL_FILE = join(REPO_DIR, 'seed-data/sweeps/hall-reversals-si.csv');

interface Fit {
  id: number;
  kind: string;
  parameters: Record<string, number>;
  confidenceIntervals: Record<string, [number, number] | null>;
}

/** Uploads the demo Hall file to a silicon wafer (or finds it there from an earlier run). */
async function hallSweepId(): Promise<number> {
  const token = await apiToken('engineer');
  const wafers = await apiGet<{ items: Array<{ id: number }> }>(
    token,
    '/api/wafers?pageSize=200&material=Si',
  );
  const target = wafers.items[0];
  if (!target) throw new Error('the demo data holds no silicon wafer');
  const fields = { method: 'hall', thicknessCm: '0.05' };
  return (await uploadSweep(token, target.id, fields, HALL_FILE)).id;
}

describe('a physicist studies a Hall sweep', () => {
  const browserPage = browserForTests(1280, 1100);
  let sweepId: number;
  beforeAll(async () => {
    sweepId = await hallSweepId();
  });

  it('sees the three plots and the carrier type, fits and keeps both Hall fits', async () => {
    const page = browserPage();
    const started = await openStudy(page, 'physicist', sweepId);
    for (const name of [
      /Resistivity against temperature \(Hall sweep\)/,
      /Carrier density against 1000\/T/,
      /Hall mobility against temperature/,
    ]) {
      await page
        .getByRole('figure', { name })
        .locator('.nsewdrag')
        .first()
        .waitFor({ timeout: 60_000 });
    }
    const drawn = Date.now() - started;
    await expect(page.getByTestId('carrier-type').textContent()).resolves.toMatch(/n-type/);

    const density = page.getByRole('region', { name: /Carrier density fit/ });
    await density.getByRole('button', { name: 'Fit n(T)' }).click();
    await density
      .getByRole('article', { name: /Hall carrier density .*\(preview\)/ })
      .waitFor({ timeout: 60_000 });
    await density.getByRole('button', { name: 'Keep this fit' }).click();
    await density
      .getByRole('article', { name: /Hall carrier density .*\(fit \d+\)/ })
      .waitFor({ timeout: 30_000 });

    const mobility = page.getByRole('region', { name: /Hall mobility fit/ });
    await mobility.getByRole('button', { name: 'Fit µ_H(T)' }).click();
    await mobility
      .getByRole('article', { name: /Hall mobility .*\(preview\)/ })
      .waitFor({ timeout: 30_000 });
    await mobility.getByRole('button', { name: 'Keep this fit' }).click();
    await mobility
      .getByRole('article', { name: /Hall mobility .*\(fit \d+\)/ })
      .waitFor({ timeout: 30_000 });
    console.log(
      `[e2e] Hall study: plots drawn after ${drawn} ms, both fits kept after ${Date.now() - started} ms`,
    );

    const token = await apiToken('physicist');
    const fits = await apiItems<Fit>(token, `/api/sweeps/${sweepId}/fits`);
    const n = fits.filter((f) => f.kind === 'carrier-density').pop()!;
    const mu = fits.filter((f) => f.kind === 'hall-mobility').pop()!;
    // The demo file was computed from N_D = 1e15, N_A = 1e14, E_d = 45 meV and mu ~ T^-2.6
    // (apps/api/src/testing/hall-sweep-file.ts): the fits must find them with intervals.
    expect(Math.abs(n.parameters['donorDensity']! / 1e15 - 1)).toBeLessThan(0.05);
    expect(Math.abs(n.parameters['donorLevel']! - 0.045)).toBeLessThan(0.003);
    expect(n.confidenceIntervals['donorLevel']).not.toBeNull();
    expect(Math.abs(mu.parameters['exponent']! + 2.6)).toBeLessThan(0.05);
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'hall-study');
  });
});
