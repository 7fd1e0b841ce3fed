import { Router } from 'express';
import type { AppDeps } from './deps';
import { healthRouter } from './health/health.router';
import { sweepRouter } from './sweeps/sweep.router';
import { activityRouter } from './activity/activity.router';
import { analysisRouter } from './analysis/analysis.router';
import { fitsRouter } from './fits/fit.router';
import { reportsRouter } from './reports/report.router';
import { authRouter } from './auth/auth.router';
import { usersRouter } from './users/users.router';
import { lotsRouter } from './lots/lots.router';
import { wafersRouter } from './wafers/wafers.router';
import { stationPostRouter } from './station-posts/station-post.router';
import { stationTokensRouter } from './station-tokens/station-tokens.router';
import { stationsRouter } from './stations/stations.router';
import { auditRouter } from './audit/audit.router';
import { assignmentsRouter } from './assignments/assignments.router';
import { devMailRouter } from './mail/dev-mail.router';
import { importSettingsRouter } from './import-settings/import-settings.router';
import { mapsRouter } from './maps/maps.router';
import { openApiRouter } from './openapi/openapi.router';
import { searchRouter } from './search/search.router';
import { plannerRouter } from './planner/planner.router';

/**
 * Every API router, mounted under /api. Each feature adds its own line here.
 */
export function apiRoutes(deps: AppDeps): Router {
  const router = Router();
  router.use(healthRouter(deps));
  router.use(openApiRouter());
  router.use(activityRouter(deps));
  router.use(sweepRouter(deps));
  router.use(authRouter(deps));
  router.use(usersRouter(deps));
  router.use(lotsRouter(deps));
  router.use(wafersRouter(deps));
  router.use(stationsRouter(deps));
  router.use(stationTokensRouter(deps));
  router.use(stationPostRouter(deps));
  router.use(auditRouter(deps));
  router.use(assignmentsRouter(deps));
  router.use(searchRouter(deps));
  router.use(devMailRouter(deps));
  router.use(analysisRouter(deps));
  router.use(fitsRouter(deps));
  router.use(reportsRouter(deps));
  router.use(mapsRouter(deps));
  router.use(plannerRouter(deps));
  router.use(importSettingsRouter(deps));
  return router;
}
