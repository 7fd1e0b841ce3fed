/**
 * Every default the library applies, in one place. Function docs refer to these entries and the
 * tests check that the functions really use them.
 */
import type { SemiconductorId } from './semiconductor/material';

/** Names of the effective density-of-states parameter sets (see `DENSITY_OF_STATES_SETS`). */
export type DensityOfStatesSetId = 'si-scaled-t15' | 'si-green-1990' | 'sze-t15' | 'sic-t15';

/** Names of the mobility models (see `mobility`). */
export type MobilityModelId = 'arora-1982' | 'caughey-thomas-ideal';

/**
 * Names of the dopant-ionization models (see `carrierDensities`): `pearson-bardeen-1949` lowers
 * each level with density and merges it continuously with the band at (E0/alpha)^3;
 * `constant-level` keeps the tabulated level and merges it, just as continuously, at
 * `mottDensityCm3`.
 */
export type IonizationModelId = 'pearson-bardeen-1949' | 'constant-level';

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
   * Fraction of the net doping |N_D - N_A| that the majority carrier density must reach for the
   * regime to count as extrinsic rather than freeze-out.
   */
  ionizedFractionThreshold: 0.9,
  /**
   * Ionization model per material unless `options.ionizationModel` names another: every material
   * lowers its levels with density (Pearson & Bardeen 1949), so rho is continuous in doping.
   */
  ionizationModel: {
    Si: 'pearson-bardeen-1949',
    Ge: 'pearson-bardeen-1949',
    GaAs: 'pearson-bardeen-1949',
    '4H-SiC': 'pearson-bardeen-1949',
  } as Readonly<Record<SemiconductorId, IonizationModelId>>,
  /**
   * Lowering constant alpha of E(N) = E0 - alpha N^(1/3), eV cm (Pearson & Bardeen, Phys. Rev.
   * 75, 865 (1949); silicon about 3e-8 eV cm, from memory). N is the total impurity density
   * N_D + N_A: the lowering comes from the Coulomb fields of the ionized impurities, and every
   * dopant, compensating ones included, is ionized in the regime the relation was measured in.
   * The level is clamped at 0: with E0 = 45 meV (P, B) it merges with the band at
   * (E0/alpha)^3 = 3.4e18 cm^-3, close to the Mott density of silicon. Materials without an
   * entry scale silicon's constant by the permittivity (`levelLoweringEvCm` in
   * semiconductor/ionization.ts).
   */
  levelLoweringEvCm: { Si: 3.0e-8 } as Readonly<Partial<Record<SemiconductorId, number>>> & {
    Si: number;
  },
  /**
   * Onset of the merge of a bound level with the band, in decades D0 below the merge density
   * for a level of `mergeReferenceLevelEv` or shallower (deeper levels: D0 sqrt(E0 / E_ref),
   * `mergeOnsetDecades` in semiconductor/ionization.ts). Below the onset every dopant keeps its
   * bound level (no carriers leak at low temperature: Si:P 1e17 at 10 K gives n about 1e9);
   * from the onset to the merge density the bound share falls smoothly to 0. Rhotrace's own
   * interpolation: 1.5 puts the onset of Si:P and Si:B at 1.07e17 and keeps the silicon model at
   * 300 K within 6 % of ASTM F723 above 1e17 (F723's mobilities assume complete ionization).
   */
  mergeOnsetDecades: 1.5,
  /** Reference level of `mergeOnsetDecades`, eV (P and B in silicon). */
  mergeReferenceLevelEv: 0.045,
  /**
   * Density at which the `constant-level` model has merged a dopant with the band (Mott
   * transition), cm^-3. Silicon: about 3e18 (Pearson and Bardeen 1949; Altermatt et al. 2006 put
   * P near 3.7e18, from memory). Other materials scale with the effective Bohr radius
   * (order-of-magnitude estimates). Under the default (`pearson-bardeen-1949`) the merge density
   * is (E0/alpha)^3 per species instead.
   */
  mottDensityCm3: {
    Si: { donor: 3e18, acceptor: 3e18 },
    Ge: { donor: 1e17, acceptor: 1e17 },
    GaAs: { donor: 1e16, acceptor: 1e18 },
    '4H-SiC': { donor: 1e19, acceptor: 1e20 },
  } as Readonly<Record<SemiconductorId, { donor: number; acceptor: number }>>,
  /**
   * Suggested intrinsic window (API): it starts where n_i reaches this multiple of the net
   * doping, where n and p both lie within 18 % of n_i and the slope reads Eg/2 (common
   * practice, no source).
   */
  intrinsicWindowRatio: 3,
  /**
   * Suggested freeze-out window (API): it ends where the majority carrier density is this
   * fraction of the net doping, well inside the exp(-Ed/2kT) or exp(-Ed/kT) range (common
   * practice, no source).
   */
  freezeOutWindowIonizedFraction: 0.5,
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
  /**
   * Consecutive readings whose temperatures lie within this of a step's first reading form one
   * dwell step, K (see `dwellSteps`).
   */
  fitStepToleranceK: 0.5,
  /** Standard uncertainty of each step's temperature for the effective variance, K. */
  fitTemperatureUncertaintyK: 0,
  /** Iteration cap of the Levenberg–Marquardt fits. */
  fitMaxIterations: 200,
  /** Relative change of the sum of squares below which a Levenberg–Marquardt fit has converged. */
  fitCostTolerance: 1e-10,
  /** Relative parameter step below which a Levenberg–Marquardt fit has converged. */
  fitStepTolerance: 1e-8,
} as const;
