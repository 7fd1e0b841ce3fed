import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createTestContext, type TestContext } from '../testing/test-context';
import { SignInThrottle } from '../users/user.model';
import {
  ACCOUNT_POLICY,
  pruneThrottles,
  recordFailure,
  takeSignInTurn,
  THROTTLE_KEEP_S,
} from './sign-in-throttle.service';

describe('sign-in throttle rows', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
  });
  afterAll(async () => {
    vi.restoreAllMocks();
    await ctx.close();
  });

  const row = (key: string, ageS: number, lockedForS: number | null, now: Date) => ({
    keySha256: key.padEnd(64, '0'),
    failures: 2,
    firstFailureAt: new Date(now.getTime() - ageS * 1000),
    lockedUntil: lockedForS === null ? null : new Date(now.getTime() + lockedForS * 1000),
  });

  it('forgets keys with nothing left to count, and keeps recent and locked ones', async () => {
    const now = new Date();
    await SignInThrottle.bulkCreate([
      row('a1', THROTTLE_KEEP_S + 60, null, now), // old, never locked: goes
      row('a2', THROTTLE_KEEP_S + 60, -30, now), // old, lock long over: goes
      row('a3', THROTTLE_KEEP_S + 60, 600, now), // old failures but locked now: stays
      row('a4', 60, null, now), // failed a minute ago: stays
    ]);
    expect(await pruneThrottles(now)).toBe(2);
    const left = (await SignInThrottle.findAll()).map((r) => r.keySha256.slice(0, 2)).sort();
    expect(left).toEqual(['a3', 'a4']);
  });

  it('makes the row again when it is pruned between being made and being locked', async () => {
    const key = 'b1'.padEnd(64, '0');
    const real = SignInThrottle.findByPk.bind(SignInThrottle);
    let vanished = 0;
    const spy = vi.spyOn(SignInThrottle, 'findByPk').mockImplementation((async (
      ...args: Parameters<typeof real>
    ) => {
      if (vanished === 0) {
        vanished += 1;
        await SignInThrottle.destroy({ where: { keySha256: key } });
      }
      return real(...args);
    }) as typeof SignInThrottle.findByPk);
    try {
      await recordFailure(key, ACCOUNT_POLICY);
    } finally {
      spy.mockRestore();
    }
    expect(vanished).toBe(1);
    expect((await SignInThrottle.findByPk(key))?.failures).toBe(1);
    // and a sign-in turn counts on from there
    await takeSignInTurn({ account: key, address: 'c1'.padEnd(64, '0') }, ACCOUNT_POLICY);
    expect((await SignInThrottle.findByPk(key))?.failures).toBe(2);
  });
});
