/** The model-curve and material-catalogue answers as zod schemas, for the OpenAPI document. */
import type { MaterialsResponse, ModelCurveResponse } from '@rhotrace/api-types';
import { z } from 'zod';
import { jsonValue } from '../openapi/shapes';

const regime = z.enum(['freeze-out', 'extrinsic', 'intrinsic']);
const nullableNumber = z.number().nullable();
const source = z
  .object({ label: z.string(), reference: z.string(), fromMemory: z.boolean().optional() })
  .strict();

export const modelCurveResponse = z.discriminatedUnion('kind', [
  z
    .object({
      kind: z.literal('semiconductor'),
      material: z.string(),
      points: z.array(
        z
          .object({
            temperatureK: z.number(),
            resistivityOhmCm: z.number(),
            electrons: z.number(),
            holes: z.number(),
            electronMobility: z.number(),
            holeMobility: z.number(),
            regime,
          })
          .strict(),
      ),
      boundaries: z
        .object({ freezeOutBelowK: nullableNumber, intrinsicAboveK: nullableNumber })
        .strict(),
      modelVersion: z.string(),
      warnings: z.array(z.string()),
    })
    .strict(),
  z
    .object({
      kind: z.literal('metal'),
      material: z.string(),
      points: z.array(
        z
          .object({
            temperatureK: z.number(),
            resistivityOhmCm: nullableNumber,
            linearReferenceOhmCm: nullableNumber,
          })
          .strict(),
      ),
      boundaries: z.null(),
      reference: z.record(z.unknown()),
      modelVersion: z.string(),
      warnings: z.array(z.string()),
    })
    .strict(),
]) satisfies z.ZodType<ModelCurveResponse>;

const level = z.object({ name: z.string(), levelEv: z.number(), isDefault: z.boolean() }).strict();

export const materialsResponse = z
  .object({
    semiconductors: z.array(
      z
        .object({
          id: z.string(),
          name: z.string(),
          bandGap: z
            .object({
              eg0Ev: z.number(),
              alphaEvPerK: z.number(),
              betaK: z.number(),
              fittedRangeK: z.tuple([z.number(), z.number()]),
              source,
            })
            .strict(),
          densityOfStatesSets: z.array(
            z
              .object({
                id: z.string(),
                description: z.string(),
                nc300: z.number(),
                ncExponent: z.number(),
                nv300: z.number(),
                nvExponent: z.number(),
                source,
                isDefault: z.boolean(),
              })
              .strict(),
          ),
          mobilityModels: z.array(
            z
              .object({ id: z.string(), parameters: jsonValue, source, isDefault: z.boolean() })
              .strict(),
          ),
          donors: z.array(level),
          acceptors: z.array(level),
          dopantSource: source,
          mottDensityCm3: z.object({ donor: z.number(), acceptor: z.number() }).strict(),
        })
        .strict(),
    ),
    metals: z.array(
      z
        .object({
          id: z.string(),
          name: z.string(),
          resistivity20COhmCm: z.number(),
          alphaPerK: z.number(),
          debyeK: z.number(),
          sources: z.object({ resistivity: source, debye: source }).strict(),
        })
        .strict(),
    ),
    modelVersion: z.string(),
  })
  .strict() satisfies z.ZodType<MaterialsResponse>;
