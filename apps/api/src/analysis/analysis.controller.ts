import type { Request, Response } from 'express';
import { currentUser } from '../middleware/authenticate';
import { parseId, parseOrThrow } from '../middleware/validate';
import { badRequest } from '../errors';
import { MAX_COMPARE_SWEEPS, compareSweeps, sweepAnalysis, waferDopant } from './analysis.service';
import { analysisQuerySchema, compareSchema, curveSchema } from './analysis.schemas';
import { toCsv } from './csv';
import { lotSummary } from './lot-summary.service';
import { curveFor, materials } from './model.service';

/** `POST /api/model/curve`. */
export function postModelCurve(req: Request, res: Response): void {
  currentUser(req);
  const body = parseOrThrow(curveSchema, req.body, 'body');
  res.json(curveFor(body));
}

/** `GET /api/materials`. */
export function getMaterials(req: Request, res: Response): void {
  currentUser(req);
  res.json(materials());
}

/** `GET /api/sweeps/:id/analysis`. */
export async function getSweepAnalysis(req: Request, res: Response): Promise<void> {
  const { leg, site } = parseOrThrow(analysisQuerySchema, req.query, 'query');
  res.json(await sweepAnalysis(currentUser(req), parseId(req.params), leg, site ?? null));
}

/** `GET /api/wafers/:id/dopant`. */
export async function getWaferDopant(req: Request, res: Response): Promise<void> {
  res.json(await waferDopant(currentUser(req), parseId(req.params)));
}

/** `GET /api/lots/:id/summary`. */
export async function getLotSummary(req: Request, res: Response): Promise<void> {
  res.json(await lotSummary(currentUser(req), parseId(req.params)));
}

/** `GET /api/lots/:id/summary.csv`. */
export async function getLotSummaryCsv(req: Request, res: Response): Promise<void> {
  const s = await lotSummary(currentUser(req), parseId(req.params));
  const rows = s.wafers.map((w) => [
    s.lot.code,
    w.number,
    w.sweepId,
    w.resistivityAt23COhmCm,
    w.method,
    w.distanceK,
    w.verdict ?? '',
    w.activationEnergies.map((a) => `${a.activationEnergyEv.toPrecision(4)} eV`).join('; '),
    w.reason,
    w.uncertaintyOhmCm,
    w.hall?.carrierDensityAt300KCm3 ?? null,
    w.hall?.hallMobilityAt300KCm2PerVs ?? null,
    w.hall?.carrierType ?? null,
    w.hall?.carrierDensityAt300KUncertaintyCm3 ?? null,
    w.hall?.hallMobilityAt300KUncertaintyCm2PerVs ?? null,
    w.hall?.hallFactor ?? null,
  ]);
  const st = s.statistics;
  rows.push(
    ['statistics', 'mean', null, st.meanOhmCm, null, null, null, null, null],
    ['statistics', 'std dev', null, st.stdDevOhmCm, null, null, null, null, null],
    ['statistics', 'min', null, st.minOhmCm, null, null, null, null, null],
    ['statistics', 'max', null, st.maxOhmCm, null, null, null, null, null],
    ['statistics', 'Ppk', null, st.ppk, null, null, null, null, st.ppkReason ?? st.note],
    ['statistics', 'Ppk lower 95 %', null, st.ppkLower95, null, null, null, null, 'Bissell 1990'],
    ['statistics', 'Cpk', null, st.cpk, null, null, null, null, st.cpkReason],
  );
  const csv = toCsv(
    [
      'lot',
      'wafer',
      'sweep_id',
      'resistivity_23c_ohm_cm',
      'method',
      'distance_k',
      'spec',
      'activation_energies',
      'note',
      'expanded_uncertainty_k2_ohm_cm',
      'hall_carrier_density_300k_cm3',
      'hall_mobility_300k_cm2_per_vs',
      'carrier_type',
      // Standard uncertainties (k = 1, type A, from the readings' scatter); the Hall factor is
      // an assumption stated beside them, not part of them.
      'hall_carrier_density_300k_u_k1_cm3',
      'hall_mobility_300k_u_k1_cm2_per_vs',
      'hall_factor',
    ],
    rows,
  );
  res.type('text/csv; charset=utf-8').attachment(`lot-${s.lot.id}-summary.csv`).send(csv);
}

/** `GET /api/compare?sweeps=1,2,3[&points=200]`. */
export async function getCompare(req: Request, res: Response): Promise<void> {
  const q = parseOrThrow(compareSchema, req.query, 'query');
  const parts = q.sweeps.split(',').map((s) => s.trim());
  const ids = parts.map(Number);
  if (parts.some((p, i) => !/^\d+$/.test(p) || !Number.isSafeInteger(ids[i]) || ids[i]! <= 0)) {
    throw badRequest('sweeps must be a comma-separated list of sweep ids', [
      {
        field: 'query.sweeps',
        problem: 'must be a comma-separated list of positive whole numbers',
      },
    ]);
  }
  const unique = [...new Set(ids)];
  if (unique.length > MAX_COMPARE_SWEEPS) {
    throw badRequest(`At most ${MAX_COMPARE_SWEEPS} sweeps can be compared`, [
      {
        field: 'query.sweeps',
        problem: `lists ${unique.length} sweeps; at most ${MAX_COMPARE_SWEEPS}`,
      },
    ]);
  }
  res.json(await compareSweeps(currentUser(req), unique, q.points));
}
