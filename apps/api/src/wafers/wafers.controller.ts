import type { Request, Response } from 'express';
import {
  MATERIALS,
  WAFER_SORT_FIELDS,
  WAFER_STATES,
  type Page,
  type WaferDto,
} from '@rhotrace/api-types';
import { z } from 'zod';
import { actorOf } from '../middleware/actor';
import { currentUser } from '../middleware/authenticate';
import {
  boundedNumber,
  LIMITS,
  listQuerySchema,
  optionalText,
  searchParam,
} from '../middleware/fields';
import { idParam, parseId, parseOrThrow } from '../middleware/validate';
import {
  createWafer,
  deleteWafer,
  getWafer,
  listLotWafers,
  listWafers,
  updateWafer,
} from './wafers.service';

const state = z.enum(WAFER_STATES, {
  errorMap: () => ({ message: `must be one of ${WAFER_STATES.join(', ')}` }),
});
/** A wafer's number in its lot: text up to 32 characters (a whole number is taken as text). */
const waferNumber = z
  .union(
    [
      z.string().max(32, 'must be at most 32 characters'),
      z.number().int().positive().max(1e9).transform(String),
    ],
    {
      errorMap: (_issue, ctx) => ({
        message:
          ctx.data === undefined
            ? 'is required'
            : 'must be text of at most 32 characters or a whole number',
      }),
    },
  )
  .refine((v) => v.trim().length > 0, 'must not be blank');

const fields = {
  number: waferNumber,
  thicknessCm: boundedNumber(1e-7, 1, 'cm').nullable(),
  state,
  notes: optionalText(LIMITS.notes),
};

const createBody = z
  .object({
    number: fields.number,
    thicknessCm: fields.thicknessCm.optional().default(null),
    state: fields.state.optional(),
    notes: fields.notes.transform((v) => v ?? null),
  })
  .strict();
const updateBody = z.object(fields).partial().strict();

const filters = { q: searchParam, state: state.optional() };
const listQuery = listQuerySchema(WAFER_SORT_FIELDS, {
  ...filters,
  lotId: idParam.optional(),
  material: z
    .enum(MATERIALS, { errorMap: () => ({ message: `must be one of ${MATERIALS.join(', ')}` }) })
    .optional(),
});
const lotListQuery = listQuerySchema(WAFER_SORT_FIELDS, filters);

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
