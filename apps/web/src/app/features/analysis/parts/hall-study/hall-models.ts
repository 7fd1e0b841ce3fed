/**
 * The model curves of the Hall plots, computed in the browser with `@rhotrace/physics`: charge
 * neutrality n(T) for a doping (the level as fitted, `constant-level`, as the carrier-density fit
 * uses it), the fitted mobility power law, and the model's drift mobility for that doping.
 */
import type { HallAnalysis } from '@rhotrace/api-types';
import {
  carrierDensities,
  mobility,
  SEMICONDUCTORS,
  type SemiconductorId,
} from '@rhotrace/physics';
import type { HallModels } from '../hall-plots/hall-traces';

/** Densities (cm^-3) and levels (eV) the curves are drawn for. */
export interface HallDoping {
  donorDensity: number;
  acceptorDensity: number;
  donorLevel?: number;
  acceptorLevel?: number;
}

const GRID_POINTS = 80;

/** True for a material the physics library models (not a metal film). */
export const isSemiconductor = (m: string): m is SemiconductorId =>
  (SEMICONDUCTORS as readonly string[]).includes(m);

/** Temperatures from the first to the last step, evenly in 1/T (where freeze-out bends). */
function grid(hall: HallAnalysis): number[] {
  const lo = hall.steps[0]!.temperatureK;
  const hi = hall.steps[hall.steps.length - 1]!.temperatureK;
  return Array.from({ length: GRID_POINTS }, (_, i) => {
    const inv = 1 / lo + ((1 / hi - 1 / lo) * i) / (GRID_POINTS - 1);
    return 1 / inv;
  });
}

/** A curve the physics refuses (a doping out of range) is left out rather than drawn wrong. */
function attempt<T>(draw: () => T): T | null {
  try {
    return draw();
  } catch (error) {
    if (error instanceof RangeError || error instanceof TypeError) return null;
    throw error;
  }
}

/** The curves of the three Hall plots. */
export function hallModels(
  material: string,
  hall: HallAnalysis,
  doping: { values: HallDoping; label: string } | null,
  powerLaw: { exponent: number; mobilityAt300K: number; minK: number; maxK: number } | null,
): HallModels {
  const temps = hall.steps.length > 1 ? grid(hall) : [];
  const m = isSemiconductor(material) ? material : null;
  const nType = hall.carrierType !== 'p';
  const density =
    m && doping && temps.length
      ? attempt(() => ({
          temperaturesK: temps,
          densitiesCm3: temps.map((t) => {
            const c = carrierDensities(m, doping.values, t, { ionizationModel: 'constant-level' });
            return nType ? c.electrons : c.holes;
          }),
          label: doping.label,
        }))
      : null;
  const impurities = doping ? doping.values.donorDensity + doping.values.acceptorDensity : 0;
  const modelMobility =
    m && doping && temps.length
      ? attempt(() => ({
          temperaturesK: temps,
          mobilities: temps.map((t) => mobility(m, nType ? 'electron' : 'hole', t, impurities)),
          label: 'Model drift mobility',
        }))
      : null;
  const law = powerLaw
    ? {
        temperaturesK: temps.filter((t) => t >= powerLaw.minK - 1e-9 && t <= powerLaw.maxK + 1e-9),
        label: `Power law T^${powerLaw.exponent.toFixed(2)}`,
      }
    : null;
  return {
    density,
    powerLaw: law
      ? {
          ...law,
          mobilities: law.temperaturesK.map(
            (t) => powerLaw!.mobilityAt300K * (t / 300) ** powerLaw!.exponent,
          ),
        }
      : null,
    modelMobility,
  };
}
