import { createServer } from 'node:net';
import { simpleParser } from 'mailparser';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createApp } from '../app';
import { AuditEvent } from '../audit/audit-event.model';
import { createLogger } from '../logger';
import { startMailStandIn, type StandInMessage } from '../mail/mail-stand-in';
import { Mailer } from '../mail/mailer.service';
import { OutgoingEmail } from '../mail/outgoing-email.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Assignment } from './assignment.model';
import { DEFER_TO_LAB_RULES, safetyCautionsFor } from './assignment-safety';

async function waitFor<T>(
  probe: () => Promise<T | undefined> | T | undefined,
  timeoutMs = 8_000,
): Promise<T> {
  const start = Date.now();
  for (;;) {
    const value = await probe();
    if (value !== undefined) return value;
    if (Date.now() - start > timeoutMs) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 25));
  }
}

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const server = createServer().listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

describe('/api/assignments', () => {
  let ctx: TestContext;
  let gaasWafer: { id: number; number: string };
  let siWafer: { id: number };
  let tech: Awaited<ReturnType<TestContext['addUser']>>;
  beforeAll(async () => {
    ctx = await createTestContext();
    const lot = await request(ctx.app)
      .post('/api/lots')
      .set(ctx.auth('manager'))
      .send({ code: 'GA-7', material: 'GaAs', dopant: 'Si', dopantType: 'n' });
    gaasWafer = (
      await request(ctx.app)
        .post(`/api/lots/${lot.body.id}/wafers`)
        .set(ctx.auth('manager'))
        .send({ number: '03' })
    ).body;
    const si = await request(ctx.app)
      .post('/api/lots')
      .set(ctx.auth('manager'))
      .send({ code: 'SI-2', material: 'Si' });
    siWafer = (
      await request(ctx.app)
        .post(`/api/lots/${si.body.id}/wafers`)
        .set(ctx.auth('manager'))
        .send({ number: '1' })
    ).body;
    tech = await ctx.addUser('technician', 'Ada <Tech> & Co');
  });
  afterAll(async () => {
    await ctx.close();
  });

  const assign = (body: object, role: 'admin' | 'manager' = 'manager') =>
    request(ctx.app).post('/api/assignments').set(ctx.auth(role)).send(body);

  it('creates an assignment and e-mails exactly one message to the assignee', async () => {
    const before = ctx.mailbox.length;
    const task = 'Measure R(T) from 80 K to 400 K <script>alert("x")</script>';
    const res = await assign({
      waferId: gaasWafer.id,
      assigneeId: tech.user.id,
      task,
      dueDate: '2031-05-02',
      notes: 'Use the "cold" station & log the LN2 level',
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      waferId: gaasWafer.id,
      waferNumber: '03',
      lotCode: 'GA-7',
      assigneeId: tech.user.id,
      assigneeName: 'Ada <Tech> & Co',
      assignedById: ctx.users.manager.id,
      task,
      dueDate: '2031-05-02',
      state: 'assigned',
      overdue: false,
    });
    expect(res.body.safetyCautions.at(-1)).toBe(DEFER_TO_LAB_RULES);
    const message = await waitFor(() =>
      ctx.mailbox.slice(before).find((m) => m.to.includes(tech.user.email)),
    );
    await new Promise((r) => setTimeout(r, 150));
    const mine = ctx.mailbox.slice(before).filter((m) => m.to.includes(tech.user.email));
    expect(mine).toHaveLength(1);
    const parsed = await simpleParser(message.raw);
    expect(parsed.text).toContain(task);
    expect(parsed.text).toContain('Wafer:    03 of lot GA-7 (GaAs)');
    expect(parsed.text).toContain('Due:      2031-05-02');
    expect(parsed.text).toContain(`${ctx.config.publicUrl}/wafers/${gaasWafer.id}`);
    expect(parsed.text).toMatch(/arsenic/);
    expect(parsed.text).toMatch(/Cryogens/);
    expect(parsed.text).toMatch(/Hot chuck/);
    expect(parsed.html).toBeTruthy();
    expect(parsed.html).not.toContain('<script>');
    expect(parsed.html).toContain('&lt;script&gt;');
    expect(parsed.html).toContain('Ada &lt;Tech&gt; &amp; Co');
    const events = await AuditEvent.findAll({
      where: { entity: 'assignment', entityId: String(res.body.id) },
    });
    expect(events.map((e) => e.action)).toEqual(['create']);
  });

  it('chooses safety cautions by material and task wording', () => {
    const metal = safetyCautionsFor('W', 'Four-point check of the film at room temperature, 1 mA');
    expect(metal.join(' ')).toMatch(/Probe current heats thin films/);
    expect(metal.join(' ')).not.toMatch(/arsenic/);
    const anneal = safetyCautionsFor('Si', 'Anneal and sweep to 600 K');
    expect(anneal.join(' ')).toMatch(/Hot chuck/);
    expect(anneal.join(' ')).not.toMatch(/Cryogens/);
    expect(safetyCautionsFor('Si', 'Sweep down to 77 K in the LN2 dewar').join(' ')).toMatch(
      /Cryogens/,
    );
    // A Hall sweep brings the magnet's cautions (common practice, no source).
    const hall = safetyCautionsFor('Si', 'Hall sweep from 20 K to 400 K at 0.5 T').join(' ');
    expect(hall).toMatch(/Strong magnet.*pacemakers.*loose steel.*cards/);
    expect(anneal.join(' ')).not.toMatch(/Strong magnet/);
  });

  it.each([
    ['missing waferId', { assigneeId: 1, task: 't', dueDate: '2031-01-01' }, 'body.waferId'],
    [
      'wrong-typed waferId',
      { waferId: '1', assigneeId: 1, task: 't', dueDate: '2031-01-01' },
      'body.waferId',
    ],
    ['missing task', { waferId: 1, assigneeId: 1, dueDate: '2031-01-01' }, 'body.task'],
    [
      'oversized task',
      { waferId: 1, assigneeId: 1, task: 't'.repeat(501), dueDate: '2031-01-01' },
      'body.task',
    ],
    ['bad date', { waferId: 1, assigneeId: 1, task: 't', dueDate: '2031-13-01' }, 'body.dueDate'],
    [
      'negative id',
      { waferId: -4, assigneeId: 1, task: 't', dueDate: '2031-01-01' },
      'body.waferId',
    ],
    [
      'oversized notes',
      { waferId: 1, assigneeId: 1, task: 't', dueDate: '2031-01-01', notes: 'n'.repeat(5001) },
      'body.notes',
    ],
    [
      'unknown field',
      { waferId: 1, assigneeId: 1, task: 't', dueDate: '2031-01-01', priority: 'high' },
      'body.priority',
    ],
  ])('refuses an assignment with %s', async (_label, body, field) => {
    const res = await assign(body);
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
  });

  it('refuses an unknown wafer (404) and an inactive or unknown assignee (400)', async () => {
    const base = { task: 'Measure', dueDate: '2031-01-01' };
    expect((await assign({ ...base, waferId: 999999, assigneeId: tech.user.id })).status).toBe(404);
    expect((await assign({ ...base, waferId: siWafer.id, assigneeId: 999999 })).status).toBe(400);
    const gone = await ctx.addUser('technician');
    await gone.user.update({ active: false });
    const res = await assign({ ...base, waferId: siWafer.id, assigneeId: gone.user.id });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([
      { field: 'body.assigneeId', problem: 'is not an active user' },
    ]);
  });

  it('lets technicians list only their own, and assignees move theirs only forward', async () => {
    const a = (
      await assign({
        waferId: siWafer.id,
        assigneeId: tech.user.id,
        task: 'Measure',
        dueDate: '2031-01-01',
      })
    ).body;
    const other = await ctx.addUser('technician');
    const own = await request(ctx.app)
      .get('/api/assignments')
      .query({ assignee: 'me' })
      .set(tech.header);
    expect(own.status).toBe(200);
    expect(own.body.items.every((x: { assigneeId: number }) => x.assigneeId === tech.user.id)).toBe(
      true,
    );
    expect(own.body.total).toBeGreaterThanOrEqual(2);
    const implicit = await request(ctx.app).get('/api/assignments').set(other.header);
    expect(implicit.body.total).toBe(0);
    expect(
      (
        await request(ctx.app)
          .get('/api/assignments')
          .query({ assignee: tech.user.id })
          .set(other.header)
      ).status,
    ).toBe(403);
    expect((await request(ctx.app).get(`/api/assignments/${a.id}`).set(other.header)).status).toBe(
      404,
    );
    expect(
      (
        await request(ctx.app)
          .patch(`/api/assignments/${a.id}`)
          .set(other.header)
          .send({ state: 'done' })
      ).status,
    ).toBe(404);
    expect(
      (
        await request(ctx.app)
          .patch(`/api/assignments/${a.id}`)
          .set(ctx.auth('engineer'))
          .send({ state: 'done' })
      ).status,
    ).toBe(403);

    const patch = (body: object) =>
      request(ctx.app).patch(`/api/assignments/${a.id}`).set(tech.header).send(body);
    expect((await patch({ state: 'in progress' })).body.state).toBe('in progress');
    expect((await patch({ state: 'assigned' })).status).toBe(403);
    expect((await patch({ state: 'cancelled' })).status).toBe(403);
    expect((await patch({ dueDate: '2040-01-01' })).status).toBe(403);
    expect((await patch({ state: 'bogus' })).status).toBe(400);
    expect((await patch({ state: 'done' })).body.state).toBe('done');
    const reopened = await request(ctx.app)
      .patch(`/api/assignments/${a.id}`)
      .set(ctx.auth('manager'))
      .send({ state: 'assigned', dueDate: '2032-02-02' });
    expect(reopened.body).toMatchObject({ state: 'assigned', dueDate: '2032-02-02' });
    const trail = await AuditEvent.findAll({
      where: { entity: 'assignment', entityId: String(a.id) },
    });
    expect(trail.map((e) => e.action)).toEqual(['create', 'update', 'update', 'update']);
  });

  it('lists overdue assignments for managers and flags them', async () => {
    const late = await Assignment.create({
      waferId: siWafer.id,
      assigneeId: tech.user.id,
      assignedById: ctx.users.manager.id,
      task: 'Overdue check',
      dueDate: '2020-01-01',
      notes: null,
    });
    await Assignment.create({
      waferId: siWafer.id,
      assigneeId: tech.user.id,
      assignedById: ctx.users.manager.id,
      task: 'Late but done',
      dueDate: '2020-01-01',
      state: 'done',
      notes: null,
    });
    const res = await request(ctx.app).get('/api/assignments/overdue').set(ctx.auth('manager'));
    expect(res.status).toBe(200);
    expect(res.body.items.map((x: { id: number }) => x.id)).toEqual([late.id]);
    expect(res.body.items[0].overdue).toBe(true);
    const filtered = await request(ctx.app)
      .get('/api/assignments')
      .query({ overdue: 'true' })
      .set(ctx.auth('admin'));
    expect(filtered.body.items.map((x: { id: number }) => x.id)).toEqual([late.id]);
    expect(
      (await request(ctx.app).get('/api/assignments/overdue').set(ctx.auth('engineer'))).status,
    ).toBe(403);
  });

  it('leaves neither assignment, audit event nor e-mail when the audit write fails', async () => {
    const counts = async () => [
      await Assignment.count(),
      await AuditEvent.count(),
      await OutgoingEmail.count(),
    ];
    const before = await counts();
    const spy = vi.spyOn(AuditEvent, 'create').mockRejectedValueOnce(new Error('lost the disk'));
    const res = await assign({
      waferId: siWafer.id,
      assigneeId: tech.user.id,
      task: 'Doomed',
      dueDate: '2031-01-01',
    });
    spy.mockRestore();
    expect(res.status).toBe(500);
    expect(await counts()).toEqual(before);
  });

  it('keeps the assignment when SMTP is down and delivers the mail once it is back', async () => {
    const port = await freePort();
    const downMailer = new Mailer({
      host: '127.0.0.1',
      port,
      from: ctx.config.smtp.from,
      retryBaseMs: 50,
      maxBackoffMs: 200,
    });
    const app = createApp({
      config: ctx.config,
      sequelize: ctx.sequelize,
      mailer: downMailer,
      logger: createLogger('silent'),
    });
    const res = await request(app).post('/api/assignments').set(ctx.auth('admin')).send({
      waferId: siWafer.id,
      assigneeId: tech.user.id,
      task: 'Measure while mail is down',
      dueDate: '2031-03-03',
    });
    expect(res.status).toBe(201);
    expect(await Assignment.findByPk(res.body.id)).not.toBeNull();
    const queued = await waitFor(async () => {
      const row = await OutgoingEmail.findOne({
        where: { relatedEntity: 'assignment', relatedId: String(res.body.id) },
      });
      return row && row.attempts >= 1 ? row : undefined;
    });
    expect(queued.state).toBe('queued');
    expect(queued.lastError).toBeTruthy();

    const box: StandInMessage[] = [];
    const standIn = await startMailStandIn({
      port,
      mailDir: ctx.config.mailDir,
      onMessage: (m) => box.push(m),
    });
    try {
      const delivered = await waitFor(async () => {
        await downMailer.deliverDue();
        return box.find((m) => m.raw.includes('Measure while mail is down'));
      });
      expect(delivered.to).toEqual([tech.user.email]);
      await queued.reload();
      expect(queued.state).toBe('sent');
    } finally {
      await downMailer.stop();
      downMailer.close();
      await standIn.close();
    }
  });

  it('lists the captured .eml files under /api/dev/mail outside production', async () => {
    const res = await request(ctx.app).get('/api/dev/mail').set('Accept', 'application/json');
    expect(res.status).toBe(200);
    expect(res.body.items.length).toBeGreaterThan(0);
    expect(res.body.items.some((m: { to: string }) => m.to.includes(tech.user.email))).toBe(true);
    const one = await request(ctx.app).get(`/api/dev/mail/${res.body.items[0].file}`);
    expect(one.status).toBe(200);
    expect(one.text).toMatch(/Subject:/);
    expect((await request(ctx.app).get('/api/dev/mail/..%2Fjwt-secret')).status).toBe(404);
    const page = await request(ctx.app).get('/api/dev/mail').set('Accept', 'text/html');
    expect(page.headers['content-type']).toMatch(/html/);
    const prod = createApp({
      config: { ...ctx.config, production: true, nodeEnv: 'production' },
      sequelize: ctx.sequelize,
      mailer: ctx.mailer,
      logger: createLogger('silent'),
    });
    expect((await request(prod).get('/api/dev/mail')).status).toBe(404);
  });
});
