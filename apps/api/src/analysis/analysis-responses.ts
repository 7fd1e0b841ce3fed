/** The sweep, wafer, lot and comparison answers as zod schemas, for the OpenAPI document. */
import type {
  CompareResponse,
  DopantDensityResponse,
  LotSummaryResponse,
  SweepAnalysisResponse,
} from '@rhotrace/api-types';
import { UNCERTAINTY_SOURCES } from '@rhotrace/api-types';
import { z } from 'zod';
import { dateTime, sweepGeometry } from '../openapi/shapes';
import { findingSchema } from '../sweeps/sweep.openapi';
import { hallAnalysisSchema, hallAt300KSchema } from './hall-responses';

const regime = z.enum(['freeze-out', 'extrinsic', 'intrinsic']);
const verdict = z.enum(['pass', 'fail', 'indeterminate']);
const valueMethod = z.enum(['interpolated', 'corrected']);
const nullableNumber = z.number().nullable();

/** The uncertainty of a 23 °C value (GUM budget). */
const uncertainty = {
  uncertaintyOhmCm: nullableNumber,
  coverageFactor: nullableNumber,
  uncertaintyBudget: z.array(
    z
      .object({
        source: z.enum(UNCERTAINTY_SOURCES),
        standardUncertaintyOhmCm: z.number(),
        relative: z.number(),
        distribution: z.enum(['normal', 'rectangular']),
        note: z.string(),
      })
      .strict(),
  ),
};

export const sweepAnalysisResponse = z
  .object({
    sweep: z
      .object({
        id: z.number().int(),
        waferId: z.number().int(),
        waferNumber: z.string(),
        lotId: z.number().int(),
        lotCode: z.string(),
        material: z.string(),
        method: z.string(),
        stationId: z.number().int().nullable(),
        pointCount: z.number().int(),
        skippedPointCount: z.number().int(),
        minTemperatureK: nullableNumber,
        maxTemperatureK: nullableNumber,
        originalName: z.string(),
        createdAt: dateTime,
        geometry: sweepGeometry,
      })
      .strict(),
    steps: z.array(
      z
        .object({
          temperatureK: z.number(),
          resistivityOhmCm: z.number(),
          spreadOhmCm: z.number(),
          count: z.number().int(),
        })
        .strict(),
    ),
    arrhenius: z.array(
      z
        .object({
          inverseTemperaturePerKK: z.number(),
          lnResistivity: z.number(),
          lnConductivity: z.number(),
        })
        .strict(),
    ),
    suggestedWindows: z.array(
      z
        .object({
          regime,
          minK: z.number(),
          maxK: z.number(),
          pointCount: z.number().int(),
          warnings: z.array(z.string()).optional(),
        })
        .strict(),
    ),
    spec: z
      .object({
        ...uncertainty,
        resistivityAt23COhmCm: nullableNumber,
        inSpec: z.boolean().nullable(),
        verdict: verdict.nullable(),
        specMinOhmCm: nullableNumber,
        specMaxOhmCm: nullableNumber,
        method: valueMethod.nullable(),
        distanceK: nullableNumber,
        reason: z.string().nullable(),
      })
      .strict(),
    legs: z
      .array(
        z
          .object({
            index: z.number().int(),
            direction: z.enum(['up', 'down', 'hold']),
            minK: z.number(),
            maxK: z.number(),
            stepCount: z.number().int(),
          })
          .strict(),
      )
      .optional(),
    leg: z.number().int().nullable().optional(),
    thermalLag: z
      .object({ lagK: z.number(), standardErrorK: z.number() })
      .strict()
      .nullable()
      .optional(),
    findings: z.array(findingSchema).optional(),
    flaggedPoints: z.number().int().optional(),
    hall: hallAnalysisSchema.optional(),
    importWarnings: z.array(z.string()).optional(),
    flaggedReadings: z
      .array(
        z
          .object({
            sequence: z.number().int(),
            temperatureK: z.number(),
            resistivityOhmCm: z.number(),
          })
          .strict(),
      )
      .optional(),
  })
  .strict() satisfies z.ZodType<SweepAnalysisResponse>;

export const dopantResponse = z
  .object({
    ...uncertainty,
    waferId: z.number().int(),
    resistivityAt23COhmCm: z.number(),
    dopant: z.string().nullable(),
    dopantDensityCm3: nullableNumber,
    source: z.string(),
    sweepId: z.number().int(),
    method: valueMethod,
    distanceK: z.number(),
    inSpec: z.boolean().nullable(),
    verdict: verdict.nullable(),
    specMinOhmCm: nullableNumber,
    specMaxOhmCm: nullableNumber,
    reason: z.string().nullable(),
  })
  .strict() satisfies z.ZodType<DopantDensityResponse>;

export const lotSummaryResponse = z
  .object({
    lot: z
      .object({
        id: z.number().int(),
        code: z.string(),
        material: z.string(),
        dopant: z.string().nullable(),
        specMinOhmCm: nullableNumber,
        specMaxOhmCm: nullableNumber,
      })
      .strict(),
    wafers: z.array(
      z
        .object({
          ...uncertainty,
          waferId: z.number().int(),
          number: z.string(),
          sweepId: z.number().int().nullable(),
          resistivityAt23COhmCm: nullableNumber,
          method: valueMethod.nullable(),
          distanceK: nullableNumber,
          pass: z.boolean().nullable(),
          verdict: verdict.nullable(),
          reason: z.string().nullable(),
          activationEnergies: z.array(
            z
              .object({
                fitId: z.number().int(),
                sweepId: z.number().int(),
                activationEnergyEv: z.number(),
                standardErrorEv: nullableNumber,
                minK: nullableNumber,
                maxK: nullableNumber,
                quantity: z.string(),
              })
              .strict(),
          ),
          hall: hallAt300KSchema.nullable().optional(),
          uniformity: z
            .object({
              temperatureK: z.number(),
              siteCount: z.number().int(),
              stdDevPercent: nullableNumber,
              rangePercent: z.number(),
            })
            .strict()
            .nullable()
            .optional()
            .describe("A map wafer's uniformity at the step nearest 23 °C"),
        })
        .strict(),
    ),
    statistics: z
      .object({
        ppk: nullableNumber,
        ppkLower95: nullableNumber,
        ppkReason: z.string().nullable(),
        note: z.string().nullable(),
        indeterminateCount: z.number().int(),
        count: z.number().int(),
        passCount: z.number().int(),
        failCount: z.number().int(),
        meanOhmCm: nullableNumber,
        stdDevOhmCm: nullableNumber,
        minOhmCm: nullableNumber,
        maxOhmCm: nullableNumber,
        cpk: nullableNumber,
        cpkReason: z.string().nullable(),
        uniformity: z
          .object({
            count: z.number().int(),
            meanStdDevPercent: z.number(),
            minStdDevPercent: z.number(),
            maxStdDevPercent: z.number(),
            stdDevOfStdDevPercent: nullableNumber,
          })
          .strict()
          .nullable()
          .optional()
          .describe("The spread of the map wafers' uniformities"),
      })
      .strict(),
  })
  .strict() satisfies z.ZodType<LotSummaryResponse>;

export const compareResponse = z
  .object({
    temperaturesK: z.array(z.number()),
    curves: z.array(
      z
        .object({
          sweepId: z.number().int(),
          waferId: z.number().int(),
          waferNumber: z.string(),
          lotId: z.number().int(),
          lotCode: z.string(),
          material: z.string(),
          minTemperatureK: z.number(),
          maxTemperatureK: z.number(),
          resistivityOhmCm: z.array(nullableNumber),
          hall: hallAt300KSchema.optional(),
        })
        .strict(),
    ),
  })
  .strict() satisfies z.ZodType<CompareResponse>;
