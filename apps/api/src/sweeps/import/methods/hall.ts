/**
 * Hall: van der Pauw's R_A and R_B for rho, and the Hall voltage at a known field and current
 * for the Hall coefficient, the carrier density and the Hall mobility. The Hall voltage comes
 * from one column already corrected for offsets, or from the four field and current reversals.
 */
import type { ColumnMeaning, PointQuantities } from '@rhotrace/api-types';
import {
  hallCoefficient,
  hallMobility,
  hallVoltageFromReversals,
  vanDerPauw,
} from '@rhotrace/physics';
import type { PointMethod } from './point-method';

const REVERSALS: ColumnMeaning[] = [
  'hall-voltage-pp',
  'hall-voltage-pn',
  'hall-voltage-np',
  'hall-voltage-nn',
];

export const HALL: PointMethod = {
  requiredColumns: [
    ['temperature'],
    ['resistance'],
    ['resistance-b'],
    ['magnetic-field'],
    ['hall-voltage', ...REVERSALS],
  ],
  readsVoltageOverCurrent: false,
  requiredCells: [
    'resistance',
    'resistance-b',
    'current',
    'magnetic-field',
    'hall-voltage',
    ...REVERSALS,
  ],
  geometry: { needs: ['thicknessCm'], uses: [] },
  columnProblems(has, constantCurrentA) {
    const problems: string[] = [];
    if (!has.has('current') && constantCurrentA === undefined) {
      problems.push(
        'a hall sweep needs the sample current: map a current column or state it in the file header',
      );
    }
    const reversals = REVERSALS.filter((m) => has.has(m));
    if (reversals.length > 0 && reversals.length < 4) {
      const missing = REVERSALS.filter((m) => !has.has(m)).join(', ');
      problems.push(
        `the four field and current reversals need all four columns; missing ${missing}`,
      );
    }
    if (reversals.length === 4 && has.has('hall-voltage')) {
      problems.push(
        'map either one hall-voltage column or the four reversals, not both (they would disagree)',
      );
    }
    if (has.has('polarity')) {
      problems.push(
        'a hall sweep reverses its current within a row (hall-voltage-pn and -nn); unmap the polarity column',
      );
    }
    return problems;
  },
  converter(geometry, settings) {
    const thicknessCm = geometry.thicknessCm!;
    return (input) => {
      const vdp = vanDerPauw({
        resistanceAOhm: input.resistanceOhm!,
        resistanceBOhm: input.resistanceBOhm!,
        thicknessCm,
      });
      const rho = vdp.resistivityOhmCm!;
      const hallVoltageV = input.hallReversalsV
        ? hallVoltageFromReversals(input.hallReversalsV)
        : input.hallVoltageV!;
      const h = hallCoefficient({
        hallVoltageV,
        currentA: input.currentA!,
        magneticFieldT: input.magneticFieldT!,
        thicknessCm,
        hallFactor: settings.hallFactor,
      });
      const quantities: PointQuantities = {
        hallCoefficientCm3PerC: h.hallCoefficientCm3PerC,
        carrierDensityCm3: h.densityCm3,
        sheetCarrierDensityCm2: h.sheetDensityCm2,
        hallMobilityCm2PerVs: hallMobility(h.hallCoefficientCm3PerC, rho),
        carrierType: h.carrierType,
        magneticFieldT: input.magneticFieldT!,
        hallVoltageV,
      };
      return { sheetResistanceOhmSq: vdp.sheetResistanceOhmSq, resistivityOhmCm: rho, quantities };
    };
  },
};
