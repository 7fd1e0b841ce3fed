import { describe, expect, it } from 'vitest';
import type { Transaction } from 'sequelize';
import { TransactionLostError } from '../../../db/transient-errors';
import type { ConvertedPoint } from '../import-types';
import { POINT_CHUNK, POINT_CHUNK_BYTES, PointWriter } from './point-writer';

const point = (row: number): ConvertedPoint => ({
  sourceRows: [row],
  recordIndexes: [row],
  temperatureK: 300,
  currentA: 1e-3,
  voltageV: 1e-2,
  resistanceOhm: null,
  sheetResistanceOhmSq: 45,
  resistivityOhmCm: 2.2,
  flags: [],
});

/** A connection that records each batch and answers as `answer` says. */
function fakeConnection(answer: (rows: unknown[][], call: number) => Promise<unknown>) {
  const batches: unknown[][][] = [];
  const statements: string[] = [];
  /** The batch count at each `end`. */
  const ended: number[] = [];
  const transaction = {
    connection: {
      batch: (sql: string, rows: unknown[][]) => {
        batches.push(rows);
        statements.push(sql);
        return answer(rows, batches.length);
      },
      end: () => {
        ended.push(batches.length);
        return Promise.resolve();
      },
    },
  } as unknown as Transaction;
  return { batches, statements, ended, transaction };
}

const inserted = (rows: unknown[][]) => Promise.resolve({ affectedRows: rows.length });

describe('the point writer', () => {
  it('numbers the points on across writes and cuts batches at POINT_CHUNK rows', async () => {
    const { batches, statements, transaction } = fakeConnection(inserted);
    const writer = new PointWriter(7, () => '[]', transaction);
    await writer.write(Array.from({ length: POINT_CHUNK + 5 }, (_, i) => point(i)));
    await writer.write([point(99_999)]);
    expect(await writer.finish()).toBe(POINT_CHUNK + 6);
    expect(batches.map((b) => b.length)).toEqual([POINT_CHUNK, 5, 1]);
    expect(statements[2]).toMatch(/\(sweep_id, sequence, source_row, .*\) VALUES \(7, \?, \?,/);
    expect(batches[2]![0]!.slice(0, 2)).toEqual([POINT_CHUNK + 6, 99_999]);
  });

  it('names the site and quantity columns only for a batch that fills them', async () => {
    const { batches, statements, transaction } = fakeConnection(inserted);
    const writer = new PointWriter(7, () => '[]', transaction);
    await writer.write([point(1)]);
    const placed = { ...point(2), site: { xMm: 1, yMm: -2, label: 'A1' }, edgeFactor: 0.9 };
    await writer.write([placed]);
    await writer.finish();
    expect(statements[0]).not.toMatch(/site_x_mm|quantities/);
    expect(statements[1]).toMatch(/leg, site_x_mm, site_y_mm, site_label, edge_factor\) VALUES/);
    expect(statements[1]).not.toMatch(/quantities/);
    expect(batches[1]![0]!.slice(-5)).toEqual([1, 1, -2, 'A1', 0.9]);
  });

  it('keeps each batch under the driver packet limit, however wide the raw rows', async () => {
    const { batches, transaction } = fakeConnection(inserted);
    const raw = 'x'.repeat(400_000);
    const writer = new PointWriter(1, () => raw, transaction);
    await writer.write(Array.from({ length: 9 }, (_, i) => point(i)));
    await writer.finish();
    // a UTF-8 bound: 3 bytes per character
    for (const b of batches)
      expect(b.length * 3 * raw.length).toBeLessThanOrEqual(POINT_CHUNK_BYTES);
    expect(batches.flat()).toHaveLength(9);
  });

  it('hands each batch to the driver once the one before has its answer', async () => {
    // mariadb 3.0.2 may run a batch handed over later before an earlier one (its prepare cache)
    const answers: Array<(affectedRows: number) => void> = [];
    const { batches, transaction } = fakeConnection(
      () => new Promise((resolve) => answers.push((affectedRows) => resolve({ affectedRows }))),
    );
    const writer = new PointWriter(1, () => '[]', transaction);
    const written = writer.write(Array.from({ length: 2 * POINT_CHUNK }, (_, i) => point(i)));
    const turn = () => new Promise((resolve) => setImmediate(resolve));
    for (let i = 0; i < 5; i++) await turn();
    expect(batches).toHaveLength(1);
    answers[0]!(POINT_CHUNK);
    for (let i = 0; i < 5; i++) await turn();
    expect(batches).toHaveLength(2);
    answers[1]!(POINT_CHUNK);
    await written;
    expect(await writer.finish()).toBe(2 * POINT_CHUNK);
  });

  it('fails when a batch reports fewer rows inserted than it sent, and sends nothing after it', async () => {
    const answers: Array<(affectedRows: number) => void> = [];
    const { batches, transaction } = fakeConnection(
      () => new Promise((resolve) => answers.push((affectedRows) => resolve({ affectedRows }))),
    );
    const writer = new PointWriter(1, () => '[]', transaction);
    const written = writer
      .write(Array.from({ length: 3 * POINT_CHUNK }, (_, i) => point(i)))
      .catch((error: unknown) => error);
    const turn = () => new Promise((resolve) => setImmediate(resolve));
    while (batches.length < 1) await turn();
    answers[0]!(POINT_CHUNK - 1);
    const error = await written;
    expect(error).toBeInstanceOf(TransactionLostError);
    expect((error as Error).message).toMatch(/points 1 to 10000: 9999 of 10000 row\(s\)/);
    expect(batches).toHaveLength(1);
  });

  it('passes a driver error on at the next write or finish', async () => {
    const refused = Object.assign(new Error('Deadlock found'), { errno: 1213 });
    const { transaction } = fakeConnection(() => Promise.reject(refused));
    const writer = new PointWriter(1, () => '[]', transaction);
    await writer.write([point(1)]).catch(() => undefined);
    await expect(writer.finish()).rejects.toBe(refused);
  });

  it('ends the connection at a fatal error, which a later statement must not inherit', async () => {
    const fatal = Object.assign(new Error('WSREP has not yet prepared node'), {
      errno: 1047,
      fatal: true,
    });
    const { ended, transaction } = fakeConnection((rows, call) =>
      call === 1 ? Promise.reject(fatal) : inserted(rows),
    );
    const writer = new PointWriter(1, () => '[]', transaction);
    await writer.write([point(1)]).catch(() => undefined);
    await expect(writer.finish()).rejects.toBe(fatal);
    expect(ended).toEqual([1]);
  });

  it('rewrites the flags of points already written, by sequence', async () => {
    const { batches, transaction } = fakeConnection(inserted);
    const writer = new PointWriter(7, () => '[]', transaction);
    const points = Array.from({ length: 4 }, (_, i) => point(i));
    await writer.write(points);
    points[1]!.flags.push('outlier');
    points[3]!.flags.push('jump', 'unsettled');
    await writer.rewriteFlags(points, [1, 3]);
    await writer.finish();
    expect(batches[1]).toEqual([
      ['outlier', 7, 2],
      ['jump,unsettled', 7, 4],
    ]);
    await expect(writer.rewriteFlags(points, [4])).rejects.toThrow(/point 5 was not written/);
  });
});
