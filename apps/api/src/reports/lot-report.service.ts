import type { FitDto, LotSummaryResponse, SessionUser } from '@rhotrace/api-types';
import { lotSummary } from '../analysis/lot-summary.service';
import { listFitsOfSweep } from '../fits/fit.service';
import { REPORT_CAUTIONS, REPORT_DISCLAIMER } from './report.service';

/** Everything a lot report shows: the lot summary (as the lot page) and the counted sweeps' fits. */
export interface LotReportData {
  summary: LotSummaryResponse;
  /** Saved fits of the sweep that gives each wafer its 23 °C value, by wafer number. */
  fits: Array<{ waferNumber: string; fits: FitDto[] }>;
  printedAt: string;
  cautions: string[];
  disclaimer: string;
}

/** Gathers a lot report (visibility as for the lot summary: technicians see their wafers only). */
export async function lotReportData(user: SessionUser, lotId: number): Promise<LotReportData> {
  const summary = await lotSummary(user, lotId);
  const fits: LotReportData['fits'] = [];
  for (const wafer of summary.wafers) {
    if (wafer.sweepId === null) continue;
    const saved = await listFitsOfSweep(wafer.sweepId);
    if (saved.length > 0) fits.push({ waferNumber: wafer.number, fits: saved });
  }
  return {
    summary,
    fits,
    printedAt: new Date().toISOString(),
    cautions: REPORT_CAUTIONS,
    disclaimer: REPORT_DISCLAIMER,
  };
}
