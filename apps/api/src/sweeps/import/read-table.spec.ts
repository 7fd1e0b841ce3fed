import { describe, expect, it } from 'vitest';
import type { RowProblem } from '@rhotrace/api-types';
import { HttpError } from '../../errors';
import { openTable, readTable, slices } from './read-table';

const csv = (rows: string[]) => Buffer.from(`T (K),V (mV),I (mA)\n${rows.join('\n')}\n`);
const rows = (n: number) => Array.from({ length: n }, (_, i) => `${80 + i},1.5,1.0`);

function thrown(call: () => unknown): HttpError {
  try {
    call();
  } catch (error) {
    if (error instanceof HttpError) return error;
    throw error;
  }
  throw new Error('expected an HttpError');
}

describe('read the table', () => {
  it('refuses a UTF-16 file as a 400 naming the file field', () => {
    const error = thrown(() => readTable(Buffer.from([0xff, 0xfe, 0x41, 0x00])));
    expect(error.status).toBe(400);
    expect(error.details).toEqual([{ field: 'file', problem: expect.stringMatching(/UTF-16/) }]);
  });

  it('refuses a file without rows of numbers as a 422', () => {
    const error = thrown(() => openTable(Buffer.from('just some words\nand more\n'), 10));
    expect(error.status).toBe(422);
    expect(error.message).toMatch(/No rows of numbers/);
  });

  it('gives the records in slices, reading each just before it is given out', () => {
    const file = openTable(csv(rows(25)), 10);
    expect(file.parsed.table.records.length).toBeLessThan(25);
    expect([...slices(file, 10)]).toEqual([
      { start: 0, end: 10, more: true },
      { start: 10, end: 20, more: true },
      { start: 20, end: 25, more: false },
    ]);
    expect(file.parsed.table.records).toHaveLength(25);
  });

  it('names the rows of the wrong width in a later slice after giving out the earlier ones', () => {
    const lines = rows(25);
    lines[14] = '94,1.5';
    lines[22] = '102';
    const file = openTable(csv(lines), 10);
    const given: number[] = [];
    const error = thrown(() => {
      for (const slice of slices(file, 10)) given.push(slice.start);
    });
    expect(given).toEqual([0]);
    expect(error.status).toBe(422);
    expect(error.message).toBe('Some rows cannot be read; nothing was stored');
    expect((error.details as RowProblem[]).map((d) => d.row)).toEqual([16, 24]);
  });

  it('reads no further slice once the caller wants none', () => {
    const file = openTable(csv(rows(25)), 10);
    let calls = 0;
    const given = [...slices(file, 10, () => ++calls < 2)].map((s) => s.start);
    expect(given).toEqual([0]);
    expect(file.parsed.table.records.length).toBeLessThan(25);
  });
});
