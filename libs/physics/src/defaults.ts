/**
 * Every default the library applies, in one place. Function docs refer to these entries and the
 * tests check that the functions really use them.
 */
import type { SemiconductorId } from './semiconductor/material';

/** Names of the effective density-of-states parameter sets (see `DENSITY_OF_STATES_SETS`). */
export type DensityOfStatesSetId = 'si-scaled-t15' | 'si-green-1990' | 'sze-t15' | 'sic-t15';

/** Names of the mobility models (see `mobility`). */
export type MobilityModelId = 'arora-1982' | 'caughey-thomas-ideal';

/** Library-wide defaults. */
export const PHYSICS_DEFAULTS = {
  /** Density-of-states set used for each material unless an option names another. */
  densityOfStatesSet: {
    Si: 'si-scaled-t15',
    Ge: 'sze-t15',
    GaAs: 'sze-t15',
    '4H-SiC': 'sic-t15',
  } as Readonly<Record<SemiconductorId, DensityOfStatesSetId>>,
  /** Mobility model used for each material unless an option names another. */
  mobilityModel: {
    Si: 'arora-1982',
    Ge: 'caughey-thomas-ideal',
    GaAs: 'caughey-thomas-ideal',
    '4H-SiC': 'caughey-thomas-ideal',
  } as Readonly<Record<SemiconductorId, MobilityModelId>>,
  /** Degeneracy factor of donor levels. */
  donorDegeneracy: 2,
  /** Degeneracy factor of acceptor levels. */
  acceptorDegeneracy: 4,
  /**
   * Fraction of the majority dopant that must be ionized for the regime to count as extrinsic
   * rather than freeze-out.
   */
  ionizedFractionThreshold: 0.9,
  /**
   * Dopant density at and above which the impurity band merges with the band edge (Mott
   * transition), cm^-3: such dopants are treated as fully ionized at every temperature.
   * Silicon: about 3e18 (Pearson and Bardeen 1949; Altermatt et al. 2006 put P near 3.7e18, from
   * memory). Other materials scale with the effective Bohr radius (order-of-magnitude estimates).
   */
  mottDensityCm3: {
    Si: { donor: 3e18, acceptor: 3e18 },
    Ge: { donor: 1e17, acceptor: 1e17 },
    GaAs: { donor: 1e16, acceptor: 1e18 },
    '4H-SiC': { donor: 1e19, acceptor: 1e20 },
  } as Readonly<Record<SemiconductorId, { donor: number; acceptor: number }>>,
  /**
   * Fermi level closer than this many kT to a band edge marks Boltzmann statistics as doubtful
   * (`nearDegenerate` in `carrierDensities`).
   */
  degeneracyMarginKt: 3,
  /** Resistivity values above this are reported as this ceiling (see `resistivity`), ohm cm. */
  resistivityCeilingOhmCm: 1e300,
  /** Nominal platinum RTD resistance at 0 °C, ohm (Pt100). */
  rtdR0Ohm: 100,
  /** Reference temperature of `fitLinearTcr`, K (20 °C). */
  tcrReferenceK: 293.15,
  /** Temperature the ASTM F723 relations refer to, K (23 °C). */
  astmF723TemperatureK: 296.15,
  /** Default quantity of `fitArrhenius`. */
  arrheniusQuantity: 'resistivity' as 'resistivity' | 'conductivity',
  /** Default T^m prefactor exponent m of `fitArrhenius`. */
  arrheniusPrefactorExponent: 0,
  /** Iteration cap of the Levenberg–Marquardt fits. */
  fitMaxIterations: 200,
  /** Relative change of the sum of squares below which a Levenberg–Marquardt fit has converged. */
  fitCostTolerance: 1e-10,
  /** Relative parameter step below which a Levenberg–Marquardt fit has converged. */
  fitStepTolerance: 1e-8,
} as const;
