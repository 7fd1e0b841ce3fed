import type { ColumnMeaning, SweepPreviewResponse } from '@rhotrace/api-types';

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
  'resistance-reciprocal': ['ohm', 'mohm', 'kohm', 'Mohm'],
  'resistance-b-reciprocal': ['ohm', 'mohm', 'kohm', 'Mohm'],
};

/**
 * What a column holds, in the words of the mapping sentence ("Column “T (°C)” holds
 * temperature in °C"). A new meaning needs only its entry here and its units above.
 */
export const MEANING_WORDS: Record<ColumnMeaning, string> = {
  temperature: 'temperature',
  voltage: 'voltage',
  current: 'current',
  resistance: 'resistance V/I (or R_A)',
  'resistance-b': 'resistance R_B (van der Pauw)',
  'sheet-resistance': 'sheet resistance',
  resistivity: 'resistivity',
  polarity: 'current direction',
  'current-level': 'current level',
  time: 'time',
  index: 'reading number',
  other: 'nothing Rhotrace uses',
  'site-x': 'map site x (from the wafer centre)',
  'site-y': 'map site y (away from the flat or notch)',
  site: 'map site number (of the chosen pattern)',
  'site-label': 'map site name',
  'magnetic-field': 'magnetic field',
  'hall-voltage': 'Hall voltage (offsets removed)',
  'hall-voltage-pp': 'Hall voltage at +B, +I',
  'hall-voltage-pn': 'Hall voltage at +B, −I',
  'hall-voltage-np': 'Hall voltage at −B, +I',
  'hall-voltage-nn': 'Hall voltage at −B, −I',
  'reference-junction': 'Reference (cold) junction temperature',
  'resistance-reciprocal': 'reciprocal of R_A (R_CD,AB, contacts swapped)',
  'resistance-b-reciprocal': 'reciprocal of R_B (R_DA,BC, contacts swapped)',
};

/** How sure the column detection is, in words (a choice made by hand is certain). */
export function confidenceWords(confidence: number): string {
  if (confidence >= 0.9) return 'high';
  if (confidence >= 0.6) return 'medium: check it';
  return 'low: choose by hand';
}

/** The choice offered for a meaning: "holds temperature", or "is not used". */
export function meaningChoice(meaning: ColumnMeaning): string {
  return meaning === 'other' ? 'is not used' : `holds ${MEANING_WORDS[meaning]}`;
}

/** Words shown for each measurement method (shared with the printed reports). */
export { METHOD_WORDS } from '@rhotrace/api-types';

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

/** The separators the import reads, in the words of the layout sentence. */
export const DELIMITER_WORDS: Record<SweepPreviewResponse['delimiter'], string> = {
  ',': 'commas',
  ';': 'semicolons',
  '\t': 'tabs',
};

/** The decimal marks the import reads, in words with an example. */
export const DECIMAL_WORDS: Record<SweepPreviewResponse['decimalMark'], string> = {
  '.': 'point (1.5)',
  ',': 'comma (1,5)',
};
