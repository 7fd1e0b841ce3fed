import type { Request, Response } from 'express';
import {
  MIN_PASSWORD_LENGTH,
  type LoginResponse,
  type PasswordResetAccepted,
  type SessionUser,
} from '@rhotrace/api-types';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { requestIdOf } from '../middleware/actor';
import { currentUser } from '../middleware/authenticate';
import { parseOrThrow } from '../middleware/validate';
import { confirmPasswordReset, login, refresh, requestPasswordReset } from './auth.service';

const emailField = z
  .string({ required_error: 'is required', invalid_type_error: 'must be text' })
  .max(254, 'must be at most 254 characters')
  .email('must be an e-mail address');

/** A new password: at least MIN_PASSWORD_LENGTH characters, at most 200 (bcrypt reads 72 bytes). */
export const passwordField = z
  .string({ required_error: 'is required', invalid_type_error: 'must be text' })
  .min(MIN_PASSWORD_LENGTH, `must be at least ${MIN_PASSWORD_LENGTH} characters`)
  .max(200, 'must be at most 200 characters')
  .refine((p) => Buffer.byteLength(p, 'utf8') <= 72, 'must be at most 72 bytes long');

const loginBody = z
  .object({
    email: emailField,
    password: z
      .string({ required_error: 'is required', invalid_type_error: 'must be text' })
      .min(1, 'is required')
      .max(200, 'must be at most 200 characters'),
  })
  .strict();
const resetBody = z.object({ email: emailField }).strict();
const confirmBody = z
  .object({
    token: z
      .string({ required_error: 'is required', invalid_type_error: 'must be text' })
      .min(1, 'is required')
      .max(200, 'must be at most 200 characters'),
    password: passwordField,
  })
  .strict();

/** The address failed sign-ins count against (`trust proxy` stays off, so the socket's). */
export const clientAddress = (req: Request): string => req.ip ?? req.socket.remoteAddress ?? '';

/** Handlers of /api/auth. */
export function authController(deps: AppDeps) {
  return {
    async login(req: Request, res: Response<LoginResponse>) {
      const body = parseOrThrow(loginBody, req.body, 'body');
      res.json(await login(body, clientAddress(req), deps.config));
    },
    async me(req: Request, res: Response<SessionUser>) {
      res.json(currentUser(req));
    },
    async refresh(req: Request, res: Response<LoginResponse>) {
      res.json(await refresh(currentUser(req).id, deps.config));
    },
    async requestReset(req: Request, res: Response<PasswordResetAccepted>) {
      const body = parseOrThrow(resetBody, req.body, 'body');
      await requestPasswordReset(body.email, {
        mailer: deps.mailer,
        publicUrl: deps.config.publicUrl,
        requestId: requestIdOf(req),
      });
      res.status(202).json({
        message: 'If an active account has this address, a reset link is on its way to it.',
      });
    },
    async confirmReset(req: Request, res: Response) {
      const body = parseOrThrow(confirmBody, req.body, 'body');
      await confirmPasswordReset(body.token, body.password, requestIdOf(req));
      res.status(204).end();
    },
  };
}
