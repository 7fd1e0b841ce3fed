import { Router, type Request, type Response } from 'express';
import type { AppDeps } from '../deps';
import { authenticate, currentUser } from '../middleware/authenticate';
import { parseId } from '../middleware/validate';
import { renderReportPdf } from './report-pdf';
import { reportData } from './report.service';

/** `GET /api/sweeps/:id/report`: the printable PDF report of one sweep (any role that sees it). */
export function reportsRouter(deps: AppDeps): Router {
  const router = Router();
  router.get(
    '/sweeps/:id/report',
    authenticate(deps.config.jwtSecret),
    async (req: Request, res: Response) => {
      const data = await reportData(currentUser(req), parseId(req.params));
      const pdf = await renderReportPdf(data);
      res
        .type('application/pdf')
        .setHeader('Content-Disposition', `inline; filename="sweep-${data.sweepId}-report.pdf"`);
      res.send(pdf);
    },
  );
  return router;
}
