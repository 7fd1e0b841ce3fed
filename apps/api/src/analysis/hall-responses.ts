/** The Hall parts of the analysis answers and of a sweep read, as zod schemas for OpenAPI. */
import type { HallAnalysis, HallAt300K, PointQuantities } from '@rhotrace/api-types';
import { HALL_FACTOR_NAMES } from '@rhotrace/api-types';
import { z } from 'zod';

const carrierType = z.enum(['n', 'p']);

/** `SweepAnalysisResponse.hall`. */
export const hallAnalysisSchema = z
  .object({
    steps: z.array(
      z
        .object({
          temperatureK: z.number(),
          carrierDensityCm3: z.number(),
          carrierDensitySpreadCm3: z.number(),
          hallMobilityCm2PerVs: z.number(),
          hallCoefficientCm3PerC: z.number(),
          carrierType,
          count: z.number().int(),
          hallMobilitySpreadCm2PerVs: z.number().optional(),
        })
        .strict(),
    ),
    carrierType: z.enum(['n', 'p', 'mixed']),
    hallFactor: z.number(),
    carrierDensityAt300KCm3: z.number().nullable(),
    hallMobilityAt300KCm2PerVs: z.number().nullable(),
    freezeOutWindow: z
      .object({
        regime: z.enum(['freeze-out', 'extrinsic', 'intrinsic']),
        minK: z.number(),
        maxK: z.number(),
        pointCount: z.number().int(),
        warnings: z.array(z.string()).optional(),
      })
      .strict()
      .nullable(),
    carrierDensityAt300KUncertaintyCm3: z.number().nullable().optional(),
    hallMobilityAt300KUncertaintyCm2PerVs: z.number().nullable().optional(),
  })
  .strict() satisfies z.ZodType<HallAnalysis>;

/** A Hall sweep at 300 K in the compare and lot-summary answers. */
export const hallAt300KSchema = z
  .object({
    sweepId: z.number().int(),
    carrierType: z.enum(['n', 'p', 'mixed']),
    carrierDensityAt300KCm3: z.number().nullable(),
    hallMobilityAt300KCm2PerVs: z.number().nullable(),
    hallFactor: z.number(),
    carrierDensityAt300KUncertaintyCm3: z.number().nullable().optional(),
    hallMobilityAt300KUncertaintyCm2PerVs: z.number().nullable().optional(),
  })
  .strict() satisfies z.ZodType<HallAt300K>;

/** A point's quantities beyond resistivity (Hall sweeps); open to further keys. */
export const pointQuantitiesSchema = z
  .object({
    hallCoefficientCm3PerC: z.number().optional(),
    carrierDensityCm3: z.number().optional(),
    sheetCarrierDensityCm2: z.number().optional(),
    hallMobilityCm2PerVs: z.number().optional(),
    carrierType: carrierType.optional(),
    magneticFieldT: z.number().optional(),
    hallVoltageV: z.number().optional(),
  })
  .catchall(z.union([z.number(), z.string()])) satisfies z.ZodType<PointQuantities>;

/** `SweepParseReport.hall`. */
export const hallImportReportSchema = z
  .object({
    hallFactor: z.number(),
    hallFactorName: z.union([z.enum(HALL_FACTOR_NAMES), z.null()]),
    mixedConduction: z.boolean(),
    hallVoltageFrom: z.enum(['reversals', 'corrected-column']),
  })
  .strict();
