import type {
  LotCapability,
  LotSummaryResponse,
  LotSummaryWafer,
  SessionUser,
} from '@rhotrace/api-types';
import { processPerformance } from '@rhotrace/physics';
import { Op } from 'sequelize';
import { max, mean, min, sampleStandardDeviation } from 'simple-statistics';
import { visibleLot, visibleWafers } from '../access/visibility.service';
import { Fit } from '../fits/fit.model';
import { Sweep } from '../sweeps/sweep.model';
import { Wafer } from '../wafers/wafer.model';
import { hallAt300K } from './hall-analysis';
import { specVerdict } from './spec-check';
import { waferAssessment } from './spec.service';
import { lotUniformitySpread, waferUniformity } from '../maps/maps.service';

/** Why `cpk` is null: Cpk needs the within-wafer (short-term) spread, which is not measured. */
export const CPK_REASON =
  'Cpk needs the within-wafer repeatability (repeated sites or measurements per wafer), which ' +
  'is not measured; Ppk from the spread between wafers is given instead';

/** Ppk of the wafers' 23 °C values with Bissell's lower bound, and the verdict counts. */
export function lotCapability(
  rows: readonly Pick<LotSummaryWafer, 'resistivityAt23COhmCm' | 'verdict'>[],
  lsl: number | null,
  usl: number | null,
): LotCapability {
  const values = rows.flatMap((r) =>
    r.resistivityAt23COhmCm === null ? [] : [r.resistivityAt23COhmCm],
  );
  const p = processPerformance(values, lsl, usl, 'wafers with a value at 23 °C');
  return {
    ppk: p.ppk,
    ppkLower95: p.ppkLower95,
    ppkReason: p.reason,
    note: p.note,
    indeterminateCount: rows.filter((r) => r.verdict === 'indeterminate').length,
  };
}

/** `GET /api/lots/:id/summary`. Technicians see only their assigned wafers (404 if none). */
export async function lotSummary(user: SessionUser, lotId: number): Promise<LotSummaryResponse> {
  const lot = await visibleLot(user, lotId);
  const wafers = await Wafer.findAll({
    where: { [Op.and]: [visibleWafers(user), { lotId }] },
    order: [['number', 'ASC']],
  });

  const sweeps = await Sweep.findAll({
    attributes: ['id', 'waferId', 'sha256', 'createdAt', 'pointCount', 'mapInfo'],
    where: { waferId: { [Op.in]: wafers.map((w) => w.id) } },
  });
  const fits = await Fit.findAll({
    where: { kind: 'arrhenius', sweepId: { [Op.in]: sweeps.map((s) => s.id) } },
    order: [['id', 'ASC']],
  });
  const waferOfSweep = new Map(sweeps.map((s) => [s.id, s.waferId]));
  const hallSweeps = await Sweep.findAll({
    attributes: ['id', 'waferId', 'sha256', 'createdAt', 'pointCount', 'parseReport'],
    where: { waferId: { [Op.in]: wafers.map((w) => w.id) }, method: 'hall' },
    order: [['id', 'DESC']],
  });

  const rows: LotSummaryWafer[] = [];
  for (const wafer of wafers) {
    const found = await waferAssessment(wafer, lot);
    const rho = found.value.resistivityOhmCm;
    const verdict = specVerdict(
      rho,
      found.uncertainty.uncertaintyOhmCm,
      lot.specMinOhmCm,
      lot.specMaxOhmCm,
    );
    const sweep = found.sweepId === null ? null : sweeps.find((s) => s.id === found.sweepId);
    const latestHall = hallSweeps.find((s) => s.waferId === wafer.id);
    rows.push({
      uniformity: sweep ? await waferUniformity(sweep) : null,
      hall: latestHall ? await hallAt300K(latestHall) : null,
      waferId: wafer.id,
      number: wafer.number,
      sweepId: found.sweepId,
      resistivityAt23COhmCm: rho,
      method: found.value.method,
      distanceK: found.value.distanceK,
      pass: verdict.verdict === null ? null : verdict.verdict === 'pass',
      verdict: verdict.verdict,
      ...found.uncertainty,
      reason: found.value.reason ?? verdict.reason,
      activationEnergies: fits
        .filter((f) => waferOfSweep.get(f.sweepId) === wafer.id)
        .map((f) => {
          const p = f.parameters as Record<string, number>;
          const se = f.standardErrors as Record<string, number | null>;
          const inputs = f.inputs as Record<string, unknown>;
          return {
            fitId: f.id,
            sweepId: f.sweepId,
            activationEnergyEv: p['activationEnergyEv']!,
            standardErrorEv: se['activationEnergyEv'] ?? null,
            minK: f.windowMinK,
            maxK: f.windowMaxK,
            quantity: String(inputs['quantity'] ?? 'resistivity'),
          };
        }),
    });
  }
  const values = rows.flatMap((r) =>
    r.resistivityAt23COhmCm === null ? [] : [r.resistivityAt23COhmCm],
  );
  return {
    lot: {
      id: lot.id,
      code: lot.code,
      material: lot.material,
      dopant: lot.dopant,
      specMinOhmCm: lot.specMinOhmCm,
      specMaxOhmCm: lot.specMaxOhmCm,
    },
    wafers: rows,
    statistics: {
      count: values.length,
      passCount: rows.filter((r) => r.verdict === 'pass').length,
      failCount: rows.filter((r) => r.verdict === 'fail').length,
      meanOhmCm: values.length ? mean(values) : null,
      stdDevOhmCm: values.length >= 2 ? sampleStandardDeviation(values) : null,
      minOhmCm: values.length ? min(values) : null,
      maxOhmCm: values.length ? max(values) : null,
      ...lotCapability(rows, lot.specMinOhmCm, lot.specMaxOhmCm),
      cpk: null,
      cpkReason: CPK_REASON,
      uniformity: lotUniformitySpread(rows),
    },
  };
}
