/** A bar (bridge) sample: V/I between voltage taps with the bar's length, width and thickness. */
import { barResistivity } from '@rhotrace/physics';
import { currentOf, voltageOf, type PointMethod } from './point-method';

export const BAR: PointMethod = {
  requiredColumns: [['temperature'], ['voltage', 'resistance']],
  readsVoltageOverCurrent: true,
  requiredCells: [],
  geometry: { needs: ['thicknessCm', 'barLengthCm', 'barWidthCm'], uses: [] },
  converter(geometry) {
    return (input) => ({
      sheetResistanceOhmSq: input.sheetResistanceOhmSq,
      resistivityOhmCm: barResistivity({
        voltageV: voltageOf(input),
        currentA: currentOf(input),
        lengthCm: geometry.barLengthCm!,
        widthCm: geometry.barWidthCm!,
        thicknessCm: geometry.thicknessCm!,
      }),
    });
  },
};
