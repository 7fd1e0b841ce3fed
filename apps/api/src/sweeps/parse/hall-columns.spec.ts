import { describe, expect, it } from 'vitest';
import { guessColumns, suggestMethod } from './columns';
import { parseUnit } from './units';

const one = (header: string) => {
  const c = guessColumns([header], null, 1)[0]!;
  return `${c.meaning} ${c.unit}`;
};

describe('Hall column detection', () => {
  it.each([
    ['V(+B,+I) [mV]', 'hall-voltage-pp mV'],
    ['V(+B-I) (mV)', 'hall-voltage-pn mV'],
    ['V(B-,I+)', 'hall-voltage-np V'],
    ['V B- I-', 'hall-voltage-nn V'],
    ['V_pn', 'hall-voltage-pn V'],
    ['V_H', 'hall-voltage V'],
    ['V_H_mV', 'hall-voltage mV'],
    ['Hall (uV)', 'hall-voltage uV'],
    ['U_H (V)', 'hall-voltage V'],
    ['B (T)', 'magnetic-field T'],
    ['B-field (mT)', 'magnetic-field mT'],
    ['field_G', 'magnetic-field G'],
    ['Field [kG]', 'magnetic-field kG'],
    // Not Hall: the usual columns keep their meanings.
    ['Voltage (V)', 'voltage V'],
    ['R_B (ohm)', 'resistance-b ohm'],
    ['T (K)', 'temperature K'],
  ])('reads %s as %s', (header, expected) => {
    expect(one(header)).toBe(expected);
  });

  it('converts gauss and millitesla to tesla (1 G = 1e-4 T)', () => {
    expect(parseUnit('G')!.factor).toBe(1e-4);
    expect(parseUnit('kG')!.factor).toBeCloseTo(0.1, 15);
    expect(parseUnit('mT')!.factor).toBe(1e-3);
    expect(parseUnit('T')!.kind).toBe('magnetic-field');
  });

  it('suggests the hall method for a field and a Hall voltage, even with a van der Pauw hint', () => {
    const columns = guessColumns(['T (K)', 'R_A', 'R_B', 'I (mA)', 'B (T)', 'V_H (mV)'], null, 6);
    expect(suggestMethod(columns, 'van der Pauw')).toBe('hall');
    expect(suggestMethod(guessColumns(['T (K)', 'R_A', 'R_B'], null, 3), null)).toBe(
      'van-der-pauw',
    );
  });
});
