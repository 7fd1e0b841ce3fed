/**
 * Analysis API shapes: model curves, materials, sweep analysis, fits, dopant density, lot
 * summaries and sweep comparison. Units are in the field names (K, ohm cm, cm^-3, eV).
 */
import type { HallAnalysis } from './hall';
import type { PointFinding, SweepGeometry } from './sweeps';
import type { SpecVerdict, ValueAt23CMethod, ValueUncertainty } from './spec';

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
  /** Factor on both mobilities, as a full-model fit reports it (semiconductors); default 1. */
  mobilityScale?: number;
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
  /** Bloch–Grüneisen model curve of the bulk metal (20–1000 K). */
  resistivityOhmCm: number | null;
  /** Linear reference rho_20 [1 + alpha (T - 293.15 K)] (200–600 K). */
  linearReferenceOhmCm: number | null;
}

/** `POST /api/model/curve` answer. */
export type ModelCurveResponse =
  | {
      kind: 'semiconductor';
      material: string;
      points: SemiconductorCurvePoint[];
      boundaries: { freezeOutBelowK: number | null; intrinsicAboveK: number | null };
      modelVersion: string;
      /** Where the model is extrapolated or its assumptions are doubtful (plain sentences). */
      warnings: string[];
    }
  | {
      kind: 'metal';
      material: string;
      points: MetalCurvePoint[];
      boundaries: null;
      /** The reference parameters the curve was drawn from. */
      reference: Record<string, unknown>;
      modelVersion: string;
      /** Where the model is extrapolated or its assumptions are doubtful (plain sentences). */
      warnings: string[];
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
  /** Where the default donor and acceptor merge with the band (default ionization model), cm^-3. */
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
  /** The geometry the sweep's readings were converted with, and where each value came from. */
  geometry: SweepGeometry;
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
  /** Why the window deserves caution, e.g. fewer than 5 steps. */
  warnings?: string[];
}

/** Resistivity at 23 °C from a sweep and the spec check against the lot. */
export interface SpecCheckDto extends ValueUncertainty {
  resistivityAt23COhmCm: number | null;
  /** `verdict === 'pass'`; null when there is no verdict. */
  inSpec: boolean | null;
  /** Guard-banded; null when the lot has no spec limits or there is no value at 23 °C. */
  verdict: SpecVerdict | null;
  specMinOhmCm: number | null;
  specMaxOhmCm: number | null;
  method: ValueAt23CMethod | null;
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
  /** The sweep's ramp legs in recorded order. */
  legs?: LegDto[];
  /** The leg the steps above come from; null: all legs together. */
  leg?: number | null;
  /**
   * Sensor-to-sample lag read from an up and a down leg overlapping by at least 20 K: half the
   * temperature offset between them at equal resistivity, positive when the sample trails the
   * sensor; null without such a pair.
   */
  thermalLag?: { lagK: number; standardErrorK: number } | null;
  /** The import's findings: each doubtful point and why (from the sweep's parse report). */
  findings?: PointFinding[];
  /** Points carrying a doubtful flag. */
  flaggedPoints?: number;
  /** Hall sweeps only: n(T) and mu_H(T) by step, the carrier type and the freeze-out window. */
  hall?: HallAnalysis;
  /** What the import warned about (the parse report's warnings, e.g. R_A/R_B above 3). */
  importWarnings?: string[];
  /** Where each flagged reading of the studied leg lies, for the plots (reasons: `findings`). */
  flaggedReadings?: FlaggedReadingDto[];
}

/** A flagged reading's place on the plots; its flags and reasons are the `findings` of its sequence. */
export interface FlaggedReadingDto {
  sequence: number;
  temperatureK: number;
  resistivityOhmCm: number;
}

/** One ramp leg of a sweep. */
export interface LegDto {
  /** 1, 2, ... in recorded order (the points' `leg`). */
  index: number;
  direction: 'up' | 'down' | 'hold';
  minK: number;
  maxK: number;
  /** Dwell steps in the leg (readings within the step tolerance of a step's first). */
  stepCount: number;
}

/** `GET /api/wafers/:id/dopant` answer. */
export interface DopantDensityResponse extends ValueUncertainty {
  waferId: number;
  resistivityAt23COhmCm: number;
  dopant: string | null;
  dopantDensityCm3: number | null;
  /** How the numbers were obtained (standard, sweep, interpolation or correction). */
  source: string;
  sweepId: number;
  method: ValueAt23CMethod;
  distanceK: number;
  /** `verdict === 'pass'`; null when there is no verdict. */
  inSpec: boolean | null;
  verdict: SpecVerdict | null;
  specMinOhmCm: number | null;
  specMaxOhmCm: number | null;
  /** Why dopantDensityCm3 or inSpec is null, when one is. */
  reason: string | null;
}
