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
import { freePort, runCommand, stopAll } from './processes';

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
  { name: 'upload', script: 'apps/api/bench/upload.bench.ts', needsDb: true },
  { name: 'analysis', script: 'apps/api/bench/analysis.bench.ts', needsDb: true },
  { name: 'load', script: 'apps/api/bench/load.bench.ts', needsDb: true },
];

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
