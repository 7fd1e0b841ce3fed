import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import { pino } from 'pino';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../app';
import { Assignment } from '../assignments/assignment.model';
import { createLogger } from '../logger';
import { openApiDocument } from '../openapi/document';
import { houseKeep } from '../ops/housekeeping';
import { documentProblems } from '../openapi/testing/document-validator';
import { makeStation, makeWafer } from '../sweeps/sweep-test-helpers';
import { Sweep } from '../sweeps/sweep.model';
import { fourPointCsv } from '../testing/sweep-files';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Wafer } from '../wafers/wafer.model';
import { IDEMPOTENCY_KEEP_S } from './key-retention';

/** Posts a station may make in a minute in this file (the rate test uses a token of its own). */
const PER_MINUTE = 12;
let ctx: TestContext;
let stationId: number;
let otherStationId: number;

async function makeToken(forStation: number, label = 'cryostat PC') {
  const res = await request(ctx.app)
    .post(`/api/stations/${forStation}/tokens`)
    .set(ctx.auth('engineer'))
    .send({ label });
  expect(res.status).toBe(201);
  return res.body as { id: number; token: string; prefix: string };
}

/** A wafer with an open assignment (from the manager) naming `station`. */
async function assignedWafer(station: number) {
  const wafer = await makeWafer({ thicknessCm: 0.05 });
  const assignment = await Assignment.create({
    waferId: wafer.id,
    assigneeId: ctx.users.technician.id,
    assignedById: ctx.users.manager.id,
    task: 'Measure rho(T) from 80 K to 500 K',
    dueDate: '2031-01-31',
    notes: null,
    stationId: station,
  });
  return { wafer, assignment };
}

function post(
  token: string,
  waferId: number,
  file: Buffer,
  key: string | null,
  app: Express = ctx.app,
) {
  let req = request(app).post('/api/station/sweeps').set('Authorization', `Bearer ${token}`);
  if (key !== null) req = req.set('Idempotency-Key', key);
  return req
    .field('waferId', String(waferId))
    .field('method', 'four-point')
    .field('spacingCm', '0.1')
    .attach('file', file, 'bench.csv');
}

beforeAll(async () => {
  ctx = await createTestContext({ stationPostsPerMinute: PER_MINUTE });
  stationId = (await makeStation({ probeSpacingCm: 0.1, name: 'Bench A' })).id;
  otherStationId = (await makeStation({ probeSpacingCm: 0.1, name: 'Bench B' })).id;
});
afterAll(async () => ctx?.close());

describe('station tokens', () => {
  it('are made once, listed without the secret and stored only as a hash', async () => {
    const made = await makeToken(stationId, 'bench A computer');
    expect(made.token).toMatch(/^rts_[A-Za-z0-9_-]{43}$/);
    expect(made.token.startsWith(made.prefix)).toBe(true);
    const list = await request(ctx.app)
      .get(`/api/stations/${stationId}/tokens`)
      .set(ctx.auth('manager'));
    expect(list.status).toBe(200);
    expect(documentProblems('GET', '/stations/{id}/tokens', 200, list.body)).toEqual([]);
    const listed = list.body.items.find((t: { id: number }) => t.id === made.id);
    expect(listed).toMatchObject({
      label: 'bench A computer',
      prefix: made.prefix,
      revokedAt: null,
    });
    expect(JSON.stringify(list.body)).not.toContain(made.token.slice(12));
    // the database holds no token text anywhere: tokens, audit trail
    const secret = made.token.slice(12);
    for (const table of ['station_tokens', 'audit_events']) {
      const rows = await ctx.sequelize.query(`SELECT * FROM ${table}`, { type: QueryTypes.SELECT });
      expect(JSON.stringify(rows)).not.toContain(secret);
    }
  });

  it('are made and seen only by roles that edit stations', async () => {
    for (const role of ['technician', 'physicist'] as const) {
      const made = await request(ctx.app)
        .post(`/api/stations/${stationId}/tokens`)
        .set(ctx.auth(role))
        .send({ label: 'x' });
      expect(made.status).toBe(403);
      const list = await request(ctx.app)
        .get(`/api/stations/${stationId}/tokens`)
        .set(ctx.auth(role));
      expect(list.status).toBe(403);
    }
    const blank = await request(ctx.app)
      .post(`/api/stations/${stationId}/tokens`)
      .set(ctx.auth('admin'))
      .send({ label: ' ' });
    expect(blank.status).toBe(400);
    expect(blank.body.error.details[0].field).toBe('body.label');
  });

  it('are refused on every route but the station post (403 where a session is needed)', async () => {
    const { token } = await makeToken(stationId);
    const paths = openApiDocument().paths ?? {};
    let checked = 0;
    for (const [path, item] of Object.entries(paths)) {
      for (const method of ['get', 'post', 'patch', 'delete'] as const) {
        const op = item[method];
        if (!op?.security?.some((s) => 'userBearer' in s)) continue;
        const url = `/api${path.replace(/\{[^}]+\}/g, '1')}`;
        const res = await request(ctx.app)[method](url).set('Authorization', `Bearer ${token}`);
        expect(res.status, `${method.toUpperCase()} ${url}`).toBe(403);
        expect(res.body.error.message).toContain('station token');
        checked += 1;
      }
    }
    expect(checked).toBeGreaterThan(50);
  });

  it('stop working the moment they are revoked, and show when they were last used', async () => {
    const { token, id } = await makeToken(stationId);
    const { wafer } = await assignedWafer(stationId);
    const first = await post(token, wafer.id, fourPointCsv(30, 'revoke'), randomUUID());
    expect(first.status).toBe(201);
    const gone = await request(ctx.app)
      .delete(`/api/stations/${stationId}/tokens/${id}`)
      .set(ctx.auth('manager'));
    expect(gone.status).toBe(204);
    const after = await post(token, wafer.id, fourPointCsv(30, 'revoked'), randomUUID());
    expect(after.status).toBe(401);
    const list = await request(ctx.app)
      .get(`/api/stations/${stationId}/tokens`)
      .set(ctx.auth('admin'));
    const listed = list.body.items.find((t: { id: number }) => t.id === id);
    expect(listed.revokedAt).not.toBeNull();
    expect(listed.lastUsedAt).not.toBeNull();
  });

  it('a user session token is no station token', async () => {
    const { wafer } = await assignedWafer(stationId);
    const res = await request(ctx.app)
      .post('/api/station/sweeps')
      .set(ctx.auth('admin'))
      .set('Idempotency-Key', randomUUID())
      .field('waferId', String(wafer.id))
      .attach('file', fourPointCsv(10, 'user'), 'u.csv');
    expect(res.status).toBe(401);
  });
});

describe('POST /api/station/sweeps', () => {
  let token: string;
  beforeAll(async () => {
    token = (await makeToken(stationId, 'bench A loop')).token;
  });

  it('stores the sweep as an upload, closes the assignment and tells the manager', async () => {
    const { wafer, assignment } = await assignedWafer(stationId);
    const res = await post(token, wafer.id, fourPointCsv(40, 'first'), randomUUID());
    expect(res.status).toBe(201);
    expect(documentProblems('POST', '/station/sweeps', 201, res.body)).toEqual([]);
    expect(res.body).toMatchObject({
      pointCount: 40,
      waferId: wafer.id,
      assignmentId: assignment.id,
    });
    const sweep = await request(ctx.app)
      .get(`/api/sweeps/${res.body.id}`)
      .set(ctx.auth('engineer'));
    expect(sweep.body.uploadedVia).toMatchObject({
      stationName: 'Bench A',
      tokenLabel: 'bench A loop',
    });
    expect(sweep.body.stationId).toBe(stationId);
    expect(documentProblems('GET', '/sweeps/{id}', 200, sweep.body)).toEqual([]);
    const closed = await request(ctx.app)
      .get(`/api/assignments/${assignment.id}`)
      .set(ctx.auth('manager'));
    expect(closed.body).toMatchObject({ state: 'done', stationId });
    expect(closed.body.stationUpload).toMatchObject({
      sweepId: res.body.id,
      stationName: 'Bench A',
    });
    expect(documentProblems('GET', '/assignments/{id}', 200, closed.body)).toEqual([]);
    expect((await Wafer.findByPk(wafer.id))!.state).toBe('measured');
    const [mail] = await ctx.sequelize.query<{ toAddress: string; subject: string }>(
      'SELECT to_address AS toAddress, subject FROM outgoing_emails WHERE related_id = ? ' +
        "AND related_entity = 'assignment' ORDER BY id DESC LIMIT 1",
      { replacements: [assignment.id], type: QueryTypes.SELECT },
    );
    expect(mail?.toAddress).toBe(ctx.users.manager.email);
    expect(mail?.subject).toContain('Bench A');
    const audit = await request(ctx.app)
      .get(`/api/audit?entity=sweep&id=${res.body.id}`)
      .set(ctx.auth('admin'));
    const stationEvent = audit.body.items.find(
      (e: { action: string }) => e.action === 'station-post',
    );
    expect(stationEvent.after).toMatchObject({
      stationName: 'Bench A',
      tokenLabel: 'bench A loop',
    });
  });

  it('needs an Idempotency-Key (400 naming the header)', async () => {
    const { wafer } = await assignedWafer(stationId);
    const res = await post(token, wafer.id, fourPointCsv(10, 'nokey'), null);
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].field).toBe('header.Idempotency-Key');
  });

  it('answers a repeated key with the first answer and stores nothing new', async () => {
    const { wafer } = await assignedWafer(stationId);
    const key = randomUUID();
    const file = fourPointCsv(25, 'repeat');
    const first = await post(token, wafer.id, file, key);
    const again = await post(token, wafer.id, file, key);
    expect(first.status).toBe(201);
    expect(again.status).toBe(201);
    expect(again.body).toEqual(first.body);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(await Sweep.count({ where: { waferId: wafer.id } })).toBe(1);
    const other = await post(token, wafer.id, fourPointCsv(25, 'another file'), key);
    expect(other.status).toBe(422);
    expect(other.body.error.details[0].field).toBe('header.Idempotency-Key');
    expect(await Sweep.count({ where: { waferId: wafer.id } })).toBe(1);
  });

  it('stores one sweep for two concurrent posts with one key', async () => {
    const { wafer } = await assignedWafer(stationId);
    const key = randomUUID();
    const file = fourPointCsv(200, 'concurrent');
    const [a, b] = await Promise.all([
      post(token, wafer.id, file, key),
      post(token, wafer.id, file, key),
    ]);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.body.id).toBe(b.body.id);
    expect(await Sweep.count({ where: { waferId: wafer.id } })).toBe(1);
  });

  it('refuses a wafer with no open assignment naming the station, and another station', async () => {
    const bare = await makeWafer();
    const none = await post(token, bare.id, fourPointCsv(10, 'bare'), randomUUID());
    expect(none.status).toBe(403);
    expect(none.body.error.message).toContain(`Wafer ${bare.id}`);
    expect(none.body.error.message).toContain('Bench A');
    const { wafer } = await assignedWafer(stationId);
    const other = await makeToken(otherStationId);
    const wrong = await post(other.token, wafer.id, fourPointCsv(10, 'other'), randomUUID());
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.message).toContain('Bench B');
    expect(await Sweep.count({ where: { waferId: wafer.id } })).toBe(0);
  });

  it('remembers a key for 48 hours, then forgets it but keeps the upload on the task', async () => {
    // Issue 17's contract: a key is remembered for at least 24 hours; docs/station-client.md
    // states 48 hours.
    expect(IDEMPOTENCY_KEEP_S).toBe(48 * 60 * 60);
    const { token: own } = await makeToken(stationId, 'bench A retention');
    const { wafer, assignment } = await assignedWafer(stationId);
    const key = randomUUID();
    const file = fourPointCsv(20, 'retention');
    const first = await post(own, wafer.id, file, key);
    expect(first.status).toBe(201);
    const deps = { sequelize: ctx.sequelize, config: { storage: 'db' as const } };
    const choresAt = (hours: number) =>
      houseKeep(
        { ...deps, logger: pino({ level: 'silent' }) },
        new Date(Date.now() + hours * 36e5),
      );

    await choresAt(47);
    const again = await post(own, wafer.id, file, key);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);

    await choresAt(49);
    const [row] = await ctx.sequelize.query<{ idempotencyKey: string | null; response: string }>(
      'SELECT idempotency_key AS idempotencyKey, response FROM station_idempotency_keys ' +
        'WHERE sweep_id = ?',
      { replacements: [first.body.id], type: QueryTypes.SELECT },
    );
    expect(row).toEqual({ idempotencyKey: null, response: '' });
    const task = await request(ctx.app)
      .get(`/api/assignments/${assignment.id}`)
      .set(ctx.auth('manager'));
    expect(task.body.stationUpload).toMatchObject({ sweepId: first.body.id });
    // The forgotten key is free again: another file with it is a new post, not a 422.
    const next = await assignedWafer(stationId);
    const reused = await post(own, next.wafer.id, fourPointCsv(20, 'after 48 h'), key);
    expect(reused.status).toBe(201);
    expect(reused.body.id).not.toBe(first.body.id);
  });

  it('limits the posts of one token (429 with Retry-After)', async () => {
    const { token: busy } = await makeToken(stationId, 'busy');
    const statuses: number[] = [];
    let retryAfter: string | undefined;
    for (let i = 0; i <= PER_MINUTE; i += 1) {
      const res = await post(busy, 1, Buffer.from('x'), null);
      statuses.push(res.status);
      retryAfter = res.headers['retry-after'];
    }
    expect(statuses.slice(0, PER_MINUTE).every((s) => s === 400)).toBe(true);
    expect(statuses[PER_MINUTE]).toBe(429);
    expect(Number(retryAfter)).toBeGreaterThan(0);
  });

  it('counts one token against one limit across API instances', async () => {
    // A second instance over the same database, as behind a load balancer: the limit is the
    // token's, not each process's.
    const second = createApp({
      config: ctx.config,
      sequelize: ctx.sequelize,
      mailer: ctx.mailer,
      logger: createLogger('silent'),
    });
    const { token: shared } = await makeToken(stationId, 'two instances');
    const statuses: number[] = [];
    for (let i = 0; i <= PER_MINUTE; i += 1) {
      const res = await post(shared, 1, Buffer.from('x'), null, i % 2 ? second : ctx.app);
      statuses.push(res.status);
    }
    expect(statuses.slice(0, PER_MINUTE).every((s) => s === 400)).toBe(true);
    expect(statuses[PER_MINUTE]).toBe(429);
  });
});
