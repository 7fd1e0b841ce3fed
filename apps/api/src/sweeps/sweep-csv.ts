/**
 * CSV export of a sweep's points, safe to open in a spreadsheet.
 */
import type { SweepColumn, SweepPointDto } from '@rhotrace/api-types';
import { looksNumeric } from './parse/numbers';

/**
 * One CSV cell. Text beginning with = + - @ (or a tab or carriage return) gets a leading
 * apostrophe so a spreadsheet does not run it as a formula; numbers, negative ones included,
 * stay numbers.
 */
export function csvCell(value: string | number | null): string {
  if (value === null) return '';
  if (typeof value === 'number') return String(value);
  let text = value;
  if (/^[=+\-@\t\r]/.test(text) && !looksNumeric(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

const FIXED = [
  'sequence',
  'source_row',
  'temperature_k',
  'current_a',
  'voltage_v',
  'resistance_ohm',
  'sheet_resistance_ohm_sq',
  'resistivity_ohm_cm',
  'flags',
];

/** Columns a map sweep's points add after the fixed ones. */
const SITE = ['site_x_mm', 'site_y_mm', 'site_label'];

/** Quantity keys in the order a Hall export lists them; other keys follow in first-seen order. */
const QUANTITY_ORDER = [
  'hallCoefficientCm3PerC',
  'carrierDensityCm3',
  'sheetCarrierDensityCm2',
  'hallMobilityCm2PerVs',
  'carrierType',
  'magneticFieldT',
  'hallVoltageV',
];

/** The quantity keys the points carry (none for most sweeps), in export order. */
function quantityKeys(points: SweepPointDto[]): string[] {
  const seen = new Set<string>();
  for (const p of points) for (const k of Object.keys(p.quantities ?? {})) seen.add(k);
  const known = QUANTITY_ORDER.filter((k) => seen.has(k));
  return [...known, ...[...seen].filter((k) => !QUANTITY_ORDER.includes(k))];
}

/** camelCase with units to the export's snake_case: `carrierDensityCm3` → `carrier_density_cm3`. */
const snake = (key: string) => key.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);

/**
 * The points as CSV: stored values first (with the site of a map sweep's points), then the
 * quantities beyond resistivity (Hall sweeps), then the file's own columns as read.
 */
export function pointsCsv(columns: SweepColumn[], points: SweepPointDto[]): string {
  const keys = quantityKeys(points);
  const isMap = points.some((p) => p.site);
  const fixed = isMap ? [...FIXED, ...SITE] : FIXED;
  const header = [...fixed, ...keys.map(snake), ...columns.map((c) => `raw ${c.header}`)]
    .map(csvCell)
    .join(',');
  const lines = [header];
  for (const p of points) {
    const raw = columns.map((c) => p.raw.map((r) => r.values[c.header] ?? '').join(' | '));
    lines.push(
      [
        p.sequence,
        p.sourceRow,
        p.temperatureK,
        p.currentA,
        p.voltageV,
        p.resistanceOhm,
        p.sheetResistanceOhmSq,
        p.resistivityOhmCm,
        p.flags.join(' '),
        ...(isMap ? [p.site?.xMm ?? null, p.site?.yMm ?? null, p.site?.label ?? null] : []),
        ...keys.map((k) => p.quantities?.[k] ?? null),
        ...raw,
      ]
        .map((v) => csvCell(v))
        .join(','),
    );
  }
  return `${lines.join('\r\n')}\r\n`;
}

/** A file name safe for Content-Disposition: no path, quotes or control characters. */
export function safeFileName(name: string, fallback: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  const cleaned = base
    // eslint-disable-next-line no-control-regex -- control characters are exactly what is removed
    .replace(/[\u0000-\u001f\u007f"*:<>?|;]/g, '_')
    .replace(/^\.+/, '')
    .trim()
    .slice(0, 200);
  return cleaned || fallback;
}
