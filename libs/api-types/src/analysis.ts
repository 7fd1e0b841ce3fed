/**
 * Analysis API shapes: model curves, materials, sweep analysis, fits, dopant density, lot
 * summaries and sweep comparison. Units are in the field names (K, ohm cm, cm^-3, eV).
 */

/** Conduction regimes of a doped semiconductor. */
export type RegimeName = 'freeze-out' | 'extrinsic' | 'intrinsic';

/** Doping as the model takes it: densities in cm^-3, ionization energies in eV. */
export interface DopingInput {
  donorDensity: number;
  acceptorDensity: number;
  donorLevel?: number;
  acceptorLevel?: number;
  donor?: string;
  acceptor?: string;
}

/** `POST /api/model/curve` body. */
export interface ModelCurveRequest {
  material: string;
  /** Required for semiconductors; ignored for metal films. */
  doping?: DopingInput;
  fromK: number;
  toK: number;
  /** 2 to 2000 temperatures, evenly spaced from fromK to toK inclusive. */
  steps: number;
}

/** One point of a semiconductor model curve (the physics library's `modelCurve` output). */
export interface SemiconductorCurvePoint {
  temperatureK: number;
  resistivityOhmCm: number;
  electrons: number;
  holes: number;
  electronMobility: number;
  holeMobility: number;
  regime: RegimeName;
}

/** One point of a metal-film reference curve (null outside the reference's valid range). */
export interface MetalCurvePoint {
  temperatureK: number;
  resistivityOhmCm: number | null;
}

/** `POST /api/model/curve` answer. */
export type ModelCurveResponse =
  | {
      kind: 'semiconductor';
      material: string;
      points: SemiconductorCurvePoint[];
      boundaries: { freezeOutBelowK: number | null; intrinsicAboveK: number | null };
      modelVersion: string;
    }
  | {
      kind: 'metal';
      material: string;
      points: MetalCurvePoint[];
      boundaries: null;
      /** The reference parameters the curve was drawn from. */
      reference: Record<string, unknown>;
      modelVersion: string;
    };

/** A literature source as the physics library names it. */
export interface SourceDto {
  label: string;
  reference: string;
  fromMemory?: boolean;
}

/** One semiconductor of `GET /api/materials` (the physics library's catalogue entry). */
export interface SemiconductorMaterialDto {
  id: string;
  name: string;
  bandGap: {
    eg0Ev: number;
    alphaEvPerK: number;
    betaK: number;
    fittedRangeK: [number, number];
    source: SourceDto;
  };
  densityOfStatesSets: Array<{
    id: string;
    description: string;
    nc300: number;
    ncExponent: number;
    nv300: number;
    nvExponent: number;
    source: SourceDto;
    isDefault: boolean;
  }>;
  mobilityModels: Array<{ id: string; parameters: unknown; source: SourceDto; isDefault: boolean }>;
  donors: Array<{ name: string; levelEv: number; isDefault: boolean }>;
  acceptors: Array<{ name: string; levelEv: number; isDefault: boolean }>;
  dopantSource: SourceDto;
  mottDensityCm3: { donor: number; acceptor: number };
}

/** One metal of `GET /api/materials`. */
export interface MetalMaterialDto {
  id: string;
  name: string;
  resistivity20COhmCm: number;
  alphaPerK: number;
  debyeK: number;
  sources: { resistivity: SourceDto; debye: SourceDto };
}

/** `GET /api/materials` answer. */
export interface MaterialsResponse {
  semiconductors: SemiconductorMaterialDto[];
  metals: MetalMaterialDto[];
  modelVersion: string;
}

/** Sweep facts the analysis views show. */
export interface AnalysisSweepDto {
  id: number;
  waferId: number;
  waferNumber: string;
  lotId: number;
  lotCode: string;
  material: string;
  method: string;
  stationId: number | null;
  pointCount: number;
  /** Points left out of the analysis (non-positive or non-finite resistivity). */
  skippedPointCount: number;
  minTemperatureK: number | null;
  maxTemperatureK: number | null;
  originalName: string;
  createdAt: string;
}

/** Points averaged per temperature step. */
export interface AnalysisStep {
  temperatureK: number;
  /** Mean resistivity of the step's points. */
  resistivityOhmCm: number;
  /** Sample standard deviation of the step's points (0 for a single point). */
  spreadOhmCm: number;
  count: number;
}

/** Arrhenius coordinates of one step. */
export interface ArrheniusPoint {
  /** 1000 / T, 1/kK. */
  inverseTemperaturePerKK: number;
  lnResistivity: number;
  lnConductivity: number;
}

/** A temperature range the data suggest for one regime. */
export interface SuggestedWindow {
  regime: RegimeName;
  minK: number;
  maxK: number;
  /** Stored points inside [minK, maxK]. */
  pointCount: number;
}

/** Resistivity at 23 °C from a sweep and the spec check against the lot. */
export interface SpecCheckDto {
  resistivityAt23COhmCm: number | null;
  /** null when the lot has no spec limits or no value at 23 °C is available. */
  inSpec: boolean | null;
  specMinOhmCm: number | null;
  specMaxOhmCm: number | null;
  method: 'interpolated' | 'nearest' | null;
  /** Distance from 296.15 K of the nearest step used, K. */
  distanceK: number | null;
  /** Why there is no value or no verdict, when there is none. */
  reason: string | null;
}

/** `GET /api/sweeps/:id/analysis` answer. */
export interface SweepAnalysisResponse {
  sweep: AnalysisSweepDto;
  steps: AnalysisStep[];
  arrhenius: ArrheniusPoint[];
  suggestedWindows: SuggestedWindow[];
  spec: SpecCheckDto;
}

export const FIT_KINDS = ['arrhenius', 'model', 'tcr', 'bloch-gruneisen'] as const;
export type FitKind = (typeof FIT_KINDS)[number];

/** `POST /api/sweeps/:id/fits` body, by kind. */
export type FitRequest = (
  | {
      kind: 'arrhenius';
      minK: number;
      maxK: number;
      quantity?: 'resistivity' | 'conductivity';
      prefactorExponent?: number;
      /** Regime for the reading; default: the suggested window the fit window overlaps most. */
      regime?: RegimeName;
      /** Freeze-out only: a compensated sample reads Ea ≈ Ed instead of Ed/2. Default false. */
      compensated?: boolean;
    }
  | {
      kind: 'model';
      material?: string;
      initial: DopingInput & { mobilityScale?: number };
      free: Array<
        'donorDensity' | 'acceptorDensity' | 'donorLevel' | 'acceptorLevel' | 'mobilityScale'
      >;
      minK?: number;
      maxK?: number;
    }
  | { kind: 'tcr'; referenceK?: number; minK?: number; maxK?: number }
  | { kind: 'bloch-gruneisen'; minK?: number; maxK?: number }
) & {
  /** Fit readings flagged at import too (default false: flagged points are left out). */
  includeFlagged?: boolean;
  /** Readings within this many kelvin of each other form one dwell step (default 0.5). */
  stepToleranceK?: number;
  /** Standard uncertainty of each temperature reading, K (default 0). */
  temperatureUncertaintyK?: number;
};

/** Goodness of fit; every kind has rSquared (null where not defined), count and residualRms. */
export interface FitGoodness {
  rSquared: number | null;
  count: number;
  /** RMS of the residuals, in the residuals' own unit (see `residualUnit`). */
  residualRms: number;
  residualUnit: string;
  [extra: string]: unknown;
}

/** What a fit's parameters say about the material, and the assumptions of that reading. */
export interface FitInterpretation {
  /** Regime the reading assumes. */
  regime: RegimeName | null;
  property: 'band-gap-0K' | 'dopant-level' | null;
  /** The property's value, eV. */
  valueEv: number | null;
  standardErrorEv: number | null;
  compensation: 'compensated' | 'uncompensated' | 'unknown';
  compensationSource: 'request' | 'inferred' | 'not-applicable';
  /** The T^m prefactor exponent the reading assumes. */
  prefactorExponent: number;
  /** One sentence: method and assumption. */
  note: string;
}

/** Curvature of an Arrhenius window (a straight line is the assumption being tested). */
export interface FitCurvature {
  value: number;
  standardError: number;
  t: number;
  significant: boolean;
}

/** A stored fit. */
export interface FitDto {
  id: number;
  sweepId: number;
  kind: FitKind;
  /** Everything needed to re-run the fit (the request plus defaults applied). */
  inputs: Record<string, unknown>;
  windowMinK: number | null;
  windowMaxK: number | null;
  parameters: Record<string, number>;
  standardErrors: Record<string, number | null>;
  /** 95 % intervals keyed like `standardErrors`. */
  confidenceIntervals: Record<string, [number, number] | null>;
  goodness: FitGoodness;
  residuals: Array<{ temperatureK: number; residual: number }>;
  converged: boolean;
  reason: string | null;
  reading: string | null;
  modelVersion: string;
  createdBy: { id: number; name: string | null };
  createdAt: string;
  /** Dwell steps fitted (`goodness.count` stays the number of readings). */
  stepCount: number | null;
  /** Flagged points left out (sequence numbers). */
  excludedSequences: number[];
  interpretation: FitInterpretation | null;
  /** Arrhenius only. */
  curvature: FitCurvature | null;
  /** E.g. window spans two regimes, parameter at bound, RSE > 50 %. */
  warnings: string[];
}

/** `POST /api/sweeps/:id/fits/preview` answer: the fit as it would be saved, not stored. */
export type FitPreviewDto = Omit<FitDto, 'id' | 'createdAt' | 'createdBy'>;

/** `GET /api/wafers/:id/dopant` answer. */
export interface DopantDensityResponse {
  waferId: number;
  resistivityAt23COhmCm: number;
  dopant: string | null;
  dopantDensityCm3: number | null;
  /** How the numbers were obtained (standard, sweep, interpolation or nearest point). */
  source: string;
  sweepId: number;
  method: 'interpolated' | 'nearest';
  distanceK: number;
  inSpec: boolean | null;
  /** Why dopantDensityCm3 or inSpec is null, when one is. */
  reason: string | null;
}

/** One wafer row of a lot summary. */
export interface LotSummaryWafer {
  waferId: number;
  number: string;
  sweepId: number | null;
  resistivityAt23COhmCm: number | null;
  method: 'interpolated' | 'nearest' | null;
  distanceK: number | null;
  pass: boolean | null;
  reason: string | null;
  activationEnergies: Array<{
    fitId: number;
    sweepId: number;
    activationEnergyEv: number;
    standardErrorEv: number | null;
    minK: number | null;
    maxK: number | null;
    quantity: string;
  }>;
}

/** `GET /api/lots/:id/summary` answer. */
export interface LotSummaryResponse {
  lot: {
    id: number;
    code: string;
    material: string;
    dopant: string | null;
    specMinOhmCm: number | null;
    specMaxOhmCm: number | null;
  };
  wafers: LotSummaryWafer[];
  statistics: {
    count: number;
    passCount: number;
    failCount: number;
    meanOhmCm: number | null;
    stdDevOhmCm: number | null;
    minOhmCm: number | null;
    maxOhmCm: number | null;
    cpk: number | null;
    cpkReason: string | null;
  };
}

/** `GET /api/compare?sweeps=1,2,3` answer. */
export interface CompareResponse {
  temperaturesK: number[];
  curves: Array<{
    sweepId: number;
    waferId: number;
    waferNumber: string;
    lotId: number;
    lotCode: string;
    material: string;
    minTemperatureK: number;
    maxTemperatureK: number;
    /** Aligned with temperaturesK; null outside the sweep's own temperature range. */
    resistivityOhmCm: Array<number | null>;
  }>;
}
