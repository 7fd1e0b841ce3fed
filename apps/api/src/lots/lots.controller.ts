import type { Request, Response } from 'express';
import type { LotDto, Page } from '@rhotrace/api-types';
import { actorOf } from '../middleware/actor';
import { currentUser } from '../middleware/authenticate';
import { parseId, parseOrThrow } from '../middleware/validate';
import { lotCreateBody, lotListQuery, lotUpdateBody } from './lots.schemas';
import { createLot, deleteLot, getLot, listLots, updateLot } from './lots.service';

/** Handlers of /api/lots. */
export const lotsController = {
  async list(req: Request, res: Response<Page<LotDto>>) {
    res.json(await listLots(currentUser(req), parseOrThrow(lotListQuery, req.query, 'query')));
  },
  async get(req: Request, res: Response<LotDto>) {
    res.json(await getLot(currentUser(req), parseId(req.params)));
  },
  async create(req: Request, res: Response<LotDto>) {
    const body = parseOrThrow(lotCreateBody, req.body, 'body');
    res.status(201).json(await createLot(body, actorOf(req)));
  },
  async update(req: Request, res: Response<LotDto>) {
    const id = parseId(req.params);
    res.json(await updateLot(id, parseOrThrow(lotUpdateBody, req.body, 'body'), actorOf(req)));
  },
  async remove(req: Request, res: Response) {
    await deleteLot(parseId(req.params), actorOf(req));
    res.status(204).end();
  },
};
