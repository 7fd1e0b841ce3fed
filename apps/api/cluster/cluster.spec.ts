/**
 * `npm test -- cluster`: Rhotrace on a three-node Galera cluster with two API instances and raw
 * files in S3 (s3rver), under load, while one database node and one API instance are SIGKILLed
 * and restarted. Checks that nothing answered 201 is lost or doubled, nothing refused is stored,
 * the node rejoins and every node ends with the same rows.
 */
import bcrypt from 'bcryptjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { connectDatabase } from '../src/db/database';
import { migrator } from '../src/db/migrator';
import { makeWafer } from '../src/sweeps/sweep-test-helpers';
import { User } from '../src/users/user.model';
import { ApiInstance, GaleraCluster, S3StandIn, freePort } from './cluster-harness';
import { postEverywhere, seedStationPost, type StationSetup } from './cluster-station-post';
import {
  POINTS_PER_FILE,
  emptyTally,
  failedReads,
  runClient,
  signIn,
  type Tally,
} from './cluster-load';

const CLIENTS = 8;
const LOAD_S = Number(process.env.CLUSTER_LOAD_SECONDS ?? 60);
const PASSWORD = 'cluster-suite-password';
const EMAIL = 'cluster-engineer@rhotrace.example';

const cluster = new GaleraCluster();
const s3 = new S3StandIn();
let a: ApiInstance;
let b: ApiInstance;
const tally: Tally = emptyTally();
const figures: Record<string, number | string> = {};
let waferIds: number[] = [];
let stationSetup: StationSetup;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function allSynced(timeoutMs: number): Promise<string> {
  const until = Date.now() + timeoutMs;
  let last = '';
  while (Date.now() < until) {
    last = await cluster.script('status').catch((e: { stdout?: string }) => e.stdout ?? '');
    const lines = last.trim().split('\n');
    if (lines.length === 3 && lines.every((l) => /cluster_size=3 state=Synced/.test(l)))
      return last;
    await sleep(500);
  }
  return last;
}

beforeAll(async () => {
  const t0 = Date.now();
  await Promise.all([cluster.start(), s3.start()]);
  figures['cluster start s'] = ((Date.now() - t0) / 1000).toFixed(1);
  const sequelize = connectDatabase(
    {
      host: '127.0.0.1',
      port: cluster.db.ports[0]!,
      hosts: [1, 2, 3].map((n) => ({ host: '127.0.0.1', port: cluster.db.ports[n - 1]! })),
      name: cluster.db.name,
      user: cluster.db.user,
      password: cluster.db.password,
    },
    { poolMax: 2 },
  );
  await migrator(sequelize).up();
  const engineer = await User.create({
    email: EMAIL,
    name: 'Cluster Engineer',
    role: 'engineer',
    passwordHash: await bcrypt.hash(PASSWORD, 10),
  });
  waferIds = [
    (await makeWafer({ thicknessCm: 0.05 })).id,
    (await makeWafer({ thicknessCm: 0.05 })).id,
  ];
  stationSetup = await seedStationPost(engineer.id);
  await sequelize.close();

  const shared = {
    ...s3.env,
    DB_NAME: cluster.db.name,
    DB_USER: cluster.db.user,
    DB_PASSWORD: cluster.db.password,
    JWT_SECRET: 'cluster-suite-secret-'.padEnd(64, 'x'),
    SIGN_IN_LIMIT: '100000',
  };
  a = new ApiInstance('A', await freePort(), {
    ...shared,
    DB_HOSTS: cluster.hosts([1, 2, 3]),
    SMTP_PORT: String(await freePort()),
  });
  b = new ApiInstance('B', await freePort(), {
    ...shared,
    DB_HOSTS: cluster.hosts([2, 3, 1]),
    SMTP_PORT: String(await freePort()),
  });
  await Promise.all([a.start(), b.start()]);
  const token = await signIn(a, EMAIL, PASSWORD);

  const startedMs = Date.now();
  const untilMs = startedMs + LOAD_S * 1000;
  const at = (s: number) => sleep(Math.max(0, startedMs + s * 1000 - Date.now()));
  const faults = (async () => {
    await at(LOAD_S * 0.15);
    const killedAt = Date.now();
    await cluster.script('kill', '2');
    figures['node 2 killed at s'] = ((killedAt - startedMs) / 1000).toFixed(1);
    await at(LOAD_S * 0.3);
    const restartAt = Date.now();
    await cluster.script('restart', '2');
    figures['node 2 rejoin s'] = ((Date.now() - restartAt) / 1000).toFixed(1);
    // B connects to node 2 first, A to node 1: B must fail over, A only waits out the view change
    for (const name of ['A', 'B'])
      figures[`${name}: reads failed in the 10 s after the node kill`] = failedReads(
        tally,
        name,
        killedAt - startedMs,
        10_000,
      );
    await at(LOAD_S * 0.6);
    b.kill();
    figures['API B killed at s'] = ((Date.now() - startedMs) / 1000).toFixed(1);
    await at(LOAD_S * 0.68);
    figures['API B restart ms'] = await b.start();
  })();
  const clients = Array.from({ length: CLIENTS }, (_, index) =>
    runClient({ index, targets: [a, b], token, waferIds, untilMs, startedMs, tally }),
  );
  await Promise.all([...clients, faults]);
  figures['load s'] = ((Date.now() - startedMs) / 1000).toFixed(1);
}, 300_000);

afterAll(async () => {
  await a?.stop();
  await b?.stop();
  await cluster.stop();
  await s3.stop();
  console.log('\n[cluster] figures');
  console.log(`  requests ${tally.requests}, client retries ${tally.clientRetries}`);
  console.log(`  answers by status ${JSON.stringify(tally.byStatus)}`);
  for (const [kind, counts] of Object.entries(tally.byKind))
    console.log(`  ${kind.padEnd(10)} ${JSON.stringify(counts)}`);
  for (const [key, value] of Object.entries(figures)) console.log(`  ${key}: ${value}`);
}, 120_000);

const rowsBySha = async (sha: string) =>
  cluster.query<{ id: number; point_count: number; n: number }>(
    1,
    'SELECT s.id, s.point_count, (SELECT COUNT(*) FROM sweep_points p WHERE p.sweep_id = s.id) AS n ' +
      'FROM sweeps s WHERE s.sha256 = ?',
    [sha],
  );

describe('Rhotrace on a Galera cluster with node and instance failures', () => {
  it('rejoins the killed node: three nodes synced at the end', async () => {
    const status = await allSynced(60_000);
    expect(status).toMatch(/node2 .*cluster_size=3 state=Synced/);
    expect(
      status
        .trim()
        .split('\n')
        .filter((l) => /state=Synced/.test(l)),
    ).toHaveLength(3);
  });

  it('did real work: uploads were answered 201 through both instances', () => {
    const created = tally.uploads.flatMap((u) => u.attempts).filter((x) => x.status === 201);
    expect(created.length).toBeGreaterThan(20);
    expect(new Set(created.map((x) => x.instance))).toEqual(new Set(['A', 'B']));
  });

  it('never answered 500, and refused no upload as malformed', () => {
    expect(tally.byStatus['500'] ?? 0).toBe(0);
    expect(tally.byKind.upload?.['400'] ?? 0).toBe(0);
  });

  it('stores every upload answered 201 exactly once, with all its points', async () => {
    for (const u of tally.uploads) {
      const ok = u.attempts.find((x) => x.status === 201);
      if (!ok) continue;
      const rows = await rowsBySha(u.sha256);
      expect(rows, `sweep ${ok.sweepId}`).toHaveLength(1);
      expect(rows[0]).toEqual({ id: ok.sweepId, point_count: POINTS_PER_FILE, n: POINTS_PER_FILE });
    }
  });

  it('stores nothing for an upload refused with an answer; a lost answer shows as 409', async () => {
    for (const u of tally.uploads) {
      const rows = await rowsBySha(u.sha256);
      const answered201 = u.attempts.some((x) => x.status === 201);
      const conflictAfterLostAnswer = u.attempts.some(
        (x, i) => x.status === 409 && u.attempts[i - 1]?.status === 0,
      );
      // a 503 promised nothing was stored: a retry must never meet the file already there
      const conflictAfter503 = u.attempts.some(
        (x, i) => x.status === 409 && u.attempts[i - 1]?.status === 503,
      );
      expect(conflictAfter503, JSON.stringify(u.attempts)).toBe(false);
      if (answered201 || conflictAfterLostAnswer) expect(rows).toHaveLength(1);
      else if (u.attempts.every((x) => x.status !== 0)) expect(rows).toHaveLength(0);
      else expect(rows.length).toBeLessThanOrEqual(1);
    }
  });

  it('keeps no audit event of a sweep that is not stored, and one per stored sweep', async () => {
    const orphans = await cluster.query<{ n: number }>(
      1,
      "SELECT COUNT(*) AS n FROM audit_events e WHERE e.entity = 'sweep' AND e.action = 'create' " +
        'AND NOT EXISTS (SELECT 1 FROM sweeps s WHERE s.id = e.entity_id)',
    );
    expect(orphans[0]!.n).toBe(0);
    const doubled = await cluster.query<{ n: number }>(
      1,
      "SELECT COUNT(*) AS n FROM (SELECT entity_id FROM audit_events WHERE entity = 'sweep' " +
        "AND action = 'create' GROUP BY entity_id HAVING COUNT(*) > 1) d",
    );
    expect(doubled[0]!.n).toBe(0);
  });

  it('stores one sweep for one Idempotency-Key posted to both instances (two nodes) at once', async () => {
    const answers = await postEverywhere(stationSetup, [a.url, b.url]);
    // the loser waits for the winner's row, or (its node not yet holding it) answers 409
    expect(answers.every((x) => x.status === 201 || x.status === 409)).toBe(true);
    const stored = answers.filter((x) => x.status === 201);
    expect(stored.length).toBeGreaterThan(0);
    expect(new Set(stored.map((x) => x.id)).size).toBe(1);
    const rows = await cluster.query<{ id: number }>(
      1,
      'SELECT id FROM sweeps WHERE wafer_id = ?',
      [stationSetup.waferId],
    );
    expect(rows.map((r) => r.id)).toEqual([stored[0]!.id]);
  });

  it('reads every stored sweep back from both instances', async () => {
    const token = await signIn(b, EMAIL, PASSWORD);
    const ids = tally.uploads
      .flatMap((u) => u.attempts)
      .filter((x) => x.status === 201)
      .map((x) => x.sweepId!);
    for (const instance of [a, b]) {
      for (const id of ids.slice(-25)) {
        const res = await fetch(`${instance.url}/api/sweeps/${id}`, {
          headers: { authorization: `Bearer ${token}` },
        });
        expect(res.status, `${instance.name} sweep ${id}`).toBe(200);
      }
    }
  });

  it('ends with identical row checksums per table on every node', async () => {
    const tables = (
      await cluster.query<{ t: string }>(
        1,
        'SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE()',
      )
    ).map((r) => r.t);
    const sums = async (node: number) => {
      const rows = await cluster.query<{ Table: string; Checksum: number }>(
        node,
        `CHECKSUM TABLE ${tables.map((t) => `\`${t}\``).join(', ')}`,
      );
      return Object.fromEntries(rows.map((r) => [r.Table, r.Checksum]));
    };
    let last: Array<Record<string, number>> = [];
    for (let i = 0; i < 20; i += 1) {
      last = await Promise.all([1, 2, 3].map(sums));
      if (
        JSON.stringify(last[0]) === JSON.stringify(last[1]) &&
        JSON.stringify(last[1]) === JSON.stringify(last[2])
      )
        break;
      await sleep(500);
    }
    expect(last[1]).toEqual(last[0]);
    expect(last[2]).toEqual(last[0]);
    figures['tables compared'] = tables.length;
  });
});
