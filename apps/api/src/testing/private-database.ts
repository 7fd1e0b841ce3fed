import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { REPO_ROOT } from '../config';
import { freePortForTest } from './free-port';

/**
 * A MariaDB server of a test's own (db/db.sh in a temporary folder on a free port), for tests
 * that kill and restart the database and so must not share the suite's server.
 */
export class PrivateDatabase {
  readonly dataDir = mkdtempSync(join(tmpdir(), 'rhotrace-fault-'));
  port = 0;
  env: Record<string, string> = {};

  private run(command: string): void {
    execFileSync('bash', [join(REPO_ROOT, 'db/db.sh'), command], {
      env: { ...process.env, DATA_DIR: this.dataDir, DB_PORT: String(this.port) },
      stdio: 'pipe',
    });
  }

  async start(): Promise<void> {
    if (!this.port) this.port = await freePortForTest();
    this.run('start');
    const env: Record<string, string> = {};
    for (const line of readFileSync(join(this.dataDir, 'db.env'), 'utf8').split('\n')) {
      const m = /^([A-Z_]+)=(.*)$/.exec(line);
      if (m) env[m[1]!] = m[2]!;
    }
    this.env = env;
  }

  /** SIGKILL, as a crash or an out-of-memory kill would. */
  kill(): void {
    const pid = Number(readFileSync(join(this.dataDir, 'mariadb.pid'), 'utf8'));
    process.kill(pid, 'SIGKILL');
  }

  async waitUntilGone(timeoutMs = 10_000): Promise<void> {
    const pid = Number(readFileSync(join(this.dataDir, 'mariadb.pid'), 'utf8'));
    const until = Date.now() + timeoutMs;
    while (Date.now() < until) {
      try {
        process.kill(pid, 0);
      } catch {
        return;
      }
      await new Promise((r) => setTimeout(r, 50));
    }
    throw new Error('mariadbd did not exit');
  }

  stop(): void {
    try {
      this.run('stop');
    } finally {
      rmSync(this.dataDir, { recursive: true, force: true });
    }
  }
}
