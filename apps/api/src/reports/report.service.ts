import type {
  AnalysisStep,
  FitDto,
  HallAnalysis,
  SessionUser,
  SpecCheckDto,
} from '@rhotrace/api-types';
import { MAGNET } from '../assignments/assignment-safety';
import { hallAnalysis, hallFactorOf } from '../analysis/hall-analysis';
import { Station } from '../stations/station.model';
import { visibleSweep } from '../access/visibility.service';
import { averageSteps, sweepReadings } from '../analysis/sweep-data.service';
import { specCheck } from '../analysis/spec-check';
import { assessSweep } from '../analysis/spec.service';
import { listFitsOfSweep } from '../fits/fit.service';

/** Cautions every printed report carries: the bench's usual hazards, deferring to local rules. */
export const REPORT_CAUTIONS = [
  'Hot chucks burn and cryogens freeze skin and displace oxygen: handle stages and dewars with the protection your lab requires.',
  'Probe current heats small samples and can damage thin films: keep the current as low as the reading allows.',
  'Some compound semiconductors (for example GaAs) are toxic when broken or abraded: collect fragments as your lab directs.',
  'Follow your lab\u2019s own safety rules, local codes and licensed practice; they take precedence over anything here.',
];

/** The statement printed on every report. */
export const REPORT_DISCLAIMER = 'Results are engineering estimates, not certified values.';

/** Everything a sweep report shows. */
export interface ReportData {
  sweepId: number;
  sweepName: string;
  measuredAt: string;
  method: string;
  waferNumber: string;
  lotCode: string;
  material: string;
  dopant: string | null;
  specMinOhmCm: number | null;
  specMaxOhmCm: number | null;
  station: { name: string; probeSpacingCm: number; thermometer: string } | null;
  geometry: Record<string, unknown>;
  steps: AnalysisStep[];
  resistivityAt23COhmCm: number | null;
  inSpec: boolean | null;
  /** The 23 °C value with its method, uncertainty budget and guard-banded verdict. */
  spec: SpecCheckDto;
  fits: FitDto[];
  /** Hall sweeps only: n(T), mu_H(T) and what goes with them. */
  hall: HallAnalysis | null;
  cautions: string[];
  disclaimer: string;
}

/** Gathers a sweep's report data (visibility as for every sweep read). */
export async function reportData(user: SessionUser, sweepId: number): Promise<ReportData> {
  const v = await visibleSweep(user, sweepId);
  const { points } = await sweepReadings(v.sweep);
  const steps = averageSteps(points);
  const factor = hallFactorOf(v.sweep.parseReport);
  const hall = factor === null ? null : hallAnalysis(points, factor);
  const station = v.sweep.stationId ? await Station.findByPk(v.sweep.stationId) : null;
  const assessed = await assessSweep(v.sweep, v.wafer, v.lot, steps);
  const spec = specCheck(
    assessed.value,
    assessed.uncertainty,
    v.lot.specMinOhmCm,
    v.lot.specMaxOhmCm,
  );
  const geometry = { ...((v.sweep.geometry as Record<string, unknown> | null) ?? {}) };
  delete geometry['sources'];
  return {
    sweepId: v.sweep.id,
    sweepName: v.sweep.originalName,
    measuredAt: v.sweep.createdAt.toISOString(),
    method: v.sweep.method,
    waferNumber: v.wafer.number,
    lotCode: v.lot.code,
    material: v.lot.material,
    dopant: v.lot.dopant,
    specMinOhmCm: v.lot.specMinOhmCm,
    specMaxOhmCm: v.lot.specMaxOhmCm,
    station: station
      ? {
          name: station.name,
          probeSpacingCm: station.probeSpacingCm,
          thermometer: station.thermometer,
        }
      : null,
    geometry,
    steps,
    resistivityAt23COhmCm: spec.resistivityAt23COhmCm,
    inSpec: spec.inSpec,
    spec,
    fits: await listFitsOfSweep(sweepId),
    hall,
    // A Hall sweep was measured in a strong field: its magnet's cautions come first.
    cautions: hall ? [MAGNET, ...REPORT_CAUTIONS] : REPORT_CAUTIONS,
    disclaimer: REPORT_DISCLAIMER,
  };
}
