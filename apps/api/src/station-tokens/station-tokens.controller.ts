import type { Request, Response } from 'express';
import type { StationTokenCreatedResponse, StationTokenDto } from '@rhotrace/api-types';
import { actorOf } from '../middleware/actor';
import { parseId, parseOrThrow } from '../middleware/validate';
import { createTokenBody, tokenParams } from './station-tokens.schemas';
import {
  createStationToken,
  listStationTokens,
  revokeStationToken,
} from './station-tokens.service';

/** Handlers of /api/stations/:id/tokens. */
export const stationTokensController = {
  async list(req: Request, res: Response<{ items: StationTokenDto[] }>) {
    res.json({ items: await listStationTokens(parseId(req.params)) });
  },
  async create(req: Request, res: Response<StationTokenCreatedResponse>) {
    const stationId = parseId(req.params);
    const { label } = parseOrThrow(createTokenBody, req.body, 'body');
    res.status(201).json(await createStationToken(stationId, label, actorOf(req)));
  },
  async revoke(req: Request, res: Response) {
    const { id, tokenId } = parseOrThrow(tokenParams, req.params, 'params');
    await revokeStationToken(id, tokenId, actorOf(req));
    res.status(204).end();
  },
};
