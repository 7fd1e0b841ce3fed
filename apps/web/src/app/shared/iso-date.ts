import { Injectable, type Provider } from '@angular/core';
import {
  DateAdapter,
  MAT_DATE_FORMATS,
  MAT_NATIVE_DATE_FORMATS,
  type MatDateFormats,
  NativeDateAdapter,
} from '@angular/material/core';

/** The one way a day is typed and shown in a date field: ISO 8601, e.g. 2026-12-05. */
export const ISO_DAY_FORMAT = 'YYYY-MM-DD';

const ISO_DAY = /^(\d{4})-(\d{2})-(\d{2})$/;
const pad = (n: number) => String(n).padStart(2, '0');

/**
 * A day typed as YYYY-MM-DD, as a local-midnight Date; null for any other form or a day that
 * does not exist (2026-02-30). Other forms are refused rather than guessed: 12/05/2026 is
 * 5 December in one lab and 12 May in the next.
 */
export function dayFromIso(text: string): Date | null {
  const m = ISO_DAY.exec(text.trim());
  if (!m) return null;
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const date = new Date(year, month - 1, day);
  date.setFullYear(year); // years below 100 would otherwise be read as 19xx
  const exists =
    date.getFullYear() === year && date.getMonth() === month - 1 && date.getDate() === day;
  return exists ? date : null;
}

/** A Date's local day as YYYY-MM-DD (what the API stores for a date-only field). */
export function isoFromDay(date: Date): string {
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/** A form's date value as the API wants it: a Date or a YYYY-MM-DD text, or null when empty. */
export function isoDayOrNull(value: Date | string | null | undefined): string | null {
  if (value === null || value === undefined || value === '') return null;
  return value instanceof Date ? isoFromDay(value) : value.slice(0, 10);
}

/**
 * Material's native date adapter, typing and showing days as YYYY-MM-DD whatever the browser's
 * locale. The calendar's month names and the screen reader's labels stay in the locale.
 */
@Injectable()
export class IsoDateAdapter extends NativeDateAdapter {
  override parse(value: unknown, parseFormat?: unknown): Date | null {
    if (value instanceof Date || typeof value === 'number') return super.parse(value, parseFormat);
    if (typeof value !== 'string' || value.trim() === '') return null;
    return dayFromIso(value) ?? this.invalid();
  }

  /** A stored day (YYYY-MM-DD) is that local day, not UTC midnight (a day early west of UTC). */
  override deserialize(value: unknown): Date | null {
    if (typeof value === 'string' && ISO_DAY.test(value)) return dayFromIso(value);
    return super.deserialize(value);
  }

  override format(date: Date, displayFormat: object | string): string {
    if (displayFormat === ISO_DAY_FORMAT) return isoFromDay(date);
    return super.format(date, displayFormat);
  }
}

/** Material's date formats with the typed and shown day in ISO form. */
export const ISO_DATE_FORMATS: MatDateFormats = {
  parse: { ...MAT_NATIVE_DATE_FORMATS.parse, dateInput: ISO_DAY_FORMAT },
  display: { ...MAT_NATIVE_DATE_FORMATS.display, dateInput: ISO_DAY_FORMAT },
};

/** Providers for every date field of the app: days typed and shown as YYYY-MM-DD. */
export function provideIsoDateAdapter(): Provider[] {
  return [
    { provide: DateAdapter, useClass: IsoDateAdapter },
    { provide: MAT_DATE_FORMATS, useValue: ISO_DATE_FORMATS },
  ];
}
