import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';
import { makeLot, makeSweep, range, synthesize } from '../analysis/testing/fixtures';
import { lotReportData } from './lot-report.service';
import { statisticsLines, waferLines } from './lot-report-pdf';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx.close());

describe('GET /api/lots/:id/report.pdf', () => {
  it('prints every wafer with its 23 °C value, U and verdict, the statistics and the fits', async () => {
    const { lot, wafers } = await makeLot({ specMinOhmCm: 8, specMaxOhmCm: 13 }, [
      'LR-01',
      'LR-02',
      'LR-03',
    ]);
    const around23C = range(291, 301, 11);
    await makeSweep(
      wafers[0]!.id,
      ctx.users.engineer.id,
      synthesize(around23C, (t) => 10 * (1 + 0.004 * (t - 296.15)), { noise: 0.002 }),
    );
    const second = await makeSweep(
      wafers[1]!.id,
      ctx.users.engineer.id,
      synthesize(around23C, (t) => 20 * (1 + 0.004 * (t - 296.15)), { noise: 0.002, seed: 2 }),
    );
    const fit = await request(ctx.app)
      .post(`/api/sweeps/${second.id}/fits`)
      .set(ctx.auth('engineer'))
      .send({ kind: 'tcr' });
    expect(fit.status).toBe(201);

    const res = await request(ctx.app)
      .get(`/api/lots/${lot.id}/report.pdf`)
      .set(ctx.auth('manager'))
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/pdf/);
    const pdf = (res.body as Buffer).toString('latin1');
    expect(pdf.startsWith('%PDF')).toBe(true);
    expect(pdf).toContain(`(Rhotrace lot report: lot ${lot.code})`);

    // What the PDF prints, line by line (the glyphs in the file are font subsets, not text).
    const m = ctx.users.manager;
    const data = await lotReportData(
      { id: m.id, email: m.email, name: m.name, role: m.role },
      lot.id,
    );
    const lines = waferLines(data.summary);
    expect(lines[0]).toMatch(
      /^LR-01: (9\.9\d+|10\.0\d) ± 0\.0\d+ Ω·cm \(k = 2, interpolated, sweep \d+\), meets spec$/,
    );
    expect(lines[1]).toMatch(/^LR-02: (19\.9\d|20\.0\d) ± 0\.\d+ Ω·cm .*misses spec$/);
    expect(lines[2]).toMatch(/^LR-03: no value at 23 °C \([a-z]/);
    const stats = statisticsLines(data.summary).join('\n');
    // Hand computation of the printed spread from the two wafers' values a and b:
    // mean (a + b) / 2, sample standard deviation |a - b| / sqrt(2).
    const [a, b] = data.summary.wafers.slice(0, 2).map((w) => w.resistivityAt23COhmCm!);
    expect(stats).toContain(
      `2 of 3 wafers with a value at 23 °C: mean ${((a! + b!) / 2).toPrecision(4)} Ω·cm, ` +
        `sample standard deviation ${(Math.abs(a! - b!) / Math.SQRT2).toPrecision(3)} Ω·cm`,
    );
    expect(stats).toContain('1 meet spec, 1 miss it, 0 too close to call');
    expect(data.fits).toHaveLength(1);
    expect(data.fits[0]!.waferNumber).toBe('LR-02');
    expect(data.fits[0]!.fits[0]!.kind).toBe('tcr');
  });

  it('is a 404 for a lot the reader cannot see, and a 400 for a bad id', async () => {
    const { lot } = await makeLot({}, ['LR-X1']);
    const hidden = await request(ctx.app)
      .get(`/api/lots/${lot.id}/report.pdf`)
      .set(ctx.auth('technician'));
    expect(hidden.status).toBe(404);
    const bad = await request(ctx.app).get('/api/lots/abc/report.pdf').set(ctx.auth('manager'));
    expect(bad.status).toBe(400);
  });
});
