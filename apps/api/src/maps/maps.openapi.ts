/** The map routes in the OpenAPI document. */
import type { LotMapsResponse, SweepMapInfo, SweepMapResponse } from '@rhotrace/api-types';
import { MAP_CORRECTIONS } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParams, registry, routesOf } from '../openapi/registry';
import { fileBody } from '../openapi/shapes';

/**
 * What a map sweep records about its wafer and conversion. Not a named component: a nullable
 * reference to one comes out of the generator without `null` (OpenAPI 3.1), so it is inlined.
 */
export const sweepMapInfoSchema = z
  .object({
    diameterMm: z.number(),
    edgeExclusionMm: z.number(),
    pattern: z.string().nullable(),
    correction: z.enum(MAP_CORRECTIONS),
    probeSpacingMm: z.number().nullable(),
  })
  .strict() satisfies z.ZodType<SweepMapInfo>;

const site = z
  .object({
    xMm: z.number(),
    yMm: z.number(),
    label: z.string().nullable(),
    sheetResistanceOhmSq: z.number().nullable(),
    resistivityOhmCm: z.number(),
    edgeFactor: z.number(),
    excluded: z.boolean(),
    readingCount: z.number().int(),
  })
  .strict();

const atTemperature = registry.register(
  'MapAtTemperature',
  z
    .object({
      temperatureK: z.number(),
      sites: z.array(site),
      statistics: z
        .object({
          count: z.number().int(),
          meanOhmCm: z.number(),
          stdDevOhmCm: z.number().nullable(),
          stdDevPercent: z.number().nullable(),
          minOhmCm: z.number(),
          maxOhmCm: z.number(),
          rangePercent: z.number(),
          radialSlopePercentPerMm: z.number().nullable(),
        })
        .strict()
        .nullable(),
    })
    .strict(),
);

const outline = z.enum(['flat', 'notch']);

const sweepMapSchema = z
  .object({
    sweepId: z.number().int(),
    waferId: z.number().int(),
    map: sweepMapInfoSchema,
    outline,
    pattern: z
      .object({
        id: z.string(),
        sites: z.array(
          z
            .object({
              number: z.number().int(),
              label: z.string(),
              xMm: z.number(),
              yMm: z.number(),
            })
            .strict(),
        ),
      })
      .strict()
      .nullable(),
    temperaturesK: z.array(z.number()),
    maps: z.array(atTemperature),
  })
  .strict() satisfies z.ZodType<SweepMapResponse>;

const lotMapsSchema = z
  .object({
    lotId: z.number().int(),
    scale: z.object({ minOhmCm: z.number(), maxOhmCm: z.number() }).strict().nullable(),
    wafers: z.array(
      z
        .object({
          waferId: z.number().int(),
          waferNumber: z.string(),
          sweepId: z.number().int(),
          map: sweepMapInfoSchema,
          outline,
          atTemperature,
        })
        .strict(),
    ),
  })
  .strict() satisfies z.ZodType<LotMapsResponse>;

/** `GET /api/sweeps/:id/map` and `GET /api/lots/:id/maps`. */
export function registerMapsApi(): void {
  const route = routesOf('Maps');
  route({
    method: 'get',
    path: '/sweeps/:id/map',
    summary: "A map sweep's maps at each temperature step, with uniformity statistics",
    params: idParams,
    ok: { status: 200, description: 'The maps', schema: sweepMapSchema },
    errors: [404],
  });
  route({
    method: 'get',
    path: '/sweeps/:id/map.csv',
    summary:
      "A map sweep's sites at every temperature step, then each step's uniformity statistics, as CSV",
    params: idParams,
    ok: {
      status: 200,
      description: 'The sites and statistics',
      schema: fileBody,
      contentType: 'text/csv',
    },
    errors: [404],
  });
  route({
    method: 'get',
    path: '/lots/:id/maps',
    summary: "Each wafer's newest map at the step nearest 23 °C, on one colour scale",
    params: idParams,
    ok: { status: 200, description: 'The maps', schema: lotMapsSchema },
    errors: [404],
  });
}
