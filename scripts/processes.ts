import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { basename } from 'node:path';

/** A free TCP port on loopback. */
export function freePort(): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolvePort(port));
    });
  });
}

const children = new Map<ChildProcess, string>();
let onChange: ((groups: Array<{ pid: number; label: string }>) => void) | null = null;

/** Tells `listener` the process groups running now, each time one starts or ends. */
export function onChildrenChange(
  listener: (groups: Array<{ pid: number; label: string }>) => void,
): void {
  onChange = listener;
}

function track(child: ChildProcess, label: string): void {
  children.set(child, label);
  notify();
}

function untrack(child: ChildProcess): void {
  if (children.delete(child)) notify();
}

function notify(): void {
  onChange?.(
    [...children].flatMap(([c, label]) => (c.pid === undefined ? [] : [{ pid: c.pid, label }])),
  );
}

/** Starts a long-running process in its own process group, so it can be stopped with its children. */
export function startProcess(
  command: string,
  args: string[],
  env: NodeJS.ProcessEnv,
  label: string,
): ChildProcess {
  const child = spawn(command, args, { env, stdio: ['ignore', 'pipe', 'pipe'], detached: true });
  track(child, label);
  const prefix = (chunk: Buffer) =>
    chunk
      .toString()
      .split('\n')
      .filter(Boolean)
      .map((line) => `[${label}] ${line}\n`)
      .join('');
  child.stdout?.on('data', (c: Buffer) => process.stdout.write(prefix(c)));
  child.stderr?.on('data', (c: Buffer) => process.stderr.write(prefix(c)));
  child.on('exit', () => untrack(child));
  return child;
}

/** Stops a process group started by `startProcess`: TERM, then KILL after `graceMs`. */
export async function stopProcess(child: ChildProcess, graceMs = 5_000): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null || child.pid === undefined) return;
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  try {
    process.kill(-child.pid, 'SIGTERM');
  } catch {
    return;
  }
  const timer = setTimeout(() => {
    try {
      process.kill(-child.pid!, 'SIGKILL');
    } catch {
      /* already gone */
    }
  }, graceMs);
  await exited;
  clearTimeout(timer);
}

/** Stops every process still running that `startProcess` started. */
export async function stopAll(): Promise<void> {
  await Promise.all([...children.keys()].map((c) => stopProcess(c)));
}

/** Runs a command to completion, echoing its output, and returns its exit code and output. */
export function runCommand(
  command: string,
  args: string[],
  options: { env?: NodeJS.ProcessEnv; cwd?: string } = {},
): Promise<{ code: number; output: string }> {
  return new Promise((resolveRun) => {
    const child = spawn(command, args, {
      env: options.env ?? process.env,
      cwd: options.cwd,
      stdio: ['ignore', 'pipe', 'pipe'],
      detached: true,
    });
    track(child, [basename(command), ...args.slice(0, 2)].join(' '));
    let output = '';
    child.stdout.on('data', (c: Buffer) => {
      output += c.toString();
      process.stdout.write(c);
    });
    child.stderr.on('data', (c: Buffer) => {
      output += c.toString();
      process.stderr.write(c);
    });
    child.on('close', (code, signal) => {
      untrack(child);
      resolveRun({ code: code ?? (signal ? 1 : 0), output });
    });
    child.on('error', (error) => {
      untrack(child);
      resolveRun({ code: 127, output: String(error) });
    });
  });
}

/** Polls `url` until it answers 200 or `timeoutMs` passes. */
export async function waitForHttp(url: string, timeoutMs: number): Promise<boolean> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const res = await fetch(url);
      if (res.ok) return true;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}
