/**
 * Chooses the geometry a sweep is converted with: the request's values first, then the wafer,
 * lot and station records, then what the file's own metadata says. Which values a method
 * needs is in its entry of `POINT_METHODS`.
 */
import type {
  GeometrySource,
  SweepGeometry,
  SweepGeometryInput,
  SweepMethod,
} from '@rhotrace/api-types';
import { validationFailed } from '../../errors';
import type { Lot } from '../../lots/lot.model';
import type { Station } from '../../stations/station.model';
import type { Wafer } from '../../wafers/wafer.model';
import type { RecognisedMetadata } from '../parse';
import { POINT_METHODS } from './methods';

/** The records and file facts geometry may come from. */
export interface GeometryInputs {
  method: SweepMethod;
  request: SweepGeometryInput;
  wafer: Pick<Wafer, 'thicknessCm'>;
  lot: Pick<Lot, 'thicknessCm' | 'diameterCm'>;
  station: Pick<Station, 'probeSpacingCm' | 'rtdR0Ohm'> | null;
  file: RecognisedMetadata;
  /** True when the temperature column holds RTD ohms. */
  needsRtd: boolean;
  /** True for a wafer map, which needs the wafer diameter to place its sites. */
  isMap?: boolean;
}

type GeometryKey = keyof SweepGeometryInput | 'rtdR0Ohm';
type Candidate = [GeometrySource, number | null | undefined];

/** Where each value may come from, in order of preference, and what to say when none has it. */
const SOURCES: Record<GeometryKey, { from: (i: GeometryInputs) => Candidate[]; missing: string }> =
  {
    thicknessCm: {
      from: (i) => [
        ['request', i.request.thicknessCm],
        ['wafer', i.wafer.thicknessCm],
        ['lot', i.lot.thicknessCm],
        ['file', i.file.thicknessCm],
      ],
      missing:
        'no sample thickness is known: give thicknessCm, or record it on the wafer or its lot',
    },
    spacingCm: {
      from: (i) => [
        ['request', i.request.spacingCm],
        ['station', i.station?.probeSpacingCm],
        ['file', i.file.spacingCm],
      ],
      missing: 'no probe spacing is known: choose the station (stationId) or give spacingCm',
    },
    diameterCm: {
      from: (i) => [
        ['request', i.request.diameterCm],
        ['lot', i.lot.diameterCm],
        ['file', i.file.diameterCm],
      ],
      missing: 'a wafer map needs the wafer diameter: give diameterCm, or record it on the lot',
    },
    barLengthCm: {
      from: (i) => [
        ['request', i.request.barLengthCm],
        ['file', i.file.barLengthCm],
      ],
      missing: 'a bar needs the distance between its voltage taps: give barLengthCm',
    },
    barWidthCm: {
      from: (i) => [
        ['request', i.request.barWidthCm],
        ['file', i.file.barWidthCm],
      ],
      missing: 'a bar needs its width: give barWidthCm',
    },
    rtdR0Ohm: {
      from: (i) => [
        ['station', i.station?.rtdR0Ohm],
        ['file', i.file.rtdR0Ohm],
      ],
      missing:
        'the temperature column is in RTD ohms, but no RTD R0 is known: choose the station ' +
        '(stationId) whose RTD R0 converts the readings to kelvin',
    },
  };

/** The order values are looked up and problems listed in. */
const ORDER: GeometryKey[] = [
  'thicknessCm',
  'spacingCm',
  'diameterCm',
  'barLengthCm',
  'barWidthCm',
  'rtdR0Ohm',
];

function first(candidates: Candidate[]): [GeometrySource, number] | null {
  for (const [source, value] of candidates) {
    if (typeof value === 'number' && Number.isFinite(value) && value > 0) return [source, value];
  }
  return null;
}

/**
 * Resolves the geometry the method needs (and the optional values it uses), or throws a 400
 * naming each missing value and where it could be given.
 */
export function resolveGeometry(inputs: GeometryInputs): SweepGeometry {
  const { needs, uses } = POINT_METHODS[inputs.method].geometry;
  const required = new Set<GeometryKey>(inputs.needsRtd ? [...needs, 'rtdR0Ohm'] : needs);
  if (inputs.isMap) required.add('diameterCm');
  const wanted = new Set<GeometryKey>([...required, ...uses]);
  const geometry: SweepGeometry = { sources: {} };
  const problems: Array<{ field: string; problem: string }> = [];
  for (const key of ORDER) {
    if (!wanted.has(key)) continue;
    const found = first(SOURCES[key].from(inputs));
    if (found) {
      geometry[key] = found[1];
      geometry.sources[key] = found[0];
    } else if (required.has(key)) {
      problems.push({ field: key, problem: SOURCES[key].missing });
    }
  }
  if (problems.length) {
    throw validationFailed('The sweep cannot be converted without more geometry', problems);
  }
  return geometry;
}
