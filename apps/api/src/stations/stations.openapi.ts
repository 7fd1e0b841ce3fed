import type { StationDto } from '@rhotrace/api-types';
import { THERMOMETERS } from '@rhotrace/api-types';
import { z } from 'zod';
import { registerCrud, registry } from '../openapi/registry';
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
  registerCrud({
    tag: 'Probe stations',
    path: '/stations',
    item: stationDtoSchema,
    names: ['station', 'stations'],
    list: {
      summary: 'Probe stations, a page at a time',
      query: listQuery,
      schema: pageOf(stationDtoSchema),
    },
    create: { summary: 'Adds a probe station', body: createBody },
    read: { summary: 'One probe station' },
    update: { summary: 'Changes some fields of a probe station', body: updateBody },
    remove: { summary: 'Deletes a probe station no sweep names' },
  });
}
