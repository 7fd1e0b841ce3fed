import { describe, expect, it } from 'vitest';
import { SweepCache, type SweepIdentity } from './sweep-cache';

const sweep = (id: number, pointCount = 10): SweepIdentity => ({
  id,
  sha256: `sha-${id}`,
  createdAt: new Date('2026-12-01T00:00:00Z'),
  pointCount,
});

describe('SweepCache', () => {
  it('keeps nothing larger than its share of the limit (a quarter by default)', () => {
    const cache = new SweepCache<number[]>(100, (v) => v.length);
    cache.remember(sweep(1), new Array<number>(26).fill(0));
    expect(cache.get(sweep(1))).toBeUndefined();
    cache.remember(sweep(2), new Array<number>(25).fill(0));
    expect(cache.get(sweep(2))).toHaveLength(25);
  });

  it('with a share of one keeps a sweep as large as the limit, pushing the oldest out', () => {
    const cache = new SweepCache<number[]>(100, (v) => v.length, 1);
    cache.remember(sweep(1), new Array<number>(40).fill(0));
    cache.remember(sweep(2), new Array<number>(90).fill(0));
    expect(cache.get(sweep(2))).toHaveLength(90);
    expect(cache.get(sweep(1))).toBeUndefined();
    expect(cache.remember(sweep(3), new Array<number>(101).fill(0))).toHaveLength(101);
    expect(cache.get(sweep(3))).toBeUndefined();
  });

  it('misses another sweep stored under the same id', () => {
    const cache = new SweepCache<number[]>(100, (v) => v.length);
    cache.remember(sweep(4), [1, 2]);
    expect(cache.get({ ...sweep(4), sha256: 'another file' })).toBeUndefined();
  });
});
