/**
 * What the import stages hand each other: a row read in stored units (`Reading`), and the point
 * made from one reading or a forward/reverse pair (`ConvertedPoint`).
 */
import type { PointFlag, PointQuantities, SweepSite } from '@rhotrace/api-types';

/** Where a row says it was measured: coordinates in mm, or a pattern's site number. */
export type RowSite =
  | { kind: 'xy'; xMm: number; yMm: number; label: string | null }
  | { kind: 'number'; number: number; label: string | null };

/** One data row read in stored units (SI, kelvin, ohm cm); null where the file has no value. */
export interface Reading {
  /** Index of the row among the parsed records. */
  record: number;
  /** Line number in the file. */
  row: number;
  temperatureK: number;
  /** 1 forward, -1 reverse, 0 when the file has no polarity column. */
  polarity: 1 | -1 | 0;
  voltageV: number | null;
  currentA: number | null;
  resistanceOhm: number | null;
  resistanceBOhm: number | null;
  sheetResistanceOhmSq: number | null;
  resistivityOhmCm: number | null;
  /** Van der Pauw reciprocal readings R_CD,AB and R_DA,BC (contacts swapped), when the file has them. */
  resistanceReciprocalOhm?: number | null;
  resistanceBReciprocalOhm?: number | null;
  /** The row's site (map files), else null or absent. */
  site?: RowSite | null;
  /** Hall sweeps: the field's magnitude, T. */
  magneticFieldT?: number | null;
  /** Hall sweeps: one Hall voltage already corrected for offsets, V. */
  hallVoltageV?: number | null;
  /** Hall sweeps: the four field and current reversals (xy = field sign, current sign), V. */
  hallReversalsV?: { pp: number; pn: number; np: number; nn: number } | null;
}

/** A converted point, ready to store. */
export interface ConvertedPoint {
  sourceRows: number[];
  /** Indexes into the parsed records of the rows this point was made from. */
  recordIndexes: number[];
  temperatureK: number;
  currentA: number | null;
  voltageV: number | null;
  resistanceOhm: number | null;
  sheetResistanceOhmSq: number | null;
  resistivityOhmCm: number;
  flags: PointFlag[];
  /** Where on the wafer (map sweeps); absent or null otherwise. */
  site?: SweepSite | null;
  /** The edge factor the reading was divided by (map sweeps with a collinear probe). */
  edgeFactor?: number | null;
  /** Quantities beyond resistivity (Hall sweeps), stored as `sweep_points.quantities`. */
  quantities?: PointQuantities | null;
  /** Why each flag the point stage set was set, in words. */
  reasons?: Partial<Record<PointFlag, string>>;
  /** Van der Pauw: R_A / R_B of the point, for the sample-shape warning. */
  resistanceRatio?: number;
  /** The ramp leg (1, 2, ...), known once the whole sweep was seen. */
  leg?: number;
}

/** Row numbers for a warning, the first ten and a count of the rest. */
export function listRows(rows: number[]): string {
  const shown = rows.slice(0, 10).join(', ');
  return rows.length > 10 ? `${shown} and ${rows.length - 10} more` : shown;
}
