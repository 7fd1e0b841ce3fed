/**
 * What a measurement method brings to the import: the columns it needs and how a row's values
 * become sheet resistance and resistivity. One file per method, listed in `index.ts`.
 */
import type {
  ColumnMeaning,
  PointQuantities,
  SweepGeometry,
  SweepGeometryInput,
} from '@rhotrace/api-types';

/** The values a point is computed from: one reading's, or a forward/reverse pair's means. */
export interface PointInput {
  voltageV: number | null;
  currentA: number | null;
  resistanceOhm: number | null;
  resistanceBOhm: number | null;
  sheetResistanceOhmSq: number | null;
  resistivityOhmCm: number | null;
  /** Van der Pauw reciprocal readings (see `Reading`). */
  resistanceReciprocalOhm?: number | null;
  resistanceBReciprocalOhm?: number | null;
  /** Hall sweeps (see `Reading`). */
  magneticFieldT?: number | null;
  hallVoltageV?: number | null;
  hallReversalsV?: { pp: number; pn: number; np: number; nn: number } | null;
}

/** What a method computes for a point. */
export interface PointValues {
  sheetResistanceOhmSq: number | null;
  resistivityOhmCm: number;
  /** Quantities beyond resistivity (Hall). */
  quantities?: PointQuantities;
}

/** Settings of an upload that are not geometry. */
export interface MethodSettings {
  /** Hall scattering factor r_H the carrier densities are computed with (default 1). */
  hallFactor: number;
}

/** One measurement method's entry in the import's table. */
export interface PointMethod {
  /** Columns the method needs; each entry lists alternatives, one of which must be mapped. */
  requiredColumns: ColumnMeaning[][];
  /**
   * True when a row gives V and I (or V/I as a resistance column): voltages then need a current
   * column or a current stated in the file header, and V and I must be filled unless R is.
   */
  readsVoltageOverCurrent: boolean;
  /** Cells every row must fill, besides the temperature. */
  requiredCells: ColumnMeaning[];
  /** Geometry the method needs (a 400 when unknown) and uses when it is known. */
  geometry: { needs: Array<keyof SweepGeometryInput>; uses: Array<keyof SweepGeometryInput> };
  /** Further checks of the mapped columns, as problems in words (none by default). */
  columnProblems?(has: ReadonlySet<ColumnMeaning>, constantCurrentA: number | undefined): string[];
  /**
   * Makes the converter for one sweep's geometry (once per import; it is called per point).
   * It throws the physics library's `PhysicsInputError` for values it cannot use.
   */
  converter(geometry: SweepGeometry, settings: MethodSettings): (input: PointInput) => PointValues;
}

/** True when a point has V and I; without them the file gives V/I as a resistance column. */
function hasVoltageAndCurrent(input: PointInput): boolean {
  return input.voltageV !== null && input.currentA !== null;
}

/** The voltage of a point, or its V/I resistance (passed as V over a unit current). */
export function voltageOf(input: PointInput): number {
  return hasVoltageAndCurrent(input) ? input.voltageV! : input.resistanceOhm!;
}

/** The current of a point, or a unit current when the file gives V/I as a resistance. */
export function currentOf(input: PointInput): number {
  return hasVoltageAndCurrent(input) ? input.currentA! : 1;
}
