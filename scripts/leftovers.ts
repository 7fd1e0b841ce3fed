/**
 * What one `npm start` of a data folder runs, written down in that folder so that its processes
 * can be found and stopped when the starter itself is gone: by the guardian the starter leaves
 * behind (scripts/guardian.ts), by `npm run stop`, and by the next start, which refuses to run
 * beside them.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';

const ROOT = resolve(import.meta.dirname, '..');

/** A process group the starter started (the group's id is its first process's id). */
export interface RecordedGroup {
  pid: number;
  label: string;
}

/** The record a running start keeps in its data folder. */
export interface StartRecord {
  starterPid: number;
  guardianPid: number | null;
  /** True once the start has started (or reused) the data folder's MariaDB, which it stops. */
  database: boolean;
  groups: RecordedGroup[];
}

export const recordFile = (dataDir: string) => join(dataDir, 'rhotrace.processes.json');
export const starterPidFile = (dataDir: string) => join(dataDir, 'rhotrace.pid');

export function writeRecord(dataDir: string, record: StartRecord): void {
  writeFileSync(recordFile(dataDir), `${JSON.stringify(record, null, 2)}\n`);
}

export function readRecord(dataDir: string): StartRecord | null {
  try {
    return JSON.parse(readFileSync(recordFile(dataDir), 'utf8')) as StartRecord;
  } catch {
    return null;
  }
}

/** Whether a process (a positive id) or a process group (a negative id) still exists. */
export function alive(id: number): boolean {
  if (!id) return false;
  try {
    process.kill(id, 0);
    return true;
  } catch (error) {
    // EPERM: it exists but belongs to someone else
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** The data folder's MariaDB process, when its pid file names a live mariadbd. */
export function databasePid(dataDir: string): number | null {
  const file = join(dataDir, 'mariadb.pid');
  if (!existsSync(file)) return null;
  const pid = Number(readFileSync(file, 'utf8').trim());
  if (!pid || !alive(pid)) return null;
  try {
    if (!readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes('mariadbd')) return null;
  } catch {
    /* no /proc: trust the pid file */
  }
  return pid;
}

/** What of a recorded start is still running, as "api (process group 123)" phrases. */
export function survivors(dataDir: string): string[] {
  const record = readRecord(dataDir);
  if (!record) return [];
  const found = record.groups
    .filter((g) => alive(-g.pid))
    .map((g) => `${g.label} (process group ${g.pid})`);
  const db = record.database ? databasePid(dataDir) : null;
  if (db) found.push(`MariaDB (process ${db})`);
  return found;
}

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Stops what a start of `dataDir` left running (its process groups: TERM, then KILL after
 * `graceMs`; then its MariaDB, cleanly) and removes the record. For a starter that is gone.
 * Returns what is still running afterwards (the record stays while anything is).
 */
export async function stopLeftovers(
  dataDir: string,
  log: (line: string) => void,
  graceMs = 5_000,
): Promise<string[]> {
  const record = readRecord(dataDir);
  if (!record) return [];
  const groups = record.groups.filter((g) => alive(-g.pid));
  for (const g of groups) {
    log(`stopping ${g.label} (process group ${g.pid})`);
    try {
      process.kill(-g.pid, 'SIGTERM');
    } catch {
      /* ended meanwhile */
    }
  }
  const until = Date.now() + graceMs;
  while (groups.some((g) => alive(-g.pid)) && Date.now() < until) await pause(50);
  for (const g of groups.filter((x) => alive(-x.pid))) {
    log(`${g.label} did not stop within ${graceMs / 1000} s: killing it`);
    try {
      process.kill(-g.pid, 'SIGKILL');
    } catch {
      /* ended meanwhile */
    }
  }
  if (record.database) {
    try {
      execFileSync('bash', [join(ROOT, 'db/db.sh'), 'stop'], {
        env: { ...process.env, DATA_DIR: dataDir },
        stdio: ['ignore', 'inherit', 'inherit'],
      });
    } catch {
      /* db.sh reports */
    }
  }
  const left = survivors(dataDir);
  if (left.length === 0) {
    rmSync(recordFile(dataDir), { force: true });
    rmSync(starterPidFile(dataDir), { force: true });
  }
  return left;
}
