/**
 * Where the semiconductor model leaves the ground its parameter sets were fitted on.
 */
import type { MobilityModelId } from '../defaults';
import { requireArray, requireTemperatureK } from '../validate';
import type { Doping } from './dopants';
import { resolveDoping } from './dopants';
import type { SemiconductorId } from './material';
import { requireSemiconductor } from './material';
import { solveNeutrality } from './neutrality';
import type { ResistivityOptions } from './resistivity';
import { resolveModel } from './resistivity';

/**
 * Temperatures each mobility model was fitted over, K: Arora, Hauser & Roulston 1982 fitted
 * about 200–500 K; the Caughey–Thomas sets are 300 K values carried to other temperatures by
 * the ideal T^-3/2 lattice term, taken as fair within 250–350 K (common practice, no source).
 */
export const MOBILITY_FITTED_RANGE_K: Readonly<Record<MobilityModelId, readonly [number, number]>> =
  {
    'arora-1982': [200, 500],
    'caughey-thomas-ideal': [250, 350],
  };

const MODEL_NAMES: Readonly<Record<MobilityModelId, string>> = {
  'arora-1982': 'Arora–Hauser–Roulston mobility model',
  'caughey-thomas-ideal': 'Caughey–Thomas mobility set (300 K values, ideal T^-3/2 lattice term)',
};

/** Below this temperature the merge range of the dopant levels matters to the curve, K. */
const LOW_TEMPERATURE_K = 100;

const kelvin = (t: number): string => `${Math.round(t)} K`;

/**
 * Plain-language warnings for a model curve: temperatures outside the mobility model's fitted
 * range (`MOBILITY_FITTED_RANGE_K`); doping inside the merge range of a dopant level (part of
 * the dopants counted as band-like, see `carrierDensities`) on a curve reaching below 100 K;
 * and temperatures where the Fermi level lies within 3 kT of a band edge (`carrierDensities` `nearDegenerate`: Boltzmann statistics overstate the carrier
 * density, so the curve's resistivity is too low there). Empty when neither applies.
 *
 * @param material semiconductor id
 * @param doping donor and acceptor densities (cm^-3) and levels (eV)
 * @param temperaturesK temperatures of the curve, K (each 1 to 1500)
 * @param options the model options the curve uses
 * @example modelCurveWarnings('Si', { donorDensity: 1e15, acceptorDensity: 0 }, [300, 400])
 *   // []
 */
export function modelCurveWarnings(
  material: SemiconductorId,
  doping: Doping,
  temperaturesK: number[],
  options: ResistivityOptions = {},
): string[] {
  const fn = 'modelCurveWarnings';
  const m = requireSemiconductor(fn, material);
  const d = resolveDoping(fn, m, doping, options?.ionizationModel);
  const temps = requireArray(fn, 'temperaturesK', temperaturesK).map((t, i) =>
    requireTemperatureK(fn, t, `temperaturesK[${i}]`),
  );
  const model = resolveModel(fn, m, options);
  const warnings: string[] = [];
  if (temps.length === 0) return warnings;
  const [lo, hi] = MOBILITY_FITTED_RANGE_K[model.mobilityModel];
  const outside = temps.filter((t) => t < lo || t > hi);
  if (outside.length > 0) {
    warnings.push(
      `The ${MODEL_NAMES[model.mobilityModel]} is fitted over ${lo}–${hi} K; from ` +
        `${kelvin(Math.min(...outside))} to ${kelvin(Math.max(...outside))} ` +
        `(${outside.length} of ${temps.length} temperatures) the mobility is extrapolated.`,
    );
  }
  // Only a share strictly between 0 and 1 means the doping sits inside the merge range.
  const partial = [d.donorBoundFraction, d.acceptorBoundFraction].some((b) => b > 0 && b < 1);
  if (partial && Math.min(...temps) < LOW_TEMPERATURE_K) {
    warnings.push(
      'The doping lies where the dopant level merges with the band: below ' +
        `${LOW_TEMPERATURE_K} K the model counts part of the dopants as band-like, standing in ` +
        'for impurity-band (hopping) conduction, which it overstates.',
    );
  }
  const degenerate = temps.filter((t) => solveNeutrality(m, model.set, d, t).nearDegenerate);
  if (degenerate.length > 0) {
    warnings.push(
      `The Fermi level lies within 3 kT of a band edge from ${kelvin(Math.min(...degenerate))} ` +
        `to ${kelvin(Math.max(...degenerate))}: the doping is near-degenerate, Boltzmann ` +
        'statistics overstate the carrier density and the model resistivity is too low there.',
    );
  }
  return warnings;
}
