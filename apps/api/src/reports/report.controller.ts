import type { Request, Response } from 'express';
import { currentUser } from '../middleware/authenticate';
import { parseId } from '../middleware/validate';
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
};
