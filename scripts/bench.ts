/**
 * `npm run bench`: runs every package's benchmark (each prints its figures and writes
 * bench/out/<name>.json), then writes bench/results.md with the machine, each figure and its target.
 * Benchmarks that need a database get a throwaway MariaDB like `npm test`.
 */
import { execFileSync } from 'node:child_process';
import {
  existsSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
  writeFileSync,
} from 'node:fs';
import { cpus, totalmem, tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { freePort, runCommand, startProcess, stopAll, stopProcess, waitForHttp } from './processes';

const ROOT = resolve(import.meta.dirname, '..');
const OUT = join(ROOT, 'bench/out');
const tsx = join(ROOT, 'node_modules/.bin/tsx');

interface Figure {
  name: string;
  value: number;
  unit: string;
  target: string;
  /** What the figure is measured against in the same run, with its value. */
  reference?: string;
  pass: boolean;
}

const benches: Array<{ name: string; script: string; needsDb: boolean }> = [
  { name: 'physics', script: 'libs/physics/bench/physics.bench.ts', needsDb: false },
  // The study page in a browser: e2e/performance.e2e.ts records its figures in bench/out.
  { name: 'study', script: 'e2e/performance.e2e.ts', needsDb: true },
  { name: 'upload', script: 'apps/api/bench/upload.bench.ts', needsDb: true },
  { name: 'analysis', script: 'apps/api/bench/analysis.bench.ts', needsDb: true },
  { name: 'load', script: 'apps/api/bench/load.bench.ts', needsDb: true },
];

/**
 * The study-page figures: builds the web app, seeds the demo, serves it as `npm test`'s e2e
 * suite does and runs e2e/performance.e2e.ts, which records bench/out/study.json. Returns what
 * went wrong, or null.
 */
async function studyBench(env: NodeJS.ProcessEnv): Promise<string | null> {
  if (!existsSync('/usr/bin/chromium'))
    return 'chromium is not installed (apt-get install chromium)';
  const ng = join(ROOT, 'node_modules/.bin/ng');
  const build = await runCommand(ng, ['build', 'web'], {
    env: { ...env, NG_CLI_ANALYTICS: 'false' },
    cwd: ROOT,
  });
  if (build.code !== 0) return 'the web build failed';
  await runCommand(tsx, ['scripts/precompress.ts'], { env, cwd: ROOT });
  const seed = await runCommand(tsx, ['apps/api/src/db/cli.ts', 'seed'], { env, cwd: ROOT });
  if (seed.code !== 0) return 'the demo seed failed';
  const appEnv = {
    ...env,
    PORT: String(await freePort()),
    SMTP_PORT: String(await freePort()),
    LOG_LEVEL: 'warn',
  };
  const mail = startProcess(tsx, ['apps/api/src/mail/stand-in-main.ts'], appEnv, 'mail');
  const api = startProcess(tsx, ['apps/api/src/main.ts'], appEnv, 'api');
  const baseUrl = `http://127.0.0.1:${appEnv.PORT}`;
  try {
    if (!(await waitForHttp(`${baseUrl}/api/health`, 60_000))) return 'the API did not start';
    const vitest = join(ROOT, 'node_modules/.bin/vitest');
    const run = await runCommand(vitest, ['run', 'performance.e2e.ts'], {
      env: { ...appEnv, E2E_BASE_URL: baseUrl, E2E_MAIL_DIR: join(env.DATA_DIR!, 'mail') },
      cwd: join(ROOT, 'e2e'),
    });
    return run.code === 0 ? null : `e2e/performance.e2e.ts exited ${run.code}`;
  } finally {
    await stopProcess(api);
    await stopProcess(mail);
  }
}

async function main(): Promise<void> {
  const only = process.argv.slice(2);
  rmSync(OUT, { recursive: true, force: true });
  mkdirSync(OUT, { recursive: true });
  const dataDir = mkdtempSync(join(tmpdir(), 'rhotrace-bench-'));
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    DATA_DIR: dataDir,
    DB_PORT: String(await freePort()),
    LOG_LEVEL: 'warn',
  };
  let dbStarted = false;
  const failures: string[] = [];
  try {
    for (const bench of benches) {
      if (only.length && !only.includes(bench.name)) continue;
      if (!existsSync(join(ROOT, bench.script))) {
        failures.push(`${bench.name}: ${bench.script} is missing`);
        continue;
      }
      if (bench.needsDb && !dbStarted) {
        execFileSync('bash', [join(ROOT, 'db/db.sh'), 'start'], { env, stdio: 'inherit' });
        for (const line of readFileSync(join(dataDir, 'db.env'), 'utf8').split('\n')) {
          const m = /^([A-Z_]+)=(.*)$/.exec(line);
          if (m) env[m[1]!] = m[2];
        }
        dbStarted = true;
      }
      console.log(`\n=== bench ${bench.name}`);
      if (bench.name === 'study') {
        const problem = await studyBench(env);
        if (problem) failures.push(`study: ${problem}`);
        continue;
      }
      const { code } = await runCommand(tsx, [bench.script], { env, cwd: ROOT });
      if (code !== 0) failures.push(`${bench.name}: exited ${code}`);
    }
  } finally {
    await stopAll();
    if (dbStarted)
      execFileSync('bash', [join(ROOT, 'db/db.sh'), 'stop'], { env, stdio: 'inherit' });
    rmSync(dataDir, { recursive: true, force: true });
  }

  const lines = [
    '# Rhotrace benchmark results',
    '',
    `Run ${new Date().toISOString()} on ${cpus().length} × ${cpus()[0]?.model ?? 'unknown CPU'}, ` +
      `${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}. Shared machines are noisy: read ratios and medians.`,
    '',
    '| benchmark | figure | value | unit | target | reference in the same run | met |',
    '|---|---|---|---|---|---|---|',
  ];
  for (const file of readdirSync(OUT)
    .filter((f) => f.endsWith('.json'))
    .sort()) {
    const figures = JSON.parse(readFileSync(join(OUT, file), 'utf8')) as Figure[];
    for (const f of figures) {
      lines.push(
        `| ${file.replace('.json', '')} | ${f.name} | ${Number(f.value.toPrecision(4))} | ${f.unit} | ${f.target} | ${f.reference ?? ''} | ${f.pass ? 'yes' : 'no'} |`,
      );
    }
  }
  if (failures.length) lines.push('', '## Failures', '', ...failures.map((f) => `- ${f}`));
  writeFileSync(join(ROOT, 'bench/results.md'), `${lines.join('\n')}\n`);
  console.log(`\n${lines.join('\n')}\n\nwritten to bench/results.md`);
  process.exit(failures.length ? 1 : 0);
}

void main();
