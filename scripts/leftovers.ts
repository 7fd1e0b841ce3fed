/**
 * What one `npm start` of a data folder runs, written down in that folder so that its processes
 * can be found and stopped when the starter itself is gone: by the guardian the starter leaves
 * behind (scripts/guardian.ts), by `npm run stop`, and by the next start, which refuses to run
 * beside them.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
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

const SERVERS: Record<string, string> = {
  'apps/api/src/main.ts': 'api',
  'apps/api/src/mail/stand-in-main.ts': 'mail',
};

/**
 * API and mail stand-in processes serving `dataDir` that no record names (left by a start whose
 * record is lost, or by a Rhotrace from before records were kept), by their process groups.
 * Linux only: it reads /proc; elsewhere it finds none.
 */
export function strays(dataDir: string): RecordedGroup[] {
  const found = new Map<number, string>();
  const matching = new Set<number>();
  let entries: string[] = [];
  try {
    entries = readdirSync('/proc').filter((e) => /^\d+$/.test(e));
  } catch {
    return [];
  }
  for (const entry of entries) {
    try {
      const command = readFileSync(`/proc/${entry}/cmdline`, 'utf8').split('\0');
      const script = command.find((a) => Object.keys(SERVERS).some((s) => a.endsWith(s)));
      if (!script) continue;
      const environment = readFileSync(`/proc/${entry}/environ`, 'utf8').split('\0');
      if (!environment.includes(`DATA_DIR=${dataDir}`)) continue;
      const stat = readFileSync(`/proc/${entry}/stat`, 'utf8');
      // after "pid (comm) ": state, ppid, process group
      const group = Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[2]);
      const label = Object.entries(SERVERS).find(([s]) => script.endsWith(s))![1];
      matching.add(Number(entry));
      if (group > 1) found.set(group, label);
    } catch {
      /* ended meanwhile, or not ours to read */
    }
  }
  // Only groups a server leads, as a start makes them: never a shell's group a server runs in.
  return [...found].filter(([pid]) => matching.has(pid)).map(([pid, label]) => ({ pid, label }));
}

/** Process groups of `dataDir`'s servers still running: the record's and any strays. */
function runningGroups(dataDir: string, record: StartRecord | null): RecordedGroup[] {
  const groups = new Map<number, string>();
  for (const g of [...(record?.groups ?? []), ...strays(dataDir)])
    if (alive(-g.pid)) groups.set(g.pid, g.label);
  return [...groups].map(([pid, label]) => ({ pid, label }));
}

/** What an earlier start of `dataDir` left running, as "api (process group 123)" phrases. */
export function survivors(dataDir: string): string[] {
  const record = readRecord(dataDir);
  const found = runningGroups(dataDir, record).map((g) => `${g.label} (process group ${g.pid})`);
  const db = record?.database || found.length ? databasePid(dataDir) : null;
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
  const groups = runningGroups(dataDir, record);
  const database = record?.database || groups.length > 0;
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
  if (database) {
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
