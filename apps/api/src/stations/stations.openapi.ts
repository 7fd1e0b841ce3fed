import type { StationDto } from '@rhotrace/api-types';
import { THERMOMETERS } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParams, registry, routesOf } from '../openapi/registry';
import { pageOf, timestamps } from '../openapi/shapes';
import { createBody, listQuery, sensor, updateBody } from './stations.schemas';

/** A probe station as the API answers it. */
export const stationDtoSchema = registry.register(
  'Station',
  z
    .object({
      id: z.number().int(),
      name: z.string(),
      probeSpacingCm: z.number(),
      tipRadiusCm: z.number().nullable(),
      thermometer: z.enum(THERMOMETERS),
      rtdR0Ohm: z.number().nullable(),
      sensor: sensor.nullable().optional(),
      minTemperatureK: z.number(),
      maxTemperatureK: z.number(),
      calibratedOn: z.string().date().nullable(),
      calibrationDueOn: z.string().date().nullable().optional(),
      calibrationOverdue: z.boolean().optional(),
      probeSpacingToleranceCm: z.number().nullable().optional(),
      temperatureToleranceK: z.number().nullable().optional(),
      notes: z.string().nullable(),
      ...timestamps,
    })
    .strict(),
) satisfies z.ZodType<StationDto>;

/** /api/stations */
export function registerStationsApi(): void {
  const route = routesOf('Probe stations');
  route({
    method: 'get',
    path: '/stations',
    summary: 'Probe stations, a page at a time',
    query: listQuery,
    ok: { status: 200, description: 'A page of stations', schema: pageOf(stationDtoSchema) },
  });
  route({
    method: 'post',
    path: '/stations',
    summary: 'Adds a probe station',
    body: createBody,
    ok: { status: 201, description: 'The new station', schema: stationDtoSchema },
    errors: [403, 409],
  });
  route({
    method: 'get',
    path: '/stations/:id',
    summary: 'One probe station',
    params: idParams,
    ok: { status: 200, description: 'The station', schema: stationDtoSchema },
    errors: [404],
  });
  route({
    method: 'patch',
    path: '/stations/:id',
    summary: 'Changes some fields of a probe station',
    params: idParams,
    body: updateBody,
    ok: { status: 200, description: 'The changed station', schema: stationDtoSchema },
    errors: [403, 404, 409],
  });
  route({
    method: 'delete',
    path: '/stations/:id',
    summary: 'Deletes a probe station no sweep names',
    params: idParams,
    ok: { status: 204, description: 'Deleted' },
    errors: [403, 404, 409],
  });
}
