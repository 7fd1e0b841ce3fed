/**
 * `npm start`: the one command that runs Rhotrace on this machine. Starts the private MariaDB,
 * migrates, seeds the demo once (never with NODE_ENV=production), starts the SMTP stand-in,
 * builds the web app when its sources changed (not with --no-web-build), and serves web app and
 * API on 127.0.0.1:PORT. Ctrl-C, SIGTERM or `npm run stop` stops everything and shuts MariaDB down
 * cleanly. If the starter is killed outright, or whatever launched it ends, the guardian it leaves
 * behind (scripts/guardian.ts) or its own watch stops the rest, so no port stays taken.
 */
import { createHash } from 'node:crypto';
import { execFileSync, spawn } from 'node:child_process';
import {
  existsSync,
  mkdirSync,
  readdirSync,
  readFileSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { createServer } from 'node:net';
import { isAbsolute, join, resolve } from 'node:path';
import { watchLaunchers } from './launcher-watch';
import {
  alive,
  recordFile,
  starterPidFile,
  survivors,
  writeRecord,
  type StartRecord,
} from './leftovers';
import { onChildrenChange, runCommand, startProcess, stopAll, waitForHttp } from './processes';

const ROOT = resolve(import.meta.dirname, '..');
const port = Number(process.env.PORT ?? 4300);
const dataDirRaw = process.env.DATA_DIR ?? join(ROOT, 'db/.data');
const dataDir = isAbsolute(dataDirRaw) ? dataDirRaw : resolve(ROOT, dataDirRaw);
const production = process.env.NODE_ENV === 'production';
const pidFile = starterPidFile(dataDir);
const buildWeb = !process.argv.includes('--no-web-build');
const bin = (name: string) => join(ROOT, 'node_modules/.bin', name);
/**
 * Node running a TypeScript file, for the processes that must stop gracefully: through the tsx
 * launcher, a SIGTERM not confirmed by the child within 30 ms becomes a SIGKILL.
 */
const typescript = (script: string, ...args: string[]) => ['--import', 'tsx', script, ...args];
const env: NodeJS.ProcessEnv = { ...process.env, DATA_DIR: dataDir, PORT: String(port) };

function portFree(p: number): Promise<boolean> {
  return new Promise((r) => {
    const s = createServer();
    s.once('error', () => r(false));
    s.listen(p, '127.0.0.1', () => s.close(() => r(true)));
  });
}

/** A digest of everything the web build depends on, so an unchanged app is not rebuilt. */
function webSourceHash(): string {
  const hash = createHash('sha256');
  const walk = (dir: string) => {
    if (!existsSync(dir)) return;
    for (const entry of readdirSync(dir).sort()) {
      const path = join(dir, entry);
      if (statSync(path).isDirectory()) walk(path);
      else hash.update(path).update(readFileSync(path));
    }
  };
  for (const dir of ['apps/web/src', 'apps/web/public', 'libs/api-types/src', 'libs/physics/src'])
    walk(join(ROOT, dir));
  for (const file of ['angular.json', 'package-lock.json', 'apps/web/tsconfig.app.json']) {
    if (existsSync(join(ROOT, file))) hash.update(readFileSync(join(ROOT, file)));
  }
  return hash.digest('hex');
}

/** The command that stops this data folder's Rhotrace from another terminal. */
function stopCommand(): string {
  return process.env.DATA_DIR ? `DATA_DIR=${dataDir} npm run stop` : 'npm run stop';
}

/**
 * Starts the guardian, which stops what this start started if this process ends without doing
 * it (see scripts/guardian.ts). Its standard input is a pipe that only our death closes.
 */
function startGuardian(): number | null {
  const guardian = spawn(
    process.execPath,
    typescript('scripts/guardian.ts', dataDir, `${process.pid}`),
    {
      cwd: ROOT,
      env,
      stdio: ['pipe', 'inherit', 'inherit'],
      detached: true,
    },
  );
  guardian.on('error', (error) => console.error(`[start] no guardian: ${error.message}`));
  guardian.unref();
  return guardian.pid ?? null;
}

let stopping = false;
async function shutdown(code: number): Promise<never> {
  if (!stopping) {
    stopping = true;
    console.log('\n[start] stopping Rhotrace');
    await stopAll();
    try {
      execFileSync('bash', [join(ROOT, 'db/db.sh'), 'stop'], { env, stdio: 'inherit' });
    } catch {
      /* db.sh reports */
    }
    // Last: while the record exists, the guardian would finish this work if we were killed.
    rmSync(recordFile(dataDir), { force: true });
    rmSync(pidFile, { force: true });
  }
  process.exit(code);
}

async function main(): Promise<void> {
  mkdirSync(dataDir, { recursive: true });
  if (existsSync(pidFile)) {
    const pid = Number(readFileSync(pidFile, 'utf8'));
    if (pid && alive(pid)) {
      console.error(
        `[start] Rhotrace is already running from ${dataDir} (process ${pid}) at http://127.0.0.1:${readFileSync(join(dataDir, 'rhotrace.port'), 'utf8').trim()}.\n` +
          `        Stop it with Ctrl-C in its terminal or with: ${stopCommand()}\n` +
          '        or start a second copy with another PORT, DB_PORT and DATA_DIR.',
      );
      process.exit(1);
    }
  }
  const stale = survivors(dataDir);
  if (stale.length) {
    console.error(
      `[start] an earlier start of Rhotrace from ${dataDir} ended but left running: ` +
        `${stale.join(', ')}.\n        Stop them with: ${stopCommand()}`,
    );
    process.exit(1);
  }
  if (!(await portFree(port))) {
    console.error(
      `[start] port ${port} on 127.0.0.1 is taken by another program: set PORT to a free port.`,
    );
    process.exit(1);
  }
  writeFileSync(pidFile, String(process.pid));
  writeFileSync(join(dataDir, 'rhotrace.port'), String(port));
  for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const)
    process.on(signal, () => void shutdown(0));
  watchLaunchers((gone) => {
    console.error(`[start] the process that launched Rhotrace (${gone}) has ended`);
    void shutdown(1);
  });
  const record: StartRecord = {
    starterPid: process.pid,
    guardianPid: startGuardian(),
    // before db.sh runs: a kill during its start must still stop the server
    database: true,
    groups: [],
  };
  writeRecord(dataDir, record);
  onChildrenChange((groups) => {
    if (!stopping) writeRecord(dataDir, { ...record, groups });
  });

  execFileSync('bash', [join(ROOT, 'db/db.sh'), 'start'], { env, stdio: 'inherit' });
  const step = async (label: string, args: string[]) => {
    const { code } = await runCommand(bin('tsx'), args, { env, cwd: ROOT });
    if (code !== 0) {
      console.error(`[start] ${label} failed`);
      await shutdown(1);
    }
  };
  await step('migration', ['apps/api/src/db/cli.ts', 'migrate']);
  if (!production) await step('demo seed', ['apps/api/src/db/cli.ts', 'seed']);

  const stamp = join(ROOT, 'dist/web/.source-hash');
  const hash = buildWeb ? webSourceHash() : '';
  if (!buildWeb) {
    console.log('[start] --no-web-build: serving the web app as last built, if it was');
  } else if (
    !existsSync(join(ROOT, 'dist/web/browser/index.html')) ||
    !existsSync(stamp) ||
    readFileSync(stamp, 'utf8') !== hash
  ) {
    console.log('[start] building the web app for production (first start or changed sources)');
    const { code } = await runCommand(bin('ng'), ['build', 'web'], {
      env: { ...env, NG_CLI_ANALYTICS: 'false' },
      cwd: ROOT,
    });
    if (code !== 0) {
      console.error('[start] the web build failed');
      await shutdown(1);
    }
    await runCommand(bin('tsx'), ['scripts/precompress.ts'], { env, cwd: ROOT });
    writeFileSync(stamp, hash);
  } else {
    console.log('[start] web app unchanged since the last build');
  }

  const node = process.execPath;
  const mail = startProcess(node, typescript('apps/api/src/mail/stand-in-main.ts'), env, 'mail');
  const api = startProcess(node, typescript('apps/api/src/main.ts'), env, 'api');
  for (const child of [mail, api]) {
    child.on('exit', (code) => {
      if (!stopping) {
        console.error(
          `[start] a Rhotrace process stopped unexpectedly (exit ${code}); shutting down`,
        );
        void shutdown(1);
      }
    });
  }
  const url = `http://127.0.0.1:${port}`;
  if (!(await waitForHttp(`${url}/api/health`, 60_000))) {
    console.error('[start] the server did not answer /api/health within 60 s');
    await shutdown(1);
  }
  const accounts = ['admin', 'manager', 'engineer', 'physicist', 'technician']
    .map((role) => `    ${`${role}@rhotrace.example`.padEnd(28)} rhotrace-demo`)
    .join('\n');
  console.log(`
Rhotrace is running at ${url}
${
  production
    ? ''
    : `
  Demo accounts (demo only; password for all: rhotrace-demo):
${accounts}
`
}
  Captured e-mail: ${join(dataDir, 'mail')}${production ? '' : ` (also listed at ${url}/api/dev/mail)`}
  Stop with Ctrl-C.
`);
}

main().catch(async (error: unknown) => {
  console.error(`[start] ${error instanceof Error ? error.message : String(error)}`);
  await shutdown(1);
});
