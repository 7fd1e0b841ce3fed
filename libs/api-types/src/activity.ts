/**
 * Recent activity the benches show: the newest sweeps and the newest saved fits, each with the
 * labels needed to name it (wafer number, lot code, who) so a bench needs one request per list.
 */
import type { FitKind } from './fits';
import type { SweepMethod } from './sweeps';

/** Most items a recent-activity list returns. */
export const MAX_RECENT_LIMIT = 50;
/** Items returned when `limit` is not given. */
export const DEFAULT_RECENT_LIMIT = 8;

/** One item of `GET /api/sweeps/recent`. */
export interface RecentSweepDto {
  id: number;
  waferId: number;
  waferNumber: string;
  lotId: number;
  lotCode: string;
  material: string;
  method: SweepMethod;
  originalName: string;
  pointCount: number;
  minTemperatureK: number | null;
  maxTemperatureK: number | null;
  uploadedBy: { id: number; name: string | null };
  createdAt: string;
}

/** `GET /api/sweeps/recent?limit=` answer, newest first. */
export interface RecentSweepsResponse {
  items: RecentSweepDto[];
}

/** One item of `GET /api/fits/recent`. */
export interface RecentFitDto {
  id: number;
  kind: FitKind;
  sweepId: number;
  sweepName: string;
  waferId: number;
  waferNumber: string;
  lotId: number;
  lotCode: string;
  /** The fit's first parameter, the one its kind is read by (e.g. activationEnergyEv). */
  headline: { parameter: string; value: number; standardError: number | null } | null;
  windowMinK: number | null;
  windowMaxK: number | null;
  converged: boolean;
  reading: string | null;
  createdBy: { id: number; name: string | null };
  createdAt: string;
}

/** `GET /api/fits/recent?limit=&mine=` answer, newest first. */
export interface RecentFitsResponse {
  items: RecentFitDto[];
}
