import { describe, expect, it } from 'vitest';
import type { SweepMethod } from '@rhotrace/api-types';
import { HttpError } from '../../errors';
import { parseSweepFile } from '../parse';
import { detectColumns } from './detect-columns';
import { POINT_METHODS } from './methods';

const parsed = (text: string) => parseSweepFile(Buffer.from(text));

function problemsOf(call: () => unknown): { message: string; problems: string[] } {
  try {
    call();
  } catch (error) {
    if (!(error instanceof HttpError)) throw error;
    expect(error.status).toBe(400);
    const details = error.details as Array<{ problem: string }>;
    return { message: error.message, problems: details.map((d) => d.problem) };
  }
  throw new Error('expected a 400');
}

describe('detect columns', () => {
  it('every method needs a temperature column', () => {
    for (const method of Object.keys(POINT_METHODS) as SweepMethod[]) {
      expect(POINT_METHODS[method].requiredColumns[0]).toEqual(['temperature']);
    }
  });

  it('keeps the guesses of a complete four-point file', () => {
    const columns = detectColumns(parsed('T (K),V (mV),I (mA)\n300,1.5,1\n'), [], 'four-point');
    expect(columns.map((c) => [c.meaning, c.unit])).toEqual([
      ['temperature', 'K'],
      ['voltage', 'mV'],
      ['current', 'mA'],
    ]);
  });

  it('asks for a current when a four-point file has voltages only', () => {
    const { problems } = problemsOf(() =>
      detectColumns(parsed('T (K),V (mV)\n300,1.5\n310,1.6\n'), [], 'four-point'),
    );
    expect(problems).toEqual([
      'voltages need a current: map a current column or state the current in the file header',
    ]);
  });

  it('takes the current stated in the file header instead', () => {
    const file = parsed('# current: 1 mA\nT (K),V (mV)\n300,1.5\n310,1.6\n');
    expect(file.recognised.currentA).toBeCloseTo(1e-3, 12);
    expect(() => detectColumns(file, [], 'four-point')).not.toThrow();
  });

  it('names the second resistance a van der Pauw sweep needs', () => {
    const { message, problems } = problemsOf(() =>
      detectColumns(parsed('T (K),R (ohm)\n300,10\n310,11\n'), [], 'van-der-pauw'),
    );
    expect(message).toBe('The columns do not fit the method');
    expect(problems).toEqual([
      'a van-der-pauw sweep needs a resistance-b column; none was found or mapped',
    ]);
  });

  it('applies a mapping and refuses one that names a missing column', () => {
    const file = parsed('T (K),A,B\n300,10,11\n310,11,12\n');
    const columns = detectColumns(
      file,
      [
        { index: 1, meaning: 'resistance', unit: 'ohm' },
        { index: 2, meaning: 'resistance-b', unit: 'ohm' },
      ],
      'van-der-pauw',
    );
    expect(columns.map((c) => c.meaning)).toEqual(['temperature', 'resistance', 'resistance-b']);
    const { message, problems } = problemsOf(() =>
      detectColumns(file, [{ index: 7, meaning: 'voltage' }], 'four-point'),
    );
    expect(message).toBe('The column mapping is not valid');
    expect(problems).toEqual(['the file has no column 7 (it has 3)']);
  });
});
