import { alsoShownIn } from '@rhotrace/api-types';
import { PHYSICS_DEFAULTS, fitLinearTcr } from '@rhotrace/physics';
import { z } from 'zod';
import { withPhysicsOnData } from '../../analysis/physics-errors';
import { computationOf } from '../fit-computation';
import type { FitKindEntry } from '../fit-kinds';
import { boundsInOrder, fitOptionsShape, kelvin } from '../fit-schemas';

/** Linear temperature coefficient through `fitLinearTcr`. */
export const tcrKind: FitKindEntry<'tcr'> = {
  schema: boundsInOrder(
    z
      .object({
        kind: z.literal('tcr'),
        referenceK: kelvin.optional(),
        minK: kelvin.optional(),
        maxK: kelvin.optional(),
        ...fitOptionsShape,
      })
      .strict(),
  ),
  run(request, context) {
    const referenceK = request.referenceK ?? PHYSICS_DEFAULTS.tcrReferenceK;
    const r = withPhysicsOnData('TCR fit', () =>
      fitLinearTcr([...context.points], referenceK, {
        stepToleranceK: context.stepToleranceK,
        temperatureUncertaintyK: context.temperatureUncertaintyK,
      }),
    );
    const p = r.parameters;
    return {
      computation: computationOf(r, context.points, {
        goodness: { referenceK },
        reading:
          `Resistivity ${p.referenceResistivityOhmCm.toPrecision(4)} Ω·cm at ${referenceK} K, ` +
          `rising ${(p.alphaPerK * 100).toPrecision(3)} % per kelvin ` +
          `(${Number(alsoShownIn('alphaPerK', p.alphaPerK)!.value.toPrecision(4))} ppm/K).`,
      }),
      inputs: { kind: 'tcr', referenceK },
      parameterSet: 'linear-tcr',
    };
  },
};
