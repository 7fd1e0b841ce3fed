import type { PlannerResponse } from '@rhotrace/api-types';
import { describe, expect, it } from 'vitest';
import { PLAN_CSV_COLUMNS, planCsv } from './plan-csv';
import { siValue } from '../../shared/si-value';

const plan: Pick<PlannerResponse, 'steps'> = {
  steps: [
    {
      temperatureK: 80,
      expectedResistivityOhmCm: 0.927,
      expectedSheetResistanceOhmSq: 17.66,
      regime: 'freeze-out',
      currentA: 2.32e-4,
      voltageV: 9.09e-4,
      powerW: 2.11e-7,
      limitedBy: 'target-voltage',
    },
    {
      temperatureK: 300,
      expectedResistivityOhmCm: 10.2,
      expectedSheetResistanceOhmSq: 194.3,
      regime: null,
      currentA: 2.32e-4,
      voltageV: 0.01,
      powerW: 2.32e-6,
      limitedBy: 'max-power',
    },
  ],
};

describe('planCsv', () => {
  it('writes a header and one line per step in the order to visit, full precision', () => {
    const lines = planCsv(plan).split('\r\n');
    expect(lines[0]).toBe(PLAN_CSV_COLUMNS.join(','));
    expect(lines[1]).toBe('1,80,0.000232,0.000909,2.11e-7,0.927,17.66,freeze-out,target-voltage');
    expect(lines[2]).toBe('2,300,0.000232,0.01,0.00000232,10.2,194.3,,max-power');
    expect(lines).toHaveLength(4);
    expect(lines[3]).toBe('');
  });
});

describe('siValue', () => {
  it('writes three significant figures with an SI prefix', () => {
    expect(siValue(4.532e-4, 'A')).toBe('453 µA');
    expect(siValue(0.01, 'V')).toBe('10 mV');
    expect(siValue(2.11e-7, 'W')).toBe('211 nW');
    expect(siValue(1.5, 'V')).toBe('1.5 V');
  });
});
