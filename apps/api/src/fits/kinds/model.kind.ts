import type { DopingInput } from '@rhotrace/api-types';
import {
  DOPANTS,
  fitModel,
  type AcceptorId,
  type DonorId,
  type Doping,
  type SemiconductorId,
} from '@rhotrace/physics';
import { z } from 'zod';
import { dopingSchema } from '../../analysis/analysis.schemas';
import { isSemiconductor, semiconductorParameterSet } from '../../analysis/model.service';
import { withPhysicsOnData } from '../../analysis/physics-errors';
import { badRequest } from '../../errors';
import { computationOf } from '../fit-computation';
import type { FitKindEntry } from '../fit-kinds';
import { boundsInOrder, fitOptionsShape, freeParameters, kelvin } from '../fit-schemas';

/** Parameters a full-model fit may free. */
export const MODEL_FREE_PARAMETERS = [
  'donorDensity',
  'acceptorDensity',
  'donorLevel',
  'acceptorLevel',
  'mobilityScale',
] as const;

const isDonorOf = (m: SemiconductorId, name: string): name is DonorId =>
  Object.hasOwn(DOPANTS[m].donors, name);
const isAcceptorOf = (m: SemiconductorId, name: string): name is AcceptorId =>
  Object.hasOwn(DOPANTS[m].acceptors, name);

function unknownDopant(field: 'donor' | 'acceptor', name: string, m: SemiconductorId): never {
  const known = Object.keys(field === 'donor' ? DOPANTS[m].donors : DOPANTS[m].acceptors);
  throw badRequest(`initial.${field} ${name} is not a ${field} the ${m} tables know`, [
    { field: `body.initial.${field}`, problem: `must be one of ${known.join(', ')}` },
  ]);
}

/** The request's starting doping with its dopant names checked against the material's table. */
export function dopingOf(m: SemiconductorId, input: DopingInput): Doping {
  const { donor, acceptor, ...rest } = input;
  const doping: Doping = { ...rest };
  if (donor !== undefined)
    doping.donor = isDonorOf(m, donor) ? donor : unknownDopant('donor', donor, m);
  if (acceptor !== undefined) {
    doping.acceptor = isAcceptorOf(m, acceptor) ? acceptor : unknownDopant('acceptor', acceptor, m);
  }
  return doping;
}

/** Full-model Levenberg–Marquardt fit through `fitModel`. */
export const modelKind: FitKindEntry<'model'> = {
  schema: boundsInOrder(
    z
      .object({
        kind: z.literal('model'),
        material: z.string().max(16).optional(),
        initial: dopingSchema.extend({
          mobilityScale: z.number().positive('must be positive').max(100).optional(),
        }),
        free: freeParameters(MODEL_FREE_PARAMETERS),
        minK: kelvin.optional(),
        maxK: kelvin.optional(),
        ...fitOptionsShape,
      })
      .strict(),
  ),
  run(request, context) {
    const material = request.material ?? context.material;
    if (!isSemiconductor(material)) {
      throw badRequest(`A full-model fit needs a semiconductor; ${material} is not one`, [
        { field: 'body.material', problem: 'must be Si, Ge, GaAs or 4H-SiC' },
      ]);
    }
    const { mobilityScale, ...start } = request.initial;
    const doping = dopingOf(material, start);
    const r = withPhysicsOnData('Model fit', () =>
      fitModel([...context.points], material, doping, [...request.free], {
        mobilityScale: mobilityScale ?? 1,
        stepToleranceK: context.stepToleranceK,
        temperatureUncertaintyK: context.temperatureUncertaintyK,
      }),
    );
    const reading = r.converged
      ? `Fitted ${request.free.join(', ')} of the ${material} model to ${r.count} readings ` +
        `(${r.stepCount} steps) in ${r.iterations} iterations.`
      : `The fit did not converge: ${r.reason}`;
    return {
      computation: computationOf(r, context.points, { reading }),
      inputs: { kind: 'model', material, initial: request.initial, free: request.free },
      parameterSet: semiconductorParameterSet(material),
    };
  },
};
