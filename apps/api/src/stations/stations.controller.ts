import type { Request, Response } from 'express';
import { STATION_SORT_FIELDS, THERMOMETERS, type Page, type StationDto } from '@rhotrace/api-types';
import { z } from 'zod';
import { actorOf } from '../middleware/actor';
import {
  boundedNumber,
  isoDate,
  LIMITS,
  listQuerySchema,
  optionalText,
  requiredText,
  searchParam,
} from '../middleware/fields';
import { parseId, parseOrThrow } from '../middleware/validate';
import {
  createStation,
  deleteStation,
  getStation,
  listStations,
  updateStation,
} from './stations.service';

const thermometer = z.enum(THERMOMETERS, {
  errorMap: () => ({ message: `must be one of ${THERMOMETERS.join(', ')}` }),
});
const fields = {
  name: requiredText(100),
  /** Four-point probe spacing: 10 µm to 1 cm. */
  probeSpacingCm: boundedNumber(0.001, 1, 'cm'),
  tipRadiusCm: boundedNumber(1e-6, 0.1, 'cm').nullable(),
  thermometer,
  /** A platinum RTD's resistance at 0 °C (Pt100: 100 Ω, Pt1000: 1000 Ω). */
  rtdR0Ohm: boundedNumber(1, 100_000, 'Ω').nullable(),
  minTemperatureK: boundedNumber(0.01, 2000, 'K'),
  maxTemperatureK: boundedNumber(0.01, 2000, 'K'),
  calibratedOn: isoDate.nullable(),
  /** +/- half-widths read by the uncertainty budget of 23 °C values. */
  probeSpacingToleranceCm: boundedNumber(0, 0.1, 'cm').nullable(),
  temperatureToleranceK: boundedNumber(0, 50, 'K').nullable(),
  notes: optionalText(LIMITS.notes),
};

const createBody = z
  .object({
    ...fields,
    tipRadiusCm: fields.tipRadiusCm.optional().default(null),
    rtdR0Ohm: fields.rtdR0Ohm.optional().default(null),
    calibratedOn: fields.calibratedOn.optional().default(null),
    probeSpacingToleranceCm: fields.probeSpacingToleranceCm.optional().default(null),
    temperatureToleranceK: fields.temperatureToleranceK.optional().default(null),
    notes: fields.notes.transform((v) => v ?? null),
  })
  .strict();
const updateBody = z.object(fields).partial().strict();
const listQuery = listQuerySchema(STATION_SORT_FIELDS, {
  q: searchParam,
  thermometer: thermometer.optional(),
});

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
