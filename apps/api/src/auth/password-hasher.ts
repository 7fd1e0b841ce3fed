import { createRequire } from 'node:module';
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import bcrypt from 'bcryptjs';

/**
 * bcrypt in worker threads. bcryptjs is plain JavaScript: at cost 10 one hash takes about 100 ms
 * of CPU, and on the main thread a burst of sign-ins would stall every other request. The workers
 * run the same bcryptjs code, so hashes are identical; if a worker cannot start, the main thread
 * does the work as before.
 *
 * On Linux each worker also lowers its own scheduling priority (nice 10; there the nice value
 * belongs to the thread, while on other systems it would be the whole process's, so they skip it). A burst of sign-ins then uses the CPU the rest of the server leaves idle and no
 * longer delays the requests of people already signed in; the sign-ins themselves take longer
 * only while the server is busy.
 */
/** The nice value of the hashing threads (0 is normal, 19 the lowest priority). */
export const HASHER_NICE = 10;
const BCRYPTJS_PATH = createRequire(import.meta.url).resolve('bcryptjs');
const WORKER_SOURCE = `
const { parentPort } = require('node:worker_threads');
const bcrypt = require(${JSON.stringify(BCRYPTJS_PATH)});
// per thread on Linux only; elsewhere the call would lower the whole server's priority
if (process.platform === 'linux') {
  try { require('node:os').setPriority(${HASHER_NICE}); } catch {}
}
parentPort.on('message', ({ id, op, a, b }) => {
  try {
    const result = op === 'compare' ? bcrypt.compareSync(a, b) : bcrypt.hashSync(a, b);
    parentPort.postMessage({ id, result });
  } catch (error) {
    parentPort.postMessage({ id, error: String(error && error.message ? error.message : error) });
  }
});
`;

interface Pending {
  worker: Worker;
  resolve: (value: unknown) => void;
  reject: (error: Error) => void;
}

class HasherPool {
  private readonly workers: Worker[] = [];
  private readonly pending = new Map<number, Pending>();
  private next = 0;
  private serial = 0;
  private broken = false;

  private worker(): Worker | null {
    if (this.broken) return null;
    const size = Math.max(1, Math.min(4, availableParallelism()));
    if (this.workers.length < size) {
      try {
        const worker = new Worker(WORKER_SOURCE, { eval: true });
        worker.unref();
        worker.on('message', (m: { id: number; result?: unknown; error?: string }) => {
          const job = this.pending.get(m.id);
          this.pending.delete(m.id);
          if (!job) return;
          if (m.error !== undefined) job.reject(new Error(m.error));
          else job.resolve(m.result);
        });
        worker.on('error', () => this.retire(worker));
        worker.on('exit', () => this.retire(worker));
        this.workers.push(worker);
      } catch {
        this.broken = true;
        return null;
      }
    }
    this.next = (this.next + 1) % this.workers.length;
    return this.workers[this.next] ?? null;
  }

  /** Drops a worker that failed or exited, failing the jobs it still had. */
  private retire(worker: Worker): void {
    const i = this.workers.indexOf(worker);
    if (i >= 0) this.workers.splice(i, 1);
    for (const [id, job] of this.pending) {
      if (job.worker !== worker) continue;
      this.pending.delete(id);
      job.reject(new Error('the password hashing thread stopped'));
    }
  }

  run<T>(
    op: 'compare' | 'hash',
    a: string,
    b: string | number,
    fallback: () => Promise<T>,
  ): Promise<T> {
    const worker = this.worker();
    if (!worker) return fallback();
    this.serial += 1;
    const id = this.serial;
    return new Promise<T>((resolve, reject) => {
      this.pending.set(id, { worker, resolve: resolve as (v: unknown) => void, reject });
      worker.postMessage({ id, op, a, b });
    });
  }
}

const pool = new HasherPool();

/** bcrypt hash of `password` at `cost`, computed off the main thread. */
export function hashPassword(password: string, cost: number): Promise<string> {
  return pool.run('hash', password, cost, () => bcrypt.hash(password, cost));
}

/** Whether `password` matches the bcrypt `hash`, checked off the main thread. */
export function comparePassword(password: string, hash: string): Promise<boolean> {
  return pool.run('compare', password, hash, () => bcrypt.compare(password, hash));
}
