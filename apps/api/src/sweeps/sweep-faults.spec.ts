import type { SweepDto } from '@rhotrace/api-types';
import { BOLTZMANN_EV_PER_K, seededNormal, seededRandom } from '@rhotrace/physics';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';
import { makeWafer } from './sweep-test-helpers';

// Invented files, one fault each, uploaded end to end; the thresholds are those of issue 15
// (Hampel window 7 / 4 scaled MAD, 2 % polarity asymmetry, 3 x scatter for self-heating).

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

async function store(text: string, name: string, method = 'four-point'): Promise<SweepDto> {
  const wafer = await makeWafer({ thicknessCm: 0.05 });
  const res = await request(ctx.app)
    .post(`/api/wafers/${wafer.id}/sweeps`)
    .set(ctx.auth('engineer'))
    .field('method', method)
    .field('spacingCm', '0.1')
    .attach('file', Buffer.from(text), name);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return (await request(ctx.app).get(`/api/sweeps/${res.body.id}`).set(ctx.auth('engineer')))
    .body as SweepDto;
}

const flagged = (s: SweepDto, flag: string) =>
  s.points.filter((p) => p.flags.includes(flag as never)).map((p) => p.sequence);

describe('faults found by the import', () => {
  it('splits an up-and-down ramp into two legs with no reversal on the return', async () => {
    const normal = seededNormal(seededRandom(11));
    const temps = [...Array.from({ length: 21 }, (_, i) => 300 + 5 * i)];
    temps.push(...temps.slice(0, -1).reverse());
    const rows = temps.map(
      (t) => `${(t + 0.05 * normal()).toFixed(2)},1,${(10 * (1 + 0.002 * (t - 300))).toFixed(4)}`,
    );
    const sweep = await store(`T (K),I (mA),V (mV)\n${rows.join('\n')}\n`, 'ramp.csv');
    expect(sweep.points.filter((p) => p.leg === 1)).toHaveLength(21);
    expect(sweep.points.filter((p) => p.leg === 2)).toHaveLength(20);
    expect(sweep.points.every((p) => p.flags.length === 0)).toBe(true);
  });

  it('flags a spike as an outlier and leaves it out of the Arrhenius fit', async () => {
    const normal = seededNormal(seededRandom(12));
    const rows = Array.from({ length: 30 }, (_, i) => {
      const t = 300 + 10 * i;
      const spike = i === 14 ? 1.3 : 1;
      const v = 10 * Math.exp(0.3 / (BOLTZMANN_EV_PER_K * t) - 0.3 / (BOLTZMANN_EV_PER_K * 300));
      return `${t},1,${(v * spike * (1 + 0.002 * normal())).toPrecision(6)}`;
    });
    const sweep = await store(`T (K),I (mA),V (mV)\n${rows.join('\n')}\n`, 'spike.csv');
    expect(flagged(sweep, 'outlier')).toEqual([15]);
    expect(sweep.parseReport.findings).toEqual([
      expect.objectContaining({
        sequence: 15,
        flag: 'outlier',
        reason: expect.stringMatching(/\(\+(2[5-9]|3[0-5])\.\d %\)/),
      }),
    ]);
    const fit = await request(ctx.app)
      .post(`/api/sweeps/${sweep.id}/fits`)
      .set(ctx.auth('engineer'))
      .send({ kind: 'arrhenius', minK: 300, maxK: 590, regime: 'intrinsic' });
    expect(fit.status, JSON.stringify(fit.body)).toBe(201);
    expect(fit.body.excludedSequences).toEqual([15]);
    const analysis = await request(ctx.app)
      .get(`/api/sweeps/${sweep.id}/analysis`)
      .set(ctx.auth('engineer'));
    // the study plots draw the flagged reading where it was measured
    expect(analysis.body.flaggedReadings).toEqual([
      { sequence: 15, temperatureK: 440, resistivityOhmCm: sweep.points[14]!.resistivityOhmCm },
    ]);
  });

  it('flags forward and reverse readings 5 % apart', async () => {
    const rows = [300, 310, 320, 330, 340, 350].flatMap((t) => [
      `${t},+,1,${t === 320 ? 10.25 : 10.01}`,
      `${t},-,1,${t === 320 ? -9.75 : -9.99}`,
    ]);
    const sweep = await store(`T (K),Polarity,I (mA),V (mV)\n${rows.join('\n')}\n`, 'pol.csv');
    expect(flagged(sweep, 'polarity-asymmetry')).toEqual([3]);
    expect(sweep.parseReport.findings![0]!.reason).toMatch(/differ by 5\.0 %/);
  });

  it('flags the higher of two currents reading 1 % high at alpha = 0.4 %/K, dT about 2.5 K', async () => {
    // rho = rho0 exp(alpha (T - 300)) has alpha = d ln rho / dT = 0.004 /K everywhere;
    // dT = (1.01 - 1) / 0.004 = 2.5 K (issue 15).
    const normal = seededNormal(seededRandom(13));
    const rows = Array.from({ length: 8 }, (_, k) => 290 + 10 * k).flatMap((t) => {
      const r = 10 * Math.exp(0.004 * (t - 300));
      const v = (ma: number, high: number) =>
        (r * ma * high * (1 + 0.0003 * normal())).toPrecision(7);
      return [`${t},1,${v(1, 1)}`, `${t},10,${v(10, 1.01)}`];
    });
    const sweep = await store(`T (K),I (mA),V (mV)\n${rows.join('\n')}\n`, 'heat.csv');
    expect(flagged(sweep, 'self-heating')).toEqual([2, 4, 6, 8, 10, 12, 14, 16]);
    const reasons = sweep.parseReport.findings!.filter((f) => f.flag === 'self-heating');
    for (const f of reasons) {
      const dT = Number(/about (\d+\.\d) K/.exec(f.reason)![1]);
      expect(Math.abs(dT - 2.5)).toBeLessThanOrEqual(0.2);
    }
    expect(sweep.points.some((p) => p.flags.includes('outlier'))).toBe(false);
  });

  it('flags the readings of a step still drifting one way (a dwell too short)', async () => {
    // Invented: five readings per step; at 330 K they settle +0.5 % (a drift 12 times the 0.04 %
    // scatter of the other steps), above the 3 x scatter the issue asks for.
    const normal = seededNormal(seededRandom(14));
    const settle = [0, 0.0025, 0.004, 0.0047, 0.005];
    const rows = [300, 310, 320, 330, 340, 350].flatMap((t) =>
      settle.map((d, k) => {
        const drift = t === 330 ? d : 0.0004 * normal();
        return `${(t + 0.02 * k).toFixed(2)},1,${(10 * (1 + 0.001 * (t - 300)) * (1 + drift)).toPrecision(7)}`;
      }),
    );
    const sweep = await store(`T (K),I (mA),V (mV)\n${rows.join('\n')}\n`, 'dwell.csv');
    expect(flagged(sweep, 'unsettled')).toEqual([16, 17, 18, 19, 20]);
    expect(sweep.points.filter((p) => p.flags.length > 0)).toHaveLength(5);
    const reason = sweep.parseReport.findings!.find((f) => f.flag === 'unsettled')!.reason;
    expect(reason).toMatch(/5 readings at 330\.0 K drift by \+0\.[45]\d* % one way/);
  });

  it('flags van der Pauw reciprocal readings more than 2 % apart as a contact fault', async () => {
    // Van der Pauw 1958: R_AB,CD = R_CD,AB by reciprocity; ASTM F76 compares the two readings
    // (the 2 % limit is common practice, no source). Point 3's R_A pair is 3 % apart (3/101.5 =
    // 2.96 %), point 5's R_B pair 1.5 % (kept), the rest 0.2 %.
    const rows = [300, 310, 320, 330, 340, 350].map((t, i) => {
      const ra = 100 + t / 100;
      const raRec = i === 2 ? ra * 1.03 : ra * 1.002;
      const rbRec = i === 4 ? 80 * 1.015 : 80 * 0.998;
      return `${t},${ra.toFixed(4)},${raRec.toFixed(4)},80,${rbRec.toFixed(4)}`;
    });
    const header = 'T (K),R_AB_CD (ohm),R_CD_AB (ohm),R_BC_DA (ohm),R_DA_BC (ohm)';
    const sweep = await store(`${header}\n${rows.join('\n')}\n`, 'vdp.csv', 'van-der-pauw');
    expect(flagged(sweep, 'contact-fault')).toEqual([3]);
    const finding = sweep.parseReport.findings!.find((f) => f.flag === 'contact-fault')!;
    expect(finding.reason).toMatch(/R_AB,CD and R_CD,AB differ by 3\.0 %.*reciprocity/);
    expect(sweep.parseReport.warnings.join(' ')).toMatch(/1 point\(s\) have reciprocal/);
    // each configuration is the mean of its reciprocal pair (ASTM F76 averages its readings)
    const first = sweep.points[0]!;
    expect(first.resistanceOhm).toBeCloseTo((103 + 103 * 1.002) / 2, 3);
    const analysis = await request(ctx.app)
      .get(`/api/sweeps/${sweep.id}/analysis`)
      .set(ctx.auth('engineer'));
    expect(analysis.body.flaggedPoints).toBe(1);
  });

  it('warns, in the preview and the stored sweep, when R_A/R_B exceeds 3', async () => {
    // Van der Pauw 1958: the solution grows sensitive as R_A/R_B departs from 1 (f about 0.7 at
    // 10); the warning above 3 is common practice, no source.
    const rows = [300, 310, 320, 330, 340].map((t) => `${t},${(40 + t / 100).toFixed(3)},10`);
    const file = `T (K),R_A (ohm),R_B (ohm)\n${rows.join('\n')}\n`;
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const preview = await request(ctx.app)
      .post(`/api/wafers/${wafer.id}/sweeps/preview`)
      .set(ctx.auth('engineer'))
      .field('method', 'van-der-pauw')
      .attach('file', Buffer.from(file), 'ratio.csv');
    expect(preview.status, JSON.stringify(preview.body)).toBe(200);
    const warning = /R_A\/R_B reaches 4\.\d+ \(above 3\) at 5 point\(s\)/;
    expect(preview.body.warnings.join(' ')).toMatch(warning);
    const sweep = await store(file, 'ratio.csv', 'van-der-pauw');
    expect(sweep.parseReport.warnings.join(' ')).toMatch(warning);
    const analysis = await request(ctx.app)
      .get(`/api/sweeps/${sweep.id}/analysis`)
      .set(ctx.auth('engineer'));
    expect(analysis.body.importWarnings.join(' ')).toMatch(warning);
  });
});
