import { createHash } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { HttpError } from '../errors';
import { SignInThrottle } from '../users/user.model';
import { inTransaction } from '../db/connection';

/**
 * How failed sign-ins are slowed, then refused. After `slowAfter` failures inside `windowS`
 * each further attempt must wait 2^(n - slowAfter) seconds (capped at `maxDelayS`); from
 * `lockAfter` failures the key is refused for `lockS`.
 */
export interface ThrottlePolicy {
  windowS: number;
  slowAfter: number;
  maxDelayS: number;
  lockAfter: number;
  lockS: number;
}

/** One e-mail address: a handful of tries, then slowed, then a 15-minute lock. */
export const ACCOUNT_POLICY: ThrottlePolicy = {
  windowS: 15 * 60,
  slowAfter: 3,
  maxDelayS: 60,
  lockAfter: 10,
  lockS: 15 * 60,
};

/** One network address (a shared lab PC may sign many people in): more room, same shape. */
export const ADDRESS_POLICY: ThrottlePolicy = {
  windowS: 15 * 60,
  slowAfter: 20,
  maxDelayS: 60,
  lockAfter: 50,
  lockS: 15 * 60,
};

/** The keys a sign-in attempt counts against; only their sha256 is stored. */
export function throttleKeys(email: string, address: string): { account: string; address: string } {
  const sha = (s: string) => createHash('sha256').update(s).digest('hex');
  return { account: sha(`account:${email}`), address: sha(`address:${address}`) };
}

/** A 429 saying when to retry, with `Retry-After` in seconds. */
export function tooManyAttempts(until: Date, now = new Date()): HttpError {
  const seconds = Math.max(1, Math.ceil((until.getTime() - now.getTime()) / 1000));
  const when = seconds < 120 ? `${seconds} seconds` : `${Math.ceil(seconds / 60)} minutes`;
  return new HttpError(
    'too_many_requests',
    `Too many failed sign-ins. Try again in ${when} (after ${until.toISOString()}).`,
    { retryAfterS: seconds, retryAt: until.toISOString() },
    { 'Retry-After': String(seconds) },
  );
}

/** Throws a 429 when any of the keys is currently slowed or locked. */
export async function assertNotThrottled(
  keys: string[],
  now = new Date(),
  transaction?: Transaction,
): Promise<void> {
  const rows = await SignInThrottle.findAll({
    where: { keySha256: { [Op.in]: keys }, lockedUntil: { [Op.gt]: now } },
    transaction,
  });
  const latest = rows.map((r) => r.lockedUntil!).sort((a, b) => b.getTime() - a.getTime())[0];
  if (latest) throw tooManyAttempts(latest, now);
}

/**
 * Counts one failure on the locked throttle `row` under `policy` and sets the key's wait when
 * the count crosses a threshold.
 */
async function countFailure(
  row: SignInThrottle,
  policy: ThrottlePolicy,
  now: Date,
  t: Transaction,
): Promise<void> {
  const expired = now.getTime() - row.firstFailureAt.getTime() > policy.windowS * 1000;
  const lockOver = !row.lockedUntil || row.lockedUntil.getTime() <= now.getTime();
  const failures = expired && lockOver ? 1 : row.failures + 1;
  let waitS = 0;
  if (failures >= policy.lockAfter) waitS = policy.lockS;
  else if (failures >= policy.slowAfter) {
    waitS = Math.min(2 ** (failures - policy.slowAfter), policy.maxDelayS);
  }
  await row.update(
    {
      failures,
      firstFailureAt: expired && lockOver ? now : row.firstFailureAt,
      lockedUntil: waitS > 0 ? new Date(now.getTime() + waitS * 1000) : null,
    },
    { transaction: t },
  );
}

/**
 * Counts one failure against `key` under `policy`, atomically across API processes (row lock
 * in the shared database).
 */
export async function recordFailure(
  key: string,
  policy: ThrottlePolicy,
  now = new Date(),
): Promise<void> {
  await withLockedRow(key, (row, t) => countFailure(row, policy, now, t));
}

/**
 * Makes sure `key` has a row, outside any transaction (concurrent INSERT IGNOREs inside
 * transactions deadlock on the gap lock).
 */
async function ensureRow(key: string): Promise<void> {
  await SignInThrottle.bulkCreate(
    [{ keySha256: key, failures: 0, firstFailureAt: new Date(), lockedUntil: null }],
    { ignoreDuplicates: true },
  );
}

/**
 * Runs `work` in a transaction holding the lock of `key`'s row. `pruneThrottles` may delete the
 * row between its creation and the lock; then it is made again.
 */
async function withLockedRow<T>(
  key: string,
  work: (row: SignInThrottle, t: Transaction) => Promise<T>,
): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    await ensureRow(key);
    const done = await inTransaction(async (t) => {
      const row = await SignInThrottle.findByPk(key, { transaction: t, lock: t.LOCK.UPDATE });
      return row ? { value: await work(row, t) } : null;
    });
    if (done) return done.value;
    if (attempt >= 3) throw new Error('the sign-in throttle row keeps disappearing');
  }
}

/** How long a key's row outlives its last failure window and lock, s. */
export const THROTTLE_KEEP_S = 24 * 60 * 60;

/**
 * Deletes the rows of keys with nothing left to count: no lock in force and no failure (nor
 * successful sign-in) for `THROTTLE_KEEP_S`, far longer than any window. Without this every
 * address and every e-mail ever tried, a guesser's made-up ones included, would keep a row.
 * Returns how many rows went.
 */
export async function pruneThrottles(now = new Date()): Promise<number> {
  return SignInThrottle.destroy({
    where: {
      firstFailureAt: { [Op.lt]: new Date(now.getTime() - THROTTLE_KEEP_S * 1000) },
      [Op.or]: [{ lockedUntil: null }, { lockedUntil: { [Op.lte]: now } }],
    },
  });
}

/**
 * Takes the turn of one sign-in attempt on an account: under its throttle row's lock (shared by
 * every API process) it refuses the attempt with a 429 when the account or the address is
 * slowed or locked, and otherwise counts the attempt as a failure before the password is even
 * checked. Parallel attempts therefore each see the count the previous one left, while no
 * connection or lock is held during the slow password check; a correct password then clears
 * the count with `clearFailures`.
 */
export async function takeSignInTurn(
  keys: { account: string; address: string },
  policy: ThrottlePolicy,
  now = new Date(),
): Promise<void> {
  await withLockedRow(keys.account, async (row, t) => {
    if (row.lockedUntil && row.lockedUntil.getTime() > now.getTime()) {
      throw tooManyAttempts(row.lockedUntil, now);
    }
    await assertNotThrottled([keys.address], now, t);
    await countFailure(row, policy, now, t);
  });
}

/** Forgets the failures of `key` (after a successful sign-in of that account). */
export async function clearFailures(key: string, transaction?: Transaction): Promise<void> {
  await SignInThrottle.update(
    { failures: 0, lockedUntil: null, firstFailureAt: new Date() },
    { where: { keySha256: key }, transaction },
  );
}
