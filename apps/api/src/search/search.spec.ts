import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assign, makeLot, makeSweep, range, synthesize } from '../analysis/testing/fixtures';
import { documentProblems } from '../openapi/testing/document-validator';
import { createTestContext, type TestContext } from '../testing/test-context';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx.close());

interface Group {
  kind: string;
  total: number;
  items: Array<{ id: number; title: string; detail: string; waferId: number | null }>;
}
const group = (body: { groups: Group[] }, kind: string) => body.groups.find((g) => g.kind === kind);

describe('GET /api/search', () => {
  it('finds lots, wafers, sweep files and people by name, within what the reader may see', async () => {
    const { lot, wafers } = await makeLot({}, ['QZ-W1', 'QZ-W2']);
    const sweep = await makeSweep(
      wafers[0]!.id,
      ctx.users.engineer.id,
      synthesize(range(290, 300, 3), () => 10),
    );
    const res = await request(ctx.app)
      .get('/api/search')
      .query({ q: 'QZ-W' })
      .set(ctx.auth('manager'));
    expect(res.status).toBe(200);
    expect(documentProblems('GET', '/search', 200, res.body)).toEqual([]);
    expect(
      group(res.body, 'wafers')!
        .items.map((h) => h.title)
        .sort(),
    ).toEqual(['QZ-W1', 'QZ-W2']);
    expect(group(res.body, 'wafers')!.items[0]!.detail).toContain(`lot ${lot.code}`);

    const byFile = await request(ctx.app)
      .get('/api/search')
      .query({ q: sweep.originalName })
      .set(ctx.auth('physicist'));
    expect(group(byFile.body, 'sweeps')!.items[0]!.waferId).toBe(wafers[0]!.id);
    expect(group(byFile.body, 'people')).toBeUndefined(); // a physicist does not look up people

    const person = await request(ctx.app)
      .get('/api/search')
      .query({ q: ctx.users.technician.name })
      .set(ctx.auth('manager'));
    expect(group(person.body, 'people')!.items[0]!.title).toBe(ctx.users.technician.name);

    // A technician finds only the wafers assigned to them.
    await assign(wafers[1]!.id, ctx.users.technician.id, ctx.users.manager.id);
    const tech = await request(ctx.app)
      .get('/api/search')
      .query({ q: 'QZ-W' })
      .set(ctx.auth('technician'));
    expect(group(tech.body, 'wafers')!.items.map((h) => h.title)).toEqual(['QZ-W2']);
    expect(group(tech.body, 'sweeps')!.total).toBe(0);
  });

  it('reaches every item of a kind, a page at a time', async () => {
    const { wafers } = await makeLot({}, ['PG-1']);
    for (let i = 0; i < 7; i += 1) {
      await makeSweep(
        wafers[0]!.id,
        ctx.users.engineer.id,
        synthesize([290 + i], () => 10),
      );
    }
    const read = (page: number) =>
      request(ctx.app)
        .get('/api/search')
        .query({ kind: 'sweeps', q: '', page, pageSize: 3 })
        .set(ctx.auth('physicist'));
    const first = await read(1);
    expect(first.status).toBe(200);
    expect(first.body.groups).toHaveLength(1);
    const total = group(first.body, 'sweeps')!.total;
    expect(total).toBeGreaterThanOrEqual(7);
    const ids: number[] = [];
    for (let page = 1; page <= Math.ceil(total / 3); page += 1) {
      ids.push(...group((await read(page)).body, 'sweeps')!.items.map((h) => h.id));
    }
    expect(ids).toHaveLength(total); // every sweep reached
    expect(new Set(ids).size).toBe(total); // none twice
    expect([...ids].sort((a, b) => b - a)).toEqual(ids); // newest first
  });

  it('refuses a bad query with the field named', async () => {
    const res = await request(ctx.app)
      .get('/api/search')
      .query({ kind: 'fits' })
      .set(ctx.auth('manager'));
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.error.details)).toContain('kind');
    expect((await request(ctx.app).get('/api/search').query({ q: 'x' })).status).toBe(401);
  });
});
