import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';
import { CPK_REASON, lotCapability } from './lot-summary.service';
import { makeLot, makeSweep, range, synthesize } from './testing/fixtures';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx.close());

const flat = (v: number) => () => v;
const around23C = range(291, 301, 11);

describe('GET /api/lots/:id/summary', () => {
  it('gives per-wafer rho at 23 °C, verdicts, statistics, and no Cpk below 5 wafers', async () => {
    const { lot, wafers } = await makeLot({ specMinOhmCm: 8, specMaxOhmCm: 13 }, [
      'W01',
      'W02',
      'W03',
      'W04',
      'W05',
    ]);
    const values = [9, 10, 11, 10];
    for (let i = 0; i < 4; i += 1) {
      await makeSweep(
        wafers[i]!.id,
        ctx.users.engineer.id,
        synthesize(around23C, flat(values[i]!)),
      );
    }
    // W05 has no sweep: listed without a value and left out of the statistics. W02's second
    // sweep (350-650 K) does not reach 23 °C, so its first sweep gives the value.
    const fit = await request(ctx.app)
      .post(
        `/api/sweeps/${
          (
            await makeSweep(
              wafers[1]!.id,
              ctx.users.engineer.id,
              synthesize(range(350, 650, 31), (t) => Math.exp(3000 / t)),
            )
          ).id
        }/fits`,
      )
      .set(ctx.auth('engineer'))
      .send({ kind: 'arrhenius', minK: 350, maxK: 650, regime: 'intrinsic' });
    expect(fit.status).toBe(201);

    const res = await request(ctx.app).get(`/api/lots/${lot.id}/summary`).set(ctx.auth('manager'));
    expect(res.status).toBe(200);
    const s = res.body.statistics;
    // Hand computation: values 9, 10, 11, 10 ohm cm; mean = 40/4 = 10;
    // sample variance = ((-1)^2 + 0 + 1^2 + 0) / (4 - 1) = 2/3, s = sqrt(2/3) = 0.816497.
    // Four wafers: no Ppk (at least 5), and Cpk is never computed (no within-wafer spread).
    expect(s.count).toBe(4);
    expect(s.meanOhmCm).toBeCloseTo(10, 9);
    expect(s.stdDevOhmCm).toBeCloseTo(Math.sqrt(2 / 3), 9);
    expect(s.minOhmCm).toBeCloseTo(9, 9);
    expect(s.maxOhmCm).toBeCloseTo(11, 9);
    expect(s.cpk).toBeNull();
    expect(s.cpkReason).toBe(CPK_REASON);
    expect(s.ppk).toBeNull();
    expect(s.ppkReason).toMatch(/at least 5 wafers/);
    expect(s.passCount).toBe(4);
    expect(s.indeterminateCount).toBe(0);
    const w05 = res.body.wafers.find((w: { number: string }) => w.number === 'W05');
    expect(w05.resistivityAt23COhmCm).toBeNull();
    expect(w05.pass).toBeNull();
    const w02 = res.body.wafers.find((w: { number: string }) => w.number === 'W02');
    expect(w02.activationEnergies).toHaveLength(1);
    // ln rho = 3000/T: Ea = 3000 K * k = 0.2585 eV
    expect(w02.activationEnergies[0].activationEnergyEv).toBeCloseTo(3000 * 8.617333262e-5, 6);
  });

  it('counts verdicts and gives Ppk with its Bissell bound from 5 wafers (hand computation)', () => {
    // Values 9.8, 10.1, 10.0, 9.9, 10.2: mean 10.0, s = sqrt(0.1/4) = 0.158114;
    // Ppk = min(11 - 10, 10 - 9) / (3 s) = 2.10819 (one-sided 95 % bound by Bissell 1990:
    // 2.10819 - 1.645 sqrt(1/45 + 2.10819^2/8) = 0.85790, hand computation).
    const rows = [9.8, 10.1, 10.0, 9.9, 10.2].map((v, i) => ({
      resistivityAt23COhmCm: v,
      verdict: i === 0 ? ('indeterminate' as const) : ('pass' as const),
    }));
    const c = lotCapability([...rows, { resistivityAt23COhmCm: null, verdict: null }], 9, 11);
    expect(c.ppk).toBeCloseTo(2.10819, 5);
    expect(c.ppkLower95).toBeCloseTo(0.8579, 4);
    expect(c.ppkReason).toBeNull();
    expect(c.note).toMatch(/Only 5 wafers with a value at 23 °C \(fewer than 25\)/);
    expect(c.indeterminateCount).toBe(1);
    expect(lotCapability(rows.slice(0, 4), 9, 11).ppkReason).toMatch(/at least 5 wafers/);
  });

  it('neutralises formula-like text cells in the CSV export', async () => {
    const { lot, wafers } = await makeLot({ specMinOhmCm: 1, specMaxOhmCm: 100 }, [
      '=1+2',
      '@SUM(A1)',
      '-cmd',
      '+x',
      'W09',
    ]);
    for (const w of wafers)
      await makeSweep(w.id, ctx.users.admin.id, synthesize(around23C, flat(20)));
    const res = await request(ctx.app)
      .get(`/api/lots/${lot.id}/summary.csv`)
      .set(ctx.auth('admin'));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const rows = res.text
      .trim()
      .split('\r\n')
      .map((r) => r.split(','));
    expect(rows[0]![0]).toBe('lot');
    const names = rows.slice(1, 6).map((r) => r[1]);
    expect(names).toEqual(expect.arrayContaining(["'=1+2", "'@SUM(A1)", "'-cmd", "'+x", 'W09']));
    // numbers stay numbers (a value like -1.5 would not be touched)
    expect(Number(rows[1]![3])).toBeCloseTo(20, 9);
  });
});

describe('GET /api/compare', () => {
  it('puts sweeps of different lots on one grid, null outside each range', async () => {
    const a = await makeLot();
    const b = await makeLot({ material: 'Ge', dopant: 'Ga', dopantType: 'p' });
    const s1 = await makeSweep(
      a.wafers[0]!.id,
      ctx.users.admin.id,
      synthesize(range(100, 300, 21), (t) => t / 100),
    );
    const s2 = await makeSweep(
      b.wafers[0]!.id,
      ctx.users.admin.id,
      synthesize(range(200, 400, 21), flat(3)),
    );
    const res = await request(ctx.app)
      .get(`/api/compare?sweeps=${s1.id},${s2.id}&points=31`)
      .set(ctx.auth('physicist'));
    expect(res.status).toBe(200);
    expect(res.body.temperaturesK).toHaveLength(31);
    expect(res.body.temperaturesK[0]).toBe(100);
    expect(res.body.temperaturesK[30]).toBe(400);
    const [c1, c2] = res.body.curves;
    expect(c1.lotCode).toBe(a.lot.code);
    expect(c2.material).toBe('Ge');
    // grid 100, 110, ... 400: index 10 = 200 K is a step of sweep 1 (rho = 2) and the start of sweep 2
    expect(c1.resistivityOhmCm[10]).toBeCloseTo(2, 9);
    expect(c1.resistivityOhmCm[25]).toBeNull();
    expect(c2.resistivityOhmCm[0]).toBeNull();
    expect(c2.resistivityOhmCm[20]).toBeCloseTo(3, 9);
    // log-linear between 200 K (2) and 210 K (2.1) at 205 K: sqrt(2 * 2.1)
    const fine = await request(ctx.app)
      .get(`/api/compare?sweeps=${s1.id}&points=401`)
      .set(ctx.auth('physicist'));
    expect(fine.body.temperaturesK[210]).toBeCloseTo(205, 9);
    expect(fine.body.curves[0].resistivityOhmCm[210]).toBeCloseTo(Math.sqrt(2 * 2.1), 9);
  });

  it('refuses bad lists and more than 20 sweeps', async () => {
    const many = Array.from({ length: 21 }, (_, i) => i + 1).join(',');
    for (const q of ['', 'sweeps=', 'sweeps=1,abc', 'sweeps=0', `sweeps=${many}`]) {
      const res = await request(ctx.app).get(`/api/compare?${q}`).set(ctx.auth('admin'));
      expect(res.status).toBe(400);
      expect(res.body.error.details[0].field).toBe('query.sweeps');
    }
    expect(
      (await request(ctx.app).get('/api/compare?sweeps=987654').set(ctx.auth('admin'))).status,
    ).toBe(404);
  });
});

describe('GET /api/sweeps/:id/report', () => {
  it('is a PDF naming the wafer in its document info', async () => {
    const { wafers } = await makeLot({ specMinOhmCm: 1, specMaxOhmCm: 10 }, ['WR-77']);
    const sweep = await makeSweep(
      wafers[0]!.id,
      ctx.users.engineer.id,
      synthesize(range(250, 400, 31), (t) => t / 50, { noise: 0.01 }),
    );
    await request(ctx.app)
      .post(`/api/sweeps/${sweep.id}/fits`)
      .set(ctx.auth('engineer'))
      .send({ kind: 'tcr' });
    const res = await request(ctx.app)
      .get(`/api/sweeps/${sweep.id}/report`)
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
    expect(pdf).toContain(`(Rhotrace sweep report: wafer WR-77`);
    expect(pdf).toContain('/FontFile2'); // the embedded IBM Plex Sans TTF
  });
});
