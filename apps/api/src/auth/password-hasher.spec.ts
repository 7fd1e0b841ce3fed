import bcrypt from 'bcryptjs';
import { describe, expect, it } from 'vitest';
import { comparePassword, hashPassword } from './password-hasher';

describe('bcrypt in worker threads', () => {
  it('writes hashes that bcryptjs on the main thread accepts, at the cost asked for', async () => {
    const hash = await hashPassword('correct horse battery', 10);
    expect(hash).toMatch(/^\$2[aby]\$10\$/);
    expect(await bcrypt.compare('correct horse battery', hash)).toBe(true);
    expect(await bcrypt.compare('wrong horse battery', hash)).toBe(false);
  });

  it('checks hashes made on the main thread, and refuses a wrong password', async () => {
    const hash = await bcrypt.hash('Ωµ° unicode pässword', 10);
    expect(await comparePassword('Ωµ° unicode pässword', hash)).toBe(true);
    expect(await comparePassword('Ωµ° unicode password', hash)).toBe(false);
  });

  it('keeps the main thread free while hashing', async () => {
    let ticks = 0;
    const timer = setInterval(() => (ticks += 1), 5);
    await Promise.all([hashPassword('a', 11), hashPassword('b', 11)]);
    clearInterval(timer);
    // cost 11 takes about 200 ms of CPU each; a blocked loop would tick once or not at all
    expect(ticks).toBeGreaterThan(5);
  });

  it('answers a malformed hash as bcryptjs does on the main thread (no match), without hanging', async () => {
    expect(await comparePassword('x', 'not-a-bcrypt-hash')).toBe(
      await bcrypt.compare('x', 'not-a-bcrypt-hash'),
    );
    expect(await comparePassword('x', 'not-a-bcrypt-hash')).toBe(false);
  });
});
