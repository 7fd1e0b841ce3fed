/** Collinear four-point probe: V/I with the probe spacing, thickness and slice diameter. */
import { fourPointProbe } from '@rhotrace/physics';
import { currentOf, voltageOf, type PointMethod } from './point-method';

export const FOUR_POINT: PointMethod = {
  requiredColumns: [['temperature'], ['voltage', 'resistance']],
  readsVoltageOverCurrent: true,
  requiredCells: [],
  geometry: { needs: ['thicknessCm', 'spacingCm'], uses: ['diameterCm'] },
  converter(geometry) {
    // One input object for the whole sweep: a 100,000-row file makes no garbage here.
    const probeInput: Parameters<typeof fourPointProbe>[0] = {
      voltageV: 0,
      currentA: 0,
      spacingCm: geometry.spacingCm!,
      thicknessCm: geometry.thicknessCm!,
    };
    if (geometry.diameterCm !== undefined) probeInput.diameterCm = geometry.diameterCm;
    return (input) => {
      probeInput.voltageV = voltageOf(input);
      probeInput.currentA = currentOf(input);
      const out = fourPointProbe(probeInput);
      return {
        sheetResistanceOhmSq: out.sheetResistanceOhmSq,
        resistivityOhmCm: out.resistivityOhmCm,
      };
    };
  },
};
