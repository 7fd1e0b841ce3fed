import type { Request, Response } from 'express';
import type { PlannerResponse } from '@rhotrace/api-types';
import { currentUser } from '../middleware/authenticate';
import { parseOrThrow } from '../middleware/validate';
import { plannerSchema } from './planner.schemas';
import { planMeasurement } from './planner.service';

/** `POST /api/planner`. */
export async function postPlan(req: Request, res: Response<PlannerResponse>): Promise<void> {
  const body = parseOrThrow(plannerSchema, req.body, 'body');
  res.json(await planMeasurement(currentUser(req), body));
}
