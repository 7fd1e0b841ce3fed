import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import { QueryTypes, type Sequelize } from 'sequelize';
import { isTransientTransactionError } from '../db/transient-errors';

/** Tries of one increment when a Galera certification failure or a deadlock aborts it. */
const TRIES = 3;

/**
 * An express-rate-limit store over the `rate_windows` table, so that the limit holds across API
 * processes and cluster nodes instead of per process. The window is fixed (it starts with the
 * first hit after the previous one ended) and timed by the database's clock, which every
 * instance shares.
 */
export class SharedRateStore implements Store {
  private windowMs = 60_000;

  /** Keys are prefixed with `scope`, so several limits can share the table. */
  constructor(
    private readonly sequelize: Sequelize,
    private readonly scope: string,
  ) {}

  /** Takes the limiter's window length. */
  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  /** Counts one hit in the key's current window (opening a new window when the last has ended). */
  async increment(key: string): Promise<ClientRateLimitInfo> {
    for (let attempt = 1; ; attempt += 1) {
      try {
        return await this.incrementOnce(this.keyOf(key));
      } catch (error) {
        if (attempt >= TRIES || !isTransientTransactionError(error)) throw error;
      }
    }
  }

  /** Takes back one hit (express-rate-limit's skip-successful/failed options). */
  async decrement(key: string): Promise<void> {
    await this.sequelize.query(
      'UPDATE rate_windows SET hits = GREATEST(CAST(hits AS SIGNED) - 1, 0) WHERE rate_key = ?',
      { replacements: [this.keyOf(key)] },
    );
  }

  /** Forgets the key's window. */
  async resetKey(key: string): Promise<void> {
    await this.sequelize.query('DELETE FROM rate_windows WHERE rate_key = ?', {
      replacements: [this.keyOf(key)],
    });
  }

  private keyOf(key: string): string {
    return `${this.scope}:${key}`.slice(0, 191);
  }

  private async incrementOnce(rateKey: string): Promise<ClientRateLimitInfo> {
    return this.sequelize.transaction(async (transaction) => {
      // MariaDB evaluates the assignments left to right; both read the row's old resets_at.
      await this.sequelize.query(
        `INSERT INTO rate_windows (rate_key, hits, resets_at)
           VALUES (?, 1, UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND)
         ON DUPLICATE KEY UPDATE
           hits = IF(resets_at <= UTC_TIMESTAMP(3), 1, hits + 1),
           resets_at = IF(resets_at <= UTC_TIMESTAMP(3), VALUES(resets_at), resets_at)`,
        { replacements: [rateKey, this.windowMs * 1000], transaction },
      );
      const [row] = await this.sequelize.query<{ hits: number; resetInMs: number }>(
        `SELECT hits, TIMESTAMPDIFF(MICROSECOND, UTC_TIMESTAMP(3), resets_at) DIV 1000 AS resetInMs
           FROM rate_windows WHERE rate_key = ?`,
        { replacements: [rateKey], transaction, type: QueryTypes.SELECT },
      );
      if (!row) throw new Error(`the rate window ${rateKey} was not stored`);
      return {
        totalHits: Number(row.hits),
        resetTime: new Date(Date.now() + Math.max(0, Number(row.resetInMs))),
      };
    });
  }
}
