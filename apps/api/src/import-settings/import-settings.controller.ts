import type { ImportSettingsDto } from '@rhotrace/api-types';
import type { Request, Response } from 'express';
import { actorOf } from '../middleware/actor';
import { parseId, parseOrThrow } from '../middleware/validate';
import { listQuery, saveBody } from './import-settings.schemas';
import {
  deleteImportSettings,
  listImportSettings,
  saveImportSettings,
} from './import-settings.service';

/** Handlers of /api/import-settings. */
export const importSettingsController = {
  /** `GET /api/import-settings?stationId=` */
  async list(req: Request, res: Response<ImportSettingsDto[]>) {
    const { stationId } = parseOrThrow(listQuery, req.query, 'query');
    res.json(await listImportSettings(stationId));
  },
  /** `PUT /api/import-settings`: saves or replaces one station's settings for one shape. */
  async save(req: Request, res: Response<ImportSettingsDto>) {
    const body = parseOrThrow(saveBody, req.body, 'body');
    res.json(await saveImportSettings(body, actorOf(req)));
  },
  /** `DELETE /api/import-settings/:id` */
  async remove(req: Request, res: Response) {
    await deleteImportSettings(parseId(req.params), actorOf(req));
    res.status(204).end();
  },
};
