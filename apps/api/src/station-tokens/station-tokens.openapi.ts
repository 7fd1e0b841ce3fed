import type { StationTokenCreatedResponse, StationTokenDto } from '@rhotrace/api-types';
import { z } from 'zod';
import { idParams, registry, routesOf } from '../openapi/registry';
import { dateTime, itemsOf, personRef } from '../openapi/shapes';
import { createTokenBody, tokenParams } from './station-tokens.schemas';

const tokenSchema = registry.register(
  'StationToken',
  z
    .object({
      id: z.number().int(),
      stationId: z.number().int(),
      label: z.string(),
      prefix: z.string().startsWith('rts_'),
      createdAt: dateTime,
      createdBy: personRef,
      lastUsedAt: dateTime.nullable(),
      revokedAt: dateTime.nullable(),
    })
    .strict(),
) satisfies z.ZodType<StationTokenDto>;

const createdSchema = z
  .object({
    id: z.number().int(),
    label: z.string(),
    prefix: z.string().startsWith('rts_'),
    token: z.string().startsWith('rts_').describe('Shown this once; only its hash is stored'),
    createdAt: dateTime,
  })
  .strict() satisfies z.ZodType<StationTokenCreatedResponse>;

/** /api/stations/:id/tokens */
export function registerStationTokensApi(): void {
  const route = routesOf('Station tokens');
  route({
    method: 'get',
    path: '/stations/:id/tokens',
    summary: "A station's tokens, revoked ones included, without their secrets",
    params: idParams,
    ok: { status: 200, description: 'The tokens, newest first', schema: itemsOf(tokenSchema) },
    errors: [403, 404],
  });
  route({
    method: 'post',
    path: '/stations/:id/tokens',
    summary: 'Makes a token the station computer posts its sweeps with',
    params: idParams,
    body: createTokenBody,
    ok: { status: 201, description: 'The token, shown this once', schema: createdSchema },
    errors: [403, 404],
  });
  route({
    method: 'delete',
    path: '/stations/:id/tokens/:tokenId',
    summary: 'Revokes a token at once (its next use answers 401)',
    params: tokenParams,
    ok: { status: 204, description: 'Revoked' },
    errors: [403, 404],
  });
}
