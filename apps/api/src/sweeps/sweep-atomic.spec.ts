import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../audit/audit-event.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { makeWafer } from './sweep-test-helpers';
import { RawFile, Sweep, SweepPoint } from './sweep.model';

const SEED = fileURLToPath(new URL('../../../../seed-data/sweeps/', import.meta.url));
const LIMIT = 64 * 1024;

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({ uploadLimitBytes: LIMIT });
});
afterAll(async () => {
  await ctx.close();
});

function bigFile(rows: number): Buffer {
  const lines = ['T (K),I (mA),V (mV)'];
  for (let i = 0; i < rows; i++)
    lines.push(`${(80 + i * 0.01).toFixed(2)},1.000,${(10 + i * 1e-4).toFixed(5)}`);
  return Buffer.from(`${lines.join('\n')}\n`);
}

const upload = (waferId: number, file: Buffer, name = 'sweep.csv') =>
  request(ctx.app)
    .post(`/api/wafers/${waferId}/sweeps`)
    .set(ctx.auth('engineer'))
    .field('method', 'four-point')
    .field('spacingCm', '0.1')
    .attach('file', file, name);

async function counts() {
  return {
    sweeps: await Sweep.count({ paranoid: false }),
    points: await SweepPoint.count(),
    raw: await RawFile.count(),
    audit: await AuditEvent.count({ where: { entity: 'sweep' } }),
  };
}

describe('all or nothing', () => {
  it('a database failure half-way through the point insert leaves nothing behind', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const before = await counts();
    // The database refuses the 1500th point: the sweep row and raw file exist by then.
    await ctx.sequelize.query(
      'CREATE TRIGGER fail_half_way BEFORE INSERT ON sweep_points FOR EACH ROW ' +
        "IF NEW.sequence = 1500 THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'disk full (test)'; END IF",
    );
    try {
      const res = await upload(wafer.id, bigFile(3000));
      expect(res.status).toBe(500);
      expect(res.body.error.code).toBe('internal');
    } finally {
      await ctx.sequelize.query('DROP TRIGGER fail_half_way');
    }
    expect(await counts()).toEqual(before);
    // The same file stores cleanly afterwards (no half-written duplicate blocks it).
    const again = await upload(wafer.id, bigFile(3000));
    expect(again.status).toBe(201);
    expect(again.body.pointCount).toBe(3000);
    const after = await counts();
    expect(after).toEqual({
      sweeps: before.sweeps + 1,
      points: before.points + 3000,
      raw: before.raw + 1,
      audit: before.audit + 1,
    });
  });

  it('a bad row near the end stores nothing', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const before = await counts();
    const file = Buffer.concat([bigFile(2000), Buffer.from('500,1,oops\n')]);
    const res = await upload(wafer.id, file);
    expect(res.status).toBe(422);
    expect(res.body.error.details[0]).toMatchObject({ row: 2002, column: 'V (mV)' });
    expect(await counts()).toEqual(before);
  });
});

describe('duplicates, size limit and the raw file', () => {
  it('the same file on the same wafer is 409 naming the earlier sweep; another wafer takes it', async () => {
    const bytes = readFileSync(SEED + 'comma-kelvin-four-point.csv');
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const first = await upload(wafer.id, bytes, 'one.csv');
    expect(first.status).toBe(201);
    const second = await upload(wafer.id, bytes, 'renamed.csv');
    expect(second.status).toBe(409);
    expect(second.body.error.details).toEqual({ sweepId: first.body.id });
    expect(second.body.error.message).toContain(`sweep ${first.body.id}`);
    const other = await makeWafer({ thicknessCm: 0.05 });
    expect((await upload(other.id, bytes)).status).toBe(201);
  });

  it('a file over the upload limit is 413', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const file = bigFile(4000);
    expect(file.length).toBeGreaterThan(LIMIT);
    const res = await upload(wafer.id, file);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
  });

  it('a second file field is refused', async () => {
    const wafer = await makeWafer({ thicknessCm: 0.05 });
    const res = await request(ctx.app)
      .post(`/api/wafers/${wafer.id}/sweeps`)
      .set(ctx.auth('engineer'))
      .field('method', 'four-point')
      .attach('file', bigFile(3), 'a.csv')
      .attach('extra', bigFile(3), 'b.csv');
    expect(res.status).toBe(400);
  });

  it('the raw download is byte-identical, stored under a generated key, with a safe name', async () => {
    const bytes = readFileSync(SEED + 'semicolon-decimal-comma-celsius.csv');
    const wafer = await makeWafer({ thicknessCm: 0.0675, diameterCm: 10 });
    const res = await request(ctx.app)
      .post(`/api/wafers/${wafer.id}/sweeps`)
      .set(ctx.auth('engineer'))
      .field('method', 'four-point')
      .field('spacingCm', '0.1587')
      .attach('file', bytes, 'run "7";\u00e9t\u00e9.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const raw = await request(ctx.app)
      .get(`/api/sweeps/${res.body.id}/raw`)
      .set(ctx.auth('manager'))
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(raw.status).toBe(200);
    const sha = (b: Buffer) => createHash('sha256').update(b).digest('hex');
    expect(sha(raw.body as Buffer)).toBe(sha(bytes));
    expect(raw.headers['content-disposition']).toMatch(/^attachment; filename="run _7__/);
    const sweep = await Sweep.findByPk(res.body.id);
    expect(sweep!.sha256).toBe(sha(bytes));
    expect(sweep!.storageKey).toMatch(/^raw-[0-9a-f-]{36}$/);
    expect(sweep!.originalName).toBe('run "7";\u00e9t\u00e9.csv');
  });
});
