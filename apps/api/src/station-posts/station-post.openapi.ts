import type { StationSweepCreatedResponse } from '@rhotrace/api-types';
import { z } from 'zod';
import { registry, routesOf } from '../openapi/registry';
import { idempotencyHeaders, stationPostFields } from './station-post.schemas';

const createdSchema = registry.register(
  'StationSweepCreated',
  z
    .object({
      id: z.number().int(),
      pointCount: z.number().int(),
      warnings: z.array(z.string()),
      waferId: z.number().int(),
      assignmentId: z.number().int(),
    })
    .strict(),
) satisfies z.ZodType<StationSweepCreatedResponse>;

/** `POST /api/station/sweeps`, the one route a station token may call. */
export function registerStationPostApi(): void {
  routesOf(
    'Station posts',
    'station',
  )({
    method: 'post',
    path: '/station/sweeps',
    summary: 'A probe station posts a finished sweep (station token only)',
    description:
      'Stored exactly as an ordinary upload, attributed to the station and the token label. ' +
      'Accepted only for a wafer with an open assignment naming the station (403 otherwise); ' +
      'that assignment becomes done, the wafer measured, and the manager who assigned it is ' +
      'e-mailed. The same Idempotency-Key with the same request answers the first answer ' +
      'again (header Idempotent-Replayed: true) and stores nothing; with another file it is a ' +
      '422. Keys are remembered for at least 24 hours. See docs/station-client.md.',
    headers: idempotencyHeaders,
    form: stationPostFields.extend({
      file: z.string().describe('The probe-station export (CSV or text)'),
    }),
    ok: {
      status: 201,
      description: 'The stored sweep (or, for a repeated key, the first answer again)',
      schema: createdSchema,
      headers: z.object({
        'Idempotent-Replayed': z
          .literal('true')
          .optional()
          .describe('Present when this is the first answer given again for a repeated key'),
      }),
    },
    errors: [403, 409, 413, 415, 422, 429, 503],
  });
}
