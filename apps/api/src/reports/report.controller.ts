import type { Request, Response } from 'express';
import { currentUser } from '../middleware/authenticate';
import { parseId } from '../middleware/validate';
import { renderLotReportPdf } from './lot-report-pdf';
import { lotReportData } from './lot-report.service';
import { renderReportPdf } from './report-pdf';
import { reportData } from './report.service';

/** Handlers of the printable reports. */
export const reportsController = {
  /** `GET /api/sweeps/:id/report`: the PDF report of one sweep, shown inline. */
  async sweepReport(req: Request, res: Response): Promise<void> {
    const data = await reportData(currentUser(req), parseId(req.params));
    const pdf = await renderReportPdf(data);
    res
      .type('application/pdf')
      .setHeader('Content-Disposition', `inline; filename="sweep-${data.sweepId}-report.pdf"`);
    res.send(pdf);
  },

  /** `GET /api/lots/:id/report.pdf`: the PDF report of one lot, shown inline. */
  async lotReport(req: Request, res: Response): Promise<void> {
    const data = await lotReportData(currentUser(req), parseId(req.params));
    const pdf = await renderLotReportPdf(data);
    res
      .type('application/pdf')
      .setHeader('Content-Disposition', `inline; filename="lot-${data.summary.lot.id}-report.pdf"`);
    res.send(pdf);
  },
};
