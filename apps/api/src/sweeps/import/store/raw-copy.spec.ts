import { describe, expect, it } from 'vitest';
import type { Transaction } from 'sequelize';
import type { RawStorage } from '../../../storage/raw-storage';
import { RawCopy } from './raw-copy';

/** A storage whose `put` answers as `put` says and which records deletes. */
function fakeStorage(put: () => Promise<string>) {
  const deleted: string[] = [];
  const storage: RawStorage = {
    kind: 's3',
    writesInTransaction: false,
    put,
    get: () => Promise.resolve(null),
    delete: (key) => {
      deleted.push(key);
      return Promise.resolve();
    },
  };
  return { storage, deleted };
}

const transaction = {} as Transaction;

describe('the raw copy of an upload attempt', () => {
  it('removes the stored copy when the upload does not commit', async () => {
    const { storage, deleted } = fakeStorage(() => Promise.resolve('raw-1'));
    const raw = new RawCopy(storage);
    expect(await raw.put(Buffer.from('x'), transaction)).toBe('raw-1');
    await raw.discard();
    expect(deleted).toEqual(['raw-1']);
  });

  it('has nothing to remove before a put, or when the put failed, and never throws', async () => {
    const failing = fakeStorage(() => Promise.reject(new Error('store down')));
    const raw = new RawCopy(failing.storage);
    await raw.discard();
    void raw.put(Buffer.from('x'), transaction).catch(() => undefined);
    await raw.settle();
    await expect(raw.discard()).resolves.toBeUndefined();
    expect(failing.deleted).toEqual([]);
  });
});
