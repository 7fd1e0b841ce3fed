/** Van der Pauw: the two four-terminal resistances R_A and R_B of a lamella, and its thickness. */
import { vanDerPauw } from '@rhotrace/physics';
import type { PointMethod } from './point-method';

export const VAN_DER_PAUW: PointMethod = {
  requiredColumns: [['temperature'], ['resistance'], ['resistance-b']],
  readsVoltageOverCurrent: false,
  requiredCells: ['resistance', 'resistance-b'],
  geometry: { needs: ['thicknessCm'], uses: [] },
  converter(geometry) {
    return (input) => {
      const out = vanDerPauw({
        resistanceAOhm: input.resistanceOhm!,
        resistanceBOhm: input.resistanceBOhm!,
        thicknessCm: geometry.thicknessCm!,
      });
      return {
        sheetResistanceOhmSq: out.sheetResistanceOhmSq,
        resistivityOhmCm: out.resistivityOhmCm!,
      };
    };
  },
};
