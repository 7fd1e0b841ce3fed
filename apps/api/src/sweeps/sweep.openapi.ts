import type {
  MetadataFinding,
  SweepCreatedResponse,
  SweepDto,
  SweepPreviewResponse,
  SweepSummaryDto,
} from '@rhotrace/api-types';
import { COLUMN_MEANINGS, POINT_FLAGS, SWEEP_METHODS } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParams, registry, routesOf } from '../openapi/registry';
import { dateTime, fileBody, sweepGeometry as geometry } from '../openapi/shapes';
import { importSettingsSchema } from '../import-settings/import-settings.openapi';
import { sweepMapInfoSchema } from '../maps/maps.openapi';
import { previewSchema as previewForm, storeSchema } from './sweep.schemas';
import { hallImportReportSchema, pointQuantitiesSchema } from '../analysis/hall-responses';

const column = z
  .object({
    index: z.number().int(),
    header: z.string(),
    meaning: z.enum(COLUMN_MEANINGS),
    unit: z.string().nullable(),
    confidence: z.number().min(0).max(1),
  })
  .strict();

/** The fields of a sweep without its points. */
const summaryShape = {
  id: z.number().int(),
  waferId: z.number().int(),
  stationId: z.number().int().nullable(),
  method: z.enum(SWEEP_METHODS),
  geometry,
  uploadedById: z.number().int(),
  uploadedByName: z.string().nullable(),
  originalName: z.string(),
  sizeBytes: z.number().int(),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  pointCount: z.number().int(),
  minTemperatureK: z.number().nullable(),
  maxTemperatureK: z.number().nullable(),
  createdAt: dateTime,
  uploadedVia: z
    .object({
      stationId: z.number().int(),
      stationName: z.string(),
      tokenId: z.number().int(),
      tokenLabel: z.string(),
    })
    .strict()
    .nullable()
    .optional()
    .describe('Set when a probe station posted the sweep with its token'),
  flaggedPoints: z.number().int().optional().describe('Points carrying a doubtful flag'),
  map: sweepMapInfoSchema
    .nullable()
    .optional()
    .describe('Set when the sweep is a wafer map (its points carry sites)'),
};

/** A doubtful point and why (issue 15 findings). */
export const findingSchema = z
  .object({
    sequence: z.number().int(),
    row: z.number().int(),
    flag: z.enum(POINT_FLAGS),
    reason: z.string(),
  })
  .strict();

const temperatureConversion = z
  .object({
    kind: z.enum(['kelvin', 'celsius', 'platinum-rtd', 'thermocouple', 'table']),
    description: z.string(),
  })
  .strict();

/** A sweep without its points. */
export const sweepSummarySchema = registry.register(
  'SweepSummary',
  z.object(summaryShape).strict(),
) satisfies z.ZodType<SweepSummaryDto>;

const point = z
  .object({
    sequence: z.number().int(),
    sourceRow: z.number().int(),
    temperatureK: z.number(),
    raw: z.array(z.object({ row: z.number().int(), values: z.record(z.string()) }).strict()),
    currentA: z.number().nullable(),
    voltageV: z.number().nullable(),
    resistanceOhm: z.number().nullable(),
    sheetResistanceOhmSq: z.number().nullable(),
    resistivityOhmCm: z.number(),
    flags: z.array(z.enum(POINT_FLAGS)),
    quantities: pointQuantitiesSchema.nullable().optional(),
    site: z
      .object({ xMm: z.number(), yMm: z.number(), label: z.string().nullable() })
      .strict()
      .nullable()
      .optional()
      .describe('Where on the wafer (map sweeps), mm from the centre'),
    leg: z.number().int().nullable().optional(),
  })
  .strict();

const sweepSchema = registry.register(
  'Sweep',
  z
    .object({
      ...summaryShape,
      columns: z.array(column),
      metadata: z.record(z.string()),
      parseReport: z
        .object({
          delimiter: z.string(),
          decimalMark: z.string(),
          headerRow: z.number().int().nullable(),
          rowCount: z.number().int(),
          warnings: z.array(z.string()),
          flaggedPoints: z.number().int(),
          findings: z.array(findingSchema).optional(),
          temperature: temperatureConversion.optional(),
          hall: hallImportReportSchema.optional(),
        })
        .strict(),
      points: z.array(point),
    })
    .strict(),
) satisfies z.ZodType<SweepDto>;

const rowProblem = z
  .object({
    row: z.number().int().nullable(),
    column: z.string().nullable(),
    problem: z.string(),
    field: z.string(),
  })
  .strict();

const metadataFinding = z
  .object({
    key: z.string(),
    label: z.string(),
    fileText: z.string(),
    recordText: z.string().nullable(),
    agreement: z.enum(['fills', 'disagrees']),
    field: z
      .enum(['thicknessCm', 'diameterCm', 'spacingCm', 'barLengthCm', 'barWidthCm'])
      .nullable(),
    fileValue: z.number().nullable(),
    using: z.enum(['file', 'record']),
    sentence: z.string(),
  })
  .strict() satisfies z.ZodType<MetadataFinding>;

const previewSchema = z
  .object({
    delimiter: z.enum([',', ';', '\t']),
    decimalMark: z.enum(['.', ',']),
    metadata: z.record(z.string()),
    columns: z.array(column),
    rows: z.array(
      z
        .object({
          row: z.number().int(),
          cells: z.array(z.string()),
          values: z.array(z.number().nullable()),
        })
        .strict(),
    ),
    rowCount: z.number().int(),
    problems: z.array(rowProblem),
    suggestedMethod: z.enum(SWEEP_METHODS).nullable(),
    temperature: temperatureConversion.nullable().optional(),
    temperatureNote: z.string().nullable().optional(),
    method: z.enum(SWEEP_METHODS).nullable(),
    stationId: z.number().int().nullable(),
    geometry: geometry.nullable(),
    blocking: z.array(rowProblem).describe('What the store would refuse, by its own checks'),
    warnings: z.array(z.string()),
    pointCount: z.number().int().nullable(),
    metadataFindings: z.array(metadataFinding),
    shape: z.string().regex(/^[0-9a-f]{64}$/),
    shapeLabel: z.string(),
    savedSettings: importSettingsSchema.nullable(),
  })
  .strict() satisfies z.ZodType<SweepPreviewResponse>;

/** `POST /api/wafers/:id/sweeps` → 201 (and the station post). */
export const sweepCreatedSchema = registry.register(
  'SweepCreated',
  z
    .object({ id: z.number().int(), pointCount: z.number().int(), warnings: z.array(z.string()) })
    .strict(),
) satisfies z.ZodType<SweepCreatedResponse>;

/** The multipart fields of an upload: the file and the text fields `storeSchema` reads. */
export const uploadForm = storeSchema.extend({
  file: z.string().describe('The probe-station export (CSV or text)'),
});

/** Sweep uploads and reads. */
export function registerSweepsApi(): void {
  const route = routesOf('Sweeps');
  route({
    method: 'post',
    path: '/wafers/:id/sweeps/preview',
    summary:
      "Reads an export without storing it and runs the store's checks with the choices given",
    params: idParams,
    form: previewForm.extend({ file: z.string().describe('The probe-station export') }),
    ok: { status: 200, description: 'What the import would see', schema: previewSchema },
    errors: [403, 404, 413, 415, 422],
  });
  route({
    method: 'post',
    path: '/wafers/:id/sweeps',
    summary: 'Imports a probe-station export onto a wafer (all or nothing)',
    params: idParams,
    form: uploadForm,
    ok: { status: 201, description: 'The stored sweep', schema: sweepCreatedSchema },
    errors: [403, 404, 409, 413, 415, 422, 503],
  });
  route({
    method: 'get',
    path: '/wafers/:id/sweeps',
    summary: "A wafer's sweeps, without points",
    params: idParams,
    ok: { status: 200, description: 'The sweeps', schema: z.array(sweepSummarySchema) },
    errors: [404],
  });
  route({
    method: 'get',
    path: '/sweeps/:id',
    summary: 'One sweep with its points (gzip when accepted; ETag)',
    params: idParams,
    ok: { status: 200, description: 'The sweep', schema: sweepSchema },
    errors: [404],
  });
  route({
    method: 'get',
    path: '/sweeps/:id/points.csv',
    summary: "A sweep's points as CSV",
    params: idParams,
    ok: { status: 200, description: 'The points', schema: fileBody, contentType: 'text/csv' },
    errors: [404],
  });
  route({
    method: 'get',
    path: '/sweeps/:id/raw',
    summary: 'The file as it was uploaded',
    params: idParams,
    ok: {
      status: 200,
      description: 'The raw file',
      schema: fileBody,
      contentType: 'application/octet-stream',
    },
    errors: [404],
  });
  route({
    method: 'delete',
    path: '/sweeps/:id',
    summary: 'Deletes a sweep and its fits',
    params: idParams,
    ok: { status: 204, description: 'Deleted' },
    errors: [403, 404],
  });
}
