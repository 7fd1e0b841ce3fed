/**
 * Guesses what each column of a sweep export holds from its header, unit and values.
 */
import type { ColumnMeaning, SweepColumn, SweepMethod } from '@rhotrace/api-types';
import { hallMeaningOf } from './hall-columns';
import { splitHeader, parseUnit, type Unit, type UnitKind } from './units';

/** A column with its unit resolved (the factor to the stored unit). */
export interface ResolvedColumn extends SweepColumn {
  unitInfo: Unit | null;
}

/** Name patterns per meaning, tried in order (more specific first). */
const NAME_RULES: Array<[ColumnMeaning, RegExp]> = [
  ['site-label', /^(site ?(label|name|id)|label|die ?name)$/i],
  ['site-x', /^(x|site ?x|x ?pos(ition)?|pos(ition)? ?x|x ?coord(inate)?)$/i],
  ['site-y', /^(y|site ?y|y ?pos(ition)?|pos(ition)? ?y|y ?coord(inate)?)$/i],
  ['site', /^(site|site ?(no\.?|nr\.?|number|#)|die|die ?(no\.?|number))$/i],
  ['index', /^(#|no\.?|nr\.?|n|idx|index|point|pt|row|step|reading|sample no\.?|seq(uence)?)$/i],
  ['time', /^(time|t_?s|elapsed|timestamp|date|clock|datetime|zeit|hora|t ?elapsed)\b/i],
  ['polarity', /^(polarity|pol|direction|dir|sign|current direction|i ?dir|i ?sign)$/i],
  ['current-level', /(level|setpoint|set ?point|range|i ?set|source ?level|nominal)/i],
  ['sheet-resistance', /(sheet|^r_?s$|^rs\b|^rsh|^r_?sq|r_?square|^r ?□)/i],
  ['resistivity', /(resistivity|^rho\b|^ρ|^p_?cm)/i],
  // Reciprocal van der Pauw readings (contacts swapped): R_CD,AB of R_A = R_AB,CD, R_DA,BC of R_B.
  [
    'resistance-reciprocal',
    /^(r|res|resistance)[ _-]?(cd[ _,]?ab|34[ _,]?12|(a|1)[ _-]?(rec|recip|reciprocal|'))$/i,
  ],
  [
    'resistance-b-reciprocal',
    /^(r|res|resistance)[ _-]?(da[ _,]?bc|41[ _,]?23|(b|2)[ _-]?(rec|recip|reciprocal|'))$/i,
  ],
  [
    'resistance-b',
    /^(r|res|resistance)[ _-]?(b|2|vert|v|23[ _,]?41|bc[ _,]?da|b ?configuration)$/i,
  ],
  ['resistance', /^(r|res|resistance|r[ _-]?(a|1|horiz|h|12[ _,]?34|ab[ _,]?cd)|v ?\/ ?i|ratio)$/i],
  [
    'reference-junction',
    /^(cold ?junction|cj|cjc|ref(erence)? ?junction|t_?ref|t_?cj|t_?rj|rj)\b/i,
  ],
  [
    'temperature',
    /^(t|temp|temperature|t_?chuck|chuck|chuck ?temp|stage|t_?sample|sample ?temp|tc|rtd|pt100|pt1000|thermometer|sensor)\b/i,
  ],
  ['magnetic-field', /^(b|b[ _-]?field|field|mag(netic)?[ _-]?field|flux( density)?|b[ _]?set)$/i],
  ['voltage', /^(v|u|volt|voltage|v_?meas|v_?4pp|v_?23|v ?probe|spannung)\b/i],
  ['current', /^(i|curr|current|i_?src|i_?source|i_?14|source ?current|strom)\b/i],
];

const UNIT_MEANING: Record<UnitKind, ColumnMeaning> = {
  temperature: 'temperature',
  voltage: 'voltage',
  current: 'current',
  resistance: 'resistance',
  'sheet-resistance': 'sheet-resistance',
  resistivity: 'resistivity',
  time: 'time',
  length: 'other',
  'magnetic-field': 'magnetic-field',
};

/** The Hall-voltage meanings: voltages like `voltage`, but never the resistivity's V. */
const HALL_VOLTAGES: ReadonlySet<ColumnMeaning> = new Set([
  'hall-voltage',
  'hall-voltage-pp',
  'hall-voltage-pn',
  'hall-voltage-np',
  'hall-voltage-nn',
]);

/** Meanings that read as numbers; the rest may hold text. */
export const NUMERIC_MEANINGS: ReadonlySet<ColumnMeaning> = new Set([
  'temperature',
  'voltage',
  'current',
  'resistance',
  'resistance-b',
  'sheet-resistance',
  'resistivity',
  'current-level',
  'site-x',
  'site-y',
  'site',
  'magnetic-field',
  ...HALL_VOLTAGES,
  'reference-junction',
  'resistance-reciprocal',
  'resistance-b-reciprocal',
]);

/** Units a meaning may carry (a temperature in ohms is an RTD reading). */
export function unitFitsMeaning(meaning: ColumnMeaning, unit: Unit): boolean {
  switch (meaning) {
    case 'temperature':
      // ohms: a platinum RTD or a table sensor; volts: a thermocouple (mV) or a diode (V)
      return (
        unit.kind === 'temperature' ||
        unit.kind === 'voltage' ||
        (unit.kind === 'resistance' && unit.factor === 1)
      );
    case 'reference-junction':
      return unit.kind === 'temperature';
    case 'resistance':
    case 'resistance-b':
    case 'resistance-reciprocal':
    case 'resistance-b-reciprocal':
      return unit.kind === 'resistance';
    case 'current-level':
      return unit.kind === 'current';
    case 'site-x':
    case 'site-y':
      return unit.kind === 'length';
    case 'magnetic-field':
      return unit.kind === 'magnetic-field';
    case 'voltage':
    case 'current':
    case 'sheet-resistance':
    case 'resistivity':
    case 'time':
      return unit.kind === meaning;
    default:
      return HALL_VOLTAGES.has(meaning) ? unit.kind === 'voltage' : true;
  }
}

/** The unit a meaning is assumed to use when the header names none. */
function defaultUnit(meaning: ColumnMeaning): Unit | null {
  const label: Partial<Record<ColumnMeaning, string>> = {
    temperature: 'K',
    voltage: 'V',
    current: 'A',
    resistance: 'ohm',
    'resistance-b': 'ohm',
    'resistance-reciprocal': 'ohm',
    'resistance-b-reciprocal': 'ohm',
    'sheet-resistance': 'ohm/sq',
    resistivity: 'ohm_cm',
    'current-level': 'A',
    time: 's',
    'site-x': 'mm',
    'site-y': 'mm',
    'magnetic-field': 'T',
  };
  const l = HALL_VOLTAGES.has(meaning) ? 'V' : label[meaning];
  return l ? parseUnit(l) : null;
}

function guessOne(index: number, header: string, unitCell: string | null): ResolvedColumn {
  const parts = splitHeader(header);
  let unit = unitCell ? parseUnit(unitCell.replace(/^[[(]\s*|\s*[)\]]$/g, '')) : parts.unit;
  const name = parts.name;
  const hall = hallMeaningOf(header);
  const byName = hall ?? NAME_RULES.find(([, re]) => re.test(name))?.[0] ?? null;
  // A suffix that contradicts the name (`R_A` is van der Pauw's R_A, not amperes) is not a unit.
  if (unit && byName && parts.fromSuffix && !unitFitsMeaning(byName, unit)) unit = null;
  const rtdName = /(rtd|pt100|pt1000|sensor|thermometer)/i.test(name);
  let meaning: ColumnMeaning;
  let confidence: number;
  if (byName && unit && unitFitsMeaning(byName, unit)) {
    meaning = byName;
    confidence = 0.95;
  } else if (unit && unit.kind === 'resistance' && unit.factor === 1 && rtdName) {
    meaning = 'temperature';
    confidence = 0.9;
  } else if (unit && !byName) {
    meaning = UNIT_MEANING[unit.kind];
    confidence = 0.8;
  } else if (byName && !unit) {
    meaning = byName;
    // A bracketed unit Rhotrace does not know stays unknown (never silently kelvin or volts).
    // (`V(+B,+I)` brackets its signs, not a unit.)
    const unknownUnit = parts.unitText !== null && !parts.fromSuffix && !hall;
    if (!unknownUnit) {
      unit = rtdName && byName === 'temperature' ? parseUnit('ohm') : defaultUnit(byName);
    }
    confidence = byName === 'index' || byName === 'polarity' ? 0.9 : unknownUnit ? 0.3 : 0.6;
  } else if (byName && unit) {
    // Name and unit disagree: trust the unit, say so through a low confidence.
    meaning = UNIT_MEANING[unit.kind];
    confidence = 0.5;
  } else {
    meaning = 'other';
    confidence = 0;
  }
  return {
    index,
    header,
    meaning,
    unit: unit?.label ?? null,
    unitInfo: unit,
    confidence,
  };
}

/**
 * Guesses every column. Each meaning but `other`, `index` and `time` goes to one column only
 * (the first, most confident); a second resistance column becomes `resistance-b`.
 */
export function guessColumns(
  headers: string[],
  units: string[] | null,
  width: number,
): ResolvedColumn[] {
  const columns: ResolvedColumn[] = [];
  for (let i = 0; i < width; i++) {
    const header = headers[i]?.trim() || `column ${i + 1}`;
    columns.push(guessOne(i, header, units?.[i] ?? null));
  }
  // Repeated headers get `#2`, `#3` (after guessing), so each column's raw cells keep a name.
  const used = new Set<string>();
  for (const c of columns) {
    let name = c.header;
    for (let n = 2; used.has(name); n++) name = `${c.header} #${n}`;
    used.add(name);
    c.header = name;
  }
  const taken = new Map<ColumnMeaning, ResolvedColumn>();
  for (const c of [...columns].sort((a, b) => b.confidence - a.confidence || a.index - b.index)) {
    if (c.meaning === 'other' || c.meaning === 'index' || c.meaning === 'time') continue;
    if (c.meaning === 'resistance' && taken.has('resistance') && !taken.has('resistance-b')) {
      c.meaning = 'resistance-b';
    }
    if (taken.has(c.meaning)) {
      Object.assign(c, { meaning: 'other', unit: null, unitInfo: null, confidence: 0 });
      continue;
    }
    taken.set(c.meaning, c);
  }
  // R_B should come after R_A in file order.
  const a = taken.get('resistance');
  const b = taken.get('resistance-b');
  if (a && b && b.index < a.index) [a.meaning, b.meaning] = ['resistance-b', 'resistance'];
  return columns;
}

/** The method the columns and metadata suggest, or null when nothing fits. */
export function suggestMethod(
  columns: SweepColumn[],
  methodHint: string | null,
): SweepMethod | null {
  const has = (m: ColumnMeaning) => columns.some((c) => c.meaning === m);
  // Hall columns decide before a hint: a Hall file often names van der Pauw in its header.
  const hall = has('magnetic-field') && (has('hall-voltage') || has('hall-voltage-pp'));
  if (hall && has('temperature')) return 'hall';
  if (methodHint) {
    if (/pauw|vdp/i.test(methodHint)) return 'van-der-pauw';
    if (/bar|bridge|hall ?bar/i.test(methodHint)) return 'bar';
    if (/four|4[ -]?p|collinear/i.test(methodHint)) return 'four-point';
  }
  if (!has('temperature')) return null;
  if (has('resistance') && has('resistance-b')) return 'van-der-pauw';
  if (has('resistivity')) return 'resistivity';
  if (has('sheet-resistance')) return 'sheet-resistance';
  if ((has('voltage') && has('current')) || has('resistance') || has('voltage'))
    return 'four-point';
  return null;
}
