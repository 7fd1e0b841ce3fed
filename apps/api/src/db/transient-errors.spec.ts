import { describe, expect, it } from 'vitest';
import { HttpError } from '../errors';
import {
  isTransientTransactionError,
  retryTransientOnce,
  TransactionLostError,
} from './transient-errors';

const sqlError = (errno: number, sqlState: string) =>
  Object.assign(new Error(`error ${errno}`), { errno, sqlState });
/** How Sequelize wraps a driver error. */
const wrapped = (original: Error) => Object.assign(new Error('wrapped'), { original });

describe('transient transaction failures', () => {
  it.each([
    ['a deadlock or Galera certification failure (1213)', sqlError(1213, '40001')],
    [
      'a Galera node not yet prepared (1047), wrapped by Sequelize',
      wrapped(sqlError(1047, '08S01')),
    ],
    ['a serialization failure by SQLSTATE', sqlError(1180, '40001')],
    ['a transaction that lost its writes', new TransactionLostError('test')],
  ])('%s is transient', (_, error) => {
    expect(isTransientTransactionError(error)).toBe(true);
  });

  it.each([
    ['a duplicate key (1062)', sqlError(1062, '23000')],
    ['a trigger refusal (1644)', wrapped(sqlError(1644, '45000'))],
    ['an HTTP error', new HttpError('unprocessable', 'bad row')],
    ['nothing at all', null],
  ])('%s is not', (_, error) => {
    expect(isTransientTransactionError(error)).toBe(false);
  });

  it('runs a transient failure once more and answers with the second attempt', async () => {
    const heard: unknown[] = [];
    let calls = 0;
    const result = await retryTransientOnce(
      'upload',
      async () => {
        calls += 1;
        if (calls === 1) throw sqlError(1213, '40001');
        return 'stored';
      },
      (e) => heard.push(e),
    );
    expect({ result, calls, heard: heard.length }).toEqual({
      result: 'stored',
      calls: 2,
      heard: 1,
    });
  });

  it('answers a second transient failure with a 503 and Retry-After', async () => {
    let calls = 0;
    const error = await retryTransientOnce('upload', async () => {
      calls += 1;
      throw new TransactionLostError('test');
    }).catch((e: unknown) => e);
    expect(calls).toBe(2);
    expect(error).toBeInstanceOf(HttpError);
    expect(error).toMatchObject({
      status: 503,
      code: 'unavailable',
      headers: { 'Retry-After': '2' },
    });
  });

  it('never repeats a failure that is not transient', async () => {
    let calls = 0;
    const refused = new HttpError('unprocessable', 'bad row');
    await expect(
      retryTransientOnce('upload', async () => {
        calls += 1;
        throw refused;
      }),
    ).rejects.toBe(refused);
    expect(calls).toBe(1);
  });
});
