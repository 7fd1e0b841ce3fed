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

function superscript(n: number): string {
  return String(n)
    .split('')
    .map((c) => SUPERSCRIPT[c] ?? c)
    .join('');
}

/** Kelvin to degrees Celsius. */
export const kelvinToCelsius = (k: number): number => k - 273.15;

/** A date-only ISO value shown as the lab writes it (YYYY-MM-DD stays as is). */
export function formatDay(iso: string | null | undefined): string {
  return iso ? iso.slice(0, 10) : '–';
}

/** Today's date as YYYY-MM-DD in local time. */
export function todayLocal(): string {
  const d = new Date();
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}
