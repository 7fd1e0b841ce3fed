import type { Request, Response } from 'express';
import type { AuditEventDto, Page } from '@rhotrace/api-types';
import { parseOrThrow } from '../middleware/validate';
import { listAudit } from './audit.service';
import { listQuery } from './audit.schemas';

/** Handlers of /api/audit. */
export const auditController = {
  async list(req: Request, res: Response<Page<AuditEventDto>>) {
    res.json(await listAudit(parseOrThrow(listQuery, req.query, 'query')));
  },
};
