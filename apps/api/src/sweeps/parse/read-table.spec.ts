import { seededRandom } from '@rhotrace/physics';
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { detectLayout } from './layout';
import { DataTableReader, splitPlain } from './read-table';

/** Reads `text` in stretches of `lines` lines and returns what the reader collected. */
function inStretches(text: string, lines: number) {
  const layout = detectLayout(text)!;
  const reader = new DataTableReader(text, layout);
  let calls = 0;
  while (!reader.done) {
    reader.readMore(lines);
    calls += 1;
  }
  return { table: reader.table, calls };
}

describe('reading the data section a stretch at a time', () => {
  const shapes: Array<[string, string]> = [
    [
      'LF with blank and comment lines',
      'T_K,V_V\n80,1\n81,2\n\n# pause\n82,3\n83,4\n84,5\n// note\n85,6\n',
    ],
    ['CRLF without a last line break', 'T_K;V_V\r\n80;1\r\n81;2\r\n\r\n82;3\r\n83;4'],
    [
      'tabs, metadata first',
      'station: P-2\noperator: a@lab.example\nT_K\tV_V\n80\t1\n81\t2\n82\t3\n',
    ],
  ];
  it.each(shapes)(
    '%s: any stretch size gives the whole-file records and file lines',
    (_name, text) => {
      const { table: whole } = inStretches(text, Infinity);
      expect(whole.records.length).toBeGreaterThan(2);
      for (const lines of [1, 2, 3, 5, 1000]) {
        const { table } = inStretches(text, lines);
        expect(table, `stretches of ${lines}`).toEqual(whole);
      }
    },
  );

  it('gives the right file line to each record, counted from the top of the file', () => {
    const { table } = inStretches('T_K,V_V\n80,1\n\n# c\n81,2\n82,3\n', 2);
    expect(table.lines).toEqual([2, 5, 6]);
    expect(table.records).toEqual([
      ['80', '1'],
      ['81', '2'],
      ['82', '3'],
    ]);
  });

  it('reads a data section with a double quote in one go (a quoted field may span lines)', () => {
    const text = 'T_K,note\n80,"first\nsecond"\n81,plain\n82,x\n';
    const { table, calls } = inStretches(text, 1);
    expect(calls).toBe(1);
    expect(table.records).toEqual([
      ['80', 'first\nsecond'],
      ['81', 'plain'],
      ['82', 'x'],
    ]);
    expect(table.lines).toEqual([2, 4, 5]);
  });
});

describe('the split of quote-free text', () => {
  it('gives what csv-parse gives wherever it takes the text', () => {
    // the reference is csv-parse itself, with the options the reader gives it, over invented
    // snippets of cells, separators, blank lines and every kind of line break
    const random = seededRandom(3);
    const pieces = [
      '1',
      '2.5e-3',
      'a',
      ' ',
      '',
      '#',
      '\t',
      ';',
      ',',
      '\n',
      '\n',
      '\r\n',
      '\r',
      'x y',
    ];
    let split = 0;
    for (let k = 0; k < 4000; k++) {
      let text = '';
      const n = Math.floor(random() * 12);
      for (let i = 0; i < n; i++) text += pieces[Math.floor(random() * pieces.length)];
      for (const delimiter of [',', ';', '\t']) {
        const records = splitPlain(text, delimiter);
        if (!records) continue;
        split += 1;
        const options = { delimiter, relax_column_count: true, relax_quotes: true };
        expect(records, JSON.stringify(text)).toEqual(parse(text, options));
      }
    }
    expect(split).toBeGreaterThan(5000);
  });

  it('leaves quoted and mixed-break text to csv-parse', () => {
    expect(splitPlain('80,"1"\n', ',')).toBeNull();
    expect(splitPlain('80,1\r\n81,2\n', ',')).toBeNull();
    expect(splitPlain('80,1\r81,2\r', ',')).toBeNull();
    expect(splitPlain('80,1\r\n81,2\r\n', ',')).toEqual([
      ['80', '1'],
      ['81', '2'],
    ]);
  });
});
