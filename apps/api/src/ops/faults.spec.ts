import { spawn, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import mariadb from 'mariadb';
import { Transaction } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REPO_ROOT } from '../config';
import { makeWafer } from '../sweeps/sweep-test-helpers';
import { freePortsForTest } from '../testing/free-port';
import { PrivateDatabase } from '../testing/private-database';
import { fourPointCsv } from '../testing/sweep-files';
import { createTestContext, type TestContext } from '../testing/test-context';

/** Count and a checksum of every stored point, to prove committed sweeps survive a crash. */
async function pointDigest(
  ctx: TestContext,
): Promise<{ sweeps: number; points: number; sum: number }> {
  const [[row]] = (await ctx.sequelize.query(
    'SELECT (SELECT COUNT(*) FROM sweeps) AS sweeps, COUNT(*) AS points, ' +
      'COALESCE(SUM(CRC32(CONCAT(sweep_id, ":", sequence, ":", temperature_k, ":", resistivity_ohm_cm))), 0) AS sum FROM sweep_points',
  )) as [Array<{ sweeps: number; points: number; sum: number }>, unknown];
  return { sweeps: Number(row!.sweeps), points: Number(row!.points), sum: Number(row!.sum) };
}

/** Signals a process started with `detached: true` together with its children. */
function killGroup(child: ChildProcess, signal: NodeJS.Signals): void {
  try {
    process.kill(-child.pid!, signal);
  } catch {
    /* already gone */
  }
}

/** Rows of `table` visible to a READ UNCOMMITTED reader, i.e. including uncommitted ones. */
function dirtyCount(ctx: TestContext, table: string): Promise<number> {
  return ctx.sequelize.transaction(
    { isolationLevel: Transaction.ISOLATION_LEVELS.READ_UNCOMMITTED },
    async (transaction) => {
      const [rows] = (await ctx.sequelize.query(`SELECT COUNT(*) AS n FROM ${table}`, {
        transaction,
      })) as [Array<{ n: number }>, unknown];
      return Number(rows[0]!.n);
    },
  );
}

/** Statements of the application's user now running an INSERT into `table` (waiting included). */
async function waitingInserts(ctx: TestContext, table: string): Promise<number> {
  // Sequelize quotes the table name; hand-written SQL may not
  const [rows] = (await ctx.sequelize.query(
    'SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE INFO LIKE ? OR INFO LIKE ?',
    { replacements: [`INSERT INTO \`${table}\`%`, `INSERT INTO ${table} %`] },
  )) as [Array<{ n: number }>, unknown];
  return Number(rows[0]!.n);
}

/**
 * Locks `table` against writes from a connection of the test's own, so that a transaction that
 * writes to it waits there, open, until the lock ends (or the database dies).
 */
async function holdTable(ctx: TestContext, table: string): Promise<mariadb.Connection> {
  const { host, port, user, password, name } = ctx.config.db;
  const holder = await mariadb.createConnection({ host, port, user, password, database: name });
  holder.on('error', () => undefined); // killing the database drops this connection too
  await holder.query(`LOCK TABLES ${table} WRITE`);
  return holder;
}

/** `SELECT COUNT(*)` of a table as a number. */
async function countRows(ctx: TestContext, table: string): Promise<number> {
  const [rows] = (await ctx.sequelize.query(`SELECT COUNT(*) AS n FROM ${table}`)) as [
    Array<{ n: number }>,
    unknown,
  ];
  return Number(rows[0]?.n ?? 0);
}

async function waitFor(check: () => Promise<boolean>, timeoutMs: number): Promise<boolean> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (await check().catch(() => false)) return true;
    await new Promise((r) => setTimeout(r, 20));
  }
  return false;
}

describe('faults: the database killed under a running API', () => {
  const db = new PrivateDatabase();
  let ctx: TestContext;
  let waferId: number;
  beforeAll(async () => {
    await db.start();
    ctx = await createTestContext({}, db.env);
    waferId = (await makeWafer({ thicknessCm: 0.05, diameterCm: 10 })).id;
  }, 120_000);
  afterAll(async () => {
    await ctx?.close().catch(() => undefined);
    db.stop();
  });

  const upload = (file: Buffer) =>
    request(ctx.app)
      .post(`/api/wafers/${waferId}/sweeps`)
      .set(ctx.auth('engineer'))
      .field('method', 'four-point')
      .field('spacingCm', '0.1')
      .attach('file', file, 'sweep.csv');

  /**
   * Sends a request whose transaction ends with an audit event, with the audit table held: once
   * `written()` (its rows are in, uncommitted) and its audit insert waits, the database is killed.
   * The request must answer 503 with a retry hint.
   */
  async function killInsideTransaction(
    send: () => PromiseLike<request.Response>,
    written: () => Promise<boolean>,
  ): Promise<void> {
    const holder = await holdTable(ctx, 'audit_events');
    const pending = Promise.resolve(send());
    const inside = await waitFor(
      async () => (await written()) && (await waitingInserts(ctx, 'audit_events')) === 1,
      60_000,
    );
    if (!inside) await holder.end(); // let the request finish before the test fails
    expect(inside).toBe(true);
    db.kill();
    const res = await pending;
    await holder.end().catch(() => undefined);
    expect(res.status).toBe(503);
    expect(res.headers['retry-after']).toBeDefined();
    expect(res.body.error.code).toBe('unavailable');
    await db.waitUntilGone();
  }

  async function restartDatabase(): Promise<void> {
    await db.start();
    const recovered = await waitFor(
      async () => (await request(ctx.app).get('/api/health')).status === 200,
      30_000,
    );
    expect(recovered).toBe(true);
  }

  it('answers 503 with a retry hint, keeps committed sweeps intact and recovers by itself', async () => {
    const first = await upload(fourPointCsv(2_000, 'committed'));
    expect(first.status).toBe(201);
    const before = await pointDigest(ctx);
    expect(before.points).toBe(2_000);

    // The upload writes every point, then waits on its audit event: the kill lands inside it.
    await killInsideTransaction(
      () => upload(fourPointCsv(20_000, 'killed')),
      async () => (await dirtyCount(ctx, 'sweep_points')) === before.points + 20_000,
    );

    const health = await request(ctx.app).get('/api/health');
    expect(health.status).toBe(503);
    expect(health.body.db).toBe('down');

    await restartDatabase();
    expect(await pointDigest(ctx)).toEqual(before);
    const again = await upload(fourPointCsv(500, 'after recovery'));
    expect(again.status).toBe(201);
  }, 120_000);

  it('fails a fit with 503 when the database dies during it, leaving no fit behind', async () => {
    const stored = await upload(fourPointCsv(400, 'for fit'));
    expect(stored.status).toBe(201);
    const fitsBefore = await countRows(ctx, 'fits');
    const auditBefore = await countRows(ctx, 'audit_events');
    // The fit's transaction writes its row, then waits on its audit event: the kill lands inside.
    await killInsideTransaction(
      () =>
        request(ctx.app)
          .post(`/api/sweeps/${stored.body.id}/fits`)
          .set(ctx.auth('physicist'))
          .send({
            kind: 'arrhenius',
            minK: 100,
            maxK: 400,
            quantity: 'resistivity',
            prefactorExponent: 0,
          }),
      async () => (await dirtyCount(ctx, 'fits')) === fitsBefore + 1,
    );
    await restartDatabase();
    // Crash recovery rolled the open transaction back: neither the fit nor its audit event stayed.
    expect(await countRows(ctx, 'fits')).toBe(fitsBefore);
    expect(await countRows(ctx, 'audit_events')).toBe(auditBefore);
  }, 120_000);
});

describe('faults and scale-out: API processes', () => {
  const db = new PrivateDatabase();
  let ctx: TestContext;
  let waferId: number;
  const processes: ChildProcess[] = [];

  async function startApi(): Promise<{ url: string; child: ChildProcess }> {
    const [port, smtpPort] = await freePortsForTest(2);
    const child = spawn(join(REPO_ROOT, 'node_modules/.bin/tsx'), ['apps/api/src/main.ts'], {
      cwd: REPO_ROOT,
      env: {
        ...process.env,
        ...db.env,
        DB_NAME: ctx.config.db.name,
        PORT: String(port),
        DATA_DIR: db.dataDir,
        JWT_SECRET: ctx.config.jwtSecret,
        SMTP_PORT: String(smtpPort),
        LOG_LEVEL: 'silent',
      },
      stdio: 'ignore',
      // its own process group: tsx runs the server in a child process, and both must go
      detached: true,
    });
    processes.push(child);
    const url = `http://127.0.0.1:${port}`;
    const up = await waitFor(async () => (await fetch(`${url}/api/health`)).ok, 30_000);
    if (!up) throw new Error('API process did not start');
    return { url, child };
  }

  beforeAll(async () => {
    await db.start();
    ctx = await createTestContext({}, db.env);
    waferId = (await makeWafer({ thicknessCm: 0.05, diameterCm: 10 })).id;
  }, 120_000);
  afterAll(async () => {
    for (const p of processes) killGroup(p, 'SIGKILL');
    await ctx?.close().catch(() => undefined);
    db.stop();
  });

  const post = (url: string, file: Buffer) => {
    const form = new FormData();
    form.set('method', 'four-point');
    form.set('spacingCm', '0.1');
    form.set('file', new Blob([file]), 'sweep.csv');
    return fetch(`${url}/api/wafers/${waferId}/sweeps`, {
      method: 'POST',
      body: form,
      headers: ctx.auth('engineer'),
    });
  };

  it('two API processes over one database take concurrent uploads without conflict', async () => {
    const [a, b] = await Promise.all([startApi(), startApi()]);
    const before = await pointDigest(ctx);
    const responses = await Promise.all(
      Array.from({ length: 12 }, (_, i) =>
        post(i % 2 ? a!.url : b!.url, fourPointCsv(1_000, `two-${i}`)),
      ),
    );
    const bodies = await Promise.all(responses.map((r) => r.json() as Promise<{ id: number }>));
    expect(responses.map((r) => r.status)).toEqual(Array(12).fill(201));
    expect(new Set(bodies.map((x) => x.id)).size).toBe(12);
    const after = await pointDigest(ctx);
    expect(after.sweeps - before.sweeps).toBe(12);
    expect(after.points - before.points).toBe(12_000);
    killGroup(a!.child, 'SIGTERM');
    killGroup(b!.child, 'SIGTERM');
  }, 120_000);

  it('an API process killed mid-upload leaves no half-stored sweep, and a restarted one works', async () => {
    const first = await startApi();
    const before = await pointDigest(ctx);
    const rawBefore = await countRows(ctx, 'raw_files');
    const pending = post(first.url, fourPointCsv(60_000, 'api-killed')).then(
      (r) => r.status,
      () => 'aborted',
    );
    // Kill the API process while its upload transaction has rows written but not committed.
    expect(
      await waitFor(async () => (await dirtyCount(ctx, 'sweep_points')) > before.points, 30_000),
    ).toBe(true);
    killGroup(first.child, 'SIGKILL');
    expect(await pending).toBe('aborted');
    // MariaDB sees the dropped connection and rolls back: even a dirty read finds no extra point.
    expect(
      await waitFor(async () => (await dirtyCount(ctx, 'sweep_points')) === before.points, 30_000),
    ).toBe(true);
    expect(await pointDigest(ctx)).toEqual(before);
    const rawAfter = await countRows(ctx, 'raw_files');
    expect(Number(rawAfter)).toBe(Number(rawBefore));
    const second = await startApi();
    const res = await post(second.url, fourPointCsv(500, 'after restart'));
    expect(res.status).toBe(201);
    killGroup(second.child, 'SIGTERM');
  }, 120_000);
});
