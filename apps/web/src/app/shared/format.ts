import {
  GEOMETRY_LABELS,
  GEOMETRY_SOURCE_WORDS,
  LENGTH_UNIT_OF,
  type LengthUnit,
  alsoShownIn,
  cmToLength,
  isoDay,
  isoStampUtc,
  type SweepGeometry,
} from '@rhotrace/api-types';

/** Number formatting for lab values: a few significant figures, exponents for extremes. */
export function formatValue(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e5 || magnitude < 1e-3) {
    const [mantissa, exponent] = value.toExponential(digits - 1).split('e');
    return `${mantissa} × 10${superscript(Number(exponent))}`;
  }
  return Number(value.toPrecision(digits)).toString();
}

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

/** An integer in superscript digits ("-3" as "⁻³"). */
export function superscript(n: number): string {
  return String(n)
    .split('')
    .map((c) => SUPERSCRIPT[c] ?? c)
    .join('');
}

/** Kelvin to degrees Celsius. */
export const kelvinToCelsius = (k: number): number => k - 273.15;

/** A day shown as the lab writes it, ISO 8601 YYYY-MM-DD (a timestamp gives its UTC day). */
export const formatDay = isoDay;

/** An instant shown to the minute with its zone stated: "2026-12-05 09:18 UTC". */
export const formatStamp = isoStampUtc;

/**
 * A stored length (cm) in the unit a lab reads its field in, with the unit: a thickness of
 * 0.0525 cm is "525 µm", a diameter of 15 cm is "150 mm". A missing value is a dash.
 */
export function formatLength(
  lengthCm: number | null | undefined,
  field: string,
  digits = 4,
): string {
  if (lengthCm === null || lengthCm === undefined || !Number.isFinite(lengthCm)) return '–';
  const unit = lengthUnitOf(field);
  return `${formatValue(cmToLength(lengthCm, unit), digits)} ${unit}`;
}

/** The unit a stored length field (`thicknessCm`) is typed and shown in; cm when not listed. */
export function lengthUnitOf(field: string): LengthUnit {
  return LENGTH_UNIT_OF[field] ?? 'cm';
}

/**
 * A parameter's second unit written beside its value, or '' when it has none: a TCR of
 * 0.003930 1/K gives " (3930 ppm/K)", its standard error 2.1e-5 gives " (21 ppm/K)".
 */
export function alsoShownText(key: string, value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  const also = alsoShownIn(key, value);
  return also ? ` (${formatValue(also.value, digits)} ${also.unit})` : '';
}

/**
 * A fitted value with its standard error, then the same in the parameter's second unit where it
 * has one: "0.00393 ± 2.1 × 10⁻⁵ (3930 ± 21 ppm/K)" for a TCR, "0.045 ± 0.002" for an energy.
 */
export function parameterValueText(
  key: string,
  value: number,
  standardError: number | null | undefined,
): string {
  const hasError = standardError !== null && standardError !== undefined;
  const main = `${formatValue(value, 4)}${hasError ? ` ± ${formatValue(standardError, 2)}` : ''}`;
  const also = alsoShownIn(key, value);
  if (!also) return main;
  const alsoError = hasError ? alsoShownIn(key, standardError)?.value : undefined;
  const error = alsoError === undefined ? '' : ` ± ${formatValue(alsoError, 2)}`;
  return `${main} (${formatValue(also.value, 4)}${error} ${also.unit})`;
}

/** Today's date as YYYY-MM-DD in local time. */
export function todayLocal(): string {
  const d = new Date();
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}

/**
 * The geometry a sweep was converted with, in words, units and where each value came from:
 * "thickness 524 µm from the wafer · probe spacing 1.588 mm from the station".
 */
export function geometryWords(geometry: SweepGeometry): string {
  return Object.entries(geometry)
    .flatMap(([key, value]) => {
      const label = GEOMETRY_LABELS[key];
      if (!label || typeof value !== 'number' || !Number.isFinite(value)) return [];
      const shown = key === 'rtdR0Ohm' ? `${formatValue(value)} Ω` : formatLength(value, key);
      const source =
        GEOMETRY_SOURCE_WORDS[geometry.sources[key as keyof SweepGeometry['sources']] ?? ''];
      return [`${label} ${shown}${source ? ` ${source}` : ''}`];
    })
    .join(' · ');
}
