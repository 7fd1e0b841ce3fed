import type { Request, Response } from 'express';
import type { Page, StationDto } from '@rhotrace/api-types';
import { actorOf } from '../middleware/actor';
import { parseId, parseOrThrow } from '../middleware/validate';
import {
  createStation,
  deleteStation,
  getStation,
  listStations,
  updateStation,
} from './stations.service';
import { createBody, updateBody, listQuery } from './stations.schemas';

/** Handlers of /api/stations. */
export const stationsController = {
  async list(req: Request, res: Response<Page<StationDto>>) {
    res.json(await listStations(parseOrThrow(listQuery, req.query, 'query')));
  },
  async get(req: Request, res: Response<StationDto>) {
    res.json(await getStation(parseId(req.params)));
  },
  async create(req: Request, res: Response<StationDto>) {
    const body = parseOrThrow(createBody, req.body, 'body');
    res.status(201).json(await createStation(body, actorOf(req)));
  },
  async update(req: Request, res: Response<StationDto>) {
    const id = parseId(req.params);
    res.json(await updateStation(id, parseOrThrow(updateBody, req.body, 'body'), actorOf(req)));
  },
  async remove(req: Request, res: Response) {
    await deleteStation(parseId(req.params), actorOf(req));
    res.status(204).end();
  },
};
