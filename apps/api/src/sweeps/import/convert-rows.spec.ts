import { describe, expect, it } from 'vitest';
import { parseSweepFile } from '../parse';
import { RowConverter } from './convert-rows';

const geometry = { sources: {}, spacingCm: 0.1, thicknessCm: 0.05 };
const converter = (text: string) => {
  const parsed = parseSweepFile(Buffer.from(text));
  return { parsed, rows: new RowConverter(parsed, parsed.columns, 'four-point', geometry) };
};

describe('reading, pairing and converting a slice', () => {
  it('pairs a forward reading at the end of one slice with the reverse opening the next', () => {
    const { rows } = converter(
      'T (K),V (mV),I (mA),pol\n300,10,1,+\n301,10,1,+\n301,-10,1,-\n302,10,1,+\n',
    );
    const first = rows.next({ start: 0, end: 2, more: true });
    const second = rows.next({ start: 2, end: 4, more: false });
    expect(first.map((p) => [p.sourceRows, p.flags])).toEqual([[[2], ['unpaired-polarity']]]);
    expect(second.map((p) => [p.sourceRows, p.flags])).toEqual([
      [[3, 4], ['polarity-averaged']],
      [[5], ['unpaired-polarity']],
    ]);
    expect(rows.finish()).toEqual([]);
    expect(rows.problems).toEqual([]);
    expect(rows.warnings).toEqual([
      '2 reading(s) with a polarity but no opposite-polarity partner were stored on their own (rows 2, 5)',
    ]);
  });

  it('gives out no points once a row has a problem, in that slice or any later', () => {
    const { rows } = converter('T (K),V (mV),I (mA)\n300,10,1\n301,oops,1\n302,10,1\n');
    expect(rows.next({ start: 0, end: 2, more: true })).toEqual([]);
    expect(rows.next({ start: 2, end: 3, more: false })).toEqual([]);
    expect(rows.finish()).toEqual([]);
    expect(rows.problems.map((p) => p.problem)).toEqual(['"oops" is not a number']);
  });

  it('names the file when no slice gave a point', () => {
    const { rows } = converter('T (K),V (mV),I (mA)\n300,10,1\n');
    expect(rows.finish()).toEqual([]);
    expect(rows.problems.map((p) => [p.field, p.problem])).toEqual([
      ['file', 'the file holds no data rows'],
    ]);
  });
});
