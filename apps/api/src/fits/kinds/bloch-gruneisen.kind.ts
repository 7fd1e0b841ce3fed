import { fitBlochGruneisen } from '@rhotrace/physics';
import { z } from 'zod';
import { isMetal } from '../../analysis/model.service';
import { withPhysicsOnData } from '../../analysis/physics-errors';
import { computationOf } from '../fit-computation';
import type { FitKindEntry } from '../fit-kinds';
import { boundsInOrder, fitOptionsShape, kelvin } from '../fit-schemas';

/** Bloch–Grüneisen fit through `fitBlochGruneisen`. */
export const blochGruneisenKind: FitKindEntry<'bloch-gruneisen'> = {
  schema: boundsInOrder(
    z
      .object({
        kind: z.literal('bloch-gruneisen'),
        minK: kelvin.optional(),
        maxK: kelvin.optional(),
        ...fitOptionsShape,
      })
      .strict(),
  ),
  run(_request, context) {
    const r = withPhysicsOnData('Bloch–Grüneisen fit', () =>
      fitBlochGruneisen([...context.points], undefined, {
        stepToleranceK: context.stepToleranceK,
        temperatureUncertaintyK: context.temperatureUncertaintyK,
      }),
    );
    const p = r.parameters;
    let reading = r.converged
      ? `Residual resistivity ${p.residualOhmCm.toPrecision(3)} Ω·cm, coupling ` +
        `${p.couplingOhmCm.toPrecision(3)} Ω·cm, Debye temperature ${p.debyeK.toPrecision(3)} K.`
      : `The fit did not converge: ${r.reason}`;
    if (!isMetal(context.material)) {
      reading = `Bloch–Grüneisen describes metals; this lot is ${context.material}. ${reading}`;
    }
    return {
      computation: computationOf(r, context.points, { reading }),
      inputs: { kind: 'bloch-gruneisen' },
      parameterSet: 'bloch-gruneisen',
    };
  },
};
