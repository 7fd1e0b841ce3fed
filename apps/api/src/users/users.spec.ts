import bcrypt from 'bcryptjs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { AuditEvent } from '../audit/audit-event.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { User } from './user.model';
import { BCRYPT_COST, createUser } from './users.service';

describe('/api/users', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => {
    await ctx.close();
  });

  const admin = () => ctx.auth('admin');

  it('creates an account with a bcrypt hash (cost ≥ 10), never showing the hash', async () => {
    const res = await request(ctx.app).post('/api/users').set(admin()).send({
      email: 'New.Person@Test.Rhotrace.Example',
      name: 'Zoë Ñúñez-李',
      role: 'technician',
      password: 'a-long-password',
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      email: 'new.person@test.rhotrace.example',
      name: 'Zoë Ñúñez-李',
      role: 'technician',
      active: true,
    });
    expect(JSON.stringify(res.body)).not.toMatch(/passwordHash|\$2[aby]\$/);
    const stored = await User.findByPk(res.body.id);
    expect(bcrypt.getRounds(stored!.passwordHash)).toBeGreaterThanOrEqual(BCRYPT_COST);
    expect(BCRYPT_COST).toBeGreaterThanOrEqual(10);
    const event = await AuditEvent.findOne({
      where: { entity: 'user', entityId: String(res.body.id) },
    });
    expect(event?.actorId).toBe(ctx.users.admin.id);
    expect(JSON.stringify(event?.after)).not.toMatch(/\$2[aby]\$/);
    const dup = await request(ctx.app).post('/api/users').set(admin()).send({
      email: 'new.person@test.rhotrace.example',
      name: 'Again',
      role: 'engineer',
      password: 'a-long-password',
    });
    expect(dup.status).toBe(409);
  });

  it.each([
    ['missing e-mail', { name: 'A', role: 'engineer', password: 'a-long-password' }, 'body.email'],
    [
      'bad e-mail',
      { email: 'nope', name: 'A', role: 'engineer', password: 'a-long-password' },
      'body.email',
    ],
    [
      'unknown role',
      { email: 'a@test.rhotrace.example', name: 'A', role: 'root', password: 'a-long-password' },
      'body.role',
    ],
    [
      'short password',
      { email: 'a@test.rhotrace.example', name: 'A', role: 'engineer', password: 'short' },
      'body.password',
    ],
    [
      'oversized name',
      {
        email: 'a@test.rhotrace.example',
        name: 'n'.repeat(201),
        role: 'engineer',
        password: 'a-long-password',
      },
      'body.name',
    ],
    [
      'wrong-typed name',
      { email: 'a@test.rhotrace.example', name: 7, role: 'engineer', password: 'a-long-password' },
      'body.name',
    ],
    [
      'unknown field',
      {
        email: 'a@test.rhotrace.example',
        name: 'A',
        role: 'engineer',
        password: 'a-long-password',
        isAdmin: true,
      },
      'body.isAdmin',
    ],
  ])('refuses an account with %s', async (_label, body, field) => {
    const res = await request(ctx.app).post('/api/users').set(admin()).send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { field: string }) => d.field)).toContain(field);
  });

  it('lists, filters and sorts accounts', async () => {
    const res = await request(ctx.app)
      .get('/api/users')
      .query({ role: 'manager', sort: '-name' })
      .set(admin());
    expect(res.status).toBe(200);
    expect(res.body.items.every((u: { role: string }) => u.role === 'manager')).toBe(true);
    const q = await request(ctx.app).get('/api/users').query({ q: 'physicist@' }).set(admin());
    expect(q.body.items.map((u: { email: string }) => u.email)).toEqual([
      'physicist@test.rhotrace.example',
    ]);
    expect(
      (await request(ctx.app).get('/api/users').query({ sort: 'passwordHash' }).set(admin()))
        .status,
    ).toBe(400);
    const assignees = await request(ctx.app).get('/api/users/assignees').set(ctx.auth('manager'));
    expect(assignees.body.items[0]).toEqual({
      id: expect.any(Number),
      name: expect.any(String),
      email: expect.any(String),
      role: expect.any(String),
    });
  });

  it('changes role and password (ending old sessions) and protects the last admin', async () => {
    const { user, header } = await ctx.addUser('physicist');
    const res = await request(ctx.app)
      .patch(`/api/users/${user.id}`)
      .set(admin())
      .send({ role: 'engineer' });
    expect(res.body.role).toBe('engineer');
    expect((await request(ctx.app).get('/api/auth/me').set(header)).body.role).toBe('engineer');
    await request(ctx.app)
      .patch(`/api/users/${user.id}`)
      .set(admin())
      .send({ password: 'admin-set-password' });
    expect((await request(ctx.app).get('/api/auth/me').set(header)).status).toBe(401);
    const login = await request(ctx.app)
      .post('/api/auth/login')
      .send({ email: user.email, password: 'admin-set-password' });
    expect(login.status).toBe(200);
    const self = await request(ctx.app)
      .patch(`/api/users/${ctx.users.admin.id}`)
      .set(admin())
      .send({ active: false });
    expect(self.status).toBe(409);
    expect(
      (await request(ctx.app).patch('/api/users/999999').set(admin()).send({ name: 'X' })).status,
    ).toBe(404);
    expect(
      (
        await request(ctx.app)
          .patch(`/api/users/${user.id}`)
          .set(admin())
          .send({ email: 'x@y.example' })
      ).status,
    ).toBe(400);
  });

  it('exports createUser for the demo seeder (no actor) and rolls back with its audit event', async () => {
    const made = await createUser(
      {
        email: 'seed@test.rhotrace.example',
        name: 'Seeded',
        role: 'engineer',
        password: 'seed-password-1',
      },
      null,
    );
    expect(await bcrypt.compare('seed-password-1', made.passwordHash)).toBe(true);
    const spy = vi.spyOn(AuditEvent, 'create').mockRejectedValueOnce(new Error('audit down'));
    await expect(
      createUser(
        {
          email: 'seed2@test.rhotrace.example',
          name: 'Seeded 2',
          role: 'engineer',
          password: 'seed-password-1',
        },
        null,
      ),
    ).rejects.toThrow('audit down');
    spy.mockRestore();
    expect(await User.count({ where: { email: 'seed2@test.rhotrace.example' } })).toBe(0);
  });
});
