/**
 * What the cluster suite runs: a three-node Galera cluster (db/cluster.sh), an S3 stand-in
 * (s3rver) and API instances as separate processes, each pointed at the nodes in its own order.
 */
import { execFile, spawn, type ChildProcess } from 'node:child_process';
import { chmodSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import mariadb from 'mariadb';
// s3rver ships no types; it is the local S3 stand-in for tests only.
// @ts-expect-error no type declarations
import S3rver from 's3rver';
import { REPO_ROOT } from '../src/config';

const run = promisify(execFile);
const CLUSTER = join(REPO_ROOT, 'db/cluster.sh');

/** A port whose next 32 neighbours are free too (a node uses base, +10, +20 and +30). */
async function freeBlock(): Promise<number> {
  const free = (port: number) =>
    new Promise<boolean>((resolve) => {
      const s = createServer();
      s.once('error', () => resolve(false));
      s.listen(port, '127.0.0.1', () => s.close(() => resolve(true)));
    });
  for (let attempt = 0; attempt < 50; attempt += 1) {
    const base = 20_000 + Math.floor(Math.random() * 20_000);
    const ports = [0, 1, 2, 10, 11, 12, 20, 21, 22, 30, 31, 32].map((d) => base + d);
    if ((await Promise.all(ports.map(free))).every(Boolean)) return base;
  }
  throw new Error('no free block of ports for the cluster');
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as { port: number }).port;
      s.close(() => resolve(port));
    });
  });
}

export interface ClusterDb {
  name: string;
  user: string;
  password: string;
  /** SQL ports of nodes 1, 2 and 3. */
  ports: number[];
}

export class GaleraCluster {
  readonly dir = mkdtempSync(join(tmpdir(), 'rhotrace-cluster-'));
  private env: NodeJS.ProcessEnv = {};
  db!: ClusterDb;

  async start(): Promise<void> {
    // the test runner stops a cluster whose owner died (scripts/test.ts, cleanStaleRuns)
    writeFileSync(join(this.dir, 'runner.pid'), String(process.pid));
    chmodSync(this.dir, 0o755); // the servers run as the mysql user when this runs as root
    const base = await freeBlock();
    this.env = { ...process.env, CLUSTER_DIR: this.dir, CLUSTER_BASE_PORT: String(base) };
    await this.script('start');
    const vars = Object.fromEntries(
      readFileSync(join(this.dir, 'db.env'), 'utf8')
        .split('\n')
        .map((l) => /^([A-Z_]+)=(.*)$/.exec(l))
        .filter((m): m is RegExpExecArray => m !== null)
        .map((m) => [m[1]!, m[2]!]),
    );
    this.db = {
      name: vars.DB_NAME!,
      user: vars.DB_USER!,
      password: vars.DB_PASSWORD!,
      ports: [base, base + 1, base + 2],
    };
  }

  /** `DB_HOSTS` listing the nodes in the given order (1-based). */
  hosts(order: number[]): string {
    return order.map((n) => `127.0.0.1:${this.db.ports[n - 1]}`).join(',');
  }

  async script(...args: string[]): Promise<string> {
    const { stdout } = await run('bash', [CLUSTER, ...args], {
      env: this.env,
      timeout: 120_000,
    });
    return stdout;
  }

  /** One query on one node (1-based), on a connection of its own. */
  async query<T>(node: number, sql: string, values?: unknown[]): Promise<T[]> {
    const conn = await mariadb.createConnection({
      host: '127.0.0.1',
      port: this.db.ports[node - 1],
      user: this.db.user,
      password: this.db.password,
      database: this.db.name,
      bigIntAsNumber: true,
      connectTimeout: 5_000,
    });
    try {
      await conn.query('SET SESSION wsrep_sync_wait = 1');
      return (await conn.query(sql, values)) as T[];
    } finally {
      await conn.end();
    }
  }

  async stop(): Promise<void> {
    await this.script('stop').catch(() => undefined);
    rmSync(this.dir, { recursive: true, force: true });
  }
}

export class S3StandIn {
  private readonly dir = mkdtempSync(join(tmpdir(), 'rhotrace-clusters3-'));
  private server: { run: () => Promise<unknown>; close: () => Promise<void> } | null = null;
  env: Record<string, string> = {};

  async start(): Promise<void> {
    const port = await freePort();
    this.server = new S3rver({ port, address: '127.0.0.1', silent: true, directory: this.dir });
    await this.server!.run();
    this.env = {
      RAW_STORAGE: 's3',
      S3_ENDPOINT: `http://127.0.0.1:${port}`,
      S3_BUCKET: 'rhotrace-cluster-raw',
      S3_ACCESS_KEY_ID: 'S3RVER',
      S3_SECRET_ACCESS_KEY: 'S3RVER',
    };
  }

  async stop(): Promise<void> {
    await this.server?.close();
    rmSync(this.dir, { recursive: true, force: true });
  }
}

function signalGroup(pid: number, signal: NodeJS.Signals): void {
  try {
    process.kill(-pid, signal);
  } catch {
    // the group is gone already
  }
}

/** An API process on a port of its own, restartable with the same settings. */
export class ApiInstance {
  private child: ChildProcess | null = null;
  readonly url: string;
  private readonly dataDir: string;

  constructor(
    readonly name: string,
    private readonly port: number,
    private readonly env: Record<string, string>,
  ) {
    this.url = `http://127.0.0.1:${port}`;
    this.dataDir = mkdtempSync(join(tmpdir(), `rhotrace-clusterapi-${name}-`));
    mkdirSync(join(this.dataDir, 'mail'), { recursive: true });
  }

  /** Starts the process and waits for its health route; resolves with the milliseconds taken. */
  async start(): Promise<number> {
    const t0 = Date.now();
    this.child = spawn(join(REPO_ROOT, 'node_modules/.bin/tsx'), ['apps/api/src/main.ts'], {
      cwd: REPO_ROOT,
      env: {
        ...process.env,
        ...this.env,
        PORT: String(this.port),
        DATA_DIR: this.dataDir,
        NODE_ENV: 'production',
        LOG_LEVEL: 'error',
      },
      stdio: ['ignore', 'inherit', 'inherit'],
      // its own process group: tsx runs the server in a child, and a kill must reach both
      detached: true,
    });
    for (let i = 0; i < 240; i += 1) {
      const ok = await fetch(`${this.url}/api/health`).then(
        (r) => r.ok,
        () => false,
      );
      if (ok) return Date.now() - t0;
      await new Promise((r) => setTimeout(r, 250));
    }
    throw new Error(`API instance ${this.name} did not become healthy`);
  }

  /** SIGKILL to the instance's whole process group, as a machine that loses power. */
  kill(): void {
    if (this.child?.pid) signalGroup(this.child.pid, 'SIGKILL');
    this.child = null;
  }

  async stop(): Promise<void> {
    const child = this.child;
    this.child = null;
    if (child?.pid && child.exitCode === null) {
      const exited = new Promise((r) => child.once('exit', r));
      signalGroup(child.pid, 'SIGTERM');
      await Promise.race([exited, new Promise((r) => setTimeout(r, 5_000))]);
      signalGroup(child.pid, 'SIGKILL');
    }
    rmSync(this.dataDir, { recursive: true, force: true });
  }
}
