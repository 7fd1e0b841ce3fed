/**
 * Analysis benchmark (issue 6): `POST /api/model/curve` with 2,000 steps and an Arrhenius fit
 * (`POST /api/sweeps/:id/fits`) on a stored 10,000-point sweep, each timed end to end over HTTP
 * on loopback against an in-process API; p50 and p99 over repeated calls. Target p99 < 50 ms.
 * Prints the figures and writes bench/out/analysis.json (path from this file's location).
 *
 * Needs the DB_* variables of a MariaDB server (`npm run bench` starts a throwaway one).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { fileURLToPath } from 'node:url';
import { BOLTZMANN_EV_PER_K, resistivity } from '@rhotrace/physics';
import { quantile } from 'simple-statistics';
import { seededNormal } from '../src/analysis/testing/fixtures';
import { makeLot, makeSweep } from '../src/analysis/testing/fixtures';
import { createApp } from '../src/app';
import { signToken } from '../src/auth/token.service';
import { loadConfig } from '../src/config';
import { connectDatabase } from '../src/db/database';
import { migrator } from '../src/db/migrator';
import { createLogger } from '../src/logger';
import { Mailer } from '../src/mail/mailer.service';
import { User } from '../src/users/user.model';

const WARMUP = 10;
const CALLS = Number(process.env.ANALYSIS_BENCH_CALLS ?? 200);
const TARGET_P99_MS = 50;
const OUT = fileURLToPath(new URL('../../../bench/out/analysis.json', import.meta.url));

interface Figure {
  name: string;
  value: number;
  unit: string;
  target: string;
  pass: boolean;
}

async function timeCalls(call: () => Promise<Response>, expected: number): Promise<number[]> {
  const times: number[] = [];
  for (let i = 0; i < WARMUP + CALLS; i += 1) {
    const start = performance.now();
    const res = await call();
    await res.arrayBuffer();
    const ms = performance.now() - start;
    if (res.status !== expected) throw new Error(`expected ${expected}, got ${res.status}`);
    if (i >= WARMUP) times.push(ms);
  }
  return times;
}

async function main(): Promise<void> {
  const base = loadConfig();
  const dbName = `${base.db.name}_analysis_bench`;
  const admin = connectDatabase(base.db, { poolMax: 1 });
  await admin.query(`DROP DATABASE IF EXISTS \`${dbName}\``);
  await admin.query(`CREATE DATABASE \`${dbName}\``);
  await admin.close();
  const config = { ...base, db: { ...base.db, name: dbName } };
  const sequelize = connectDatabase(config.db, { poolMax: 4 });
  await migrator(sequelize).up();
  const mailer = new Mailer(config.smtp);
  const app = createApp({ config, sequelize, mailer, logger: createLogger('silent') });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api`;

  try {
    const user = await User.create({
      email: 'analysis-bench@bench.rhotrace.example',
      name: 'Analysis Bench',
      role: 'engineer',
      passwordHash: 'not-used',
    });
    const headers = {
      Authorization: `Bearer ${signToken(user, config.jwtSecret, config.tokenTtlS).token}`,
      'Content-Type': 'application/json',
    };
    // A 10,000-point continuous ramp, 20-800 K, from the model with 0.5 % seeded noise.
    const normal = seededNormal(42);
    const doping = { donorDensity: 1e15, acceptorDensity: 0 };
    const points = Array.from({ length: 10_000 }, (_, i) => {
      const t = 20 + (780 * i) / 9_999;
      return {
        temperatureK: t,
        resistivityOhmCm: resistivity('Si', doping, t) * (1 + 0.005 * normal()),
      };
    });
    const { wafers } = await makeLot({ material: 'Si', dopant: 'P' });
    const sweep = await makeSweep(wafers[0]!.id, user.id, points, 'bench-10k.csv');

    const curveBody = JSON.stringify({ material: 'Si', doping, fromK: 10, toK: 1000, steps: 2000 });
    const curve = await timeCalls(
      () => fetch(`${url}/model/curve`, { method: 'POST', headers, body: curveBody }),
      200,
    );
    const fitBody = JSON.stringify({
      kind: 'arrhenius',
      minK: 600,
      maxK: 800,
      regime: 'intrinsic',
    });
    const fit = await timeCalls(
      () => fetch(`${url}/sweeps/${sweep.id}/fits`, { method: 'POST', headers, body: fitBody }),
      201,
    );
    const fitCheck = (await (
      await fetch(`${url}/sweeps/${sweep.id}/fits`, { method: 'POST', headers, body: fitBody })
    ).json()) as { goodness: { count: number }; parameters: { activationEnergyEv: number } };
    const suggested = await timeCalls(
      () =>
        fetch(`${url}/sweeps/${sweep.id}/fits`, {
          method: 'POST',
          headers,
          body: JSON.stringify({ kind: 'arrhenius', minK: 600, maxK: 800 }),
        }),
      201,
    );

    const figure = (name: string, times: number[], q: number, gated: boolean): Figure => {
      const value = quantile(times, q);
      return {
        name,
        value,
        unit: 'ms',
        target: gated ? `< ${TARGET_P99_MS}` : 'information',
        pass: gated ? value < TARGET_P99_MS : true,
      };
    };
    const figures: Figure[] = [
      figure('model curve 2000 steps p50', curve, 0.5, false),
      figure('model curve 2000 steps p99', curve, 0.99, true),
      figure('Arrhenius fit, 10000-point sweep p50', fit, 0.5, false),
      figure('Arrhenius fit, 10000-point sweep p99', fit, 0.99, true),
      figure('Arrhenius fit, regime from suggested windows p50', suggested, 0.5, false),
      figure('Arrhenius fit, regime from suggested windows p99', suggested, 0.99, false),
    ];
    console.log(
      `sweep ${sweep.id}: 10000 points; fit window 600-800 K holds ${fitCheck.goodness.count} points, ` +
        `Ea = ${fitCheck.parameters.activationEnergyEv.toFixed(4)} eV (k = ${BOLTZMANN_EV_PER_K} eV/K); ${CALLS} timed calls each`,
    );
    for (const f of figures) {
      console.log(
        `${f.name}: ${f.value.toFixed(2)} ${f.unit} (target ${f.target}) ${f.pass ? 'ok' : 'MISSED'}`,
      );
    }
    mkdirSync(fileURLToPath(new URL('../../../bench/out/', import.meta.url)), { recursive: true });
    writeFileSync(OUT, `${JSON.stringify(figures, null, 2)}\n`);
    console.log(`written to ${OUT}`);
  } finally {
    server.close();
    mailer.close();
    await sequelize.query(`DROP DATABASE IF EXISTS \`${dbName}\``).catch(() => undefined);
    await sequelize.close();
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
