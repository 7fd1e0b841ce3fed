import type { Request, Response } from 'express';
import type { Page, WaferDto } from '@rhotrace/api-types';
import { actorOf } from '../middleware/actor';
import { currentUser } from '../middleware/authenticate';
import { parseId, parseOrThrow } from '../middleware/validate';
import {
  createWafer,
  deleteWafer,
  getWafer,
  listLotWafers,
  listWafers,
  updateWafer,
} from './wafers.service';
import { createBody, updateBody, listQuery, lotListQuery } from './wafers.schemas';

/** Handlers of /api/wafers and /api/lots/:id/wafers. */
export const wafersController = {
  async list(req: Request, res: Response<Page<WaferDto>>) {
    res.json(await listWafers(currentUser(req), parseOrThrow(listQuery, req.query, 'query')));
  },
  async listInLot(req: Request, res: Response<Page<WaferDto>>) {
    const lotId = parseId(req.params);
    const query = parseOrThrow(lotListQuery, req.query, 'query');
    res.json(await listLotWafers(currentUser(req), lotId, query));
  },
  async get(req: Request, res: Response<WaferDto>) {
    res.json(await getWafer(currentUser(req), parseId(req.params)));
  },
  async create(req: Request, res: Response<WaferDto>) {
    const lotId = parseId(req.params);
    const body = parseOrThrow(createBody, req.body, 'body');
    res.status(201).json(await createWafer(lotId, body, actorOf(req)));
  },
  async update(req: Request, res: Response<WaferDto>) {
    const id = parseId(req.params);
    res.json(await updateWafer(id, parseOrThrow(updateBody, req.body, 'body'), actorOf(req)));
  },
  async remove(req: Request, res: Response) {
    await deleteWafer(parseId(req.params), actorOf(req));
    res.status(204).end();
  },
};
