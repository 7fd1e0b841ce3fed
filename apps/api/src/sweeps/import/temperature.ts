/**
 * How the temperature column becomes kelvin: kelvin or °C as written; ohms through a platinum
 * RTD (IEC 60751) or the station's calibration table; volts through a thermocouple's ITS-90
 * reference function with cold-junction compensation, or a diode's calibration table. The
 * thermocouple type and cold junction come from the file first (a `thermocouple: K` or
 * `cold junction: 23.4 °C` line, a reference-junction column), then the station's sensor.
 */
import {
  THERMOCOUPLE_LETTERS,
  type StationSensor,
  type SweepGeometry,
  type TemperatureConversion,
  type ThermocoupleLetter,
} from '@rhotrace/api-types';
import {
  calibrationTableTemperatureK,
  celsiusToKelvin,
  kelvinToCelsius,
  rtdTemperatureK,
  thermocoupleTemperatureK,
} from '@rhotrace/physics';
import { validationFailed } from '../../errors';
import type { RecognisedMetadata, ResolvedColumn } from '../parse';

/** Converts one cell (in stored units: K, degC, ohm or V) to kelvin; may throw the physics' errors. */
export interface TemperatureReader {
  conversion: TemperatureConversion;
  /** `referenceJunctionK` is the row's reference-junction cell in kelvin (null without a column). */
  toKelvin(value: number, referenceJunctionK: number | null): number;
}

/** What the conversion may draw on. */
export interface TemperatureSources {
  column: ResolvedColumn;
  /** The file has a reference-junction column. */
  referenceColumn: boolean;
  sensor: StationSensor | null;
  file: RecognisedMetadata;
  geometry: Pick<SweepGeometry, 'rtdR0Ohm'>;
}

const fail = (problem: string): never => {
  throw validationFailed('The temperature column cannot be converted', [
    { field: 'temperature', problem },
  ]);
};

/** The reader for the temperature column; a 400 naming what is missing when there is none. */
export function temperatureReader(s: TemperatureSources): TemperatureReader {
  const unit = s.column.unitInfo;
  if (!unit) return fail(`the unit of "${s.column.header}" is not known`);
  if (unit.kind === 'temperature') {
    return unit.label === 'degC'
      ? { conversion: { kind: 'celsius', description: '°C as written' }, toKelvin: celsiusToKelvin }
      : { conversion: { kind: 'kelvin', description: 'kelvin as written' }, toKelvin: (k) => k };
  }
  if (s.sensor?.kind === 'table') return tableReader(s.sensor.points, unit.kind);
  if (unit.kind === 'resistance') {
    const r0 = s.geometry.rtdR0Ohm;
    if (r0 === undefined) return fail('RTD ohms need R0 (the station sensor or an `R0` line)');
    return {
      conversion: {
        kind: 'platinum-rtd',
        description: `platinum RTD, IEC 60751, R0 = ${r0} Ω`,
      },
      toKelvin: (ohm) => rtdTemperatureK(ohm, r0),
    };
  }
  return thermocoupleReader(s);
}

function tableReader(
  points: Array<{ reading: number; temperatureK: number }>,
  kind: string,
): TemperatureReader {
  const unit = kind === 'voltage' ? 'V' : 'Ω';
  return {
    conversion: {
      kind: 'table',
      description: `the station's calibration table (${points.length} points, readings in ${unit}), monotone cubic Hermite`,
    },
    toKelvin: (reading) => calibrationTableTemperatureK(points, reading),
  };
}

function thermocoupleReader(s: TemperatureSources): TemperatureReader {
  const stationTc = s.sensor?.kind === 'thermocouple' ? s.sensor : null;
  const fromFile = s.file.thermocoupleType;
  if (fromFile !== undefined && !(THERMOCOUPLE_LETTERS as readonly string[]).includes(fromFile)) {
    fail(
      `the file's thermocouple type "${fromFile}" is not one of ${THERMOCOUPLE_LETTERS.join(', ')}`,
    );
  }
  const type = (fromFile as ThermocoupleLetter | undefined) ?? stationTc?.type ?? null;
  if (!type) {
    return fail(
      `"${s.column.header}" holds a voltage: state the thermocouple type with a "thermocouple: K" line in the file or in the station's sensor`,
    );
  }
  const fixed: [number, string] | null =
    s.file.referenceJunctionK !== undefined
      ? [s.file.referenceJunctionK, 'file metadata']
      : stationTc?.referenceJunctionK != null
        ? [stationTc.referenceJunctionK, 'station sensor']
        : null;
  if (!s.referenceColumn && !fixed) {
    fail(
      'a thermocouple reading needs its cold-junction temperature: a "cold junction: 23.4 °C" line, a reference-junction column, or the station sensor\'s referenceJunctionK (273.15 K for an ice bath)',
    );
  }
  const typeText = `${fromFile ? 'file' : 'station'}`;
  const junction = s.referenceColumn
    ? 'the reference-junction column, row by row'
    : `${kelvinToCelsius(fixed![0]).toFixed(2)} °C (${fixed![1]})`;
  return {
    conversion: {
      kind: 'thermocouple',
      description: `type ${type} thermocouple (${typeText}), ITS-90 reference function (NIST Monograph 175), cold junction at ${junction}`,
    },
    toKelvin: (volts, rowJunctionK) =>
      thermocoupleTemperatureK(type, volts * 1e3, rowJunctionK ?? fixed![0]),
  };
}
