/**
 * `@rhotrace/physics`: semiconductor and metal resistivity models, probe conversions,
 * thermometry and fits. Units: K, eV, cm, cm^-3, cm^2/(V s), ohm cm, ohm per square.
 */
export {
  BOLTZMANN_EV_PER_K,
  BOLTZMANN_J_PER_K,
  BOUND_ALLOWANCE_K,
  ELECTRON_MASS_KG,
  ELEMENTARY_CHARGE_C,
  MAX_TEMPERATURE_K,
  MIN_TEMPERATURE_K,
  PLANCK_J_S,
  ZERO_CELSIUS_K,
} from './constants';
export { PhysicsInputError, PhysicsTypeError } from './errors';
export { PHYSICS_DEFAULTS } from './defaults';
export type { DensityOfStatesSetId, IonizationModelId, MobilityModelId } from './defaults';
export { celsiusToKelvin, kelvinToCelsius } from './temperature';

export { SEMICONDUCTORS, SEMICONDUCTOR_NAMES } from './semiconductor/material';
export type { Carrier, Citation, SemiconductorId } from './semiconductor/material';
export { bandGap, VARSHNI_PARAMETERS } from './semiconductor/band-gap';
export type { VarshniParameters } from './semiconductor/band-gap';
export { densityOfStates, DENSITY_OF_STATES_SETS } from './semiconductor/density-of-states';
export type { BandModelOptions, DensityOfStatesSet } from './semiconductor/density-of-states';
export { intrinsicDensity } from './semiconductor/intrinsic';
export { DOPANTS, MAX_DOPING_CM3 } from './semiconductor/dopants';
export type { AcceptorId, DonorId, Doping, DopantTable } from './semiconductor/dopants';
export { carrierDensities } from './semiconductor/neutrality';
export {
  levelLoweringEvCm,
  mergeDensityCm3,
  RELATIVE_PERMITTIVITY,
} from './semiconductor/ionization';
export type { CarrierDensities, Regime } from './semiconductor/neutrality';
export {
  ARORA_1982_SILICON,
  CAUGHEY_THOMAS_SETS,
  IDEAL_LATTICE_EXPONENT,
  mobility,
} from './semiconductor/mobility';
export type {
  AroraParameters,
  CaugheyThomasParameters,
  MobilityOptions,
} from './semiconductor/mobility';
export { modelCurve, resistivity } from './semiconductor/resistivity';
export type { ModelPoint, ResistivityOptions } from './semiconductor/resistivity';
export { regimeBoundaries, windowLimits } from './semiconductor/regimes';
export { modelCurveWarnings, MOBILITY_FITTED_RANGE_K } from './semiconductor/validity';
export { dopingFromResistivity } from './semiconductor/doping-from-resistivity';
export type { RegimeBoundaries, WindowLimits } from './semiconductor/regimes';

export {
  circularSliceFactor,
  finiteThicknessFactor,
  fourPointProbe,
  MIN_DIAMETER_SPACINGS,
  THIN_SHEET_FACTOR,
} from './probe/four-point';
export type { FourPointProbeResult } from './probe/four-point';
export { vanDerPauw } from './probe/van-der-pauw';
export type { VanDerPauwResult } from './probe/van-der-pauw';
export { reciprocityDifference } from './probe/reciprocity';
export { barResistivity } from './probe/bar';
export { edgeCorrectionFactor, PROBE_ORIENTATIONS } from './probe/edge-correction';
export type { ProbeOrientation } from './probe/edge-correction';
export {
  dualConfiguration,
  DUAL_CONFIGURATION_IDEAL_RATIO,
  DUAL_CONFIGURATION_RATIO_RANGE,
} from './probe/dual-configuration';
export type { DualConfigurationResult } from './probe/dual-configuration';
export { GRID_49_PITCH, patternSiteMm, SITE_PATTERN_IDS, SITE_PATTERNS } from './map/site-patterns';
export type { PatternSite, SitePatternId } from './map/site-patterns';
export { mapUniformity } from './map/uniformity';
export type { MapSiteValue, MapUniformity } from './map/uniformity';
export {
  denseAround,
  MAX_PLAN_STEPS,
  PLAN_DEFAULTS,
  planTemperatureSteps,
  sweepDurationS,
} from './plan/temperature-steps';
export type { StepSpacing } from './plan/temperature-steps';
export { planCurrentRanges, planProbeCurrent } from './plan/probe-current';
export type {
  CurrentLimit,
  CurrentRange,
  PlanMethod,
  ProbeCurrentPlan,
  ProbeLimits,
} from './plan/probe-current';
export { resistivityFromSheetResistance } from './probe/sheet-resistance';

export { IEC_60751, rtdResistance, rtdTemperatureK } from './thermometry/rtd';
export {
  THERMOCOUPLE_INVERSE_RANGE_CELSIUS,
  thermocoupleEmfMv,
  thermocoupleTemperatureK,
} from './thermometry/thermocouple';
export {
  THERMOCOUPLE_REFERENCE,
  THERMOCOUPLE_TYPES,
} from './thermometry/thermocouple-coefficients';
export type { ReferenceRange, ThermocoupleType } from './thermometry/thermocouple-coefficients';
export {
  CALIBRATION_EXTRAPOLATION_FRACTION,
  calibrationTableTemperatureK,
} from './thermometry/calibration-table';
export type { CalibrationPoint } from './thermometry/calibration-table';
export {
  ASTM_F723_RANGES,
  siliconDopantFromResistivity,
  siliconResistivityFromDopant,
} from './silicon/astm-f723';
export type { F723Dopant } from './silicon/astm-f723';

export { CURVATURE_T_LIMIT, fitArrhenius } from './fit/arrhenius';
export type {
  ArrheniusCurvature,
  ArrheniusFit,
  ArrheniusOptions,
  ArrheniusParameter,
} from './fit/arrhenius';
export { MAX_RELATIVE_STANDARD_ERROR } from './fit/fit-result';
export type { FitResult, ParameterScale } from './fit/fit-result';
export { dwellSteps } from './fit/steps';
export type { DwellStep, StepOptions } from './fit/steps';
export { interpretArrheniusSlope } from './fit/interpret';
export type { ArrheniusReading } from './fit/interpret';
export { levenbergMarquardt } from './fit/levenberg-marquardt';
export type { LeastSquaresProblem, LeastSquaresResult } from './fit/levenberg-marquardt';
export { fitModel } from './fit/model-fit';
export type { ModelFit, ModelFitOptions, ModelParameter } from './fit/model-fit';
export { fitLinearTcr } from './fit/tcr';
export { arrheniusValue, linearTcrResistivity } from './fit/fitted-curves';
export { thermalLag } from './fit/thermal-lag';
export type { LegCurve, ThermalLag } from './fit/thermal-lag';
export type { LinearTcrFit, TcrParameter } from './fit/tcr';
export { studentTCritical } from './numeric/student-t';

export {
  COVERAGE_FACTOR,
  combinedStandardUncertainty,
  IEC_60751_TOLERANCE,
  iec60751Tolerance,
  rectangularStandardUncertainty,
} from './uncertainty/gum';
export type { Iec60751Class } from './uncertainty/gum';
export { guardBandedVerdict } from './uncertainty/conformity';
export type { ConformityVerdict } from './uncertainty/conformity';
export {
  bissellLowerBound,
  MIN_PPK_SAMPLE,
  processPerformance,
  SMALL_PPK_SAMPLE,
  Z_ONE_SIDED_95,
} from './statistics/capability';
export type { ProcessPerformance } from './statistics/capability';
export { seededNormal, seededRandom } from './numeric/prng';

export {
  blochGruneisen,
  blochGruneisenJ5,
  J5_INFINITY,
  METAL_TEMPERATURE_RANGE_K,
} from './metal/bloch-gruneisen';
export type { BlochGruneisenParameters } from './metal/bloch-gruneisen';
export { fitBlochGruneisen } from './metal/bloch-gruneisen-fit';
export type { BlochGruneisenFit, BlochGruneisenParameter } from './metal/bloch-gruneisen-fit';
export {
  METAL_BLOCH_GRUNEISEN,
  METAL_LINEAR_RANGE_K,
  METAL_MODEL_RANGE_K,
  METALS,
  metalBlochGruneisen,
  metalResistivity,
} from './metal/metals';
export type { MetalBlochGruneisen, MetalId, MetalReference } from './metal/metals';
export { listMaterials } from './materials';
export type { MaterialCatalogue, SemiconductorCatalogueEntry } from './materials';

export {
  HALL_SCATTERING_FACTORS,
  hallCoefficient,
  hallMobility,
  hallVoltageFromReversals,
  twoCarrierHallCoefficient,
} from './hall/hall-effect';
export type {
  HallCoefficientInput,
  HallCoefficientResult,
  HallReversals,
  TwoCarrierInput,
} from './hall/hall-effect';
export { fitCarrierDensity } from './hall/carrier-density-fit';
export type {
  CarrierDensityFit,
  CarrierDensityFitOptions,
  CarrierDensityParameter,
} from './hall/carrier-density-fit';
export { fitMobilityPowerLaw } from './hall/mobility-power-law';
export type {
  MobilityPowerLawFit,
  MobilityPowerLawOptions,
  MobilityPowerLawParameter,
} from './hall/mobility-power-law';
