/**
 * Metadata keys Rhotrace recognises in the lines before a file's header.
 */
import { readNumber } from './numbers';
import { parseUnit } from './units';

/** Values read from metadata lines, in stored units. */
export interface RecognisedMetadata {
  stationName?: string;
  thicknessCm?: number;
  diameterCm?: number;
  spacingCm?: number;
  barLengthCm?: number;
  barWidthCm?: number;
  currentA?: number;
  rtdR0Ohm?: number;
  method?: string;
  /** The sample or wafer the file says it was measured on (`Sample: DEMO-W03`). */
  sampleName?: string;
  /** `thermocouple: K`, `TC type: type K`: the letter, upper case (checked by the import). */
  thermocoupleType?: string;
  /** `cold junction: 23.4 °C`, `reference junction: 296.55 K`. */
  referenceJunctionK?: number;
}

/** `23.4 °C`, `23,4 C`, `296.55 K`: a temperature in kelvin, or undefined without a unit. */
export function readTemperatureK(value: string): number | undefined {
  const m = /^\s*([-+]?[\d.,]+(?:[eE][-+]?\d+)?)\s*(°\s*C|deg\s*C|degC|C|K)\s*$/i.exec(value);
  if (!m) return undefined;
  const n = readNumber(m[1]!, m[1]!.includes(',') && !m[1]!.includes('.') ? ',' : '.');
  if (typeof n !== 'number') return undefined;
  const kelvin = /^k$/i.test(m[2]!) ? n : n + 273.15;
  return kelvin > 0 ? kelvin : undefined;
}

const LENGTH_CM: Record<string, number> = {
  cm: 1,
  mm: 0.1,
  um: 1e-4,
  micron: 1e-4,
  microns: 1e-4,
  nm: 1e-7,
  m: 100,
  in: 2.54,
  inch: 2.54,
  '"': 2.54,
};

/** `525 um`, `0.0525 cm`, `1,0 mm`, `100mm`, `4 in`: a length in cm, or undefined. */
export function readLengthCm(value: string): number | undefined {
  const m = /^\s*([-+]?[\d.,]+(?:[eE][-+]?\d+)?)\s*([a-zA-Zµμ"]*)\s*$/.exec(value);
  if (!m) return undefined;
  const n = readNumber(m[1]!, m[1]!.includes(',') && !m[1]!.includes('.') ? ',' : '.');
  const unit = m[2]!.replace(/[µμ]/g, 'u').toLowerCase();
  const factor = unit === '' ? undefined : LENGTH_CM[unit];
  if (typeof n !== 'number' || factor === undefined || n <= 0) return undefined;
  return n * factor;
}

function readWithUnit(value: string, kind: 'current' | 'resistance'): number | undefined {
  const m = /^\s*([-+]?[\d.,]+(?:[eE][-+]?\d+)?)\s*(.*?)\s*$/.exec(value);
  if (!m) return undefined;
  const n = readNumber(m[1]!, m[1]!.includes(',') && !m[1]!.includes('.') ? ',' : '.');
  const unit = parseUnit(m[2]! || (kind === 'current' ? 'A' : 'ohm'));
  if (typeof n !== 'number' || !unit || unit.kind !== kind || n <= 0) return undefined;
  return n * unit.factor;
}

const KEYS: Array<[RegExp, (v: string, out: RecognisedMetadata) => void]> = [
  [/^(station|probe ?station|instrument|tool|setup)( ?name)?$/i, (v, o) => (o.stationName = v)],
  [/^(wafer |sample )?thickness/i, (v, o) => (o.thicknessCm = readLengthCm(v))],
  [/^(wafer |sample )?diameter/i, (v, o) => (o.diameterCm = readLengthCm(v))],
  [/^(probe )?(tip )?spacing|^probe pitch/i, (v, o) => (o.spacingCm = readLengthCm(v))],
  [/^(bar |tap )?length|^tap spacing/i, (v, o) => (o.barLengthCm = readLengthCm(v))],
  [/^(bar )?width/i, (v, o) => (o.barWidthCm = readLengthCm(v))],
  [
    /^((source|test|probe) )?current$|^i ?(source|set)$/i,
    (v, o) => (o.currentA = readWithUnit(v, 'current')),
  ],
  [
    /^(rtd )?r0$|^rtd|^r_?0|^sensor/i,
    (v, o) => {
      const pt = /pt ?(100|1000)\b/i.exec(v);
      o.rtdR0Ohm = pt ? Number(pt[1]) : readWithUnit(v, 'resistance');
    },
  ],
  [/^(method|measurement|technique|configuration)$/i, (v, o) => (o.method = v)],
  [/^(sample|wafer|specimen)( ?(name|id|no\.?|number))?$/i, (v, o) => (o.sampleName = v)],
  [
    /^(thermocouple|tc)( ?type)?$/i,
    (v, o) => (o.thermocoupleType = /^\s*(type\s*)?([a-z])\s*$/i.exec(v)?.[2]?.toUpperCase() ?? v),
  ],
  [
    /^(cold|reference|ref) ?junction( ?temp(erature)?)?$|^cjc?$/i,
    (v, o) => (o.referenceJunctionK = readTemperatureK(v)),
  ],
];

/** Reads the recognised keys; unknown keys stay in the sweep's metadata only. */
export function recogniseMetadata(metadata: Record<string, string>): RecognisedMetadata {
  const out: RecognisedMetadata = {};
  for (const [rawKey, rawValue] of Object.entries(metadata)) {
    // `Thickness (um): 525` carries its unit in the key.
    const bracket = /^(.*?)\s*[([]\s*([^)\]]+)\s*[)\]]\s*$/.exec(rawKey.trim());
    const key = bracket ? bracket[1]! : rawKey.trim();
    let value = rawValue.trim();
    if (bracket && !/[a-zA-Zµμ]/.test(value)) value = `${value} ${bracket[2]!}`;
    const rule = KEYS.find(([re]) => re.test(key));
    if (rule && value !== '') rule[1](value, out);
  }
  for (const k of Object.keys(out) as Array<keyof RecognisedMetadata>) {
    if (out[k] === undefined) delete out[k];
  }
  return out;
}
