/**
 * Stage 5, turn a row into a point: a reading, or a forward/reverse pair averaged, becomes
 * sheet resistance and resistivity through the method's entry in `POINT_METHODS`. The physics
 * library's `PhysicsInputError` says which argument it refused: a geometry argument makes the
 * whole upload a 400, anything else is a problem of that row. A map reading (with a
 * `SitePlacer`) is placed on the wafer and divided by its edge factor; a map converts without
 * the centred-slice diameter correction, which the edge factor replaces.
 */
import type {
  ColumnMeaning,
  PointFlag,
  RowProblem,
  SweepGeometry,
  SweepMethod,
} from '@rhotrace/api-types';
import { PhysicsInputError } from '@rhotrace/physics';
import { validationFailed } from '../../errors';
import { rowProblem, type ResolvedColumn } from '../parse';
import type { ConvertedPoint, Reading } from './import-types';
import { POINT_METHODS, type MethodSettings, type PointInput, type PointValues } from './methods';
import type { ReadingGroup } from './pair-polarities';
import { withReciprocals } from './reciprocity';
import { dualConfigurationConverter, type SitePlacer } from './sites';

/** Arguments of the physics functions that come from the sweep's geometry, not from a row. */
const GEOMETRY_ARGUMENTS: ReadonlySet<string> = new Set([
  'diameterCm',
  'spacingCm',
  'thicknessCm',
  'lengthCm',
  'widthCm',
]);

/** The column a refused Hall argument comes from (the first of the alternatives mapped). */
const HALL_ARGUMENT_COLUMNS: Readonly<Record<string, ColumnMeaning[]>> = {
  'input.hallVoltageV': ['hall-voltage', 'hall-voltage-pp'],
  'input.magneticFieldT': ['magnetic-field'],
  'input.currentA': ['current'],
};

/** Refused together when V/I is zero or negative. */
const VOLTAGE_OVER_CURRENT = 'voltageV and currentA';

/** Forward and reverse readings further apart than this (relative) are flagged. */
export const POLARITY_ASYMMETRY_LIMIT = 0.02;

/**
 * The relative difference of the forward and reverse readings of a pair, |R+ - R-| / R, with R
 * the pair's averaged value; null for a lone reading or where a reading lacks the values.
 */
function polarityAsymmetry(
  f: Reading,
  r: Reading | undefined,
  averaged: PointInput,
): number | null {
  if (!r) return null;
  const vi = (x: Reading) =>
    x.voltageV !== null && x.currentA ? x.voltageV / x.currentA : x.resistanceOhm;
  const avg =
    averaged.voltageV !== null && averaged.currentA
      ? averaged.voltageV / averaged.currentA
      : averaged.resistanceOhm;
  const a = vi(f);
  const b = vi(r);
  if (a === null || b === null || !avg) return null;
  return Math.abs(a - b) / Math.abs(avg);
}

/** Mean of a value of the forward and reverse readings (null if either lacks it). */
function pairMean(f: number | null, r: number | null): number | null {
  return f === null || r === null ? null : (f + r) / 2;
}

/**
 * The values of a group. Forward/reverse: V = (V+ - V-)/2 over I = (I+ - I-)/2 cancels thermal
 * EMFs; resistances are averaged.
 */
function pointInput(f: Reading, r: Reading | undefined): PointInput {
  if (!r) return f;
  return {
    voltageV: f.voltageV !== null && r.voltageV !== null ? (f.voltageV - r.voltageV) / 2 : null,
    currentA: f.currentA !== null && r.currentA !== null ? (f.currentA - r.currentA) / 2 : null,
    resistanceOhm: pairMean(f.resistanceOhm, r.resistanceOhm),
    resistanceBOhm: pairMean(f.resistanceBOhm, r.resistanceBOhm),
    sheetResistanceOhmSq: pairMean(f.sheetResistanceOhmSq, r.sheetResistanceOhmSq),
    resistivityOhmCm: pairMean(f.resistivityOhmCm, r.resistivityOhmCm),
    resistanceReciprocalOhm: pairMean(
      f.resistanceReciprocalOhm ?? null,
      r.resistanceReciprocalOhm ?? null,
    ),
    resistanceBReciprocalOhm: pairMean(
      f.resistanceBReciprocalOhm ?? null,
      r.resistanceBReciprocalOhm ?? null,
    ),
    // Hall readings reverse their current within a row; a pair keeps the forward one's.
    magneticFieldT: f.magneticFieldT ?? null,
    hallVoltageV: f.hallVoltageV ?? null,
    hallReversalsV: f.hallReversalsV ?? null,
  };
}

/**
 * A converter of reading groups to points for one sweep; null after noting a row problem in
 * `problems`. Throws a 400 when the physics refuses the geometry (a diameter under three probe
 * spacings).
 */
export function pointMaker(
  method: SweepMethod,
  geometry: SweepGeometry,
  columns: ResolvedColumn[],
  problems: RowProblem[],
  settings: MethodSettings = { hallFactor: 1 },
  placer: SitePlacer | null = null,
): (group: ReadingGroup) => ConvertedPoint | null {
  const correction = placer?.info.correction ?? 'none';
  const compute: (input: PointInput) => PointValues & { edgeFactor?: number } =
    correction === 'dual-configuration'
      ? dualConfigurationConverter(geometry)
      : POINT_METHODS[method].converter(placer ? withoutDiameter(geometry) : geometry, settings);
  const valueColumn =
    columns.find((c) => c.meaning === 'voltage' || c.meaning === 'resistance')?.header ?? null;
  const columnOf = (argument: string): string | null => {
    const meanings = HALL_ARGUMENT_COLUMNS[argument];
    if (!meanings) return valueColumn;
    return columns.find((c) => meanings.includes(c.meaning))?.header ?? valueColumn;
  };
  return ({ forward: f, reverse: r, flag }) => {
    const { input, fault } = withReciprocals(pointInput(f, r));
    const placement = placer ? placer.place(f) : null;
    if (placer && !placement) return null;
    if (placement && r && !sameSite(f, r)) {
      problems.push(
        rowProblem(
          r.row,
          null,
          'the reverse reading lies at another site than its forward reading',
        ),
      );
      return null;
    }
    let values: PointValues & { edgeFactor?: number };
    try {
      values = compute(input);
    } catch (error) {
      if (!(error instanceof PhysicsInputError)) throw error;
      if (GEOMETRY_ARGUMENTS.has(error.argument)) {
        throw validationFailed('The geometry does not fit the method', [
          { field: 'geometry', problem: error.requirement },
        ]);
      }
      problems.push(
        rowProblem(
          f.row,
          columnOf(error.argument),
          error.argument === VOLTAGE_OVER_CURRENT
            ? 'voltage and current have opposite signs (a negative resistance); check the wiring or the polarity column'
            : HALL_ARGUMENT_COLUMNS[error.argument]
              ? `the Hall coefficient cannot be computed: ${error.requirement}`
              : `the resistivity cannot be computed: ${error.requirement}`,
        ),
      );
      return null;
    }
    const asymmetry = polarityAsymmetry(f, r, input);
    const flags: PointFlag[] = flag ? [flag] : [];
    let edgeFactor: number | null = null;
    if (placement) {
      edgeFactor = values.edgeFactor ?? placement.edgeFactor;
      if (correction === 'edge-images') {
        values = {
          sheetResistanceOhmSq:
            values.sheetResistanceOhmSq === null ? null : values.sheetResistanceOhmSq / edgeFactor,
          resistivityOhmCm: values.resistivityOhmCm / edgeFactor,
        };
      }
      if (placement.excluded) flags.push('edge-exclusion');
    }
    const point: ConvertedPoint = {
      sourceRows: r ? [f.row, r.row] : [f.row],
      recordIndexes: r ? [f.record, r.record] : [f.record],
      temperatureK: r ? (f.temperatureK + r.temperatureK) / 2 : f.temperatureK,
      currentA: input.currentA,
      voltageV: input.voltageV,
      resistanceOhm: input.resistanceOhm,
      sheetResistanceOhmSq: values.sheetResistanceOhmSq,
      resistivityOhmCm: values.resistivityOhmCm,
      flags,
      site: placement?.site ?? null,
      edgeFactor,
      ...(values.quantities ? { quantities: values.quantities } : {}),
    };
    if (asymmetry !== null && asymmetry > POLARITY_ASYMMETRY_LIMIT) {
      flags.push('polarity-asymmetry');
      point.reasons = {
        ...point.reasons,
        'polarity-asymmetry': `forward and reverse readings differ by ${(asymmetry * 100).toFixed(1)} % (a rectifying or drifting contact, or a thermoelectric offset)`,
      };
    }
    if (fault !== null) {
      flags.push('contact-fault');
      point.reasons = { ...point.reasons, 'contact-fault': fault };
    }
    if (input.resistanceOhm && input.resistanceBOhm && method === 'van-der-pauw') {
      point.resistanceRatio = input.resistanceOhm / input.resistanceBOhm;
    }
    return point;
  };
}

/** The geometry without the slice diameter (a map's edge factor replaces the centred one). */
function withoutDiameter(geometry: SweepGeometry): SweepGeometry {
  const { diameterCm: _diameter, ...rest } = geometry;
  return rest;
}

/** True when a forward and a reverse reading name one site. */
function sameSite(f: Reading, r: Reading): boolean {
  const a = f.site;
  const b = r.site;
  if (!a || !b || a.kind !== b.kind) return !a && !b;
  return a.kind === 'xy' && b.kind === 'xy'
    ? a.xMm === b.xMm && a.yMm === b.yMm
    : a.kind === 'number' && b.kind === 'number' && a.number === b.number;
}
