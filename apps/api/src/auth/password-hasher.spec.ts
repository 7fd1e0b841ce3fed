import { readdirSync, readFileSync } from 'node:fs';
import { getPriority } from 'node:os';
import bcrypt from 'bcryptjs';
import { describe, expect, it } from 'vitest';
import { comparePassword, HASHER_NICE, hashPassword } from './password-hasher';

/** The nice value of every thread of this process (Linux: field 19 of /proc/self/task/N/stat). */
function threadNiceValues(): number[] {
  return readdirSync('/proc/self/task').map((tid) => {
    const stat = readFileSync(`/proc/self/task/${tid}/stat`, 'utf8');
    // the fields after the parenthesised name; nice is the 19th field overall
    return Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[16]);
  });
}

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

  it('hashes on threads of lower priority, leaving the main thread at its own', async () => {
    const before = getPriority();
    const hashing = hashPassword('c', 12);
    await hashPassword('warm-up', 4); // the pool has started its threads once this answers
    const nice = threadNiceValues();
    await hashing;
    expect(HASHER_NICE).toBeGreaterThan(0);
    expect(nice).toContain(Math.min(19, before + HASHER_NICE));
    expect(getPriority()).toBe(before);
  });

  it('answers a malformed hash as bcryptjs does on the main thread (no match), without hanging', async () => {
    expect(await comparePassword('x', 'not-a-bcrypt-hash')).toBe(
      await bcrypt.compare('x', 'not-a-bcrypt-hash'),
    );
    expect(await comparePassword('x', 'not-a-bcrypt-hash')).toBe(false);
  });
});
