import type { ColumnMeaning, SweepMethod } from '@rhotrace/api-types';

/** Unit labels the import understands for each column meaning (the API's canonical spellings). */
export const UNITS_BY_MEANING: Record<ColumnMeaning, readonly string[]> = {
  temperature: ['K', 'degC', 'ohm', 'mV', 'V'],
  voltage: ['V', 'mV', 'uV', 'nV'],
  current: ['A', 'mA', 'uA', 'nA'],
  resistance: ['ohm', 'mohm', 'kohm', 'Mohm'],
  'resistance-b': ['ohm', 'mohm', 'kohm', 'Mohm'],
  'sheet-resistance': ['ohm/sq', 'kohm/sq'],
  resistivity: ['ohm_cm', 'mohm_cm', 'kohm_cm', 'ohm_m'],
  polarity: [],
  'current-level': [],
  time: ['s', 'ms', 'min', 'h'],
  index: [],
  other: [],
  'site-x': ['mm', 'cm', 'um'],
  'site-y': ['mm', 'cm', 'um'],
  site: [],
  'site-label': [],
  'magnetic-field': ['T', 'mT', 'G', 'kG'],
  'hall-voltage': ['V', 'mV', 'uV', 'nV'],
  'hall-voltage-pp': ['V', 'mV', 'uV', 'nV'],
  'hall-voltage-pn': ['V', 'mV', 'uV', 'nV'],
  'hall-voltage-np': ['V', 'mV', 'uV', 'nV'],
  'hall-voltage-nn': ['V', 'mV', 'uV', 'nV'],
  'reference-junction': ['K', 'degC'],
};

/** Words shown for each column meaning. */
export const MEANING_WORDS: Record<ColumnMeaning, string> = {
  temperature: 'Temperature',
  voltage: 'Voltage',
  current: 'Current',
  resistance: 'Resistance (V/I, or R_A)',
  'resistance-b': 'Resistance R_B (van der Pauw)',
  'sheet-resistance': 'Sheet resistance',
  resistivity: 'Resistivity',
  polarity: 'Current polarity',
  'current-level': 'Current level',
  time: 'Time',
  index: 'Row number',
  other: 'Keep as raw text',
  'site-x': 'Map site x (from the wafer centre)',
  'site-y': 'Map site y (away from the flat or notch)',
  site: 'Map site number (of the chosen pattern)',
  'site-label': 'Map site name',
  'magnetic-field': 'Magnetic field',
  'hall-voltage': 'Hall voltage (offsets removed)',
  'hall-voltage-pp': 'Hall voltage at +B, +I',
  'hall-voltage-pn': 'Hall voltage at +B, −I',
  'hall-voltage-np': 'Hall voltage at −B, +I',
  'hall-voltage-nn': 'Hall voltage at −B, −I',
  'reference-junction': 'Reference (cold) junction temperature',
};

/** Words shown for each measurement method. */
export const METHOD_WORDS: Record<SweepMethod, string> = {
  'four-point': 'Four-point probe (collinear)',
  'van-der-pauw': 'Van der Pauw square',
  bar: 'Bar with contacts',
  resistivity: 'Resistivity already computed',
  'sheet-resistance': 'Sheet resistance already computed',
  hall: 'Hall effect (van der Pauw with a field)',
};

/** A unit label as a person writes it: degC → °C, ohm → Ω, u → µ. */
export function unitLabel(unit: string | null): string {
  if (!unit) return '—';
  if (unit === 'degC') return '°C';
  if (unit === 'ohm') return 'Ω (RTD or resistance)';
  return unit
    .replace(/^u/, 'µ')
    .replace(/ohm_cm$/, 'Ω·cm')
    .replace(/ohm_m$/, 'Ω·m')
    .replace(/ohm\/sq$/, 'Ω/□')
    .replace(/ohm$/, 'Ω');
}
