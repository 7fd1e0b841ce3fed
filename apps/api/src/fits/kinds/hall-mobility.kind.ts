import type { FitInterpretation, HallScattering } from '@rhotrace/api-types';
import { fitMobilityPowerLaw } from '@rhotrace/physics';
import { z } from 'zod';
import { withPhysicsOnData } from '../../analysis/physics-errors';
import { computationOf } from '../fit-computation';
import type { FitKindEntry } from '../fit-kinds';
import { boundsInOrder, fitOptionsShape, kelvin } from '../fit-schemas';
import { hallSeries } from './hall-points';

/**
 * The scattering mechanism an exponent of mu ~ T^exponent suggests: about -1.5 for acoustic
 * phonons alone, -2.2 to -2.6 where optical (intervalley) phonons join (silicon, Morin & Maita,
 * Phys. Rev. 96, 28 (1954)), about +1.5 for ionized impurities (Conwell & Weisskopf 1950);
 * anything between is a mixture (Matthiessen's rule). The boundaries -2.0, -1.0 and +1.0 are
 * common practice, no source.
 */
export function scatteringOf(exponent: number): HallScattering {
  if (exponent <= -2) return 'acoustic-and-optical-phonon';
  if (exponent <= -1) return 'acoustic-phonon';
  if (exponent >= 1) return 'ionized-impurity';
  return 'mixed';
}

const WORDS: Record<HallScattering, string> = {
  'acoustic-and-optical-phonon': 'lattice scattering by acoustic and optical phonons',
  'acoustic-phonon': 'acoustic-phonon (lattice) scattering',
  'ionized-impurity': 'ionized-impurity scattering',
  mixed: 'a mixture of lattice and impurity scattering',
};

function interpretationOf(exponent: number, ci: [number, number] | null): FitInterpretation {
  const scattering = scatteringOf(exponent);
  const spans = ci !== null && scatteringOf(ci[0]) !== scatteringOf(ci[1]);
  return {
    regime: null,
    property: null,
    valueEv: null,
    standardErrorEv: null,
    compensation: 'unknown',
    compensationSource: 'not-applicable',
    prefactorExponent: 0,
    scattering,
    note:
      `An exponent of ${exponent.toFixed(2)} suggests ${WORDS[scattering]} (about -1.5 for ` +
      'acoustic phonons, -2.2 to -2.6 in silicon with optical phonons, +1.5 for ionized ' +
      `impurities).${spans ? ' Its 95 % interval reaches another mechanism: read it as a hint.' : ''}` +
      ' Hall mobility is the drift mobility times r_H, which itself changes with temperature.',
  };
}

/** Power law mu_H = mu_300 (T/300)^exponent through `fitMobilityPowerLaw`. */
export const hallMobilityKind: FitKindEntry<'hall-mobility'> = {
  schema: boundsInOrder(
    z
      .object({
        kind: z.literal('hall-mobility'),
        minK: kelvin.optional(),
        maxK: kelvin.optional(),
        ...fitOptionsShape,
      })
      .strict(),
  ),
  run(_request, context) {
    const series = hallSeries(context.points, 'hallMobilityCm2PerVs', 'hall-mobility');
    const r = withPhysicsOnData('Hall-mobility fit', () =>
      fitMobilityPowerLaw(
        series.values.map((v) => ({ temperatureK: v.temperatureK, mobility: v.value })),
        {
          stepToleranceK: context.stepToleranceK,
          temperatureUncertaintyK: context.temperatureUncertaintyK,
        },
      ),
    );
    const ci = r.confidenceIntervals95.exponent ?? null;
    const reading = r.converged
      ? `Hall mobility ${r.mobilityAt300K.toPrecision(4)} cm²/(V s) at 300 K, varying as ` +
        `T^${r.exponent.toFixed(2)}` +
        (ci ? ` (95 %: ${ci[0].toFixed(2)} to ${ci[1].toFixed(2)}).` : '.')
      : `The fit did not converge: ${r.reason}`;
    const computation = computationOf(r, series.points, { reading });
    computation.interpretation = interpretationOf(r.exponent, ci);
    return {
      computation,
      inputs: { kind: 'hall-mobility' },
      parameterSet: 'hall-mobility-power-law',
    };
  },
};
