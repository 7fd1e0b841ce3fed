import { QueryTypes } from 'sequelize';
import { database } from '../db/connection';

/**
 * How long a station post's Idempotency-Key is remembered, s: 48 hours. The contract promises at
 * least 24 hours; the second day covers a station computer that retries after a night and a day
 * offline.
 */
export const IDEMPOTENCY_KEEP_S = 48 * 60 * 60;

/**
 * Forgets the Idempotency-Keys of station posts made more than `IDEMPOTENCY_KEEP_S` before
 * `now`: the key and the stored answer go, so a later post with that key is a new post. The row
 * stays, as the record of which station post fulfilled which assignment (the worklist shows it).
 * Answers how many keys were forgotten.
 */
export async function forgetOldKeys(now = new Date()): Promise<number> {
  const before = new Date(now.getTime() - IDEMPOTENCY_KEEP_S * 1000);
  const [, forgotten] = await database().query(
    "UPDATE station_idempotency_keys SET idempotency_key = NULL, response = '' " +
      'WHERE idempotency_key IS NOT NULL AND created_at < ?',
    { replacements: [before], type: QueryTypes.UPDATE },
  );
  return forgotten;
}
