import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';

describe('GET /api/health', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => {
    await ctx.close();
  });

  it('reports the database up without sign-in', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      status: 'ok',
      db: 'up',
      dbHost: `${ctx.config.db.host}:${ctx.config.db.port}`,
      clusterSize: null,
    });
  });

  it('answers unknown API paths with the JSON error shape', async () => {
    const res = await request(ctx.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('reports the database down with 503 when it cannot be reached', async () => {
    const { connectDatabase } = await import('../db/database');
    const { healthRouter } = await import('./health.router');
    const express = (await import('express')).default;
    const dead = connectDatabase({ ...ctx.config.db, port: 1 }, { poolMax: 1 });
    const app = express().use('/api', healthRouter({ sequelize: dead }));
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(503);
    expect(res.body).toEqual({
      status: 'degraded',
      db: 'down',
      dbHost: `${ctx.config.db.host}:1`,
      clusterSize: null,
    });
    await dead.close();
  });
});
