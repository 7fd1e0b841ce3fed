import type { AssignmentPlanDto, PlannerResponse } from '@rhotrace/api-types';
import { CURRENT_LIMITS, PLAN_METHODS } from '@rhotrace/api-types';
import { z } from 'zod';
import { registry, routesOf } from '../openapi/registry';
import { dateTime } from '../openapi/shapes';
import { dopingSchema } from '../analysis/analysis.schemas';
import { plannerSchema } from './planner.schemas';

const limit = z.enum(CURRENT_LIMITS);
const nullableNumber = z.number().nullable();
// A union with null, not `.nullable()` on the enum: the 3.1 output keeps null allowed.
const regime = z.union([z.enum(['freeze-out', 'extrinsic', 'intrinsic']), z.null()]);
const range = z.tuple([z.number(), z.number()]);

/** The planner's answer. */
export const plannerResponseSchema = registry.register(
  'MeasurementPlan',
  z
    .object({
      steps: z.array(
        z
          .object({
            temperatureK: z.number(),
            expectedResistivityOhmCm: z.number(),
            expectedSheetResistanceOhmSq: z.number(),
            regime,
            currentA: z.number(),
            voltageV: z.number(),
            powerW: z.number(),
            limitedBy: limit,
          })
          .strict(),
      ),
      regimeBoundaries: z
        .object({ freezeOutBelowK: nullableNumber, intrinsicAboveK: nullableNumber })
        .strict()
        .nullable(),
      currentRanges: z.array(
        z
          .object({
            fromK: z.number(),
            toK: z.number(),
            stepCount: z.number().int(),
            currentA: z.number(),
            limitedBy: limit,
          })
          .strict(),
      ),
      estimatedDurationS: z.number(),
      cautions: z.array(z.string()),
      warnings: z.array(z.string()),
      basis: z
        .object({
          material: z.string(),
          doping: dopingSchema.nullable(),
          dopingSource: z.string(),
          thicknessCm: z.number(),
          diameterCm: nullableNumber,
          method: z.enum(PLAN_METHODS),
          probeSpacingCm: nullableNumber,
          stationId: z.number().int(),
          stationName: z.string(),
          stationRangeK: range,
          readableVoltageV: range,
          maxPowerW: z.number(),
          dwellS: z.number(),
          rampKPerMin: z.number(),
          modelVersion: z.string(),
        })
        .strict(),
    })
    .strict(),
) satisfies z.ZodType<PlannerResponse>;

/** The plan attached to an assignment: the request as given and the plan computed from it. */
export const assignmentPlanSchema = z
  .object({
    request: plannerSchema,
    plan: plannerResponseSchema,
    createdAt: dateTime,
  })
  .strict() satisfies z.ZodType<AssignmentPlanDto>;

/** /api/planner */
export function registerPlannerApi(): void {
  const route = routesOf('Planner');
  route({
    method: 'post',
    path: '/planner',
    summary: 'A measurement plan: temperature steps, probe currents, duration and cautions',
    description:
      "Doping from the wafer's lot (ASTM F723 for boron- or phosphorus-doped silicon) unless " +
      'given; geometry and temperature limits from the station (steps outside its range are ' +
      'refused, not clipped).',
    body: plannerSchema,
    ok: { status: 200, description: 'The plan', schema: plannerResponseSchema },
    errors: [403],
  });
}
