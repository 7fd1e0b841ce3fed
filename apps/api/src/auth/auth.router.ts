import { Router, type Request } from 'express';
import { ipKeyGenerator, rateLimit, type RateLimitRequestHandler } from 'express-rate-limit';
import type { AppDeps } from '../deps';
import { HttpError } from '../errors';
import { authenticate } from '../middleware/authenticate';
import { authController, clientAddress } from './auth.controller';

/** Address (IPv6 grouped by /56) plus the e-mail in the body; the JSON parser has run first. */
function addressAndEmail(req: Request): string {
  const body = req.body as { email?: unknown } | undefined;
  const email = typeof body?.email === 'string' ? body.email.trim().toLowerCase() : '';
  return `${ipKeyGenerator(clientAddress(req), 56)}|${email}`;
}

/**
 * An in-process first line against floods (the per-account and per-address counts that hold
 * across API processes live in the database, see sign-in-throttle.service).
 */
function limiter(windowMs: number, limit: number, what: string): RateLimitRequestHandler {
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    keyGenerator: addressAndEmail,
    handler: (req, _res, next) => {
      const reset = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
      const seconds = Math.max(
        1,
        Math.ceil(((reset?.getTime() ?? Date.now() + windowMs) - Date.now()) / 1000),
      );
      next(
        new HttpError(
          'too_many_requests',
          `Too many ${what} requests. Try again in ${seconds < 120 ? `${seconds} seconds` : `${Math.ceil(seconds / 60)} minutes`}.`,
          { retryAfterS: seconds },
          { 'Retry-After': String(seconds) },
        ),
      );
    },
  });
}

/** /api/auth: sign-in, session, token refresh and password reset. */
export function authRouter(deps: AppDeps): Router {
  const router = Router();
  const c = authController(deps);
  const signInLimit = limiter(15 * 60_000, deps.config.signInLimitPer15Min, 'sign-in');
  const resetLimit = limiter(60 * 60_000, 5, 'password reset');
  const confirmLimit = limiter(60 * 60_000, 20, 'password reset');
  router.post('/auth/login', signInLimit, c.login);
  router.get('/auth/me', authenticate(deps.config.jwtSecret), c.me);
  router.post('/auth/refresh', authenticate(deps.config.jwtSecret), c.refresh);
  router.post('/auth/password-reset', resetLimit, c.requestReset);
  router.post('/auth/password-reset/confirm', confirmLimit, c.confirmReset);
  return router;
}
