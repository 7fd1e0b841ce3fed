/**
 * Hall-effect shapes of the analysis answers: n(T) and mu_H(T) by step, and a sweep's values at
 * 300 K for the compare and lot summaries.
 */
import type { SuggestedWindow } from './analysis';

/** One temperature step of a Hall sweep (means of the step's readings). */
export interface HallAnalysisStep {
  temperatureK: number;
  carrierDensityCm3: number;
  /** Sample standard deviation of the step's densities (0 for one reading). */
  carrierDensitySpreadCm3: number;
  hallMobilityCm2PerVs: number;
  hallCoefficientCm3PerC: number;
  /** The sign of the step's mean Hall coefficient. */
  carrierType: 'n' | 'p';
  count: number;
  /** Sample standard deviation of the step's Hall mobilities (0 for one reading). */
  hallMobilitySpreadCm2PerVs?: number;
}

/** The Hall part of a sweep analysis. */
export interface HallAnalysis {
  steps: HallAnalysisStep[];
  /** 'mixed' when the sign changes within the sweep. */
  carrierType: 'n' | 'p' | 'mixed';
  /** r_H the densities were computed with at import. */
  hallFactor: number;
  /** Carrier density and Hall mobility at 300 K (interpolated within 15 K), null if none. */
  carrierDensityAt300KCm3: number | null;
  hallMobilityAt300KCm2PerVs: number | null;
  /**
   * Where n(T) is frozen out (below half its plateau value), the range that fixes the dopant
   * level in a carrier-density fit; null when the sweep shows no plateau or no freeze-out.
   */
  freezeOutWindow: SuggestedWindow | null;
  /** Standard uncertainties of the values at 300 K, as in `HallAt300K`. */
  carrierDensityAt300KUncertaintyCm3?: number | null;
  hallMobilityAt300KUncertaintyCm2PerVs?: number | null;
}

/** Carrier density and Hall mobility of a Hall sweep at 300 K (interpolated within 15 K). */
export interface HallAt300K {
  sweepId: number;
  carrierType: 'n' | 'p' | 'mixed';
  carrierDensityAt300KCm3: number | null;
  hallMobilityAt300KCm2PerVs: number | null;
  /** r_H the density was computed with. */
  hallFactor: number;
  /**
   * Standard uncertainties of the two values at 300 K from the scatter of the readings (type A,
   * k = 1); null where a step used has one reading. The Hall factor is an assumption, not in them.
   */
  carrierDensityAt300KUncertaintyCm3?: number | null;
  hallMobilityAt300KUncertaintyCm2PerVs?: number | null;
}
