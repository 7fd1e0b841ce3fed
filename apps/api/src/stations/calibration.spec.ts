import { describe, expect, it } from 'vitest';
import {
  calibrationDueOn,
  calibrationIntervalMonths,
  calibrationState,
  calibrationWarning,
} from './calibration';

describe('the calibration interval', () => {
  it('is 12 months unless the lab sets another whole number of months', () => {
    expect(calibrationIntervalMonths({})).toBe(12);
    expect(calibrationIntervalMonths({ CALIBRATION_INTERVAL_MONTHS: '6' })).toBe(6);
    expect(() => calibrationIntervalMonths({ CALIBRATION_INTERVAL_MONTHS: '1.5' })).toThrow(
      /CALIBRATION_INTERVAL_MONTHS must be a whole number/,
    );
  });

  it('falls due on the same day months later, or the last day of a shorter month', () => {
    expect(calibrationDueOn('2026-06-02', 12)).toBe('2027-06-02');
    expect(calibrationDueOn('2027-01-31', 1)).toBe('2027-02-28');
    expect(calibrationDueOn('2028-01-31', 1)).toBe('2028-02-29');
  });

  it('is overdue only after the due day, and unknown without a calibration date', () => {
    const day = (s: string) => new Date(`${s}T12:00:00Z`);
    expect(calibrationState('2025-06-02', day('2026-06-02'), 12)).toEqual({
      dueOn: '2026-06-02',
      overdue: false,
    });
    expect(calibrationState('2025-06-02', day('2026-06-03'), 12).overdue).toBe(true);
    expect(calibrationState(null, day('2026-06-03'), 12)).toEqual({ dueOn: null, overdue: false });
    expect(
      calibrationWarning({ name: 'Hot chuck', calibratedOn: '2025-06-02' }, day('2026-07-01'), 12),
    ).toBe(
      'station "Hot chuck" was last calibrated on 2025-06-02; the lab\'s 12-month interval ended on 2026-06-02: treat its readings with care',
    );
  });
});
