import { z } from 'zod';
import { registerRoute } from './registry';

/** The document itself. */
export function registerOpenApiApi(): void {
  registerRoute({
    method: 'get',
    path: '/openapi.json',
    tag: 'Contract',
    summary: 'This OpenAPI 3.1 document (no sign-in); a readable page of it is at /api/docs/',
    auth: 'none',
    ok: {
      status: 200,
      description: 'The document',
      schema: z.object({ openapi: z.literal('3.1.0') }).passthrough(),
    },
  });
}
