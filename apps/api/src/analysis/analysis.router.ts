import { Router } from 'express';
import type { AppDeps } from '../deps';
import { authenticate } from '../middleware/authenticate';
import {
  getCompare,
  getLotSummary,
  getLotSummaryCsv,
  getMaterials,
  getSweepAnalysis,
  getWaferDopant,
  postModelCurve,
} from './analysis.controller';

/**
 * Analysis reads: model curves, materials, sweep analysis, dopant density, lot summaries and
 * comparison. Every signed-in role may read them; sweep, wafer and lot reads are limited to
 * what the user may see (technicians: assigned wafers only, 404 otherwise).
 */
export function analysisRouter(deps: AppDeps): Router {
  const router = Router();
  const auth = authenticate(deps.config.jwtSecret);
  router.post('/model/curve', auth, postModelCurve);
  router.get('/materials', auth, getMaterials);
  router.get('/sweeps/:id/analysis', auth, getSweepAnalysis);
  router.get('/wafers/:id/dopant', auth, getWaferDopant);
  router.get('/lots/:id/summary', auth, getLotSummary);
  router.get('/lots/:id/summary.csv', auth, getLotSummaryCsv);
  router.get('/compare', auth, getCompare);
  return router;
}
