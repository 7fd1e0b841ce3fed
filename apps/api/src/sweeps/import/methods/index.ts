/**
 * The measurement methods the import knows, keyed by `SweepMethod`: a new method is a new file
 * and one line here (the type makes a missing entry a compile error).
 */
import type { SweepMethod } from '@rhotrace/api-types';
import { BAR } from './bar';
import { FOUR_POINT } from './four-point';
import { HALL } from './hall';
import type { PointMethod } from './point-method';
import { RESISTIVITY } from './resistivity';
import { SHEET_RESISTANCE } from './sheet-resistance';
import { VAN_DER_PAUW } from './van-der-pauw';

export const POINT_METHODS: Readonly<Record<SweepMethod, PointMethod>> = {
  'four-point': FOUR_POINT,
  bar: BAR,
  'van-der-pauw': VAN_DER_PAUW,
  resistivity: RESISTIVITY,
  'sheet-resistance': SHEET_RESISTANCE,
  hall: HALL,
};

export type { MethodSettings, PointInput, PointMethod, PointValues } from './point-method';
