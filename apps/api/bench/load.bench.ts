/**
 * `npm run bench:load`: 50 concurrent clients for 30 s against an API process on loopback, each
 * looping over sign-in, list lots, read a 1,000-point sweep and upload a 1,000-point file.
 * Prints requests per second, p50/p99 latency per kind and errors, then checks that the database
 * holds exactly the sweeps that were answered 201. Bounded in time and count; loopback only.
 *
 * Needs the DB_* variables of a MariaDB server (`npm run bench` starts a throwaway one).
 */
import { spawn } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import bcrypt from 'bcryptjs';
import { quantile } from 'simple-statistics';
import { loadConfig, REPO_ROOT } from '../src/config';
import { connectDatabase } from '../src/db/database';
import { migrator } from '../src/db/migrator';
import { makeWafer } from '../src/sweeps/sweep-test-helpers';
import { freePortForTest } from '../src/testing/free-port';
import { fourPointCsv } from '../src/testing/sweep-files';
import { User } from '../src/users/user.model';

const CLIENTS = Number(process.env.LOAD_CLIENTS ?? 50);
const DURATION_S = Number(process.env.LOAD_SECONDS ?? 30);
const MAX_REQUESTS = 200_000;
const SIGN_IN_EVERY = Number(process.env.LOAD_SIGN_IN_EVERY ?? 25);
const UPLOAD_EVERY = Number(process.env.LOAD_UPLOAD_EVERY ?? 5);
/** Pause between a client's rounds, as a person or an instrument leaves; 0 hammers back to back. */
const THINK_MS = Number(process.env.LOAD_THINK_MS ?? 1000);
const PASSWORD = 'load-bench-password';
type Kind = 'sign-in' | 'list lots' | 'read sweep' | 'upload';

async function main(): Promise<void> {
  const base = loadConfig();
  const dbName = `${base.db.name}_load`;
  const admin = connectDatabase(base.db, { poolMax: 1 });
  await admin.query(`DROP DATABASE IF EXISTS \`${dbName}\``);
  await admin.query(`CREATE DATABASE \`${dbName}\``);
  await admin.close();
  const sequelize = connectDatabase({ ...base.db, name: dbName }, { poolMax: 4 });
  await migrator(sequelize).up();
  const hash = await bcrypt.hash(PASSWORD, 10);
  const users = await User.bulkCreate(
    Array.from({ length: CLIENTS }, (_, i) => ({
      email: `load${i}@bench.rhotrace.example`,
      name: `Load ${i}`,
      role: 'engineer' as const,
      passwordHash: hash,
    })),
  );
  const wafer = await makeWafer({ thicknessCm: 0.05, diameterCm: 10 });

  const port = await freePortForTest();
  const url = `http://127.0.0.1:${port}`;
  // LOAD_PROFILE_DIR=/some/dir writes a CPU profile of the API process there when it stops
  const profile = process.env.LOAD_PROFILE_DIR;
  const nodeArgs = profile ? ['--cpu-prof', `--cpu-prof-dir=${profile}`] : [];
  const server = spawn(
    join(REPO_ROOT, 'node_modules/.bin/tsx'),
    [...nodeArgs, 'apps/api/src/main.ts'],
    {
      cwd: REPO_ROOT,
      env: {
        ...process.env,
        DB_NAME: dbName,
        PORT: String(port),
        SMTP_PORT: String(await freePortForTest()),
        LOG_LEVEL: 'warn',
        SIGN_IN_LIMIT: '1000000',
        NODE_ENV: 'production',
      },
      stdio: ['ignore', 'inherit', 'inherit'],
      detached: true,
    },
  );
  try {
    for (let i = 0; i < 120; i += 1) {
      if (
        await fetch(`${url}/api/health`).then(
          (r) => r.ok,
          () => false,
        )
      )
        break;
      await new Promise((r) => setTimeout(r, 250));
    }
    const signIn = async (email: string) => {
      const res = await fetch(`${url}/api/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email, password: PASSWORD }),
      });
      return {
        status: res.status,
        token: res.ok ? ((await res.json()) as { token: string }).token : '',
      };
    };
    const upload = (token: string, file: Buffer) => {
      const form = new FormData();
      form.set('method', 'four-point');
      form.set('spacingCm', '0.1');
      form.set('file', new Blob([file]), 'load.csv');
      return fetch(`${url}/api/wafers/${wafer.id}/sweeps`, {
        method: 'POST',
        body: form,
        headers: { authorization: `Bearer ${token}` },
      });
    };
    const { token: seedToken } = await signIn(users[0]!.email);
    const seeded = await upload(seedToken, fourPointCsv(1_000, 'read target'));
    if (seeded.status !== 201)
      throw new Error(`could not store the sweep to read: ${seeded.status} ${await seeded.text()}`);
    const sweepId = ((await seeded.json()) as { id: number }).id;
    const sweepsBefore = await sequelizeCount(sequelize);

    const latencies: Record<Kind, number[]> = {
      'sign-in': [],
      'list lots': [],
      'read sweep': [],
      upload: [],
    };
    const errors: Record<Kind, number> = {
      'sign-in': 0,
      'list lots': 0,
      'read sweep': 0,
      upload: 0,
    };
    let created = 0;
    let total = 0;
    const started = performance.now();
    // this process's own event-loop delay: how much of a latency is the load generator's
    const clientLoop = monitorEventLoopDelay({ resolution: 5 });
    clientLoop.enable();
    const until = Date.now() + DURATION_S * 1000;
    const trace: Array<{ kind: Kind; atMs: number; ms: number }> = [];
    const timed = async (kind: Kind, run: () => Promise<Response>, ok: number) => {
      const t0 = performance.now();
      let status = 0;
      try {
        const res = await run();
        status = res.status;
        await res.arrayBuffer();
      } catch {
        status = -1;
      }
      latencies[kind].push(performance.now() - t0);
      trace.push({ kind, atMs: t0 - started, ms: performance.now() - t0 });
      total += 1;
      if (status !== ok) errors[kind] += 1;
      return status;
    };
    // The mix of a working lab: a client signs in once and again every SIGN_IN_EVERY rounds,
    // reads in every round, and uploads a new sweep every UPLOAD_EVERY rounds.
    const client = async (i: number) => {
      const email = users[i]!.email;
      let token = '';
      // clients arrive spread over the first pause, not all in the same millisecond
      await new Promise((r) => setTimeout(r, Math.random() * THINK_MS));
      for (let round = 0; Date.now() < until && total < MAX_REQUESTS; round += 1) {
        if (round % SIGN_IN_EVERY === 0) {
          await timed(
            'sign-in',
            async () => {
              const res = await fetch(`${url}/api/auth/login`, {
                method: 'POST',
                headers: { 'content-type': 'application/json' },
                body: JSON.stringify({ email, password: PASSWORD }),
              });
              if (res.ok) token = ((await res.clone().json()) as { token: string }).token;
              return res;
            },
            200,
          );
        }
        const auth = { authorization: `Bearer ${token}` };
        await timed(
          'list lots',
          () => fetch(`${url}/api/lots?page=1&pageSize=25`, { headers: auth }),
          200,
        );
        await timed(
          'read sweep',
          () => fetch(`${url}/api/sweeps/${sweepId}`, { headers: auth }),
          200,
        );
        if (round % UPLOAD_EVERY === UPLOAD_EVERY - 1) {
          const status = await timed(
            'upload',
            () => upload(token, fourPointCsv(1_000, `load ${i}`)),
            201,
          );
          if (status === 201) created += 1;
        }
        if (THINK_MS > 0) await new Promise((r) => setTimeout(r, THINK_MS * (0.5 + Math.random())));
      }
    };
    await Promise.all(Array.from({ length: CLIENTS }, (_, i) => client(i)));
    const seconds = (performance.now() - started) / 1000;
    clientLoop.disable();
    const stored = (await sequelizeCount(sequelize)) - sweepsBefore;

    const figures: Array<{
      name: string;
      value: number;
      unit: string;
      target: string;
      pass: boolean;
    }> = [];
    console.log(
      `\n${CLIENTS} clients, ${seconds.toFixed(1)} s, ${total} requests, ${(total / seconds).toFixed(0)} requests/s`,
    );
    figures.push({
      name: 'throughput',
      value: total / seconds,
      unit: 'requests/s',
      target: 'reported',
      pass: true,
    });
    for (const kind of Object.keys(latencies) as Kind[]) {
      const l = latencies[kind];
      const p50 = l.length ? quantile(l, 0.5) : 0;
      const p99 = l.length ? quantile(l, 0.99) : 0;
      const isRead = kind === 'list lots' || kind === 'read sweep';
      console.log(
        `${kind.padEnd(11)} n=${l.length} p50 ${p50.toFixed(1)} ms  p99 ${p99.toFixed(1)} ms  errors ${errors[kind]}${isRead ? '  (target p99 < 100 ms)' : ''}`,
      );
      figures.push({ name: `${kind} p50`, value: p50, unit: 'ms', target: 'reported', pass: true });
      figures.push({
        name: `${kind} p99`,
        value: p99,
        unit: 'ms',
        target: isRead ? '< 100 ms' : 'reported',
        pass: isRead ? p99 < 100 : true,
      });
    }
    const loopP99 = clientLoop.percentile(99) / 1e6;
    console.log(
      `load generator event-loop delay p99 ${loopP99.toFixed(1)} ms (part of every latency above)`,
    );
    figures.push({
      name: 'load generator event-loop delay p99',
      value: loopP99,
      unit: 'ms',
      target: 'reported',
      pass: true,
    });
    const errorCount = Object.values(errors).reduce((a, b) => a + b, 0);
    console.log(
      `errors ${errorCount}; uploads answered 201: ${created}; new sweeps stored: ${stored}`,
    );
    figures.push({
      name: 'errors',
      value: errorCount,
      unit: 'responses',
      target: '0',
      pass: errorCount === 0,
    });
    figures.push({
      name: 'lost or duplicated sweeps',
      value: Math.abs(stored - created),
      unit: 'sweeps',
      target: '0',
      pass: stored === created,
    });
    const out = join(REPO_ROOT, 'bench/out');
    mkdirSync(out, { recursive: true });
    writeFileSync(join(out, 'load.json'), JSON.stringify(figures, null, 2));
    // every request with its start (ms from the first client) and latency, to find where a tail is
    writeFileSync(
      join(out, 'load-trace.ndjson'),
      trace.map((r) => JSON.stringify(r)).join('\n') + '\n',
    );
  } finally {
    process.kill(-server.pid!, 'SIGTERM');
    await sequelize.query(`DROP DATABASE IF EXISTS \`${dbName}\``).catch(() => undefined);
    await sequelize.close();
  }
}

async function sequelizeCount(sequelize: ReturnType<typeof connectDatabase>): Promise<number> {
  const [rows] = (await sequelize.query('SELECT COUNT(*) AS n FROM sweeps')) as [
    Array<{ n: number }>,
    unknown,
  ];
  return Number(rows[0]?.n ?? 0);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
