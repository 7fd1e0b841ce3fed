/** A file that already gives resistivity: stored as read. */
import type { PointMethod } from './point-method';

export const RESISTIVITY: PointMethod = {
  requiredColumns: [['temperature'], ['resistivity']],
  readsVoltageOverCurrent: false,
  requiredCells: ['resistivity'],
  geometry: { needs: [], uses: ['thicknessCm'] },
  converter() {
    return (input) => ({
      sheetResistanceOhmSq: input.sheetResistanceOhmSq,
      resistivityOhmCm: input.resistivityOhmCm!,
    });
  },
};
