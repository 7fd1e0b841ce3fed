/**
 * Chooses the geometry a sweep is converted with: the request's values first, then the wafer,
 * lot and station records, then what the file's own metadata says.
 */
import type {
  GeometrySource,
  SweepGeometry,
  SweepGeometryInput,
  SweepMethod,
} from '@rhotrace/api-types';
import { validationFailed } from '../errors';
import type { Lot } from '../lots/lot.model';
import type { Station } from '../stations/station.model';
import type { Wafer } from '../wafers/wafer.model';
import type { RecognisedMetadata } from './parse';

/** The records and file facts geometry may come from. */
export interface GeometryInputs {
  method: SweepMethod;
  request: SweepGeometryInput;
  wafer: Wafer;
  lot: Lot;
  station: Station | null;
  file: RecognisedMetadata;
  /** True when the temperature column holds RTD ohms. */
  needsRtd: boolean;
}

type Candidate = [GeometrySource, number | null | undefined];

function first(candidates: Candidate[]): [GeometrySource, number] | null {
  for (const [source, value] of candidates) {
    if (typeof value === 'number' && Number.isFinite(value) && value > 0) return [source, value];
  }
  return null;
}

/**
 * Resolves the geometry the method needs, or throws a 400 naming each missing value and where
 * it could be given.
 */
export function resolveGeometry(inputs: GeometryInputs): SweepGeometry {
  const { method, request, wafer, lot, station, file } = inputs;
  const geometry: SweepGeometry = { sources: {} };
  const problems: Array<{ field: string; problem: string }> = [];
  const pick = (
    key: keyof SweepGeometryInput | 'rtdR0Ohm',
    candidates: Candidate[],
    required: boolean,
    missing: string,
  ) => {
    const found = first(candidates);
    if (found) {
      geometry[key] = found[1];
      geometry.sources[key] = found[0];
    } else if (required) problems.push({ field: key, problem: missing });
  };
  const needsThickness = method !== 'resistivity';
  pick(
    'thicknessCm',
    [
      ['request', request.thicknessCm],
      ['wafer', wafer.thicknessCm],
      ['lot', lot.thicknessCm],
      ['file', file.thicknessCm],
    ],
    needsThickness,
    'no sample thickness is known: give thicknessCm, or record it on the wafer or its lot',
  );
  if (method === 'four-point') {
    pick(
      'spacingCm',
      [
        ['request', request.spacingCm],
        ['station', station?.probeSpacingCm],
        ['file', file.spacingCm],
      ],
      true,
      'no probe spacing is known: choose the station (stationId) or give spacingCm',
    );
    pick(
      'diameterCm',
      [
        ['request', request.diameterCm],
        ['lot', lot.diameterCm],
        ['file', file.diameterCm],
      ],
      false,
      '',
    );
  }
  if (method === 'bar') {
    pick(
      'barLengthCm',
      [
        ['request', request.barLengthCm],
        ['file', file.barLengthCm],
      ],
      true,
      'a bar needs the distance between its voltage taps: give barLengthCm',
    );
    pick(
      'barWidthCm',
      [
        ['request', request.barWidthCm],
        ['file', file.barWidthCm],
      ],
      true,
      'a bar needs its width: give barWidthCm',
    );
  }
  if (inputs.needsRtd) {
    pick(
      'rtdR0Ohm',
      [
        ['station', station?.rtdR0Ohm],
        ['file', file.rtdR0Ohm],
      ],
      true,
      'the temperature column is in RTD ohms, but no RTD R0 is known: choose the station ' +
        '(stationId) whose RTD R0 converts the readings to kelvin',
    );
  }
  if (problems.length) {
    throw validationFailed('The sweep cannot be converted without more geometry', problems);
  }
  return geometry;
}
