/** Parses map requests and sends the answers the service shapes. */
import type { Request, Response } from 'express';
import { currentUser } from '../middleware/authenticate';
import { parseId } from '../middleware/validate';
import { mapCsv } from './map-csv';
import { lotMaps, sweepMap } from './maps.service';

/** Handlers of the map reads. */
export const mapsController = {
  /** `GET /api/sweeps/:id/map` */
  async sweep(req: Request, res: Response): Promise<void> {
    res.json(await sweepMap(currentUser(req), parseId(req.params)));
  },
  /** `GET /api/sweeps/:id/map.csv`: every site at every step, then each step's uniformity. */
  async sweepCsv(req: Request, res: Response): Promise<void> {
    const answer = await sweepMap(currentUser(req), parseId(req.params));
    res
      .type('text/csv; charset=utf-8')
      .attachment(`sweep-${answer.sweepId}-map.csv`)
      .send(mapCsv(answer));
  },
  /** `GET /api/lots/:id/maps` */
  async lot(req: Request, res: Response): Promise<void> {
    res.json(await lotMaps(currentUser(req), parseId(req.params)));
  },
};
