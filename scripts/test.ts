/**
 * `npm test`: every suite of the repository against a throwaway MariaDB on a free loopback port
 * in a temporary directory, removed again however the run ends. Closes with the line
 * `summary: N passed, M failed` and a non-zero exit when anything failed.
 *
 *   npm test                 all suites
 *   npm test -- physics api  only the named suites (lint, typecheck, physics, api, web, e2e,
 *                            cluster)
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { alive } from './leftovers';
import { freePort, runCommand, startProcess, stopAll, stopProcess, waitForHttp } from './processes';
import { ensureDebianPackage } from './system-packages';

const ROOT = resolve(import.meta.dirname, '..');
const TMP_PREFIX = 'rhotrace-test-';
/** The cluster suite's folders (apps/api/cluster): a Galera cluster to stop when left behind. */
const CLUSTER_PREFIX = 'rhotrace-cluster-';
const bin = (name: string) => join(ROOT, 'node_modules/.bin', name);

interface Result {
  suite: string;
  passed: number;
  failed: number;
  skipped: number;
  seconds: number;
  note?: string;
}
const results: Result[] = [];

/** Records a suite that could not run or report, as one failure with the reason. */
function recordFailure(suite: string, note?: string, seconds = 0): void {
  results.push({ suite, passed: 0, failed: 1, skipped: 0, seconds, note });
}

/** Counts from vitest's closing "Tests  N passed | M failed (T)" line. */
function vitestCounts(output: string): { passed: number; failed: number; skipped: number } | null {
  // eslint-disable-next-line no-control-regex
  const plain = output.replace(/\u001b\[[0-9;]*m/g, '');
  const lines = plain.split('\n').filter((l) => /^\s*Tests\s+\d+/.test(l));
  const line = lines.at(-1);
  if (!line) return null;
  const num = (word: string) => Number(new RegExp(`(\\d+) ${word}`).exec(line)?.[1] ?? 0);
  return { passed: num('passed'), failed: num('failed'), skipped: num('skipped') + num('todo') };
}

async function suite(
  name: string,
  command: string,
  args: string[],
  options: { env?: NodeJS.ProcessEnv; cwd?: string; kind: 'vitest' | 'exit' },
): Promise<void> {
  console.log(`\n=== ${name}: ${[command, ...args].map((a) => a.replace(ROOT, '.')).join(' ')}`);
  const started = Date.now();
  const { code, output } = await runCommand(command, args, options);
  const seconds = (Date.now() - started) / 1000;
  if (options.kind === 'exit') {
    results.push({
      suite: name,
      passed: code === 0 ? 1 : 0,
      failed: code === 0 ? 0 : 1,
      skipped: 0,
      seconds,
    });
    return;
  }
  const counts = vitestCounts(output);
  if (!counts) {
    recordFailure(name, `exit ${code}, no test summary`, seconds);
    return;
  }
  // A non-zero exit with no failed test (an unhandled error, a crashed worker) still fails.
  const extra = code !== 0 && counts.failed === 0 ? 1 : 0;
  results.push({
    suite: name,
    ...counts,
    failed: counts.failed + extra,
    seconds,
    note: extra ? `exit ${code} with no failing test: see the log above` : undefined,
  });
}

/** Stops databases and removes folders left by earlier runs that were killed half-way. */
function cleanStaleRuns(): void {
  for (const entry of readdirSync(tmpdir())) {
    const cluster = entry.startsWith(CLUSTER_PREFIX);
    if (!entry.startsWith(TMP_PREFIX) && !cluster) continue;
    const dir = join(tmpdir(), entry);
    const owner = Number(
      existsSync(join(dir, 'runner.pid')) ? readFileSync(join(dir, 'runner.pid'), 'utf8') : 0,
    );
    if (owner && alive(owner)) continue;
    try {
      if (cluster && existsSync(join(dir, 'node1')))
        execFileSync('bash', [join(ROOT, 'db/cluster.sh'), 'stop'], {
          env: { ...process.env, CLUSTER_DIR: dir },
          stdio: 'ignore',
        });
      else if (!cluster)
        execFileSync('bash', [join(ROOT, 'db/db.sh'), 'stop'], {
          env: { ...process.env, DATA_DIR: dir },
          stdio: 'ignore',
        });
    } catch {
      /* nothing running */
    }
    rmSync(dir, { recursive: true, force: true });
    console.log(`[test] removed ${dir} left by an interrupted run`);
  }
}

let dataDir = '';
let cleaned = false;
async function cleanUp(): Promise<void> {
  if (cleaned) return;
  cleaned = true;
  await stopAll();
  if (dataDir) {
    try {
      execFileSync('bash', [join(ROOT, 'db/db.sh'), 'stop'], {
        env: { ...process.env, DATA_DIR: dataDir },
        stdio: 'inherit',
      });
    } catch {
      /* reported by db.sh */
    }
    rmSync(dataDir, { recursive: true, force: true });
  }
}
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) {
  process.on(signal, () => {
    console.error(`\n[test] ${signal}: cleaning up`);
    void cleanUp().then(() => process.exit(130));
  });
}

function readEnvFile(path: string): Record<string, string> {
  const env: Record<string, string> = {};
  for (const line of readFileSync(path, 'utf8').split('\n')) {
    const m = /^([A-Z_]+)=(.*)$/.exec(line);
    if (m) env[m[1]!] = m[2]!;
  }
  return env;
}

async function e2e(env: NodeJS.ProcessEnv): Promise<void> {
  const name = 'e2e';
  if (!ensureDebianPackage('/usr/bin/chromium', 'chromium', 'the browser tests')) {
    recordFailure(name, 'chromium missing');
    return;
  }
  const seed = await runCommand(bin('tsx'), ['apps/api/src/db/cli.ts', 'seed'], { env, cwd: ROOT });
  if (seed.code !== 0) {
    recordFailure(name, 'demo seed failed');
    return;
  }
  const port = await freePort();
  const smtpPort = await freePort();
  const appEnv = { ...env, PORT: String(port), SMTP_PORT: String(smtpPort), LOG_LEVEL: 'warn' };
  const mail = startProcess(bin('tsx'), ['apps/api/src/mail/stand-in-main.ts'], appEnv, 'mail');
  const api = startProcess(bin('tsx'), ['apps/api/src/main.ts'], appEnv, 'api');
  const baseUrl = `http://127.0.0.1:${port}`;
  if (!(await waitForHttp(`${baseUrl}/api/health`, 60_000))) {
    recordFailure(name, 'API did not start');
  } else {
    await suite(name, bin('vitest'), ['run'], {
      cwd: join(ROOT, 'e2e'),
      env: { ...appEnv, E2E_BASE_URL: baseUrl, E2E_MAIL_DIR: join(env.DATA_DIR!, 'mail') },
      kind: 'vitest',
    });
  }
  await stopProcess(api);
  await stopProcess(mail);
}

async function main(): Promise<void> {
  const wanted = process.argv.slice(2).filter((a) => !a.startsWith('-'));
  const want = (name: string) => wanted.length === 0 || wanted.includes(name);
  cleanStaleRuns();
  dataDir = mkdtempSync(join(tmpdir(), TMP_PREFIX));
  writeFileSync(join(dataDir, 'runner.pid'), String(process.pid));
  const dbPort = await freePort();
  const baseEnv: NodeJS.ProcessEnv = {
    ...process.env,
    DATA_DIR: dataDir,
    DB_PORT: String(dbPort),
    NODE_ENV: 'test',
  };
  delete baseEnv.JWT_SECRET;

  const needsDb = want('api') || want('e2e');
  let env = baseEnv;
  if (needsDb) {
    console.log(`[test] starting a throwaway MariaDB on 127.0.0.1:${dbPort} in ${dataDir}`);
    execFileSync('bash', [join(ROOT, 'db/db.sh'), 'start'], { env: baseEnv, stdio: 'inherit' });
    env = { ...baseEnv, ...readEnvFile(join(dataDir, 'db.env')) };
  }

  if (want('lint'))
    await suite('lint', bin('eslint'), ['.', '--max-warnings=0'], { cwd: ROOT, kind: 'exit' });
  if (want('lint'))
    await suite('api-types-index', bin('tsx'), ['scripts/api-types-index.ts', '--check'], {
      cwd: ROOT,
      kind: 'exit',
    });
  if (want('lint'))
    await suite('format', bin('prettier'), ['--check', '.', '--log-level=warn'], {
      cwd: ROOT,
      kind: 'exit',
    });
  if (want('typecheck'))
    await suite('typecheck', bin('tsx'), ['scripts/typecheck.ts'], { cwd: ROOT, kind: 'exit' });
  if (want('physics'))
    await suite('physics', bin('vitest'), ['run'], {
      cwd: join(ROOT, 'libs/physics'),
      kind: 'vitest',
    });
  if (want('api'))
    await suite('api', bin('vitest'), ['run'], {
      cwd: join(ROOT, 'apps/api'),
      env,
      kind: 'vitest',
    });
  if (existsSync(join(ROOT, 'angular.json'))) {
    if (want('web'))
      await suite('web', bin('ng'), ['test', 'web', '--watch=false'], {
        cwd: ROOT,
        env: { ...env, NG_CLI_ANALYTICS: 'false' },
        kind: 'vitest',
      });
    if (want('e2e')) {
      await suite('web-build', bin('ng'), ['build', 'web'], {
        cwd: ROOT,
        env: { ...env, NG_CLI_ANALYTICS: 'false' },
        kind: 'exit',
      });
      if (results.at(-1)?.failed === 0) {
        await runCommand(bin('tsx'), ['scripts/precompress.ts'], { cwd: ROOT });
        await e2e(env);
      }
    }
  }
  if (want('cluster'))
    await suite('cluster', bin('vitest'), ['run', '--config', 'cluster/vitest.config.ts'], {
      cwd: join(ROOT, 'apps/api'),
      env: { ...baseEnv, LOG_LEVEL: 'error' },
      kind: 'vitest',
    });
}

main()
  .catch((error: unknown) => {
    console.error(
      `[test] runner error: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`,
    );
    recordFailure('runner');
  })
  .finally(async () => {
    await cleanUp();
    console.log('\n=== results');
    for (const r of results) {
      const skipped = r.skipped ? `, ${r.skipped} skipped` : '';
      console.log(
        `${r.suite.padEnd(10)} ${r.passed} passed, ${r.failed} failed${skipped}  (${r.seconds.toFixed(1)} s)${r.note ? `  ${r.note}` : ''}`,
      );
    }
    const passed = results.reduce((s, r) => s + r.passed, 0);
    const failed = results.reduce((s, r) => s + r.failed, 0);
    if (results.length === 0) console.log('no suite ran');
    console.log(`summary: ${passed} passed, ${failed} failed`);
    process.exit(failed > 0 || results.length === 0 ? 1 : 0);
  });
