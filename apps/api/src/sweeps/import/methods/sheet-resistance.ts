/** A file that gives sheet resistance: resistivity is R_s times the thickness. */
import { resistivityFromSheetResistance } from '@rhotrace/physics';
import type { PointMethod } from './point-method';

export const SHEET_RESISTANCE: PointMethod = {
  requiredColumns: [['temperature'], ['sheet-resistance']],
  readsVoltageOverCurrent: false,
  requiredCells: ['sheet-resistance'],
  geometry: { needs: ['thicknessCm'], uses: [] },
  converter(geometry) {
    return (input) => ({
      sheetResistanceOhmSq: input.sheetResistanceOhmSq,
      resistivityOhmCm: resistivityFromSheetResistance({
        sheetResistanceOhmSq: input.sheetResistanceOhmSq!,
        thicknessCm: geometry.thicknessCm!,
      }),
    });
  },
};
