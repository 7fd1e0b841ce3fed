/**
 * Units and dates as a lab reads them in the printed report, the fits CSV and the e-mails:
 * a TCR in ppm/K beside 1/K, days as YYYY-MM-DD, instants to the minute in UTC.
 */
import type { FitDto } from '@rhotrace/api-types';
import { parse } from 'csv-parse/sync';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeLot, makeSweep, range, synthesize } from '../analysis/testing/fixtures';
import { assignmentMail } from '../mail/templates/assignment.mail';
import { overdueMail } from '../mail/templates/overdue.mail';
import { createTestContext, type TestContext } from '../testing/test-context';
import { fitLines, storedLine } from './report-pdf';

let ctx: TestContext;
let fit: FitDto;
let sweepId: number;
beforeAll(async () => {
  ctx = await createTestContext();
  const { wafers } = await makeLot({}, ['TCR-01']);
  // A film rising 0.4 % per kelvin about 293.15 K: alpha = 0.004 1/K, i.e. 4000 ppm/K.
  const sweep = await makeSweep(
    wafers[0]!.id,
    ctx.users.engineer.id,
    synthesize(range(280, 330, 11), (t) => 2e-6 * (1 + 0.004 * (t - 293.15)), { noise: 0.0005 }),
  );
  sweepId = sweep.id;
  const res = await request(ctx.app)
    .post(`/api/sweeps/${sweepId}/fits`)
    .set(ctx.auth('engineer'))
    .send({ kind: 'tcr' });
  expect(res.status).toBe(201);
  fit = res.body as FitDto;
});
afterAll(async () => ctx.close());

// 1 ppm/K = 10⁻⁶ 1/K (parts per million, SI Brochure 9th ed. 2019, section 5.4.7).
const PPM = 1e6;

describe('a temperature coefficient in ppm/K beside 1/K', () => {
  it('is printed in both units in the report, the standard error too', () => {
    const alpha = fit.parameters['alphaPerK']!;
    const se = fit.standardErrors['alphaPerK']!;
    expect(alpha).toBeCloseTo(0.004, 4);
    const line = fitLines(fit).find((l) => l.includes('Temperature coefficient (1/K)'))!;
    const m = /= ([\d.]+) ± .+ \(([\d.]+) ± ([\d.]+) ppm\/K\)/.exec(line);
    expect(m, line).not.toBeNull();
    expect(Number(m![1])).toBeCloseTo(alpha, 6);
    expect(Number(m![2])).toBeCloseTo(alpha * PPM, 0);
    expect(Number(m![3])).toBeCloseTo(Number((se * PPM).toPrecision(2)), 6);
    // Only the TCR has a second unit.
    const rho = fitLines(fit).find((l) => l.includes('ρ at reference'))!;
    expect(rho).not.toContain('ppm');
    // The fit's reading on the study page says it too.
    expect(fit.reading).toMatch(/0\.4\d\d % per kelvin \(\d{4} ppm\/K\)/);
  });

  it('adds ppm/K columns to the fits CSV, leaving the 1/K columns as they were', async () => {
    const res = await request(ctx.app)
      .get(`/api/sweeps/${sweepId}/fits.csv`)
      .set(ctx.auth('engineer'));
    expect(res.status).toBe(200);
    const [header, ...rows] = parse(res.text) as string[][];
    expect(header!.slice(0, 7)).toEqual([
      'fit_id',
      'sweep_id',
      'kind',
      'window_min_k',
      'window_max_k',
      'parameter',
      'value',
    ]);
    expect(header!.slice(-3)).toEqual([
      'created_at',
      'value_ppm_per_k',
      'standard_error_ppm_per_k',
    ]);
    const col = (name: string) => header!.indexOf(name);
    const alphaRow = rows.find((r) => r[col('parameter')] === 'alphaPerK')!;
    const alpha = Number(alphaRow[col('value')]);
    expect(alpha).toBeCloseTo(fit.parameters['alphaPerK']!, 12);
    expect(Number(alphaRow[col('value_ppm_per_k')])).toBeCloseTo(alpha * PPM, 6);
    expect(Number(alphaRow[col('standard_error_ppm_per_k')])).toBeCloseTo(
      Number(alphaRow[col('standard_error')]) * PPM,
      6,
    );
    const rhoRow = rows.find((r) => r[col('parameter')] === 'referenceResistivityOhmCm')!;
    expect(rhoRow[col('value_ppm_per_k')]).toBe('');
    // The CSV keeps the full ISO 8601 instant with its zone (Z), as machines read it.
    expect(alphaRow[col('created_at')]).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
  });
});

describe('lengths refused in the unit the form takes them in', () => {
  it('gives the limit in cm as stored and in mm or µm as typed', async () => {
    // 1 cm = 10 mm = 10⁴ µm (SI): 50 cm is 500 mm, 0.1 cm is 1000 µm.
    const res = await request(ctx.app)
      .post('/api/lots')
      .set(ctx.auth('engineer'))
      .send({ code: 'UNIT-BIG', material: 'Si', diameterCm: 60, thicknessToleranceCm: 0.2 });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual(
      expect.arrayContaining([
        { field: 'body.diameterCm', problem: 'must be at most 50 cm (500 mm)' },
        { field: 'body.thicknessToleranceCm', problem: 'must be at most 0.1 cm (1000 µm)' },
      ]),
    );
  });
});

describe('dates in the report and the e-mails', () => {
  it('gives instants in the report to the minute in UTC, the zone stated', () => {
    // ISO 8601 day and time; 09:18:42Z is 09:18 UTC (seconds dropped, not rounded).
    expect(
      storedLine({
        sweepId: 4,
        sweepName: 'W03.csv',
        measuredAt: '2026-12-05T09:18:42.000Z',
        method: 'four-point',
      }),
    ).toBe('Sweep 4 (W03.csv), stored 2026-12-05 09:18 UTC, Four-point probe (collinear)');
    const by = fitLines(fit).at(-1)!;
    const at = fit.createdAt;
    expect(by).toBe(
      `   by ${fit.createdBy.name ?? `user ${fit.createdBy.id}`} on ${at.slice(0, 10)} ${at.slice(11, 16)} UTC`,
    );
  });

  it('writes due dates in the e-mails as YYYY-MM-DD', () => {
    const common = {
      to: 'tia@lab.example',
      assigneeName: 'Tia',
      assignmentId: 3,
      task: 'Sweep',
      dueDate: '2026-12-05',
      waferNumber: 'W03',
      lotCode: 'L-7',
      link: 'http://127.0.0.1/wafers/3',
    };
    const assigned = assignmentMail({
      ...common,
      assignedByName: 'Max',
      notes: null,
      material: 'Si',
      cautions: ['Follow your lab rules.'],
    });
    expect(assigned.subject).toContain('(due 2026-12-05)');
    expect(assigned.text).toContain('Due:      2026-12-05');
    const late = overdueMail({ ...common, daysLate: 2 });
    expect(late.text).toContain('This task was due on 2026-12-05 and is still open (2 days late).');
  });
});
