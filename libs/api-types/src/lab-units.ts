/**
 * The units and date forms people read and type, shared by the screens, the printed reports,
 * the CSV exports and the e-mails (one rule, one place). Stored values keep their own units
 * (lengths in cm, temperature coefficients in 1/K, days as YYYY-MM-DD, instants in UTC).
 */

/** A length unit a lab writes: wafer thickness in µm, diameter and probe spacing in mm. */
export type LengthUnit = 'µm' | 'mm' | 'cm';

/** Powers of ten from a stored centimetre to each unit (1 cm = 10 mm = 10⁴ µm, SI). */
const CM_POWER: Readonly<Record<LengthUnit, number>> = { µm: 4, mm: 1, cm: 0 };

/**
 * The unit each stored length (cm) is typed and shown in, by field name. Thickness and its
 * tolerance and probe tip radii are read in micrometres; diameters, probe spacing, bar sizes and
 * edge distances in millimetres (common practice, no source; wafer specifications such as
 * SEMI M1 state diameter in mm and thickness in µm, from memory).
 */
export const LENGTH_UNIT_OF: Readonly<Record<string, LengthUnit>> = {
  thicknessCm: 'µm',
  thicknessToleranceCm: 'µm',
  tipRadiusCm: 'µm',
  diameterCm: 'mm',
  probeSpacingCm: 'mm',
  probeSpacingToleranceCm: 'mm',
  spacingCm: 'mm',
  barLengthCm: 'mm',
  barWidthCm: 'mm',
};

/** A sweep geometry field in words, as screens and reports name it (its unit from above). */
export const GEOMETRY_LABELS: Readonly<Record<string, string>> = {
  thicknessCm: 'thickness',
  diameterCm: 'diameter',
  spacingCm: 'probe spacing',
  barLengthCm: 'bar length',
  barWidthCm: 'bar width',
  rtdR0Ohm: 'thermometer R0',
};

/** Where a sweep's geometry value came from, in words (`SweepGeometry.sources`). */
export const GEOMETRY_SOURCE_WORDS: Readonly<Record<string, string>> = {
  request: 'as given',
  wafer: 'from the wafer',
  lot: 'from the lot',
  station: 'from the station',
  file: "from the file's header",
};

/**
 * `value` × 10^`power`, rounded as the decimal it is written as, so 525 µm is 0.0525 cm and not
 * 0.052500000000000005 (the shift happens in the decimal exponent, which JavaScript rounds once).
 */
function shiftDecimal(value: number, power: number): number {
  if (!Number.isFinite(value) || value === 0) return value;
  const [mantissa = '0', exponent = '0'] = String(value).split('e');
  return Number(`${mantissa}e${Number(exponent) + power}`);
}

/** A stored length in centimetres, written in `unit`: `cmToLength(0.0525, 'µm')` is 525. */
export function cmToLength(lengthCm: number, unit: LengthUnit): number {
  return shiftDecimal(lengthCm, CM_POWER[unit]);
}

/** A length typed in `unit`, in centimetres as stored: `lengthToCm(525, 'µm')` is 0.0525. */
export function lengthToCm(value: number, unit: LengthUnit): number {
  return shiftDecimal(value, -CM_POWER[unit]);
}

/**
 * Parameters also shown in a second unit beside their own, by parameter key: the unit and the
 * power of ten from the stored one. A linear TCR (1/K) is read in ppm/K too, as resistor and
 * film data sheets state it (1 ppm/K = 10⁻⁶ 1/K, SI "parts per million" convention).
 */
export const ALSO_SHOWN_IN: Readonly<Record<string, { unit: string; power: number }>> = {
  alphaPerK: { unit: 'ppm/K', power: 6 },
};

/** A parameter's value in its second unit (`alphaPerK` 0.00393 is 3930 ppm/K); null if none. */
export function alsoShownIn(key: string, value: number): { value: number; unit: string } | null {
  const also = ALSO_SHOWN_IN[key];
  return also ? { value: shiftDecimal(value, also.power), unit: also.unit } : null;
}

const pad = (n: number) => String(n).padStart(2, '0');

/** A date as the lab writes it, ISO 8601 (YYYY-MM-DD); a missing one is a dash. */
export function isoDay(value: string | Date | null | undefined): string {
  if (value === null || value === undefined || value === '') return '–';
  if (value instanceof Date) return value.toISOString().slice(0, 10);
  return value.slice(0, 10);
}

/**
 * An instant as the lab reads it, ISO 8601 day and time to the minute in UTC with the zone
 * stated: `2026-12-05 09:18 UTC`. Every screen, report and e-mail gives instants this way, so a
 * time read off a PDF matches the history on screen whatever the reader's time zone.
 */
export function isoStampUtc(value: string | Date | null | undefined): string {
  if (value === null || value === undefined || value === '') return '–';
  const d = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(d.getTime())) return '–';
  return (
    `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())} ` +
    `${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())} UTC`
  );
}
