import type { Request, Response } from 'express';
import type { AuditEventDto, Page } from '@rhotrace/api-types';
import { currentUser } from '../middleware/authenticate';
import { parseId, parseOrThrow } from '../middleware/validate';
import { listAudit } from './audit.service';
import { historyQuery, listQuery } from './audit.schemas';
import { type HistoryOf, recordHistory } from './record-history';

const history =
  (of: HistoryOf) =>
  async (req: Request, res: Response<Page<AuditEventDto>>): Promise<void> => {
    const id = parseId(req.params);
    const page = parseOrThrow(historyQuery, req.query, 'query');
    res.json(await recordHistory(currentUser(req), of, id, page));
  };

/** Handlers of /api/audit and of each lot's, wafer's and station's history. */
export const auditController = {
  async list(req: Request, res: Response<Page<AuditEventDto>>) {
    res.json(await listAudit(parseOrThrow(listQuery, req.query, 'query')));
  },
  lotHistory: history('lot'),
  waferHistory: history('wafer'),
  stationHistory: history('station'),
};
