/**
 * `npm start` killed outright: nothing it started may outlive it (the next start would find its
 * ports taken), and a start that finds leftovers of its own data folder says so and names the
 * command that stops them. Each test starts the stack as `npm start` does (npm's `sh -c`, then
 * node running scripts/start.ts; without the web build) on free ports in a temporary data folder.
 */
import { execFileSync, spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { REPO_ROOT } from '../config';
import { freePortsForTest } from '../testing/free-port';

const tsx = join(REPO_ROOT, 'node_modules/.bin/tsx');

interface Stack {
  dataDir: string;
  ports: number[];
  env: NodeJS.ProcessEnv;
  launcher: ChildProcess;
  output: () => string;
}

function alive(id: number): boolean {
  try {
    process.kill(id, 0);
    return true;
  } catch {
    return false;
  }
}

function portFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const server = createServer();
    server.once('error', () => resolve(false));
    server.listen(port, '127.0.0.1', () => server.close(() => resolve(true)));
  });
}

async function waitFor(check: () => boolean | Promise<boolean>, timeoutMs: number) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (await check()) return true;
    await new Promise((r) => setTimeout(r, 100));
  }
  return false;
}

const stacks: Stack[] = [];
/** One data folder for every start here: each test stops its stack, and a second start is faster. */
const dataDir = mkdtempSync(join(tmpdir(), 'rhotrace-lifetime-'));

async function startStack(): Promise<Stack> {
  const [port, dbPort, smtpPort] = await freePortsForTest(3);
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    DATA_DIR: dataDir,
    PORT: String(port),
    DB_PORT: String(dbPort),
    SMTP_PORT: String(smtpPort),
    NODE_ENV: 'production',
    LOG_LEVEL: 'warn',
  };
  // the suite's own database settings would point the API away from the stack's server
  for (const key of ['DB_HOST', 'DB_NAME', 'DB_USER', 'DB_PASSWORD', 'JWT_SECRET']) delete env[key];
  // what `npm start` runs: npm's `sh -c`, then scripts/start.sh's command line
  const command = `"${process.execPath}" --import tsx scripts/start.ts --no-web-build`;
  const launcher = spawn('sh', ['-c', command], {
    cwd: REPO_ROOT,
    env,
    stdio: ['ignore', 'pipe', 'pipe'],
    // a group of its own, as a terminal gives the command it runs (Ctrl-C signals that group)
    detached: true,
  });
  let output = '';
  launcher.stdout!.on('data', (c: Buffer) => (output += c.toString()));
  launcher.stderr!.on('data', (c: Buffer) => (output += c.toString()));
  const stack = {
    dataDir,
    ports: [port!, dbPort!, smtpPort!],
    env,
    launcher,
    output: () => output,
  };
  stacks.push(stack);
  const up = await waitFor(async () => {
    const res = await fetch(`http://127.0.0.1:${port}/api/health`).catch(() => null);
    return res?.status === 200;
  }, 90_000);
  if (!up) throw new Error(`the stack did not start:\n${output}`);
  return stack;
}

/** Every process the stack runs, read from the files the start keeps in its data folder. */
function processesOf(stack: Stack) {
  const record = JSON.parse(
    readFileSync(join(stack.dataDir, 'rhotrace.processes.json'), 'utf8'),
  ) as { starterPid: number; guardianPid: number; groups: Array<{ pid: number; label: string }> };
  const database = Number(readFileSync(join(stack.dataDir, 'mariadb.pid'), 'utf8'));
  // a 0 here would make the kills below signal this test's own process group
  for (const pid of [
    record.starterPid,
    record.guardianPid,
    database,
    ...record.groups.map((g) => g.pid),
  ])
    expect(pid).toBeGreaterThan(1);
  return { ...record, database };
}

/** Whether every process is gone and every port free again. */
async function allGone(stack: Stack, ids: ReturnType<typeof processesOf>): Promise<boolean> {
  const groups = ids.groups.map((g) => -g.pid);
  const running = [ids.starterPid, ids.guardianPid, ids.database, ...groups].filter(alive);
  if (running.length) return false;
  return (await Promise.all(stack.ports.map(portFree))).every(Boolean);
}

afterEach(() => {
  // whatever a failed test left: stop it, as a person would
  for (const stack of stacks.splice(0)) {
    try {
      execFileSync(tsx, ['scripts/stop.ts'], { cwd: REPO_ROOT, env: stack.env, stdio: 'pipe' });
    } catch {
      /* reported by the test */
    }
  }
});
afterAll(() => rmSync(dataDir, { recursive: true, force: true }));

describe('process lifetime: npm start killed with SIGKILL', () => {
  it('Ctrl-C: the starter itself stops everything, MariaDB cleanly', async () => {
    const stack = await startStack();
    const ids = processesOf(stack);
    process.kill(-stack.launcher.pid!, 'SIGINT');
    expect(await waitFor(() => allGone(stack, ids), 30_000)).toBe(true);
    expect(stack.output()).toContain('[db] stopped');
    // the guardian had nothing to finish
    expect(stack.output()).not.toContain('[guardian]');
  }, 150_000);

  it('a killed launcher (as npm is) takes the API, mail stand-in and MariaDB down', async () => {
    const stack = await startStack();
    const ids = processesOf(stack);
    expect(ids.groups.map((g) => g.label).sort()).toEqual(['api', 'mail']);
    expect([ids.starterPid, ids.guardianPid, ids.database].every(alive)).toBe(true);
    stack.launcher.kill('SIGKILL');
    expect(await waitFor(() => allGone(stack, ids), 15_000)).toBe(true);
    expect(stack.output()).toContain('the process that launched Rhotrace');
    expect(existsSync(join(stack.dataDir, 'rhotrace.processes.json'))).toBe(false);
  }, 150_000);

  it('a killed starter leaves a guardian behind that stops the rest', async () => {
    const stack = await startStack();
    const ids = processesOf(stack);
    process.kill(ids.starterPid, 'SIGKILL');
    expect(await waitFor(() => allGone(stack, ids), 15_000)).toBe(true);
    expect(stack.output()).toContain('[guardian] the starter');
  }, 150_000);

  it('a start that finds leftovers of its data folder says so and names the stop command', async () => {
    const stack = await startStack();
    const ids = processesOf(stack);
    // Both watchers gone at once (or processes left by an older Rhotrace): the children stay.
    process.kill(-ids.guardianPid, 'SIGKILL');
    process.kill(ids.starterPid, 'SIGKILL');
    expect(await waitFor(() => !alive(ids.starterPid) && !alive(-ids.guardianPid), 5_000)).toBe(
      true,
    );
    expect(ids.groups.every((g) => alive(-g.pid))).toBe(true);

    const expectRefusal = () => {
      const again = spawnSync(
        process.execPath,
        ['--import', 'tsx', 'scripts/start.ts', '--no-web-build'],
        {
          cwd: REPO_ROOT,
          env: stack.env,
          timeout: 60_000,
        },
      );
      expect(again.status).toBe(1);
      const refusal = again.stderr.toString();
      expect(refusal).toContain(`an earlier start of Rhotrace from ${stack.dataDir}`);
      for (const g of ids.groups) expect(refusal).toContain(`${g.label} (process group ${g.pid})`);
      expect(refusal).toContain(`MariaDB (process ${ids.database})`);
      expect(refusal).toContain(`DATA_DIR=${stack.dataDir} npm run stop`);
    };
    expectRefusal();
    // Without the record (lost, or never written by an older Rhotrace) the servers are still found.
    rmSync(join(stack.dataDir, 'rhotrace.processes.json'));
    expectRefusal();

    const stopped = execFileSync(tsx, ['scripts/stop.ts'], { cwd: REPO_ROOT, env: stack.env });
    expect(stopped.toString()).toContain('is stopped');
    expect(await waitFor(() => allGone(stack, ids), 15_000)).toBe(true);
  }, 150_000);
});
