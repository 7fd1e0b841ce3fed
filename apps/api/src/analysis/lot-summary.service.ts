import type { LotSummaryResponse, LotSummaryWafer, SessionUser } from '@rhotrace/api-types';
import { Op } from 'sequelize';
import { max, mean, min, sampleStandardDeviation } from 'simple-statistics';
import { visibleLot, visibleWafers } from '../access/visibility.service';
import { Fit } from '../fits/fit.model';
import { Sweep } from '../sweeps/sweep.model';
import { Wafer } from '../wafers/wafer.model';
import { waferValueAt23C } from './analysis.service';
import { specVerdict } from './spec-check';

/**
 * Process capability against the spec: Cpk = min(USL - mean, mean - LSL) / (3 s) with s the
 * sample standard deviation; one-sided when the lot has only one limit. Null, with the reason,
 * for fewer than 2 values, s = 0, or no limits.
 */
export function processCapability(
  values: readonly number[],
  lsl: number | null,
  usl: number | null,
): { cpk: number | null; reason: string | null } {
  if (lsl === null && usl === null) return { cpk: null, reason: 'The lot has no resistivity spec' };
  if (values.length < 2) {
    return { cpk: null, reason: 'Cpk needs at least 2 wafers with a resistivity at 23 °C' };
  }
  const sd = sampleStandardDeviation([...values]);
  if (sd === 0)
    return { cpk: null, reason: 'All wafers read the same; the standard deviation is 0' };
  const m = mean([...values]);
  const sides: number[] = [];
  if (usl !== null) sides.push(usl - m);
  if (lsl !== null) sides.push(m - lsl);
  return { cpk: Math.min(...sides) / (3 * sd), reason: null };
}

/** `GET /api/lots/:id/summary`. Technicians see only their assigned wafers (404 if none). */
export async function lotSummary(user: SessionUser, lotId: number): Promise<LotSummaryResponse> {
  const lot = await visibleLot(user, lotId);
  const wafers = await Wafer.findAll({
    where: { [Op.and]: [visibleWafers(user), { lotId }] },
    order: [['number', 'ASC']],
  });

  const sweeps = await Sweep.findAll({
    attributes: ['id', 'waferId'],
    where: { waferId: { [Op.in]: wafers.map((w) => w.id) } },
  });
  const fits = await Fit.findAll({
    where: { kind: 'arrhenius', sweepId: { [Op.in]: sweeps.map((s) => s.id) } },
    order: [['id', 'ASC']],
  });
  const waferOfSweep = new Map(sweeps.map((s) => [s.id, s.waferId]));

  const rows: LotSummaryWafer[] = [];
  for (const wafer of wafers) {
    const found = await waferValueAt23C(wafer.id);
    const rho = found.value.resistivityOhmCm;
    const verdict = specVerdict(rho, lot.specMinOhmCm, lot.specMaxOhmCm);
    rows.push({
      waferId: wafer.id,
      number: wafer.number,
      sweepId: found.sweepId,
      resistivityAt23COhmCm: rho,
      method: found.value.method,
      distanceK: found.value.distanceK,
      pass: verdict.inSpec,
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
  const capability = processCapability(values, lot.specMinOhmCm, lot.specMaxOhmCm);
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
      passCount: rows.filter((r) => r.pass === true).length,
      failCount: rows.filter((r) => r.pass === false).length,
      meanOhmCm: values.length ? mean(values) : null,
      stdDevOhmCm: values.length >= 2 ? sampleStandardDeviation(values) : null,
      minOhmCm: values.length ? min(values) : null,
      maxOhmCm: values.length ? max(values) : null,
      cpk: capability.cpk,
      cpkReason: capability.reason,
    },
  };
}
