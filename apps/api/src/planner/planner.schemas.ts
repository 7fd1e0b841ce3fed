import { MATERIALS, PLAN_METHODS, PLAN_SPACINGS } from '@rhotrace/api-types';
import { MAX_PLAN_STEPS } from '@rhotrace/physics';
import { z } from 'zod';
import { dopingSchema } from '../analysis/analysis.schemas';

const number = () =>
  z
    .number({ required_error: 'is required', invalid_type_error: 'must be a number' })
    .finite('must be a finite number');
const positive = () => number().gt(0, 'must be above 0');
const temperature = () =>
  number().min(1, 'must be at least 1 K').max(1500, 'must be at most 1500 K');
const id = z
  .number({ required_error: 'is required', invalid_type_error: 'must be a whole number' })
  .int('must be a whole number')
  .positive('must be positive')
  .max(2_147_483_647, 'is too large');

/**
 * Body of `POST /api/planner` (and of the plan attached to an assignment). Limits on the
 * voltages, power and currents must be above zero; the station's own range is checked by the
 * service, which knows the station.
 */
export const plannerSchema = z
  .object({
    waferId: id.optional(),
    material: z
      .enum(MATERIALS, {
        errorMap: () => ({ message: `must be one of ${MATERIALS.join(', ')}` }),
      })
      .optional(),
    doping: dopingSchema.optional(),
    thicknessCm: positive().max(10, 'must be at most 10 cm').optional(),
    diameterCm: positive().max(100, 'must be at most 100 cm').optional(),
    stationId: id,
    method: z
      .enum(PLAN_METHODS, {
        errorMap: () => ({ message: `must be one of ${PLAN_METHODS.join(', ')}` }),
      })
      .default('four-point'),
    minK: temperature(),
    maxK: temperature(),
    count: z
      .number({ required_error: 'is required', invalid_type_error: 'must be a number' })
      .int('must be a whole number')
      .min(2, 'must be at least 2')
      .max(MAX_PLAN_STEPS, `must be at most ${MAX_PLAN_STEPS}`),
    spacing: z.enum(PLAN_SPACINGS, {
      errorMap: () => ({ message: `must be one of ${PLAN_SPACINGS.join(', ')}` }),
    }),
    targetVoltageV: positive().max(1000, 'must be at most 1000 V'),
    maxVoltageV: positive().max(1000, 'must be at most 1000 V'),
    maxPowerW: positive().max(100, 'must be at most 100 W'),
    minCurrentA: positive().max(10, 'must be at most 10 A').optional(),
    maxCurrentA: positive().max(10, 'must be at most 10 A').optional(),
    dwellS: number().min(0, 'must be 0 or more').max(86_400, 'must be at most 86400 s').optional(),
    rampKPerMin: positive().max(1000, 'must be at most 1000 K/min').optional(),
    denseAroundTransitions: z.boolean({ invalid_type_error: 'must be true or false' }).optional(),
  })
  .strict()
  .superRefine((b, ctx) => {
    const problem = (path: string, message: string) =>
      ctx.addIssue({ code: z.ZodIssueCode.custom, path: [path], message });
    if (b.minK >= b.maxK) problem('minK', 'must be below maxK');
    if (b.targetVoltageV > b.maxVoltageV) problem('targetVoltageV', 'must not exceed maxVoltageV');
    if (b.minCurrentA !== undefined && b.maxCurrentA !== undefined && b.minCurrentA > b.maxCurrentA)
      problem('minCurrentA', 'must not exceed maxCurrentA');
    if (b.waferId === undefined && b.material === undefined)
      problem('waferId', 'is required unless material is given');
    if (b.waferId !== undefined && b.material !== undefined)
      problem('material', 'must not be given with waferId (the lot says the material)');
  });

/** The planner request after validation (defaults applied). */
export type PlannerInput = z.infer<typeof plannerSchema>;
