import { TestBed } from '@angular/core/testing';
import { DateAdapter, MAT_DATE_FORMATS, type MatDateFormats } from '@angular/material/core';
import { FormControl } from '@angular/forms';
import { fieldError } from './field-error';
import { dayFromIso, isoFromDay, provideIsoDateAdapter } from './iso-date';

describe('the ISO date adapter', () => {
  function adapter() {
    TestBed.configureTestingModule({ providers: [provideIsoDateAdapter()] });
    return {
      dates: TestBed.inject<DateAdapter<Date>>(DateAdapter),
      formats: TestBed.inject<MatDateFormats>(MAT_DATE_FORMATS),
    };
  }

  it('reads 2026-12-05 as that local day and shows it back the same way', () => {
    const { dates, formats } = adapter();
    const day = dates.parse('2026-12-05', formats.parse.dateInput)!;
    expect([day.getFullYear(), day.getMonth(), day.getDate()]).toEqual([2026, 11, 5]);
    expect(dates.format(day, formats.display.dateInput)).toBe('2026-12-05');
    // A stored day is that day wherever the browser is, not UTC midnight.
    expect(isoFromDay(dates.deserialize('2026-12-05')!)).toBe('2026-12-05');
  });

  it('refuses 12/05/2026 and days that do not exist, with words a person can act on', () => {
    const { dates, formats } = adapter();
    for (const text of ['12/05/2026', '05.12.2026', '2026-02-30', '2026-13-01', '26-12-05']) {
      const parsed = dates.parse(text, formats.parse.dateInput);
      expect(parsed !== null && dates.isValid(parsed)).toBe(false);
    }
    expect(dates.parse('', formats.parse.dateInput)).toBeNull();
    const control = new FormControl(null);
    control.setErrors({ matDatepickerParse: { text: '12/05/2026' } });
    expect(fieldError(control)).toBe(
      'Write the date as YYYY-MM-DD, e.g. 2026-12-05 ("12/05/2026" is not).',
    );
  });

  it('round-trips every day of a leap year', () => {
    // 2028 is a leap year (Gregorian rule: divisible by 4, not a century): 366 days.
    let count = 0;
    for (let d = new Date(2028, 0, 1); d.getFullYear() === 2028; d.setDate(d.getDate() + 1)) {
      expect(isoFromDay(dayFromIso(isoFromDay(d))!)).toBe(isoFromDay(d));
      count++;
    }
    expect(count).toBe(366);
  });
});
