import type { FitInterpretation } from '@rhotrace/api-types';
import { fitCarrierDensity, type CarrierDensityFit } from '@rhotrace/physics';
import { z } from 'zod';
import { dopingSchema } from '../../analysis/analysis.schemas';
import { isSemiconductor, semiconductorParameterSet } from '../../analysis/model.service';
import { withPhysicsOnData } from '../../analysis/physics-errors';
import { badRequest } from '../../errors';
import { computationOf } from '../fit-computation';
import type { FitKindEntry } from '../fit-kinds';
import { boundsInOrder, fitOptionsShape, freeParameters, kelvin } from '../fit-schemas';
import { hallSeries, otherTypeWarning } from './hall-points';
import { dopingOf } from './model.kind';

/** Parameters a carrier-density fit may free. */
export const CARRIER_DENSITY_FREE_PARAMETERS = [
  'donorDensity',
  'acceptorDensity',
  'donorLevel',
  'acceptorLevel',
] as const;

/**
 * The compensation ratio N_minority / N_majority with its 95 % interval: ln r = ln N_min -
 * ln N_maj, var(ln r) = var(ln N_min) + var(ln N_maj) - 2 cov (the fit's correlation is that of
 * the ln densities), interval exp(ln r ± t se). Null unless both densities were fitted.
 */
export function compensationRatio(
  r: CarrierDensityFit,
  nType: boolean,
): FitInterpretation['compensationRatio'] {
  const [maj, min] = nType
    ? (['donorDensity', 'acceptorDensity'] as const)
    : (['acceptorDensity', 'donorDensity'] as const);
  const i = r.fitted.indexOf(maj);
  const j = r.fitted.indexOf(min);
  if (i < 0 || j < 0) return null;
  const value = r.parameters[min] / r.parameters[maj];
  const seMaj = r.standardErrors[maj];
  const seMin = r.standardErrors[min];
  const rho = r.correlation?.[i]?.[j];
  if (seMaj == null || seMin == null || rho === undefined) {
    return { value, confidenceInterval95: null };
  }
  const a = seMaj / r.parameters[maj];
  const b = seMin / r.parameters[min];
  const se = Math.sqrt(Math.max(0, a * a + b * b - 2 * rho * a * b));
  const half = r.tCritical * se;
  return { value, confidenceInterval95: [value * Math.exp(-half), value * Math.exp(half)] };
}

function interpretationOf(r: CarrierDensityFit, nType: boolean): FitInterpretation {
  const level = nType ? 'donorLevel' : 'acceptorLevel';
  const minority = nType ? 'acceptorDensity' : 'donorDensity';
  const ratio = compensationRatio(r, nType);
  const levelFitted = r.fitted.includes(level);
  const e = r.parameters[level];
  const se = levelFitted ? (r.standardErrors[level] ?? null) : null;
  const ratioText = ratio
    ? ` Compensation N_${nType ? 'A/N_D' : 'D/N_A'} = ${ratio.value.toPrecision(3)}` +
      (ratio.confidenceInterval95
        ? ` (95 %: ${ratio.confidenceInterval95.map((v) => v.toPrecision(2)).join(' to ')}).`
        : '.')
    : '';
  return {
    regime: null,
    property: levelFitted ? 'dopant-level' : null,
    valueEv: levelFitted ? e : null,
    standardErrorEv: se,
    compensation: r.parameters[minority] > 0 ? 'compensated' : 'uncompensated',
    compensationSource: r.fitted.includes(minority) ? 'inferred' : 'request',
    prefactorExponent: 1.5,
    compensationRatio: ratio,
    note:
      `Charge neutrality with incomplete ionization fitted to ln ${nType ? 'n' : 'p'}(T) ` +
      '(Blakemore 1962; Look 1989): the level is the sample’s own (its freeze-out slope), ' +
      'the densities are Hall densities divided by the Hall factor used at import.' +
      ratioText,
  };
}

/** Charge-neutrality fit of the Hall carrier density through `fitCarrierDensity`. */
export const carrierDensityKind: FitKindEntry<'carrier-density'> = {
  schema: boundsInOrder(
    z
      .object({
        kind: z.literal('carrier-density'),
        material: z.string().max(16).optional(),
        initial: dopingSchema,
        free: freeParameters(CARRIER_DENSITY_FREE_PARAMETERS),
        minK: kelvin.optional(),
        maxK: kelvin.optional(),
        ...fitOptionsShape,
      })
      .strict(),
  ),
  run(request, context) {
    const material = request.material ?? context.material;
    if (!isSemiconductor(material)) {
      throw badRequest(`A carrier-density fit needs a semiconductor; ${material} is not one`, [
        { field: 'body.material', problem: 'must be Si, Ge, GaAs or 4H-SiC' },
      ]);
    }
    const doping = dopingOf(material, request.initial);
    const nType = doping.donorDensity >= doping.acceptorDensity;
    const type = nType ? 'n' : 'p';
    const series = hallSeries(context.points, 'carrierDensityCm3', 'carrier-density', type);
    const r = withPhysicsOnData('Carrier-density fit', () =>
      fitCarrierDensity(
        series.values.map((v) => ({ temperatureK: v.temperatureK, densityCm3: v.value })),
        material,
        doping,
        [...request.free],
        {
          stepToleranceK: context.stepToleranceK,
          temperatureUncertaintyK: context.temperatureUncertaintyK,
        },
      ),
    );
    const p = r.parameters;
    const reading = r.converged
      ? `N_D ${p.donorDensity.toPrecision(3)} cm⁻³, N_A ${p.acceptorDensity.toPrecision(3)} ` +
        `cm⁻³, ${nType ? 'E_d' : 'E_a'} ${((nType ? p.donorLevel : p.acceptorLevel) * 1000).toFixed(1)} ` +
        `meV from ${r.count} readings (${r.stepCount} steps).`
      : `The fit did not converge: ${r.reason}`;
    const computation = computationOf(r, series.points, { reading });
    computation.interpretation = interpretationOf(r, nType);
    computation.warnings.push(...otherTypeWarning(series, type));
    return {
      computation,
      inputs: {
        kind: 'carrier-density',
        material,
        initial: request.initial,
        free: request.free,
        ionizationModel: 'constant-level',
      },
      parameterSet: `${semiconductorParameterSet(material)}:constant-level`,
    };
  },
};
