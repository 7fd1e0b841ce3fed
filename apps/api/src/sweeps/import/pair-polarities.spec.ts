import { describe, expect, it } from 'vitest';
import type { Reading } from './import-types';
import { PolarityPairer } from './pair-polarities';

const reading = (row: number, polarity: 1 | -1 | 0): Reading => ({
  record: row - 2,
  row,
  temperatureK: 300,
  polarity,
  voltageV: polarity * 1e-3,
  currentA: polarity * 1e-3,
  resistanceOhm: null,
  resistanceBOhm: null,
  sheetResistanceOhmSq: null,
  resistivityOhmCm: null,
});

/** Groups as `forward row/reverse row:flag`. */
const shape = (groups: ReturnType<PolarityPairer['pair']>) =>
  groups.map((g) => `${g.forward.row}/${g.reverse?.row ?? '-'}:${g.flag ?? 'none'}`);

describe('pair polarities', () => {
  it('pairs neighbours of opposite polarity, forward first whatever the order', () => {
    const pairer = new PolarityPairer();
    const groups = pairer.pair(
      [reading(2, 1), reading(3, -1), reading(4, -1), reading(5, 1)],
      false,
    );
    expect(shape(groups)).toEqual(['2/3:polarity-averaged', '5/4:polarity-averaged']);
    expect(pairer.warnings).toEqual([]);
  });

  it('leaves a reading without a partner on its own and says which rows', () => {
    const pairer = new PolarityPairer();
    const groups = pairer.pair([reading(2, 1), reading(3, 1), reading(4, -1)], false);
    expect(shape(groups)).toEqual(['2/-:unpaired-polarity', '3/4:polarity-averaged']);
    expect(pairer.warnings).toEqual([
      '1 reading(s) with a polarity but no opposite-polarity partner were stored on their own (rows 2)',
    ]);
  });

  it('holds a reading at the end of a slice for the first reading of the next', () => {
    const pairer = new PolarityPairer();
    expect(shape(pairer.pair([reading(2, 0), reading(3, 1)], true))).toEqual(['2/-:none']);
    expect(shape(pairer.pair([reading(4, -1)], false))).toEqual(['3/4:polarity-averaged']);
  });

  it('gives out a reading still held after the last slice as a lone one', () => {
    const pairer = new PolarityPairer();
    expect(pairer.pair([reading(2, -1)], true)).toEqual([]);
    expect(shape(pairer.finish())).toEqual(['2/-:unpaired-polarity']);
    expect(pairer.finish()).toEqual([]);
  });
});
