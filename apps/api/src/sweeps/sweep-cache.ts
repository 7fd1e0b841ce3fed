/**
 * An in-memory cache of what a stored sweep's points give (response text, readings for
 * analysis), least recently used first out. Stored points never change once their upload
 * commits, so an entry cannot go stale; it is keyed by the database and the sweep id, and
 * stamped with what tells one stored sweep from another under the same id (after a restore
 * ids are handed out again), so another sweep under that id misses. Each API process keeps
 * its own copy; nothing in it is state another process needs.
 */
import { Sweep } from './sweep.model';

/** The sweep row fields that identify one stored sweep. */
export type SweepIdentity = Pick<Sweep, 'id' | 'sha256' | 'createdAt' | 'pointCount'>;

const stampOf = (s: SweepIdentity) => `${s.sha256}:${s.createdAt.getTime()}:${s.pointCount}`;

export class SweepCache<T> {
  private readonly entries = new Map<string, { stamp: string; value: T; size: number }>();
  private total = 0;

  /**
   * @param limit total size (as `sizeOf` counts it) kept across all sweeps
   * @param sizeOf the size of one value, e.g. its number of points
   * @param largestShare the largest part of `limit` one sweep may take (a larger one is never
   *   kept); a quarter by default, so one big sweep cannot push out every other
   */
  constructor(
    private readonly limit: number,
    private readonly sizeOf: (value: T) => number,
    private readonly largestShare = 0.25,
  ) {}

  /** Cache key: the database as well as the id, since a test process may talk to several. */
  private key(id: number): string {
    return `${Sweep.sequelize?.getDatabaseName() ?? ''}:${id}`;
  }

  /** The value kept for this very sweep, or undefined. */
  get(sweep: SweepIdentity): T | undefined {
    const key = this.key(sweep.id);
    const entry = this.entries.get(key);
    if (!entry) return undefined;
    if (entry.stamp !== stampOf(sweep)) {
      this.forget(sweep.id);
      return undefined;
    }
    this.entries.delete(key); // least recently used goes first when the cache is full
    this.entries.set(key, entry);
    return entry.value;
  }

  /** Keeps `value` for the sweep (when small enough) and returns it. */
  remember(sweep: SweepIdentity, value: T): T {
    this.forget(sweep.id);
    const size = this.sizeOf(value);
    if (size > this.limit * this.largestShare) return value;
    this.entries.set(this.key(sweep.id), { stamp: stampOf(sweep), value, size });
    this.total += size;
    for (const [oldest, entry] of this.entries) {
      if (this.total <= this.limit) break;
      this.entries.delete(oldest);
      this.total -= entry.size;
    }
    return value;
  }

  /** Drops what is kept for sweep `id`. */
  forget(id: number): void {
    const key = this.key(id);
    const entry = this.entries.get(key);
    if (!entry) return;
    this.total -= entry.size;
    this.entries.delete(key);
  }
}
