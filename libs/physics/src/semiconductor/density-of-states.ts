/**
 * Effective densities of states of the conduction and valence bands.
 */
import type { DensityOfStatesSetId, IonizationModelId } from '../defaults';
import { PHYSICS_DEFAULTS } from '../defaults';
import type { Citation, SemiconductorId } from './material';
import { requireSemiconductor } from './material';
import { requireOneOf, requireTemperatureK } from '../validate';

/** A density-of-states set: N(T) = N300 * (T / 300)^exponent for each band. */
export interface DensityOfStatesSet {
  id: DensityOfStatesSetId;
  /** Materials the set applies to. */
  materials: readonly SemiconductorId[];
  /** Per-material 300 K values, cm^-3, and exponents. */
  values: Partial<
    Record<
      SemiconductorId,
      { nc300: number; ncExponent: number; nv300: number; nvExponent: number }
    >
  >;
  description: string;
  source: Citation;
}

/**
 * The density-of-states sets. The silicon default `si-scaled-t15` keeps the ideal T^1.5 law and
 * Green's Nc/Nv ratio and scales the pair so that, with the Thurmond gap, n_i(300 K) = 1.00e10
 * cm^-3 (1.0038e10; the last digits centre the deviation from Sproul & Green 1991 over
 * 250–500 K, which then stays within 4.9 %, and within 8.2 % of Misiakos & Tsamakis 1993).
 */
export const DENSITY_OF_STATES_SETS: Readonly<Record<DensityOfStatesSetId, DensityOfStatesSet>> = {
  'si-scaled-t15': {
    id: 'si-scaled-t15',
    materials: ['Si'],
    values: { Si: { nc300: 2.69e19, ncExponent: 1.5, nv300: 2.915e19, nvExponent: 1.5 } },
    description:
      'T^1.5 pair with the Nc/Nv ratio of Green 1990, scaled so n_i(300 K) = 1.00e10 cm^-3',
    source: {
      label: 'Sproul & Green 1991 (scaling target); Green 1990 (ratio)',
      reference: 'J. Appl. Phys. 70, 846 (1991); J. Appl. Phys. 67, 2944 (1990)',
    },
  },
  'si-green-1990': {
    id: 'si-green-1990',
    materials: ['Si'],
    values: { Si: { nc300: 2.86e19, ncExponent: 1.58, nv300: 3.1e19, nvExponent: 1.85 } },
    description: 'Green 1990 silicon set with its own temperature exponents',
    source: { label: 'Green 1990', reference: 'J. Appl. Phys. 67, 2944 (1990)' },
  },
  'sze-t15': {
    id: 'sze-t15',
    materials: ['Si', 'Ge', 'GaAs'],
    values: {
      Si: { nc300: 2.8e19, ncExponent: 1.5, nv300: 1.04e19, nvExponent: 1.5 },
      Ge: { nc300: 1.04e19, ncExponent: 1.5, nv300: 6.0e18, nvExponent: 1.5 },
      GaAs: { nc300: 4.7e17, ncExponent: 1.5, nv300: 7.0e18, nvExponent: 1.5 },
    },
    description: 'Sze 2nd edition 300 K values scaled as (T/300)^1.5',
    source: { label: 'Sze 1981', reference: 'Physics of Semiconductor Devices, 2nd ed.' },
  },
  'sic-t15': {
    id: 'sic-t15',
    materials: ['4H-SiC'],
    values: { '4H-SiC': { nc300: 1.69e19, ncExponent: 1.5, nv300: 2.49e19, nvExponent: 1.5 } },
    description: '4H-SiC device-simulator values scaled as (T/300)^1.5',
    source: {
      label: 'device-simulator set',
      reference: 'Nc = 3.25e15 T^1.5, Nv = 4.8e15 T^1.5 cm^-3',
      fromMemory: true,
    },
  },
};

/** Options shared by the functions built on the band model. */
export interface BandModelOptions {
  /** Density-of-states set; default per material in `PHYSICS_DEFAULTS.densityOfStatesSet`. */
  densityOfStatesSet?: DensityOfStatesSetId;
  /**
   * Dopant-ionization model; default per material in `PHYSICS_DEFAULTS.ionizationModel`
   * (`pearson-bardeen-1949` for every material; `constant-level` turns the level lowering off).
   */
  ionizationModel?: IonizationModelId;
}

/** @internal Resolves and checks the density-of-states set for a material. */
export function resolveDensityOfStatesSet(
  fn: string,
  material: SemiconductorId,
  setId: unknown,
): DensityOfStatesSet {
  if (setId === undefined)
    return DENSITY_OF_STATES_SETS[PHYSICS_DEFAULTS.densityOfStatesSet[material]];
  const id = requireOneOf(
    fn,
    'densityOfStatesSet',
    setId,
    Object.keys(DENSITY_OF_STATES_SETS) as DensityOfStatesSetId[],
  );
  const set = DENSITY_OF_STATES_SETS[id];
  if (!set.values[material]) {
    throw new RangeError(`\`${fn}\` requires a densityOfStatesSet for ${material}, got "${id}"`);
  }
  return set;
}

/** @internal ln Nc and ln Nv without input checks. */
export function logDensityOfStates(
  set: DensityOfStatesSet,
  material: SemiconductorId,
  temperatureK: number,
): { lnNc: number; lnNv: number } {
  const v = set.values[material]!;
  const lnT = Math.log(temperatureK / 300);
  return {
    lnNc: Math.log(v.nc300) + v.ncExponent * lnT,
    lnNv: Math.log(v.nv300) + v.nvExponent * lnT,
  };
}

/**
 * Effective densities of states of the conduction band (Nc) and valence band (Nv).
 *
 * Formula: Nc(T) = Nc300 (T/300)^a, Nv(T) = Nv300 (T/300)^b; a = b = 1.5 for parabolic bands
 * with temperature-independent effective masses, Green 1990 uses 1.58 and 1.85 for silicon.
 * Default set per material: `PHYSICS_DEFAULTS.densityOfStatesSet` (silicon: `si-scaled-t15`,
 * 2.69e19 and 2.915e19 cm^-3 at 300 K).
 * Source: S. M. Sze, Physics of Semiconductor Devices, 2nd ed. (1981); M. A. Green, J. Appl.
 * Phys. 67, 2944 (1990).
 *
 * @param material semiconductor id
 * @param temperatureK temperature, K (1 to 1500)
 * @param options optional density-of-states set
 * @returns { conduction, valence } in cm^-3
 * @example densityOfStates('Si', 300) // { conduction: 2.69e19, valence: 2.915e19 }
 */
export function densityOfStates(
  material: SemiconductorId,
  temperatureK: number,
  options: BandModelOptions = {},
): { conduction: number; valence: number } {
  const m = requireSemiconductor('densityOfStates', material);
  const t = requireTemperatureK('densityOfStates', temperatureK);
  const set = resolveDensityOfStatesSet('densityOfStates', m, options?.densityOfStatesSet);
  const { lnNc, lnNv } = logDensityOfStates(set, m, t);
  return { conduction: Math.exp(lnNc), valence: Math.exp(lnNv) };
}
