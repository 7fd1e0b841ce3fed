import jwt from 'jsonwebtoken';
import { simpleParser } from 'mailparser';
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it, onTestFinished, vi } from 'vitest';
import { PasswordReset, SignInThrottle } from '../users/user.model';
import { createTestContext, TEST_PASSWORD, type TestContext } from '../testing/test-context';
import { ACCOUNT_DEACTIVATED, SIGN_IN_FAILED } from './auth.service';

async function waitFor<T>(probe: () => T | undefined, timeoutMs = 5_000): Promise<T> {
  const start = Date.now();
  for (;;) {
    const value = probe();
    if (value !== undefined) return value;
    if (Date.now() - start > timeoutMs) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 25));
  }
}

/** Stops `Date` (only) for the rest of a test; bcrypt's worker threads and timers run on. */
function freezeClock(): void {
  vi.useFakeTimers({ toFake: ['Date'], now: new Date() });
  onTestFinished(() => void vi.useRealTimers());
}

describe('/api/auth', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => {
    await ctx.close();
  });
  beforeEach(async () => {
    await SignInThrottle.destroy({ where: {} });
  });

  const login = (email: string, password: string) =>
    request(ctx.app).post('/api/auth/login').send({ email, password });

  it('signs in with e-mail and password and answers token, expiry and user', async () => {
    const res = await login('Engineer@test.rhotrace.example', TEST_PASSWORD);
    expect(res.status).toBe(200);
    expect(res.body.user).toEqual({
      id: ctx.users.engineer.id,
      email: 'engineer@test.rhotrace.example',
      name: 'Test engineer',
      role: 'engineer',
    });
    const decoded = jwt.decode(res.body.token, { complete: true });
    expect(decoded?.header.alg).toBe('HS256');
    const ttlMs = Date.parse(res.body.expiresAt) - Date.now();
    expect(ttlMs).toBeGreaterThan((ctx.config.tokenTtlS - 60) * 1000);
    expect(ttlMs).toBeLessThanOrEqual(ctx.config.tokenTtlS * 1000);
    const me = await request(ctx.app)
      .get('/api/auth/me')
      .set('Authorization', `Bearer ${res.body.token}`);
    expect(me.status).toBe(200);
    expect(me.body.email).toBe('engineer@test.rhotrace.example');
  });

  it('answers a wrong e-mail and a wrong password with the same 401', async () => {
    const wrongEmail = await login('nobody@test.rhotrace.example', TEST_PASSWORD);
    const wrongPassword = await login('physicist@test.rhotrace.example', 'not-the-password');
    expect(wrongEmail.status).toBe(401);
    expect(wrongPassword.status).toBe(401);
    expect(wrongEmail.body).toEqual(wrongPassword.body);
    expect(wrongEmail.body.error.message).toBe(SIGN_IN_FAILED);
  });

  it('validates the sign-in body', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/login')
      .send({ email: 42, password: TEST_PASSWORD, remember: true });
    expect(res.status).toBe(400);
    const fields = res.body.error.details.map((d: { field: string }) => d.field);
    expect(fields).toEqual(expect.arrayContaining(['body.email', 'body.remember']));
  });

  it('refreshes a valid token into a new one that works', async () => {
    const res = await request(ctx.app).post('/api/auth/refresh').set(ctx.auth('manager'));
    expect(res.status).toBe(200);
    expect(res.body.user.role).toBe('manager');
    const me = await request(ctx.app)
      .get('/api/auth/me')
      .set('Authorization', `Bearer ${res.body.token}`);
    expect(me.status).toBe(200);
    expect((await request(ctx.app).post('/api/auth/refresh')).status).toBe(401);
  });

  it('refuses tampered, expired, unsigned, alg-none and foreign-key tokens with 401', async () => {
    const good = ctx.auth('admin').Authorization.slice('Bearer '.length);
    const [h, p, s] = good.split('.');
    const payload = JSON.parse(Buffer.from(p!, 'base64url').toString());
    const forged = Buffer.from(
      JSON.stringify({ ...payload, sub: String(ctx.users.admin.id + 1) }),
    ).toString('base64url');
    const none = Buffer.from(JSON.stringify({ alg: 'none', typ: 'JWT' })).toString('base64url');
    const expired = jwt.sign({ ver: 0 }, ctx.config.jwtSecret, {
      algorithm: 'HS256',
      subject: String(ctx.users.admin.id),
      issuer: 'rhotrace',
      expiresIn: -10,
    });
    const otherSecret = jwt.sign({ ver: 0 }, 'some-other-secret', {
      algorithm: 'HS256',
      subject: String(ctx.users.admin.id),
      issuer: 'rhotrace',
      expiresIn: 600,
    });
    const hs512 = jwt.sign({ ver: 0 }, ctx.config.jwtSecret, {
      algorithm: 'HS512',
      subject: String(ctx.users.admin.id),
      issuer: 'rhotrace',
      expiresIn: 600,
    });
    const tokens = [
      `${h}.${forged}.${s}`,
      `${none}.${p}.`,
      `${h}.${p}.`,
      `${h}.${p}`,
      expired,
      otherSecret,
      hs512,
      'garbage',
    ];
    for (const token of tokens) {
      const res = await request(ctx.app)
        .get('/api/auth/me')
        .set('Authorization', `Bearer ${token}`);
      expect(res.status, token).toBe(401);
      expect(res.body.error.code).toBe('unauthenticated');
    }
    expect((await request(ctx.app).get('/api/auth/me')).status).toBe(401);
    expect((await request(ctx.app).get('/api/auth/me').set('Authorization', good)).status).toBe(
      401,
    );
  });

  it('slows an account after 3 failures, then refuses it for 15 minutes after 10', async () => {
    // The clock stands still, so a slow machine cannot let the 1-second wait pass between calls.
    freezeClock();
    const email = 'technician@test.rhotrace.example';
    for (let i = 1; i <= 3; i++) expect((await login(email, 'wrong-password')).status).toBe(401);
    const slowed = await login(email, TEST_PASSWORD);
    expect(slowed.status).toBe(429);
    expect(Number(slowed.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    expect(slowed.body.error.message).toMatch(/Try again in \d+ seconds/);
    // Let each wait pass (as time would) and keep failing up to the lock.
    for (let i = 4; i <= 10; i++) {
      await SignInThrottle.update({ lockedUntil: null }, { where: {} });
      expect((await login(email, 'wrong-password')).status).toBe(401);
    }
    const locked = await login(email, TEST_PASSWORD);
    expect(locked.status).toBe(429);
    expect(Number(locked.headers['retry-after'])).toBeGreaterThan(14 * 60);
    expect(locked.body.error.message).toMatch(/Try again in 15 minutes/);
    // A different account from the same address is not locked by this one.
    expect((await login('admin@test.rhotrace.example', TEST_PASSWORD)).status).toBe(200);
  });

  it('makes parallel attempts on one account take turns, so a burst cannot skip the count', async () => {
    const email = 'manager@test.rhotrace.example';
    const results = await Promise.all(
      Array.from({ length: 8 }, () => login(email, 'wrong-password')),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([401, 401, 401, 429, 429, 429, 429, 429]);
  });

  it('slows an address that fails across many accounts', async () => {
    freezeClock();
    for (let i = 0; i < 20; i++) {
      expect((await login(`guess${i}@test.rhotrace.example`, 'wrong-password')).status).toBe(401);
    }
    const res = await login('engineer@test.rhotrace.example', TEST_PASSWORD);
    expect(res.status).toBe(429);
    expect(res.headers['retry-after']).toBeDefined();
  });

  it('clears an account’s failures after a successful sign-in', async () => {
    const email = 'physicist@test.rhotrace.example';
    for (let i = 0; i < 2; i++) await login(email, 'wrong-password');
    expect((await login(email, TEST_PASSWORD)).status).toBe(200);
    for (let i = 0; i < 2; i++) expect((await login(email, 'wrong-password')).status).toBe(401);
    expect((await login(email, TEST_PASSWORD)).status).toBe(200);
  });

  it('stops a deactivated account from signing in and ends its sessions', async () => {
    const { user, header } = await ctx.addUser('engineer');
    expect((await request(ctx.app).get('/api/auth/me').set(header)).status).toBe(200);
    const off = await request(ctx.app)
      .patch(`/api/users/${user.id}`)
      .set(ctx.auth('admin'))
      .send({ active: false });
    expect(off.status).toBe(200);
    expect(off.body.active).toBe(false);
    expect((await request(ctx.app).get('/api/auth/me').set(header)).status).toBe(401);
    // A correct password is told the account is deactivated; a wrong one learns nothing new.
    const again = await login(user.email, TEST_PASSWORD);
    expect(again.status).toBe(401);
    expect(again.body.error.message).toBe(ACCOUNT_DEACTIVATED);
    const guess = await login(user.email, 'not-the-password-1');
    expect(guess.status).toBe(401);
    expect(guess.body.error.message).toBe(SIGN_IN_FAILED);
  });

  describe('password reset', () => {
    async function resetLink(email: string): Promise<string> {
      const before = ctx.mailbox.length;
      const res = await request(ctx.app).post('/api/auth/password-reset').send({ email });
      expect(res.status).toBe(202);
      const message = await waitFor(() =>
        ctx.mailbox.slice(before).find((m) => m.to.includes(email)),
      );
      const parsed = await simpleParser(message.raw);
      expect(parsed.html).toContain('reset-password?token=');
      const link = /https?:\/\/\S+\/reset-password\?token=([A-Za-z0-9_-]+)/.exec(parsed.text ?? '');
      expect(link?.[0].startsWith(`${ctx.config.publicUrl}/reset-password?token=`)).toBe(true);
      return decodeURIComponent(link![1]!);
    }

    it('e-mails a single-use link that changes the password and ends old sessions', async () => {
      const { user, header } = await ctx.addUser('physicist');
      const token = await resetLink(user.email);
      const stored = await PasswordReset.findOne({ where: { userId: user.id } });
      expect(stored?.tokenSha256).toMatch(/^[0-9a-f]{64}$/);
      expect(stored?.tokenSha256).not.toContain(token);
      const ok = await request(ctx.app)
        .post('/api/auth/password-reset/confirm')
        .send({ token, password: 'a-brand-new-secret' });
      expect(ok.status).toBe(204);
      expect((await request(ctx.app).get('/api/auth/me').set(header)).status).toBe(401);
      expect((await login(user.email, TEST_PASSWORD)).status).toBe(401);
      expect((await login(user.email, 'a-brand-new-secret')).status).toBe(200);
      const reused = await request(ctx.app)
        .post('/api/auth/password-reset/confirm')
        .send({ token, password: 'yet-another-secret' });
      expect(reused.status).toBe(400);
      expect((await login(user.email, 'a-brand-new-secret')).status).toBe(200);
    });

    it('refuses an expired link and a too-short password', async () => {
      const { user } = await ctx.addUser('engineer');
      const token = await resetLink(user.email);
      const short = await request(ctx.app)
        .post('/api/auth/password-reset/confirm')
        .send({ token, password: 'short' });
      expect(short.status).toBe(400);
      expect(short.body.error.details[0].field).toBe('body.password');
      await PasswordReset.update(
        { expiresAt: new Date(Date.now() - 1000) },
        { where: { userId: user.id } },
      );
      const late = await request(ctx.app)
        .post('/api/auth/password-reset/confirm')
        .send({ token, password: 'long-enough-secret' });
      expect(late.status).toBe(400);
      expect(late.body.error.message).toMatch(/not valid any more/);
      expect((await login(user.email, TEST_PASSWORD)).status).toBe(200);
    });

    it('answers 202 for unknown addresses without sending anything', async () => {
      const before = ctx.mailbox.length;
      const res = await request(ctx.app)
        .post('/api/auth/password-reset')
        .send({ email: 'stranger@test.rhotrace.example' });
      expect(res.status).toBe(202);
      await new Promise((r) => setTimeout(r, 200));
      expect(
        ctx.mailbox.slice(before).some((m) => m.to.includes('stranger@test.rhotrace.example')),
      ).toBe(false);
    });

    it('limits reset requests per address and e-mail with 429 and Retry-After', async () => {
      const email = 'limit-me@test.rhotrace.example';
      for (let i = 0; i < 5; i++) {
        expect(
          (await request(ctx.app).post('/api/auth/password-reset').send({ email })).status,
        ).toBe(202);
      }
      const res = await request(ctx.app).post('/api/auth/password-reset').send({ email });
      expect(res.status).toBe(429);
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
      expect(res.body.error.code).toBe('too_many_requests');
    });
  });
});
