import type { RecentFitsResponse, RecentSweepsResponse } from '@rhotrace/api-types';
import type { Request, Response } from 'express';
import { currentUser } from '../middleware/authenticate';
import { parseOrThrow } from '../middleware/validate';
import { recentFitsQuery, recentSweepsQuery } from './activity.schemas';
import { recentFits, recentSweeps } from './activity.service';

/** Handlers of the recent-activity lists. */
export const activityController = {
  /** `GET /api/sweeps/recent?limit=`. */
  async recentSweeps(req: Request, res: Response): Promise<void> {
    const { limit } = parseOrThrow(recentSweepsQuery, req.query, 'query');
    const body: RecentSweepsResponse = { items: await recentSweeps(currentUser(req), limit) };
    res.json(body);
  },
  /** `GET /api/fits/recent?limit=&mine=true`. */
  async recentFits(req: Request, res: Response): Promise<void> {
    const { limit, mine } = parseOrThrow(recentFitsQuery, req.query, 'query');
    const body: RecentFitsResponse = { items: await recentFits(currentUser(req), limit, mine) };
    res.json(body);
  },
};
