import type { HealthResponse } from '@rhotrace/api-types';
import { z } from 'zod';
import { registry, routesOf } from '../openapi/registry';

const healthSchema = registry.register(
  'Health',
  z
    .object({
      status: z.enum(['ok', 'degraded']),
      db: z.enum(['up', 'down']),
      dbHost: z.string(),
      clusterSize: z.number().int().nullable(),
    })
    .strict(),
) satisfies z.ZodType<HealthResponse>;

/** /api/health */
export function registerHealthApi(): void {
  routesOf(
    'Health',
    'none',
  )({
    method: 'get',
    path: '/health',
    summary: 'Whether the API and its database answer (no sign-in)',
    description: 'Answers 503 with the same body when the database is down.',
    ok: { status: 200, description: 'Up', schema: healthSchema },
    errors: [503],
  });
}
