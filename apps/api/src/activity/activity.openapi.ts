import type { RecentFitsResponse, RecentSweepsResponse } from '@rhotrace/api-types';
import { FIT_KINDS, SWEEP_METHODS } from '@rhotrace/api-types';
import { z } from 'zod';
import { routesOf } from '../openapi/registry';
import { dateTime, itemsOf, personRef } from '../openapi/shapes';
import { recentFitsQuery, recentSweepsQuery } from './activity.schemas';

const recentSweeps = itemsOf(
  z
    .object({
      id: z.number().int(),
      waferId: z.number().int(),
      waferNumber: z.string(),
      lotId: z.number().int(),
      lotCode: z.string(),
      material: z.string(),
      method: z.enum(SWEEP_METHODS),
      originalName: z.string(),
      pointCount: z.number().int(),
      minTemperatureK: z.number().nullable(),
      maxTemperatureK: z.number().nullable(),
      uploadedBy: personRef,
      createdAt: dateTime,
    })
    .strict(),
) satisfies z.ZodType<RecentSweepsResponse>;

const recentFits = itemsOf(
  z
    .object({
      id: z.number().int(),
      kind: z.enum(FIT_KINDS),
      sweepId: z.number().int(),
      sweepName: z.string(),
      waferId: z.number().int(),
      waferNumber: z.string(),
      lotId: z.number().int(),
      lotCode: z.string(),
      headline: z
        .object({
          parameter: z.string(),
          value: z.number(),
          standardError: z.number().nullable(),
        })
        .strict()
        .nullable(),
      windowMinK: z.number().nullable(),
      windowMaxK: z.number().nullable(),
      converged: z.boolean(),
      reading: z.string().nullable(),
      createdBy: personRef,
      createdAt: dateTime,
    })
    .strict(),
) satisfies z.ZodType<RecentFitsResponse>;

/** The recent-activity lists of the benches. */
export function registerActivityApi(): void {
  const route = routesOf('Activity');
  route({
    method: 'get',
    path: '/sweeps/recent',
    summary: 'The newest sweeps the caller may see',
    query: recentSweepsQuery,
    ok: { status: 200, description: 'Newest first', schema: recentSweeps },
  });
  route({
    method: 'get',
    path: '/fits/recent',
    summary: 'The newest saved fits the caller may see (mine=true: their own)',
    query: recentFitsQuery,
    ok: { status: 200, description: 'Newest first', schema: recentFits },
  });
}
