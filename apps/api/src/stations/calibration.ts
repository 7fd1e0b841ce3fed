/**
 * The lab's calibration interval: a station whose last calibration is older than it is marked
 * on the stations page and warned about at upload (not refused: the readings still stand, with
 * the caveat stated). The interval is the setting `CALIBRATION_INTERVAL_MONTHS` (default 12).
 */

/** Months between calibrations when the lab sets nothing (common practice, no source). */
export const DEFAULT_CALIBRATION_INTERVAL_MONTHS = 12;

/** The interval the lab set in `env`, in whole months from 1 to 120; throws naming the setting. */
export function calibrationIntervalMonths(
  env: Record<string, string | undefined> = process.env,
): number {
  const raw = env.CALIBRATION_INTERVAL_MONTHS;
  if (raw === undefined || raw.trim() === '') return DEFAULT_CALIBRATION_INTERVAL_MONTHS;
  const months = Number(raw);
  if (!Number.isInteger(months) || months < 1 || months > 120) {
    throw new Error(
      `CALIBRATION_INTERVAL_MONTHS must be a whole number of months from 1 to 120 (got "${raw}")`,
    );
  }
  return months;
}

/**
 * The day a calibration on `calibratedOn` (YYYY-MM-DD) falls due after `months`: the same day of
 * the month, or the month's last day when it has no such day (31 Jan + 1 month = 28/29 Feb).
 */
export function calibrationDueOn(calibratedOn: string, months: number): string {
  const [y, m, d] = calibratedOn.slice(0, 10).split('-').map(Number) as [number, number, number];
  const monthIndex = m - 1 + months;
  const lastDay = new Date(Date.UTC(y, monthIndex + 1, 0)).getUTCDate();
  return new Date(Date.UTC(y, monthIndex, Math.min(d, lastDay))).toISOString().slice(0, 10);
}

/** When a station's calibration falls due and whether that day has passed on `today`. */
export function calibrationState(
  calibratedOn: string | null,
  today: Date = new Date(),
  months: number = calibrationIntervalMonths(),
): { dueOn: string | null; overdue: boolean } {
  if (!calibratedOn) return { dueOn: null, overdue: false };
  const dueOn = calibrationDueOn(calibratedOn, months);
  return { dueOn, overdue: today.toISOString().slice(0, 10) > dueOn };
}

/** The upload's warning about a station past its calibration, or null. */
export function calibrationWarning(
  station: { name: string; calibratedOn: string | null },
  today: Date = new Date(),
  months: number = calibrationIntervalMonths(),
): string | null {
  const { dueOn, overdue } = calibrationState(station.calibratedOn, today, months);
  if (!overdue) return null;
  return (
    `station "${station.name}" was last calibrated on ${station.calibratedOn!.slice(0, 10)}; ` +
    `the lab's ${months}-month interval ended on ${dueOn}: treat its readings with care`
  );
}
