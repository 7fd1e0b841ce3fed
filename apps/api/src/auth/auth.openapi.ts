import type { LoginResponse, SessionUser } from '@rhotrace/api-types';
import { ROLES } from '@rhotrace/api-types';
import { z } from 'zod';
import { registry, routesOf } from '../openapi/registry';
import { dateTime } from '../openapi/shapes';
import { confirmBody, loginBody, resetBody } from './auth.schemas';

/** The signed-in user a session carries. */
export const sessionUserSchema = registry.register(
  'SessionUser',
  z
    .object({ id: z.number().int(), email: z.string(), name: z.string(), role: z.enum(ROLES) })
    .strict(),
) satisfies z.ZodType<SessionUser>;

const loginResponse = z
  .object({ token: z.string(), expiresAt: dateTime, user: sessionUserSchema })
  .strict() satisfies z.ZodType<LoginResponse>;

/** /api/auth */
export function registerAuthApi(): void {
  const route = routesOf('Sign-in');
  route({
    method: 'post',
    path: '/auth/login',
    auth: 'none',
    summary: 'Signs in with e-mail and password',
    body: loginBody,
    ok: { status: 200, description: 'A session token', schema: loginResponse },
    errors: [401, 429],
  });
  route({
    method: 'get',
    path: '/auth/me',
    summary: 'The signed-in user',
    ok: { status: 200, description: 'The user', schema: sessionUserSchema },
  });
  route({
    method: 'post',
    path: '/auth/refresh',
    summary: 'A fresh session token for the signed-in user',
    ok: { status: 200, description: 'A new token', schema: loginResponse },
  });
  route({
    method: 'post',
    path: '/auth/password-reset',
    auth: 'none',
    summary: 'Sends a password-reset link, if the account exists',
    body: resetBody,
    ok: {
      status: 202,
      description: 'Accepted (the same answer whether or not the account exists)',
      schema: z.object({ message: z.string() }).strict(),
    },
    errors: [429],
  });
  route({
    method: 'post',
    path: '/auth/password-reset/confirm',
    auth: 'none',
    summary: 'Sets a new password with the token of a reset link',
    body: confirmBody,
    ok: { status: 204, description: 'Password changed' },
    errors: [429],
  });
}
