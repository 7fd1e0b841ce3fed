/** The lot summary (every wafer's 23 °C value, verdict and statistics) and the overlay's curves. */
import type { HallAt300K } from './hall';
import type { LotUniformitySpread, WaferUniformity } from './maps';
import type { LotCapability, SpecVerdict, ValueAt23CMethod, ValueUncertainty } from './spec';

/** One wafer row of a lot summary. */
export interface LotSummaryWafer extends ValueUncertainty {
  waferId: number;
  number: string;
  sweepId: number | null;
  resistivityAt23COhmCm: number | null;
  method: ValueAt23CMethod | null;
  distanceK: number | null;
  /** `verdict === 'pass'`; null when there is no verdict. */
  pass: boolean | null;
  verdict: SpecVerdict | null;
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
  /**
   * When the sweep behind the 23 °C value is a wafer map: its uniformity at the step nearest
   * 23 °C (over the sites not excluded); null otherwise.
   */
  uniformity?: WaferUniformity | null;
  /** The wafer's latest Hall sweep at 300 K, null when it has none. */
  hall?: HallAt300K | null;
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
  statistics: LotCapability & {
    count: number;
    passCount: number;
    failCount: number;
    meanOhmCm: number | null;
    stdDevOhmCm: number | null;
    minOhmCm: number | null;
    maxOhmCm: number | null;
    /** Always null: within-wafer repeatability is not measured (see `cpkReason`); use `ppk`. */
    cpk: number | null;
    cpkReason: string | null;
    /** The spread of the map wafers' uniformities; null without two-site maps. */
    uniformity?: LotUniformitySpread | null;
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
    /** Hall sweeps only: the sweep at 300 K. */
    hall?: HallAt300K;
  }>;
}
