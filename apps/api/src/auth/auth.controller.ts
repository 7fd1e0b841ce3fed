import type { Request, Response } from 'express';
import type { LoginResponse, PasswordResetAccepted, SessionUser } from '@rhotrace/api-types';
import type { AppDeps } from '../deps';
import { requestIdOf } from '../middleware/actor';
import { currentUser } from '../middleware/authenticate';
import { parseOrThrow } from '../middleware/validate';
import { confirmPasswordReset, login, refresh, requestPasswordReset } from './auth.service';
import { loginBody, resetBody, confirmBody } from './auth.schemas';

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
